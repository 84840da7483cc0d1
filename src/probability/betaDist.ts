/**
 * Beta distribution on [min, max] with shape parameters a, b > 0.
 * From mean μ and sd σ on the unit interval (m = (μ − min)/(max − min), s = σ/(max − min)):
 * ν = m(1 − m)/s² − 1 > 0, a = mν, b = (1 − m)ν (method of moments).
 */
import type { Distribution } from './distribution.js';
import { invRegIncBetaLower, regIncBeta, regIncBetaComplement } from './incompleteBeta.js';
import { logBeta } from './logGamma.js';
import { normalCdf, normalQuantile, normalQuantileUpper } from './normal.js';

export class BetaDistribution implements Distribution {
  readonly name = 'beta' as const;
  readonly mean: number;
  readonly sd: number;
  readonly params: Readonly<Record<string, number>>;
  private readonly width: number;
  private readonly lnB: number;
  constructor(
    readonly a: number,
    readonly b: number,
    readonly min: number,
    readonly max: number,
  ) {
    this.width = max - min;
    this.lnB = logBeta(a, b);
    const m = a / (a + b);
    this.mean = min + this.width * m;
    this.sd = this.width * Math.sqrt((a * b) / ((a + b) * (a + b) * (a + b + 1)));
    this.params = Object.freeze({ a, b, min, max });
  }
  /** unit-interval shape parameters (a, b) from the moments; ν ≤ 0 means impossible moments */
  static shapesFromMoments(mean: number, sd: number, min: number, max: number): { a: number; b: number; nu: number } {
    const m = (mean - min) / (max - min);
    const s = sd / (max - min);
    const nu = (m * (1 - m)) / (s * s) - 1;
    return { a: m * nu, b: (1 - m) * nu, nu };
  }
  pdf(x: number): number {
    if (x < this.min || x > this.max) return 0;
    const y = (x - this.min) / this.width;
    const yc = (this.max - x) / this.width;
    return Math.exp((this.a - 1) * Math.log(y) + (this.b - 1) * Math.log(yc) - this.lnB) / this.width;
  }
  cdf(x: number): number {
    if (x <= this.min) return 0;
    if (x >= this.max) return 1;
    return regIncBeta((x - this.min) / this.width, (this.max - x) / this.width, this.a, this.b);
  }
  sf(x: number): number {
    if (x <= this.min) return 1;
    if (x >= this.max) return 0;
    return regIncBetaComplement((x - this.min) / this.width, (this.max - x) / this.width, this.a, this.b);
  }
  /** x with F(x) = p for p ≤ 1/2 */
  private lowerX(p: number): number {
    return this.min + this.width * invRegIncBetaLower(p, this.a, this.b);
  }
  /** x with 1 − F(x) = q for q ≤ 1/2: 1 − y solves I_{1−y}(b, a) = q */
  private upperX(q: number): number {
    return this.max - this.width * invRegIncBetaLower(q, this.b, this.a);
  }
  quantile(p: number): number {
    return p <= 0.5 ? this.lowerX(p) : this.upperX(1 - p);
  }
  fromStandardNormal(u: number): number {
    return u <= 0 ? this.lowerX(normalCdf(u)) : this.upperX(normalCdf(-u));
  }
  toStandardNormal(x: number): number {
    const p = this.cdf(x);
    if (p <= 0.5) return normalQuantile(p);
    return normalQuantileUpper(this.sf(x));
  }
}
