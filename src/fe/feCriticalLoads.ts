import { assembleColumn, type FeFrame, type FeRestraint } from './columnModel.js';
import { generalizedEigenvalues } from './generalizedEigenvalues.js';

/**
 * Lowest `count` eigenvalues λ = P L²/EI (= φ²) of the finite-element column with `elements` elements:
 * K v = λ Kg v. A mechanism shows as λ ≈ 0 (clamped at 0).
 */
export function feEigenvalues(frame: FeFrame, r: FeRestraint, elements: number, count = 3, stiffnessAt?: (xi: number) => number): number[] {
  // a segment-wise stiffness is read at each element's mid-point
  const perElement = stiffnessAt === undefined ? undefined : (e: number) => stiffnessAt((e + 0.5) / elements);
  const { n, K, Kg } = assembleColumn(frame, r, elements, perElement);
  const lam = generalizedEigenvalues(K, Kg, n);
  const out: number[] = [];
  for (let i = 0; i < Math.min(count, n); i++) out.push(Math.max(0, lam[i]));
  return out;
}

/**
 * Richardson-extrapolated eigenvalues from meshes of m and 2m elements. Hermite cubics with the
 * consistent geometric stiffness converge as h⁴ for these eigenvalues (checked in the tests), so
 * λ ≈ (16 λ_2m − λ_m)/15. With `stiffnessAt(ξ)` (relative EI, piecewise constant) the steps must fall on
 * element boundaries of both meshes for that rate to hold.
 */
export function feEigenvaluesExtrapolated(frame: FeFrame, r: FeRestraint, elements: number, count = 3, stiffnessAt?: (xi: number) => number): number[] {
  const coarse = feEigenvalues(frame, r, elements, count, stiffnessAt);
  const fine = feEigenvalues(frame, r, 2 * elements, count, stiffnessAt);
  return fine.map((f, i) => (16 * f - coarse[i]) / 15);
}

/** Lowest `count` critical loads (N) of a column of length L and bending stiffness EI. */
export function feCriticalLoads(
  EI: number,
  L: number,
  frame: FeFrame,
  r: FeRestraint,
  options: { elements?: number; count?: number; extrapolate?: boolean } = {},
): number[] {
  const elements = options.elements ?? 32;
  const count = options.count ?? 3;
  const lam = options.extrapolate === false
    ? feEigenvalues(frame, r, elements, count)
    : feEigenvaluesExtrapolated(frame, r, elements, count);
  return lam.map((l) => (l * EI) / (L * L));
}
