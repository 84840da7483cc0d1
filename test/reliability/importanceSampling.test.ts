import { describe, expect, it } from 'vitest';
import { importanceSampling, importanceSamplingAtDesignPoint, isEstimate } from '../../src/reliability/importanceSampling.js';
import { form } from '../../src/reliability/form.js';
import { linearSum, paraboloid, shortColumn, testProblemRecipe } from '../../src/reliability/testProblems.js';
import { normalSf } from '../../src/probability/normal.js';

/**
 * Exact CoV of IS at the design point for the linear limit state (docs/verification.md §R1i):
 * CoV = sqrt((exp(β²) Φ(−2β)/Φ(−β)² − 1)/N).
 */
function exactIsCov(beta: number, n: number): number {
  return Math.sqrt((Math.exp(beta * beta) * normalSf(2 * beta) / normalSf(beta) ** 2 - 1) / n);
}

describe('importance sampling at the design point', () => {
  for (const [beta, pf] of [[3.5, 2.32629e-4], [5, 2.86652e-7]] as const) {
    it(`§1c linear in 100 normals, β = ${beta}: pf within 4 exact standard errors, CoV as predicted`, async () => {
      const problem = linearSum({ n: 100, beta });
      const f = form(problem, { restarts: 0 });
      const r = await importanceSamplingAtDesignPoint(problem, f, { samples: 2000, seed: 21 });
      // source: docs/verification.md §R1c exact pf and §R1i exact IS variance (own derivation there)
      const cov = exactIsCov(beta, 2000);
      expect(Math.abs(r.pf / pf - 1)).toBeLessThanOrEqual(4 * cov);
      // the sample CoV estimates the exact one: its own relative error is about 5 % here
      expect(r.cov / cov).toBeGreaterThan(0.75);
      expect(r.cov / cov).toBeLessThan(1.25);
      expect(r.calls).toBe(2000);
      expect(r.warnings).toEqual([]);
    });
  }

  it('§R1i stops at the target CoV after about the predicted number of samples', async () => {
    const problem = linearSum({ n: 100, beta: 5 });
    const f = form(problem, { restarts: 0 });
    const r = await importanceSamplingAtDesignPoint(problem, f, { samples: 100_000, seed: 8, targetCov: 0.1 });
    // source: docs/verification.md §R1i: N for 10 % CoV at β = 5 is 568
    expect(r.stoppedEarly).toBe(true);
    expect(r.stopReason).toBe('target-cov');
    expect(r.cov).toBeLessThanOrEqual(0.1);
    expect(r.samples).toBeGreaterThan(300);
    expect(r.samples).toBeLessThan(1000);
    expect(Math.abs(r.pf / 2.86652e-7 - 1)).toBeLessThanOrEqual(4 * exactIsCov(5, r.samples));
  });

  it('§R1d paraboloid n = 10, κ = 0.1: within 4 reported standard errors of the exact 3.53069e-4', async () => {
    const problem = paraboloid({ n: 10, beta: 3, kappa: 0.1 });
    const r = await importanceSamplingAtDesignPoint(problem, form(problem), { samples: 20_000, seed: 3 });
    // source: docs/verification.md §R1d exact column
    expect(r.cov).toBeLessThan(0.05);
    expect(Math.abs(r.pf / 3.53069e-4 - 1)).toBeLessThanOrEqual(4 * r.cov);
  });

  it('§R2b short column: agrees with the 4e7-sample MC of the reference', async () => {
    const problem = shortColumn({});
    const r = await importanceSamplingAtDesignPoint(problem, form(problem), { samples: 20_000, seed: 9 });
    // source: docs/verification.md §R2b, crude MC 4e7 samples: 9.2762e-3 ± 0.0152e-3
    const sigma = Math.hypot(r.cov * r.pf, 0.0152e-3);
    expect(Math.abs(r.pf - 9.2762e-3)).toBeLessThanOrEqual(4 * sigma);
  });

  it('is bit-identical for 1 and 2 workers', async () => {
    // common practice: per-chunk sums merged in chunk order
    const args = { n: 10, beta: 3, kappa: 0.1 };
    const problem = paraboloid(args);
    const centre = form(problem).designPointU;
    const recipe = testProblemRecipe('paraboloid', args);
    const one = await importanceSampling(problem, centre, { samples: 5000, seed: 4, chunkSize: 500 });
    const two = await importanceSampling(problem, centre, { samples: 5000, seed: 4, chunkSize: 500, workers: 2, recipe });
    expect(two.workers).toBe(2);
    expect({ ...two, workers: 1 }).toEqual(one);
  });

  it('warns when no sample fails', async () => {
    // common practice: an empty estimate must say so
    const problem = linearSum({ n: 2, beta: 3 });
    const r = await importanceSampling(problem, [-5, -5], { samples: 100, seed: 1 });
    expect(r.pf).toBe(0);
    expect(r.cov).toBe(Infinity);
    expect(r.warnings.join(' ')).toMatch(/no sample failed/);
  });
});

describe('the importance-sampling estimate is a probability', () => {
  // common practice: the weighted mean is unbiased but unbounded; near-certain failure can push it past 1
  it('is at most 1, with the raw standard error', () => {
    const e = isEstimate(400, 466.7, 700);
    expect(e.pf).toBe(1);
    const mean = 466.7 / 400;
    expect(e.cov).toBeCloseTo(Math.sqrt((700 / 400 - mean * mean) / 399), 12);
  });
});

