/**
 * The two independent base samples A and B of the Saltelli design, N rows × d columns,
 * row-major Float64Array blocks, drawn by inverse CDF from seeded uniform streams
 * (A from stream 0, B from stream 1 of `seed`). Independent inputs only.
 */
import { throwIfInterrupted } from '../runtime/interruptFlag.js';
import type { Distribution } from '../probability/distribution.js';
import { uniformStream } from '../probability/rng.js';

export const SOBOL_STREAM_A = 0;
export const SOBOL_STREAM_B = 1;
export const SOBOL_STREAM_BOOTSTRAP = 2;

export function sampleMatrix(dists: readonly Distribution[], n: number, seed: number, stream: number): Float64Array {
  const d = dists.length;
  const uniform = uniformStream(seed, stream);
  const out = new Float64Array(n * d);
  for (let row = 0; row < n; row++) {
    const base = row * d;
    for (let col = 0; col < d; col++) out[base + col] = dists[col].quantile(uniform());
  }
  return out;
}

/**
 * Model outputs on A, B and every A_B^(i) (A with column i taken from B).
 * fAB is d blocks of N: fAB[i·N + row]. One workspace row, no allocation per call.
 */
export function evaluateDesign(
  model: (x: Float64Array) => number,
  a: Float64Array,
  b: Float64Array,
  n: number,
  d: number,
): { fA: Float64Array; fB: Float64Array; fAB: Float64Array } {
  const fA = new Float64Array(n);
  const fB = new Float64Array(n);
  const fAB = new Float64Array(n * d);
  const x = new Float64Array(d);
  const checked = (value: number, what: string, row: number): number => {
    if (!Number.isFinite(value)) throw new Error(`sobol: model returned ${value} on ${what}, row ${row}`);
    return value;
  };
  for (let row = 0; row < n; row++) {
    throwIfInterrupted('the Sobol study'); // d + 2 model calls per row
    const base = row * d;
    for (let col = 0; col < d; col++) x[col] = a[base + col];
    fA[row] = checked(model(x), 'A', row);
    for (let col = 0; col < d; col++) x[col] = b[base + col];
    fB[row] = checked(model(x), 'B', row);
    for (let i = 0; i < d; i++) {
      for (let col = 0; col < d; col++) x[col] = a[base + col];
      x[i] = b[base + i];
      fAB[i * n + row] = checked(model(x), `A_B^(${i})`, row);
    }
  }
  return { fA, fB, fAB };
}
