/**
 * Probabilities near 1 lose their information in floating point (1 − 1e-17 is 1). Raising a
 * probability to a power n — the distribution of the largest of n independent values, or a
 * reliability index over n years — is therefore done on log-probabilities, and turned back
 * into a standard normal value from whichever tail is small.
 */
import { normalCdf, normalQuantile, normalQuantileUpper } from './normal.js';

/** ln Φ(u), accurate in both tails. */
export function logNormalCdf(u: number): number {
  return u <= 0 ? Math.log(normalCdf(u)) : Math.log1p(-normalCdf(-u));
}

/** Below this ln P, exp(ln P) underflows: the lower tail is inverted from its asymptotic form. */
const UNDERFLOW_LOG = -700;
const LOG_SQRT_2PI = 0.5 * Math.log(2 * Math.PI);

/**
 * u < 0 with ln Φ(u) = logP far in the lower tail, from Φ(u) = φ(u)/|u| · (1 − 1/u² + 3/u⁴ …)
 * (Abramowitz & Stegun 26.2.12), solved by fixed-point iteration on u² = −2(logP + ln√(2π) + ln|u| − ln(1 − 1/u² + 3/u⁴)).
 */
function lowerTailFromLog(logP: number): number {
  let u = -Math.sqrt(-2 * logP);
  for (let k = 0; k < 50; k++) {
    const u2 = u * u;
    const next = -Math.sqrt(-2 * (logP + LOG_SQRT_2PI + Math.log(-u) - Math.log1p(-1 / u2 + 3 / (u2 * u2))));
    if (Math.abs(next - u) <= 1e-15 * Math.abs(u)) return next;
    u = next;
  }
  return u;
}

/** Φ⁻¹(exp(logP)) for logP ≤ 0, taking the upper tail when P > 1/2. */
export function normalQuantileOfLog(logP: number): number {
  if (logP < UNDERFLOW_LOG) return lowerTailFromLog(logP);
  if (logP < -Math.LN2) return normalQuantile(Math.exp(logP));
  return normalQuantileUpper(-Math.expm1(logP));
}

/**
 * The standard normal value u_n with Φ(u_n) = Φ(u)^n (n > 0): the largest of n independent
 * values that are each Φ(u)-likely to stay below a level. n = 1 returns u unchanged.
 */
export function powerOfNormalCdf(u: number, n: number): number {
  if (n === 1) return u;
  return normalQuantileOfLog(n * logNormalCdf(u));
}

/**
 * A reliability index stated for one period converted to a period n times as long:
 * Φ(β_n) = Φ(β_1)^n (EN 1990:2002 Annex C, eq. C.3; independent periods).
 */
export function betaOverPeriods(beta: number, n: number): number {
  return powerOfNormalCdf(beta, n);
}
