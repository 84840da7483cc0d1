/**
 * The `assess` command as the command line shows it: options and help. The run (assessCommand.ts,
 * with the studies and the report stack) is loaded only when an assessment runs.
 */
import { Option, type Command } from 'commander';
import type { AssessCliOptions } from './assessCommand.js';
import { parseAxis, parseEnd, parseFraction, parseMethods, parseNonNegativeInteger, parseSampleCount, parseStudies, parseWorkerCount } from './optionParsers.js';
import { STUDY_NAMES } from '../studies/studyNames.js';
import { CAUTION } from './textTable.js';

/** `argv`: the arguments after the executable, echoed in the report's `command`. */
export function registerAssess(program: Command, unitsOption: () => Option, argv: string[]): void {
  program
    .command('assess')
    .description('reliability, sensitivity, restraint study and report for one scenario')
    .argument('<FILE>', 'scenario (.yaml, .yml, .json, or - for stdin)')
    .option('--json', 'print one JSON document (SI units) on stdout')
    .option('--out <DIR>', 'write the report (HTML, Markdown, JSON, CSV, charts) into the new folder DIR, whole or not at all')
    .option('--force', 'replace DIR when it is a report folder stanchion wrote (it holds .stanchion-output.json); nothing else is ever replaced')
    .addOption(new Option('--seed <N>', 'seed of every random stream (default: the scenario\'s, else 1)').argParser(parseNonNegativeInteger))
    .addOption(new Option('--methods <LIST>', 'comma-separated: form, sorm, is, mc, subset').argParser(parseMethods))
    .addOption(new Option('--studies <LIST>', `comma-separated studies to run beside the methods: ${STUDY_NAMES.join(', ')}, all or none (default: all; tornado only when --methods has neither form nor sorm)`).argParser(parseStudies))
    .option('--no-studies', 'run the reliability methods only (same as --studies none)')
    .addOption(new Option('--samples <N>', 'Monte Carlo samples (default: the scenario\'s, else 1e6)').argParser(parseSampleCount))
    .addOption(new Option('--target-cov <x>', 'stop Monte Carlo, importance sampling and subset simulation as soon as their CoV is at most x (e.g. 0.1)').argParser(parseFraction))
    .option('--thorough', 'FORM: search again from the mirror point and from both sides of every axis (default: only when the first search is in doubt)')
    .addOption(new Option('--workers <N>', 'worker threads for Monte Carlo (same numbers whatever N)').argParser(parseWorkerCount))
    .addOption(new Option('--end <end>', 'ends for the restraint study: bottom, top or both').argParser(parseEnd))
    .addOption(new Option('--axis <axis>', 'axis of the restraint study: y or z (default: the axis with the lower β)').argParser(parseAxis))
    .addOption(unitsOption())
    .addHelpText(
      'after',
      `\nExamples:\n  stanchion assess scenarios/braced-base-plate.yaml\n  stanchion assess scenarios/braced-base-plate.yaml --out reports/braced-base-plate --force\n  stanchion assess scenarios/sway-canopy-post.yaml --methods form,sorm,mc --samples 2e6 --workers 2 --json\n  stanchion assess scenarios/timber-store-post.yaml --methods form,is --no-studies --target-cov 0.1\n\nEach option by example:\n  --json                      one JSON document on stdout (SI units)\n  --out reports/c3 --force    report folder; --force replaces one stanchion wrote\n  --seed 20261201             same seed, same numbers\n  --methods form,sorm,is      any of form, sorm, is, mc, subset, given once\n  --studies tornado,restraint only these studies beside the methods (all: every one; --no-studies: none)\n  --samples 2e6               Monte Carlo samples\n  --target-cov 0.05           stop MC, IS and subset at 5 % CoV of pf\n  --thorough                  FORM: the full restart scan\n  --workers 2                 worker threads\n  --end bottom                restraint study of the base only\n  --axis z                    restraint study about z (column.axis_z.ends)\n  --units us                  kip, ft, ksi for people (JSON stays SI)\n\nExit codes: 0 done, 1 internal failure, 2 bad input or usage, 130 interrupted (Ctrl-C).\n\n${CAUTION}\n`,
    )
    .action(async (file: string, opts: AssessCliOptions) => (await import('./assessCommand.js')).runAssess(file, opts, argv));
}
