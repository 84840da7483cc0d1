/**
 * `npm run bench`: the speed of the mechanics and of the reliability methods, each against a
 * floor measured in the same run (ratios, because the machines are shared and noisy).
 * `npm run bench -- valid [COUNT] [SEED]` instead runs generated valid scenarios through every
 * method and study and counts results, input errors and internal errors (bench/validBench.ts).
 * `npm run bench -- measurements`: frequency solves and the posterior of a scenario with measurements.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { dirname, join } from 'node:path';
import { runMechanicsBench } from './mechanicsBench.js';
import { runReliabilityBench } from './reliabilityBench.js';
import { runSweepBench } from './sweepBench.js';
import { runValidBench } from './validBench.js';
import { runPlasticZoneBench } from './plasticZoneBench.js';
import { runKernelBench } from './kernelBench.js';
import { runMeasurementBench } from './measurementBench.js';
import { runSweepCostBench } from './sweepCostBench.js';
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
  } else if (process.argv[2] === 'valid') {
    // npm run bench -- valid [COUNT] [SEED]: generated valid scenarios through everything
    const count = Number(process.argv[3] ?? 400);
    const seed = Number(process.argv[4] ?? 1);
    console.log(`\n## valid scenarios (bench/validScenarios.ts)`);
    for (const line of await runValidBench(count, seed)) console.log(line);
    return;
  }
  if (process.argv[2] === 'measurements') {
    // `node dist/bench/run.js measurements`: frequency solves and the posterior of the demo with measurements
    console.log('\n## measurements on the structure (docs/evidence.md §7)');
    for (const line of runMeasurementBench(join(root, 'scenarios', 'measured-shed-column.yaml'))) console.log(line);
    return;
  }
  if (process.argv[2] === 'sweep-cost') {
    // `node dist/bench/run.js sweep-cost`: the 800-case FORM sweep's cost per case only
    console.log('\n## sweep cost per case');
    for (const line of await runSweepCostBench(join(root, 'scenarios', 'braced-base-plate.yaml'))) console.log(line);
    return;
  }
  if (process.argv[2] === 'plastic-zone') {
    // `node dist/bench/run.js plastic-zone`: the full model, the table build, a table read and the table's error
    console.log('\n## plastic-zone strength model (direct and through the table)');
    runPlasticZoneBench();
    return;
  }
  if (process.argv[2] === 'cost') {
    // `node dist/bench/run.js cost`: the Monte Carlo kernel (with the whole-process ratio) and the sweep cost only
    const demo = join(root, 'scenarios', 'braced-base-plate.yaml');
    console.log('\n## Monte Carlo kernel (per CPU second; numpy reference: bench/numpy_column_mc.py)');
    for (const line of await runKernelBench({ root, recipe: recipeFor('braced-base-plate.yaml'), scenario: demo })) console.log(line);
    console.log('\n## sweep cost per case');
    for (const line of await runSweepCostBench(demo)) console.log(line);
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
  console.log('\n## Monte Carlo kernel (per CPU second; numpy reference: bench/numpy_column_mc.py)');
  const demo = join(root, 'scenarios', 'braced-base-plate.yaml');
  for (const line of await runKernelBench({ root, recipe: recipeFor('braced-base-plate.yaml'), scenario: demo })) console.log(line);
  console.log('\n## sweep cost per case');
  for (const line of await runSweepCostBench(demo)) console.log(line);
  console.log('\n## reliability (column limit state: scenarios/braced-base-plate.yaml; rare event: scenarios/timber-store-post.yaml)');
  const lines = await runReliabilityBench({
    columnRecipe: recipeFor('braced-base-plate.yaml'),
    rareColumnRecipe: recipeFor('timber-store-post.yaml'),
  });
  for (const line of lines) console.log(line);
  console.log('\n## plastic-zone strength model (direct, and through the table when cached; the table build: `node dist/bench/run.js plastic-zone`)');
  runPlasticZoneBench({ points: 12, grid: false });
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
