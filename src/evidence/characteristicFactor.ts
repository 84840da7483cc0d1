/**
 * The fractile factor k_n of a characteristic value X_k = m(1 − k_n V) (EN 1990:2002 Annex D,
 * D7.2, Table D1), obtained here from the posterior predictive of a normal population updated
 * with n tests under the non-informative prior: its p-fractile is ȳ − k_n s with
 *   V_X unknown: k_n = t_{n−1; 1−p} √(1 + 1/n)   (Student-t predictive)
 *   V_X known:   k_n = u_{1−p} √(1 + 1/n)        (normal predictive)
 */
import { normalQuantileUpper } from '../probability/normal.js';
import { studentTQuantileUpper } from '../probability/studentTDist.js';
import { EvidenceError } from './evidenceError.js';

export function fractileFactor(n: number, variance: 'known' | 'unknown', fractile = 0.05): number {
  if (!(Number.isInteger(n) && n >= 1)) throw new EvidenceError(`the number of tests must be a whole number >= 1, got ${n}`);
  if (!(fractile > 0 && fractile < 0.5)) throw new EvidenceError(`the fractile must lie in (0, 0.5), got ${fractile}`);
  if (variance === 'known') return normalQuantileUpper(fractile) * Math.sqrt(1 + 1 / n);
  if (n < 2) throw new EvidenceError('with an unknown variance k_n needs at least 2 tests');
  return studentTQuantileUpper(fractile, n - 1) * Math.sqrt(1 + 1 / n);
}
