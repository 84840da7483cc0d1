/**
 * `stanchion new [--frame braced|sway] [FILE]`: the commented starter scenario, on stdout
 * (so `stanchion new | stanchion check -` works) or into FILE. A file is written whole or
 * not at all (temporary file, then a hard link that fails if FILE exists), and an existing
 * FILE is kept unless --force.
 */
import { didYouMean } from '../scenario/nearestName.js';
import { closeSync, existsSync, fsyncSync, linkSync, openSync, renameSync, statSync, unlinkSync, writeSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { Command, InvalidArgumentError, Option } from 'commander';
import { InputError } from '../scenario/inputError.js';
import { starterScenario } from '../scenario/starterScenario.js';
import type { Frame } from '../scenario/types.js';

export interface NewOptions {
  frame?: Frame;
  force?: boolean;
}

function parseFrame(value: string): Frame {
  if (value !== 'braced' && value !== 'sway') throw new InvalidArgumentError(`expected 'braced' or 'sway'${didYouMean(value, ['braced', 'sway'])}.`);
  return value;
}

function writeTemp(file: string, text: string): string {
  const temp = join(dirname(file), `.${basename(file)}.${process.pid}.tmp`);
  const fd = openSync(temp, 'w');
  try {
    writeSync(fd, text);
    fsyncSync(fd);
  } finally {
    closeSync(fd);
  }
  return temp;
}

/** Write `text` to `file` atomically; without `force` an existing file is an InputError. */
export function writeNewFile(file: string, text: string, force: boolean): void {
  if (!/\.ya?ml$/i.test(file)) throw new InputError('FILE', `the starter scenario is YAML: name it .yaml or .yml, got ${file}`);
  const dir = dirname(file);
  if (!existsSync(dir) || !statSync(dir).isDirectory()) throw new InputError('FILE', `folder ${dir} does not exist`);
  if (existsSync(file) && !force) throw new InputError('FILE', `${file} already exists; use --force to replace it`);
  const temp = writeTemp(file, text);
  try {
    if (force) {
      renameSync(temp, file);
      return;
    }
    linkSync(temp, file); // fails if someone created FILE meanwhile
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code === 'EEXIST') throw new InputError('FILE', `${file} already exists; use --force to replace it`);
    throw err;
  } finally {
    if (existsSync(temp)) unlinkSync(temp);
  }
}

export function runNew(file: string | undefined, opts: NewOptions): void {
  const frame = opts.frame ?? 'braced';
  const text = starterScenario(frame);
  if (file === undefined || file === '-') {
    process.stdout.write(text);
    return;
  }
  writeNewFile(file, text, opts.force === true);
  process.stdout.write(`wrote ${file} (a starter scenario, ${frame} frame; every number in it is invented)\n`);
  process.stdout.write(`next: edit it, then run  stanchion check ${file}\n`);
}

export function registerNew(program: Command): void {
  program
    .command('new')
    .description('print a commented starter scenario to edit (or write it to FILE)')
    .argument('[FILE]', 'write here (.yaml) instead of stdout')
    .addOption(new Option('--frame <frame>', 'braced (ends do not sway) or sway').argParser(parseFrame))
    .option('--force', 'replace FILE if it exists')
    .addHelpText(
      'after',
      '\nExamples:\n  stanchion new > column.yaml\n  stanchion new --frame sway canopy-post.yaml\n  stanchion new | stanchion check -\n  stanchion new column.yaml --force   (replace column.yaml)\n',
    )
    .action((file: string | undefined, opts: NewOptions) => runNew(file, opts));
}
