/**
 * Crude Monte Carlo: pf = failures / N, CoV = sqrt((1 − pf)/(N pf)) (binomial variance, e.g.
 * Melchers 1999 ch. 3), β = −Φ⁻¹(pf), Wilson 95 % interval. Samples are processed in chunks of
 * fixed size, chunk i drawing from stream i; failures are summed as integers, so the result is
 * bit-identical for any number of workers. Memory does not grow with N.
 */
import { availableParallelism } from 'node:os';
import { normalQuantile } from '../probability/normal.js';
import { SAMPLER_VERSION } from '../probability/blockRng.js';
import type { McResult, McTracePoint, ProblemRecipe, ReliabilityProblem, SimulationProgress } from './types.js';
import { runChunks } from './chunkRunner.js';
import { MC_STREAM_BASE } from './streams.js';
import { wilsonInterval } from './wilson.js';

export interface MonteCarloOptions {
  samples: number;
  seed: number;
  /**
   * Worker threads. Needs `recipe` to go parallel. Default: with a recipe, every core once the
   * run is long enough to repay starting them (chunkRunner.ts `autoWorkers`), else in-process.
   */
  workers?: number;
  recipe?: ProblemRecipe;
  /** Stop at the first chunk boundary where the CoV is at or below this. */
  targetCov?: number;
  signal?: AbortSignal;
  onProgress?: (p: SimulationProgress) => void;
  /** With the default worker choice: work left (ms) from which workers start (tests). */
  workerStartRepaidMs?: number;
  /** Samples per chunk (part of the seed's meaning: change it and the numbers change). */
  chunkSize?: number;
}

export const MC_CHUNK_SIZE = 16384;
/** Trace points per decade of sample count. */
const TRACE_PER_DECADE = 5;

export function crudeCov(failures: number, samples: number): number {
  if (failures === 0 || samples === 0) return Infinity;
  const pf = failures / samples;
  return Math.sqrt((1 - pf) / (samples * pf));
}

/** β = −Φ⁻¹(pf), computed as Φ⁻¹ of the small tail; ±Infinity at pf = 0 or 1. */
export function betaFromPf(pf: number): number {
  if (pf <= 0) return Infinity;
  if (pf >= 1) return -Infinity;
  return -normalQuantile(pf);
}

export async function monteCarlo(problem: ReliabilityProblem, opts: MonteCarloOptions): Promise<McResult> {
  const total = opts.samples;
  let samples = 0;
  let failures = 0;
  const trace: McTracePoint[] = [];
  let nextTrace = 0;
  const tracePoint = (): McTracePoint => {
    const [lo, hi] = wilsonInterval(failures, samples);
    return { samples, pf: samples > 0 ? failures / samples : 0, lo, hi };
  };

  const summary = await runChunks({
    problem,
    spec: { kind: 'mc', seed: opts.seed, streamBase: MC_STREAM_BASE },
    total,
    chunkSize: opts.chunkSize ?? MC_CHUNK_SIZE,
    workers: opts.workers ?? (opts.recipe ? availableParallelism() : 1),
    autoWorkers: opts.workers === undefined,
    workerStartRepaidMs: opts.workerStartRepaidMs,
    recipe: opts.recipe,
    signal: opts.signal,
    method: 'Monte Carlo',
    onChunk: (c) => {
      samples += c.count;
      failures += c.failures;
      if (samples >= nextTrace) {
        trace.push(tracePoint());
        nextTrace = samples * 10 ** (1 / TRACE_PER_DECADE);
      }
      const cov = crudeCov(failures, samples);
      opts.onProgress?.({ samples, total, pf: failures / samples, cov });
      return opts.targetCov !== undefined && cov <= opts.targetCov;
    },
  });

  if (trace.length === 0 || trace[trace.length - 1].samples !== samples) trace.push(tracePoint());
  const pf = samples > 0 ? failures / samples : 0;
  const result: McResult = {
    pf,
    cov: crudeCov(failures, samples),
    beta: betaFromPf(pf),
    samples,
    failures,
    ci95: wilsonInterval(failures, samples),
    calls: samples,
    stoppedEarly: summary.stopReason !== undefined,
    trace,
    seed: opts.seed,
    sampler: SAMPLER_VERSION,
    workers: summary.workers,
  };
  if (summary.stopReason !== undefined) result.stopReason = summary.stopReason;
  return result;
}
