/**
 * Two-parameter Weibull (smallest values): F(x) = 1 − exp(−(x/scale)^shape), x ≥ 0.
 * Mean = scale·Γ(1 + 1/k), CoV² = Γ(1 + 2/k)/Γ(1 + 1/k)² − 1, so the shape k follows from
 * the CoV alone (a bracketed root solve) and then scale = mean/Γ(1 + 1/k).
 */
import type { Distribution } from './distribution.js';
import { logGamma } from './logGamma.js';
import { logNormalCdf, normalCdf, normalQuantile, normalQuantileUpper } from './normal.js';
import { clampFinite } from './clampFinite.js';
import { findRootBracketed } from './rootBracketed.js';

/** Shape range searched; its CoV range is [weibullCovRange.min, weibullCovRange.max]. */
export const WEIBULL_SHAPE_MIN = 0.05;
export const WEIBULL_SHAPE_MAX = 2e4;

/** CoV of a Weibull variable of shape k (expm1 keeps the digits for large k). */
export function weibullCov(k: number): number {
  return Math.sqrt(Math.expm1(logGamma(1 + 2 / k) - 2 * logGamma(1 + 1 / k)));
}

export const weibullCovRange = {
  min: weibullCov(WEIBULL_SHAPE_MAX),
  max: weibullCov(WEIBULL_SHAPE_MIN),
};

/** The shape k whose CoV is `cov` (throws plain Error outside weibullCovRange). */
export function weibullShapeFromCov(cov: number): number {
  // CoV falls monotonically with k; solve in ln k for an even bracket.
  const root = findRootBracketed(
    (lnK) => Math.log(weibullCov(Math.exp(lnK))) - Math.log(cov),
    Math.log(WEIBULL_SHAPE_MIN),
    Math.log(WEIBULL_SHAPE_MAX),
    { xTolerance: 1e-15 },
  );
  return Math.exp(root);
}

export class WeibullDistribution implements Distribution {
  readonly name = 'weibull' as const;
  readonly mean: number;
  readonly sd: number;
  readonly params: Readonly<Record<string, number>>;
  private readonly invShape: number;
  constructor(
    readonly shape: number,
    readonly scale: number,
  ) {
    this.invShape = 1 / shape;
    this.mean = scale * Math.exp(logGamma(1 + 1 / shape));
    this.sd = this.mean * weibullCov(shape);
    this.params = Object.freeze({ shape, scale });
  }
  static fromMoments(mean: number, sd: number): WeibullDistribution {
    const shape = weibullShapeFromCov(sd / mean);
    return new WeibullDistribution(shape, mean / Math.exp(logGamma(1 + 1 / shape)));
  }
  pdf(x: number): number {
    if (x < 0) return 0;
    const z = x / this.scale;
    return (this.shape / this.scale) * Math.pow(z, this.shape - 1) * Math.exp(-Math.pow(z, this.shape));
  }
  cdf(x: number): number {
    if (x <= 0) return 0;
    return -Math.expm1(-Math.pow(x / this.scale, this.shape));
  }
  sf(x: number): number {
    if (x <= 0) return 1;
    return Math.exp(-Math.pow(x / this.scale, this.shape));
  }
  /** x with −ln(1 − F(x)) = h: scale·h^{1/k} */
  private fromHazard(h: number): number {
    return this.scale * Math.pow(h, this.invShape);
  }
  quantile(p: number): number {
    return this.fromHazard(p <= 0.5 ? -Math.log1p(-p) : -Math.log(1 - p));
  }
  fromStandardNormal(u: number): number {
    // upper tail: hazard −ln Φ(−u) in log form, finite where Φ(−u) underflows
    return clampFinite(this.fromHazard(u <= 0 ? -Math.log1p(-normalCdf(u)) : -logNormalCdf(-u)));
  }
  toStandardNormal(x: number): number {
    if (x <= 0) return -Infinity;
    const h = Math.pow(x / this.scale, this.shape);
    if (h <= Math.LN2) return normalQuantile(-Math.expm1(-h));
    return normalQuantileUpper(Math.exp(-h));
  }
}
