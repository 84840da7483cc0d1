import { enReductionFactor } from './en1993.js';
import { firstYieldCapacity } from './firstYield.js';

/**
 * First yield with the equivalent bow of EN 1993-1-1:2005 §5.3.2(11), Eqs. (5.9)/(5.10):
 *   η_init = e0 · Ncr / (E I |η''_cr,max|) · η_cr,
 *   e0 = α (λ̄ − 0.2) · M_Rk/N_Rk · (1 − χ λ̄²/γ_M1) / (1 − χ λ̄²)   for λ̄ > 0.2 (else 0),
 * with η_cr the first buckling mode of the restrained column and λ̄ = √(A fy / Ncr).
 * With η_cr normalised to max|η_cr| = 1, the amplitude of η_init is e0·Ncr/(EI max|η''|) = e0/c, c the
 * curvature factor of docs/mechanics.md; the first-yield moment is then P e0 / (1 − P/Ncr) whatever the
 * restraint. M_Rk/N_Rk = S/A here (the elastic modulus, the same one the first-yield check uses), and
 * γ_M1 = 1 for a mean-level model, so the last fraction is 1 and the result is χ·A·fy of the curve:
 * the Ayrton–Perry form of Eq. (6.49) with η = α(λ̄ − 0.2).
 */
export function en1993EquivalentBow(alpha: number, A: number, S: number, fy: number, Pcr: number, gammaM1 = 1): number {
  if (!(Pcr > 0)) return 0;
  const lambdaBar = Math.sqrt((A * fy) / Pcr);
  if (!(lambdaBar > 0.2)) return 0;
  const chiLambda2 = enReductionFactor(alpha, lambdaBar) * lambdaBar * lambdaBar;
  return alpha * (lambdaBar - 0.2) * (S / A) * ((1 - chiLambda2 / gammaM1) / (1 - chiLambda2));
}

/**
 * Capacity (N) by first yield with the equivalent bow e0/c of curve α, plus |measuredBow| on top
 * (0 for the plain equivalent-bow model). The measured bow adds to a shape that already holds the
 * code's allowance for geometric imperfection and residual stress, so the "plus bow" form is the
 * cautious reading of a column that is known to be out of straight. A mechanism gives 0.
 */
export function equivalentBowCapacity(alpha: number, A: number, S: number, fy: number, Pcr: number, c: number, measuredBow: number): number {
  if (!(Pcr > 0)) return 0;
  return firstYieldCapacity(A, S, fy, Pcr, equivalentBowAmplitude(alpha, A, S, fy, Pcr, c) + Math.abs(measuredBow), c);
}

/**
 * The amplitude e0/c (m) of the equivalent bow η_init affine to the first mode (max|η_cr| = 1), c the
 * curvature factor of the cross-section checked: the bow the beam-column under combined actions takes
 * in place of the measured one (EN 1993-1-1 §5.2.2(3)a with §5.3.2(11)). 0 for a mechanism or c = 0.
 */
export function equivalentBowAmplitude(alpha: number, A: number, S: number, fy: number, Pcr: number, c: number): number {
  if (!(Pcr > 0) || !(c > 0)) return 0;
  return en1993EquivalentBow(alpha, A, S, fy, Pcr) / c;
}
