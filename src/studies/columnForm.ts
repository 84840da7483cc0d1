/**
 * FORM on a whole scenario: the one call the studies repeat (conditional β, elasticities,
 * restraint curve). A column that is a mechanism everywhere fails with certainty.
 */
import { buildColumnModel } from '../limitState/columnModel.js';
import { problemFromModel } from '../limitState/columnRecipe.js';
import { form } from '../reliability/form.js';
import type { Scenario } from '../scenario/types.js';

export interface BetaPoint {
  beta: number;
  pf: number;
  converged: boolean;
}

export function scenarioForm(s: Scenario): BetaPoint {
  const model = buildColumnModel(s);
  if (model.names.length === 0 || !(model.capacity(model.mean) > 0)) {
    const g = model.g(model.mean);
    return g > 0 ? { beta: Infinity, pf: 0, converged: true } : { beta: -Infinity, pf: 1, converged: true };
  }
  // restarts: 0 — the main assessment has already looked for other design points
  const r = form(problemFromModel(model), { restarts: 0 });
  return { beta: r.beta, pf: r.pf, converged: r.converged };
}
