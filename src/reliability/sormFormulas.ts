/**
 * Second-order asymptotic failure probabilities from β and the principal curvatures κ_j
 * (positive when the limit-state surface bends away from the origin). Each returns null where
 * the formula is not defined for these curvatures.
 *
 * Breitung (1984), J. Eng. Mech. 110(3):          pf = Φ(−β) Π (1 + β κ_j)^−½
 * Hohenbichler & Rackwitz (1988), J. Eng. Mech. 114(12):
 *                                                  pf = Φ(−β) Π (1 + κ_j φ(β)/Φ(−β))^−½
 * Tvedt (1990), J. Eng. Mech. 116(6), three terms: pf = A1 + A2 + A3,
 *   A1 = Φ(−β) P(β),  A2 = [β Φ(−β) − φ(β)] [P(β) − P(β + 1)],
 *   A3 = (β + 1) [β Φ(−β) − φ(β)] [P(β) − Re P(β + i)],   P(s) = Π (1 + s κ_j)^−½
 *   (complex s, principal square root).
 */
import { normalPdf, normalSf } from '../probability/normal.js';

export function breitung(beta: number, curvatures: readonly number[]): number | null {
  let prod = 1;
  for (const k of curvatures) {
    const f = 1 + beta * k;
    if (!(f > 0)) return null;
    prod *= f;
  }
  return normalSf(beta) / Math.sqrt(prod);
}

export function hohenbichlerRackwitz(beta: number, curvatures: readonly number[]): number | null {
  const tail = normalSf(beta);
  const ratio = normalPdf(beta) / tail;
  let prod = 1;
  for (const k of curvatures) {
    const f = 1 + k * ratio;
    if (!(f > 0)) return null;
    prod *= f;
  }
  return tail / Math.sqrt(prod);
}

export function tvedt(beta: number, curvatures: readonly number[]): number | null {
  const pReal = (s: number): number | null => {
    let prod = 1;
    for (const k of curvatures) {
      const f = 1 + s * k;
      if (!(f > 0)) return null;
      prod *= f;
    }
    return 1 / Math.sqrt(prod);
  };
  const pBeta = pReal(beta);
  const pBeta1 = pReal(beta + 1);
  if (pBeta === null || pBeta1 === null) return null;
  const reComplex = realPartOfComplexP(beta, curvatures);
  const tail = normalSf(beta);
  const bracket = beta * tail - normalPdf(beta);
  const a1 = tail * pBeta;
  const a2 = bracket * (pBeta - pBeta1);
  const a3 = (beta + 1) * bracket * (pBeta - reComplex);
  const pf = a1 + a2 + a3;
  return pf > 0 && pf < 1 ? pf : null;
}

/** Re Π (1 + (β + i) κ_j)^−½ with the principal square root of each factor. */
function realPartOfComplexP(beta: number, curvatures: readonly number[]): number {
  let re = 1;
  let im = 0;
  for (const k of curvatures) {
    // sqrt of a + ib (principal branch)
    const a = 1 + beta * k;
    const b = k;
    const r = Math.hypot(a, b);
    const sr = Math.sqrt((r + a) / 2);
    const si = (b < 0 ? -1 : 1) * Math.sqrt(Math.max(0, (r - a) / 2));
    const nr = re * sr - im * si;
    const ni = re * si + im * sr;
    re = nr;
    im = ni;
  }
  // 1/(re + i im)
  const m2 = re * re + im * im;
  return re / m2;
}
