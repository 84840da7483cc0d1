/**
 * Values along an axis. Numbers are rounded to 12 significant digits so that 0.1 + 0.2 style
 * noise never reaches a case table; a unit, when present, is appended as text.
 */
import type { RangeAxis, SweepValue } from './sweepTypes.js';

export function roundValue(x: number): number {
  return x === 0 ? 0 : Number(x.toPrecision(12));
}

export function withUnit(x: number, unit: string): SweepValue {
  const v = roundValue(x);
  return unit === '' ? v : `${v} ${unit}`;
}

/** Position u ∈ [0, 1] along a range, linear or logarithmic; u = 0 and 1 give the ends exactly. */
export function pointOnRange(axis: RangeAxis, u: number): number {
  if (u === 0) return axis.from;
  if (u === 1) return axis.to;
  if (axis.scale === 'log') return Math.exp(Math.log(axis.from) + u * (Math.log(axis.to) - Math.log(axis.from)));
  return axis.from + u * (axis.to - axis.from);
}

export function rangeValues(axis: RangeAxis, steps: number): SweepValue[] {
  if (steps === 1) return [withUnit(axis.from, axis.unit)];
  return Array.from({ length: steps }, (_, k) => withUnit(pointOnRange(axis, k / (steps - 1)), axis.unit));
}
