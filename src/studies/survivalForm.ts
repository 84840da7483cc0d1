/**
 * β of a whole scenario given its survived loads (docs/evidence.md §5, §8): the call the restraint
 * study repeats at every stiffness, the way `scenarioForm` is repeated without survived loads.
 * g and h come from `survivalProblem` of the edited scenario, so a stiffness edit reaches both:
 * the survived load tested the same column with the same connections.
 *
 * The check is the verdict's (columnAssessment.ts `survivalGoverning`): conditional importance
 * sampling, crude Monte Carlo of the ratio only when importance sampling saw no joint failure;
 * when it disagrees with conditional FORM, its estimate is the one to rest on.
 */
import { conditionalCheck, conditionalForm, conditionalMonteCarlo, type ConditionalCheck } from '../reliability/conditionalFailure.js';
import { conditionalImportance, importanceCheck } from '../reliability/conditionalImportance.js';
import { buildColumnModel } from '../limitState/columnModel.js';
import { InputError } from '../scenario/inputError.js';
import type { Scenario } from '../scenario/types.js';
import { SURVIVAL_MC_SAMPLES, survivalProblem } from './survivalStudy.js';

export interface SurvivalBetaPoint {
  /** conditional FORM: β and pf of P(g ≤ 0 | h > 0) */
  beta: number;
  pf: number;
  converged: boolean;
  /** the column at this stiffness could not have carried the survived load (P(h > 0) = 0) */
  impossible: boolean;
  /** P(h > 0) by FORM: how likely the survival was, beforehand, at this stiffness */
  pSurvival: number;
}

export interface CheckedSurvivalPoint extends SurvivalBetaPoint {
  /** the sampling check of conditional FORM (absent when FORM's answer is exact: β = ±∞, nothing random) */
  check?: { agrees: boolean; method: string; detail: ConditionalCheck };
  /** the check's estimate (its upper bound when Monte Carlo saw no failure); FORM's without a check */
  checkBeta: number;
  checkPf: number;
  /** why there is no check although FORM's β is finite */
  noCheck?: string;
}

/** How a check is named where the restraint study lists it (JSON `checks[].check_method`). */
export const SURVIVAL_CHECK_LABEL: Record<ConditionalCheck['method'], string> = {
  is: 'importance sampling given the survived loads',
  mc: 'Monte Carlo given the survived loads',
};

/** β when the survival could not have happened: no column of this stiffness is the real one; taken as failing (conservative). */
const IMPOSSIBLE: SurvivalBetaPoint = { beta: -Infinity, pf: 1, converged: true, impossible: true, pSurvival: 0 };

/** Conditional FORM of a scenario with survived loads, with the problem it ran on. */
function formGivenSurvival(s: Scenario) {
  const problem = survivalProblem(s);
  if (problem.names.length === 0) {
    // nothing random: the survival and the failure are certain or impossible
    const x = new Float64Array(0);
    if (!(problem.h(x) > 0)) return { point: IMPOSSIBLE, problem, result: null };
    const failed = problem.g(x) <= 0;
    return { point: { beta: failed ? -Infinity : Infinity, pf: failed ? 1 : 0, converged: true, impossible: false, pSurvival: 1 }, problem, result: null };
  }
  // a mechanism at the means carries nothing (scenarioForm's rule): FORM would only meet a flat h
  const model = buildColumnModel(s);
  if (!(model.capacity(model.mean) > 0)) return { point: IMPOSSIBLE, problem, result: null };
  try {
    const r = conditionalForm(problem, { restarts: 0 });
    return { point: { beta: r.beta, pf: r.pf, converged: r.converged, impossible: false, pSurvival: r.pSurvival }, problem, result: r };
  } catch (e) {
    if (e instanceof Error && /probability zero/.test(e.message)) return { point: IMPOSSIBLE, problem, result: null };
    throw e;
  }
}

/** Conditional FORM β of a scenario given its survived loads. */
export function survivalForm(s: Scenario): SurvivalBetaPoint {
  return formGivenSurvival(s).point;
}

/** Conditional FORM and the verdict's sampling check of it, same seed at every call (common random numbers). */
export function survivalFormChecked(s: Scenario, seed: number, targetCov?: number): CheckedSurvivalPoint {
  const { point, problem, result } = formGivenSurvival(s);
  if (result === null || !Number.isFinite(point.beta)) return { ...point, checkBeta: point.beta, checkPf: point.pf };
  const importance = conditionalImportance(problem, result, { seed, targetCov });
  let detail = importance ? importanceCheck(point.beta, importance) : undefined;
  if (detail === undefined) {
    const mc = conditionalMonteCarlo(problem, { samples: SURVIVAL_MC_SAMPLES, seed });
    // no survivor among the samples: the ratio has no estimate at all, not even a bound
    if (mc.survived === 0) return { ...point, checkBeta: point.beta, checkPf: point.pf, noCheck: 'none (no sample survived the load)' };
    detail = conditionalCheck(point.beta, mc);
  }
  return {
    ...point,
    check: { agrees: detail.agrees, method: SURVIVAL_CHECK_LABEL[detail.method], detail },
    checkBeta: detail.estimate.beta,
    checkPf: detail.estimate.pf,
  };
}

/** The governing β given the survived loads, as the verdict decides it: conditional FORM, or the check's estimate where they disagree. */
export function survivalGoverningBeta(s: Scenario, seed: number): { method: string; beta: number } {
  const p = survivalFormChecked(s, seed);
  if (p.check && !p.check.agrees) return { method: p.check.detail.method, beta: p.checkBeta };
  return { method: 'form', beta: p.beta };
}

/**
 * Refuses a scenario whose column, as given, could not have carried its survived load (the same
 * message as `survivalStudy`): conditioning on an impossible event has no meaning.
 */
export function requirePossibleSurvival(s: Scenario): void {
  if (!survivalForm(s).impossible) return;
  const field = s.survivedLoads![0].path;
  throw new InputError(field, 'the column could not have carried this load under the scenario’s distributions (its survival has probability zero): check the load and the distributions');
}
