/**
 * What n Monte Carlo samples with no failure say about pf: only a one-sided upper bound.
 *
 * Exact binomial (Clopper–Pearson) bound at confidence 1 − a with zero successes in n trials:
 * (1 − p)^n = a, so p_u = 1 − a^(1/n) (Clopper C.J., Pearson E.S., Biometrika 26 (1934) 404–413).
 * For a = 0.05 this is close to the "rule of three", 3/n (Hanley J.A., Lippman-Hand A.,
 * JAMA 249 (1983) 1743–1745), since −ln 0.05 = 2.996.
 */
import { normalQuantileUpper } from '../probability/normal.js';

export interface ZeroFailureBound {
  /** pf is below this with the stated confidence. */
  pf: number;
  /** β = −Φ⁻¹(pf bound): β is above this. */
  beta: number;
  confidence: number;
}

export function zeroFailureBound(samples: number, confidence = 0.95): ZeroFailureBound {
  if (!(samples >= 1) || !(confidence > 0 && confidence < 1)) throw new RangeError('zeroFailureBound needs samples ≥ 1 and 0 < confidence < 1');
  // −expm1(ln(a)/n) keeps full precision when n is large
  const pf = -Math.expm1(Math.log(1 - confidence) / samples);
  return { pf, beta: normalQuantileUpper(pf), confidence };
}
