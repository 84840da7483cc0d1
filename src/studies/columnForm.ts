/**
 * FORM on a whole scenario: the one call the studies repeat (conditional β, elasticities,
 * restraint curve). A column that is a mechanism everywhere fails with certainty. β and pf are
 * those of FORM's series system of design points (FORM's own when there is one).
 */
import { buildColumnModel, type AxisName } from '../limitState/columnModel.js';
import { problemFromModel } from '../limitState/columnRecipe.js';
import { form } from '../reliability/form.js';
import { sorm } from '../reliability/sorm.js';
import { checkEstimate, checkForm, type FormCheckResult } from '../reliability/formCheck.js';
import type { Scenario } from '../scenario/types.js';

export interface BetaPoint {
  beta: number;
  pf: number;
  converged: boolean;
}

export interface CheckedBetaPoint extends BetaPoint {
  /** The sampling check of FORM (absent where there is nothing random to sample). */
  check?: FormCheckResult;
  /** β and pf of the check itself (its upper bound when nothing failed); FORM's where there is no check. */
  checkBeta: number;
  checkPf: number;
}

/** β at both certain extremes: no random variable, or a mechanism at the means. */
function certain(s: Scenario, axis?: AxisName): BetaPoint | null {
  const model = buildColumnModel(s, undefined, axis);
  if (model.names.length === 0 || !(model.capacity(model.mean) > 0)) {
    const g = model.g(model.mean);
    return g > 0 ? { beta: Infinity, pf: 0, converged: true } : { beta: -Infinity, pf: 1, converged: true };
  }
  return null;
}

/** `axis`: FORM on the capacity about that axis alone (default: the column, min over its axes). */
export function scenarioForm(s: Scenario, axis?: AxisName): BetaPoint {
  const known = certain(s, axis);
  if (known) return known;
  // restarts: 0 — no blind restarts; doubtful directions are still searched (form.ts)
  const r = form(problemFromModel(buildColumnModel(s, undefined, axis)), { restarts: 0 });
  return { beta: r.system.beta, pf: r.system.pf, converged: r.converged };
}

/** FORM and its sampling check (formCheck.ts) on a whole scenario. */
export function scenarioFormChecked(s: Scenario, seed: number): CheckedBetaPoint {
  const known = certain(s);
  if (known) return { ...known, checkBeta: known.beta, checkPf: known.pf };
  const problem = problemFromModel(buildColumnModel(s));
  const r = form(problem, { restarts: 0 });
  const check = checkForm(problem, r, { seed });
  const e = checkEstimate(check);
  return { beta: r.system.beta, pf: r.system.pf, converged: r.converged, check, checkBeta: e.beta, checkPf: e.pf };
}

/** SORM on a whole scenario (its nearest design point), for the restraint study's `--method sorm`. */
export function scenarioSorm(s: Scenario): BetaPoint {
  const known = certain(s);
  if (known) return known;
  const problem = problemFromModel(buildColumnModel(s));
  const r = form(problem, { restarts: 0 });
  const q = sorm(problem, r);
  return Number.isFinite(q.beta) ? { beta: q.beta, pf: q.pf, converged: r.converged } : { beta: r.system.beta, pf: r.system.pf, converged: r.converged };
}

/** FORM's signed α of every random variable of a scenario (resistances < 0), by name. */
export function scenarioAlphas(s: Scenario): { names: string[]; alpha: number[] } {
  const model = buildColumnModel(s);
  if (model.names.length === 0) return { names: [], alpha: [] };
  const r = form(problemFromModel(model), { restarts: 0 });
  return { names: [...model.names], alpha: r.alpha };
}
