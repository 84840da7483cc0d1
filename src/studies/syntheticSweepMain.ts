/**
 * A small command-line sweep on the synthetic case runner, used to test killing and
 * resuming a sweep as a real process:
 *   node dist/src/studies/syntheticSweepMain.js --sweep FILE --state DIR [--csv F] [--json F]
 *        [--workers N] [--shard I/N] [--sleep MS]
 * Prints one JSON summary line on stdout.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';
import { mergeSweep } from './mergeSweep.js';
import { runSweep } from './runSweep.js';
import { buildCaseTable } from './sweepDesign.js';
import { parseSweepFile } from './sweepFile.js';
import { writeSweepOutputs } from './sweepOutput.js';
import { parseShardOption } from './varyOption.js';

const { values } = parseArgs({
  options: {
    sweep: { type: 'string' },
    state: { type: 'string' },
    csv: { type: 'string' },
    json: { type: 'string' },
    workers: { type: 'string', default: '1' },
    shard: { type: 'string', default: '0/1' },
    sleep: { type: 'string', default: '0' },
  },
});
if (!values.sweep || !values.state) throw new Error('--sweep and --state are required');
const table = buildCaseTable(parseSweepFile(readFileSync(values.sweep, 'utf8'), values.sweep));
const summary = await runSweep({
  table,
  runCase: {
    module: fileURLToPath(new URL('./syntheticCaseRunner.js', import.meta.url)),
    exportName: 'syntheticCaseRunner',
    args: { sleepMs: Number(values.sleep) },
  },
  workers: Number(values.workers),
  workerStartRepaidMs: 0, // its cases are tiny: without this the workers the tests ask for would never start
  stateDir: values.state,
  shard: parseShardOption(values.shard),
});
writeSweepOutputs(mergeSweep(summary.journal), { csv: values.csv, json: values.json });
process.stdout.write(`${JSON.stringify(summary)}\n`);
