/**
 * Brent's method (zeroin: bisection + secant + inverse quadratic interpolation) on a bracket.
 * Brent, "Algorithms for Minimization without Derivatives", 1973, ch. 4.
 *
 * The function takes a parameter array so that callers in hot loops need not allocate a closure.
 * Converges to a bracket of width ~4·eps·|x|; throws if the bracket is invalid or it fails to converge.
 */
export type ParamFn = (x: number, p: Float64Array) => number;

const EPS = 2.220446049250313e-16;
// Enough for plain bisection from an O(1) bracket down to a root near 1e−300 and 53 bits beyond
// (a near-mechanism: a sway column restrained by R ~ 1e−300 has φ ~ 1e−150); Brent's usual count is ~10.
const MAX_ITER = 1100;

export function brentRoot(
  f: ParamFn,
  p: Float64Array,
  a: number,
  b: number,
  fa: number = f(a, p),
  fb: number = f(b, p),
): number {
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (!(Number.isFinite(fa) && Number.isFinite(fb))) throw new Error(`brentRoot: non-finite value at the bracket [${a}, ${b}]`);
  if ((fa > 0) === (fb > 0)) throw new Error(`brentRoot: [${a}, ${b}] does not bracket a root (f = ${fa}, ${fb})`);
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iter = 0; iter < MAX_ITER; iter++) {
    if ((fb > 0 && fc > 0) || (fb < 0 && fc < 0)) {
      c = a;
      fc = fa;
      d = b - a;
      e = d;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol1 = 2 * EPS * Math.abs(b) + 1e-300;
    const xm = 0.5 * (c - b);
    if (Math.abs(xm) <= tol1 || fb === 0) return b;
    if (Math.abs(e) >= tol1 && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let pp: number;
      let q: number;
      if (a === c) {
        pp = 2 * xm * s;
        q = 1 - s;
      } else {
        const qq = fa / fc;
        const r = fb / fc;
        pp = s * (2 * xm * qq * (qq - r) - (b - a) * (r - 1));
        q = (qq - 1) * (r - 1) * (s - 1);
      }
      if (pp > 0) q = -q;
      pp = Math.abs(pp);
      const min1 = 3 * xm * q - Math.abs(tol1 * q);
      const min2 = Math.abs(e * q);
      if (2 * pp < Math.min(min1, min2)) {
        e = d;
        d = pp / q;
      } else {
        d = xm;
        e = d;
      }
    } else {
      d = xm;
      e = d;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol1 ? d : xm > 0 ? tol1 : -tol1;
    fb = f(b, p);
    if (!Number.isFinite(fb)) throw new Error(`brentRoot: non-finite value at x = ${b}`);
  }
  throw new Error('brentRoot: no convergence in 200 iterations');
}
