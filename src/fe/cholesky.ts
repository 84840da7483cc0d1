/**
 * In-place Cholesky factorisation M = L Lᵀ of a symmetric positive definite n×n row-major matrix;
 * the lower triangle of m receives L (the upper triangle is zeroed). Throws if M is not positive definite.
 */
export function choleskyInPlace(m: Float64Array, n: number): Float64Array {
  for (let j = 0; j < n; j++) {
    let s = m[j * n + j];
    for (let k = 0; k < j; k++) s -= m[j * n + k] * m[j * n + k];
    if (!(s > 0)) throw new Error(`cholesky: matrix is not positive definite (pivot ${j})`);
    const ljj = Math.sqrt(s);
    m[j * n + j] = ljj;
    for (let i = j + 1; i < n; i++) {
      let t = m[i * n + j];
      for (let k = 0; k < j; k++) t -= m[i * n + k] * m[j * n + k];
      m[i * n + j] = t / ljj;
    }
    for (let i = 0; i < j; i++) m[i * n + j] = 0;
  }
  return m;
}

/** Solves L X = B in place for all columns of B (n×n row-major), L lower triangular. */
export function forwardSubstituteColumns(L: Float64Array, b: Float64Array, n: number): Float64Array {
  for (let col = 0; col < n; col++) {
    for (let i = 0; i < n; i++) {
      let t = b[i * n + col];
      for (let k = 0; k < i; k++) t -= L[i * n + k] * b[k * n + col];
      b[i * n + col] = t / L[i * n + i];
    }
  }
  return b;
}
