/**
 * How a worker thread rebuilds the column's reliability problem: from the validated scenario
 * itself (plain data, cloned to the thread), so every thread uses exactly the same numbers and
 * none pays for parsing, units or validation again.
 */
import { natafTransform } from '../probability/nataf.js';
import { compiledTwin } from '../runtime/compiledTwin.js';
import type { ProblemRecipe, ReliabilityProblem } from '../reliability/types.js';
import type { Scenario } from '../scenario/types.js';
import { buildColumnModel, type ColumnModel } from './columnModel.js';
import { combinationModels, combinationSystemProblem } from './combinationSystem.js';

export interface ColumnRecipeArgs {
  scenario: Scenario;
  /** the series system of every load combination instead of the default one */
  system?: boolean;
}

export function problemFromModel(model: ColumnModel): ReliabilityProblem {
  return {
    names: model.names.slice(),
    transform: natafTransform(model.dists, model.correlation, model.names),
    g: model.g,
    ...(model.gBlock ? { gBlock: { of: model.g, evaluate: model.gBlock } } : {}),
  };
}

/** The export named in the recipe: (args) => ReliabilityProblem. */
export function buildColumnProblem(args: ColumnRecipeArgs): ReliabilityProblem {
  if (args.system) return combinationSystemProblem(combinationModels(args.scenario));
  return problemFromModel(buildColumnModel(args.scenario));
}

export function columnRecipe(scenario: Scenario, system = false): ProblemRecipe {
  return {
    module: compiledTwin(import.meta.url, 'columnRecipe.js').href,
    exportName: 'buildColumnProblem',
    args: (system ? { scenario, system } : { scenario }) satisfies ColumnRecipeArgs,
  };
}
