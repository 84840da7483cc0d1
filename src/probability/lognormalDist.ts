/**
 * Lognormal distribution: ln X ~ N(lambda, zeta²). From the mean μ and CoV V of X itself:
 * zeta² = ln(1 + V²), lambda = ln μ − zeta²/2 (e.g. Melchers 1999, ch. 3 / App. A).
 */
import type { Distribution } from './distribution.js';
import { normalCdf, normalPdf, normalQuantile } from './normal.js';
import { clampFinite } from './clampFinite.js';

export class LognormalDistribution implements Distribution {
  readonly name = 'lognormal' as const;
  readonly mean: number;
  readonly sd: number;
  readonly params: Readonly<Record<string, number>>;
  constructor(
    readonly lambda: number,
    readonly zeta: number,
  ) {
    this.mean = Math.exp(lambda + 0.5 * zeta * zeta);
    this.sd = this.mean * Math.sqrt(Math.expm1(zeta * zeta));
    this.params = Object.freeze({ lambda, zeta });
  }
  static fromMoments(mean: number, sd: number): LognormalDistribution {
    const v = sd / mean;
    const zeta2 = Math.log1p(v * v);
    return new LognormalDistribution(Math.log(mean) - 0.5 * zeta2, Math.sqrt(zeta2));
  }
  pdf(x: number): number {
    if (!(x > 0)) return 0;
    return normalPdf((Math.log(x) - this.lambda) / this.zeta) / (this.zeta * x);
  }
  cdf(x: number): number {
    if (!(x > 0)) return 0;
    return normalCdf((Math.log(x) - this.lambda) / this.zeta);
  }
  sf(x: number): number {
    if (!(x > 0)) return 1;
    return normalCdf((this.lambda - Math.log(x)) / this.zeta);
  }
  quantile(p: number): number {
    return Math.exp(this.lambda + this.zeta * normalQuantile(p));
  }
  fromStandardNormal(u: number): number {
    return clampFinite(Math.exp(this.lambda + this.zeta * u));
  }
  toStandardNormal(x: number): number {
    if (!(x > 0)) return -Infinity;
    return (Math.log(x) - this.lambda) / this.zeta;
  }
}
