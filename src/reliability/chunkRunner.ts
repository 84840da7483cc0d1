/**
 * Runs the chunks of a sampling method, in-process or over worker threads, and hands the
 * outcomes to `onChunk` strictly in chunk order. The chunk layout (size, stream) depends only
 * on the sample count, so the merged sums — and any stop decision taken in `onChunk` — are the
 * same whatever the number of workers.
 */
import { Worker } from 'node:worker_threads';
import type { ProblemRecipe, ReliabilityProblem } from './types.js';
import { makeChunkKernel, type ChunkJob, type ChunkOutcome, type SamplingSpec } from './chunkKernel.js';
import { compiledTwin, requireCompiled } from '../runtime/compiledTwin.js';
import { LimitStateError } from './limitStateError.js';
import { interruptedDuring, interruptFlagBuffer, interruptRequested, whenInterrupted } from '../runtime/interruptFlag.js';

export interface ChunkRunOptions {
  problem: ReliabilityProblem;
  spec: SamplingSpec;
  total: number;
  chunkSize: number;
  workers: number;
  recipe?: ProblemRecipe;
  /**
   * With a signal, an abort or Ctrl-C (runtime/interruptFlag.ts) ends the run early with
   * stopReason 'aborted' and the chunks merged so far; without one, Ctrl-C throws
   * InterruptedError (a caller that cannot use a partial result must not receive one).
   */
  signal?: AbortSignal;
  /** Called in chunk order; return true to stop (e.g. the target CoV is reached). */
  onChunk: (outcome: ChunkOutcome) => boolean;
  method: string;
}

export type StopReason = 'target-cov' | 'aborted' | undefined;

export interface ChunkRunSummary {
  stopReason: StopReason;
  /** Workers actually used (1 for the in-process path). */
  workers: number;
}

/** How long the in-process path may compute before letting timers and signals run. */
const YIELD_EVERY_MS = 25;
/** Jobs queued per worker, so a worker never waits for the main thread. */
const IN_FLIGHT_PER_WORKER = 2;

export function chunkJob(index: number, total: number, chunkSize: number): ChunkJob {
  const firstSample = index * chunkSize;
  return { index, firstSample, count: Math.min(chunkSize, total - firstSample) };
}

export async function runChunks(o: ChunkRunOptions): Promise<ChunkRunSummary> {
  if (!(o.total >= 0) || !Number.isInteger(o.total)) throw new Error(`sample count must be a non-negative integer, got ${o.total}`);
  if (!(o.chunkSize >= 1) || !Number.isInteger(o.chunkSize)) throw new Error(`chunk size must be a positive integer, got ${o.chunkSize}`);
  const chunks = Math.ceil(o.total / o.chunkSize);
  const workers = Math.max(1, Math.min(Math.floor(o.workers), chunks));
  if (workers <= 1 || o.recipe === undefined) {
    return { stopReason: await runInProcess(o, chunks), workers: 1 };
  }
  return { stopReason: await runOnWorkers(o, chunks, workers, o.recipe), workers };
}

function toError(o: ChunkRunOptions, names: string[], outcome: ChunkOutcome): LimitStateError {
  const f = outcome.fault!;
  return new LimitStateError(names, f.x, f.value ?? undefined, { sampleIndex: f.sampleIndex, cause: f.cause, method: o.method });
}

/** Stopped by an abort or by Ctrl-C: 'aborted' for a caller with a signal, else InterruptedError. */
function stopped(o: ChunkRunOptions): 'aborted' {
  if (o.signal === undefined) throw interruptedDuring(o.method);
  return 'aborted';
}

async function runInProcess(o: ChunkRunOptions, chunks: number): Promise<StopReason> {
  const kernel = makeChunkKernel(o.problem, o.spec);
  let lastYield = performance.now();
  for (let c = 0; c < chunks; c++) {
    if (o.signal?.aborted || interruptRequested()) return stopped(o);
    const outcome = kernel(chunkJob(c, o.total, o.chunkSize));
    if (outcome.interrupted) return stopped(o);
    if (outcome.fault) throw toError(o, o.problem.names, outcome);
    if (o.onChunk(outcome)) return 'target-cov';
    if (performance.now() - lastYield > YIELD_EVERY_MS) {
      await new Promise<void>((resolve) => setImmediate(resolve));
      lastYield = performance.now();
    }
  }
  return undefined;
}

function runOnWorkers(o: ChunkRunOptions, chunks: number, count: number, recipe: ProblemRecipe): Promise<StopReason> {
  const script = requireCompiled(compiledTwin(import.meta.url, 'samplingWorker.js'));
  const n = o.problem.transform.n;
  return new Promise<StopReason>((resolve, reject) => {
    const pool: Worker[] = [];
    const pending = new Map<number, ChunkOutcome>();
    let nextToSend = 0;
    let nextToMerge = 0;
    let finished = false;

    const finish = (err: Error | null, reason?: StopReason): void => {
      if (finished) return;
      finished = true;
      o.signal?.removeEventListener('abort', onAbort);
      stopWatching();
      void Promise.all(pool.map((w) => w.terminate())).then(
        () => (err ? reject(err) : resolve(reason)),
        () => (err ? reject(err) : resolve(reason)),
      );
    };
    const onAbort = (): void => {
      try {
        finish(null, stopped(o));
      } catch (e) {
        finish(e as Error);
      }
    };
    let stopWatching = (): void => {};
    if (o.signal?.aborted || interruptRequested()) return onAbort();
    o.signal?.addEventListener('abort', onAbort);
    stopWatching = whenInterrupted(onAbort);

    const send = (w: Worker): void => {
      if (nextToSend < chunks) w.postMessage(chunkJob(nextToSend++, o.total, o.chunkSize));
    };

    for (let k = 0; k < count; k++) {
      const w = new Worker(script, { workerData: { recipe, spec: o.spec, n, interruptFlag: interruptFlagBuffer() } });
      pool.push(w);
      w.on('message', (msg: { ready?: boolean; loadError?: string; outcome?: ChunkOutcome }) => {
        if (finished) return;
        if (msg.loadError !== undefined) return finish(new Error(`worker could not build the problem: ${msg.loadError}`));
        if (msg.ready) {
          for (let j = 0; j < IN_FLIGHT_PER_WORKER; j++) send(w);
          return;
        }
        const outcome = msg.outcome!;
        if (outcome.interrupted) return onAbort();
        pending.set(outcome.index, outcome);
        while (pending.has(nextToMerge)) {
          const next = pending.get(nextToMerge)!;
          pending.delete(nextToMerge);
          nextToMerge++;
          if (next.fault) return finish(toError(o, o.problem.names, next));
          if (o.onChunk(next)) return finish(null, 'target-cov');
        }
        if (nextToMerge >= chunks) return finish(null, undefined);
        send(w);
      });
      w.on('error', (e) => (interruptRequested() ? onAbort() : finish(e instanceof Error ? e : new Error(String(e)))));
      w.on('exit', (code) => {
        if (!finished && code !== 0) finish(new Error(`sampling worker exited with code ${code}`));
      });
    }
  });
}
