/**
 * `npm run bench -- valid [COUNT] [SEED]`: the long run of the valid-scenario property
 * (bench/validScenarios.ts). Prints the counts and every internal error with its scenario text;
 * asserts nothing (the short run in test/scenario/validScenarios.test.ts does).
 */
import { runGeneratedScenarios, type RunSizes } from './validScenarios.js';

const BENCH_SIZES: RunSizes = { mcSamples: 5000, isSamples: 1000, subsetSamples: 300, sobolSamples: 128, report: 'png', planOutcomes: 40 };

export async function runValidBench(count: number, seed: number): Promise<string[]> {
  const start = Date.now();
  const r = await runGeneratedScenarios(seed, count, BENCH_SIZES);
  const seconds = (Date.now() - start) / 1000;
  const lines = [
    `${r.generated} generated valid scenarios (seed ${seed}), ${r.results} results, ${r.inputErrors} input errors, ${r.internalErrors.length} internal errors (${seconds.toFixed(0)} s, check + FORM, SORM, IS, MC, subset, tornado, conditional β, elasticities, Sobol, restraint study each; plan-tests with test plans, restraint --axis with two axes)`,
  ];
  const kinds = new Map<string, number>();
  for (const m of r.inputErrorMessages) {
    const key = m.replace(/ \(line \d+\)/, '').slice(0, 90);
    kinds.set(key, (kinds.get(key) ?? 0) + 1);
  }
  for (const [k, n] of kinds) lines.push(`  input error ×${n}: ${k}`);
  for (const e of r.internalErrors) lines.push(`  INTERNAL ERROR in scenario ${e.index}: ${e.message}\n${e.text}`);
  return lines;
}
