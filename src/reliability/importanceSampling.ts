/**
 * Importance sampling with the standard normal density shifted to a centre c in u-space
 * (usually the FORM design point): pf = mean(1[g <= 0] w), w = φ(u)/φ(u − c).
 * CoV from the sample variance of the weighted indicator:
 *   Var(pf̂) = (mean(1 w²) − pf̂²)/(N − 1).
 * Chunked and seeded exactly like Monte Carlo (own stream range), so the result does not depend
 * on the number of workers; per-chunk float sums are merged in chunk order.
 */
import type { FormResult, IsResult, ProblemRecipe, ReliabilityProblem, SimulationProgress } from './types.js';
import { runChunks } from './chunkRunner.js';
import { IS_STREAM_BASE } from './streams.js';
import { betaFromPf } from './monteCarlo.js';

export interface ImportanceSamplingOptions {
  /** Largest number of samples (default 100 000). */
  samples?: number;
  seed: number;
  /** Stop at the first chunk boundary where the CoV is at or below this. */
  targetCov?: number;
  workers?: number;
  recipe?: ProblemRecipe;
  signal?: AbortSignal;
  onProgress?: (p: SimulationProgress) => void;
  chunkSize?: number;
}

export const IS_CHUNK_SIZE = 256;
export const IS_DEFAULT_SAMPLES = 100_000;

export interface IsEstimate {
  pf: number;
  cov: number;
}

/**
 * pf and its CoV from N samples with Σ w·1 and Σ w²·1. The weighted mean is unbiased but not bounded:
 * where failure is nearly certain (the origin fails, the centre sits in the failure domain) it can
 * exceed 1, and a probability is reported as at most 1 (closer to the truth than the raw mean; its
 * standard error is the raw one).
 */
export function isEstimate(samples: number, sumW: number, sumW2: number): IsEstimate {
  if (samples === 0 || sumW === 0) return { pf: 0, cov: Infinity };
  const mean = sumW / samples;
  const pf = Math.min(1, mean);
  if (samples < 2) return { pf, cov: Infinity };
  const variance = Math.max(0, sumW2 / samples - mean * mean) / (samples - 1);
  return { pf, cov: Math.sqrt(variance) / pf };
}

/** IS centred at the FORM design point. */
export function importanceSamplingAtDesignPoint(
  problem: ReliabilityProblem,
  form: FormResult,
  opts: ImportanceSamplingOptions,
): Promise<IsResult> {
  const warnings: string[] = [];
  if (!form.converged) warnings.push(`FORM did not converge (${form.reason ?? 'unknown reason'}); IS is centred at its last point`);
  if (form.originFails) warnings.push('the origin of u-space already fails; IS around the design point is inefficient, prefer Monte Carlo');
  if (form.multipleDesignPoints) warnings.push('several design points: IS centred at one of them may miss the others');
  return importanceSampling(problem, form.designPointU, opts, warnings);
}

export async function importanceSampling(
  problem: ReliabilityProblem,
  centreU: ArrayLike<number>,
  opts: ImportanceSamplingOptions,
  warnings: string[] = [],
): Promise<IsResult> {
  const total = opts.samples ?? IS_DEFAULT_SAMPLES;
  const centre = Array.from(centreU);
  let samples = 0;
  let failures = 0;
  let sumW = 0;
  let sumW2 = 0;
  const summary = await runChunks({
    problem,
    spec: { kind: 'is', seed: opts.seed, streamBase: IS_STREAM_BASE, centre },
    total,
    chunkSize: opts.chunkSize ?? IS_CHUNK_SIZE,
    workers: opts.workers ?? 1,
    recipe: opts.recipe,
    signal: opts.signal,
    method: 'importance sampling',
    onChunk: (c) => {
      samples += c.count;
      failures += c.failures;
      sumW += c.sumW;
      sumW2 += c.sumW2;
      const e = isEstimate(samples, sumW, sumW2);
      opts.onProgress?.({ samples, total, pf: e.pf, cov: e.cov });
      // At least a few failures before trusting a variance estimate.
      return opts.targetCov !== undefined && failures >= 10 && e.cov <= opts.targetCov;
    },
  });
  const e = isEstimate(samples, sumW, sumW2);
  if (failures === 0) warnings.push(`no sample failed in ${samples}: pf and its CoV are unknown`);
  const result: IsResult = {
    pf: e.pf,
    cov: e.cov,
    beta: betaFromPf(e.pf),
    calls: samples,
    samples,
    failures,
    stoppedEarly: summary.stopReason !== undefined,
    centreU: centre,
    seed: opts.seed,
    workers: summary.workers,
    warnings,
  };
  if (summary.stopReason !== undefined) result.stopReason = summary.stopReason;
  return result;
}
