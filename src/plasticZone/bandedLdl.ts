/**
 * Symmetric banded LDLᵀ without pivoting, on a dense row-major n×n Float64Array of which only the
 * band |i − j| ≤ bw is read. The tangent stiffness of the column is symmetric but becomes
 * indefinite past the limit point, so Cholesky would fail; LDLᵀ only needs non-zero pivots.
 * The count of negative pivots equals the number of negative eigenvalues (Sylvester's law of
 * inertia), which the elastic critical-load search uses.
 */
export function factorBanded(a: Float64Array, n: number, bw: number): { negativePivots: number; singular: boolean } {
  let negativePivots = 0;
  let singular = false;
  for (let k = 0; k < n; k++) {
    const dk = a[k * n + k];
    if (dk === 0 || !Number.isFinite(dk)) {
      singular = true;
      break;
    }
    if (dk < 0) negativePivots++;
    const last = Math.min(n - 1, k + bw);
    for (let i = k + 1; i <= last; i++) {
      const lik = a[k * n + i] / dk; // a is symmetric; the upper row k holds column k
      if (lik === 0) continue;
      for (let j = i; j <= last; j++) a[i * n + j] -= lik * a[k * n + j];
    }
    for (let i = k + 1; i <= last; i++) a[i * n + k] = a[k * n + i] / dk; // store L below the diagonal
  }
  return { negativePivots, singular };
}

/** Solve with a matrix factored by factorBanded; x holds b on entry and the solution on exit. */
export function solveBanded(a: Float64Array, n: number, bw: number, x: Float64Array): void {
  for (let k = 0; k < n; k++) {
    const last = Math.min(n - 1, k + bw);
    const xk = x[k];
    for (let i = k + 1; i <= last; i++) x[i] -= a[i * n + k] * xk;
  }
  for (let k = 0; k < n; k++) x[k] /= a[k * n + k];
  for (let k = n - 1; k >= 0; k--) {
    const last = Math.min(n - 1, k + bw);
    let s = x[k];
    for (let i = k + 1; i <= last; i++) s -= a[i * n + k] * x[i];
    x[k] = s;
  }
}
