/**
 * Brent's bracketed root finder (R. P. Brent, Algorithms for Minimization without
 * Derivatives, 1973, ch. 4): inverse quadratic / secant steps kept inside a shrinking
 * sign-change bracket, falling back to bisection. Never returns an unconverged root.
 */
export interface RootOptions {
  /** absolute tolerance on x (default 1e-15); a relative 4.4e-16·|x| is always added */
  xTolerance?: number;
  maxIterations?: number;
}

export function findRootBracketed(
  f: (x: number) => number,
  lower: number,
  upper: number,
  options: RootOptions = {},
): number {
  const maxIterations = options.maxIterations ?? 200;
  const xTolerance = options.xTolerance ?? 1e-15;
  let a = lower;
  let b = upper;
  let fa = f(a);
  let fb = f(b);
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (!(fa * fb < 0)) {
    throw new Error(`findRootBracketed: no sign change on [${lower}, ${upper}] (f = ${fa}, ${fb})`);
  }
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iter = 0; iter < maxIterations; iter++) {
    if (fb * fc > 0) {
      c = a; fc = fa; d = b - a; e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b; b = c; c = a;
      fa = fb; fb = fc; fc = fa;
    }
    const tol = 4.4e-16 * Math.abs(b) + 0.5 * xTolerance;
    const mid = 0.5 * (c - b);
    if (Math.abs(mid) <= tol || fb === 0) return b;
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * mid * s;
        q = 1 - s;
      } else {
        const qa = fa / fc;
        const r = fb / fc;
        p = s * (2 * mid * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * mid * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = mid; e = d;
      }
    } else {
      d = mid; e = d;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : mid > 0 ? tol : -tol;
    fb = f(b);
  }
  throw new Error(`findRootBracketed: not converged after ${maxIterations} iterations`);
}
