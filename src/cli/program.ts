/**
 * stanchion's command line: parse options, call a study, write outputs. One file per command.
 * Runs in the command thread (commandWorker.ts); main.ts only starts it and listens for Ctrl-C,
 * and answers --help and --version itself through this file (no thread needed).
 *
 * Start-up: this file and the *Definition.ts files import only commander and small helpers;
 * each command's run (scenario reader, studies, report stack) is imported when it runs.
 * A fresh Command per run, so one process can run several command lines (the tests do).
 */
import { Command, CommanderError, Option } from 'commander';
import { toolVersion } from './version.js';
import { EXIT_INPUT, EXIT_OK, reportFailure } from './failure.js';
import { parseAxis, parseDesignAlpha, parseEnd, parseNonNegativeInteger, parseOutcomeCount, parseRestraintMethod, parseUnits } from './optionParsers.js';
import { refuseRepeatedOptions } from './repeatedOptions.js';
import type { CheckOptions } from './checkCommand.js';
import type { RestraintOptions } from './restraintCommand.js';
import type { PlanTestsOptions } from './planTestsCommand.js';
import { registerSweep } from './sweepDefinition.js';
import { registerNew } from './newCommand.js';
import { registerAssess } from './assessDefinition.js';
import { CAUTION } from './textTable.js';
import { boundLines } from '../scenario/shortenEcho.js';

/** The whole command line; `argv` is node, script, args... (the args are echoed in reports). */
export function buildProgram(argv: string[]): Command {
  const program = new Command();

  program
    .name('stanchion')
    .description(
      'Reliability of an existing column whose end connections are neither pinned nor fixed: ' +
        'failure probability, reliability index, what drives it, and the end restraint the verdict relies on.',
    )
    .version(toolVersion(), '-V, --version')
    .exitOverride()
    .configureOutput({ writeErr: (s) => process.stderr.write(boundLines(s)) })
    .addHelpText('after', `\n${CAUTION}\n`);

  const unitsOption = () =>
    new Option('--units <system>', 'display units for people: si (kN, m, MPa) or us (kip, ft, ksi)').argParser(parseUnits);

  program
    .command('check')
    .description('deterministic check with every random variable at its mean')
    .argument('<FILE>', 'scenario (.yaml, .yml, .json, or - for stdin)')
    .option('--json', 'print one JSON document (SI units) on stdout')
    .addOption(unitsOption())
    .addHelpText(
      'after',
      `\nExamples:\n  stanchion check scenarios/braced-base-plate.yaml\n  stanchion check scenarios/sway-canopy-post.yaml --json\n  stanchion new | stanchion check -\n\nEach option by example:\n  --json      one JSON document on stdout (SI units)\n  --units us  kip, ft, ksi for people\n\n${CAUTION}\n`,
    )
    .action(async (file: string, opts: CheckOptions) => (await import('./checkCommand.js')).runCheck(file, opts));

  registerAssess(program, unitsOption, argv.slice(2));

  program
    .command('restraint')
    .description('how much end restraint the target reliability needs (the connection stiffness at which β reaches the target, confirmed with the governing method)')
    .argument('<FILE>', 'scenario (.yaml, .yml, .json, or - for stdin)')
    .option('--json', 'print one JSON document (SI units) on stdout')
    .addOption(new Option('--end <end>', 'which connection to study: bottom, top or both (default: the ends given as springs)').argParser(parseEnd))
    .addOption(new Option('--axis <axis>', 'the principal axis whose connections are studied: y or z (default: the axis with the lower β; a column without column.axis_z has only y)').argParser(parseAxis))
    .addOption(new Option('--method <method>', 'what solves for the requirement: form, sorm or is (default: FORM, or importance sampling where FORM disagrees with its sampling check)').argParser(parseRestraintMethod))
    .addOption(new Option('--design-alpha <alpha>', "α of the design stiffness (EN 1990 Annex C): form (FORM's own α, default) or standard (0.8 leading, 0.4 × 0.8 otherwise)").argParser(parseDesignAlpha))
    .option('--out <DIR>', 'also write the report (HTML, Markdown, JSON, CSV, charts) into the new folder DIR, whole or not at all')
    .option('--force', 'replace DIR when it is a report folder stanchion wrote (it holds .stanchion-output.json); nothing else is ever replaced')
    .addOption(unitsOption())
    .addHelpText(
      'after',
      `\nExamples:\n  stanchion restraint scenarios/braced-base-plate.yaml\n  stanchion restraint scenarios/sway-canopy-post.yaml --end bottom --json\n  stanchion restraint scenarios/braced-base-plate.yaml --out reports/c3-restraint\n\nEach option by example:\n  --json                            one JSON document on stdout (SI units)\n  --end top                         study the top connection only (bottom, top or both)\n  --axis z                          study the connections about z (column.axis_z.ends)\n  --method is                       solve the requirement with importance sampling (form, sorm or is)\n  --design-alpha standard           design stiffness with the standard α = 0.8 / 0.4 × 0.8 (or form)\n  --out reports/c3-restraint --force  report folder; --force replaces one stanchion wrote\n  --units us                        kip·in/rad, ft, ksi for people\n\n${CAUTION}\n`,
    )
    .action(async (file: string, opts: RestraintOptions) => (await import('./restraintCommand.js')).runRestraint(file, opts));

  program
    .command('plan-tests')
    .description('which test on the structure buys most: rank candidate tests by the reliability index the assessment would have after them (pre-posterior analysis)')
    .argument('<FILE>', 'scenario (.yaml, .yml, .json, or - for stdin)')
    .option('--json', 'print one JSON document on stdout')
    .addOption(new Option('--seed <N>', 'seed of the simulated test outcomes (default: analysis.seed, else 20261201)').argParser(parseNonNegativeInteger))
    .addOption(new Option('--outcomes <N>', 'simulated outcomes per plan, 10 to 2000 (default 40)').argParser(parseOutcomeCount))
    .addOption(unitsOption())
    .addHelpText(
      'after',
      `\nPlans come from the scenario's test_plans: list ({variable, tests, tested, measurement_cov}); without one,\n1, 3 and 5 tests on each of the three most important variables that can be tested.\n\nExamples:\n  stanchion plan-tests scenarios/tested-base-plate.yaml\n  stanchion plan-tests scenarios/tested-base-plate.yaml --outcomes 100 --json\n\nEach option by example:\n  --json          one JSON document on stdout\n  --seed 7        another set of simulated outcomes\n  --outcomes 100  more outcomes per plan (finer probabilities, longer run)\n\n${CAUTION}\n`,
    )
    .action(async (file: string, opts: PlanTestsOptions) => (await import('./planTestsCommand.js')).runPlanTests(file, opts));

  registerSweep(program, unitsOption);
  registerNew(program);
  return program;
}

/** Run the command line `argv` (node, script, args...) and return the exit code. */
export async function runProgram(argv: string[]): Promise<number> {
  try {
    const program = buildProgram(argv);
    refuseRepeatedOptions(program, argv.slice(2));
    await program.parseAsync(argv);
    return EXIT_OK;
  } catch (err) {
    if (err instanceof CommanderError) {
      // --help and --version end through here with exit code 0; usage errors were already printed.
      return err.exitCode === 0 ? EXIT_OK : EXIT_INPUT;
    }
    return reportFailure(err);
  }
}
