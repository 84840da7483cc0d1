/**
 * Runs the chunks of a sampling method, in-process or over worker threads, and hands the
 * outcomes to `onChunk` strictly in chunk order. The chunk layout (size, stream) depends only
 * on the sample count, so the merged sums — and any stop decision taken in `onChunk` — are the
 * same whatever the number of workers.
 */
import { Worker } from 'node:worker_threads';
import type { ProblemRecipe, ReliabilityProblem } from './types.js';
import { makeChunkKernel, type ChunkJob, type ChunkKernel, type ChunkOutcome, type SamplingSpec } from './chunkKernel.js';
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
   * Decide the worker count here (`workers` is then the most to use): time chunk 0 in this
   * thread and start workers only when the rest would take longer than WORKER_START_REPAID_MS.
   */
  autoWorkers?: boolean;
  /** With autoWorkers: the work left (ms) from which workers start (default WORKER_START_REPAID_MS). */
  workerStartRepaidMs?: number;
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
/**
 * Work left after chunk 0 (ms, one thread) from which starting workers pays. A sampling worker
 * is ready ~0.25–0.4 s after it is started (it loads the modules and rebuilds the problem;
 * measured on 2 shared cores with the demo column), and this thread keeps sampling meanwhile,
 * so workers pay once the rest takes about as long again.
 */
export const WORKER_START_REPAID_MS = 400;

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
  if (!o.autoWorkers) return { stopReason: await runOnWorkers(o, chunks, workers, o.recipe, 0), workers };
  // Auto: chunk 0 here, timed; the rest here too unless it is long enough to repay workers.
  const kernel = makeChunkKernel(o.problem, o.spec);
  const t0 = performance.now();
  const first = kernel(chunkJob(0, o.total, o.chunkSize));
  const perChunk = performance.now() - t0;
  if (first.interrupted || o.signal?.aborted || interruptRequested()) return { stopReason: stopped(o), workers: 1 };
  if (first.fault) throw toError(o, o.problem.names, first);
  if (o.onChunk(first)) return { stopReason: 'target-cov', workers: 1 };
  if ((chunks - 1) * perChunk < (o.workerStartRepaidMs ?? WORKER_START_REPAID_MS) || chunks === 1) {
    return { stopReason: await runInProcess(o, chunks, 1, kernel), workers: 1 };
  }
  const more = Math.min(workers, chunks - 1);
  return { stopReason: await runOnWorkers(o, chunks, more, o.recipe, 1, kernel), workers: more };
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

async function runInProcess(o: ChunkRunOptions, chunks: number, from = 0, kernel = makeChunkKernel(o.problem, o.spec)): Promise<StopReason> {
  let lastYield = performance.now();
  for (let c = from; c < chunks; c++) {
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

/**
 * Chunks from `from` on, over `count` workers. With a `local` kernel this thread also samples
 * chunks until the first worker is ready (start-up is not wasted), then only merges.
 */
function runOnWorkers(o: ChunkRunOptions, chunks: number, count: number, recipe: ProblemRecipe, from: number, local?: ChunkKernel): Promise<StopReason> {
  const script = requireCompiled(compiledTwin(import.meta.url, 'samplingWorker.js'));
  const n = o.problem.transform.n;
  return new Promise<StopReason>((resolve, reject) => {
    const pool: Worker[] = [];
    const pending = new Map<number, ChunkOutcome>();
    let nextToSend = from;
    let nextToMerge = from;
    let finished = false;
    let anyReady = false;

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
    /** Merge in chunk order; true when the run is over. */
    const deliver = (outcome: ChunkOutcome): boolean => {
      if (outcome.interrupted) {
        onAbort();
        return true;
      }
      pending.set(outcome.index, outcome);
      while (pending.has(nextToMerge)) {
        const next = pending.get(nextToMerge)!;
        pending.delete(nextToMerge);
        nextToMerge++;
        if (next.fault) {
          finish(toError(o, o.problem.names, next));
          return true;
        }
        if (o.onChunk(next)) {
          finish(null, 'target-cov');
          return true;
        }
      }
      if (nextToMerge >= chunks) {
        finish(null, undefined);
        return true;
      }
      return false;
    };

    for (let k = 0; k < count; k++) {
      const w = new Worker(script, { workerData: { recipe, spec: o.spec, n, interruptFlag: interruptFlagBuffer() } });
      pool.push(w);
      w.on('message', (msg: { ready?: boolean; loadError?: string; outcome?: ChunkOutcome }) => {
        if (finished) return;
        if (msg.loadError !== undefined) return finish(new Error(`worker could not build the problem: ${msg.loadError}`));
        if (msg.ready) {
          anyReady = true;
          for (let j = 0; j < IN_FLIGHT_PER_WORKER; j++) send(w);
          return;
        }
        if (!deliver(msg.outcome!)) send(w);
      });
      w.on('error', (e) => (interruptRequested() ? onAbort() : finish(e instanceof Error ? e : new Error(String(e)))));
      w.on('exit', (code) => {
        if (!finished && code !== 0) finish(new Error(`sampling worker exited with code ${code}`));
      });
    }

    if (local === undefined) return;
    const fillIn = (): void => {
      if (finished || anyReady || nextToSend >= chunks) return;
      if (deliver(local(chunkJob(nextToSend++, o.total, o.chunkSize)))) return;
      setImmediate(fillIn); // let the workers' messages in between chunks
    };
    setImmediate(fillIn);
  });
}
