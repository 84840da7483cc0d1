/**
 * Ctrl-C during a long run: the first SIGINT asks the samplers to stop at their next chunk
 * (well within a second); they return what they did and the command writes nothing.
 * A second Ctrl-C exits at once.
 */
export class InterruptedError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'InterruptedError';
  }
}

export async function withInterrupt<T>(run: (signal: AbortSignal) => Promise<T>): Promise<T> {
  const controller = new AbortController();
  const onSigint = () => {
    if (controller.signal.aborted) process.exit(130);
    process.stderr.write('\nstanchion: stopping (Ctrl-C again to quit at once)…\n');
    controller.abort();
  };
  process.on('SIGINT', onSigint);
  try {
    return await run(controller.signal);
  } finally {
    process.off('SIGINT', onSigint);
  }
}
