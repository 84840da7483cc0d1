/**
 * A stiffness requirement in a reviewer's terms, per studied end: the required mean with its
 * coefficient of variation, the 5 % characteristic value, and a design value by the design-value
 * method of EN 1990 Annex C (C.7 and Table C.3): the stiffness is a resistance-side variable, so
 * its design value is the fractile P(X ≤ x_d) = Φ(−α·β_target), with α either FORM's own
 * sensitivity of the stiffness at the requirement or the standard reading α = 0.8 (leading
 * resistance variable) or 0.4 × 0.8 (a non-leading one) (Annex C values from memory).
 */
import { makeDistribution } from '../probability/makeDistribution.js';
import { normalCdf } from '../probability/normal.js';
import type { Scalar } from '../scenario/types.js';

export type DesignAlphaChoice = 'form' | 'standard';

/** EN 1990 Annex C, C.7(3): α_R for the leading resistance variable (from memory). */
export const ALPHA_LEADING_RESISTANCE = 0.8;
/** EN 1990 Annex C, C.7(4): the factor 0.4 on α for non-leading variables (from memory). */
export const NON_LEADING_FACTOR = 0.4;

export interface EndRequirement {
  /** required mean stiffness, N·m/rad */
  mean: number;
  /** coefficient of variation kept from the scenario (0 when the stiffness is known exactly) */
  cov: number;
  /** 5 % fractile at that mean, N·m/rad */
  characteristic: number;
  /** design value Φ(−α·β_target) fractile, N·m/rad */
  design: number;
  /** |α| used for the design value */
  alpha: number;
  /** where α comes from, in words */
  alphaBasis: string;
  /** the fractile P(X ≤ x_d) */
  designFractile: number;
}

/**
 * α of one stiffness for the design value. `alphas` are FORM's signed α (resistance < 0) of
 * every variable at the requirement, `index` the stiffness's position (−1 when it is not random).
 */
export function designAlpha(alphas: readonly number[], index: number, choice: DesignAlphaChoice): { alpha: number; basis: string } {
  if (index < 0) return { alpha: 0, basis: 'known exactly' };
  const own = Math.abs(alphas[index]);
  if (choice === 'form') return { alpha: own, basis: `FORM α = ${own.toFixed(2)} at the requirement` };
  // the leading resistance variable: the largest |α| among the variables on the resistance side (α < 0)
  let lead = -1;
  for (let i = 0; i < alphas.length; i++) if (alphas[i] < 0 && (lead < 0 || Math.abs(alphas[i]) > Math.abs(alphas[lead]))) lead = i;
  const leading = lead === index;
  const alpha = leading ? ALPHA_LEADING_RESISTANCE : NON_LEADING_FACTOR * ALPHA_LEADING_RESISTANCE;
  return { alpha, basis: leading ? 'EN 1990 Annex C standard α = 0.8 (leading resistance variable)' : 'EN 1990 Annex C standard α = 0.4 × 0.8 (non-leading variable)' };
}

/**
 * The requirement of one end whose base stiffness (at factor 1) is `base`, at the required
 * factor: mean, CoV and fractiles of `factor × base` (scale family: CoV kept).
 */
export function endRequirement(base: Scalar, factor: number, target: number, alpha: { alpha: number; basis: string }): EndRequirement {
  if (!(factor > 0 && Number.isFinite(factor))) throw new Error(`endRequirement: factor must be finite and > 0, got ${factor}`);
  if (base.kind === 'fixed') {
    const k = base.value * factor;
    return { mean: k, cov: 0, characteristic: k, design: k, alpha: 0, alphaBasis: 'known exactly', designFractile: 0.5 };
  }
  const d = makeDistribution(base.spec);
  const designFractile = normalCdf(-alpha.alpha * target);
  return {
    mean: d.mean * factor,
    cov: d.sd / d.mean,
    characteristic: d.quantile(0.05) * factor,
    design: d.quantile(designFractile) * factor,
    alpha: alpha.alpha,
    alphaBasis: alpha.basis,
    designFractile,
  };
}
