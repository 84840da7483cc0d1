/**
 * How a worker thread rebuilds the column's reliability problem: from the scenario text itself,
 * so that every thread parses, validates and converts exactly the same numbers.
 */
import { natafTransform } from '../probability/nataf.js';
import { compiledTwin } from '../runtime/compiledTwin.js';
import type { ProblemRecipe, ReliabilityProblem } from '../reliability/types.js';
import { loadScenario } from '../scenario/loadScenario.js';
import { buildColumnModel, type ColumnModel } from './columnModel.js';

export interface ColumnRecipeArgs {
  text: string;
  fileName: string;
}

export function problemFromModel(model: ColumnModel): ReliabilityProblem {
  return {
    names: model.names.slice(),
    transform: natafTransform(model.dists, model.correlation, model.names),
    g: model.g,
  };
}

/** The export named in the recipe: (args) => ReliabilityProblem. */
export function buildColumnProblem(args: ColumnRecipeArgs): ReliabilityProblem {
  return problemFromModel(buildColumnModel(loadScenario(args.text, args.fileName)));
}

export function columnRecipe(text: string, fileName: string): ProblemRecipe {
  return {
    module: compiledTwin(import.meta.url, 'columnRecipe.js').href,
    exportName: 'buildColumnProblem',
    args: { text, fileName } satisfies ColumnRecipeArgs,
  };
}
