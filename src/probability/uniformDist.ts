/** Uniform distribution on [min, max]. */
import type { Distribution } from './distribution.js';
import { normalCdf, normalQuantile, normalQuantileUpper } from './normal.js';

export class UniformDistribution implements Distribution {
  readonly name = 'uniform' as const;
  readonly mean: number;
  readonly sd: number;
  readonly params: Readonly<Record<string, number>>;
  private readonly width: number;
  constructor(
    readonly min: number,
    readonly max: number,
  ) {
    this.width = max - min;
    this.mean = 0.5 * (min + max);
    this.sd = this.width / Math.sqrt(12);
    this.params = Object.freeze({ min, max });
  }
  pdf(x: number): number {
    return x >= this.min && x <= this.max ? 1 / this.width : 0;
  }
  cdf(x: number): number {
    if (x <= this.min) return 0;
    if (x >= this.max) return 1;
    return (x - this.min) / this.width;
  }
  sf(x: number): number {
    if (x <= this.min) return 1;
    if (x >= this.max) return 0;
    return (this.max - x) / this.width;
  }
  quantile(p: number): number {
    if (p > 0.5) return this.max - (1 - p) * this.width;
    return this.min + p * this.width;
  }
  fromStandardNormal(u: number): number {
    if (u <= 0) return this.min + this.width * normalCdf(u);
    return this.max - this.width * normalCdf(-u);
  }
  toStandardNormal(x: number): number {
    if (x <= this.mean) return normalQuantile(this.cdf(x));
    return normalQuantileUpper(this.sf(x));
  }
}
