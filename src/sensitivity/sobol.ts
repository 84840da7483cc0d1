/**
 * First-order and total Sobol indices of a model of independent inputs, with bootstrap
 * percentile confidence intervals (rows resampled with replacement, same resample for every
 * index). Cost: N (d + 2) model calls. Every random number comes from seeded streams, so a
 * seed gives the same indices and intervals every time.
 */
import type { Distribution } from '../probability/distribution.js';
import { uniformStream } from '../probability/rng.js';
import { throwIfInterrupted } from '../runtime/interruptFlag.js';
import { sortedPercentile } from './percentile.js';
import { sobolEstimates } from './sobolEstimators.js';
import { evaluateDesign, sampleMatrix, SOBOL_STREAM_A, SOBOL_STREAM_B, SOBOL_STREAM_BOOTSTRAP } from './sobolSample.js';

export interface SobolIndex {
  name: string;
  value: number;
  /** Bootstrap percentile interval. */
  lo: number;
  hi: number;
}

export interface SobolOptions {
  /** Rows of each base sample (default 10 000). */
  n?: number;
  seed: number;
  /** Bootstrap resamples (default 200). */
  resamples?: number;
  /** Confidence level of the interval (default 0.95). */
  confidence?: number;
}

export interface SobolResult {
  first: SobolIndex[];
  total: SobolIndex[];
  /** Model calls spent: N (d + 2). */
  calls: number;
  n: number;
  /** Variance of the model output (from A and B). */
  variance: number;
  seed: number;
}

export function sobolIndices(
  names: readonly string[],
  dists: readonly Distribution[],
  model: (x: Float64Array) => number,
  opts: SobolOptions,
): SobolResult {
  const d = dists.length;
  if (names.length !== d) throw new Error(`${names.length} names but ${d} distributions`);
  if (d === 0) throw new Error('sobol: no input variables');
  const n = opts.n ?? 10_000;
  const resamples = opts.resamples ?? 200;
  const confidence = opts.confidence ?? 0.95;
  if (!Number.isInteger(n) || n < 2) throw new Error(`sobol: n must be an integer >= 2, got ${n}`);
  if (!Number.isInteger(resamples) || resamples < 1) throw new Error(`sobol: resamples must be >= 1, got ${resamples}`);
  if (!(confidence > 0 && confidence < 1)) throw new Error(`sobol: confidence must be in (0, 1), got ${confidence}`);

  const a = sampleMatrix(dists, n, opts.seed, SOBOL_STREAM_A);
  const b = sampleMatrix(dists, n, opts.seed, SOBOL_STREAM_B);
  const outputs = evaluateDesign(model, a, b, n, d);

  const all = new Int32Array(n);
  for (let k = 0; k < n; k++) all[k] = k;
  const first = new Float64Array(d);
  const total = new Float64Array(d);
  const variance = sobolEstimates(outputs, n, d, all, first, total);
  if (!(variance > 0)) {
    // A constant output (e.g. a column with no capacity over the whole sample) has no variance to
    // apportion: no input moves it, so every index is 0, exactly.
    const zeros = (): SobolIndex[] => names.map((name) => ({ name, value: 0, lo: 0, hi: 0 }));
    return { first: zeros(), total: zeros(), calls: n * (d + 2), n, variance: 0, seed: opts.seed };
  }

  // bootstrap: column-major store so each index's resamples sort as one block
  const bootFirst = new Float64Array(resamples * d);
  const bootTotal = new Float64Array(resamples * d);
  const rows = new Int32Array(n);
  const f = new Float64Array(d);
  const t = new Float64Array(d);
  const uniform = uniformStream(opts.seed, SOBOL_STREAM_BOOTSTRAP);
  for (let r = 0; r < resamples; r++) {
    throwIfInterrupted('the Sobol study');
    for (let k = 0; k < n; k++) rows[k] = Math.floor(uniform() * n);
    sobolEstimates(outputs, n, d, rows, f, t);
    for (let i = 0; i < d; i++) {
      bootFirst[i * resamples + r] = f[i];
      bootTotal[i * resamples + r] = t[i];
    }
  }
  const tail = (1 - confidence) / 2;
  const interval = (boot: Float64Array, i: number): [number, number] => {
    const block = boot.subarray(i * resamples, (i + 1) * resamples).sort();
    return [sortedPercentile(block, tail), sortedPercentile(block, 1 - tail)];
  };
  const pack = (values: Float64Array, boot: Float64Array): SobolIndex[] =>
    names.map((name, i) => {
      const [lo, hi] = interval(boot, i);
      return { name, value: values[i], lo, hi };
    });
  return { first: pack(first, bootFirst), total: pack(total, bootTotal), calls: n * (d + 2), n, variance, seed: opts.seed };
}
