// Simulated outcomes of planned tests (pre-posterior analysis) against the closed forms of the
// conjugate normal cases.
import { describe, expect, it } from 'vitest';
import { itemOutcome, populationOutcome } from '../../src/evidence/preposterior.js';
import { normalStream, uniformStream } from '../../src/probability/rng.js';

describe('tests of this item (normal prior, normal readings)', () => {
  // source: Gelman et al., Bayesian Data Analysis, 3rd ed. (2013), §2.5, eq. 2.12: the posterior
  // sd 1/s₁² = 1/s₀² + n/σₘ² does not depend on the readings
  const prior = { dist: 'normal' as const, mean: 300, sd: 20 };
  const cov = 0.05; // σₘ = 15 at the prior mean
  const n = 3;
  const s1 = 1 / Math.sqrt(1 / 20 ** 2 + n / 15 ** 2);

  it('every outcome has the closed-form posterior sd', () => {
    const normal = normalStream(7, 1);
    for (let k = 0; k < 20; k++) {
      const spec = itemOutcome(prior, n, cov, normal);
      expect(spec.dist).toBe('normal');
      expect(spec.sd).toBeCloseTo(s1, 10);
    }
  });

  it('the posterior means spread with variance s₀² − s₁² (within 4 standard errors)', () => {
    // source: Raiffa & Schlaifer, Applied Statistical Decision Theory (1961), pre-posterior
    // distribution of the posterior mean: Var(E[X | y]) = Var(X) − E[Var(X | y)]
    const normal = normalStream(11, 2);
    const N = 4000;
    const means: number[] = [];
    for (let k = 0; k < N; k++) means.push(itemOutcome(prior, n, cov, normal).mean!);
    const m = means.reduce((a, b) => a + b, 0) / N;
    const v = means.reduce((a, b) => a + (b - m) ** 2, 0) / (N - 1);
    const exact = 20 ** 2 - s1 ** 2;
    // common practice: the sample variance of N normal values has sd √(2/(N−1)) × variance
    expect(Math.abs(v - exact)).toBeLessThan(4 * Math.sqrt(2 / (N - 1)) * exact);
    expect(Math.abs(m - 300)).toBeLessThan(4 * Math.sqrt(exact / N));
  });
});

describe('more tests of a population with known scatter', () => {
  // source: Gelman et al. (2013) §2.5 (normal–normal conjugacy): with σₘ = 0, n₀ prior tests and
  // n tests in all the mean's posterior sd is σ/√(n₀ + n), so the predictive sd is σ √(1 + 1/(n₀ + n))
  it('the predictive sd after the planned tests is σ √(1 + 1/(n₀ + n_old + n_new))', () => {
    const sigma = 0.2e6;
    const prior = { dist: 'normal' as const, mean: 1.5e6, sd: sigma };
    const existing = { tests: [1.4e6, 1.7e6], tested: 'similar' as const, scatter: 'known' as const, priorWeight: 2, measurementSd: 0 };
    const uniform = uniformStream(3, 1);
    const normal = normalStream(3, 2);
    for (const nNew of [1, 3, 5]) {
      const spec = populationOutcome(prior, existing, nNew, uniform, normal);
      expect(spec.sd).toBeCloseTo(sigma * Math.sqrt(1 + 1 / (2 + 2 + nNew)), 6);
    }
  });
  it('simulated new tests centre on the current posterior mean (within 4 standard errors)', () => {
    // common practice: the average of pre-posterior means is the current posterior mean
    const sigma = 1;
    const prior = { dist: 'normal' as const, mean: 10, sd: sigma };
    const existing = { tests: [11, 12], tested: 'similar' as const, scatter: 'known' as const, priorWeight: 1, measurementSd: 0 };
    const current = (1 * 10 + 11 + 12) / 3; // n₀ m₀ + Σy over n₀ + n
    const uniform = uniformStream(5, 1);
    const normal = normalStream(5, 2);
    const N = 3000;
    let sum = 0;
    for (let k = 0; k < N; k++) sum += populationOutcome(prior, existing, 2, uniform, normal).mean!;
    // Var of the new posterior mean = vₙ − vₙ₊₂ = σ²(1/3 − 1/5)
    expect(Math.abs(sum / N - current)).toBeLessThan(4 * Math.sqrt((1 / 3 - 1 / 5) / N));
  });
});
