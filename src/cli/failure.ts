import { InputError } from '../scenario/inputError.js';
import { boundEchoes } from '../scenario/shortenEcho.js';

/** Exit codes of docs/json-output.md. */
export const EXIT_OK = 0;
export const EXIT_INTERNAL = 1;
export const EXIT_INPUT = 2;
/** Ctrl-C: the shell's convention, 128 + SIGINT. */
export const EXIT_INTERRUPTED = 130;

/** Anything a user can fix: scenario fields, options, the --out folder, a bad distribution. */
export function isUserError(err: unknown): err is Error & { field?: string } {
  if (err instanceof InputError) return true;
  const name = (err as { name?: string } | null)?.name;
  return name === 'DistributionError' || name === 'CommanderError';
}

/** One line on stderr for a person; the stack only when STANCHION_DEBUG is set. */
export function reportFailure(err: unknown): number {
  if ((err as { name?: string } | null)?.name === 'InterruptedError') {
    process.stderr.write(`stanchion: ${(err as Error).message}\n`);
    return EXIT_INTERRUPTED;
  }
  if (err instanceof InputError) {
    process.stderr.write(`stanchion: ${err.describe()}\n`);
    return EXIT_INPUT;
  }
  if (isUserError(err)) {
    process.stderr.write(`stanchion: ${boundEchoes((err as Error).message)}\n`);
    return EXIT_INPUT;
  }
  const message = err instanceof Error ? err.message : String(err);
  process.stderr.write(`stanchion: internal error: ${boundEchoes(message)}\n`);
  if (process.env.STANCHION_DEBUG && err instanceof Error && err.stack) process.stderr.write(`${err.stack}\n`);
  return EXIT_INTERNAL;
}
