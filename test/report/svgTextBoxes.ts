/**
 * Test helper: the boxes of every text line a vega SVG draws, in the SVG's own coordinates. Widths
 * come from the DejaVu Sans metrics the charts are laid out and drawn with (fontMetrics.ts);
 * heights from ascent 0.76 em / descent 0.24 em (DejaVu Sans, common practice for its em box).
 * Group translations, the text's own translate/rotate chain, text-anchor and tspan lines are applied.
 */
import { readFileSync } from 'node:fs';
import { chartFontFiles } from '../../src/report/chartFonts.js';
import { readFontMetrics, textWidth } from '../../src/report/fontMetrics.js';

export interface TextBox { text: string; corners: [number, number][] }

type Affine = [number, number, number, number, number, number]; // a b c d e f
const ID: Affine = [1, 0, 0, 1, 0, 0];
const mul = (m: Affine, n: Affine): Affine => [
  m[0] * n[0] + m[2] * n[1], m[1] * n[0] + m[3] * n[1], m[0] * n[2] + m[2] * n[3], m[1] * n[2] + m[3] * n[3], m[0] * n[4] + m[2] * n[5] + m[4], m[1] * n[4] + m[3] * n[5] + m[5],
];
const apply = (m: Affine, x: number, y: number): [number, number] => [m[0] * x + m[2] * y + m[4], m[1] * x + m[3] * y + m[5]];

function parseTransform(t: string | undefined): Affine {
  let m = ID;
  if (!t) return m;
  for (const [, op, args] of t.matchAll(/(translate|rotate|scale)\(([^)]*)\)/g)) {
    const v = args.split(/[ ,]+/).filter(Boolean).map(Number);
    if (op === 'translate') m = mul(m, [1, 0, 0, 1, v[0], v[1] ?? 0]);
    else if (op === 'rotate') {
      const r = (v[0] * Math.PI) / 180;
      m = mul(m, [Math.cos(r), Math.sin(r), -Math.sin(r), Math.cos(r), 0, 0]);
    } else m = mul(m, [v[0], 0, 0, v[1] ?? v[0], 0, 0]);
  }
  return m;
}

const attr = (tag: string, name: string): string | undefined => new RegExp(`\\s${name}="([^"]*)"`).exec(tag)?.[1];
const unescape = (s: string) => s.replace(/&amp;/g, '&').replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&quot;/g, '"').replace(/&#39;/g, "'");

export function svgTextBoxes(svg: string): TextBox[] {
  const [regularFile, boldFile] = chartFontFiles();
  const regular = readFontMetrics(readFileSync(regularFile));
  const bold = readFontMetrics(readFileSync(boldFile));
  const boxes: TextBox[] = [];
  const stack: Affine[] = [ID];
  const re = /<(\/?)(g|text|svg)\b([^>]*?)(\/?)>/g;
  let m: RegExpExecArray | null;
  while ((m = re.exec(svg))) {
    const [whole, close, name, rest, selfClose] = m;
    if (name === 'g' || name === 'svg') {
      if (close) stack.pop();
      else if (!selfClose) stack.push(mul(stack[stack.length - 1], parseTransform(attr(whole, 'transform'))));
      continue;
    }
    if (close || selfClose || name !== 'text') continue;
    const end = svg.indexOf('</text>', re.lastIndex);
    const inner = svg.slice(re.lastIndex, end);
    re.lastIndex = end;
    if (attr(rest, 'opacity') === '0') continue; // hidden by vega's label-overlap rule: not drawn
    const fs = parseFloat(attr(rest, 'font-size') ?? '11');
    const isBold = /bold|[6-9]00/.test(attr(rest, 'font-weight') ?? '');
    const anchor = attr(rest, 'text-anchor') ?? 'start';
    const base = mul(stack[stack.length - 1], parseTransform(attr(rest, 'transform')));
    const lines: { text: string; dy: number }[] = [];
    if (inner.includes('<tspan')) {
      let y = 0;
      for (const t of inner.matchAll(/<tspan([^>]*)>([\s\S]*?)<\/tspan>/g)) {
        y += parseFloat(attr(t[1], 'dy') ?? '0');
        lines.push({ text: unescape(t[2]), dy: y });
      }
    } else lines.push({ text: unescape(inner), dy: 0 });
    for (const line of lines) {
      if (line.text.trim() === '') continue;
      const w = textWidth(isBold ? bold : regular, line.text, fs);
      const x0 = anchor === 'middle' ? -w / 2 : anchor === 'end' ? -w : 0;
      const y0 = line.dy - 0.76 * fs;
      const y1 = line.dy + 0.24 * fs;
      boxes.push({ text: line.text, corners: [apply(base, x0, y0), apply(base, x0 + w, y0), apply(base, x0 + w, y1), apply(base, x0, y1)] });
    }
  }
  return boxes;
}

/** Separating-axis test of two convex quadrilaterals, shrunk by `slack` px so that touching is allowed. */
export function boxesIntersect(a: TextBox, b: TextBox, slack = 0.5): boolean {
  for (const poly of [a.corners, b.corners]) {
    for (let i = 0; i < 4; i++) {
      const [x1, y1] = poly[i];
      const [x2, y2] = poly[(i + 1) % 4];
      const nx = y2 - y1;
      const ny = x1 - x2;
      const len = Math.hypot(nx, ny) || 1;
      const proj = (p: [number, number][]) => p.map(([x, y]) => (x * nx + y * ny) / len);
      const pa = proj(a.corners);
      const pb = proj(b.corners);
      if (Math.max(...pa) - slack <= Math.min(...pb) || Math.max(...pb) - slack <= Math.min(...pa)) return false;
    }
  }
  return true;
}

/** Every pair of text boxes that intersect. */
export function overlappingTexts(svg: string): [string, string][] {
  const boxes = svgTextBoxes(svg);
  const out: [string, string][] = [];
  for (let i = 0; i < boxes.length; i++) for (let j = i + 1; j < boxes.length; j++) if (boxesIntersect(boxes[i], boxes[j])) out.push([boxes[i].text, boxes[j].text]);
  return out;
}
