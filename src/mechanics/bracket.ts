import { brentRoot, type ParamFn } from './brent.js';

/**
 * Fractions of an interval at which to look for a sign change: uniform in the middle and
 * geometrically crowded toward both ends, so that a root lying very close to an endpoint
 * (which may itself be a root of no interest) is still bracketed.
 */
const FRACTIONS: Float64Array = (() => {
  const t: number[] = [];
  for (let k = 14; k >= 2; k--) t.push(Math.pow(10, -k));
  for (let i = 1; i < 64; i++) t.push(i / 64);
  for (let k = 2; k <= 14; k++) t.push(1 - Math.pow(10, -k));
  return Float64Array.from(t);
})();

/**
 * The first root strictly inside (lo, hi): scan the interior points for a strict sign change
 * (the functions scanned here are entire — no poles — so a sign change is a root), then refine
 * it with Brent. Returns NaN when no interior sign change was seen; the endpoints are not
 * evaluated (they may be roots the caller does not want).
 */
export function firstInteriorRoot(f: ParamFn, p: Float64Array, lo: number, hi: number): number {
  const w = hi - lo;
  let xPrev = lo + FRACTIONS[0] * w;
  let fPrev = f(xPrev, p);
  for (let i = 1; i < FRACTIONS.length; i++) {
    const x = lo + FRACTIONS[i] * w;
    const fx = f(x, p);
    if (fx === 0) return x;
    if (fPrev !== 0 && (fPrev > 0) !== (fx > 0)) return brentRoot(f, p, xPrev, x, fPrev, fx);
    xPrev = x;
    fPrev = fx;
  }
  return NaN;
}

/** max |f| over the interior scan points — a scale against which "f ≈ 0" is judged. */
export function interiorScale(f: ParamFn, p: Float64Array, lo: number, hi: number): number {
  let m = 0;
  for (let i = 0; i < FRACTIONS.length; i++) m = Math.max(m, Math.abs(f(lo + FRACTIONS[i] * (hi - lo), p)));
  return m;
}
