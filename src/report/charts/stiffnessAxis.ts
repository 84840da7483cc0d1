/**
 * A readable axis for rotational stiffness: MN·m/rad once the values reach 1 MN·m/rad (SI),
 * and log ticks thinned to decades (or 1-2-5 within two decades) so labels never crowd.
 */
import { displayUnit, type DisplayUnit, type UnitSystem } from '../displayUnits.js';

export function stiffnessUnit(valuesSI: readonly number[], system: UnitSystem): DisplayUnit {
  const finite = valuesSI.filter((v) => Number.isFinite(v) && v > 0);
  const mid = finite.length ? Math.sqrt(Math.min(...finite) * Math.max(...finite)) : 0;
  if (system === 'si' && mid >= 1e6) return { label: 'MN·m/rad', siPerUnit: 1e6 };
  return displayUnit('rotationalStiffness', system);
}

/** Tick values on a log axis between lo and hi (display units). */
export function logTicks(lo: number, hi: number): number[] {
  const a = Math.floor(Math.log10(lo));
  const b = Math.ceil(Math.log10(hi));
  const steps = b - a <= 2 ? [1, 2, 5] : [1];
  const every = b - a > 6 ? 2 : 1;
  const out: number[] = [];
  for (let d = a; d <= b; d += every) for (const m of steps) {
    const v = m * 10 ** d;
    if (v >= lo * (1 - 1e-9) && v <= hi * (1 + 1e-9)) out.push(Number(v.toPrecision(12)));
  }
  return out;
}

/** The shared log-axis block for a stiffness scale. */
export function stiffnessAxis(lo: number, hi: number): Record<string, unknown> {
  return { values: logTicks(lo, hi), format: '~g', labelOverlap: true };
}
