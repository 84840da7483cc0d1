/**
 * Tornado diagram data: one variable at a time at its low / high quantile, every other
 * variable at its mean, and the response recorded. Sorted by swing |high − low|, largest
 * first (docs/json-output.md uses utilization as the response; capacity works the same way).
 */
import type { Distribution } from '../probability/distribution.js';
import { throwIfInterrupted } from '../runtime/interruptFlag.js';
import { bySwingDescending, checkedLevels, checkSameLength, type QuantileLevels } from './quantilePair.js';

export interface TornadoEntry {
  variable: string;
  /** Response with this variable at its low quantile. */
  low: number;
  /** Response with this variable at its high quantile. */
  high: number;
  /** |high − low|. */
  swing: number;
  /** The variable's value at the low quantile (physical units). */
  lowValue: number;
  highValue: number;
}

/** The response must not keep a reference to x (the array is reused). */
export type Response = (x: Float64Array) => number;

export function tornado(
  names: readonly string[],
  dists: readonly Distribution[],
  response: Response,
  opts?: QuantileLevels,
): TornadoEntry[] {
  checkSameLength(names, dists, 'distributions');
  const { lowQ, highQ } = checkedLevels(opts);
  const x = Float64Array.from(dists, (d) => d.mean);
  const entries: TornadoEntry[] = [];
  for (let i = 0; i < dists.length; i++) {
    throwIfInterrupted('the tornado study');
    const lowValue = dists[i].quantile(lowQ);
    const highValue = dists[i].quantile(highQ);
    x[i] = lowValue;
    const low = response(x);
    x[i] = highValue;
    const high = response(x);
    x[i] = dists[i].mean;
    entries.push({ variable: names[i], low, high, swing: Math.abs(high - low), lowValue, highValue });
  }
  return bySwingDescending(entries);
}
