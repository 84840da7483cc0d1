/**
 * A hand-drawn (hand-written SVG) elevation of the column: its end conditions as pin,
 * fixed or rotational-spring symbols with their stiffness, the lateral restraint at the top,
 * the load arrow, the length, and the first buckled mode dashed alongside.
 */
import type { ColumnDescription, EndDescription, EndName, ModeShapeData } from './reportInput.js';
import { formatNumber, formatQuantity, type UnitSystem } from './displayUnits.js';
import { CHART_FONT, PALETTE } from './chartStyle.js';
import { escapeXml } from './escapeXml.js';

const W = 470;
const H = 480;
const CX = 200; // column centre line
const TOP = 110;
const BOTTOM = 400;
const INK = PALETTE.ink;

function text(x: number, y: number, s: string, opts: { anchor?: string; size?: number; color?: string; weight?: string; rotate?: number } = {}): string {
  const rot = opts.rotate ? ` transform="rotate(${opts.rotate} ${x} ${y})"` : '';
  return `<text x="${x}" y="${y}" text-anchor="${opts.anchor ?? 'start'}" font-size="${opts.size ?? 13}" fill="${opts.color ?? INK}"${opts.weight ? ` font-weight="${opts.weight}"` : ''}${rot}>${escapeXml(s)}</text>`;
}

/** A ground line with short diagonal hatching on the side away from the column. */
function ground(x1: number, x2: number, y: number, side: 'below' | 'above'): string {
  const d = side === 'below' ? 9 : -9;
  let hatch = '';
  for (let x = x1 + 4; x <= x2; x += 8) hatch += `M${x},${y} l-7,${d} `;
  return `<path d="M${x1},${y} H${x2}" stroke="${INK}" stroke-width="2"/><path d="${hatch}" stroke="${INK}" stroke-width="1"/>`;
}

/** A vertical wall at x with hatching to the right, for lateral restraints. */
function wall(x: number, y1: number, y2: number): string {
  let hatch = '';
  for (let y = y1 + 4; y <= y2; y += 8) hatch += `M${x},${y} l9,-7 `;
  return `<path d="M${x},${y1} V${y2}" stroke="${INK}" stroke-width="2"/><path d="${hatch}" stroke="${INK}" stroke-width="1"/>`;
}

function hinge(y: number): string {
  return `<circle cx="${CX}" cy="${y}" r="5" fill="white" stroke="${INK}" stroke-width="2"/>`;
}

/** A pin: at the bottom a hinge on a triangle and ground; at the top a hinge under a beam stub. */
function pinSymbol(y: number, end: EndName): string {
  if (end === 'top') return `${beamStub(y - 22)}<path d="M${CX},${y} V${y - 22}" stroke="${INK}" stroke-width="2"/>${hinge(y)}`;
  const base = y + 24;
  return `<path d="M${CX},${y} L${CX - 16},${base} H${CX + 16} Z" fill="white" stroke="${INK}" stroke-width="2"/>${ground(CX - 36, CX + 36, base, 'below')}${hinge(y)}`;
}

/** The beam or slab the top of the column hangs from (short, thick). */
function beamStub(y: number): string {
  return `<path d="M${CX - 40},${y} H${CX + 40}" stroke="${INK}" stroke-width="5"/>`;
}

/** A fixed end: a thick plate with hatching (bottom) or a rigid beam joint (top). */
function fixedSymbol(y: number, end: EndName): string {
  if (end === 'top') return `${beamStub(y)}<path d="M${CX - 12},${y + 12} L${CX},${y} L${CX + 12},${y + 12}" fill="none" stroke="${INK}" stroke-width="1.5"/>`;
  return ground(CX - 34, CX + 34, y, 'below').replace('stroke-width="2"', 'stroke-width="4"');
}

/** A rotational spring: a spiral round the hinge whose outer end is tied to the support. */
function springSymbol(y: number, end: EndName): string {
  const s = end === 'bottom' ? 1 : -1;
  let d = '';
  const turns = 2.25;
  let last = { x: CX, y };
  for (let i = 0; i <= 60; i++) {
    const t = (i / 60) * turns * 2 * Math.PI;
    const r = 6 + (t / (2 * Math.PI)) * 5;
    last = { x: CX + r * Math.cos(t), y: y + s * r * Math.sin(t) };
    d += `${i === 0 ? 'M' : 'L'}${last.x.toFixed(1)},${last.y.toFixed(1)} `;
  }
  const supportY = y + s * (end === 'bottom' ? 24 : 22);
  const spiral = `<path d="${d}" fill="none" stroke="${PALETTE.resistance}" stroke-width="1.8"/>`;
  const arm = `<path d="M${last.x.toFixed(1)},${last.y.toFixed(1)} H${CX + 30} V${supportY}" fill="none" stroke="${PALETTE.resistance}" stroke-width="1.8"/>`;
  return `${pinSymbol(y, end)}${spiral}${arm}`;
}

function endLabel(e: EndDescription, system: UnitSystem): string[] {
  if (e.type === 'pinned') return ['pinned'];
  if (e.type === 'fixed') return ['fixed'];
  const lines = [`rotational spring${e.random ? ' (random)' : ''}`];
  if (e.stiffness !== undefined) lines.push(`k = ${formatQuantity(e.stiffness, 'rotationalStiffness', system)}${e.random ? ' (mean)' : ''}`);
  const r = e.R !== undefined ? `R = ${formatNumber(e.R)}` : '';
  const f = e.fixity !== undefined ? `fixity ${formatNumber(e.fixity, 2)}` : '';
  if (r || f) lines.push([r, f].filter(Boolean).join(', '));
  return lines;
}

function endSymbol(e: EndDescription, y: number, end: EndName): string {
  if (e.type === 'pinned') return pinSymbol(y, end);
  if (e.type === 'fixed') return fixedSymbol(y, end);
  return springSymbol(y, end);
}

function zigzag(x1: number, x2: number, y: number): string {
  const n = 8;
  const step = (x2 - x1 - 20) / n;
  let d = `M${x1},${y} h10 `;
  for (let i = 0; i < n; i++) d += `l${step / 2},${i % 2 === 0 ? -7 : 7} l${step / 2},${i % 2 === 0 ? 7 : -7} `;
  d += 'h10';
  return `<path d="${d}" fill="none" stroke="${PALETTE.resistance}" stroke-width="1.8"/>`;
}

function lateralRestraint(column: ColumnDescription, system: UnitSystem): string {
  const wallX = CX + 110;
  if (column.frame === 'braced') {
    return `<path d="M${CX + 6},${TOP} H${wallX}" stroke="${INK}" stroke-width="1.5"/><circle cx="${CX + 40}" cy="${TOP}" r="3" fill="${INK}"/>${wall(wallX, TOP - 18, TOP + 18)}${text(wallX - 52, TOP + 32, 'braced: top held', { anchor: 'middle', size: 12, color: PALETTE.muted })}${text(wallX - 52, TOP + 46, 'laterally', { anchor: 'middle', size: 12, color: PALETTE.muted })}`;
  }
  const k = column.lateralStiffness ?? 0;
  if (k <= 0) return text(CX + 20, TOP + 36, 'sway: top free to move sideways', { size: 12, color: PALETTE.muted });
  return `${zigzag(CX + 6, wallX, TOP)}${wall(wallX, TOP - 18, TOP + 18)}${text(wallX - 52, TOP + 32, `kT = ${formatQuantity(k, 'translationalStiffness', system)}`, { anchor: 'middle', size: 12 })}`;
}

function loadArrow(demand: number, system: UnitSystem, topType: EndDescription['type']): string {
  const tip = topType === 'fixed' ? TOP - 6 : TOP - 28; // stop at the beam stub
  return `<path d="M${CX},20 V${tip - 10}" stroke="${PALETTE.load}" stroke-width="3"/><path d="M${CX - 7},${tip - 12} L${CX},${tip} L${CX + 7},${tip - 12} Z" fill="${PALETTE.load}"/>${text(CX + 14, 34, `P = ${formatQuantity(demand, 'force', system)}`, { weight: 'bold', color: PALETTE.load })}${text(CX + 14, 50, 'mean demand, concentric', { size: 12, color: PALETTE.muted })}`;
}

function dimension(length: number, system: UnitSystem): string {
  const x = 70;
  return `<path d="M${x},${TOP} V${BOTTOM} M${x - 6},${TOP} h12 M${x - 6},${BOTTOM} h12" stroke="${PALETTE.muted}" stroke-width="1"/>${text(x - 8, (TOP + BOTTOM) / 2, `L = ${formatQuantity(length, 'length', system)}`, { anchor: 'middle', rotate: -90 })}`;
}

function modeOverlay(mode: ModeShapeData | undefined): string {
  if (!mode || mode.points.length < 2) return '';
  const amp = 34;
  const d = mode.points.map((p, i) => `${i === 0 ? 'M' : 'L'}${(CX + amp * p.w).toFixed(1)},${(BOTTOM - p.xi * (BOTTOM - TOP)).toFixed(1)}`).join(' ');
  return `<path d="${d}" fill="none" stroke="${PALETTE.muted}" stroke-width="1.5" stroke-dasharray="5 4"/>`;
}

/** The column elevation as a standalone SVG document. */
export function columnSketchSvg(column: ColumnDescription, demand: number, firstMode: ModeShapeData | undefined, system: UnitSystem): string {
  const section = `A = ${formatQuantity(column.section.area, 'area', system)}, I = ${formatQuantity(column.section.inertia, 'inertia', system)}`;
  const labelLines = (lines: string[], y: number) => lines.map((l, i) => text(CX + 46, y + i * 15, l, { size: 12 })).join('');
  const parts = [
    `<rect width="${W}" height="${H}" fill="white"/>`,
    modeOverlay(firstMode),
    `<path d="M${CX},${TOP} V${BOTTOM}" stroke="${INK}" stroke-width="8" stroke-linecap="butt"/>`,
    endSymbol(column.ends.bottom, BOTTOM, 'bottom'),
    endSymbol(column.ends.top, TOP, 'top'),
    lateralRestraint(column, system),
    loadArrow(demand, system, column.ends.top.type),
    dimension(column.length, system),
    text(22, BOTTOM - 20, 'bottom', { size: 12, color: PALETTE.muted }),
    text(22, TOP + 20, 'top', { size: 12, color: PALETTE.muted }),
    labelLines(endLabel(column.ends.bottom, system), BOTTOM - 56),
    column.frame === 'braced' ? labelLines(endLabel(column.ends.top, system), TOP + 72) : labelLines(endLabel(column.ends.top, system), TOP + 56),
    text(CX, H - 30, section, { anchor: 'middle', size: 12, color: PALETTE.muted }),
    text(CX, H - 12, `${column.frame} frame${firstMode ? '; dashed: first buckled mode (not to scale)' : ''}`, { anchor: 'middle', size: 12, color: PALETTE.muted }),
  ];
  return `<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}" font-family="${CHART_FONT}" role="img" aria-label="Column sketch"><title>Column sketch: ${escapeXml(column.frame)} column, bottom ${escapeXml(column.ends.bottom.type)}, top ${escapeXml(column.ends.top.type)}</title>${parts.join('')}</svg>`;
}
