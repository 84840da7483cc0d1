/**
 * Characteristic equations of a prismatic column with rotational end springs (R_A bottom, R_B top)
 * and, in sway, a translational spring T at the top. Unknown φ = L √(P/EI).
 *
 * Deflection y = A sin φξ + B cos φξ + Cξ + D (ξ = x/L) solves EI y'''' + P y'' = 0. Boundary conditions
 * (natural conditions of the energy ½∫EI y''² − ½P∫y'² + ½k_A y'(0)² + ½k_B y'(L)² + ½k_T y(L)²):
 *   y(0) = 0,  y''(0) = R_A y'(0),  y''(1) = −R_B y'(1),
 *   braced: y(1) = 0;   sway: y'''(1) + φ² y'(1) = T y(1)  ⇔  φ² C = T y(1).
 * Expanding the determinant (checked symbolically) gives, with Δb and Δs as in docs/verification.md §M2
 * (Timoshenko & Gere 1961 ch. 2; Chen & Lui 1987 §2.3):
 *   Δb = R_A R_B [2(1 − cos φ) − φ sin φ] + (R_A + R_B) φ (sin φ − φ cos φ) + φ³ sin φ
 *   Δs = (R_A R_B − φ²) sin φ + (R_A + R_B) φ cos φ
 *   with a lateral spring:  T Δb + φ³ Δs = 0.
 * Limits confirm the sign of T: T = 0 gives Δs (plain sway), T → ∞ gives Δb (braced), and with both
 * ends pinned it factorises as φ³ sin φ (T − φ²), i.e. the rigid tilt P = k_T L.
 *
 * Infinite springs are handled exactly by homogeneous weights: R = α/β with α = R/(1+R), β = 1/(1+R)
 * (R = ∞ ⇒ α = 1, β = 0), and T = τ/υ likewise. Then, with P = α_Aα_B, Q = α_Aβ_B + β_Aα_B, S = β_Aβ_B,
 * the pole-free, trivial-root-free forms used for root finding are
 *   Hb(φ) = Δb/φ⁴ = P e1(φ) + Q e2(φ) + S sinc φ
 *   Hs(φ) = Δs/φ  = (P − S φ²) sinc φ + Q cos φ
 *   Ht(φ) = τ Hb + υ Hs
 * with e1 = (2(1 − cos φ) − φ sin φ)/φ⁴ and e2 = (sin φ − φ cos φ)/φ³ (series near 0). All are entire in φ.
 */

/** Parameter layout of the weight vector used by the characteristic functions. */
export const W_ALPHA_A = 0;
export const W_BETA_A = 1;
export const W_ALPHA_B = 2;
export const W_BETA_B = 3;
export const W_TAU = 4;
export const W_UPS = 5;
export const W_P = 6;
export const W_Q = 7;
export const W_S = 8;
export const WEIGHT_LENGTH = 9;

function alphaOf(R: number): number {
  return R === Infinity ? 1 : R / (1 + R);
}
function betaOf(R: number): number {
  return R === Infinity ? 0 : 1 / (1 + R);
}

/** Fill w (length WEIGHT_LENGTH) with the homogeneous weights of (R_A, R_B, T). No allocation. */
export function weightsInto(w: Float64Array, RA: number, RB: number, T: number): Float64Array {
  if (!(RA >= 0) || !(RB >= 0) || !(T >= 0)) throw new RangeError(`restraint ratios must be >= 0 (got ${RA}, ${RB}, ${T})`);
  const aA = alphaOf(RA);
  const bA = betaOf(RA);
  const aB = alphaOf(RB);
  const bB = betaOf(RB);
  w[W_ALPHA_A] = aA;
  w[W_BETA_A] = bA;
  w[W_ALPHA_B] = aB;
  w[W_BETA_B] = bB;
  w[W_TAU] = alphaOf(T);
  w[W_UPS] = betaOf(T);
  w[W_P] = aA * aB;
  w[W_Q] = aA * bB + bA * aB;
  w[W_S] = bA * bB;
  return w;
}

const SMALL = 0.25;

/** (2(1 − cos φ) − φ sin φ)/φ⁴; Σ_{k≥2} (−1)^{k+1}(2 − 2k) φ^{2k−4}/(2k)! near 0. */
export function e1(phi: number): number {
  const x2 = phi * phi;
  if (Math.abs(phi) < SMALL) {
    return 1 / 12 + x2 * (-1 / 180 + x2 * (1 / 6720 + x2 * (-1 / 453600 + x2 * (1 / 47900160))));
  }
  return (2 * (1 - Math.cos(phi)) - phi * Math.sin(phi)) / (x2 * x2);
}

/** (sin φ − φ cos φ)/φ³; Σ_{k≥1} (−1)^{k+1} 2k φ^{2k−2}/(2k+1)! near 0. */
export function e2(phi: number): number {
  const x2 = phi * phi;
  if (Math.abs(phi) < SMALL) {
    return 1 / 3 + x2 * (-1 / 30 + x2 * (1 / 840 + x2 * (-1 / 45360 + x2 * (1 / 3991680))));
  }
  return (Math.sin(phi) - phi * Math.cos(phi)) / (x2 * phi);
}

export function sinc(phi: number): number {
  if (Math.abs(phi) < 1e-4) return 1 - (phi * phi) / 6;
  return Math.sin(phi) / phi;
}

/** Braced: Δb/φ⁴. */
export function bracedChar(phi: number, w: Float64Array): number {
  return w[W_P] * e1(phi) + w[W_Q] * e2(phi) + w[W_S] * sinc(phi);
}

/** Sway, no lateral spring: Δs/φ. */
export function swayChar(phi: number, w: Float64Array): number {
  const P = w[W_P];
  const S = w[W_S];
  return (P - S * phi * phi) * sinc(phi) + w[W_Q] * Math.cos(phi);
}

/** Sway with lateral spring: τ Δb/φ⁴ + υ Δs/φ  (∝ (T Δb + φ³ Δs)/φ⁴). */
export function lateralChar(phi: number, w: Float64Array): number {
  return w[W_TAU] * bracedChar(phi, w) + w[W_UPS] * swayChar(phi, w);
}

/** Hb at φ = mπ exactly (sin = 0, cos = ±1), m ≥ 1: avoids the rounding of sin(mπ) dominating tiny R terms. */
export function bracedCharAtMultipleOfPi(m: number, w: Float64Array): number {
  const sgn = m % 2 === 0 ? 1 : -1;
  const x = m * Math.PI;
  const x2 = x * x;
  return w[W_P] * ((2 * (1 - sgn)) / (x2 * x2)) + w[W_Q] * (-sgn / x2);
}

/** Hs at φ = mπ exactly, m ≥ 0. */
export function swayCharAtMultipleOfPi(m: number, w: Float64Array): number {
  if (m === 0) return w[W_P] + w[W_Q];
  return w[W_Q] * (m % 2 === 0 ? 1 : -1);
}

/** sin x − x cos x: the antisymmetric fixed–fixed factor (roots at x = φ/2). */
export function fixedFixedAntisymmetric(x: number): number {
  return Math.sin(x) - x * Math.cos(x);
}
