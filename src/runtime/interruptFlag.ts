/**
 * Ctrl-C across threads. A Node signal handler runs only when its thread returns to the event
 * loop, so the command runs in a worker thread (cli/commandWorker.ts) while the main thread
 * keeps nothing but the handler. The handler sets one Int32 in a SharedArrayBuffer; every
 * long loop, in the command thread and in its own worker pools, reads it with one Atomics.load
 * and stops by throwing InterruptedError. Without a flag installed (tests, library use) the
 * checks are a null test.
 */

/** Ctrl-C: reported on one line by cli/failure.ts with exit code 130. */
export class InterruptedError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'InterruptedError';
  }
}

/** True for an InterruptedError, also one that crossed a thread (only its name survives). */
export function isInterruptedError(err: unknown): boolean {
  return (err as { name?: unknown } | null)?.name === 'InterruptedError';
}

let flag: Int32Array | null = null;
let buffer: SharedArrayBuffer | undefined;

/** A new, unset flag (the main thread makes one per run). */
export function createInterruptFlag(): SharedArrayBuffer {
  return new SharedArrayBuffer(Int32Array.BYTES_PER_ELEMENT);
}

/** Read this flag from now on in this thread (a worker calls it with what its parent sent). */
export function useInterruptFlag(shared: SharedArrayBuffer | undefined): void {
  buffer = shared;
  flag = shared ? new Int32Array(shared) : null;
}

/** The flag this thread reads, to pass on to the workers it starts (undefined when none). */
export function interruptFlagBuffer(): SharedArrayBuffer | undefined {
  return buffer;
}

/** Set the flag: every thread that shares it stops at its next check. */
export function requestInterrupt(): void {
  if (flag) Atomics.store(flag, 0, 1);
}

export function interruptRequested(): boolean {
  return flag !== null && Atomics.load(flag, 0) !== 0;
}

/** `what` names the phase stopped, e.g. 'FORM' → "interrupted during FORM; nothing was written". */
export function throwIfInterrupted(what: string): void {
  if (flag !== null && Atomics.load(flag, 0) !== 0) throw interruptedDuring(what);
}

export function interruptedDuring(what: string): InterruptedError {
  return new InterruptedError(`interrupted during ${what}; nothing was written`);
}

/** How often an idle thread (waiting on its workers) looks at the flag. */
const POLL_MS = 50;

/**
 * Call `onInterrupt` once, soon after the flag is set, while this thread waits on its event
 * loop (e.g. for a worker pool's replies). Returns the function that stops watching.
 */
export function whenInterrupted(onInterrupt: () => void): () => void {
  if (flag === null) return () => {};
  const timer = setInterval(() => {
    if (!interruptRequested()) return;
    clearInterval(timer);
    onInterrupt();
  }, POLL_MS);
  timer.unref();
  return () => clearInterval(timer);
}
