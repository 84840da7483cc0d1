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
    // a traced capacity jumps a little where its path changes steps: at the mean resistance's scale
    ...(model.capacityNoise > 0 ? { gNoise: model.capacityNoise * Math.abs(model.modelFactor(model.mean) * model.capacity(model.mean)) } : {}),
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
