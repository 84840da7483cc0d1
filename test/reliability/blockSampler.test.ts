import { describe, expect, it } from 'vitest';
import { BlockRng } from '../../src/probability/blockRng.js';
import { makeDistribution } from '../../src/probability/makeDistribution.js';
import { natafTransform, type IsoTransform } from '../../src/probability/nataf.js';
import { BLOCK_SIZE, makeBlockSampler } from '../../src/reliability/blockSampler.js';
import type { Distribution, DistSpec } from '../../src/probability/distribution.js';

const SPECS: DistSpec[] = [
  { dist: 'lognormal', mean: 200, cov: 0.1 }, // independent lognormal
  { dist: 'normal', mean: 10, sd: 2 }, // independent normal
  { dist: 'gumbel', mean: 100, cov: 0.25 }, // independent, own inverse CDF
  { dist: 'weibull', mean: 50, cov: 0.2 }, // independent, own inverse CDF
  { dist: 'lognormal', mean: 1, cov: 0.3 }, // correlated with the next (ρ = 0.6)
  { dist: 'lognormal', mean: 2, cov: 0.2 },
  { dist: 'normal', mean: 0, sd: 1 }, // correlated with the next (ρ = −0.4)
  { dist: 'gumbel', mean: 5, cov: 0.3 },
];
const CORRELATION: number[][] = SPECS.map((_, i) => SPECS.map((__, j) => (i === j ? 1 : 0)));
CORRELATION[4][5] = CORRELATION[5][4] = 0.6;
CORRELATION[6][7] = CORRELATION[7][6] = -0.4;

function draw(transform: IsoTransform, n: number): Float64Array[] {
  const { columns, fill } = makeBlockSampler(transform);
  const out = columns.map(() => new Float64Array(n));
  const rng = new BlockRng(2026, 0);
  for (let start = 0; start < n; start += BLOCK_SIZE) {
    const count = Math.min(BLOCK_SIZE, n - start);
    fill(rng, count);
    columns.forEach((c, i) => out[i].set(c.subarray(0, count), start));
  }
  return out;
}

function meanSd(a: Float64Array): [number, number] {
  let m = 0;
  for (const v of a) m += v;
  m /= a.length;
  let s = 0;
  for (const v of a) s += (v - m) * (v - m);
  return [m, Math.sqrt(s / (a.length - 1))];
}

function correlation(a: Float64Array, b: Float64Array): number {
  const [ma, sa] = meanSd(a);
  const [mb, sb] = meanSd(b);
  let s = 0;
  for (let k = 0; k < a.length; k++) s += (a[k] - ma) * (b[k] - mb);
  return s / ((a.length - 1) * sa * sb);
}

function ksDistance(a: Float64Array, d: Distribution): number {
  const sorted = Float64Array.from(a).sort();
  let dist = 0;
  for (let k = 0; k < sorted.length; k++) {
    const F = d.cdf(sorted[k]);
    dist = Math.max(dist, Math.abs(F - k / sorted.length), Math.abs(F - (k + 1) / sorted.length));
  }
  return dist;
}

describe('block sampler (column-wise draws of x)', () => {
  const n = 200_000;
  const dists = SPECS.map(makeDistribution);
  const nataf = natafTransform(dists, CORRELATION);
  const direct = draw(nataf, n);
  // The same law through u-space (ziggurat u, then the transform per sample).
  const general: IsoTransform = { n: nataf.n, toPhysical: (u, x) => nataf.toPhysical(u, x), toStandard: (x, u) => nataf.toStandard(x, u) };
  const viaU = draw(general, n);

  it('every marginal has its distribution (Kolmogorov–Smirnov at 0.1 %, both paths)', () => {
    // common practice: Kolmogorov critical value 1.95/√n at the 0.1 % level
    dists.forEach((d, i) => {
      expect(ksDistance(direct[i], d), `${SPECS[i].dist} #${i} direct`).toBeLessThan(1.95 / Math.sqrt(n));
      expect(ksDistance(viaU[i], d), `${SPECS[i].dist} #${i} via u`).toBeLessThan(1.95 / Math.sqrt(n));
    });
  });

  it('means and standard deviations within 4 standard errors', () => {
    dists.forEach((d, i) => {
      const [m, s] = meanSd(direct[i]);
      expect(Math.abs(m - d.mean), `mean #${i}`).toBeLessThan((4 * d.sd) / Math.sqrt(n));
      // sd: SE ≈ σ √((κ − 1)/(4n)); κ < 9 for these marginals (common practice)
      expect(Math.abs(s - d.sd), `sd #${i}`).toBeLessThan(4 * d.sd * Math.sqrt(8 / (4 * n)));
    });
  });

  it('correlated pairs reach their Pearson correlation; the others stay uncorrelated', () => {
    // SE of a sample correlation ≈ (1 − ρ²)/√n for near-normal pairs; 6 SE for skewed marginals
    const tol = (rho: number): number => (6 * (1 - rho * rho)) / Math.sqrt(n);
    expect(Math.abs(correlation(direct[4], direct[5]) - 0.6)).toBeLessThan(tol(0.6));
    expect(Math.abs(correlation(direct[6], direct[7]) + 0.4)).toBeLessThan(tol(0.4));
    expect(Math.abs(correlation(direct[0], direct[4]))).toBeLessThan(tol(0));
    expect(Math.abs(correlation(direct[2], direct[7]))).toBeLessThan(tol(0));
    expect(Math.abs(correlation(viaU[4], viaU[5]) - 0.6)).toBeLessThan(tol(0.6));
  });
});
