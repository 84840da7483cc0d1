/**
 * `npm run bench`: the speed of the mechanics and of the reliability methods, each against a
 * floor measured in the same run (ratios, because the machines are shared and noisy).
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { dirname, join } from 'node:path';
import { runMechanicsBench } from './mechanicsBench.js';
import { runReliabilityBench } from './reliabilityBench.js';
import { runSweepBench } from './sweepBench.js';
import { runFormCallsBench, runStartupBench } from './startupBench.js';
import { loadRecipe } from '../src/reliability/loadRecipe.js';
import { columnRecipe } from '../src/limitState/columnRecipe.js';
import { loadScenario } from '../src/scenario/loadScenario.js';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');

function recipeFor(file: string) {
  const path = join(root, 'scenarios', file);
  return columnRecipe(loadScenario(readFileSync(path, 'utf8'), path));
}

async function main(): Promise<void> {
  console.log(`stanchion bench — node ${process.version}, ${new Date().toISOString()}`);
  if (process.argv[2] === 'sweep') {
    // `node dist/bench/run.js sweep [CASES]`: memory of a large sweep only (default 1e6 cases)
    console.log('\n## sweep memory (synthetic cases, grid)');
    for (const line of await runSweepBench(Number(process.argv[3] ?? 1_000_000))) console.log(line);
    return;
  }
  console.log('\n## start-up (wall time, against node -e 0 in the same run)');
  for (const line of runStartupBench(root, join(root, 'scenarios', 'braced-base-plate.yaml'))) console.log(line);
  console.log('\n## FORM calls');
  for (const file of ['braced-base-plate.yaml', 'timber-store-post.yaml']) {
    for (const line of runFormCallsBench(await loadRecipe(recipeFor(file)), `scenarios/${file}`)) console.log(line);
  }
  if (process.argv[2] === 'startup') return;
  console.log('\n## mechanics (critical-load solves per second)');
  for (const line of await runMechanicsBench()) console.log(line);
  console.log('\n## reliability (column limit state: scenarios/braced-base-plate.yaml; rare event: scenarios/timber-store-post.yaml)');
  const lines = await runReliabilityBench({
    columnRecipe: recipeFor('braced-base-plate.yaml'),
    rareColumnRecipe: recipeFor('timber-store-post.yaml'),
  });
  for (const line of lines) console.log(line);
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
