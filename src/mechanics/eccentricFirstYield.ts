import { ECC_LENGTH, eccentricCoefficientsInto, maxAbsTwoSinusoids } from './beamColumn.js';
import { brentRoot } from './brent.js';
import type { EndRestraint, Frame, ModeShape } from './types.js';

/** Load-independent data of one column for the eccentric first-yield search (docs/beam-column.md). */
export interface EccentricColumn {
  A: number;
  S: number;
  fy: number;
  EI: number;
  L: number;
  frame: Frame;
  r: EndRestraint;
  bow: number;
  eB: number;
  eT: number;
  /** line load and top force per unit axial load as lengths: q = (w/P) L², h = (H/P) L (m; absent = 0) */
  q?: number;
  h?: number;
  Pcr: number;
  /** the first mode at Pcr (mechanics/modeShape.ts) */
  mode: ModeShape;
}

/**
 * N/A + max_x |M(x)|/S − fy at the axial load P, M the second-order moment of mechanics/beamColumn.ts
 * (end couples P·e, line load and top force growing with P, plus the amplified bow on its unfavourable
 * side). scratch: ECC_LENGTH + 1 entries.
 */
export function firstYieldMargin(col: EccentricColumn, P: number, scratch: Float64Array): number {
  if (P <= 0) return -col.fy;
  // far below Pcr the moment is linear in P to within P/Pcr: take it from SMALL_LOAD·Pcr, where the closed
  // form is still well conditioned (at φ → 0 its terms of order q/φ² cancel to rounding noise)
  const floor = SMALL_LOAD * col.Pcr;
  if (P < floor) return P / col.A + (P / floor) * secondOrderMaxMoment(col, floor, scratch) / col.S - col.fy;
  return P / col.A + secondOrderMaxMoment(col, P, scratch) / col.S - col.fy;
}

/**
 * Below this share of Pcr the second-order moment is scaled linearly from its value at this share
 * (the amplification 1/(1 − P/Pcr) differs from 1 by less than 1e-6 there).
 */
export const SMALL_LOAD = 1e-6;

/** max_x |M(x)| at the axial load P > 0: end couples, line load, top force and the amplified bow on its unfavourable side. */
function secondOrderMaxMoment(col: EccentricColumn, P: number, scratch: Float64Array): number {
  const phi = col.L * Math.sqrt(P / col.EI);
  const q = col.q ?? 0;
  const k = eccentricCoefficientsInto(scratch, col.frame, col.r, phi, col.eB, col.eT, q, col.h ?? 0);
  const offset = (P * q) / (phi * phi);
  const ratio = P / col.Pcr;
  const bowQ = col.Pcr * ((Math.abs(col.bow) * ratio) / (1 - ratio));
  const at = scratch.subarray(ECC_LENGTH, ECC_LENGTH + 1);
  const A = k[0];
  const B = k[1];
  const m = col.mode;
  const up = maxAbsTwoSinusoids(P, A, B, phi, bowQ, m.A, m.B, m.phi, at, offset);
  const down = bowQ === 0 ? up : maxAbsTwoSinusoids(P, A, B, phi, -bowQ, m.A, m.B, m.phi, at, offset);
  return Math.max(up, down);
}

const SCAN = 16;
const NO_PARAMS = new Float64Array(0);
const BELOW_PCR = 1 - 1e-12;

/**
 * The smallest axial load P at which N/A + max|M|/S reaches fy, the end couples growing with P
 * (every load scaled together, so the eccentricities stay fixed). A column that stays below yield up
 * to its critical load has capacity Pcr, as the concentric first-yield model gives min(A fy, Pcr).
 * A mechanism (Pcr = 0) gives 0. The margin need not be monotonic in P (double curvature), so a scan
 * of SCAN steps finds the first sign change before Brent's method refines it.
 */
export function eccentricFirstYieldCapacity(col: EccentricColumn): number {
  if (!(col.Pcr > 0)) return 0;
  const scratch = new Float64Array(ECC_LENGTH + 1);
  const f = (P: number) => firstYieldMargin(col, P, scratch);
  const top = col.Pcr * BELOW_PCR;
  let lo = 0;
  let flo = -col.fy;
  for (let i = 1; i <= SCAN; i++) {
    const hi = (top * i) / SCAN;
    const fhi = f(hi);
    if (fhi >= 0) return brentRoot((P) => f(P), NO_PARAMS, lo, hi, flo, fhi);
    lo = hi;
    flo = fhi;
  }
  return col.Pcr;
}
