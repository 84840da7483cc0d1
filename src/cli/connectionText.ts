/** Terminal lines for the connection moments, rotations and joint classes (check and assess). */
import type { EndSpringMoments } from '../mechanics/endSpringMoments.js';
import type { ConnectionResponse, EndClassification } from '../limitState/connectionResponse.js';
import { formatNumber, formatQuantity, type UnitSystem } from '../report/displayUnits.js';
import { textTable } from './textTable.js';

function mrad(theta: number): string {
  return Number.isFinite(theta) ? `${formatNumber(Math.abs(theta) * 1e3, 3)} mrad` : '∞';
}

function classText(c: EndClassification, system: UnitSystem): string {
  if (c.rule === 'none') return `— (${c.note})`;
  if (c.rule === 'given') return `${c.classAtMean} (${c.note})`;
  const limits: string[] = [];
  if (c.boundaries && Number.isFinite(c.boundaries.rigidFrom)) limits.push(`rigid from ${formatQuantity(c.boundaries.rigidFrom, 'rotationalStiffness', system)}`);
  if (c.boundaries && c.boundaries.pinnedUpTo > 0) limits.push(`pinned up to ${formatQuantity(c.boundaries.pinnedUpTo, 'rotationalStiffness', system)}`);
  return `${c.classAtMean} at the mean k, ${c.classAtLow} at its 5 % fractile (${c.note}${limits.length ? '; ' + limits.join(', ') : ''})`;
}

/** Where and under what the moments were computed, in one sentence. */
export function connectionBasis(m: ConnectionResponse, where: string, system: UnitSystem): string {
  if (!m.stable) return `  at ${where} the load ${formatQuantity(m.load, 'force', system)} reaches Pcr: no equilibrium, the moments are unbounded.`;
  const e = m.eccentricity;
  const t = m.transverse;
  if (t !== undefined && (t.line !== 0 || t.top !== 0)) {
    const parts = [`P = ${formatQuantity(m.load, 'force', system)}`];
    if (e !== undefined && (e.bottom !== 0 || e.top !== 0)) {
      parts.push(`end couples bottom ${formatQuantity(m.load * e.bottom, 'moment', system)}, top ${formatQuantity(m.load * e.top, 'moment', system)} (P·e and applied moments)`);
    }
    if (t.line !== 0) parts.push(`line load ${formatQuantity(t.line, 'lineLoad', system)} along the height`);
    if (t.top !== 0) parts.push(`horizontal force ${formatQuantity(t.top, 'force', system)} at the top (with P·φ of any out-of-plumb)`);
    return `  at ${where}: ${parts.join(', ')}, bow ${formatQuantity(m.bow, 'length', system)} on its unfavourable side`;
  }
  if (e !== undefined && (e.bottom !== 0 || e.top !== 0)) {
    return `  at ${where}: P = ${formatQuantity(m.load, 'force', system)} at end eccentricities bottom ${formatQuantity(e.bottom, 'length', system)}, top ${formatQuantity(e.top, 'length', system)} (load-weighted; the moments include the end couples P·e), bow ${formatQuantity(m.bow, 'length', system)} on its unfavourable side`;
  }
  if (m.bow === 0) return `  no bow is given (column.imperfection.bow), so the column stays straight and the connections carry no moment at ${where}.`;
  return `  at ${where}: P = ${formatQuantity(m.load, 'force', system)}, bow ${formatQuantity(m.bow, 'length', system)}, amplification 1/(1 − P/Pcr) = ${formatNumber(m.amplification, 3)}`;
}

/** Moments (and classes when given) per end; `classes` is omitted at the design point. */
export function connectionLines(m: EndSpringMoments, system: UnitSystem, classes?: EndClassification[], indent = '  '): string[] {
  const q = (v: number) => (Number.isFinite(v) ? formatQuantity(Math.abs(v), 'moment', system) : '∞');
  const head = ['end', 'moment k·θ', 'rotation θ'];
  if (classes) head.push('joint class, EN 1993-1-8 §5.2.2.5');
  const row = (end: 'bottom' | 'top'): string[] => {
    const r = [end, q(m.springMoment[end]), mrad(m.rotation[end])];
    const c = classes?.find((x) => x.end === end);
    if (classes) r.push(c ? classText(c, system) : '');
    return r;
  };
  const lines = [textTable([head, row('bottom'), row('top')], indent)];
  const at = Number.isFinite(m.memberMaxAt) ? ` at ${formatQuantity(m.memberMaxAt, 'length', system)} above the base` : '';
  lines.push(`${indent}largest bending moment in the member: ${q(m.memberMax)}${at}`);
  return lines;
}
