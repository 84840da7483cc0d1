/**
 * What one case of a FORM sweep costs in one process: an 800-case grid over the demo column
 * (base stiffness mean × dead load mean), methods [form], run in this thread through runSweep
 * with its journal on the temporary folder's disk (its fsyncs included). Wall and CPU
 * milliseconds and limit-state calls (FORM and its self-check) per case.
 */
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { columnCaseRunner } from '../src/studies/columnCaseRunner.js';
import { runSweep } from '../src/studies/runSweep.js';
import { buildCaseTable } from '../src/studies/sweepDesign.js';
import { parseVaryOption } from '../src/studies/varyOption.js';
import { evaluationsSoFar } from '../src/limitState/evaluationCount.js';

export async function runSweepCostBench(scenarioPath: string, cases = 800): Promise<string[]> {
  const side = Math.round(Math.sqrt(cases / 2));
  const table = buildCaseTable({
    design: 'grid',
    seed: 1,
    vary: [parseVaryOption(`column.ends.bottom.rotation.mean=log:0.2 MN m/rad:20 MN m/rad:${2 * side}`), parseVaryOption(`loads.dead.mean=300 kN:500 kN:${side}`)],
  });
  const runner = columnCaseRunner({ scenarioText: readFileSync(scenarioPath, 'utf8'), fileName: scenarioPath, methods: ['form'] });
  const dir = mkdtempSync(join(tmpdir(), 'stanchion-sweep-cost-'));
  try {
    const warm = buildCaseTable({ design: 'grid', seed: 1, vary: [parseVaryOption('loads.dead.mean=300 kN:500 kN:20')] });
    await runSweep({ table: warm, runCase: runner, stateDir: join(dir, 'warm') });
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    const e0 = evaluationsSoFar();
    const r = await runSweep({ table, runCase: runner, stateDir: join(dir, 'run') });
    const calls = evaluationsSoFar() - e0;
    const wall = performance.now() - t0;
    const c = process.cpuUsage(c0);
    const cpu = (c.user + c.system) / 1000;
    return [`FORM sweep, ${r.ran} cases of the demo column, 1 thread: ${(wall / r.ran).toFixed(2)} ms per case (CPU ${(cpu / r.ran).toFixed(2)} ms per case, journal fsyncs included); ${(calls / r.ran).toFixed(0)} limit-state calls per case`];
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
