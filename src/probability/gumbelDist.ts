/**
 * Gumbel (largest values, type I): F(x) = exp(−exp(−(x − loc)/scale)).
 * From mean μ and sd σ: scale = σ√6/π, loc = μ − γ·scale, γ = Euler's constant.
 */
import type { Distribution } from './distribution.js';
import { logNormalCdf, normalCdf, normalQuantile, normalQuantileUpper } from './normal.js';
import { clampFinite } from './clampFinite.js';

const EULER_GAMMA = 0.57721566490153286061;

export class GumbelDistribution implements Distribution {
  readonly name = 'gumbel' as const;
  readonly mean: number;
  readonly sd: number;
  readonly params: Readonly<Record<string, number>>;
  constructor(
    readonly loc: number,
    readonly scale: number,
  ) {
    this.mean = loc + EULER_GAMMA * scale;
    this.sd = (scale * Math.PI) / Math.sqrt(6);
    this.params = Object.freeze({ loc, scale });
  }
  static fromMoments(mean: number, sd: number): GumbelDistribution {
    const scale = (sd * Math.sqrt(6)) / Math.PI;
    return new GumbelDistribution(mean - EULER_GAMMA * scale, scale);
  }
  pdf(x: number): number {
    const z = (x - this.loc) / this.scale;
    const e = Math.exp(-z);
    if (!Number.isFinite(e)) return 0;
    return Math.exp(-z - e) / this.scale;
  }
  cdf(x: number): number {
    return Math.exp(-Math.exp(-(x - this.loc) / this.scale));
  }
  sf(x: number): number {
    return -Math.expm1(-Math.exp(-(x - this.loc) / this.scale));
  }
  quantile(p: number): number {
    if (p > 0.5) return this.upperQuantile(1 - p);
    return this.loc - this.scale * Math.log(-Math.log(p));
  }
  /** x with sf(x) = q: −ln F = −ln(1 − q) = −log1p(−q). */
  private upperQuantile(q: number): number {
    return this.loc - this.scale * Math.log(-Math.log1p(-q));
  }
  /**
   * Finite for every finite u: −ln F = −ln Φ(u) is taken in log form in the lower tail, and in the
   * upper tail −ln(1 − q) = q(1 + q/2 + …), so ln(−ln F) → ln q = ln Φ(−u) where q underflows.
   */
  fromStandardNormal(u: number): number {
    if (u <= 0) {
      const minusLogF = -logNormalCdf(u);
      const logOfIt = Number.isFinite(minusLogF) ? Math.log(minusLogF) : 2 * Math.log(-u) - Math.LN2;
      return clampFinite(this.loc - this.scale * logOfIt);
    }
    const q = normalCdf(-u);
    if (q > 1e-300) return clampFinite(this.upperQuantile(q));
    return clampFinite(this.loc - this.scale * logNormalCdf(-u));
  }
  toStandardNormal(x: number): number {
    const z = (x - this.loc) / this.scale;
    const e = Math.exp(-z); // −ln F(x)
    if (e >= Math.LN2) return normalQuantile(Math.exp(-e)); // F ≤ 1/2
    return normalQuantileUpper(-Math.expm1(-e));
  }
}
