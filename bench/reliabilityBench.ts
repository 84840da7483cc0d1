/**
 * Reliability benchmark: how fast sampling runs against a bare floor, and what the rare-event
 * methods cost. Returns printable lines; speed is shown here only, never asserted in tests.
 *
 * 1. floor: a bare loop g = R − S, R lognormal, S Gumbel, inverse-CDF sampling from one
 *    uniform stream (no transform object, no chunking): evaluations per second on one core.
 * 2. crude MC on the given recipe (default: the Euler column of docs/verification.md §R1g) with 1 and
 *    2 workers, and the ratio of its throughput to the floor.
 * 3. a rare event (pf near 1e-6; default: g = β − Σu/√n, n = 10, β = 4.75342, pf = 1e-6):
 *    limit-state calls that FORM + IS and subset simulation need to reach CoV <= 10 %.
 */
import { pathToFileURL } from 'node:url';
import { makeDistribution } from '../src/probability/makeDistribution.js';
import { uniformStream } from '../src/probability/rng.js';
import { monteCarlo } from '../src/reliability/monteCarlo.js';
import { form } from '../src/reliability/form.js';
import { importanceSamplingAtDesignPoint } from '../src/reliability/importanceSampling.js';
import { subsetSimulation } from '../src/reliability/subsetSimulation.js';
import { loadRecipe } from '../src/reliability/loadRecipe.js';
import { testProblemRecipe } from '../src/reliability/testProblems.js';
import type { ProblemRecipe } from '../src/reliability/types.js';

export interface ReliabilityBenchOptions {
  columnRecipe?: ProblemRecipe;
  rareColumnRecipe?: ProblemRecipe;
}

const TARGET_COV = 0.1;
const SEED = 20261201;

function rate(evaluations: number, ms: number): string {
  const perSecond = (evaluations / ms) * 1000;
  return perSecond >= 1e6 ? `${(perSecond / 1e6).toFixed(2)} M/s` : `${(perSecond / 1e3).toFixed(1)} k/s`;
}

/** The floor: R − S by inverse CDF, nothing else. */
function bareFloor(samples: number): { ms: number; failures: number } {
  const r = makeDistribution({ dist: 'lognormal', mean: 200, cov: 0.1 });
  const s = makeDistribution({ dist: 'gumbel', mean: 100, cov: 0.25 });
  const uniform = uniformStream(SEED, 0);
  const t0 = performance.now();
  let failures = 0;
  for (let i = 0; i < samples; i++) {
    if (r.quantile(uniform()) - s.quantile(uniform()) <= 0) failures++;
  }
  return { ms: performance.now() - t0, failures };
}

export async function runReliabilityBench(opts: ReliabilityBenchOptions = {}): Promise<string[]> {
  const lines: string[] = [];
  bareFloor(200_000); // warm-up
  const floorSamples = 4_000_000;
  const floor = bareFloor(floorSamples);
  const floorRate = (floorSamples / floor.ms) * 1000;
  lines.push(`floor: bare g = R − S (lognormal R, Gumbel S, inverse CDF), 1 core: ${rate(floorSamples, floor.ms)} (${floorSamples} samples, pf ${(floor.failures / floorSamples).toExponential(3)})`);

  const columnRecipe = opts.columnRecipe ?? testProblemRecipe('eulerColumn', { length: 5 });
  const column = await loadRecipe(columnRecipe);
  const label = opts.columnRecipe ? 'column recipe' : 'textbook Euler column (docs/verification.md §R1g)';
  // Warm-up, then a timed pilot to size the run at about 3 s on one worker.
  await monteCarlo(column, { samples: 65_536, seed: SEED });
  const t0 = performance.now();
  await monteCarlo(column, { samples: 65_536, seed: SEED + 1 });
  const perSample = (performance.now() - t0) / 65_536;
  const samples = Math.max(131_072, Math.min(50_000_000, Math.round(3000 / perSample / 16_384) * 16_384));
  for (const workers of [1, 2]) {
    const t = performance.now();
    const r = await monteCarlo(column, { samples, seed: SEED, workers, recipe: columnRecipe });
    const ms = performance.now() - t;
    const perSecond = (r.samples / ms) * 1000;
    lines.push(`crude MC, ${label}, ${workers} worker${workers > 1 ? 's' : ''}: ${rate(r.samples, ms)} (${r.samples} samples, pf ${r.pf.toExponential(3)}, CoV ${(100 * r.cov).toFixed(1)} %), ${(perSecond / floorRate).toFixed(2)} × floor`);
  }

  const rareRecipe = opts.rareColumnRecipe ?? testProblemRecipe('linearSum', { n: 10, beta: 4.75342 });
  const rare = await loadRecipe(rareRecipe);
  const rareLabel = opts.rareColumnRecipe ? 'rare-event recipe' : 'g = β − Σu/√n, n = 10, pf = 1e-6 (docs/verification.md §R1c3)';
  const f = form(rare);
  const is = await importanceSamplingAtDesignPoint(rare, f, { samples: 1_000_000, seed: SEED, targetCov: TARGET_COV });
  lines.push(`rare event, ${rareLabel}: FORM β ${f.beta.toFixed(4)} (${f.calls} calls)`);
  lines.push(`  FORM + IS to CoV ${(100 * is.cov).toFixed(1)} %: ${f.calls + is.calls} calls (IS ${is.calls}), pf ${is.pf.toExponential(3)}`);
  let spent = 0;
  for (let n = 1000; n <= 256_000; n *= 2) {
    const sub = subsetSimulation(rare, { seed: SEED, samplesPerLevel: n });
    spent += sub.calls;
    if (sub.cov <= TARGET_COV || n === 256_000) {
      lines.push(`  subset simulation to reported CoV ${(100 * sub.cov).toFixed(1)} %: ${sub.calls} calls (N = ${n} per level, ${sub.levels.length} levels; ${spent} calls in all while doubling N), pf ${sub.pf.toExponential(3)}`);
      break;
    }
  }
  if (is.pf > 0) {
    const mcCalls = (1 - is.pf) / (TARGET_COV * TARGET_COV * is.pf);
    lines.push(`  crude MC would need about ${mcCalls.toExponential(2)} calls for the same CoV`);
  }
  return lines;
}

if (process.argv[1] !== undefined && import.meta.url === pathToFileURL(process.argv[1]).href) {
  for (const line of await runReliabilityBench()) console.log(line);
}
