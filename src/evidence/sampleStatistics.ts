/** Sample size, mean and (n − 1)-divisor variance of test results, summed in two passes. */
import { EvidenceError } from './evidenceError.js';

export interface SampleStatistics {
  readonly n: number;
  readonly mean: number;
  /** s² with divisor n − 1 (0 for a single value). */
  readonly variance: number;
}

export function sampleStatistics(values: readonly number[]): SampleStatistics {
  const n = values.length;
  if (n === 0) throw new EvidenceError('no test results were given');
  for (const v of values) if (!Number.isFinite(v)) throw new EvidenceError(`a test result is not a finite number (${v})`);
  let sum = 0;
  for (const v of values) sum += v;
  const mean = sum / n;
  let ss = 0;
  for (const v of values) ss += (v - mean) * (v - mean);
  return { n, mean, variance: n > 1 ? ss / (n - 1) : 0 };
}
