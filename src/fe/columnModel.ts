import { consistentMass, elasticStiffness, geometricStiffness } from './hermiteBeamElement.js';

export type FeFrame = 'braced' | 'sway';

export interface FeRestraint {
  /** R = kL/EI at the bottom and top (Infinity = fixed) */
  bottom: number;
  top: number;
  /** T = kT L³/EI at the top, sway only (Infinity = braced) */
  lateral?: number;
}

export interface ColumnMatrices {
  n: number;
  /** elastic stiffness incl. springs, reduced to the free DOFs (EI = L = 1) */
  K: Float64Array;
  /** geometric stiffness per unit P L²/EI, reduced likewise */
  Kg: Float64Array;
  /** consistent mass per unit mass per length (m = 1), reduced likewise */
  M: Float64Array;
  /** the full-model DOF (2·node + 0 for w, + 1 for θ) of each reduced row */
  keep: number[];
}

/**
 * Assemble the dimensionless column (EI = 1, L = 1, eigenvalue λ = P L²/EI = φ²) from `elements`
 * equal Hermite elements. Node i at ξ = i/elements, DOFs (w_i, θ_i). `elementStiffness(e)`, when given,
 * is the EI of element e relative to the reference EI (a stepped member); R and T refer to that EI. Rotational springs R on θ at the
 * ends, translational spring T on w at the top (sway). Removed DOFs: w at the base; w at the top when
 * braced (or T = ∞); θ at an end whose R = ∞.
 */
export function assembleColumn(frame: FeFrame, r: FeRestraint, elements: number, elementStiffness?: (element: number) => number): ColumnMatrices {
  if (!(Number.isInteger(elements) && elements >= 1)) throw new RangeError('elements must be a positive integer');
  const T = frame === 'sway' ? r.lateral ?? 0 : Infinity;
  for (const v of [r.bottom, r.top, T]) if (!(v >= 0)) throw new RangeError('restraint ratios must be >= 0');
  const N = 2 * (elements + 1);
  const h = 1 / elements;
  const ke = elasticStiffness(h);
  const kg = geometricStiffness(h);
  const me = consistentMass(h);
  const Kf = new Float64Array(N * N);
  const Gf = new Float64Array(N * N);
  const Mf = new Float64Array(N * N);
  for (let el = 0; el < elements; el++) {
    const o = 2 * el;
    // a member of segment-wise stiffness: EI of this element relative to the one R and T refer to
    const ei = elementStiffness === undefined ? 1 : elementStiffness(el);
    if (!(ei > 0 && Number.isFinite(ei))) throw new RangeError(`element stiffness must be finite and > 0 (element ${el}: ${ei})`);
    for (let i = 0; i < 4; i++) {
      for (let j = 0; j < 4; j++) {
        Kf[(o + i) * N + o + j] += ei * ke[i * 4 + j];
        Gf[(o + i) * N + o + j] += kg[i * 4 + j];
        Mf[(o + i) * N + o + j] += me[i * 4 + j];
      }
    }
  }
  const theta0 = 1;
  const wTop = N - 2;
  const thetaTop = N - 1;
  const removed = new Set<number>([0]);
  if (r.bottom === Infinity) removed.add(theta0);
  else Kf[theta0 * N + theta0] += r.bottom;
  if (r.top === Infinity) removed.add(thetaTop);
  else Kf[thetaTop * N + thetaTop] += r.top;
  if (T === Infinity) removed.add(wTop);
  else Kf[wTop * N + wTop] += T;
  const keep: number[] = [];
  for (let d = 0; d < N; d++) if (!removed.has(d)) keep.push(d);
  const n = keep.length;
  const K = new Float64Array(n * n);
  const Kg = new Float64Array(n * n);
  const M = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      K[i * n + j] = Kf[keep[i] * N + keep[j]];
      Kg[i * n + j] = Gf[keep[i] * N + keep[j]];
      M[i * n + j] = Mf[keep[i] * N + keep[j]];
    }
  }
  return { n, K, Kg, M, keep };
}
