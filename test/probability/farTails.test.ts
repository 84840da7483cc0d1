/**
 * Far out in u-space (where an iteration may wander) every inverse CDF stays finite and
 * monotone, and ln Φ keeps its digits where Φ underflows.
 */
import { describe, expect, it } from 'vitest';
import { makeDistribution } from '../../src/probability/makeDistribution.js';
import type { DistSpec } from '../../src/probability/distribution.js';
import { logNormalCdf, normalCdf, normalQuantileFromLog } from '../../src/probability/normal.js';

const SPECS: DistSpec[] = [
  { dist: 'normal', mean: 1, sd: 0.3 },
  { dist: 'lognormal', mean: 1, cov: 0.5 },
  { dist: 'gumbel', mean: 1, cov: 0.3 },
  { dist: 'uniform', min: 0, max: 1 },
  { dist: 'truncnormal', mean: 1, sd: 1, min: 0 },
  { dist: 'truncnormal', mean: 1, sd: 1, max: 3 },
  { dist: 'weibull', mean: 1, cov: 0.3 },
  { dist: 'beta', min: 0, max: 1, mean: 0.5, sd: 0.2 },
];
const US = [-1e300, -1e150, -1e10, -1e3, -60, -40, -38.6, -38.4, -37, -10, 0, 10, 37, 38.4, 38.6, 40, 60, 1e3, 1e10, 1e150, 1e300];

describe('fromStandardNormal is finite and non-decreasing for every finite u (common practice)', () => {
  it.each(SPECS.map((s) => [s.dist, s] as const))('%s', (_name, spec) => {
    const d = makeDistribution(spec);
    let previous = -Infinity;
    for (const u of US) {
      const x = d.fromStandardNormal(u);
      expect(Number.isFinite(x), `u = ${u} gave ${x}`).toBe(true);
      expect(x, `u = ${u}`).toBeGreaterThanOrEqual(previous);
      previous = x;
    }
  });
});

describe('ln Φ in the far lower tail', () => {
  it('agrees with ln of Φ where Φ is still a normal double (common practice: the two branches meet)', () => {
    for (const x of [-29.99, -30.01, -31, -33, -35, -36]) {
      expect(Math.abs(logNormalCdf(x) / Math.log(normalCdf(x)) - 1)).toBeLessThan(1e-13);
    }
  });
  it('follows Mills ratio: ln Φ(x) = −x²/2 − ln(−x√(2π)) + ln(1 − 1/x² + 3/x⁴ …) (source: Abramowitz & Stegun 26.2.12, from memory)', () => {
    for (const x of [-40, -100, -1e4]) {
      const leading = -0.5 * x * x - Math.log(-x * Math.sqrt(2 * Math.PI)) + Math.log1p(-1 / (x * x));
      expect(Math.abs(logNormalCdf(x) - leading)).toBeLessThan(4 / x ** 4);
    }
  });
  it('normalQuantileFromLog inverts it (common practice: round trip)', () => {
    for (const x of [-5, -20, -37, -39, -100, -1e5, -1e6]) {
      expect(normalQuantileFromLog(logNormalCdf(x)) / x).toBeCloseTo(1, 12);
    }
  });
});

describe('gumbel tails beyond the underflow of Φ', () => {
  const d = makeDistribution({ dist: 'gumbel', mean: 1, cov: 0.3 });
  const { loc, scale } = d.params as { loc: number; scale: number };
  it('lower: x = loc − scale·ln(−ln Φ(u)) (source: the Gumbel CDF F = exp(−e^{−(x−loc)/scale}), Gumbel 1958)', () => {
    for (const u of [-39, -50, -200]) {
      expect(d.fromStandardNormal(u)).toBeCloseTo(loc - scale * Math.log(-logNormalCdf(u)), 10);
    }
  });
  it('upper: −ln F ≈ 1 − F there, so x = loc − scale·ln Φ(−u) (source: same CDF, first-order expansion)', () => {
    for (const u of [39, 50, 200]) {
      expect(d.fromStandardNormal(u) / (loc - scale * logNormalCdf(-u))).toBeCloseTo(1, 12);
    }
  });
});
