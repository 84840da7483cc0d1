/**
 * g at a batch of u-space points, for methods that choose their points themselves (the FORM
 * self-check): the points are transformed (x = T(u); column-wise when the transform offers
 * toPhysicalRows, bit-identical to one point at a time), then g runs once over the
 * batch through the problem's block form when it has one (types.ts BlockLimitState), else point
 * by point. Values, errors and call counts are those of checkedLimitState called on each point in
 * order: the block form is bit-identical to g, a NaN/±Infinity raises the same LimitStateError
 * for the first such point, and a block form that throws hands the batch to the one-point path.
 */
import { checkedLimitState } from './checkedLimitState.js';
import { LimitStateError, isFiniteNumber } from './limitStateError.js';
import type { ReliabilityProblem } from './types.js';
import { throwIfInterrupted } from '../runtime/interruptFlag.js';

export interface BatchLimitState {
  /** out[r] = g(T(u_r)), u_r = uRows[r·n … r·n + n), for r < count (count ≤ the batch size). */
  evaluate(uRows: Float64Array, count: number, out: Float64Array): void;
  /** Limit-state calls so far. */
  calls(): number;
}

export function batchLimitState(problem: ReliabilityProblem, method: string, batchSize: number): BatchLimitState {
  const one = checkedLimitState(problem, method);
  const block = problem.gBlock !== undefined && problem.gBlock.of === problem.g ? problem.gBlock : null;
  if (block === null) {
    const n = problem.transform.n;
    return {
      evaluate: (uRows, count, out) => {
        for (let r = 0; r < count; r++) out[r] = one(uRows.subarray(r * n, r * n + n));
      },
      calls: one.calls,
    };
  }
  const n = problem.transform.n;
  const transform = problem.transform;
  const columns = Array.from({ length: n }, () => new Float64Array(batchSize));
  const u = new Float64Array(n);
  const x = new Float64Array(n);
  let blockCalls = 0;
  const onePointEach = (uRows: Float64Array, count: number, out: Float64Array): void => {
    for (let r = 0; r < count; r++) out[r] = one(uRows.subarray(r * n, r * n + n));
  };
  return {
    evaluate: (uRows, count, out) => {
      if (count > batchSize) throw new Error(`batch of ${count} points exceeds ${batchSize}`);
      throwIfInterrupted(method);
      if (transform.toPhysicalRows !== undefined) transform.toPhysicalRows(uRows, count, columns);
      else {
        for (let r = 0; r < count; r++) {
          for (let i = 0; i < n; i++) u[i] = uRows[r * n + i];
          transform.toPhysical(u, x);
          for (let i = 0; i < n; i++) columns[i][r] = x[i];
        }
      }
      try {
        block.evaluate(columns, count, out);
      } catch {
        onePointEach(uRows, count, out);
        return;
      }
      for (let r = 0; r < count; r++) {
        const v = out[r];
        if (!isFiniteNumber(v)) {
          blockCalls += r + 1;
          for (let i = 0; i < n; i++) x[i] = columns[i][r];
          throw new LimitStateError(problem.names, x, v, { method });
        }
      }
      blockCalls += count;
    },
    calls: () => one.calls() + blockCalls,
  };
}
