import { criticalLoad } from './criticalLoad.js';
import { modeShape } from './modeShape.js';
import type { EndRestraint, Frame } from './types.js';

/**
 * Second-order moments and rotations of the bowed, spring-restrained column under axial load P
 * (derivation: docs/mechanics-moments.md).
 *
 * The initial shape is w0 = e0·ŵ, ŵ the first buckling mode normalised as in docs/mechanics.md (max|ŵ| = 1,
 * braced: from the chord; sway: from the vertical through the base). The added deflection v = w − w0
 * solves EI v'''' + P (v + w0)'' = 0 with the homogeneous spring conditions of the perfect column.
 * Because ŵ is an eigenfunction (EI ŵ'''' = −Pcr ŵ'', and the sway shear condition holds for it at
 * Pcr), v = a·ŵ with a = e0 (P/Pcr)/(1 − P/Pcr) solves the problem exactly, including the
 * lateral-spring condition: amplification 1/(1 − P/Pcr) of the whole shape.
 *
 * Sign convention (the sign of a sampled bow does not matter, |e0| is used):
 *   w positive on the side of the bow's largest deviation; x upwards from the base;
 *   rotation θ = d(w − w0)/dx (positive when the column turns towards +w going up);
 *   bending moment M = −EI (w − w0)'' (positive when it bends the member the way the bow does,
 *   so M = P·w for pinned ends). The moment a rotational spring takes is k·θ at the end; at the
 *   bottom it equals −M(0), at the top +M(L), from the end conditions EI v''(0) = k_A v'(0) and
 *   EI v''(L) = −k_B v'(L).
 */
export interface EndSpringMoments {
  /** false when P ≥ Pcr (or the column is a mechanism): no equilibrium, every value is Infinity */
  stable: boolean;
  /** axial load used (N) and |e0| (m) */
  load: number;
  bow: number;
  Pcr: number;
  /** 1/(1 − P/Pcr) */
  amplification: number;
  /** end rotations θ (rad), signed as above */
  rotation: { bottom: number; top: number };
  /** moment taken by each end spring, k·θ (N·m), signed as above; 0 at a pinned end, the fixed-end moment at a fixed end */
  springMoment: { bottom: number; top: number };
  /** largest |M| in the member (N·m), ends included, and where (m above the base) */
  memberMax: number;
  memberMaxAt: number;
  /** the top of the column's added sideways displacement v(L) (m); 0 when braced */
  drift: number;
}

/** No equilibrium at this load (P ≥ Pcr, a mechanism, a section that is gone): every value unknown. */
export function unstableResponse(load: number, bow: number, Pcr: number): EndSpringMoments {
  return {
    stable: false,
    load,
    bow,
    Pcr,
    amplification: Infinity,
    rotation: { bottom: Infinity, top: Infinity },
    springMoment: { bottom: Infinity, top: Infinity },
    memberMax: Infinity,
    memberMaxAt: NaN,
    drift: Infinity,
  };
}

/**
 * EI (N·m²), L (m), r as in criticalLoad (R = kL/EI; lateral T = kT L³/EI), bow e0 (m, either sign),
 * P (N, compression > 0; a net tension P < 0 is allowed: the same modal solution holds and 1/(1 − P/Pcr) < 1).
 */
export function endSpringMoments(EI: number, L: number, frame: Frame, r: EndRestraint, bow: number, P: number): EndSpringMoments {
  if (!Number.isFinite(P)) throw new RangeError(`axial load must be finite (got ${P})`);
  if (!Number.isFinite(bow)) throw new RangeError(`bow must be finite (got ${bow})`);
  const e0 = Math.abs(bow);
  // a section that is gone (a corrosion loss through the plates) or overflowed at a far design point
  // has no equilibrium to report: the values are written as unknown, not an error
  if (!(EI > 0 && Number.isFinite(EI))) return unstableResponse(P, e0, 0);
  const { Pcr, phi } = criticalLoad(EI, L, frame, r);
  if (!(Pcr > 0) || P >= Pcr) return unstableResponse(P, e0, Pcr);
  const ratio = P / Pcr;
  const a = (e0 * ratio) / (1 - ratio);
  const m = modeShape(frame, r, phi);
  // ŵ' = Aφ cos φξ − Bφ sin φξ + C (per unit ξ); ŵ'' from the shape
  const slope = (xi: number) => m.A * phi * Math.cos(phi * xi) - m.B * phi * Math.sin(phi * xi) + m.C;
  const bending = (xi: number) => (-EI * a * m.curvature(xi)) / (L * L);
  const thetaB = (a * slope(0)) / L;
  const thetaT = (a * slope(1)) / L;
  // a pinned end takes no moment; writing 0 avoids a rounding residue of the closed form
  const mB = r.bottom === 0 ? 0 : -bending(0);
  const mT = r.top === 0 ? 0 : bending(1);
  return {
    stable: true,
    load: P,
    bow: e0,
    Pcr,
    amplification: 1 / (1 - ratio),
    rotation: { bottom: thetaB, top: thetaT },
    springMoment: { bottom: mB, top: mT },
    memberMax: Math.abs((EI * a * m.maxCurvature) / (L * L)),
    memberMaxAt: m.maxCurvatureAt * L,
    drift: frame === 'sway' ? a * m.sample(1) : 0,
  };
}
