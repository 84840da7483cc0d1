import { describe, expect, it } from 'vitest';
import { subsetSimulation, subsetToTargetCov } from '../../src/reliability/subsetSimulation.js';
import { linearSum, paraboloid } from '../../src/reliability/testProblems.js';
import type { ReliabilityProblem, SubsetResult } from '../../src/reliability/types.js';

interface RunStats { mean: number; runCov: number; meanReportedCov: number; results: SubsetResult[] }

function repeat(problem: ReliabilityProblem, runs: number, seed: number): RunStats {
  const results = Array.from({ length: runs }, (_, run) => subsetSimulation(problem, { seed, run }));
  const pfs = results.map((r) => r.pf);
  const mean = pfs.reduce((a, b) => a + b, 0) / runs;
  const sd = Math.sqrt(pfs.reduce((a, b) => a + (b - mean) ** 2, 0) / (runs - 1));
  const meanReportedCov = results.reduce((a, r) => a + r.cov, 0) / runs;
  return { mean, runCov: sd / mean, meanReportedCov, results };
}

/**
 * Subset simulation is right-skewed and biased by O(1/N): test the mean of independent runs
 * against the exact pf with 3 standard errors of that mean (docs/verification.md §R6 advice).
 */
function expectMeanNearExact(s: RunStats, exact: number, runs: number): void {
  const tolerance = (3 * s.runCov) / Math.sqrt(runs);
  expect(Math.abs(s.mean / exact - 1), `mean ${s.mean} vs ${exact}, run CoV ${s.runCov}`).toBeLessThanOrEqual(tolerance);
}

describe('subset simulation', () => {
  it('§R1c1 linear in 100 normals, β = 3.5: mean of 50 runs near 2.32629e-4', () => {
    const s = repeat(linearSum({ n: 100, beta: 3.5 }), 50, 101);
    // source: docs/verification.md §R1c1 exact pf; Au & Beck 2001 (formulas from memory)
    expectMeanNearExact(s, 2.32629e-4, 50);
    // source: docs/verification.md §R6, run-to-run CoV about 0.3 at this pf (own runs there)
    expect(s.runCov).toBeGreaterThan(0.15);
    expect(s.runCov).toBeLessThan(0.5);
    // the reported CoV (levels taken as independent) is of the size of the observed scatter
    expect(s.meanReportedCov / s.runCov).toBeGreaterThan(0.6);
    expect(s.meanReportedCov / s.runCov).toBeLessThan(1.5);
  });

  it('§R1c2 linear in 100 normals, β = 5: mean of 50 runs near 2.86652e-7, about 6 400 calls', () => {
    const s = repeat(linearSum({ n: 100, beta: 5 }), 50, 202);
    // source: docs/verification.md §R1c2 exact pf and §R6 (about 6 430 calls, CoV about 0.5)
    expectMeanNearExact(s, 2.86652e-7, 50);
    expect(s.runCov).toBeGreaterThan(0.3);
    expect(s.runCov).toBeLessThan(0.8);
    const meanCalls = s.results.reduce((a, r) => a + r.calls, 0) / 50;
    expect(meanCalls).toBeGreaterThan(5500);
    expect(meanCalls).toBeLessThan(7400);
  });

  it('§R1d paraboloid n = 2, κ = 0.1: mean of 100 runs near 1.16896e-3', () => {
    const s = repeat(paraboloid({ n: 2, beta: 3, kappa: 0.1 }), 100, 303);
    // source: docs/verification.md §R1d exact column
    expectMeanNearExact(s, 1.16896e-3, 100);
  });

  it('costs N + (m − 1)(1 − p0)N calls and its levels multiply to pf', () => {
    const r = subsetSimulation(linearSum({ n: 10, beta: 4.75342 }), { seed: 5 });
    // source: docs/verification.md §R6: 1000 + 5·900 = 5 500 calls for m = 6 levels at pf = 1e-6
    expect(r.calls).toBe(1000 + (r.levels.length - 1) * 900);
    expect(r.levels.length).toBeGreaterThanOrEqual(5);
    expect(r.levels.length).toBeLessThanOrEqual(7);
    expect(r.converged).toBe(true);
    // p0 = 0.1, or a little more when repeated chain states tie at the threshold
    expect(r.levels.slice(0, -1).every((l) => l.p >= 0.1 && l.p < 0.12 && l.threshold > 0)).toBe(true);
    expect(r.levels[0].p).toBe(0.1);
    expect(r.levels[r.levels.length - 1].threshold).toBe(0);
    expect(r.levels[0].gamma).toBe(0);
    expect(r.pf).toBeCloseTo(r.levels.reduce((a, l) => a * l.p, 1), 20);
    for (let i = 1; i < r.levels.length - 1; i++) expect(r.levels[i].threshold).toBeLessThan(r.levels[i - 1].threshold);
    // common practice: the lower bound with independent samples, sqrt(Σ (1 − p)/(N p))
    const bound = Math.sqrt(r.levels.reduce((a, l) => a + (1 - l.p) / (1000 * l.p), 0));
    expect(r.cov).toBeGreaterThanOrEqual(bound);
  });

  it('is reproducible from the seed and run number', () => {
    // common practice: seeded streams
    const p = linearSum({ n: 5, beta: 3 });
    expect(subsetSimulation(p, { seed: 9 })).toEqual(subsetSimulation(p, { seed: 9 }));
    expect(subsetSimulation(p, { seed: 9, run: 1 }).pf).not.toBe(subsetSimulation(p, { seed: 9 }).pf);
  });

  it('says so when the cap on levels is reached', () => {
    // common practice: never return an unconverged estimate silently
    const r = subsetSimulation(linearSum({ n: 5, beta: 5 }), { seed: 1, maxLevels: 3 });
    expect(r.converged).toBe(false);
    expect(r.levels).toHaveLength(3);
    expect(r.warnings.join(' ')).toMatch(/cap of 3 levels/);
  });

  it('a whole-failing problem stops at level 0', () => {
    // common practice: pf = failures/N when at least p0·N samples fail
    const r = subsetSimulation(linearSum({ n: 2, beta: -1 }), { seed: 1, samplesPerLevel: 500 });
    expect(r.levels).toHaveLength(1);
    expect(r.calls).toBe(500);
    expect(r.pf).toBeGreaterThan(0.75);
  });

  it('rejects an N that p0 does not divide', () => {
    // common practice: N·p0 seeds, each growing a chain of 1/p0 states
    expect(() => subsetSimulation(linearSum({ n: 2, beta: 3 }), { seed: 1, samplesPerLevel: 1005 })).toThrow(/whole number/);
  });
});

describe('subset simulation to a target CoV', () => {
  const problem = linearSum({ n: 2, beta: 3.5 });
  it('adds independent runs until the CoV of their mean reaches the target, then stops', () => {
    const one = subsetSimulation(problem, { seed: 31 });
    const r = subsetToTargetCov(problem, { seed: 31, targetCov: 0.1 });
    expect(r.cov).toBeLessThanOrEqual(0.1);
    expect(r.runs).toBeGreaterThan(1);
    // stops as soon as reached: one run fewer would not have reached it
    const fewer = subsetToTargetCov(problem, { seed: 31, targetCov: 0.1, maxRuns: (r.runs ?? 1) - 1 });
    expect(fewer.cov).toBeGreaterThan(0.1);
    expect(fewer.warnings.join(' ')).toMatch(/target CoV 0.1 was not reached/);
    // run 0 is the plain run: same streams, and its calls are counted with the others'
    expect(r.calls).toBeGreaterThan(one.calls);
    expect(subsetToTargetCov(problem, { seed: 31, targetCov: 0.1 })).toEqual(r);
    // source: docs/verification.md §R1 (row 1c1) exact pf Φ(−3.5) = 2.32629e-4; 4 × the reported CoV (from memory: levels as independent understate it slightly)
    expect(Math.abs(r.pf / 2.32629e-4 - 1)).toBeLessThanOrEqual(4 * r.cov);
  });

  it('without a target it is exactly one run', () => {
    // common practice: an option left out changes nothing
    expect(subsetToTargetCov(problem, { seed: 5 })).toEqual(subsetSimulation(problem, { seed: 5 }));
  });
});
