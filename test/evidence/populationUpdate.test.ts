import { describe, expect, it } from 'vitest';
import jstatModule from 'jstat';
import { fractileFactor } from '../../src/evidence/characteristicFactor.js';
import { updateLognormalKnownVariance, updateLognormalUnknownVariance } from '../../src/evidence/lognormalPopulation.js';
import { updateNormalKnownVariance, updateNormalUnknownVariance } from '../../src/evidence/normalPopulation.js';
import type { Predictive } from '../../src/evidence/predictive.js';
import { makeDistribution } from '../../src/probability/makeDistribution.js';

const jStat = jstatModule.jStat ?? jstatModule;

function quantileOf(p: Predictive, prob: number): number {
  return p.family === 'normal'
    ? makeDistribution({ dist: 'normal', mean: p.mean, sd: p.sd }).quantile(prob)
    : makeDistribution({ dist: 'studentt', loc: p.loc, scale: p.scale, dof: p.dof }).quantile(prob);
}

/** n values with sample mean m and sample sd s (divisor n − 1), evenly spread. */
function sampleWith(n: number, m: number, s: number): number[] {
  const raw = Array.from({ length: n }, (_, i) => i - (n - 1) / 2);
  const sd = Math.sqrt(raw.reduce((a, x) => a + x * x, 0) / (n - 1));
  return raw.map((x) => m + (s * x) / sd);
}

// EN 1990:2002 Annex D, Table D1, 5 % characteristic value (from memory)
const TABLE_D1: { n: number; unknown: number; known: number }[] = [
  { n: 3, unknown: 3.37, known: 1.89 },
  { n: 4, unknown: 2.63, known: 1.83 },
  { n: 5, unknown: 2.33, known: 1.8 },
  { n: 6, unknown: 2.18, known: 1.77 },
  { n: 8, unknown: 2.0, known: 1.74 },
  { n: 10, unknown: 1.92, known: 1.72 },
  { n: 20, unknown: 1.76, known: 1.68 },
  { n: 30, unknown: 1.73, known: 1.67 },
];

describe('EN 1990 Annex D k_n from the posterior predictive', () => {
  it('V_X unknown: the 5 % fractile of the Student-t predictive is ȳ − k_n s (EN 1990:2002 Annex D, Table D1)', () => {
    for (const row of TABLE_D1) {
      const values = sampleWith(row.n, 355, 20);
      const p = updateNormalUnknownVariance(values, 0).predictive;
      const kn = (355 - quantileOf(p, 0.05)) / 20;
      expect(Math.abs(kn - fractileFactor(row.n, 'unknown'))).toBeLessThan(1e-9);
      // the table is printed to two decimals and rounds loosely: at n = 20 it lies 0.012 below t·√(1 + 1/n)
      expect(Math.abs(kn - row.unknown)).toBeLessThan(0.0125);
    }
  });

  it('V_X known: the 5 % fractile of the normal predictive is ȳ − k_n σ (EN 1990:2002 Annex D, Table D1)', () => {
    for (const row of TABLE_D1) {
      const values = sampleWith(row.n, 355, 12); // the sample's own scatter plays no part
      const p = updateNormalKnownVariance(values, 20, 0);
      const kn = (355 - quantileOf(p, 0.05)) / 20;
      expect(Math.abs(kn - 1.6448536269514722 * Math.sqrt(1 + 1 / row.n))).toBeLessThan(1e-9);
      // the table uses u = 1.64: 1.64 √(1 + 1/n) reproduces it to its rounding, 1.645 √(1 + 1/n) to 0.011
      expect(Math.abs(1.64 * Math.sqrt(1 + 1 / row.n) - row.known)).toBeLessThan(0.005);
      expect(Math.abs(kn - row.known)).toBeLessThan(0.01);
    }
    expect(Math.abs(fractileFactor(100000, 'unknown') - 1.64)).toBeLessThan(0.006); // n → ∞: 1.64 (Table D1)
  });

  it('the t predictive matches t_{n−1}(ȳ, s²(1 + 1/n)) computed with jstat (BDA3 §3.2, common practice)', () => {
    const values = [312, 298, 305, 321, 290, 301];
    const p = updateNormalUnknownVariance(values, 0).predictive;
    const m = jStat.mean(values);
    const s = jStat.stdev(values, true);
    for (const prob of [0.001, 0.05, 0.5, 0.9]) {
      expect(Math.abs(quantileOf(p, prob) - (m + s * Math.sqrt(1 + 1 / 6) * jStat.studentt.inv(prob, 5)))).toBeLessThan(1e-6);
    }
  });
});

describe('normal population: prior weight and measurement error', () => {
  const tests = [312, 298, 305, 321, 290];

  it('a prior worth n₀ tests gives exactly the answer of pooling n₀ earlier tests (BDA3 §3.3 with κ₀ = n₀, ν₀ = n₀ − 1)', () => {
    const earlier = [330, 310, 342, 318];
    const mean0 = jStat.mean(earlier);
    const sd0 = jStat.stdev(earlier, true);
    const withPrior = updateNormalUnknownVariance(tests, 0, { mean: mean0, sd: sd0, tests: earlier.length }).predictive;
    const pooled = updateNormalUnknownVariance([...earlier, ...tests], 0).predictive;
    expect(withPrior.dof).toBe(pooled.dof);
    expect(Math.abs(withPrior.loc - pooled.loc)).toBeLessThan(1e-9);
    expect(Math.abs(withPrior.scale - pooled.scale)).toBeLessThan(1e-9);
  });

  it('a measurement error takes its variance out of the predictive (unknown variance: σₙ²(1 + 1/κₙ) − σₘ²)', () => {
    const plain = updateNormalUnknownVariance(tests, 0).predictive;
    const noisy = updateNormalUnknownVariance(tests, 5).predictive;
    expect(noisy.loc).toBe(plain.loc);
    expect(Math.abs(noisy.scale ** 2 - (plain.scale ** 2 - 25))).toBeLessThan(1e-9);
  });

  it('known variance with measurement error: readings weigh 1/(σ² + σₘ²) (normal–normal conjugacy, BDA3 §2.5)', () => {
    // worked by hand: σ = 10, σₘ = 5, prior mean 320 worth 2 tests (variance 50), 5 readings of mean 305.2
    const p = updateNormalKnownVariance(tests, 10, 5, 320, 2);
    const precision = 2 / 100 + 5 / 125;
    const mean = (320 * (2 / 100) + 305.2 * (5 / 125)) / precision;
    expect(Math.abs(p.mean - mean)).toBeLessThan(1e-9);
    expect(Math.abs(p.sd - Math.sqrt(100 + 1 / precision))).toBeLessThan(1e-12);
  });

  it('refuses evidence that cannot carry an unknown variance, and readings no noisier than their error', () => {
    expect(() => updateNormalUnknownVariance([300, 310], 0)).toThrow(/at least 3/);
    expect(() => updateNormalUnknownVariance([300, 300, 300], 0)).toThrow(/do not scatter/);
    expect(() => updateNormalUnknownVariance([300, 301, 302], 5)).toThrow(/measurement error/);
    expect(() => updateNormalUnknownVariance([300, NaN, 302], 0)).toThrow(/finite/);
  });
});

describe('lognormal population through the logarithm', () => {
  const tests = [31e6, 24e6, 40e6, 28e6];

  it('the 5 % fractile is exp(m_y − k_n s_y) on the logs (EN 1990:2002 Annex D, D7.2 and Table D1)', () => {
    const logs = tests.map(Math.log);
    const my = jStat.mean(logs);
    const sy = jStat.stdev(logs, true);
    const p = updateLognormalUnknownVariance(tests, 0);
    const d = makeDistribution({ dist: 'logstudentt', loc: p.loc, scale: p.scale, dof: p.dof });
    expect(Math.abs(d.quantile(0.05) / Math.exp(my - fractileFactor(4, 'unknown') * sy) - 1)).toBeLessThan(1e-9);
  });

  it('known CoV: the predictive of ln X is N(m_y, ζ²(1 + 1/n)) with ζ² = ln(1 + V²) (EN 1990:2002 Annex D, D7.2)', () => {
    const p = updateLognormalKnownVariance(tests, 0.2, 0);
    const zeta2 = Math.log1p(0.04);
    expect(Math.abs(p.mean - jStat.mean(tests.map(Math.log)))).toBeLessThan(1e-12);
    expect(Math.abs(p.sd - Math.sqrt(zeta2 * (1 + 1 / 4)))).toBeLessThan(1e-12);
  });

  it('refuses a non-positive test result of a lognormal variable', () => {
    expect(() => updateLognormalUnknownVariance([3, 0, 4], 0)).toThrow(/> 0/);
  });
});
