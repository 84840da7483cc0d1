/**
 * Brent's method (Brent 1973, "Algorithms for Minimization without Derivatives", ch. 4,
 * zeroin): bisection safeguarding secant and inverse quadratic interpolation. Needs a
 * bracket with a sign change; never returns an unconverged root silently (it throws).
 */
export interface RootResult {
  x: number;
  fx: number;
  iterations: number;
}

export function brentRoot(
  f: (x: number) => number,
  lo: number,
  hi: number,
  opts?: { xtol?: number; maxIterations?: number },
): RootResult {
  const xtol = opts?.xtol ?? 1e-10;
  const maxIterations = opts?.maxIterations ?? 200;
  let a = lo;
  let b = hi;
  let fa = f(a);
  let fb = f(b);
  if (fa === 0) return { x: a, fx: fa, iterations: 0 };
  if (fb === 0) return { x: b, fx: fb, iterations: 0 };
  if (!(Number.isFinite(fa) && Number.isFinite(fb)) || fa * fb > 0) {
    throw new Error(`brentRoot: no sign change on [${lo}, ${hi}] (f = ${fa}, ${fb})`);
  }
  let c = a;
  let fc = fa;
  let d = b - a;
  let e = d;
  for (let iteration = 1; iteration <= maxIterations; iteration++) {
    if (fb * fc > 0) {
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
    const tol = 2 * Number.EPSILON * Math.abs(b) + 0.5 * xtol;
    const m = 0.5 * (c - b);
    if (Math.abs(m) <= tol || fb === 0) return { x: b, fx: fb, iterations: iteration };
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      const s = fb / fa;
      let p: number;
      let q: number;
      if (a === c) {
        p = 2 * m * s;
        q = 1 - s;
      } else {
        const qq = fa / fc;
        const r = fb / fc;
        p = s * (2 * m * qq * (qq - r) - (b - a) * (r - 1));
        q = (qq - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = p / q;
      } else {
        d = m;
        e = d;
      }
    } else {
      d = m;
      e = d;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = f(b);
    if (!Number.isFinite(fb)) throw new Error(`brentRoot: f(${b}) = ${fb}`);
  }
  throw new Error(`brentRoot: no convergence in ${maxIterations} iterations`);
}
