import { WEIGHT_LENGTH, weightsInto } from './characteristicEquation.js';
import { criticalPhi } from './criticalLoad.js';
import {
  EXTREMA_LENGTH, EX_MAX_G, EX_MAX_G_AT, EX_MAX_W_AT, EX_W_AT_MAX, curvatureFactorFromExtrema, modeExtremaInto,
} from './curvatureFactor.js';
import { modeCoefficientsInto } from './modeCoefficients.js';
import type { EndRestraint, Frame, ModeShape } from './types.js';

const EDGE = 1e-9;

/**
 * Buckled shape at a root φ of the characteristic equation (from criticalLoad/criticalPhi), in closed
 * form w = A sin φξ + B cos φξ + Cξ + D (ξ = x/L) from the null vector of the boundary-condition matrix.
 * Normalised so that the largest |w| is +1. Braced: w is the deviation from the chord (both ends stay
 * on it); sway: the deviation from the vertical through the base (w(0) = 0, w(1) = drift).
 * w'' is a pure sinusoid, so its zeros (inflection points) are found in closed form: θ = kπ − γ.
 * φ = 0 (a sway mechanism) gives the rigid tilt w = ξ with no curvature (c = 0).
 */
export function modeShape(frame: Frame, r: EndRestraint, phi: number): ModeShape {
  if (!(phi >= 0 && Number.isFinite(phi))) throw new RangeError(`phi must be finite and >= 0 (got ${phi})`);
  if (phi === 0) return rigidTilt(frame);
  const w = weightsInto(new Float64Array(WEIGHT_LENGTH), r.bottom, r.top, frame === 'sway' ? r.lateral ?? 0 : 0);
  const abc = modeCoefficientsInto(new Float64Array(3), frame, w, phi);
  const ex = modeExtremaInto(new Float64Array(EXTREMA_LENGTH), abc[0], abc[1], abc[2], phi);
  const scale = ex[EX_W_AT_MAX];
  const A = abc[0] / scale;
  const B = abc[1] / scale;
  const C = abc[2] / scale;
  const zeros = curvatureZerosOf(A, B, phi);
  const inside = zeros.filter((x) => x > EDGE && x < 1 - EDGE);
  const fromInflections = zeros.length >= 2;
  const effectiveLength = fromInflections ? zeros[1] - zeros[0] : Math.PI / phi;
  return {
    frame,
    phi,
    A,
    B,
    C,
    D: -B,
    sample: (xi: number) => A * Math.sin(phi * xi) + B * Math.cos(phi * xi) + C * xi - B,
    curvature: (xi: number) => -phi * phi * (A * Math.sin(phi * xi) + B * Math.cos(phi * xi)),
    maxDeflectionAt: ex[EX_MAX_W_AT],
    maxCurvature: (phi * phi * ex[EX_MAX_G]) / Math.abs(scale),
    maxCurvatureAt: ex[EX_MAX_G_AT],
    curvatureFactor: curvatureFactorFromExtrema(ex),
    inflectionPoints: inside,
    curvatureZeros: zeros,
    effectiveLength,
    effectiveLengthFromInflections: fromInflections,
  };
}

/** ξ ∈ [0, 1] where A sin φξ + B cos φξ = 0, increasing (ends included within 1e-9). */
function curvatureZerosOf(A: number, B: number, phi: number): number[] {
  const out: number[] = [];
  if (A === 0 && B === 0) return out;
  let t = -Math.atan2(B, A) % Math.PI;
  if (t < 0) t += Math.PI;
  // a zero a hair below θ = 0 (rounding) belongs to the bottom end
  if (Math.PI - t <= EDGE * phi) t -= Math.PI;
  for (; t <= phi * (1 + EDGE); t += Math.PI) {
    out.push(Math.min(1, Math.max(0, t / phi)));
  }
  return out;
}

function rigidTilt(frame: Frame): ModeShape {
  return {
    frame,
    phi: 0,
    A: 0,
    B: 0,
    C: 1,
    D: 0,
    sample: (xi: number) => xi,
    curvature: () => 0,
    maxDeflectionAt: 1,
    maxCurvature: 0,
    maxCurvatureAt: 0,
    curvatureFactor: 0,
    inflectionPoints: [],
    curvatureZeros: [],
    effectiveLength: Infinity,
    effectiveLengthFromInflections: false,
  };
}

/** Curvature factor c of mode `mode` (docs/mechanics.md); 0 for a mechanism. */
export function modeCurvatureFactor(frame: Frame, r: EndRestraint, mode = 1): number {
  return modeShape(frame, r, criticalPhi(frame, r, mode)).curvatureFactor;
}
