/**
 * A case runner turns one sweep case into a row of results. For worker threads it is
 * rebuilt from a recipe, like a reliability ProblemRecipe: `module` is an absolute path or
 * file URL of a compiled .js module (a .ts path is mapped to its dist twin), whose export
 * `exportName` is `(args) => CaseRunner`; `args` must survive structured cloning.
 */
import { compiledModule } from '../runtime/compiledTwin.js';
import { isInterruptedError } from '../runtime/interruptFlag.js';
import type { CaseResult, ResultValue, SweepCase } from './sweepTypes.js';

export type CaseRunner = (c: SweepCase) => CaseResult | Promise<CaseResult>;

export interface CaseRunnerRecipe {
  module: string;
  exportName: string;
  args: unknown;
}

export async function loadCaseRunner(recipe: CaseRunnerRecipe): Promise<CaseRunner> {
  const mod = (await import(compiledModule(recipe.module).href)) as Record<string, unknown>;
  const factory = mod[recipe.exportName];
  if (typeof factory !== 'function') throw new Error(`${recipe.module} has no function export '${recipe.exportName}'`);
  const runner: unknown = await (factory as (args: unknown) => unknown)(recipe.args);
  if (typeof runner !== 'function') throw new Error(`${recipe.exportName}(args) did not return a case runner function`);
  return runner as CaseRunner;
}

/** A journal-safe copy of a runner's result: scalars only; non-finite numbers become text. */
export function normaliseResult(result: unknown): CaseResult {
  if (typeof result !== 'object' || result === null || Array.isArray(result)) {
    throw new Error('a case runner must return an object of result columns');
  }
  const out: CaseResult = {};
  for (const [key, value] of Object.entries(result)) {
    let v: ResultValue;
    if (typeof value === 'number') v = Number.isFinite(value) ? value : String(value);
    else if (typeof value === 'string' || typeof value === 'boolean' || value === null) v = value;
    else throw new Error(`result column '${key}' is not a number, string, boolean or null`);
    out[key] = v;
  }
  return out;
}

/** Run one case; a throw becomes a recorded error so the sweep goes on, except Ctrl-C, which stops it. */
export async function runOneCase(runner: CaseRunner, c: SweepCase): Promise<{ result: CaseResult; error?: string }> {
  try {
    return { result: normaliseResult(await runner(c)) };
  } catch (error) {
    if (isInterruptedError(error)) throw error;
    return { result: {}, error: error instanceof Error ? error.message : String(error) };
  }
}
