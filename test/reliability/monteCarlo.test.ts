import { availableParallelism } from 'node:os';
import { describe, expect, it } from 'vitest';
import { monteCarlo } from '../../src/reliability/monteCarlo.js';
import { LimitStateError } from '../../src/reliability/limitStateError.js';
import { misbehaving, paraboloid, resistanceMinusLoad, testProblemRecipe } from '../../src/reliability/testProblems.js';
import type { McResult } from '../../src/reliability/types.js';

const A_ARGS = { r: { dist: 'normal', mean: 200, sd: 20 }, s: { dist: 'normal', mean: 100, sd: 25 } } as const;
const B_ARGS = { r: { dist: 'lognormal', mean: 200, cov: 0.1 }, s: { dist: 'lognormal', mean: 100, cov: 0.25 } } as const;

/** |p̂ − p| within 4 binomial standard errors of the exact p. */
function expectWithin4Sigma(r: McResult, exact: number): void {
  const sigma = Math.sqrt((exact * (1 - exact)) / r.samples);
  expect(Math.abs(r.pf - exact), `pf ${r.pf} vs ${exact} ± ${sigma}`).toBeLessThanOrEqual(4 * sigma);
}

/** Everything but the worker count. */
function numbers(r: McResult): unknown {
  const { workers, ...rest } = r;
  void workers;
  return rest;
}

describe('crude Monte Carlo', () => {
  it('§R1a R − S: pf within 4σ of 8.93645e-4; CoV, β and Wilson interval consistent', async () => {
    const r = await monteCarlo(resistanceMinusLoad(A_ARGS), { samples: 200_000, seed: 1 });
    // source: docs/verification.md §R1a exact pf; CoV formula §R6 (binomial variance)
    expectWithin4Sigma(r, 8.93645e-4);
    expect(r.samples).toBe(200_000);
    expect(r.calls).toBe(200_000);
    expect(r.pf).toBe(r.failures / r.samples);
    expect(r.cov).toBeCloseTo(Math.sqrt((1 - r.pf) / (r.samples * r.pf)), 14);
    expect(r.ci95[0]).toBeLessThan(r.pf);
    expect(r.ci95[1]).toBeGreaterThan(r.pf);
    expect(r.beta).toBeGreaterThan(2.9);
    expect(r.beta).toBeLessThan(3.4);
    expect(r.stoppedEarly).toBe(false);
  });

  it('§R1d paraboloid n = 10, κ = 0.1: pf within 4σ of the exact 3.53069e-4', async () => {
    const r = await monteCarlo(paraboloid({ n: 10, beta: 3, kappa: 0.1 }), { samples: 1_000_000, seed: 7 });
    // source: docs/verification.md §R1d exact column (two quadratures)
    expectWithin4Sigma(r, 3.53069e-4);
  });

  it('the convergence trace is log-spaced and ends at the final count', async () => {
    // common practice: a trace for a chart of pf against N
    const r = await monteCarlo(resistanceMinusLoad(A_ARGS), { samples: 300_000, seed: 3, chunkSize: 1000 });
    const ns = r.trace.map((t) => t.samples);
    expect(ns[0]).toBe(1000);
    expect(ns[ns.length - 1]).toBe(300_000);
    for (let i = 1; i < ns.length; i++) expect(ns[i]).toBeGreaterThan(ns[i - 1]);
    expect(ns.length).toBeGreaterThan(10);
    expect(ns.length).toBeLessThan(16); // about 5 per decade over 2.5 decades
    const last = r.trace[r.trace.length - 1];
    expect(last.pf).toBe(r.pf);
    expect([last.lo, last.hi]).toEqual(r.ci95);
  });

  it('is bit-identical for 1 and 2 workers (and in-process without a recipe)', async () => {
    // common practice: chunk i uses stream i, integer failure counts
    const recipe = testProblemRecipe('resistanceMinusLoad', B_ARGS);
    const problem = resistanceMinusLoad(B_ARGS);
    const opts = { samples: 100_000, seed: 11, chunkSize: 4096 };
    const plain = await monteCarlo(problem, opts);
    const one = await monteCarlo(problem, { ...opts, recipe, workers: 1 });
    const two = await monteCarlo(problem, { ...opts, recipe, workers: 2 });
    expect(two.workers).toBe(2);
    expect(one.workers).toBe(1);
    expect(numbers(two)).toEqual(numbers(one));
    expect(numbers(plain)).toEqual(numbers(one));
    // source: docs/verification.md §R1b exact pf 3.42004e-3
    expectWithin4Sigma(two, 3.42004e-3);
  });

  it('by default starts workers only for a long run, with the same numbers as one thread', async () => {
    // common practice: the worker count never changes the numbers (chunk i uses stream i)
    const recipe = testProblemRecipe('resistanceMinusLoad', B_ARGS);
    const problem = resistanceMinusLoad(B_ARGS);
    const opts = { samples: 60_000, seed: 12, chunkSize: 4096 };
    const one = await monteCarlo(problem, { ...opts, workers: 1 });
    const short = await monteCarlo(problem, { ...opts, recipe });
    expect(short.workers).toBe(1); // 15 small chunks: far below the start-up cost
    expect(numbers(short)).toEqual(numbers(one));
    // Forced: this thread samples while the workers start, then they take over; merged in order.
    const long = { samples: 1_200_000, seed: 12, chunkSize: 2048 };
    const oneLong = await monteCarlo(problem, { ...long, workers: 1 });
    const forced = await monteCarlo(problem, { ...long, recipe, workerStartRepaidMs: 0 });
    expect(forced.workers).toBe(Math.min(availableParallelism(), 585));
    expect(numbers(forced)).toEqual(numbers(oneLong));
    expect(one.sampler).toBe('block-v2');
  });

  it('stops at the same chunk boundary once the target CoV is reached, whatever the workers', async () => {
    // common practice: the stop test runs on chunks merged in order
    const recipe = testProblemRecipe('resistanceMinusLoad', B_ARGS);
    const problem = resistanceMinusLoad(B_ARGS);
    const opts = { samples: 10_000_000, seed: 5, chunkSize: 2048, targetCov: 0.1 };
    const one = await monteCarlo(problem, opts);
    const two = await monteCarlo(problem, { ...opts, recipe, workers: 2 });
    expect(one.stoppedEarly).toBe(true);
    expect(one.stopReason).toBe('target-cov');
    expect(one.cov).toBeLessThanOrEqual(0.1);
    expect(one.samples % 2048).toBe(0);
    // one chunk fewer would not have reached it: about 100/pf samples are needed
    expect(one.samples).toBeGreaterThan(0.8 * (1 - 3.42e-3) / (0.01 * 3.42e-3));
    expect(numbers(two)).toEqual(numbers(one));
  });

  it('an abort (as on SIGINT) stops early and returns what was done', async () => {
    // common practice: Ctrl-C keeps the partial estimate
    const controller = new AbortController();
    const onSigint = (): void => controller.abort();
    process.once('SIGINT', onSigint);
    let chunks = 0;
    try {
      const r = await monteCarlo(resistanceMinusLoad(A_ARGS), {
        samples: 1e9, // memory must not grow with this
        seed: 2,
        signal: controller.signal,
        onProgress: () => {
          if (++chunks === 3) process.kill(process.pid, 'SIGINT');
        },
      });
      expect(r.stoppedEarly).toBe(true);
      expect(r.stopReason).toBe('aborted');
      expect(r.samples).toBeGreaterThanOrEqual(3 * 16384);
      expect(r.samples).toBeLessThan(1e8);
      expect(r.samples % 16384).toBe(0);
    } finally {
      process.removeListener('SIGINT', onSigint);
    }
  });

  it('an abort stops the workers too', async () => {
    // common practice: Ctrl-C stops a parallel run within a second
    const controller = new AbortController();
    setTimeout(() => controller.abort(), 300);
    const recipe = testProblemRecipe('resistanceMinusLoad', A_ARGS);
    const r = await monteCarlo(resistanceMinusLoad(A_ARGS), { samples: 1e9, seed: 2, workers: 2, recipe, signal: controller.signal });
    expect(r.stoppedEarly).toBe(true);
    expect(r.stopReason).toBe('aborted');
    expect(r.samples).toBeLessThan(1e9);
  });

  it('reports the first offending sample of a NaN limit state, same with workers', async () => {
    // common practice: a NaN limit state must stop the run, never be counted as safe
    const args = { mode: 'nan', above: 180 } as const;
    const catchIt = async (workers: number): Promise<LimitStateError> => {
      try {
        await monteCarlo(misbehaving(args), { samples: 200_000, seed: 4, chunkSize: 1000, workers, recipe: testProblemRecipe('misbehaving', args) });
      } catch (e) {
        expect(e).toBeInstanceOf(LimitStateError);
        return e as LimitStateError;
      }
      throw new Error('no error thrown');
    };
    const e1 = await catchIt(1);
    expect(e1.names).toEqual(['R', 'S']);
    expect(e1.x[1]).toBeGreaterThan(180);
    expect(Number.isNaN(e1.value)).toBe(true);
    expect(e1.message).toMatch(/Monte Carlo: limit state returned NaN at sample \d+ \(R = .*, S = /);
    const e2 = await catchIt(2);
    expect(e2.sampleIndex).toBe(e1.sampleIndex);
    expect(e2.x).toEqual(e1.x);
  });

  it('says when a worker cannot build the problem from its recipe', async () => {
    // common practice: a wrong recipe is an internal failure with a clear message
    const recipe = testProblemRecipe('noSuchProblem', {});
    await expect(monteCarlo(resistanceMinusLoad(A_ARGS), { samples: 100_000, seed: 1, workers: 2, recipe })).rejects.toThrow(
      /worker could not build the problem: .*no function export 'noSuchProblem'/,
    );
  });

  it('reports a limit state that throws', async () => {
    // common practice: the cause is kept in the message
    await expect(monteCarlo(misbehaving({ mode: 'throw', above: 170 }), { samples: 100_000, seed: 4 })).rejects.toThrow(
      /threw: load beyond the model range at sample/,
    );
    await expect(monteCarlo(misbehaving({ mode: 'infinity', above: 170 }), { samples: 100_000, seed: 4 })).rejects.toThrow(
      /returned -Infinity/,
    );
  });
});
