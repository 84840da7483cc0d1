import { assembleColumn, type FeFrame, type FeRestraint } from './columnModel.js';
import { generalizedEigenvalues } from './generalizedEigenvalues.js';

/**
 * Frequency parameters λ (ω = λ² √(EI/(m L⁴))) of the finite-element column under the axial load
 * φ² = P L²/EI: (K − φ² Kg) v = λ⁴ M v with the consistent mass M (EI = L = m = 1). A check of
 * mechanics/naturalFrequency.ts by an independent route; λ = 0 where K − φ²Kg is not positive.
 */
export function feFrequencyParameters(frame: FeFrame, r: FeRestraint, phi: number, elements: number, count = 2): number[] {
  const { n, K, Kg, M } = assembleColumn(frame, r, elements);
  const phi2 = phi * phi;
  const A = new Float64Array(n * n);
  for (let i = 0; i < n * n; i++) A[i] = K[i] - phi2 * Kg[i];
  const lam4 = generalizedEigenvalues(A, M, n);
  const out: number[] = [];
  for (let i = 0; i < Math.min(count, n); i++) out.push(Math.pow(Math.max(0, lam4[i]), 0.25));
  return out;
}

/**
 * Richardson-extrapolated λ from meshes of m and 2m elements. The eigenvalue λ⁴ of Hermite cubics
 * with consistent mass converges as h⁴ (checked in the tests), so λ⁴ ≈ (16 λ⁴_2m − λ⁴_m)/15.
 */
export function feFrequencyParametersExtrapolated(frame: FeFrame, r: FeRestraint, phi: number, elements: number, count = 2): number[] {
  const coarse = feFrequencyParameters(frame, r, phi, elements, count);
  const fine = feFrequencyParameters(frame, r, phi, 2 * elements, count);
  return fine.map((f, i) => Math.pow(Math.max(0, (16 * f ** 4 - coarse[i] ** 4) / 15), 0.25));
}
