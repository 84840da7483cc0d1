/**
 * The boxes the visible text labels of a vega SVG occupy, measured with the shipped DejaVu Sans
 * widths (src/report/fontMetrics.ts), so a test can say that no two labels overlap.
 * Handles what vega writes: nested `<g transform="translate(x,y)">`, `<text transform="translate(x,y)
 * [rotate(±90|270) translate(dx,dy)]">` with text-anchor, multi-line `<tspan x="0" dy="…">`,
 * and labels hidden by vega's own overlap removal (opacity="0"), which are skipped.
 */
import { readFileSync } from 'node:fs';
import { chartFontFiles } from '../../src/report/chartFonts.js';
import { readFontMetrics, textWidth, type FontMetrics } from '../../src/report/fontMetrics.js';

export interface TextBox {
  text: string;
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

// DejaVu Sans: ascent ≈ 0.76 em, descent ≈ 0.24 em (font tables; common practice to box text by them)
const ASCENT = 0.76;
const DESCENT = 0.24;

let fonts: { regular: FontMetrics; bold: FontMetrics } | undefined;
function metrics(): { regular: FontMetrics; bold: FontMetrics } {
  if (!fonts) {
    const [r, b] = chartFontFiles();
    fonts = { regular: readFontMetrics(readFileSync(r)), bold: readFontMetrics(readFileSync(b)) };
  }
  return fonts;
}

function attr(tag: string, name: string): string | undefined {
  return new RegExp(`\\s${name}="([^"]*)"`).exec(tag)?.[1];
}

function translate(t: string | undefined): [number, number] {
  const m = t ? /^\s*translate\(([-\d.e]+)[ ,]+([-\d.e]+)\)/.exec(t) : null;
  return m ? [Number(m[1]), Number(m[2])] : [0, 0];
}

function unescape(s: string): string {
  return s.replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&quot;/g, '"').replace(/&#39;/g, "'").replace(/&amp;/g, '&');
}

/** Every visible, non-empty text element as an axis-aligned box in the SVG's coordinates. */
export function svgTextBoxes(svg: string): TextBox[] {
  const { regular, bold } = metrics();
  const stack: [number, number][] = [[0, 0]];
  const boxes: TextBox[] = [];
  const re = /<g\b[^>]*?\/>|<g\b[^>]*>|<\/g>|<text\b[^>]*\/>|<text\b([^>]*)>([\s\S]*?)<\/text>/g;
  for (const m of svg.matchAll(re)) {
    const tag = m[0];
    if (tag.startsWith('</g')) {
      stack.pop();
      continue;
    }
    if (tag.startsWith('<g')) {
      if (tag.endsWith('/>')) continue;
      const [dx, dy] = translate(attr(tag, 'transform'));
      const [px, py] = stack[stack.length - 1];
      stack.push([px + dx, py + dy]);
      continue;
    }
    if (m[2] === undefined) continue; // self-closing text: nothing drawn
    const open = `<text${m[1]}>`;
    if (attr(open, 'opacity') === '0') continue;
    const lines = m[2].split(/<tspan[^>]*>/).map((l) => unescape(l.replace(/<\/tspan>/g, '')).trim()).filter((l) => l !== '');
    if (lines.length === 0) continue;
    const size = Number((attr(open, 'font-size') ?? '11').replace('px', ''));
    const w = attr(open, 'font-weight');
    const font = w === 'bold' || Number(w) >= 600 ? bold : regular;
    const lineStep = Number(/<tspan[^>]*\sdy="([-\d.]+)"/.exec(m[2])?.[1] ?? size * 1.2);
    const width = Math.max(...lines.map((l) => textWidth(font, l, size)));
    const height = (ASCENT + DESCENT) * size + (lines.length - 1) * lineStep;
    const anchor = attr(open, 'text-anchor') ?? 'start';
    const along0 = anchor === 'middle' ? -width / 2 : anchor === 'end' ? -width : 0;
    const across0 = -ASCENT * size;
    const transform = attr(open, 'transform') ?? '';
    const [tx, ty] = translate(transform);
    const rot = /rotate\(([-\d.]+)\)/.exec(transform);
    const after = translate(transform.replace(/^.*rotate\([^)]*\)\s*/, '').trim() || undefined);
    const [ox, oy] = stack[stack.length - 1];
    const angle = rot ? ((Number(rot[1]) % 360) + 360) % 360 : 0;
    // local box (before rotation) in the text's own frame
    const lx0 = along0 + (rot ? after[0] : 0);
    const ly0 = across0 + (rot ? after[1] : 0);
    const corners: [number, number][] = [
      [lx0, ly0],
      [lx0 + width, ly0],
      [lx0, ly0 + height],
      [lx0 + width, ly0 + height],
    ].map(([x, y]) => {
      const r = (angle * Math.PI) / 180;
      return [ox + tx + x * Math.cos(r) - y * Math.sin(r), oy + ty + x * Math.sin(r) + y * Math.cos(r)];
    });
    const xs = corners.map((c) => c[0]);
    const ys = corners.map((c) => c[1]);
    boxes.push({ text: lines.join(' / '), x0: Math.min(...xs), y0: Math.min(...ys), x1: Math.max(...xs), y1: Math.max(...ys) });
  }
  return boxes;
}

/** Pairs of boxes that overlap by more than `slack` px in both directions (touching is fine). */
export function overlappingLabels(boxes: TextBox[], slack = 1): [TextBox, TextBox][] {
  const out: [TextBox, TextBox][] = [];
  for (let i = 0; i < boxes.length; i++) {
    for (let j = i + 1; j < boxes.length; j++) {
      const a = boxes[i];
      const b = boxes[j];
      const dx = Math.min(a.x1, b.x1) - Math.max(a.x0, b.x0);
      const dy = Math.min(a.y1, b.y1) - Math.max(a.y0, b.y0);
      if (dx > slack && dy > slack) out.push([a, b]);
    }
  }
  return out;
}
