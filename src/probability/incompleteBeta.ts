/**
 * The regularized incomplete beta function I_x(a, b) and its complement, both without
 * cancellation in the tail that matters, and its inverse.
 *
 * Evaluation: the continued fraction for I_x(a,b) (Abramowitz & Stegun 26.5.8), summed by
 * the modified Lentz method (Lentz 1976; Thompson & Barnett 1986), on the side of the mode
 * where it converges fast; the other side follows from I_x(a,b) = 1 − I_{1−x}(b,a).
 * Callers pass x and 1 − x separately so that neither is formed by a lossy subtraction.
 */
import { logBeta } from './logGamma.js';

const TINY = 1e-300;
const EPS = 1e-16;
const MAX_TERMS = 10000;

/** The continued fraction 1/(1 + d1/(1 + d2/(1 + ...))) of A&S 26.5.8. */
function betaContinuedFraction(x: number, a: number, b: number): number {
  const apb = a + b;
  let c = 1;
  let d = 1 - (apb * x) / (a + 1);
  if (Math.abs(d) < TINY) d = TINY;
  d = 1 / d;
  let h = d;
  for (let m = 1; m <= MAX_TERMS; m++) {
    const m2 = 2 * m;
    // even step d_{2m}
    let num = (m * (b - m) * x) / ((a + m2 - 1) * (a + m2));
    d = 1 + num * d;
    if (Math.abs(d) < TINY) d = TINY;
    c = 1 + num / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    h *= d * c;
    // odd step d_{2m+1}
    num = (-(a + m) * (apb + m) * x) / ((a + m2) * (a + m2 + 1));
    d = 1 + num * d;
    if (Math.abs(d) < TINY) d = TINY;
    c = 1 + num / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    const delta = d * c;
    h *= delta;
    if (Math.abs(delta - 1) < EPS) return h;
  }
  throw new Error(`incomplete beta: continued fraction did not converge (x=${x}, a=${a}, b=${b})`);
}

/** ln of x^a (1−x)^b / (a B(a,b)) · CF — i.e. ln I_x(a,b) on the fast side. */
function logLowerFast(x: number, xc: number, a: number, b: number): number {
  return a * Math.log(x) + b * Math.log(xc) - logBeta(a, b) - Math.log(a) + Math.log(betaContinuedFraction(x, a, b));
}

/** True when the continued fraction for I_x(a,b) itself converges fast. */
function lowerSideIsFast(x: number, a: number, b: number): boolean {
  return x < (a + 1) / (a + b + 2);
}

/**
 * I_x(a, b), given x and xc = 1 − x. Relative accuracy ~1e-14 when the result is small.
 */
export function regIncBeta(x: number, xc: number, a: number, b: number): number {
  if (x <= 0) return 0;
  if (xc <= 0) return 1;
  if (lowerSideIsFast(x, a, b)) return Math.exp(logLowerFast(x, xc, a, b));
  return -Math.expm1(logLowerFast(xc, x, b, a));
}

/** 1 − I_x(a, b) = I_{1−x}(b, a), given x and xc = 1 − x. */
export function regIncBetaComplement(x: number, xc: number, a: number, b: number): number {
  return regIncBeta(xc, x, b, a);
}

/** ln I_x(a, b) (finite even where I_x underflows), given x and xc = 1 − x. */
export function logRegIncBeta(x: number, xc: number, a: number, b: number): number {
  if (x <= 0) return -Infinity;
  if (xc <= 0) return 0;
  if (lowerSideIsFast(x, a, b)) return logLowerFast(x, xc, a, b);
  return Math.log1p(-Math.exp(logLowerFast(xc, x, b, a)));
}

/**
 * A first guess of the x with I_x(a, b) = p (p ≤ 1/2), as ln x: for a, b ≥ 1 the normal
 * approximation of A&S 26.5.22 with the quantile of A&S 26.2.23; otherwise the power laws of the
 * two tails, I_x ≈ x^a/(a B) near 0 and 1 − I_x ≈ (1 − x)^b/(b B) near 1 (Press et al.,
 * Numerical Recipes, 3rd ed., §6.14). Only a start: Halley's steps below make it exact.
 */
function firstGuessLog(p: number, a: number, b: number, lnB: number): number {
  if (a >= 1 && b >= 1) {
    const t = Math.sqrt(-2 * Math.log(p));
    // y_p of A&S 26.5.22: the normal deviate exceeded with probability p (positive for p < 1/2)
    const z = t - (2.30753 + 0.27061 * t) / (1 + t * (0.99229 + 0.04481 * t));
    const al = (z * z - 3) / 6;
    const h = 2 / (1 / (2 * a - 1) + 1 / (2 * b - 1));
    const w = (z * Math.sqrt(al + h)) / h - (1 / (2 * b - 1) - 1 / (2 * a - 1)) * (al + 5 / 6 - 2 / (3 * h));
    // x = a / (a + b e^{2w}), as a log without overflow
    const r = Math.log(b / a) + 2 * w;
    return r > 0 ? -r - Math.log1p(Math.exp(-r)) : -Math.log1p(Math.exp(r));
  }
  const lower = Math.exp(a * Math.log(a / (a + b)) - lnB) / a;
  const upper = Math.exp(b * Math.log(b / (a + b)) - lnB) / b;
  if (p < lower) return (Math.log(p) + Math.log(a) + lnB) / a;
  return Math.log1p(-Math.exp((Math.log1p(-p) + Math.log(b) + lnB) / b));
}

/**
 * The x in [0, 1] with I_x(a, b) = p, for 0 ≤ p ≤ 1/2 (use the complement with (b, a)
 * for upper-tail probabilities). Halley's method on L(t) = ln I as a function of t = ln x — the
 * lower tail behaves like a power law in x, so L is nearly linear there — from the first guess
 * above, kept inside a sign-change bracket in t and falling back to bisection (geometric in x).
 * L' = s = x f(x)/I and L'' = s (a − (b − 1) x/(1 − x) − s), f the beta density.
 */
export function invRegIncBetaLower(p: number, a: number, b: number): number {
  if (!(p >= 0 && p <= 0.5)) throw new Error(`invRegIncBetaLower: p must be in [0, 1/2], got ${p}`);
  if (p === 0) return 0;
  const target = Math.log(p);
  const lnB = logBeta(a, b);
  let tLow = -745; // exp(−745) is the smallest positive double
  let tHigh = 0;
  if (logRegIncBeta(Math.exp(tLow), -Math.expm1(tLow), a, b) - target >= 0) return 0; // the quantile underflows
  let t = firstGuessLog(p, a, b, lnB);
  if (!(t > tLow && t < tHigh)) t = Math.min((target + Math.log(a) + lnB) / a, Math.log(a / (a + b)));
  if (!(t > tLow && t < tHigh)) t = 0.5 * (tLow + tHigh);
  for (let iter = 0; iter < 300; iter++) {
    const x = Math.exp(t);
    const xc = -Math.expm1(t);
    const lnI = logRegIncBeta(x, xc, a, b);
    const value = lnI - target;
    if (value === 0) return x;
    if (value < 0) tLow = t;
    else tHigh = t;
    const slope = Math.exp(a * t + (b - 1) * Math.log(xc) - lnB - lnI);
    const curvature = slope * (a - ((b - 1) * x) / xc - slope);
    const newton = value / slope;
    // Halley's correction, only while it stays a modest change of the Newton step
    const halley = 1 - (0.5 * newton * curvature) / slope;
    const useHalley = halley > 0.5 && halley < 2;
    let next = t - (useHalley ? newton / halley : newton);
    let bisected = false;
    if (!(next > tLow && next < tHigh) || !Number.isFinite(next)) {
      next = 0.5 * (tLow + tHigh);
      bisected = true;
    }
    const step = Math.abs(next - t);
    // Halley's method converges cubically: after a step below 1e-8 the error left is far below 1e-16
    if (!bisected && useHalley && step <= 1e-8 * Math.max(1, Math.abs(t))) return Math.exp(next);
    if (step <= 1e-15 * Math.max(1, Math.abs(t))) return Math.exp(next);
    if (tHigh - tLow <= 1e-15 * Math.max(1, Math.abs(t))) return Math.exp(0.5 * (tLow + tHigh));
    t = next;
  }
  throw new Error(`invRegIncBetaLower: not converged (p=${p}, a=${a}, b=${b})`);
}

/** The x with I_x(a, b) = p for any p in [0, 1] (upper half via the complement). */
export function invRegIncBeta(p: number, a: number, b: number): number {
  if (p <= 0.5) return invRegIncBetaLower(p, a, b);
  return 1 - invRegIncBetaLower(1 - p, b, a);
}
