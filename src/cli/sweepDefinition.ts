/**
 * The `sweep` and `merge` commands as the command line shows them: options, help and limits.
 * Nothing heavy is imported here: the run itself (sweepCommand.ts) is loaded when a sweep runs,
 * so `stanchion --help` stays quick.
 */
import { InvalidArgumentError, Option, type Command } from 'commander';
import { MAX_SWEEP_CASES } from '../studies/sweepDesign.js';
import type { MergeOptions, SweepOptions } from './sweepCommand.js';
import { parseCaseCount, parseMethods, parseNonNegativeInteger, parseSampleCount, parseShard, parseWorkerCount } from './optionParsers.js';
import { isAutoShard } from '../studies/schedulerShard.js';
import { CAUTION } from './textTable.js';

/** --json lists the results inline up to this many cases; beyond, they are in sweep.json only. */
export const INLINE_RESULTS_LIMIT = 10_000;
/** The report lists and charts every case: beyond this many it is not written. */
export const REPORT_CASES_LIMIT = 5_000;

function collect(value: string, previous: string[] | undefined): string[] {
  return [...(previous ?? []), value];
}

function parseDesign(value: string): 'grid' | 'lhs' {
  if (value !== 'grid' && value !== 'lhs') throw new InvalidArgumentError("expected 'grid' or 'lhs'.");
  return value;
}

export function registerSweep(program: Command, unitsOption: () => Option): void {
  program
    .command('sweep')
    .description('run a scenario over a grid or Latin hypercube of inputs; results to CSV and JSON (resumable)')
    .argument('<FILE>', 'a scenario (with --vary) or a sweep file (scenario: + vary: or list:)')
    .option('--vary <PATH=FROM:TO:STEPS>', 'vary one input (repeatable); also log:FROM:TO:STEPS, FROM:TO (lhs) or A,B,C', collect)
    .addOption(new Option('--design <design>', 'grid (every combination) or lhs (Latin hypercube)').argParser(parseDesign))
    .addOption(new Option('--cases <n>', 'number of cases of a Latin hypercube').argParser(parseCaseCount))
    .addOption(new Option('--methods <list>', 'comma-separated: form, sorm, is, mc, subset (default form)').argParser(parseMethods))
    .addOption(new Option('--seed <n>', 'sweep seed; each case derives its own (default: the file\'s, else 1)').argParser(parseNonNegativeInteger))
    .addOption(new Option('--samples <n>', 'Monte Carlo samples per case (default: the scenario\'s mc_samples, else 100000)').argParser(parseSampleCount))
    .addOption(new Option('--workers <n>', 'worker threads (at most the cores available; more are capped)').argParser(parseWorkerCount).default(1))
    .addOption(
      new Option('--shard <I/N>', 'run only the cases with index % N == I; join shards with `stanchion merge`. auto: I and N from a job array (Slurm, Grid Engine); auto/N: I from PBS, Torque or LSF')
        .argParser((v: string) => (isAutoShard(v) ? v.trim() : parseShard(v))),
    )
    .addOption(new Option('--emit-array-script <N>', 'print a Slurm job-array script that runs the sweep as N shards, then the merge; runs nothing').argParser(parseCaseCount))
    .option('--state <dir>', 'journal folder for resuming (default OUT/.state)')
    .option('--out <dir>', 'output folder (default sweep-out/<FILE name>)')
    .option('--force', 'discard the journal or results of a different sweep found in the same folders')
    .option('--json', 'print one JSON document on stdout')
    .addOption(unitsOption())
    .addHelpText(
      'after',
      [
        '',
        'Writes OUT/sweep.csv, OUT/sweep.json and, when every case is done, OUT/report/ (report.html,',
        'summary.md, result.json, CSV tables and charts of the base scenario and the sweep).',
        'OUT/report/ is replaced only when stanchion wrote it (it holds .stanchion-output.json);',
        'anything else there stops the sweep before any case runs.',
        '',
        'Examples:',
        '  stanchion sweep scenarios/braced-base-plate.yaml --vary "column.ends.bottom.rotation.mean=log:0.2 MN m/rad:20 MN m/rad:9"',
        '  stanchion sweep scenarios/braced-base-plate.yaml --vary "column.length=4 m:7 m:7" --vary "loads.dead.mean=300 kN:400 kN:5"',
        '  stanchion sweep scenarios/sweep-base-stiffness.yaml --workers 2',
        '  stanchion sweep scenarios/sweep-base-stiffness.yaml --shard 0/2 --state st   (and 1/2 elsewhere, then: stanchion merge st --out res)',
        '  stanchion sweep scenarios/sweep-base-stiffness.yaml --emit-array-script 16 > sweep-array.sh && bash sweep-array.sh   (Slurm)',
        '',
        'Each option by example:',
        '  --vary "loads.dead.mean=300 kN:500 kN:5"   repeat for a second axis; log:FROM:TO:STEPS, FROM:TO, A,B,C',
        '  --design lhs --cases 200                   Latin hypercube of 200 cases (default grid)',
        '  --methods form,mc                          given once, as one list',
        '  --seed 7                                   sweep seed',
        '  --samples 1e5                              Monte Carlo samples per case',
        '  --workers 2                                worker threads',
        '  --shard 0/2                                first of two shards; --shard auto inside a job array',
        '  --emit-array-script 16                     print a Slurm job-array script for 16 shards and the merge',
        '  --state st  --out res  --force             journal folder, output folder, replace another sweep',
        '  --json  --units us                         JSON on stdout; kip, ft, ksi for people',
        '',
        'PATH is a scenario path (column.length, loads.dead) or a parameter of a random variable',
        '(column.ends.bottom.rotation.mean, loads.imposed.cov). Run the same command again to resume.',
        '',
        `Limits: at most ${MAX_SWEEP_CASES.toExponential(0)} cases (the journal, sweep.csv and sweep.json take a few`,
        `hundred bytes per case each), a Latin hypercube at most 1e+6; the report only up to ${REPORT_CASES_LIMIT} cases,`,
        `--json lists results inline up to ${INLINE_RESULTS_LIMIT} cases. Every value is checked before anything is`,
        'written; a journal line that is damaged or not a case of this sweep is refused (exit 2, with its line).',
        '',
        CAUTION,
        '',
      ].join('\n'),
    )
    .action(async (file: string, opts: SweepOptions) => (await import('./sweepCommand.js')).runSweepCommand(file, opts));

  program
    .command('merge')
    .description('join the journals of sweep shards into the sweep.csv and sweep.json a single run writes')
    .argument('<STATE_DIR...>', 'state folders (or journal files) of the shards')
    .requiredOption('--out <dir>', 'output folder')
    .option('--force', 'replace results of a different sweep in --out')
    .option('--json', 'print one JSON document on stdout')
    .addHelpText('after', `\nExample:\n  stanchion merge shard0/.state shard1/.state --out sweep-out/all\n\n${CAUTION}\n`)
    .action(async (paths: string[], opts: MergeOptions) => (await import('./sweepCommand.js')).runMergeCommand(paths, opts));
}
