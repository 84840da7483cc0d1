import { brentRoot } from './brent.js';
import { firstInteriorRoot, interiorScale } from './bracket.js';
import {
  W_P, W_Q, W_S, W_TAU, W_UPS, WEIGHT_LENGTH,
  bracedChar, bracedCharAtMultipleOfPi, fixedFixedAntisymmetric, lateralChar, swayChar,
  swayCharAtMultipleOfPi, weightsInto,
} from './characteristicEquation.js';
import type { CriticalLoadResult, EndRestraint, Frame } from './types.js';

/**
 * Exact critical loads of the spring-restrained column (characteristic equations in
 * characteristicEquation.ts). Brackets come from interlacing: the n-th root lies in
 *   braced:            [nπ, (n+1)π]        (between pinned–pinned and fixed–fixed)
 *   sway, T = 0:       [(n−1)π, nπ]        (between the free mechanism and fixed–guided)
 *   sway, 0 < T < ∞:   [φ_n(sway, T=0), φ_n(braced)]   (a rank-one stiffening between the two)
 * and in each there is exactly one root of that problem, so the lowest-mode solve is one Brent
 * refinement on a bracket whose end values are known exactly. Never an unbracketed step; an
 * unconverged or unbracketed root throws.
 */

const PI = Math.PI;
const fixedFixedFn = (x: number): number => fixedFixedAntisymmetric(x);

/** n-th braced root φ (n ≥ 1). */
export function bracedPhi(w: Float64Array, n: number): number {
  if (w[W_Q] === 0) {
    if (w[W_P] === 0) return n * PI; // pinned–pinned: sin φ = 0
    // fixed–fixed: 4 sin(φ/2)[sin(φ/2) − (φ/2)cos(φ/2)] = 0
    if (n % 2 === 1) return (n + 1) * PI;
    const j = n / 2;
    const lo = j * PI;
    const hi = (j + 0.5) * PI;
    const flo = -lo * (j % 2 === 0 ? 1 : -1);
    const fhi = j % 2 === 0 ? 1 : -1;
    return 2 * brentRoot(fixedFixedFn, w, lo, hi, flo, fhi);
  }
  return brentRoot(bracedChar, w, n * PI, (n + 1) * PI, bracedCharAtMultipleOfPi(n, w), bracedCharAtMultipleOfPi(n + 1, w));
}

/** n-th sway root φ with no lateral spring (n ≥ 1); 0 for the mechanism's first mode. */
export function swayPhi(w: Float64Array, n: number): number {
  if (w[W_Q] === 0) {
    if (w[W_P] === 0) return (n - 1) * PI; // both pinned: rigid tilt (φ = 0), then sin φ = 0
    if (w[W_S] === 0) return n * PI; // both fixed: sin φ = 0
  }
  return brentRoot(swayChar, w, (n - 1) * PI, n * PI, swayCharAtMultipleOfPi(n - 1, w), swayCharAtMultipleOfPi(n, w));
}

/** n-th sway root with a lateral spring T = τ/υ at the top. */
export function lateralPhi(w: Float64Array, n: number): number {
  if (w[W_TAU] === 0) return swayPhi(w, n);
  if (w[W_UPS] === 0) return bracedPhi(w, n);
  if (w[W_P] === 0 && w[W_Q] === 0) {
    // both ends pinned: modes are the rigid tilt φ² = T and the pinned–pinned modes sin φ = 0
    const tilt = Math.sqrt(w[W_TAU] / w[W_UPS]);
    const below = Math.floor(tilt / PI);
    if (n <= below) return n * PI;
    return n === below + 1 ? tilt : (n - 1) * PI;
  }
  const lo = swayPhi(w, n);
  const hi = bracedPhi(w, n);
  if (hi - lo <= 1e-14 * hi) return lo;
  const r = firstInteriorRoot(lateralChar, w, lo, hi);
  if (!Number.isNaN(r)) return r;
  // No interior root: the mode coincides with an endpoint that is a root of both the sway and the
  // braced equations (e.g. the symmetric braced mode of equal springs, which has no end shear).
  const scale = interiorScale(lateralChar, w, lo, hi);
  const flo = Math.abs(lateralChar(lo, w));
  const fhi = Math.abs(lateralChar(hi, w));
  const tol = 1e-7 * scale;
  if (flo <= tol && flo <= fhi) return lo;
  if (fhi <= tol) return hi;
  throw new Error(`criticalLoad: could not bracket sway mode ${n} with a lateral spring`);
}

/** φ of mode n for prepared weights (see weightsInto). No allocation. */
export function criticalPhiFromWeights(frame: Frame, w: Float64Array, n: number): number {
  return frame === 'braced' ? bracedPhi(w, n) : lateralPhi(w, n);
}

/** Weights for a frame and restraint (lateral is ignored for braced frames). */
export function restraintWeights(frame: Frame, r: EndRestraint): Float64Array {
  const T = frame === 'sway' ? r.lateral ?? 0 : 0;
  return weightsInto(new Float64Array(WEIGHT_LENGTH), r.bottom, r.top, T);
}

/** φ = L√(P/EI) of mode `mode` (1 = lowest); 0 for a sway mechanism. */
export function criticalPhi(frame: Frame, r: EndRestraint, mode = 1): number {
  if (!(Number.isInteger(mode) && mode >= 1)) throw new RangeError(`mode must be an integer >= 1 (got ${mode})`);
  return criticalPhiFromWeights(frame, restraintWeights(frame, r), mode);
}

/**
 * Elastic critical load of mode `mode` of a prismatic column (EI in N·m², L in m).
 * r.bottom, r.top: R = kL/EI (0 pinned … Infinity fixed); r.lateral: T = kT L³/EI (sway only).
 * A sway column with both ends pinned and no lateral spring is a mechanism: Pcr = 0, K = Infinity.
 */
export function criticalLoad(EI: number, L: number, frame: Frame, r: EndRestraint, mode = 1): CriticalLoadResult {
  if (!(EI > 0 && Number.isFinite(EI))) throw new RangeError(`EI must be finite and > 0 (got ${EI})`);
  if (!(L > 0 && Number.isFinite(L))) throw new RangeError(`L must be finite and > 0 (got ${L})`);
  const phi = criticalPhi(frame, r, mode);
  return { Pcr: (phi * phi * EI) / (L * L), phi, K: phi === 0 ? Infinity : PI / phi };
}
