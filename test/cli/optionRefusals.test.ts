import { describe, expect, it } from 'vitest';
import { Command, Option } from 'commander';
import { findRepeatedOption } from '../../src/cli/repeatedOptions.js';
import { didYouMean, nearestName } from '../../src/scenario/nearestName.js';
import { runCliProcess as runCli } from './runCli.js'; // a real process: these read its exit code and streams whole

function toyProgram(): Command {
  const program = new Command();
  program
    .command('assess')
    .argument('<FILE>')
    .option('--seed <n>')
    .option('--methods <list>')
    .option('--json')
    .addOption(new Option('--vary <spec>').argParser((v: string, prev: string[] = []) => [...prev, v]));
  return program;
}

describe('repeated single-valued options', () => {
  const program = toyProgram();
  it.each([
    [['assess', 'f.yaml', '--seed', '1', '--seed', '2'], '--seed'],
    [['assess', '--seed=1', 'f.yaml', '--seed', '2'], '--seed'],
    [['assess', 'f.yaml', '--methods', 'form', '--methods', 'mc'], '--methods'],
    [['assess', 'f.yaml', '--json', '--json'], '--json'],
  ])('%j repeats %s', (args, name) => {
    expect(findRepeatedOption(program, args)).toBe(name);
  });
  it.each([
    [['assess', 'f.yaml', '--vary', 'a=1,2', '--vary', 'b=3,4']], // made to repeat
    [['assess', 'f.yaml', '--seed', '1', '--methods', 'form,mc']],
    [['assess', 'f.yaml', '--methods', '--seed']], // the value of --methods, not a second option
    [['assess', 'f.yaml', '--', '--seed', '--seed']], // after --, nothing is an option
    [['--seed', '1']], // no command
  ])('%j repeats nothing', (args) => {
    expect(findRepeatedOption(program, args)).toBeUndefined();
  });

  it('the CLI refuses a repeated option with exit 2, naming it', () => {
    const r = runCli(['check', 'scenarios/braced-base-plate.yaml', '--units', 'us', '--units', 'si']);
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr.trim()).toBe('stanchion: --units: given more than once: give it once');
  });
});

describe('each option has its own example', () => {
  it('--workers 0 is told about workers, not samples', () => {
    const r = runCli(['assess', 'scenarios/braced-base-plate.yaml', '--workers', '0']);
    expect(r.status).toBe(2);
    expect(r.stderr).toContain('(e.g. 2)');
    expect(r.stderr).not.toContain('1e6');
  });
  it('every option of assess, restraint and sweep appears in a help example', () => {
    for (const command of ['assess', 'restraint', 'sweep']) {
      const r = runCli([command, '--help']);
      const [options, after] = r.stdout.split(/Examples:/);
      const flags = [...options!.matchAll(/^\s+(?:-\w, )?(--[a-z-]+)/gm)].map((m) => m[1]!).filter((f) => f !== '--help');
      expect(flags.length, command).toBeGreaterThan(2);
      for (const flag of flags) expect(after, `${command} ${flag}`).toContain(`${flag} `);
    }
  });
});

describe('words of the trade get the right suggestion', () => {
  it.each([
    ['unbraced', ['braced', 'sway'], 'sway'],
    ['Unbraced', ['braced', 'sway'], 'sway'],
    ['non-sway', ['braced', 'sway'], 'braced'],
    ['non sway', ['braced', 'sway'], 'braced'],
    ['sidesway', ['braced', 'sway'], 'sway'],
    ['clamped', ['pinned', 'fixed'], 'fixed'],
    ['hinged', ['pinned', 'fixed'], 'pinned'],
    ['semi-rigid', ['rotation', 'fixity', 'alignment_g'], 'rotation'],
    ['brased', ['braced', 'sway'], 'braced'], // a plain typo still goes by spelling
  ])('%s → %s', (word, candidates, expected) => {
    expect(nearestName(word, candidates)).toBe(expected);
  });
  it('a synonym is offered only among the candidates', () => {
    expect(didYouMean('unbraced', ['grid', 'lhs'])).toBe('');
  });
  it('the scenario and the new command say sway for unbraced', () => {
    const check = runCli(['check', '-'], 'stanchion: 1\ncolumn:\n  frame: unbraced\n');
    expect(check.status).toBe(2);
    expect(check.stderr).toContain("did you mean 'sway'?");
    const created = runCli(['new', '--frame', 'unbraced']);
    expect(created.status).toBe(2);
    expect(created.stderr).toContain("did you mean 'sway'?");
  });
});
