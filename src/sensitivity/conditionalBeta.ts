/**
 * Conditional reliability index: β of the problem with one variable fixed at its low or
 * high quantile (the others stay random). The caller supplies `betaWithFixed`, e.g. FORM on
 * the reduced problem; this module only chooses the values and ranks the variables.
 * Complements the tornado: it says how much knowing a variable (e.g. by testing the
 * connection) could move β.
 */
import type { Distribution } from '../probability/distribution.js';
import { throwIfInterrupted } from '../runtime/interruptFlag.js';
import { bySwingDescending, checkedLevels, checkSameLength, type QuantileLevels } from './quantilePair.js';

export interface ConditionalBetaEntry {
  variable: string;
  lowValue: number;
  highValue: number;
  /** β with the variable fixed at its low quantile. */
  betaLow: number;
  betaHigh: number;
  /** |betaHigh − betaLow|. */
  swing: number;
}

/** β of the problem with variable `index` replaced by the constant `value`. */
export type BetaWithFixed = (index: number, value: number) => number;

export function conditionalBeta(
  names: readonly string[],
  dists: readonly Distribution[],
  betaWithFixed: BetaWithFixed,
  opts?: QuantileLevels,
): ConditionalBetaEntry[] {
  checkSameLength(names, dists, 'distributions');
  const { lowQ, highQ } = checkedLevels(opts);
  const entries = dists.map((dist, i): ConditionalBetaEntry => {
    throwIfInterrupted('the conditional β study');
    const lowValue = dist.quantile(lowQ);
    const highValue = dist.quantile(highQ);
    const betaLow = betaWithFixed(i, lowValue);
    const betaHigh = betaWithFixed(i, highValue);
    return { variable: names[i], lowValue, highValue, betaLow, betaHigh, swing: Math.abs(betaHigh - betaLow) };
  });
  return bySwingDescending(entries);
}
