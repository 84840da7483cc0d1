import { describe, expect, it } from 'vitest';
import type { Distribution } from '../../src/probability/distribution.js';
import { makeDistribution } from '../../src/probability/makeDistribution.js';
import { sobolIndices, type SobolIndex, type SobolResult } from '../../src/sensitivity/sobol.js';

/**
 * The exact value must lie in the bootstrap 95 % interval widened twofold about the estimate
 * (≈ ±4 standard errors), and the interval must be narrow enough to mean something.
 */
function expectWithinWidenedInterval(index: SobolIndex, exact: number, maxWidth: number): void {
  const below = 2 * (index.value - index.lo);
  const above = 2 * (index.hi - index.value);
  expect(index.lo).toBeLessThanOrEqual(index.value);
  expect(index.hi).toBeGreaterThanOrEqual(index.value);
  expect(exact).toBeGreaterThanOrEqual(index.value - below - 1e-12);
  expect(exact).toBeLessThanOrEqual(index.value + above + 1e-12);
  expect(index.hi - index.lo).toBeLessThan(maxWidth);
}

function check(result: SobolResult, first: number[], total: number[], maxWidth: number): void {
  first.forEach((exact, i) => expectWithinWidenedInterval(result.first[i], exact, maxWidth));
  total.forEach((exact, i) => expectWithinWidenedInterval(result.total[i], exact, maxWidth));
}

const uniforms = (n: number, min: number, max: number): Distribution[] =>
  Array.from({ length: n }, () => makeDistribution({ dist: 'uniform', min, max }));

describe('Sobol indices (Saltelli 2010 first order, Jansen 1999 total)', () => {
  const ishigami = (x: Float64Array): number => Math.sin(x[0]) + 7 * Math.sin(x[1]) ** 2 + 0.1 * x[2] ** 4 * Math.sin(x[0]);
  const ishigamiInputs = uniforms(3, -Math.PI, Math.PI);

  it('Ishigami a = 7, b = 0.1 (source: Ishigami & Homma 1990; Saltelli et al. 2008, from memory; docs/verification.md §R3a)', () => {
    const result = sobolIndices(['x1', 'x2', 'x3'], ishigamiInputs, ishigami, { n: 20_000, seed: 11 });
    expect(result.calls).toBe(20_000 * 5);
    // source: Ishigami & Homma 1990; Saltelli et al. 2008 (from memory), values of docs/verification.md §R3a
    check(result, [0.31390519, 0.44241114, 0], [0.55758886, 0.44241114, 0.24368366], 0.1);
    // source: docs/verification.md §R3a, V = 13.8446 (from memory); 5 % is several standard errors at N = 20 000
    expect(Math.abs(result.variance / 13.8446 - 1)).toBeLessThan(0.05);
  });

  it('is reproducible from its seed and changes with it', () => {
    const a = sobolIndices(['x1', 'x2', 'x3'], ishigamiInputs, ishigami, { n: 2000, seed: 5, resamples: 50 });
    const b = sobolIndices(['x1', 'x2', 'x3'], ishigamiInputs, ishigami, { n: 2000, seed: 5, resamples: 50 });
    const c = sobolIndices(['x1', 'x2', 'x3'], ishigamiInputs, ishigami, { n: 2000, seed: 6, resamples: 50 });
    expect(b).toEqual(a);
    expect(c.first[0].value).not.toBe(a.first[0].value);
  });

  it("Sobol' g-function, a = (0, 1, 4.5, 9, 99, 99, 99, 99) (source: Saltelli & Sobol' 1995, from memory; docs/verification.md §R3b)", () => {
    const a = [0, 1, 4.5, 9, 99, 99, 99, 99];
    const g = (x: Float64Array): number => {
      let p = 1;
      for (let i = 0; i < 8; i++) p *= (Math.abs(4 * x[i] - 2) + a[i]) / (1 + a[i]);
      return p;
    };
    const names = a.map((_, i) => `x${i + 1}`);
    const result = sobolIndices(names, uniforms(8, 0, 1), g, { n: 20_000, seed: 3 });
    const s5 = 7.16192e-5;
    const t5 = 1.04949e-4;
    // source: Saltelli & Sobol' 1995 (from memory), values of docs/verification.md §R3b
    check(result, [0.716192, 0.179048, 0.0236758, 0.00716192, s5, s5, s5, s5], [0.787144, 0.242198, 0.0343169, 0.0104604, t5, t5, t5, t5], 0.1);
  });

  it('additive log-column model: S_i = S_Ti = α² (docs/verification.md §R3c, own construction: exact)', () => {
    const dists = [
      makeDistribution({ dist: 'lognormal', mean: 210e9, cov: 0.03 }),
      makeDistribution({ dist: 'lognormal', mean: 2.003e-5, cov: 0.04 }),
      makeDistribution({ dist: 'lognormal', mean: 0.85, cov: 0.15 }),
      makeDistribution({ dist: 'lognormal', mean: 700e3, cov: 0.2 }),
    ];
    const lnMargin = (x: Float64Array): number => Math.log((Math.PI ** 2 * x[0] * x[1]) / (x[2] * 5) ** 2 / x[3]);
    const result = sobolIndices(['E', 'I', 'K', 'P'], dists, lnMargin, { n: 20_000, seed: 7 });
    // source: docs/verification.md §R3c (own construction, exact: S_i = S_Ti = α²)
    const exact = [0.00688177, 0.01223, 0.680856, 0.300033];
    // the first-order estimator is the noisy one here (K: 95 % interval ≈ ±0.055 at N = 20 000)
    check(result, exact, exact, 0.15);
  });

  it('gives a constant model zero indices (no variance to apportion) and rejects mismatched names', () => {
    // common practice: S_i = V_i / V; with V = 0 no input moves the output, reported as 0
    const flat = sobolIndices(['x', 'y'], uniforms(2, 0, 1), () => 1, { n: 100, seed: 1 });
    expect(flat.variance).toBe(0);
    for (const s of [...flat.first, ...flat.total]) expect([s.value, s.lo, s.hi]).toEqual([0, 0, 0]);
    expect(() => sobolIndices(['x', 'y'], uniforms(1, 0, 1), (x) => x[0], { n: 100, seed: 1 })).toThrow();
  });
});
