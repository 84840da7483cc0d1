import { maxAbsTwoSinusoids } from './beamColumn.js';
import { brentRoot } from './brent.js';
import { SMALL_LOAD } from './eccentricFirstYield.js';
import { steppedMemberOf, type SteppedMode } from './steppedColumn.js';
import type { ColumnState, EndRestraint, Frame, SoundSection } from './types.js';

/**
 * Second-order elastic solution of the stepped, spring-restrained beam-column (docs/beam-column.md,
 * "A stepped member under end couples and transverse actions"): a lower segment 0 ≤ ξ ≤ ζ of stiffness
 * E·I₁ (a corroded zone) and an upper one of E·I₂ = ρ·E·I₁, under an axial load P with end couples
 * P·e_B, P·e_T, a uniform line load w along the height and a force H at the top of a sway column, plus
 * the bow affine to the stepped first mode.
 *
 * Everything is referred to the lower segment, as in steppedColumn.ts: φ = L√(P/(E·I₁)), R = kL/(E·I₁),
 * T = k_T L³/(E·I₁); segment i has the relative stiffness e_i (1, ρ) and κ_i = φ/√e_i. On each segment,
 * with σ the distance from its start (in units of L),
 *   v_i(σ) = A_i sin κ_iσ + B_i cos κ_iσ + C_iσ + D_i + qσ²/2,   q = wL²/P
 * solves e_i v'''' + φ² v'' = q φ² (the particular part does not depend on the stiffness). Eight
 * conditions fix the eight coefficients:
 *   base      v(0) = 0;  R v'(0) − v''(0) = φ² e_B                  (M(0) = P e_B − kθ(0))
 *   step ζ    v, v', e·v'' (the moment) and e·v''' (with v', the shear) continuous
 *   top       R_T v'(1) + ρ v''(1) = −φ² e_T                        (M(L) = P e_T + kθ(L))
 *             braced v(1) = 0;  sway φ²(C₂ + q(1 − ζ)) = T v(1) − φ² h,  h = HL/P
 * (each spring row in the a = 1/(1+R), b = R/(1+R) form of beamColumn.ts, so R = ∞ needs no special case).
 * The moment is M = −E·I v''/L² = P(A_i sin κ_iσ + B_i cos κ_iσ) − E·I_i w/P on segment i; with ζ = 0, 1 or
 * ρ = 1 every row is the prismatic column's of beamColumn.ts.
 * Bow (as for the prismatic column, mechanics/endSpringMoments.ts): the stepped first mode amplified by
 * 1/(1 − P/Pcr), its moment Pcr·a·m(ξ) with m the mode's moment per unit (SteppedMode.segments), put on
 * whichever side gives the larger value.
 */

/** The stepped member under its actions (load-independent data); moments about one axis. */
export interface SteppedBeamColumn {
  frame: Frame;
  /** R and T referred to E·I₁ of the lower segment */
  r: EndRestraint;
  L: number;
  /** E·I₁ of the lower segment (N·m²) */
  EI1: number;
  /** I₂/I₁ */
  ratio: number;
  /** ζ = a/L, the lower segment's share of the length */
  zone: number;
  /** end eccentricities (m; an applied end moment M enters as M/P) */
  eB: number;
  eT: number;
  /** line load and top force per unit axial load as lengths: q = (w/P) L², h = (H/P) L (m) */
  q: number;
  h: number;
  /** |e0| of the bow (m) */
  bow: number;
  /** critical load of the stepped member (N) and its first mode */
  Pcr: number;
  mode: SteppedMode;
}

/** Rows of the 8 × 9 augmented system, written into m (72 entries). Unknowns A₁ B₁ C₁ D₁ A₂ B₂ C₂ D₂. */
function fillSystem(m: Float64Array, c: SteppedBeamColumn, phi: number): void {
  m.fill(0);
  const { r, eB, eT, q, h } = c;
  const zeta = c.zone;
  const lambda = 1 - zeta;
  const e2 = c.ratio;
  const p2 = phi * phi;
  const k1 = phi;
  const k2 = phi / Math.sqrt(e2);
  const aB = 1 / (1 + r.bottom);
  const bB = r.bottom === Infinity ? 1 : r.bottom / (1 + r.bottom);
  const aT = 1 / (1 + r.top);
  const bT = r.top === Infinity ? 1 : r.top / (1 + r.top);
  const row = (i: number, values: readonly number[], rhs: number): void => {
    for (let j = 0; j < 8; j++) m[i * 9 + j] = values[j];
    m[i * 9 + 8] = rhs;
  };
  // base
  row(0, [0, 1, 0, 1, 0, 0, 0, 0], 0);
  row(1, [bB * k1, aB * p2, bB, 0, 0, 0, 0, 0], aB * p2 * eB + aB * q);
  // the step at ζ (segment 1 at σ = ζ, segment 2 at σ = 0)
  const s1 = Math.sin(k1 * zeta), c1 = Math.cos(k1 * zeta);
  row(2, [s1, c1, zeta, 1, 0, -1, 0, -1], -0.5 * q * zeta * zeta);
  row(3, [k1 * c1, -k1 * s1, 1, 0, -k2, 0, -1, 0], -q * zeta);
  // e·v'': −φ²(A₁ s + B₁ c) + q (segment 1) = −φ² B₂ + e₂ q (segment 2)
  row(4, [-p2 * s1, -p2 * c1, 0, 0, 0, p2, 0, 0], (e2 - 1) * q);
  // e·v''': φ² κ₁ (−A₁ c + B₁ s) = −φ² κ₂ A₂
  row(5, [-k1 * c1, k1 * s1, 0, 0, k2, 0, 0, 0], 0);
  // top (segment 2 at σ = λ)
  const s2 = Math.sin(k2 * lambda), c2 = Math.cos(k2 * lambda);
  row(6, [0, 0, 0, 0, bT * k2 * c2 - aT * p2 * s2, -bT * k2 * s2 - aT * p2 * c2, bT, 0], -aT * p2 * eT - bT * q * lambda - aT * e2 * q);
  if (c.frame === 'braced') {
    row(7, [0, 0, 0, 0, s2, c2, lambda, 1], -0.5 * q * lambda * lambda);
  } else {
    const T = r.lateral ?? 0;
    const aL = 1 / (1 + T);
    const bL = T === Infinity ? 1 : T / (1 + T);
    row(7, [0, 0, 0, 0, -bL * s2, -bL * c2, aL * p2 - bL * lambda, -bL], -aL * p2 * h - aL * p2 * q * lambda + 0.5 * bL * q * lambda * lambda);
  }
}

/** Gaussian elimination with partial pivoting of the 8 × 9 system in m; the solution to out[0..7]. */
function solve8(m: Float64Array, out: Float64Array): void {
  const n = 8;
  for (let col = 0; col < n; col++) {
    let piv = col;
    for (let i = col + 1; i < n; i++) if (Math.abs(m[i * 9 + col]) > Math.abs(m[piv * 9 + col])) piv = i;
    if (piv !== col) {
      for (let k = 0; k < 9; k++) {
        const t = m[col * 9 + k];
        m[col * 9 + k] = m[piv * 9 + k];
        m[piv * 9 + k] = t;
      }
    }
    const d = m[col * 9 + col];
    for (let i = col + 1; i < n; i++) {
      const f = m[i * 9 + col] / d;
      if (f === 0) continue;
      for (let k = col; k < 9; k++) m[i * 9 + k] -= f * m[col * 9 + k];
    }
  }
  for (let i = n - 1; i >= 0; i--) {
    let t = m[i * 9 + 8];
    for (let k = i + 1; k < n; k++) t -= m[i * 9 + k] * out[k];
    out[i] = t / m[i * 9 + i];
  }
}

/** Scratch of steppedMaxMoments (no allocation per call). */
export interface SteppedScratch {
  system: Float64Array;
  coefficients: Float64Array;
  at: Float64Array;
}

export function steppedScratch(): SteppedScratch {
  return { system: new Float64Array(72), coefficients: new Float64Array(8), at: new Float64Array(1) };
}

/** φ at P, with the coefficients A₁ … D₂ solved into scratch.coefficients. */
function solveAt(c: SteppedBeamColumn, P: number, scratch: SteppedScratch): number {
  const phi = c.L * Math.sqrt(P / c.EI1);
  fillSystem(scratch.system, c, phi);
  solve8(scratch.system, scratch.coefficients);
  return phi;
}

/**
 * The largest |M| on segment `seg` (0 lower, 1 upper; it must have a length) with the bow's moment
 * amplitude `bowMoment` (N·m, signed: Pcr·a times the mode's moment per unit), after solveAt; the place,
 * as a share of the segment, goes to scratch.at[0]. σ = length·t, t ∈ [0, 1]: frequencies κ·length and
 * κ_cr·length; the line load's constant moment E·I_i w/P = P q e_i/φ².
 */
function segmentPeak(c: SteppedBeamColumn, P: number, phi: number, seg: number, bowMoment: number, scratch: SteppedScratch): number {
  const e = seg === 0 ? 1 : c.ratio;
  const length = seg === 0 ? c.zone : 1 - c.zone;
  const mode = c.mode.segments[seg];
  const k = scratch.coefficients;
  const offset = (P * c.q * e) / (phi * phi);
  const Q = mode === undefined ? 0 : bowMoment;
  return maxAbsTwoSinusoids(P, k[4 * seg], k[4 * seg + 1], (phi / Math.sqrt(e)) * length, Q, mode?.sin ?? 0, mode?.cos ?? 0, (mode?.kappa ?? 0) * length, scratch.at, offset);
}

/** Pcr·a of the bow amplified at P: a = |e0| (P/Pcr)/(1 − P/Pcr). */
function bowAmplitude(c: SteppedBeamColumn, P: number): number {
  const ratio = P / c.Pcr;
  return (Math.abs(c.bow) * ratio) / (1 - ratio);
}

/**
 * The largest |M| (N·m) on the lower and the upper segment at the axial load P (0 < P < Pcr), the bow
 * on its unfavourable side for each (the larger of the two sides), into out[0] (lower) and out[1] (upper).
 */
export function steppedMaxMoments(c: SteppedBeamColumn, P: number, scratch: SteppedScratch, out: Float64Array): void {
  const phi = solveAt(c, P, scratch);
  const amp = c.Pcr * bowAmplitude(c, P);
  for (let seg = 0; seg < 2; seg++) {
    const length = seg === 0 ? c.zone : 1 - c.zone;
    if (!(length > 0)) {
      out[seg] = 0;
      continue;
    }
    const up = segmentPeak(c, P, phi, seg, amp, scratch);
    out[seg] = amp === 0 || c.mode.segments[seg] === undefined ? up : Math.max(up, segmentPeak(c, P, phi, seg, -amp, scratch));
  }
}

/**
 * The stepped member of a ColumnState with a corroded zone (`sound` the section above it), its stepped
 * Pcr, K and first mode, and its actions per unit axial load (the top force acts only in a sway frame);
 * `bow` |s.bow| unless given (the equivalent-bow models put their own). Shared by the capacity
 * (columnCapacity.ts) and the connection moments (limitState/connectionResponse.ts).
 */
export function steppedBeamColumnOf(s: ColumnState, sound: SoundSection, bow = Math.abs(s.bow)): SteppedBeamColumn & { K: number } {
  const { member, Pcr, K, mode } = steppedMemberOf(s, sound);
  const e = s.eccentricity ?? { bottom: 0, top: 0 };
  const t = s.transverse ?? { line: 0, top: 0 };
  return {
    frame: s.frame, r: s.r, L: s.L, EI1: s.E * s.I, ratio: member.ratio, zone: member.zone, eB: e.bottom, eT: e.top,
    q: t.line * s.L * s.L, h: s.frame === 'sway' ? t.top * s.L : 0, bow, Pcr, K, mode,
  };
}

/** The two segments' sections for the first-yield check: lower (the zone) and upper (sound). */
export interface SteppedSections {
  A1: number;
  S1: number;
  A2: number;
  S2: number;
  fy: number;
}

const SCAN = 16;
const NO_PARAMS = new Float64Array(0);
const BELOW_PCR = 1 - 1e-12;

/**
 * max over the two segments of N/A_i + max|M_i|/S_i − fy at P: the first-yield margin of the stepped
 * member. Far below Pcr the moments are scaled linearly from SMALL_LOAD·Pcr, as for the prismatic column.
 */
export function steppedFirstYieldMargin(c: SteppedBeamColumn, sec: SteppedSections, P: number, scratch: SteppedScratch, moments: Float64Array): number {
  if (P <= 0) return -sec.fy;
  const floor = SMALL_LOAD * c.Pcr;
  const scale = P < floor ? P / floor : 1;
  steppedMaxMoments(c, P < floor ? floor : P, scratch, moments);
  const lower = c.zone > 0 ? P / sec.A1 + (scale * moments[0]) / sec.S1 : -Infinity;
  const upper = c.zone < 1 ? P / sec.A2 + (scale * moments[1]) / sec.S2 : -Infinity;
  return Math.max(lower, upper) - sec.fy;
}

/**
 * The smallest axial load at which either segment reaches first yield under the end couples, the line
 * load, the top force and the bow, every load scaled together (a scan of SCAN steps up to Pcr, then
 * Brent's method, as eccentricFirstYield.ts). Below yield up to Pcr: Pcr. A mechanism: 0.
 */
export function steppedEccentricFirstYieldCapacity(c: SteppedBeamColumn, sec: SteppedSections): number {
  if (!(c.Pcr > 0)) return 0;
  const scratch = steppedScratch();
  const moments = new Float64Array(2);
  const f = (P: number) => steppedFirstYieldMargin(c, sec, P, scratch, moments);
  const top = c.Pcr * BELOW_PCR;
  let lo = 0;
  let flo = -sec.fy;
  for (let i = 1; i <= SCAN; i++) {
    const hi = (top * i) / SCAN;
    const fhi = f(hi);
    if (fhi >= 0) return brentRoot((P) => f(P), NO_PARAMS, lo, hi, flo, fhi);
    lo = hi;
    flo = fhi;
  }
  return c.Pcr;
}

/** What the stepped member's end springs carry at P (as mechanics/endSpringMoments.ts and beamColumn.ts). */
export interface SteppedResponse {
  /** false when P ≥ Pcr (or a mechanism): every value is Infinity */
  stable: boolean;
  /** end rotations θ (rad) */
  rotation: { bottom: number; top: number };
  /** moment taken by each end spring, k·θ (N·m): P e_B − M(0) at the bottom, M(L) − P e_T at the top, 0 at a pinned end */
  springMoment: { bottom: number; top: number };
  /** largest |M| over the height (N·m) and where (m above the base) */
  memberMax: number;
  memberMaxAt: number;
  /** the top's added sideways displacement v(L) (m); 0 when braced */
  drift: number;
  /** +1 or −1: the side of the bow (its deflection ±|e0|·ŵ) that gives memberMax */
  bowSide: number;
}

/**
 * The full response of the stepped member at 0 < P: end rotations, spring moments, the largest moment
 * and the top's drift, the bow on the side that gives the larger moment over the whole member (as
 * beamColumnResponse does for the prismatic column).
 */
export function steppedResponse(c: SteppedBeamColumn, P: number): SteppedResponse {
  if (!(c.Pcr > 0) || !(P < c.Pcr) || !(P > 0)) {
    return { stable: false, rotation: { bottom: Infinity, top: Infinity }, springMoment: { bottom: Infinity, top: Infinity }, memberMax: Infinity, memberMaxAt: NaN, drift: Infinity, bowSide: 1 };
  }
  const scratch = steppedScratch();
  const phi = solveAt(c, P, scratch);
  const k = scratch.coefficients;
  const a = bowAmplitude(c, P);
  const amp = c.Pcr * a;
  const lambda = 1 - c.zone;
  const k1 = phi, k2 = phi / Math.sqrt(c.ratio);
  // the larger moment over both segments decides the bow's side. SteppedMode.moment is E·I ŵ''
  // (steppedColumn.ts), the bending moment of a deflection +ŵ is −E·I ŵ'': the bow's part of M carries −side
  let best = -1, bestAt = 0, side = 1;
  for (const s of [1, -1]) {
    for (let seg = 0; seg < 2; seg++) {
      const length = seg === 0 ? c.zone : lambda;
      const mode = c.mode.segments[seg];
      if (!(length > 0) || mode === undefined) continue;
      const v = segmentPeak(c, P, phi, seg, -s * amp, scratch);
      if (v > best) { best = v; bestAt = (mode.from + scratch.at[0] * length) * c.L; side = s; }
    }
  }
  const offset1 = (P * c.q) / (phi * phi);
  const offset2 = (P * c.q * c.ratio) / (phi * phi);
  const s2 = Math.sin(k2 * lambda), c2 = Math.cos(k2 * lambda);
  const m0 = P * k[1] - offset1 - side * amp * c.mode.moment(0);
  const m1 = P * (k[4] * s2 + k[5] * c2) - offset2 - side * amp * c.mode.moment(1);
  const slope0 = k[0] * k1 + k[2] + side * a * c.mode.slope(0);
  const slope1 = k[4] * k2 * c2 - k[5] * k2 * s2 + k[6] + c.q * lambda + side * a * c.mode.slope(1);
  const top = k[4] * s2 + k[5] * c2 + k[6] * lambda + k[7] + 0.5 * c.q * lambda * lambda + side * a * c.mode.sample(1);
  return {
    stable: true,
    rotation: { bottom: slope0 / c.L, top: slope1 / c.L },
    springMoment: { bottom: c.r.bottom === 0 ? 0 : P * c.eB - m0, top: c.r.top === 0 ? 0 : m1 - P * c.eT },
    memberMax: best,
    memberMaxAt: bestAt,
    drift: c.frame === 'sway' ? top : 0,
    bowSide: side,
  };
}
