/**
 * Normal distribution N(mu, sigma²) truncated to [min, max] (either bound may be infinite).
 * mu and sigma are the PARENT's; `mean` and `sd` are those of the truncated variable
 * (e.g. Johnson, Kotz & Balakrishnan, Continuous Univariate Distributions vol. 1, §13.10).
 *
 * Tail accuracy: every probability is written as a difference of two normal tail areas on
 * the side of the parent's mean where both are small, so nothing cancels catastrophically.
 */
import type { Distribution } from './distribution.js';
import { clampFinite } from './clampFinite.js';
import { logNormalCdf, normalCdf, normalPdf, normalQuantile, normalQuantileFromLog, normalQuantileUpper } from './normal.js';

/** Φ(high) − Φ(low) for low ≤ high, from whichever tail keeps the digits. */
export function normalMassBetween(low: number, high: number): number {
  if (low >= 0) return normalCdf(-low) - normalCdf(-high);
  if (high <= 0) return normalCdf(high) - normalCdf(low);
  return 1 - normalCdf(low) - normalCdf(-high);
}

/** t·φ(t), taken as 0 at t = ±∞. */
function tTimesPdf(t: number): number {
  return Number.isFinite(t) ? t * normalPdf(t) : 0;
}

export class TruncatedNormalDistribution implements Distribution {
  readonly name = 'truncnormal' as const;
  readonly mean: number;
  readonly sd: number;
  readonly params: Readonly<Record<string, number>>;
  /** standardized bounds (min − mu)/sigma and (max − mu)/sigma */
  private readonly alpha: number;
  private readonly beta: number;
  /** Φ(beta) − Φ(alpha): the parent's probability inside the bounds */
  readonly mass: number;
  /** Φ(alpha), Φ(−alpha), Φ(beta), Φ(−beta) */
  private readonly cdfAlpha: number;
  private readonly sfAlpha: number;
  private readonly cdfBeta: number;
  private readonly sfBeta: number;

  constructor(
    readonly mu: number,
    readonly sigma: number,
    readonly min: number,
    readonly max: number,
  ) {
    this.alpha = (min - mu) / sigma;
    this.beta = (max - mu) / sigma;
    this.mass = normalMassBetween(this.alpha, this.beta);
    this.cdfAlpha = normalCdf(this.alpha);
    this.sfAlpha = normalCdf(-this.alpha);
    this.cdfBeta = normalCdf(this.beta);
    this.sfBeta = normalCdf(-this.beta);
    const ratio = (normalPdf(this.alpha) - normalPdf(this.beta)) / this.mass;
    const spread = (tTimesPdf(this.alpha) - tTimesPdf(this.beta)) / this.mass;
    this.mean = mu + sigma * ratio;
    this.sd = sigma * Math.sqrt(Math.max(0, 1 + spread - ratio * ratio));
    this.params = Object.freeze({ mu, sigma, min, max });
  }

  pdf(x: number): number {
    if (x < this.min || x > this.max) return 0;
    return normalPdf((x - this.mu) / this.sigma) / (this.sigma * this.mass);
  }
  cdf(x: number): number {
    if (x <= this.min) return 0;
    if (x >= this.max) return 1;
    return normalMassBetween(this.alpha, (x - this.mu) / this.sigma) / this.mass;
  }
  sf(x: number): number {
    if (x <= this.min) return 1;
    if (x >= this.max) return 0;
    return normalMassBetween((x - this.mu) / this.sigma, this.beta) / this.mass;
  }
  /** standardized parent value t with (Φ(t) − Φ(alpha))/mass = p, p small */
  private lowerT(p: number): number {
    const m = p * this.mass;
    return this.alpha < 0 ? normalQuantile(this.cdfAlpha + m) : normalQuantileUpper(this.sfAlpha - m);
  }
  /** standardized parent value t with (Φ(beta) − Φ(t))/mass = q, q small */
  private upperT(q: number): number {
    const m = q * this.mass;
    return this.beta > 0 ? normalQuantileUpper(this.sfBeta + m) : normalQuantile(this.cdfBeta - m);
  }
  private toX(t: number): number {
    const x = this.mu + this.sigma * t;
    return clampFinite(x < this.min ? this.min : x > this.max ? this.max : x);
  }
  quantile(p: number): number {
    return this.toX(p <= 0.5 ? this.lowerT(p) : this.upperT(1 - p));
  }
  /**
   * Finite for every finite u. On an unbounded side far out, Φ(t) = Φ(u)·mass is solved in log
   * form (Φ(u) underflows there); on a bounded side toX clamps to the bound.
   */
  fromStandardNormal(u: number): number {
    const p = normalCdf(u <= 0 ? u : -u);
    if (p * this.mass < 1e-300) {
      if (u <= 0 && this.min === -Infinity) return this.toX(normalQuantileFromLog(logNormalCdf(u) + Math.log(this.mass)));
      if (u > 0 && this.max === Infinity) return this.toX(-normalQuantileFromLog(logNormalCdf(-u) + Math.log(this.mass)));
    }
    return this.toX(u <= 0 ? this.lowerT(p) : this.upperT(p));
  }
  toStandardNormal(x: number): number {
    const p = this.cdf(x);
    if (p <= 0.5) return normalQuantile(p);
    return normalQuantileUpper(this.sf(x));
  }
}
