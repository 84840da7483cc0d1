import { brentRoot } from './brent.js';
import { WEIGHT_LENGTH, W_ALPHA_A, W_ALPHA_B, W_BETA_A, W_BETA_B, W_TAU, W_UPS, weightsInto } from './characteristicEquation.js';
import { criticalPhiFromWeights } from './criticalLoad.js';
import type { EndRestraint, Frame } from './types.js';

/**
 * First natural frequency of lateral vibration of the spring-restrained column under axial
 * compression P: EI v'''' + P v'' + m v̈ = 0, free vibration v = y(x) sin ωt. With ξ = x/L,
 * φ² = P L²/EI and λ⁴ = m ω² L⁴/EI:
 *
 *   y'''' + φ² y'' − λ⁴ y = 0,   roots s² = β² > 0 and s² = −α² with
 *   α² = (φ² + √(φ⁴ + 4λ⁴))/2,   β² = (−φ² + √(φ⁴ + 4λ⁴))/2,   α²β² = λ⁴,  α² − β² = φ²
 *
 * (Timoshenko, Young & Weaver, Vibration Problems in Engineering, 4th ed., 1974, §5.10–5.12, beam
 * with axial force). The boundary conditions are the static ones of characteristicEquation.ts (the
 * inertia is distributed, so no end term is added): y(0) = 0, y''(0) = R_A y'(0),
 * y''(1) = −R_B y'(1), and braced y(1) = 0 or sway y'''(1) + φ² y'(1) = T y(1).
 *
 * Instead of sin, cos, sinh, cosh (which become dependent as λ → 0) the solution is written in the
 * basis of the fundamental solution G (G(0) = G'(0) = G''(0) = 0, G'''(0) = 1):
 *   G = (sinh βξ/β − sin αξ/α)/(α² + β²),
 * with U₁ = G'' + φ² G (unit slope at 0) and U₂ = G' (unit curvature at 0). With the homogeneous
 * spring weights (α = R/(1+R), β = 1/(1+R), as in characteristicEquation.ts) the bottom conditions
 * leave y = t·(β_A U₁ + α_A U₂) + c·G, and the two top conditions give a 2×2 determinant D(λ)
 * that is entire in λ, has no trivial root, and at λ = 0 is the static buckling determinant.
 * Near α² + β² = 0 the G-values come from their power series (no cancellation).
 *
 * The first eigenvalue is bracketed by the Rayleigh-quotient bounds: springs and constraints only
 * raise it and compression only lowers it, so 0 < λ₁ ≤ λ₁(fixed–fixed, P = 0) = 4.7300 whenever
 * P < Pcr. D is scanned over (0, LAMBDA_MAX] (crowded toward 0 for columns near a mechanism) and the
 * first sign change is refined with Brent. P ≥ Pcr (the column has no lateral stiffness left)
 * gives λ = 0.
 */

/** Just above the fixed–fixed eigenvalue 4.730040745: an upper bound of λ₁ for any springs and P ≥ 0. */
export const LAMBDA_MAX = 4.7301;

const P_PHI2 = WEIGHT_LENGTH; // parameter layout: the spring weights, then φ²
const PARAM_LENGTH = WEIGHT_LENGTH + 1;

// scratch G, G', G'', G''' at ξ = 1 (module level: no allocation per call)
const g = new Float64Array(4);

function fundamentalValues(lambda: number, phi2: number): void {
  const l4 = lambda * lambda * lambda * lambda;
  const s = Math.sqrt(phi2 * phi2 + 4 * l4); // α² + β²
  if (s < 1) {
    // G^(j)(1) = Σ h_k / (2k + 1 − j)!, h_k = (b^k − a^k)/(b − a) with b = β², a = −α²:
    // h_0 = 0, h_1 = 1, h_k = (a + b) h_{k−1} − ab h_{k−2} = −φ² h_{k−1} + λ⁴ h_{k−2}
    let hPrev = 0;
    let h = 1;
    let g0 = 0;
    let g1 = 0;
    let g2 = 0;
    let g3 = 1; // k = 0 term of Σ h_{k+1}/(2k)!
    let f = 1; // (2k − 1)! for k = 1
    for (let k = 1; k <= 24; k++) {
      // f = (2k − 1)!
      g2 += h / f;
      g1 += h / (f * 2 * k);
      g0 += h / (f * 2 * k * (2 * k + 1));
      const hNext = -phi2 * h + l4 * hPrev;
      g3 += hNext / (f * 2 * k);
      hPrev = h;
      h = hNext;
      f *= 2 * k * (2 * k + 1);
    }
    g[0] = g0;
    g[1] = g1;
    g[2] = g2;
    g[3] = g3;
    return;
  }
  const a2 = 0.5 * (phi2 + s);
  const b2 = (2 * l4) / (phi2 + s); // = (s − φ²)/2 without cancellation
  const a = Math.sqrt(a2);
  const b = Math.sqrt(b2);
  const sa = Math.sin(a);
  const ca = Math.cos(a);
  const shb = Math.sinh(b);
  const chb = Math.cosh(b);
  g[0] = ((b > 0 ? shb / b : 1) - sa / a) / s;
  g[1] = (chb - ca) / s;
  g[2] = (b * shb + a * sa) / s;
  g[3] = (b2 * chb + a2 * ca) / s;
}

/** D(λ): zero exactly at the eigenvalues λ (p: spring weights, then φ²). No allocation. */
export function frequencyDeterminant(lambda: number, p: Float64Array): number {
  const phi2 = p[P_PHI2];
  fundamentalValues(lambda, phi2);
  const l4 = lambda * lambda * lambda * lambda;
  const [G0, G1, G2, G3] = g;
  const G4 = -phi2 * G2 + l4 * G0;
  const aA = p[W_ALPHA_A];
  const bA = p[W_BETA_A];
  // Y = β_A U₁ + α_A U₂ and its derivatives at ξ = 1
  const Y0 = bA * (G2 + phi2 * G0) + aA * G1;
  const Y1 = bA * (G3 + phi2 * G1) + aA * G2;
  const Y2 = bA * l4 * G0 + aA * G3;
  const Y3 = bA * l4 * G1 + aA * G4;
  const aB = p[W_ALPHA_B];
  const bB = p[W_BETA_B];
  const tau = p[W_TAU];
  const ups = p[W_UPS];
  const momentY = bB * Y2 + aB * Y1;
  const momentG = bB * G2 + aB * G1;
  const shearY = ups * (Y3 + phi2 * Y1) - tau * Y0;
  const shearG = ups * (G3 + phi2 * G1) - tau * G0;
  return momentY * shearG - momentG * shearY;
}

// scan points on (0, LAMBDA_MAX]: geometric toward 0, then uniform
const SCAN: Float64Array = (() => {
  const t: number[] = [];
  for (let k = 12; k >= 2; k--) t.push(LAMBDA_MAX * Math.pow(10, -k));
  for (let i = 1; i <= 64; i++) t.push((LAMBDA_MAX * i) / 64);
  return Float64Array.from(t);
})();

const params = new Float64Array(PARAM_LENGTH);

/**
 * λ₁ of the first lateral mode for restraint ratios r (R = kL/EI, T = k_T L³/EI) and
 * φ = L√(P/EI) ≥ 0; ω₁ = λ₁² √(EI/(m L⁴)). Returns 0 when P ≥ Pcr. Throws if no root is bracketed
 * (which the bounds above exclude).
 */
export function frequencyParameter(frame: Frame, r: EndRestraint, phi: number): number {
  if (!(phi >= 0 && Number.isFinite(phi))) throw new RangeError(`phi must be finite and >= 0 (got ${phi})`);
  const T = frame === 'sway' ? r.lateral ?? 0 : Infinity;
  weightsInto(params, r.bottom, r.top, T);
  if (phi >= criticalPhiFromWeights(frame, params, 1)) return 0;
  params[P_PHI2] = phi * phi;
  let xPrev = SCAN[0];
  let fPrev = frequencyDeterminant(xPrev, params);
  for (let i = 1; i < SCAN.length; i++) {
    const x = SCAN[i];
    const fx = frequencyDeterminant(x, params);
    if (fx === 0) return x;
    if (fPrev !== 0 && (fPrev > 0) !== (fx > 0)) return brentRoot(frequencyDeterminant, params, xPrev, x, fPrev, fx);
    xPrev = x;
    fPrev = fx;
  }
  throw new Error(`naturalFrequency: no eigenvalue below ${LAMBDA_MAX} (R = ${r.bottom}, ${r.top}, T = ${T}, φ = ${phi})`);
}

export interface NaturalFrequency {
  /** rad/s */
  omega: number;
  /** Hz */
  hertz: number;
  /** λ₁ in ω = λ² √(EI/(m L⁴)) */
  lambda: number;
}

/**
 * First natural frequency of lateral vibration (EI in N·m², L in m, mass per length m in kg/m,
 * axial compression P in N, restraint ratios as in criticalLoad). 0 when P ≥ Pcr.
 */
export function naturalFrequency(EI: number, L: number, massPerLength: number, P: number, frame: Frame, r: EndRestraint): NaturalFrequency {
  if (!(EI > 0 && Number.isFinite(EI))) throw new RangeError(`EI must be finite and > 0 (got ${EI})`);
  if (!(L > 0 && Number.isFinite(L))) throw new RangeError(`L must be finite and > 0 (got ${L})`);
  if (!(massPerLength > 0 && Number.isFinite(massPerLength))) throw new RangeError(`mass per length must be finite and > 0 (got ${massPerLength})`);
  if (!(P >= 0 && Number.isFinite(P))) throw new RangeError(`axial load must be finite and >= 0 (compression) (got ${P})`);
  const lambda = frequencyParameter(frame, r, L * Math.sqrt(P / EI));
  const omega = lambda * lambda * Math.sqrt(EI / (massPerLength * L * L * L * L));
  return { omega, hertz: omega / (2 * Math.PI), lambda };
}
