/**
 * A problem's block form of g (types.ts BlockLimitState) changes speed only: Monte Carlo and the
 * FORM self-check give the same numbers, calls and errors with it as without it, a block form
 * that belongs to another g is ignored, and one that throws hands its block to the one-sample path.
 */
import { describe, expect, it } from 'vitest';
import { lowerTimes, sparseLower, sparseLowerTimes } from '../../src/probability/cholesky.js';
import { form } from '../../src/reliability/form.js';
import { checkForm } from '../../src/reliability/formCheck.js';
import { LimitStateError } from '../../src/reliability/limitStateError.js';
import { monteCarlo } from '../../src/reliability/monteCarlo.js';
import { misbehaving, resistanceMinusLoad } from '../../src/reliability/testProblems.js';
import type { BlockLimitState, LimitState, ReliabilityProblem } from '../../src/reliability/types.js';

/** The problem with a block form of its own g: out[b] = g(x_b), written column-wise. */
function withBlock(problem: ReliabilityProblem, evaluate?: BlockLimitState['evaluate'], of: LimitState = problem.g): ReliabilityProblem {
  const g = problem.g;
  const x = new Float64Array(problem.names.length);
  const columnWise: BlockLimitState['evaluate'] = (columns, count, out) => {
    for (let b = 0; b < count; b++) {
      for (let i = 0; i < x.length; i++) x[i] = columns[i][b];
      out[b] = g(x);
    }
  };
  return { ...problem, gBlock: { of, evaluate: evaluate ?? columnWise } };
}

const R_MINUS_S = () => resistanceMinusLoad({ r: { dist: 'lognormal', mean: 200, cov: 0.15 }, s: { dist: 'gumbel', mean: 100, cov: 0.3 }, rho: 0.3 });

describe('Monte Carlo with a block form', () => {
  it('counts the same failures as the one-sample path', async () => {
    const plain = await monteCarlo(R_MINUS_S(), { samples: 50_000, seed: 9, chunkSize: 5000 });
    const block = await monteCarlo(withBlock(R_MINUS_S()), { samples: 50_000, seed: 9, chunkSize: 5000 });
    expect(plain.failures).toBeGreaterThan(50);
    expect(block.failures).toBe(plain.failures);
  });

  it('ignores a block form tied to another g', async () => {
    const wrong = withBlock(R_MINUS_S(), (_c, count, out) => out.fill(-1, 0, count), () => -1);
    const plain = await monteCarlo(R_MINUS_S(), { samples: 20_000, seed: 3 });
    expect((await monteCarlo(wrong, { samples: 20_000, seed: 3 })).failures).toBe(plain.failures);
  });

  it('falls back to one sample at a time where the block form throws', async () => {
    const throwing = withBlock(R_MINUS_S(), () => {
      throw new RangeError('outside the table');
    });
    const plain = await monteCarlo(R_MINUS_S(), { samples: 20_000, seed: 5 });
    expect((await monteCarlo(throwing, { samples: 20_000, seed: 5 })).failures).toBe(plain.failures);
  });

  it('names the same first NaN sample as the one-sample path', async () => {
    // common practice: a NaN limit state must stop the run, never be counted as safe
    const args = { mode: 'nan', above: 180 } as const;
    const catchIt = async (p: ReliabilityProblem): Promise<LimitStateError> => {
      try {
        await monteCarlo(p, { samples: 200_000, seed: 4, chunkSize: 1000 });
      } catch (e) {
        expect(e).toBeInstanceOf(LimitStateError);
        return e as LimitStateError;
      }
      throw new Error('no error thrown');
    };
    const plain = await catchIt(misbehaving(args));
    const block = await catchIt(withBlock(misbehaving(args)));
    expect(block.sampleIndex).toBe(plain.sampleIndex);
    expect(block.x).toEqual(plain.x);
    expect(block.message).toBe(plain.message);
  });
});

describe('the FORM self-check with a block form', () => {
  it('gives the same estimate and calls as the one-sample path', () => {
    const f = form(R_MINUS_S());
    const plain = checkForm(R_MINUS_S(), f);
    const block = checkForm(withBlock(R_MINUS_S()), f);
    expect(plain.failures).toBeGreaterThan(0);
    expect(block).toEqual(plain);
  });

  it('raises the same error for a NaN limit state', () => {
    const args = { mode: 'nan', above: 150 } as const;
    const f = form(resistanceMinusLoad({ r: { dist: 'normal', mean: 200, sd: 20 }, s: { dist: 'normal', mean: 100, sd: 25 } }));
    const message = (p: ReliabilityProblem): string => {
      try {
        checkForm(p, f);
      } catch (e) {
        expect(e).toBeInstanceOf(LimitStateError);
        return (e as Error).message;
      }
      throw new Error('no error thrown');
    };
    expect(message(withBlock(misbehaving(args)))).toBe(message(misbehaving(args)));
  });
});

describe('sparse lower-triangular product', () => {
  it('equals the dense product', () => {
    const n = 6;
    const L = new Float64Array(n * n);
    for (let i = 0; i < n; i++) L[i * n + i] = 1;
    L[3 * n + 1] = 0.4;
    L[3 * n + 3] = 0.9;
    L[5 * n + 0] = -0.25;
    L[5 * n + 5] = 0.8;
    const x = Float64Array.from([0.3, -1.2, 2.5, 0.7, -0.1, 1.9]);
    const dense = new Float64Array(n);
    const sparse = new Float64Array(n);
    lowerTimes(L, n, x, dense);
    const s = sparseLower(L, n);
    sparseLowerTimes(s, x, sparse);
    expect(Array.from(sparse)).toEqual(Array.from(dense));
    expect(s.value.length).toBe(n + 2);
  });
});
