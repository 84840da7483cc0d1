/**
 * u-space evaluation for the gradient-based methods (FORM, SORM, subset): transform, call g,
 * count the call, and turn NaN/±Infinity/throws into a LimitStateError naming the sample.
 */
import type { ReliabilityProblem } from './types.js';
import { LimitStateError, describeThrown, isFiniteNumber } from './limitStateError.js';
import { throwIfInterrupted } from '../runtime/interruptFlag.js';

/** Calls between looks at the Ctrl-C flag: cheap, and under a second even for 1000 variables. */
const INTERRUPT_CHECK_MASK = 63;

export interface CheckedLimitState {
  /** g(T(u)); u is not kept. */
  (u: Float64Array): number;
  /** Number of calls made so far. */
  readonly calls: () => number;
  /** The physical point of the last call (reused buffer). */
  readonly lastX: Float64Array;
}

export function checkedLimitState(problem: ReliabilityProblem, method: string): CheckedLimitState {
  const n = problem.transform.n;
  const x = new Float64Array(n);
  let calls = 0;
  const evaluate = (u: Float64Array): number => {
    if ((calls & INTERRUPT_CHECK_MASK) === 0) throwIfInterrupted(method);
    problem.transform.toPhysical(u, x);
    calls++;
    let v: number;
    try {
      v = problem.g(x);
    } catch (e) {
      throw new LimitStateError(problem.names, x, undefined, { cause: describeThrown(e), method });
    }
    if (!isFiniteNumber(v)) throw new LimitStateError(problem.names, x, v, { method });
    return v;
  };
  return Object.assign(evaluate, { calls: () => calls, lastX: x });
}
