/**
 * Prefix every id in an SVG (and every reference to it), so several vega SVGs can sit
 * inline in one HTML page without their clip paths colliding (`clip1` in each chart).
 */
export function namespaceSvgIds(svg: string, prefix: string): string {
  const ids = new Set<string>();
  for (const m of svg.matchAll(/\sid="([^"]+)"/g)) ids.add(m[1]);
  if (ids.size === 0) return svg;
  return svg
    .replace(/\sid="([^"]+)"/g, (_, id: string) => ` id="${prefix}${id}"`)
    .replace(/url\(#([^)]+)\)/g, (whole, id: string) => (ids.has(id) ? `url(#${prefix}${id})` : whole))
    .replace(/href="#([^"]+)"/g, (whole, id: string) => (ids.has(id) ? `href="#${prefix}${id}"` : whole));
}
