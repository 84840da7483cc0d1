import { choleskyInPlace, forwardSubstituteColumns } from './cholesky.js';
import { symmetricEigenvalues } from './symmetricEigenvalues.js';

/**
 * Eigenvalues λ of K v = λ M v for symmetric K and symmetric positive definite M (n×n row-major),
 * by Cholesky reduction M = L Lᵀ, C = L⁻¹ K L⁻ᵀ (symmetric, same eigenvalues). Increasing order.
 * Inputs are not modified.
 */
export function generalizedEigenvalues(K: Float64Array, M: Float64Array, n: number): Float64Array {
  const L = choleskyInPlace(Float64Array.from(M), n);
  const Y = forwardSubstituteColumns(L, Float64Array.from(K), n); // Y = L⁻¹ K
  const Yt = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) Yt[i * n + j] = Y[j * n + i];
  const C = forwardSubstituteColumns(L, Yt, n); // C = L⁻¹ Kᵀ L⁻ᵀ = L⁻¹ K L⁻ᵀ
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < i; j++) {
      const s = 0.5 * (C[i * n + j] + C[j * n + i]);
      C[i * n + j] = s;
      C[j * n + i] = s;
    }
  }
  return symmetricEigenvalues(C, n);
}
