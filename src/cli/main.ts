#!/usr/bin/env node
/**
 * The stanchion executable. A signal handler runs only when its thread returns to the event
 * loop, and a FORM search, a Sobol study or a report rendering keeps its thread busy for
 * minutes; so the command runs in a worker thread (commandWorker.ts) and this thread keeps only
 * the Ctrl-C handler. It imports nothing heavy, so start-up stays short.
 *
 * First Ctrl-C: set the shared flag; every long loop stops at its next check, removes what it
 * had started writing and ends with exit code 130. If the command thread has not ended after
 * GRACE_MS, or on a second Ctrl-C, it is stopped here, the temporaries it noted are removed
 * and the process exits with 130 at once.
 */
import { rmSync } from 'node:fs';
import { Worker } from 'node:worker_threads';
import { createInterruptFlag, requestInterrupt, useInterruptFlag } from '../runtime/interruptFlag.js';
import { createTemporaryRegistry, heldTemporaries } from '../runtime/temporaryPaths.js';
import type { CommandWorkerData } from './commandWorker.js';

const EXIT_INTERNAL = 1;
const EXIT_INTERRUPTED = 130;
/** Time the command thread has to stop by itself; the whole stop stays under a second. */
const GRACE_MS = 700;
/** How long to wait for the thread to die before removing its temporaries anyway. */
const TERMINATE_WAIT_MS = 200;

// `stanchion ... | head` closes the pipe early: that is the reader's choice, not a failure.
for (const stream of [process.stdout, process.stderr]) {
  stream.on('error', (err: NodeJS.ErrnoException) => {
    if (err.code === 'EPIPE') process.exit(0);
    throw err;
  });
}

/**
 * --help and --version print a page and stop: answered here, without starting the command
 * thread (program.ts imports only commander and small helpers). Only flags before a `--`
 * count; a command that runs always runs in the thread.
 */
function onlyPrints(args: readonly string[]): boolean {
  const end = args.indexOf('--');
  const flags = end < 0 ? args : args.slice(0, end);
  return args[0] === 'help' || flags.some((a) => a === '-h' || a === '--help' || a === '-V' || a === '--version');
}

if (onlyPrints(process.argv.slice(2))) {
  const { runProgram } = await import('./program.js');
  process.exitCode = await runProgram(process.argv);
} else {
  startCommandThread();
}

function startCommandThread(): void {
  const interruptFlag = createInterruptFlag();
  useInterruptFlag(interruptFlag);
  const temporaries = createTemporaryRegistry();
  const workerData: CommandWorkerData = {
    interruptFlag,
    temporaries,
    stdoutIsTTY: Boolean(process.stdout.isTTY),
    stderrIsTTY: Boolean(process.stderr.isTTY),
  };
  const worker = new Worker(new URL('./commandWorker.js', import.meta.url), { argv: process.argv.slice(2), workerData });

  let reportedCode: number | undefined;
  let grace: NodeJS.Timeout | undefined;
  let stopping = false;

  async function stopNow(): Promise<void> {
    if (stopping) return;
    stopping = true;
    await Promise.race([worker.terminate(), new Promise((resolve) => setTimeout(resolve, TERMINATE_WAIT_MS))]);
    for (const path of heldTemporaries(temporaries)) rmSync(path, { recursive: true, force: true });
    // the command may already have said why it stopped; then one line is enough
    if (reportedCode === undefined) process.stderr.write('stanchion: interrupted; nothing half-written was left behind\n');
    process.exit(reportedCode ?? EXIT_INTERRUPTED);
  }

  function onSigint(): void {
    if (grace === undefined) {
      requestInterrupt();
      grace = setTimeout(() => void stopNow(), GRACE_MS);
      return;
    }
    void stopNow();
  }
  process.on('SIGINT', onSigint);

  worker.on('message', (message: { exitCode?: number }) => {
    if (typeof message.exitCode === 'number') reportedCode = message.exitCode;
  });
  worker.on('error', (err) => {
    // an error no command caught (a bug): one line, like reportFailure
    process.stderr.write(`stanchion: internal error: ${err instanceof Error ? err.message : String(err)}\n`);
    if (process.env.STANCHION_DEBUG && err instanceof Error && err.stack) process.stderr.write(`${err.stack}\n`);
    reportedCode = EXIT_INTERNAL;
  });
  worker.on('exit', (code) => {
    if (stopping) return;
    if (grace !== undefined) clearTimeout(grace);
    // a late Ctrl-C while the output drains must not kill the process by signal
    process.off('SIGINT', onSigint);
    process.on('SIGINT', () => undefined);
    // the worker's output is already queued on this thread's stdout/stderr: let it drain, then exit
    process.exitCode = reportedCode ?? (code === 0 ? 0 : EXIT_INTERNAL);
  });
}
