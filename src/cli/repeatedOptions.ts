/**
 * An option that takes one value, given twice (`--seed 1 ... --seed 2`), would silently keep
 * the last one: the first was probably meant. It is refused before anything runs. Only the
 * options made to collect several values (`--vary`) may repeat; a list option such as
 * `--methods form,mc` takes its whole list once.
 */
import type { Command, Option } from 'commander';
import { InputError } from '../scenario/inputError.js';

/** Options that collect one value per use. */
const REPEATABLE = new Set(['--vary']);

function takesValue(option: Option): boolean {
  return option.required || option.optional;
}

/** The option (as `--name`) given more than once in `args` (argv without node and script), if any. */
export function findRepeatedOption(program: Command, args: readonly string[]): string | undefined {
  const commandAt = args.findIndex((a) => !a.startsWith('-'));
  if (commandAt < 0) return undefined;
  const command = program.commands.find((c) => c.name() === args[commandAt] || c.aliases().includes(args[commandAt]!));
  if (command === undefined) return undefined;
  const seen = new Set<string>();
  for (let i = commandAt + 1; i < args.length; i++) {
    const token = args[i]!;
    if (token === '--') break;
    if (!token.startsWith('-') || token === '-') continue;
    const flag = token.split('=')[0]!;
    const option = command.options.find((o) => o.long === flag || o.short === flag);
    if (option === undefined) continue; // commander reports unknown options itself
    const name = option.long ?? flag;
    if (!REPEATABLE.has(name) && !option.variadic) {
      if (seen.has(option.attributeName())) return name;
      seen.add(option.attributeName());
    }
    if (takesValue(option) && !token.includes('=')) i++; // skip its value, even one starting with '-'
  }
  return undefined;
}

/** Throws the user's error for a repeated single-valued option. */
export function refuseRepeatedOptions(program: Command, args: readonly string[]): void {
  const name = findRepeatedOption(program, args);
  if (name === undefined) return;
  const hint = name === '--methods' ? ' (list several methods in one: --methods form,sorm,mc)' : '';
  throw new InputError(name, `given more than once: give it once${hint}`);
}
