/** Normal distribution N(mean, sd²). */
import type { Distribution } from './distribution.js';
import { normalCdf, normalPdf, normalQuantile } from './normal.js';
import { clampFinite } from './clampFinite.js';

export class NormalDistribution implements Distribution {
  readonly name = 'normal' as const;
  readonly params: Readonly<Record<string, number>>;
  constructor(
    readonly mean: number,
    readonly sd: number,
  ) {
    this.params = Object.freeze({ mean, sd });
  }
  pdf(x: number): number {
    return normalPdf((x - this.mean) / this.sd) / this.sd;
  }
  cdf(x: number): number {
    return normalCdf((x - this.mean) / this.sd);
  }
  sf(x: number): number {
    return normalCdf((this.mean - x) / this.sd);
  }
  quantile(p: number): number {
    return this.mean + this.sd * normalQuantile(p);
  }
  fromStandardNormal(u: number): number {
    return clampFinite(this.mean + this.sd * u);
  }
  toStandardNormal(x: number): number {
    return (x - this.mean) / this.sd;
  }
}
