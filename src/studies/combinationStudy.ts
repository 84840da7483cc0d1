/**
 * With two or more time-varying loads: FORM (and SORM when asked) on every load combination,
 * and the series system of the combinations from seriesSystemFailure (linearised limit states
 * at each design point, their correlation from the α vectors). The sampling methods evaluate
 * min_j g_j directly (limitState/combinationSystem.ts).
 */
import type { ColumnModel } from '../limitState/columnModel.js';
import { problemFromModel } from '../limitState/columnRecipe.js';
import { form } from '../reliability/form.js';
import { seriesSystemFailure, type SeriesSystemResult } from '../reliability/seriesSystem.js';
import { sorm } from '../reliability/sorm.js';
import type { FormResult, ReliabilityProblem, SormResult } from '../reliability/types.js';

export interface CombinationResult {
  /** the leading load's name */
  leading: string;
  model: ColumnModel;
  problem: ReliabilityProblem;
  form: FormResult;
  sorm?: SormResult;
}

export interface CombinationStudy {
  combinations: CombinationResult[];
  /** index of the combination with the lowest FORM β */
  governing: number;
  /** series system from the FORM βs */
  formSystem: SeriesSystemResult;
  /** series system from the SORM βs (with FORM's α), when SORM ran */
  sormSystem?: SeriesSystemResult;
}

export function combinationStudy(models: readonly ColumnModel[], opts: { sorm: boolean; seed: number }): CombinationStudy {
  const combinations = models.map((model): CombinationResult => {
    const problem = problemFromModel(model);
    const f = form(problem);
    const r: CombinationResult = { leading: model.combination.leading ?? '', model, problem, form: f };
    if (opts.sorm) r.sorm = sorm(problem, f);
    return r;
  });
  let governing = 0;
  combinations.forEach((c, i) => {
    if (c.form.beta < combinations[governing]!.form.beta) governing = i;
  });
  const alphas = combinations.map((c) => c.form.alpha);
  const formSystem = seriesSystemFailure(
    combinations.map((c) => c.form.beta),
    alphas,
    { seed: opts.seed },
  );
  const out: CombinationStudy = { combinations, governing, formSystem };
  if (opts.sorm) {
    out.sormSystem = seriesSystemFailure(
      combinations.map((c) => c.sorm!.beta),
      alphas,
      { seed: opts.seed },
    );
  }
  return out;
}
