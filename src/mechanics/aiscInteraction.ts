import { aiscCapacity } from './aisc360.js';
import { ECC_LENGTH, eccentricCoefficientsInto, maxAbsTwoSinusoids } from './beamColumn.js';
import { brentRoot } from './brent.js';
import { SMALL_LOAD } from './eccentricFirstYield.js';
import type { EccentricColumn } from './eccentricFirstYield.js';

/**
 * Members under flexure and axial compression, AISC 360-16 §H1.1 (Eqs. H1-1a/b, from memory), with no
 * resistance factor (mean-level nominal, like the other strength models):
 *
 *   P_r/P_c ≥ 0.2:  P_r/P_c + (8/9) M_r/M_c ≤ 1      (H1-1a)
 *   P_r/P_c < 0.2:  P_r/(2 P_c) + M_r/M_c ≤ 1        (H1-1b)
 *
 * P_c = P_n of §E3 from the exact restrained critical load (aisc360.ts). M_c = fy·S: the elastic
 * (first-yield) moment, S being the only modulus the scenario gives (no plastic modulus, no
 * lateral-torsional buckling: one axis). M_r is the tool's own exact second-order maximum member
 * moment of the spring-restrained column under the end couples P·e (applied end moments included), the
 * line load along the height and the force at the top of a sway column (beamColumn.ts), which takes the
 * place of the B1/B2 amplification of Appendix 8. No bow enters M_r: the member's out-of-straightness
 * is already inside P_n (common practice).
 */
export function aiscInteractionRatio(Pr: number, Pc: number, Mr: number, Mc: number): number {
  const p = Pr / Pc;
  return p >= 0.2 ? p + (8 / 9) * (Mr / Mc) : p / 2 + Mr / Mc;
}

/** Load-independent data of the H1-1 check of one column: the eccentric column without its bow (P_n holds the imperfection). */
export type AiscInteractionColumn = Omit<EccentricColumn, 'bow' | 'mode'>;

/** Largest |M(x)| (N·m) over the height at P (0 < P < Pcr) under the end couples, line load and top force (no bow). scratch: ECC_LENGTH + 1. */
export function secondOrderEndCoupleMoment(col: AiscInteractionColumn, P: number, scratch: Float64Array): number {
  if (P <= 0) return 0;
  // linear in P far below Pcr, where the closed form loses its digits (eccentricFirstYield.ts, SMALL_LOAD)
  const floor = SMALL_LOAD * col.Pcr;
  if (P < floor) return (P / floor) * secondOrderEndCoupleMoment(col, floor, scratch);
  const phi = col.L * Math.sqrt(P / col.EI);
  const q = col.q ?? 0;
  const k = eccentricCoefficientsInto(scratch, col.frame, col.r, phi, col.eB, col.eT, q, col.h ?? 0);
  return maxAbsTwoSinusoids(P, k[0], k[1], phi, 0, 0, 0, 0, scratch.subarray(ECC_LENGTH, ECC_LENGTH + 1), (P * q) / (phi * phi));
}

const SCAN = 16;
const NO_PARAMS = new Float64Array(0);

/**
 * The smallest axial load P (all loads scaled together, e_B and e_T fixed) at which H1-1 reaches 1.
 * At P = P_n the ratio is already 1 + (8/9) M_r/M_c ≥ 1, and P_n ≤ 0.877 Pcr keeps M_r finite. H1-1
 * jumps at P_r/P_c = 0.2, but both branches equal 1 there only together (M_r/M_c = 0.9), so the jump
 * never straddles 1. M_r need not grow monotonically with P for every restraint (double curvature),
 * so SCAN equal steps find the first sign change before Brent's method refines it.
 * A mechanism gives 0.
 */
export function aiscEccentricCapacity(col: AiscInteractionColumn): number {
  if (!(col.Pcr > 0)) return 0;
  const Pc = aiscCapacity(col.A, col.fy, col.Pcr);
  if (!(Pc > 0)) return 0;
  const Mc = col.fy * col.S;
  const scratch = new Float64Array(ECC_LENGTH + 1);
  const f = (P: number) => aiscInteractionRatio(P, Pc, secondOrderEndCoupleMoment(col, P, scratch), Mc) - 1;
  let lo = 0;
  let flo = -1;
  for (let i = 1; i <= SCAN; i++) {
    const hi = (Pc * i) / SCAN;
    const fhi = f(hi);
    if (fhi >= 0) return brentRoot((P) => f(P), NO_PARAMS, lo, hi, flo, fhi);
    lo = hi;
    flo = fhi;
  }
  return Pc;
}
