import { brentRoot } from './brent.js';
import { enReductionFactor } from './en1993.js';
import { firstOrderSwayMoment } from './firstOrderSway.js';
import type { EndRestraint, Frame } from './types.js';

/**
 * In-plane member check under axial force and end moments of EN 1993-1-1:2005 §6.3.3, Eq. (6.61),
 * with the interaction factor k_yy of Annex B (method 2), no partial factor (γM1 = 1, mean-level
 * nominal like the other strength models):
 *
 *   N/(χ_y N_Rk) + k_yy · M_y/M_y,Rk ≤ 1,   N_Rk = A fy,  M_y,Rk = fy S.
 *
 * One buckling axis and no lateral-torsional buckling: χ_LT = 1, M_z = 0, and Eq. (6.62) (buckling
 * about the other axis) does not apply. S is the elastic modulus, so k_yy takes the class 3 form of
 * Table B.1 (members not susceptible to torsional deformation):
 *
 *   k_yy = C_my (1 + 0.6 λ̄_y n) ≤ C_my (1 + 0.6 n),   n = N/(χ_y N_Rk),
 *
 * i.e. C_my (1 + 0.6 min(λ̄_y, 1) n). C_my from Table B.3 for a linear moment diagram between the end
 * moments: 0.6 + 0.4ψ ≥ 0.4, ψ = M_min/M_max (−1 ≤ ψ ≤ 1, positive in single curvature); for a
 * member whose buckling mode sways the note to Table B.3 sets C_my = 0.9 (table values from memory).
 * M_y is the first-order end moment P·e; the factors χ and k_yy account for second order.
 */

/** C_my of Table B.3: the end moments M_B = P e_B, M_T = P e_T (same sign = single curvature). */
export function enEquivalentMomentFactor(eB: number, eT: number, frame: Frame): number {
  if (frame === 'sway') return 0.9;
  const big = Math.abs(eB) >= Math.abs(eT) ? eB : eT;
  const small = big === eB ? eT : eB;
  const psi = big === 0 ? 1 : small / big;
  const c = 0.6 + 0.4 * psi;
  return c > 0.4 ? c : 0.4;
}

/**
 * C_my of Table B.3 for a moment diagram with a uniform transverse load (table values from memory):
 * M_h the larger end moment, ψ M_h the other, M_s the moment at mid-span (h: end, s: span).
 *   |M_s| ≤ |M_h|, α_s = M_s/M_h:  α_s ≥ 0: 0.2 + 0.8 α_s;  α_s < 0: 0.1 − 0.8 α_s (ψ ≥ 0), 0.1(1 − ψ) − 0.8 α_s (ψ < 0);  all ≥ 0.4
 *   |M_s| > |M_h|, α_h = M_h/M_s:  0.95 + 0.05 α_h, or 0.95 + 0.05 α_h (1 + 2ψ) when α_h < 0 and ψ < 0
 * A sway buckling mode takes 0.9 (note to Table B.3). Without a transverse load M_s = M_h (1 + ψ)/2 and
 * the first row gives 0.6 + 0.4ψ, the linear diagram.
 */
export function enEquivalentMomentFactorUniformLoad(mB: number, mT: number, mSpan: number, frame: Frame): number {
  if (frame === 'sway') return 0.9;
  const mh = Math.abs(mB) >= Math.abs(mT) ? mB : mT;
  const other = mh === mB ? mT : mB;
  const psi = mh === 0 ? 1 : other / mh;
  if (Math.abs(mSpan) <= Math.abs(mh)) {
    const as = mSpan / mh;
    const c = as >= 0 ? 0.2 + 0.8 * as : psi >= 0 ? 0.1 - 0.8 * as : 0.1 * (1 - psi) - 0.8 * as;
    return c > 0.4 ? c : 0.4;
  }
  const ah = mh / mSpan;
  return ah < 0 && psi < 0 ? 0.95 + 0.05 * ah * (1 + 2 * psi) : 0.95 + 0.05 * ah;
}

/**
 * The first-order moment diagram per unit axial load of the member between its ends (the part the
 * end springs take is not deducted, as for the end couples alone): m(ξ) = e_B (1 − ξ) + e_T ξ + q ξ(1 − ξ)/2,
 * q = (w/P) L². Returns max |m| (m) and C_my of Table B.3 for it.
 */
export function enFirstOrderDiagram(eB: number, eT: number, q: number, frame: Frame): { maxMoment: number; cmy: number } {
  const m = (xi: number) => eB * (1 - xi) + eT * xi + 0.5 * q * xi * (1 - xi);
  let maxMoment = Math.max(Math.abs(eB), Math.abs(eT));
  if (q !== 0) {
    const vertex = 0.5 + (eT - eB) / q; // dm/dξ = 0
    if (vertex > 0 && vertex < 1) maxMoment = Math.max(maxMoment, Math.abs(m(vertex)));
  }
  return { maxMoment, cmy: enEquivalentMomentFactorUniformLoad(eB, eT, m(0.5), frame) };
}

/** k_yy of Table B.1, class 3 form: C_my (1 + 0.6 λ̄ n) capped at C_my (1 + 0.6 n), n = N/(χ N_Rk). */
export function enInteractionFactor(cmy: number, lambdaBar: number, n: number): number {
  return cmy * (1 + 0.6 * (lambdaBar < 1 ? lambdaBar : 1) * n);
}

/** Load-independent data of the Eq. (6.61) check of one column. */
export interface EnInteractionColumn {
  /** imperfection factor α of Table 6.1 */
  alpha: number;
  A: number;
  S: number;
  fy: number;
  Pcr: number;
  eB: number;
  eT: number;
  /** uniform line load per unit axial load as a length, q = (w/P) L² (m; absent = 0) */
  q?: number;
  /** sway only: top force per unit axial load as a length, h = (H/P) L (m; absent = 0) */
  h?: number;
  /** the end springs: needed for the first-order sway moments of q and h (firstOrderSway.ts) */
  r?: EndRestraint;
  frame: Frame;
}

/** Largest |c0 + c1 ξ + c2 ξ²| over ξ ∈ [0, 1]. */
function maxAbsQuadratic(c0: number, c1: number, c2: number): number {
  let best = Math.max(Math.abs(c0), Math.abs(c0 + c1 + c2));
  if (c2 !== 0) {
    const v = -c1 / (2 * c2);
    if (v > 0 && v < 1) best = Math.max(best, Math.abs(c0 + c1 * v + c2 * v * v));
  }
  return best;
}

/**
 * A sway member's first-order diagram per unit axial load: the end couples as for a braced member
 * (linear, the part the springs take not deducted), plus the line load's and top force's moments of
 * the spring-restrained member at P = 0 (firstOrderSway.ts), which need the springs to exist at all.
 * Returns max |m| (m); C_my is 0.9 for the sway mode (note to Table B.3).
 */
export function enFirstOrderSwayDiagram(eB: number, eT: number, q: number, h: number, r: EndRestraint): number {
  const s = firstOrderSwayMoment(r, q, h);
  return maxAbsQuadratic(eB + s.c0, eT - eB + s.c1, s.c2);
}

/** χ N_Rk evaluated as en1993.ts's enCapacity does, so that n = 1 exactly at the concentric capacity. */
function flexuralResistance(alpha: number, lambdaBar: number, A: number, fy: number): number {
  return enReductionFactor(alpha, lambdaBar) * A * fy;
}

/**
 * Left-hand side of Eq. (6.61) at the axial load P, with M_y = P·max(|e_B|, |e_T|), or with a line load
 * the largest first-order moment P·max|m(ξ)| and C_my of Table B.3 for that diagram (enFirstOrderDiagram);
 * a sway member under a line load or top force takes its spring-restrained first-order diagram
 * (enFirstOrderSwayDiagram) and C_my = 0.9. χ comes from the sway (restrained) critical load, so these
 * first-order moments with the sway buckling length are the route of EN 1993-1-1 §5.2.2(8).
 */
export function enInteractionRatio(col: EnInteractionColumn, P: number): number {
  const lambdaBar = Math.sqrt((col.A * col.fy) / col.Pcr);
  const Nb = flexuralResistance(col.alpha, lambdaBar, col.A, col.fy);
  const n = P / Nb;
  let M: number;
  let cmy: number;
  const q = col.q ?? 0;
  const h = col.h ?? 0;
  if (q === 0 && h === 0) {
    M = P * Math.max(Math.abs(col.eB), Math.abs(col.eT));
    cmy = enEquivalentMomentFactor(col.eB, col.eT, col.frame);
  } else if (col.frame === 'sway') {
    if (col.r === undefined) throw new RangeError('the sway check under a line load or top force needs the end springs');
    M = P * enFirstOrderSwayDiagram(col.eB, col.eT, q, h, col.r);
    cmy = 0.9;
  } else {
    const d = enFirstOrderDiagram(col.eB, col.eT, q, col.frame);
    M = P * d.maxMoment;
    cmy = d.cmy;
  }
  const kyy = enInteractionFactor(cmy, lambdaBar, n);
  return n + (kyy * M) / (col.fy * col.S);
}

const NO_PARAMS = new Float64Array(0);

/**
 * The axial load P (all loads scaled together, so e_B, e_T stay fixed) at which Eq. (6.61) equals 1.
 * The ratio rises strictly with P (n and k_yy both grow) from 0 at P = 0 to at least 1 at the
 * flexural buckling resistance χ N_Rk, so that load brackets the single root. A mechanism gives 0.
 */
export function enEccentricCapacity(col: EnInteractionColumn): number {
  if (!(col.Pcr > 0)) return 0;
  const Nb = flexuralResistance(col.alpha, Math.sqrt((col.A * col.fy) / col.Pcr), col.A, col.fy);
  if (!(Nb > 0)) return 0;
  return brentRoot((P) => enInteractionRatio(col, P) - 1, NO_PARAMS, 0, Nb, -1, enInteractionRatio(col, Nb) - 1);
}
