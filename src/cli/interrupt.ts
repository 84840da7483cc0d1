/**
 * Ctrl-C for the samplers that stop gracefully (Monte Carlo, importance sampling): they take an
 * AbortSignal, return what they did, and the command says how far it got. The signal is
 * aborted soon after the shared flag is set (runtime/interruptFlag.ts); everything else stops
 * by throwing InterruptedError at its next check.
 */
import { whenInterrupted } from '../runtime/interruptFlag.js';

export { InterruptedError } from '../runtime/interruptFlag.js';

export async function withInterrupt<T>(run: (signal: AbortSignal) => Promise<T>): Promise<T> {
  const controller = new AbortController();
  const stopWatching = whenInterrupted(() => controller.abort());
  try {
    return await run(controller.signal);
  } finally {
    stopWatching();
  }
}
