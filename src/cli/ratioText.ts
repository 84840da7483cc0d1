import { formatNumber } from '../report/displayUnits.js';

/**
 * A ratio or factor to three decimals, as the terminal tables print them; far outside the range a
 * real column gives (a near-mechanism: ratios of 1e30) in engineering notation instead of the
 * thirty-digit string toFixed would print.
 */
export function ratioText(x: number): string {
  return Number.isFinite(x) && Math.abs(x) < 1e6 ? x.toFixed(3) : formatNumber(x, 4);
}
