/**
 * Failure given that a proof event was survived: P(g ≤ 0 | h > 0) = P(g ≤ 0 ∩ h > 0) / P(h > 0)
 * (Melchers & Beck, Structural Reliability Analysis and Prediction, 3rd ed., 2018, proof
 * loading; Madsen, Krenk & Lind, Methods of Structural Safety, 1986, ch. 5, conditional
 * probabilities from linearised limit states). Knows nothing of columns: g and h are any two
 * limit states on the same variables.
 *
 * FORM: each of g and h is linearised at its own design point, Y_g = α_g·u ≥ β_g is failure and
 * Y_h = α_h·u ≥ β_h the (not observed) failure under the proof; corr(Y_g, Y_h) = α_g·α_h, so
 *     P(g ≤ 0 ∩ h > 0) = P(Y_g ≥ β_g, Y_h < β_h)      (seriesSystem.ts, one-dimensional quadrature)
 *     P(h > 0) = Φ(β_h).
 * Exact when g and h are linear in u (a normal resistance and a fixed proof load, for example).
 * Monte Carlo: the ratio of the two counts, seeded on its own stream range. Importance sampling
 * of the same ratio, the check at small probabilities: conditionalImportance.ts.
 */
import { form, type FormOptions } from './form.js';
import { firstOutsideSecondInside } from './seriesSystem.js';
import { checkedLimitState } from './checkedLimitState.js';
import { CONDITIONAL_STREAM_BASE } from './streams.js';
import type { FormResult, LimitState, ReliabilityProblem } from './types.js';
import { normalCdf, normalQuantile, normalQuantileUpper } from '../probability/normal.js';
import { normalStream } from '../probability/rng.js';
import { throwIfInterrupted } from '../runtime/interruptFlag.js';
import { BETA_TOLERANCE, statisticalInterval } from './formCheck.js';
import { zeroFailureBound } from './zeroFailureBound.js';

/** A reliability problem with a survived event: the structure is known to have h(x) > 0. */
export interface ConditionedProblem extends ReliabilityProblem {
  readonly h: LimitState;
}

export interface ConditionalFormResult {
  /** β of the conditional failure probability, −Φ⁻¹(pf) */
  beta: number;
  pf: number;
  /** unconditional FORM β and pf of g (before the survival is known) */
  betaBefore: number;
  pfBefore: number;
  /** P(h > 0): how likely the survival was, beforehand */
  pSurvival: number;
  /** β of h ≤ 0 (the proof failing) */
  betaProof: number;
  /** α_g · α_h */
  rho: number;
  converged: boolean;
  calls: number;
  failure: FormResult;
  proof: FormResult;
}

/** β from a probability without losing the small ones. */
export function betaOf(pf: number): number {
  if (pf <= 0) return Infinity;
  if (pf >= 1) return -Infinity;
  return pf < 0.5 ? normalQuantileUpper(pf) : -normalQuantile(pf);
}

function dot(a: readonly number[], b: readonly number[]): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * b[i];
  return s;
}

/**
 * Throws a plain Error when the survival had no chance under the model (P(h > 0) = 0): the
 * caller names the input that contradicts the model.
 */
export function conditionalForm(problem: ConditionedProblem, opts: FormOptions = {}): ConditionalFormResult {
  const failure = form(problem, opts);
  const proof = form({ names: problem.names, transform: problem.transform, g: problem.h }, opts);
  const calls = failure.calls + proof.calls;
  const converged = failure.converged && proof.converged;
  const betaG = failure.beta;
  // a survival margin with no slope anywhere the search went (every variable leaves it unchanged:
  // nothing random acts on it) is certain or impossible, decided by its sign, not FORM's β = 0 of a flat g
  const flatProof = !proof.converged && proof.alpha.every((a) => a === 0) && Number.isFinite(proof.g0);
  const betaH = flatProof ? (proof.g0 > 0 ? Infinity : -Infinity) : proof.beta;
  const base = { betaBefore: betaG, pfBefore: failure.pf, betaProof: betaH, converged, calls, failure, proof };
  const pSurvival = normalCdf(betaH);
  if (betaH === -Infinity || !(pSurvival > 0)) throw new Error('the survived event has probability zero under the model');
  if (betaH === Infinity) return { ...base, beta: betaG, pf: failure.pf, pSurvival: 1, rho: 0 };
  if (betaG === Infinity) return { ...base, beta: Infinity, pf: 0, pSurvival, rho: 0 };
  const rho = Math.max(-1, Math.min(1, dot(failure.alpha, proof.alpha)));
  if (betaG === -Infinity) {
    // g fails everywhere: every survivor fails
    return { ...base, beta: -Infinity, pf: 1, pSurvival, rho };
  }
  const joint = firstOutsideSecondInside(betaG, betaH, rho);
  const pf = Math.min(1, joint / pSurvival);
  return { ...base, beta: betaOf(pf), pf, pSurvival, rho };
}

export interface ConditionalMcResult {
  pf: number;
  /** CoV of the ratio estimate given the survivors (binomial over them) */
  cov: number;
  beta: number;
  samples: number;
  survived: number;
  /** failures among the survivors */
  failures: number;
  /** P(g ≤ 0) of the same samples, ignoring the survival */
  pfBefore: number;
  seed: number;
}

/** Crude Monte Carlo of P(g ≤ 0 | h > 0); same seed, same numbers. */
export function conditionalMonteCarlo(problem: ConditionedProblem, opts: { samples: number; seed: number }): ConditionalMcResult {
  const n = problem.transform.n;
  const u = new Float64Array(n);
  const next = normalStream(opts.seed, CONDITIONAL_STREAM_BASE);
  // g through the checked path so a NaN names its sample; h checked by hand
  const G = checkedLimitState(problem, 'conditional Monte Carlo');
  const H = checkedLimitState({ names: problem.names, transform: problem.transform, g: problem.h }, 'conditional Monte Carlo');
  let survived = 0;
  let failures = 0;
  let failedAtAll = 0;
  for (let k = 0; k < opts.samples; k++) {
    if ((k & 4095) === 0) throwIfInterrupted('conditional Monte Carlo');
    for (let i = 0; i < n; i++) u[i] = next();
    const g = G(u);
    if (g <= 0) failedAtAll++;
    if (H(u) > 0) {
      survived++;
      if (g <= 0) failures++;
    }
  }
  const pf = survived > 0 ? failures / survived : NaN;
  const cov = failures > 0 ? Math.sqrt((1 - pf) / (pf * survived)) : Infinity;
  return { pf, cov, beta: betaOf(pf), samples: opts.samples, survived, failures, pfBefore: failedAtAll / opts.samples, seed: opts.seed };
}

export interface ConditionalCheck {
  /** FORM's conditional β lies within the sampling estimate's CHECK_SIGMAS interval widened by BETA_TOLERANCE */
  agrees: boolean;
  /** the estimate checked against: crude Monte Carlo or importance sampling (conditionalImportance.ts) */
  method: 'mc' | 'is';
  /** the estimate to rest on when they disagree: the sampled ratio, or the Monte Carlo one-sided bound with no failure */
  estimate: { beta: number; pf: number; upperBound: boolean };
  reason: string;
}

/**
 * Does the Monte Carlo ratio confirm FORM's conditional β? The same rule as FORM's own sampling
 * check (formCheck.ts): a lognormal interval of CHECK_SIGMAS standard errors on pf, widened by
 * BETA_TOLERANCE in β. With no failure among the survivors only the one-sided 95 % bound is known
 * (zeroFailureBound.ts): FORM agrees when its β is above that bound less the tolerance.
 */
export function conditionalCheck(formBeta: number, mc: ConditionalMcResult): ConditionalCheck {
  if (mc.failures === 0) {
    const bound = zeroFailureBound(Math.max(1, mc.survived));
    const agrees = formBeta >= bound.beta - BETA_TOLERANCE;
    return {
      agrees,
      method: 'mc',
      estimate: { beta: bound.beta, pf: bound.pf, upperBound: true },
      reason: `Monte Carlo saw no failure among ${mc.survived} survivors (β above ${bound.beta.toFixed(2)} at 95 %), ${agrees ? 'consistent with' : 'which contradicts'} FORM's β = ${formBeta.toFixed(2)}`,
    };
  }
  const [low, high] = statisticalInterval(mc.pf, mc.cov);
  const agrees = formBeta >= low - BETA_TOLERANCE && formBeta <= high + BETA_TOLERANCE;
  return {
    agrees,
    method: 'mc',
    estimate: { beta: mc.beta, pf: mc.pf, upperBound: false },
    reason: `Monte Carlo gives β = ${mc.beta.toFixed(2)} (${mc.failures} failures among ${mc.survived} survivors, CoV ${(100 * mc.cov).toFixed(0)} %), ${agrees ? 'which agrees with' : 'which disagrees with'} FORM's β = ${formBeta.toFixed(2)}`,
  };
}
