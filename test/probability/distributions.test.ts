import { describe, expect, it } from 'vitest';
import jstatModule from 'jstat';
import type { Distribution, DistSpec } from '../../src/probability/distribution.js';
import { makeDistribution } from '../../src/probability/makeDistribution.js';
import { gaussHermiteNormal } from '../../src/probability/gaussHermite.js';
import { normalCdf } from '../../src/probability/normal.js';
import { weibullCov } from '../../src/probability/weibullDist.js';

const jStat = jstatModule.jStat ?? jstatModule;
const relErr = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

const specs: DistSpec[] = [
  { dist: 'normal', mean: 420e3, cov: 0.1 },
  { dist: 'lognormal', mean: 200, cov: 0.1 },
  { dist: 'lognormal', mean: 2.5e6, cov: 0.5 },
  { dist: 'gumbel', mean: 2500, cov: 0.2 },
  { dist: 'weibull', mean: 40, cov: 0.1 },
  { dist: 'weibull', mean: 3, cov: 0.6 },
  { dist: 'uniform', min: 0, max: 3 },
  { dist: 'truncnormal', mean: 1, sd: 2, min: 0, max: 6 },
  { dist: 'truncnormal', mean: 0, sd: 1, min: 0.5 },
  { dist: 'beta', min: 0, max: 10, mean: 3, sd: 1 },
  { dist: 'beta', min: 0, max: 1, mean: 0.2, sd: 0.3 },
];

const label = (s: DistSpec) => JSON.stringify(s);

/** E[g(X)] with X = F⁻¹(Φ(U)), by the 64-node Gauss–Hermite rule. */
function expectation(d: Distribution, g: (x: number) => number): number {
  const { nodes, weights } = gaussHermiteNormal(64);
  let s = 0;
  for (let i = 0; i < nodes.length; i++) s += weights[i] * g(d.fromStandardNormal(nodes[i]));
  return s;
}

/** ∫ f over [a, b] by composite Simpson with n (even) panels. */
function simpson(f: (x: number) => number, a: number, b: number, n = 4000): number {
  const h = (b - a) / n;
  let s = f(a) + f(b);
  for (let i = 1; i < n; i++) s += (i % 2 ? 4 : 2) * f(a + i * h);
  return (s * h) / 3;
}

describe('parameters fitted from the moments', () => {
  it('reproduce the reference parameter values', () => {
    // source: docs/verification.md §R1b: mean 200 V 0.10 → lambda 5.29334, zeta 0.0997513; mean 100 V 0.25 → 4.57486, 0.246221
    const r = makeDistribution({ dist: 'lognormal', mean: 200, cov: 0.1 });
    expect(r.params.lambda).toBeCloseTo(5.29334, 5);
    expect(r.params.zeta).toBeCloseTo(0.0997513, 7);
    const s = makeDistribution({ dist: 'lognormal', mean: 100, cov: 0.25 });
    expect(s.params.lambda).toBeCloseTo(4.57486, 5);
    expect(s.params.zeta).toBeCloseTo(0.246221, 6);
    // source: docs/verification.md §R1e: theta LN(1.0, 0.05) → lamT −0.00124844, zetaT 0.0499688
    const t = makeDistribution({ dist: 'lognormal', mean: 1, cov: 0.05 });
    expect(relErr(t.params.lambda, -0.00124844)).toBeLessThan(1e-5);
    expect(t.params.zeta).toBeCloseTo(0.0499688, 7);
    // source: docs/verification.md §R2b (Der Kiureghian 2005 data): Gumbel(2500, 0.2) → a 2274.97, b 389.848
    const g = makeDistribution({ dist: 'gumbel', mean: 2500, cov: 0.2 });
    expect(g.params.loc).toBeCloseTo(2274.97, 2);
    expect(g.params.scale).toBeCloseTo(389.848, 3);
    // source: docs/verification.md §R2b: Weibull(40, 0.1) → k 12.1534, scale 41.7215
    const w = makeDistribution({ dist: 'weibull', mean: 40, cov: 0.1 });
    expect(w.params.shape).toBeCloseTo(12.1534, 4);
    expect(w.params.scale).toBeCloseTo(41.7215, 4);
  });

  it('recover the requested mean and sd, in closed form and by quadrature of F⁻¹(Φ(u))', () => {
    for (const spec of specs) {
      const d = makeDistribution(spec);
      const mean = expectation(d, (x) => x);
      const sd = Math.sqrt(expectation(d, (x) => (x - mean) ** 2));
      expect(relErr(d.mean, mean), label(spec)).toBeLessThan(1e-6);
      expect(relErr(d.sd, sd), label(spec)).toBeLessThan(1e-4); // GH converges slowly for bounded supports
      if (spec.dist === 'uniform') {
        expect(d.mean).toBe(1.5);
        expect(d.sd).toBeCloseTo(3 / Math.sqrt(12), 14);
      } else if (spec.dist !== 'truncnormal') {
        expect(relErr(d.mean, spec.mean!), label(spec)).toBeLessThan(1e-13);
        const wantSd = spec.sd ?? spec.cov! * Math.abs(spec.mean!);
        expect(relErr(d.sd, wantSd), label(spec)).toBeLessThan(1e-12);
      }
    }
  });

  it('truncnormal: mean and sd are those of the truncated variable', () => {
    // source: half-normal moments, mean √(2/π), sd √(1 − 2/π) (Johnson, Kotz & Balakrishnan vol. 1, ch. 13)
    const half = makeDistribution({ dist: 'truncnormal', mean: 0, sd: 1, min: 0 });
    expect(half.mean).toBeCloseTo(Math.sqrt(2 / Math.PI), 14);
    expect(half.sd).toBeCloseTo(Math.sqrt(1 - 2 / Math.PI), 14);
    const d = makeDistribution({ dist: 'truncnormal', mean: 1, sd: 2, min: 0, max: 6 });
    const mean = simpson((x) => x * d.pdf(x), 0, 6);
    const second = simpson((x) => (x - mean) ** 2 * d.pdf(x), 0, 6);
    expect(relErr(d.mean, mean)).toBeLessThan(1e-10);
    expect(relErr(d.sd, Math.sqrt(second))).toBeLessThan(1e-10);
    expect(simpson((x) => d.pdf(x), 0, 6)).toBeCloseTo(1, 12);
  });

  it('weibull CoV(k) has the textbook special cases', () => {
    // source: k = 1 is the exponential (CoV 1); k = 2 is Rayleigh (CoV √(4/π − 1))
    expect(weibullCov(1)).toBeCloseTo(1, 13);
    expect(weibullCov(2)).toBeCloseTo(Math.sqrt(4 / Math.PI - 1), 13);
    const exp = makeDistribution({ dist: 'weibull', mean: 2, cov: 1 });
    expect(exp.params.shape).toBeCloseTo(1, 12);
    expect(exp.params.scale).toBeCloseTo(2, 12);
  });

  it('beta with uniform moments is the uniform distribution', () => {
    // source: Beta(1, 1) = U(0, 1): mean 1/2, sd 1/√12
    const d = makeDistribution({ dist: 'beta', min: 2, max: 4, mean: 3, sd: 2 / Math.sqrt(12) });
    expect(d.params.a).toBeCloseTo(1, 12);
    expect(d.params.b).toBeCloseTo(1, 12);
    expect(d.cdf(2.5)).toBeCloseTo(0.25, 12);
  });
});

describe('cdf, sf and pdf', () => {
  it('agree with jstat (independent implementation; common practice)', () => {
    const n = makeDistribution({ dist: 'normal', mean: 10, sd: 2 });
    const ln = makeDistribution({ dist: 'lognormal', mean: 200, cov: 0.1 });
    const w = makeDistribution({ dist: 'weibull', mean: 40, cov: 0.1 });
    const wide = makeDistribution({ dist: 'weibull', mean: 3, cov: 0.6 });
    const u = makeDistribution({ dist: 'uniform', min: 1, max: 3 });
    const b = makeDistribution({ dist: 'beta', min: 0, max: 10, mean: 3, sd: 1 });
    const t = makeDistribution({ dist: 'truncnormal', mean: 1, sd: 2, min: 0, max: 6 });
    for (let p = 0.001; p < 1; p += 0.0271) {
      const xn = n.quantile(p);
      expect(Math.abs(n.cdf(xn) - jStat.normal.cdf(xn, 10, 2))).toBeLessThan(1e-12);
      const xl = ln.quantile(p);
      expect(Math.abs(ln.cdf(xl) - jStat.lognormal.cdf(xl, ln.params.lambda, ln.params.zeta))).toBeLessThan(1e-12);
      expect(relErr(ln.pdf(xl), jStat.lognormal.pdf(xl, ln.params.lambda, ln.params.zeta))).toBeLessThan(1e-12);
      for (const d of [w, wide]) {
        const xw = d.quantile(p);
        expect(Math.abs(d.cdf(xw) - jStat.weibull.cdf(xw, d.params.scale, d.params.shape))).toBeLessThan(1e-13);
        expect(relErr(d.pdf(xw), jStat.weibull.pdf(xw, d.params.scale, d.params.shape))).toBeLessThan(1e-12);
      }
      const xu = u.quantile(p);
      expect(Math.abs(u.cdf(xu) - jStat.uniform.cdf(xu, 1, 3))).toBeLessThan(1e-15);
      const xb = b.quantile(p);
      // jstat's incomplete beta is good to ~1e-8 only
      expect(Math.abs(b.cdf(xb) - jStat.beta.cdf(xb / 10, b.params.a, b.params.b))).toBeLessThan(1e-7);
      expect(relErr(b.pdf(xb), jStat.beta.pdf(xb / 10, b.params.a, b.params.b) / 10)).toBeLessThan(1e-10);
      const xt = t.quantile(p);
      const phi = (x: number) => jStat.normal.cdf(x, 1, 2) as number;
      expect(Math.abs(t.cdf(xt) - (phi(xt) - phi(0)) / (phi(6) - phi(0)))).toBeLessThan(1e-10);
    }
  });

  it('gumbel: textbook median and cdf = ∫ pdf', () => {
    const g = makeDistribution({ dist: 'gumbel', mean: 2500, cov: 0.2 });
    // source: Gumbel (max) median = loc − scale·ln(ln 2)
    expect(relErr(g.quantile(0.5), g.params.loc - g.params.scale * Math.log(Math.LN2))).toBeLessThan(1e-14);
    expect(g.cdf(g.quantile(0.5))).toBeCloseTo(0.5, 14);
    const a = 1500;
    const b = 4500;
    expect(simpson((x) => g.pdf(x), a, b)).toBeCloseTo(g.cdf(b) - g.cdf(a), 12);
  });

  it('are consistent for every distribution: cdf + sf = 1, pdf = dF/dx, quantile inverts cdf', () => {
    for (const spec of specs) {
      const d = makeDistribution(spec);
      for (const p of [0.01, 0.1, 0.3, 0.5, 0.7, 0.9, 0.99]) {
        const x = d.quantile(p);
        expect(Math.abs(d.cdf(x) - p), label(spec)).toBeLessThan(1e-13);
        expect(Math.abs(d.cdf(x) + d.sf(x) - 1), label(spec)).toBeLessThan(1e-14);
        const h = 1e-6 * Math.min(d.sd, Math.abs(x) || d.sd); // stay clear of a singular bound
        const deriv = (d.cdf(x + h) - d.cdf(x - h)) / (2 * h);
        expect(relErr(deriv, d.pdf(x)), label(spec)).toBeLessThan(1e-6);
      }
    }
  });
});

describe('standard-normal maps, accurate in both tails', () => {
  const tails = [-37, -20, -8, -3, -0.5, 0, 0.5, 3, 8, 20, 37];

  it('round-trip u → x → u for the unbounded and half-bounded distributions (|u| up to 37)', () => {
    const unbounded: DistSpec[] = [
      { dist: 'normal', mean: 420e3, cov: 0.1 },
      { dist: 'lognormal', mean: 200, cov: 0.1 },
      { dist: 'lognormal', mean: 2.5e6, cov: 0.5 },
      { dist: 'gumbel', mean: 2500, cov: 0.2 },
      { dist: 'weibull', mean: 40, cov: 0.1 },
      { dist: 'weibull', mean: 3, cov: 0.6 },
    ];
    for (const spec of unbounded) {
      const d = makeDistribution(spec);
      for (const u of tails) {
        const back = d.toStandardNormal(d.fromStandardNormal(u));
        expect(Math.abs(back - u), `${label(spec)} u=${u}`).toBeLessThan(1e-11 * Math.max(1, Math.abs(u)));
      }
    }
  });

  it('bounded distributions round-trip in the tail where x can resolve it', () => {
    // Near a bound x only has the floating-point spacing of the bound itself, so uniform and beta
    // tails are tested with that bound at 0; x = F⁻¹ underflowing to the bound (beta with a < 1
    // beyond u ≈ −9) is the representable limit, not an error.
    const check = (spec: DistSpec, us: number[], tol = 1e-10) => {
      const d = makeDistribution(spec);
      for (const u of us) {
        const back = d.toStandardNormal(d.fromStandardNormal(u));
        expect(Math.abs(back - u), `${label(spec)} u=${u}`).toBeLessThan(tol * Math.max(1, Math.abs(u)));
      }
    };
    check({ dist: 'uniform', min: 0, max: 3 }, [-37, -20, -8, -3, 0, 1, 2]);
    check({ dist: 'beta', min: 0, max: 10, mean: 3, sd: 1 }, [-37, -20, -8, -3, 0, 1, 2]);
    check({ dist: 'beta', min: 0, max: 1, mean: 0.2, sd: 0.3 }, [-8, -3, 0, 1, 2]);
    check({ dist: 'uniform', min: -3, max: 0 }, [-2, -1, 0, 3, 8, 20, 37]);
    check({ dist: 'beta', min: -10, max: 0, mean: -3, sd: 1 }, [-2, -1, 0, 3, 8, 20, 37]);
    check({ dist: 'beta', min: -1, max: 0, mean: -0.2, sd: 0.3 }, [-2, -1, 0, 3, 8]);
    // truncnormal: x = mu + sigma·t, so near a finite bound the resolution is that of mu; |u| ≤ 5
    check({ dist: 'truncnormal', mean: 1, sd: 2, min: 0, max: 6 }, [-5, -3, 0, 3, 5], 1e-7);
    check({ dist: 'truncnormal', mean: 0, sd: 1, min: 0.5 }, [-5, -3, 0, 3, 8, 20, 37], 1e-7);
    check({ dist: 'truncnormal', mean: 1, sd: 1, max: 0 }, [-37, -20, -8, -3, 0, 3, 5], 1e-7);
  });

  it('fromStandardNormal(u) puts exactly Φ(−|u|) in the far tail (sf for u > 0, cdf for u < 0)', () => {
    for (const spec of specs) {
      const d = makeDistribution(spec);
      for (const u of [8, 20]) {
        const q = normalCdf(-u);
        const lo = d.fromStandardNormal(-u);
        const hi = d.fromStandardNormal(u);
        const bounded = spec.dist === 'uniform' || spec.dist === 'beta' || spec.dist === 'truncnormal';
        // uniform/beta lower tails in `specs` sit at 0 (full accuracy); truncnormal bounds do not
        if (spec.dist !== 'truncnormal' && !(spec.dist === 'beta' && spec.sd === 0.3 && u === 20)) {
          expect(relErr(d.cdf(lo), q), `${label(spec)} cdf at u=${-u}`).toBeLessThan(1e-9);
        }
        if (!bounded) expect(relErr(d.sf(hi), q), `${label(spec)} sf at u=${u}`).toBeLessThan(1e-9);
        expect(hi).toBeGreaterThan(d.fromStandardNormal(3));
        expect(lo).toBeLessThan(d.fromStandardNormal(-3));
      }
    }
  });

  it('fromStandardNormal is monotone and agrees with quantile(Φ(u)) in the body', () => {
    for (const spec of specs) {
      const d = makeDistribution(spec);
      let prev = -Infinity;
      for (let u = -6; u <= 6; u += 0.25) {
        const x = d.fromStandardNormal(u);
        expect(x, label(spec)).toBeGreaterThanOrEqual(prev);
        prev = x;
        // beyond |u| = 4, Φ(u) near 1 has lost the digits that fromStandardNormal keeps
        if (Math.abs(u) <= 4) expect(Math.abs(x - d.quantile(normalCdf(u))), label(spec)).toBeLessThan(1e-9 * d.sd);
      }
    }
  });
});
