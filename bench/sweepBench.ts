/**
 * Memory of a large sweep: a grid of `cases` synthetic cases (cheap, seeded) run in this
 * thread through runSweep, then sweep.csv and sweep.json assembled from the journal. Prints
 * the resident set size after 10 % of the cases and at the end of the run, and the peak
 * (process.resourceUsage().maxRSS) after the outputs: flat memory means cases and rows are
 * streamed, not held. The journal goes to /dev/shm when there is one (fsync there costs
 * nothing: this measures memory, not the disk).
 */
import { existsSync, mkdtempSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { mergeSweep } from '../src/studies/mergeSweep.js';
import { runSweep } from '../src/studies/runSweep.js';
import { buildCaseTable } from '../src/studies/sweepDesign.js';
import { writeSweepOutputs } from '../src/studies/sweepOutput.js';
import { syntheticCaseRunner } from '../src/studies/syntheticCaseRunner.js';
import { parseVaryOption } from '../src/studies/varyOption.js';

const MB = 1024 * 1024;
const mb = (bytes: number): string => `${(bytes / MB).toFixed(0)} MB`;

export async function runSweepBench(cases = 1_000_000): Promise<string[]> {
  const side = Math.round(Math.sqrt(cases));
  const table = buildCaseTable({ design: 'grid', seed: 7, vary: [parseVaryOption(`a=0:1:${side}`), parseVaryOption(`b=1 kN:2 kN:${side}`)] });
  const base = existsSync('/dev/shm') ? '/dev/shm' : tmpdir();
  const dir = mkdtempSync(join(base, 'stanchion-sweep-bench-'));
  const lines: string[] = [];
  try {
    const rss: Record<string, number> = { start: process.memoryUsage().rss };
    const tenth = Math.floor(table.count / 10);
    const started = performance.now();
    const run = await runSweep({
      table,
      runCase: syntheticCaseRunner({ sleepMs: 0, draws: 8 }),
      stateDir: join(dir, 'state'),
      onCaseDone: (_r, finished) => {
        if (finished === tenth) rss.tenth = process.memoryUsage().rss;
      },
    });
    rss.ran = process.memoryUsage().rss;
    const ranSeconds = (performance.now() - started) / 1000;
    const t0 = performance.now();
    writeSweepOutputs(mergeSweep(run.journal), { csv: join(dir, 'sweep.csv'), json: join(dir, 'sweep.json') });
    const writeSeconds = (performance.now() - t0) / 1000;
    rss.written = process.memoryUsage().rss;
    const peak = process.resourceUsage().maxRSS * 1024;
    lines.push(`  ${table.count} synthetic cases in ${ranSeconds.toFixed(1)} s (journal in ${base}); outputs in ${writeSeconds.toFixed(1)} s`);
    lines.push(`  journal ${mb(statSync(run.journal).size)}, sweep.csv ${mb(statSync(join(dir, 'sweep.csv')).size)}, sweep.json ${mb(statSync(join(dir, 'sweep.json')).size)}`);
    lines.push(`  RSS: start ${mb(rss.start)}, after ${tenth} cases ${mb(rss.tenth)}, after ${table.count} cases ${mb(rss.ran)}, after writing the outputs ${mb(rss.written)}`);
    lines.push(`  peak RSS (maxRSS) ${mb(peak)}`);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
  return lines;
}
