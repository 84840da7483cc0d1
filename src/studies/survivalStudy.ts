/**
 * Failure given the loads the column is known to have survived (docs/evidence.md §5):
 * h(x) = θ·capacity(x) − max_i P_i, g(x) = θ·capacity(x) − S(x), P(g ≤ 0 | h > 0).
 * The same column and the same model: every resistance variable and the model factor θ are
 * shared by g and h (θ says how this column's real strength departs from the model, and the
 * survived load tested that real strength). The loads in g are independent of the survived loads.
 * The survived load acts like the scenario's loads (the same eccentricities, if any).
 */
import { buildColumnModel, resistanceMargin } from '../limitState/columnModel.js';
import { makeDistribution } from '../probability/makeDistribution.js';
import { natafTransform } from '../probability/nataf.js';
import { conditionalCheck, conditionalForm, conditionalMonteCarlo, type ConditionalCheck, type ConditionalMcResult, type ConditionedProblem } from '../reliability/conditionalFailure.js';
import { conditionalImportance, importanceCheck, type ConditionalImportanceResult } from '../reliability/conditionalImportance.js';
import { InputError } from '../scenario/inputError.js';
import type { Scenario } from '../scenario/types.js';

export interface SurvivalStudy {
  /** FORM (two linearised limit states, exact bivariate normal) */
  beta: number;
  pf: number;
  betaBefore: number;
  pfBefore: number;
  /** P(the column would survive the largest survived load), before knowing it did */
  pSurvival: number;
  /** correlation of the two linearised margins */
  rho: number;
  converged: boolean;
  calls: number;
  /** crude Monte Carlo of the same conditional probability, a check */
  mc?: ConditionalMcResult;
  /** importance sampling of the same conditional probability, the check at small probabilities */
  importance?: ConditionalImportanceResult;
  /** does the Monte Carlo ratio confirm FORM's conditional β (absent without Monte Carlo) */
  mcCheck?: ConditionalCheck;
  /** does the importance-sampling ratio confirm it (absent without a sample in the joint domain) */
  importanceCheck?: ConditionalCheck;
  /** the check the verdict uses: importance sampling's, else Monte Carlo's */
  check?: ConditionalCheck;
}

export const SURVIVAL_MC_SAMPLES = 400_000;

/** The conditioned problem: the model's variables, then each random survived load. */
export function survivalProblem(s: Scenario): ConditionedProblem {
  const survived = s.survivedLoads ?? [];
  if (survived.length === 0) throw new Error('survivalProblem: no survived load');
  const model = buildColumnModel(s);
  const n = model.names.length;
  const names = [...model.names];
  const dists = [...model.dists];
  const slots: { index: number; value: number }[] = [];
  for (const l of survived) {
    if (l.load.kind === 'fixed') slots.push({ index: -1, value: l.load.value });
    else {
      slots.push({ index: names.length, value: NaN });
      names.push(l.path);
      dists.push(makeDistribution(l.load.spec));
    }
  }
  const m = names.length;
  const correlation = model.correlation ? Array.from({ length: m }, (_, i) => Array.from({ length: m }, (_, j) => (i < n && j < n ? model.correlation![i][j] : i === j ? 1 : 0))) : null;
  const h = (x: Float64Array): number => {
    let largest = 0;
    for (const sl of slots) {
      const p = sl.index < 0 ? sl.value : x[sl.index];
      if (p > largest) largest = p;
    }
    // held finite as g is: far out in u-space θ and the capacity may overflow together
    return resistanceMargin(model.modelFactor(x), model.capacity(x), largest);
  };
  return { names, transform: natafTransform(dists, correlation, names), g: model.g, h };
}

/**
 * FORM, then its checks: importance sampling first (it sees failures at 1e-7 as well), crude
 * Monte Carlo beside it (no centre to choose, and the only estimate when importance sampling saw
 * no failure). `samples: 0` leaves Monte Carlo out, `importance: false` importance sampling.
 */
export function survivalStudy(s: Scenario, opts: { seed: number; samples?: number; importance?: boolean; targetCov?: number }): SurvivalStudy {
  const problem = survivalProblem(s);
  const field = s.survivedLoads![0].path;
  if (problem.names.length === 0) {
    const x = new Float64Array(0);
    if (!(problem.h(x) > 0)) throw new InputError(field, 'the column could not have carried this load: with every value fixed its resistance is below it; check the load and the scenario');
    const failed = problem.g(x) <= 0;
    const b = failed ? -Infinity : Infinity;
    return { beta: b, pf: failed ? 1 : 0, betaBefore: b, pfBefore: failed ? 1 : 0, pSurvival: 1, rho: 0, converged: true, calls: 2 };
  }
  let r;
  try {
    r = conditionalForm(problem, { restarts: 0 });
  } catch (e) {
    if (e instanceof Error && /probability zero/.test(e.message)) {
      throw new InputError(field, 'the column could not have carried this load under the scenario’s distributions (its survival has probability zero): check the load and the distributions');
    }
    throw e;
  }
  const samples = opts.samples ?? SURVIVAL_MC_SAMPLES;
  const mc = samples > 0 ? conditionalMonteCarlo(problem, { samples, seed: opts.seed }) : undefined;
  const importance = opts.importance === false ? undefined : conditionalImportance(problem, r, { seed: opts.seed, targetCov: opts.targetCov });
  const mcCheck = mc ? conditionalCheck(r.beta, mc) : undefined;
  const isCheck = importance ? importanceCheck(r.beta, importance) : undefined;
  const check = isCheck ?? mcCheck;
  return {
    beta: r.beta, pf: r.pf, betaBefore: r.betaBefore, pfBefore: r.pfBefore, pSurvival: r.pSurvival, rho: r.rho,
    converged: r.converged, calls: r.calls + (mc ? 2 * mc.samples : 0) + (importance ? importance.calls : 0),
    ...(mc ? { mc } : {}), ...(importance ? { importance } : {}),
    ...(mcCheck ? { mcCheck } : {}), ...(isCheck ? { importanceCheck: isCheck } : {}), ...(check ? { check } : {}),
  };
}
