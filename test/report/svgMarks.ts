/** Helpers for tests: find a named vega mark group in an SVG and count what it drew. */

/** The insides of every `<g class="mark-… role-mark NAME_marks" …>` up to its first `</g>` (leaf marks hold no groups). */
export function markGroups(svg: string, name: string): string[] {
  const re = new RegExp(`<g class="mark-[a-z]+ role-mark ${name}_marks"[^>]*>`, 'g');
  const out: string[] = [];
  for (const m of svg.matchAll(re)) {
    const start = (m.index ?? 0) + m[0].length;
    out.push(svg.slice(start, svg.indexOf('</g>', start)));
  }
  return out;
}

/**
 * Number of drawn items (path, line, text, rect, circle) in a named mark, summed over its
 * groups (a line mark split by colour gets one group per series); -1 if the mark is missing.
 */
export function countMarks(svg: string, name: string): number {
  const groups = markGroups(svg, name);
  if (groups.length === 0) return -1;
  return groups.reduce((n, g) => n + (g.match(/<(path|line|text|rect|circle)\b/g) ?? []).length, 0);
}

/** All text content of <text> elements (tspans joined by a space). */
export function svgTexts(svg: string): string[] {
  const out: string[] = [];
  for (const m of svg.matchAll(/<text\b[^>]*>([\s\S]*?)<\/text>/g)) {
    out.push(m[1].replace(/<tspan[^>]*>/g, ' ').replace(/<\/tspan>/g, '').replace(/&amp;/g, '&').replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&quot;/g, '"').replace(/&#39;/g, "'").trim());
  }
  return out;
}
