/**
 * Cholesky factor of a symmetric positive-definite matrix, R = L Lᵀ with L lower triangular,
 * stored row-major in a Float64Array (n × n, upper part zero). Returns null when the matrix
 * is not positive definite (a pivot ≤ tolerance · diagonal), leaving the message to callers.
 */
import { throwIfInterrupted } from '../runtime/interruptFlag.js';

export function choleskyLower(matrix: ArrayLike<ArrayLike<number>>, relativePivotTolerance = 1e-12): Float64Array | null {
  const n = matrix.length;
  const L = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    throwIfInterrupted('the Nataf transformation'); // O(n³) in all: seconds for a thousand variables
    for (let j = 0; j <= i; j++) {
      let sum = matrix[i][j];
      for (let k = 0; k < j; k++) sum -= L[i * n + k] * L[j * n + k];
      if (i === j) {
        if (!(sum > relativePivotTolerance * Math.abs(matrix[i][i]))) return null;
        L[i * n + i] = Math.sqrt(sum);
      } else {
        L[i * n + j] = sum / L[j * n + j];
      }
    }
  }
  return L;
}

/** y = L x for row-major lower-triangular L (y may not alias x). */
export function lowerTimes(L: Float64Array, n: number, x: ArrayLike<number>, y: Float64Array): void {
  for (let i = 0; i < n; i++) {
    let sum = 0;
    const row = i * n;
    for (let k = 0; k <= i; k++) sum += L[row + k] * x[k];
    y[i] = sum;
  }
}

/** Solve L x = b by forward substitution (x may alias b). */
export function lowerSolve(L: Float64Array, n: number, b: ArrayLike<number>, x: Float64Array): void {
  for (let i = 0; i < n; i++) {
    let sum = b[i];
    const row = i * n;
    for (let k = 0; k < i; k++) sum -= L[row + k] * x[k];
    x[i] = sum / L[row + i];
  }
}

/**
 * L's nonzero entries row by row (CSR), for y = L x when most variables are independent (their
 * rows are the identity): the same sums as lowerTimes with the zero terms left out.
 */
export interface SparseLower {
  readonly n: number;
  /** Entries of row i: start[i] … start[i + 1]. */
  readonly start: Int32Array;
  readonly column: Int32Array;
  readonly value: Float64Array;
}

export function sparseLower(L: Float64Array, n: number): SparseLower {
  const start = new Int32Array(n + 1);
  const column: number[] = [];
  const value: number[] = [];
  for (let i = 0; i < n; i++) {
    start[i] = column.length;
    for (let k = 0; k <= i; k++) {
      if (L[i * n + k] !== 0) {
        column.push(k);
        value.push(L[i * n + k]);
      }
    }
  }
  start[n] = column.length;
  return { n, start, column: Int32Array.from(column), value: Float64Array.from(value) };
}

/** y = L x over the nonzero entries only (equal to lowerTimes up to the sign of a zero). */
export function sparseLowerTimes(L: SparseLower, x: ArrayLike<number>, y: Float64Array): void {
  const { n, start, column, value } = L;
  for (let i = 0; i < n; i++) {
    let sum = 0;
    for (let e = start[i]; e < start[i + 1]; e++) sum += value[e] * x[column[e]];
    y[i] = sum;
  }
}
