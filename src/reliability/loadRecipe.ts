/** Build a problem from its recipe (what a worker thread does; also handy in the main thread). */
import type { ProblemRecipe, ReliabilityProblem } from './types.js';
import { importableUrl } from '../runtime/compiledTwin.js';

export async function loadRecipe(recipe: ProblemRecipe): Promise<ReliabilityProblem> {
  const mod = (await import(importableUrl(recipe.module))) as Record<string, unknown>;
  const build = mod[recipe.exportName];
  if (typeof build !== 'function') {
    throw new Error(`recipe module ${recipe.module} has no function export '${recipe.exportName}'`);
  }
  return (build as (args: unknown) => ReliabilityProblem)(recipe.args);
}
