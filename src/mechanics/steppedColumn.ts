import { brentRoot } from './brent.js';
import { WEIGHT_LENGTH, weightsInto, W_ALPHA_A, W_ALPHA_B, W_BETA_A, W_BETA_B, W_TAU, W_UPS } from './characteristicEquation.js';
import { criticalPhi } from './criticalLoad.js';
import type { ColumnState, EndRestraint, Frame, SoundSection } from './types.js';

/**
 * Exact buckling of the spring-restrained column made of two prismatic segments (docs/mechanics.md,
 * "A stepped member"): the lower segment 0 ≤ x ≤ a with E·I₁ (a corroded zone) and the upper one
 * a < x ≤ L with E·I₂. On each segment E·I v'''' + P v'' = 0; at x = a the deflection v, the slope v',
 * the moment M = E·I v'' and the shear V = E·I v''' + P v' are continuous.
 *
 * Everything is dimensionless with the LOWER segment's stiffness: φ = L √(P/(E·I₁)), R = k L/(E·I₁),
 * T = k_T L³/(E·I₁), ρ = I₂/I₁, ζ = a/L. Over a segment of length ℓ and relative stiffness e (1 or ρ),
 * with κ = φ/√e and u = κℓ, the state (v, v', M, V) carries over exactly (transfer matrix):
 *   v₁ = v + v'·sin u/κ + M(1 − cos u)/(e κ²) + V(ℓ − sin u/κ)/(e κ²)
 *   v'₁ = v' cos u + M sin u/(e κ) + V(1 − cos u)/(e κ²)
 *   M₁ = −φ² v' sin u/κ + M cos u + V sin u/κ,     V₁ = V
 * (the general solution A sin κx + B cos κx + Cx + D written through its initial values;
 * Timoshenko & Gere, Theory of Elastic Stability, 1961, §2.9 solves the stepped column the same way).
 * The base gives v = 0 and M = R_A v', i.e. (v', M) = t(β_A, α_A) with the homogeneous weights of
 * characteristicEquation.ts; the unknowns are t and V. The top gives
 *   β_B M + α_B v' = 0   (M = −R_B v')   and   υ V − τ v = 0   (V = T v; braced: τ = 1, υ = 0).
 * The 2 × 2 determinant of these two conditions is zero exactly at the critical loads.
 */

const PI = Math.PI;
const SMALL = 0.25;

/** Parameter layout of the stepped characteristic function (see steppedChar). */
const P_RATIO = WEIGHT_LENGTH;
const P_ZONE = WEIGHT_LENGTH + 1;
const PARAM_LENGTH = WEIGHT_LENGTH + 2;

/** (1 − cos u)/u², series near 0. */
function versine2(u: number): number {
  const u2 = u * u;
  if (Math.abs(u) < SMALL) return 0.5 + u2 * (-1 / 24 + u2 * (1 / 720 + u2 * (-1 / 40320 + u2 / 3628800)));
  return (1 - Math.cos(u)) / u2;
}

/** (u − sin u)/u³, series near 0. */
function sineDefect3(u: number): number {
  const u2 = u * u;
  if (Math.abs(u) < SMALL) return 1 / 6 + u2 * (-1 / 120 + u2 * (1 / 5040 + u2 * (-1 / 362880 + u2 / 39916800)));
  return (u - Math.sin(u)) / (u2 * u);
}

function sincOf(u: number): number {
  if (Math.abs(u) < 1e-4) return 1 - (u * u) / 6;
  return Math.sin(u) / u;
}

/** Carry the state s = [v, v', M, V] over a segment of length ℓ and relative stiffness e at φ (in place). */
function carry(s: Float64Array, o: number, phi: number, e: number, l: number): void {
  const kappa = phi / Math.sqrt(e);
  const u = kappa * l;
  const S = l * sincOf(u); // sin u/κ
  const C1 = l * l * versine2(u); // (1 − cos u)/κ²
  const X = l * l * l * sineDefect3(u); // (ℓ − sin u/κ)/κ²
  const c = Math.cos(u);
  const v = s[o], t = s[o + 1], M = s[o + 2], V = s[o + 3];
  s[o] = v + t * S + (M * C1) / e + (V * X) / e;
  s[o + 1] = t * c + (M * S) / e + (V * C1) / e;
  s[o + 2] = -phi * phi * S * t + M * c + V * S;
  s[o + 3] = V;
}

/** Fill the two base states (t = 1, V = 0) and (t = 0, V = 1) into s[0..3], s[4..7]. */
function baseStates(s: Float64Array, p: Float64Array): void {
  s.fill(0);
  s[1] = p[W_BETA_A];
  s[2] = p[W_ALPHA_A];
  s[7] = 1;
}

function topRows(s: Float64Array, o: number, p: Float64Array): [number, number] {
  return [p[W_UPS] * s[o + 3] - p[W_TAU] * s[o], p[W_BETA_B] * s[o + 2] + p[W_ALPHA_B] * s[o + 1]];
}

const scratch = new Float64Array(8);

/** The characteristic function of the stepped column; p from steppedParams. Entire in φ. */
export function steppedChar(phi: number, p: Float64Array): number {
  const s = scratch;
  baseStates(s, p);
  const rho = p[P_RATIO];
  const a = p[P_ZONE];
  carry(s, 0, phi, 1, a);
  carry(s, 0, phi, rho, 1 - a);
  carry(s, 4, phi, 1, a);
  carry(s, 4, phi, rho, 1 - a);
  // top conditions (hot: written out, no tuples)
  const tau = p[W_TAU], ups = p[W_UPS], aB = p[W_ALPHA_B], bB = p[W_BETA_B];
  const r1a = ups * s[3] - tau * s[0];
  const r2a = bB * s[2] + aB * s[1];
  const r1b = ups * s[7] - tau * s[4];
  const r2b = bB * s[6] + aB * s[5];
  return r1a * r2b - r1b * r2a;
}

/** The stepped member: ρ = I₂/I₁ (upper over lower segment) and ζ = a/L, the lower segment's share of the length. */
export interface SteppedMember {
  ratio: number;
  zone: number;
}

function steppedParams(frame: Frame, r: EndRestraint, m: SteppedMember): Float64Array {
  const p = new Float64Array(PARAM_LENGTH);
  weightsInto(p, r.bottom, r.top, frame === 'sway' ? r.lateral ?? 0 : Infinity);
  p[P_RATIO] = m.ratio;
  p[P_ZONE] = m.zone;
  return p;
}

function checkMember(m: SteppedMember): void {
  if (!(m.ratio > 0 && Number.isFinite(m.ratio))) throw new RangeError(`stiffness ratio I2/I1 must be finite and > 0 (got ${m.ratio})`);
  if (!(m.zone >= 0 && m.zone <= 1)) throw new RangeError(`zone share a/L must be in [0, 1] (got ${m.zone})`);
}

/** The prismatic member of stiffness ρ·E·I₁ throughout, its φ referred to E·I₁. */
function upperThroughout(frame: Frame, r: EndRestraint, rho: number): number {
  const scaled: EndRestraint = { bottom: r.bottom / rho, top: r.top / rho, ...(r.lateral !== undefined ? { lateral: r.lateral / rho } : {}) };
  return Math.sqrt(rho) * criticalPhi(frame, scaled);
}

const SCAN_STEP = PI / 16;

/**
 * φ = L √(Pcr/(E·I₁)) of the lowest mode of the stepped column; 0 for a mechanism. A zone of no
 * length (ζ = 0), the whole length (ζ = 1) or equal stiffness (ρ = 1) is the prismatic column, solved
 * by the prismatic solver itself. Otherwise the root lies between the two prismatic columns of
 * stiffness E·I₁ and E·I₂ throughout (more stiffness anywhere cannot lower Pcr: the Rayleigh quotient);
 * the interval is scanned from just below the lower one in steps of π/16 for the first change of sign,
 * then refined by Brent's method.
 */
export function steppedCriticalPhi(frame: Frame, r: EndRestraint, m: SteppedMember): number {
  checkMember(m);
  if (m.zone === 1 || m.ratio === 1) return criticalPhi(frame, r);
  if (m.zone === 0) return upperThroughout(frame, r, m.ratio);
  const lower = criticalPhi(frame, r);
  const upper = upperThroughout(frame, r, m.ratio);
  if (lower === 0 && upper === 0) return 0; // a sway mechanism whatever the stiffness
  const lo = Math.min(lower, upper) * (1 - 1e-3);
  const hi = Math.max(lower, upper) * (1 + 1e-3);
  const p = steppedParams(frame, r, m);
  const step = Math.min(SCAN_STEP, (hi - lo) / 4);
  let x0 = lo;
  let f0 = steppedChar(x0, p);
  if (f0 === 0) return x0;
  for (;;) {
    const x1 = Math.min(hi, x0 + step);
    const f1 = steppedChar(x1, p);
    if (f1 === 0) return x1;
    if ((f1 > 0) !== (f0 > 0)) return brentRoot(steppedChar, p, x0, x1, f0, f1);
    if (x1 >= hi) break;
    x0 = x1;
    f0 = f1;
  }
  throw new Error('steppedCriticalPhi: no root between the bounds of the two prismatic columns');
}

/** Critical load (N) of the stepped column; EI1 = E·I₁ of the lower segment, R referred to it. */
export function steppedCriticalLoad(EI1: number, L: number, frame: Frame, r: EndRestraint, m: SteppedMember): { Pcr: number; phi: number; K: number } {
  if (!(EI1 > 0 && Number.isFinite(EI1))) throw new RangeError(`EI must be finite and > 0 (got ${EI1})`);
  if (!(L > 0 && Number.isFinite(L))) throw new RangeError(`L must be finite and > 0 (got ${L})`);
  const phi = steppedCriticalPhi(frame, r, m);
  return { Pcr: (phi * phi * EI1) / (L * L), phi, K: phi === 0 ? Infinity : PI / phi };
}

/** The first mode of the stepped column at its root φ. */
export interface SteppedMode {
  readonly phi: number;
  /** w(ξ), ξ = x/L, normalised so that the largest |w| is +1 (deviation from the vertical through the base) */
  sample(xi: number): number;
  /** dw/dξ of the same normalised shape */
  slope(xi: number): number;
  /** M(ξ)/(Pcr · max|w|): the bending moment of the mode per unit of axial load and bow amplitude */
  moment(xi: number): number;
  /** max over the lower segment of |M|/(Pcr max|w|): the curvature factor of the zone */
  readonly zoneFactor: number;
  /** the same over the upper segment */
  readonly upperFactor: number;
  /**
   * moment(ξ) on each segment as a sinusoid of its own: for `from` ≤ ξ ≤ `from` + `length`,
   * moment(ξ) = cos·cos(κ(ξ − from)) + sin·sin(κ(ξ − from)), κ = φ/√(I/I₁) (the lower segment first)
   */
  readonly segments: readonly ModeSegment[];
}

/** One segment of the stepped mode's moment (see SteppedMode.segments). */
export interface ModeSegment {
  readonly from: number;
  readonly length: number;
  readonly kappa: number;
  readonly cos: number;
  readonly sin: number;
}

/** Candidate u ∈ [0, uEnd] where c0 + p cos u + q sin u = 0 (closed form). */
function sinusoidZeros(c0: number, p: number, q: number, uEnd: number, out: number[]): void {
  const amp = Math.hypot(p, q);
  if (!(amp > 0) || Math.abs(c0) > amp) return;
  const gamma = Math.atan2(q, p);
  const d = Math.acos(-c0 / amp);
  for (const base of [gamma + d, gamma - d]) {
    let u = base % (2 * PI);
    if (u < 0) u += 2 * PI;
    for (; u <= uEnd; u += 2 * PI) out.push(u);
  }
}

/**
 * The first mode at φ (a root of steppedChar, from steppedCriticalPhi). The largest deflection and the
 * largest moment of each segment are found in closed form: the slope and the moment are sinusoids
 * plus a constant on each segment. φ = 0 (a mechanism) gives the rigid tilt with no moment.
 */
export function steppedMode(frame: Frame, r: EndRestraint, m: SteppedMember, phi: number): SteppedMode {
  checkMember(m);
  if (!(phi >= 0 && Number.isFinite(phi))) throw new RangeError(`phi must be finite and >= 0 (got ${phi})`);
  if (phi === 0) return { phi, sample: (xi) => xi, slope: () => 1, moment: () => 0, zoneFactor: 0, upperFactor: 0, segments: [] };
  const p = steppedParams(frame, r, m);
  const s = new Float64Array(8);
  baseStates(s, p);
  const a = m.zone;
  const rho = m.ratio;
  for (const o of [0, 4]) {
    carry(s, o, phi, 1, a);
    carry(s, o, phi, rho, 1 - a);
  }
  // null vector of the 2 × 2 top conditions, from the row with the larger entries
  const [r1a, r2a] = topRows(s, 0, p);
  const [r1b, r2b] = topRows(s, 4, p);
  const useFirst = Math.abs(r1a) + Math.abs(r1b) >= Math.abs(r2a) + Math.abs(r2b);
  const t = useFirst ? r1b : r2b;
  const V = useFirst ? -r1a : -r2a;
  const base = Float64Array.from([0, t * p[W_BETA_A], t * p[W_ALPHA_A], V]);
  const atZone = Float64Array.from(base);
  carry(atZone, 0, phi, 1, a);
  const state = new Float64Array(4);
  /** raw state at ξ */
  const at = (xi: number): Float64Array => {
    if (xi <= a) {
      state.set(base);
      carry(state, 0, phi, 1, xi);
    } else {
      state.set(atZone);
      carry(state, 0, phi, rho, xi - a);
    }
    return state;
  };
  // candidates for the largest |w| and |M| on each segment: ends and stationary points
  const wAt: number[] = [0, a, 1];
  const mLower: number[] = [0, a];
  const mUpper: number[] = [a, 1];
  const segments: [Float64Array, number, number, number, number[]][] = [
    [base, 1, 0, a, mLower],
    [atZone, rho, a, 1 - a, mUpper],
  ];
  for (const [s0, e, x0, l, mList] of segments) {
    if (!(l > 0)) continue;
    const kappa = phi / Math.sqrt(e);
    const uEnd = kappa * l;
    const phi2 = phi * phi;
    const [, t0, M0, V0] = s0;
    // v' = V/φ² + (v'₀ − V/φ²) cos u + M₀/(eκ) sin u
    const slopeZeros: number[] = [];
    sinusoidZeros(V0 / phi2, t0 - V0 / phi2, M0 / (e * kappa), uEnd, slopeZeros);
    for (const u of slopeZeros) wAt.push(x0 + u / kappa);
    // M = M₀ cos u + ((V − φ² v'₀)/κ) sin u, stationary where −M₀ sin u + q cos u = 0
    const q = (V0 - phi2 * t0) / kappa;
    const momentZeros: number[] = [];
    sinusoidZeros(0, q, -M0, uEnd, momentZeros);
    for (const u of momentZeros) mList.push(x0 + u / kappa);
  }
  let wMax = 0;
  for (const xi of wAt) {
    const v = at(Math.min(1, Math.max(0, xi)))[0];
    if (Math.abs(v) > Math.abs(wMax)) wMax = v;
  }
  if (wMax === 0) throw new Error('steppedMode: the mode has no deflection');
  const scaleM = phi * phi * wMax; // M/(Pcr max|w|) in units of E·I₁/L² over φ²·E·I₁/L²
  const maxMoment = (list: number[]): number => {
    let mx = 0;
    for (const xi of list) mx = Math.max(mx, Math.abs(at(Math.min(1, Math.max(0, xi)))[2]));
    return mx / Math.abs(scaleM);
  };
  const zoneFactor = a > 0 ? maxMoment(mLower) : 0;
  const upperFactor = a < 1 ? maxMoment(mUpper) : 0;
  // M(u) = M₀ cos u + (V₀ − φ² v'₀) sin u/κ over a segment (carry), u = κ·(ξ − from)
  const segment = (s0: Float64Array, e: number, from: number, length: number): ModeSegment => {
    const kappa = phi / Math.sqrt(e);
    return { from, length, kappa, cos: s0[2] / scaleM, sin: (s0[3] - phi * phi * s0[1]) / (kappa * scaleM) };
  };
  return {
    phi,
    sample: (xi) => at(xi)[0] / wMax,
    slope: (xi) => at(xi)[1] / wMax,
    moment: (xi) => at(xi)[2] / scaleM,
    zoneFactor,
    upperFactor,
    segments: [segment(base, 1, 0, a), segment(atZone, rho, a, 1 - a)],
  };
}

/**
 * The stepped member of a column state with a corroded zone (A, I, S of `s` over the lowest sound.from,
 * `sound` above): ρ and ζ, its critical load, K and first mode, R referred to E·I of the zone.
 */
export function steppedMemberOf(s: ColumnState, sound: SoundSection): { member: SteppedMember; Pcr: number; phi: number; K: number; mode: SteppedMode } {
  const member: SteppedMember = { ratio: sound.I / s.I, zone: Math.min(1, Math.max(0, sound.from / s.L)) };
  const { Pcr, phi, K } = steppedCriticalLoad(s.E * s.I, s.L, s.frame, s.r, member);
  return { member, Pcr, phi, K, mode: steppedMode(s.frame, s.r, member, phi) };
}
