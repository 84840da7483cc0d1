/**
 * Student's t distribution with ν degrees of freedom, shifted and scaled: X = loc + scale·T, and
 * its log form (ln X = loc + scale·T). Both arise as posterior predictive distributions when a
 * normal (or lognormal) population with unknown mean and variance is updated with test results
 * (docs/evidence.md).
 *
 * CDF through the regularized incomplete beta function (Abramowitz & Stegun 26.7.1):
 *   P(T ≤ −|t|) = ½ · I_{ν/(ν+t²)}(ν/2, ½),
 * always evaluated on the lower side so that neither tail loses digits; the quantile inverts the
 * same relation (for central probabilities through the complement I_{t²/(ν+t²)}(½, ν/2)).
 */
import { clampFinite } from './clampFinite.js';
import type { Distribution } from './distribution.js';
import { invRegIncBetaLower, regIncBeta } from './incompleteBeta.js';
import { logBeta } from './logGamma.js';
import { normalCdf, normalQuantile, normalQuantileUpper } from './normal.js';

/** P(T ≤ t) for t ≤ 0 (the lower tail), ν > 0. */
function lowerTail(t: number, nu: number): number {
  const t2 = t * t;
  return 0.5 * regIncBeta(nu / (nu + t2), t2 / (nu + t2), 0.5 * nu, 0.5);
}

/** P(T ≤ t), accurate in both tails. */
export function studentTCdf(t: number, nu: number): number {
  if (Number.isNaN(t)) return NaN;
  if (t === -Infinity) return 0;
  if (t === Infinity) return 1;
  return t <= 0 ? lowerTail(t, nu) : 1 - lowerTail(-t, nu);
}

/** P(T > t), accurate in both tails. */
export function studentTSf(t: number, nu: number): number {
  return studentTCdf(-t, nu);
}

/** The density of T. */
export function studentTPdf(t: number, nu: number): number {
  return Math.exp(-0.5 * (nu + 1) * Math.log1p((t * t) / nu) - 0.5 * Math.log(nu) - logBeta(0.5 * nu, 0.5));
}

/** t ≤ 0 with P(T ≤ t) = p, for 0 ≤ p ≤ ½. */
function lowerQuantile(p: number, nu: number): number {
  if (p <= 0) return -Infinity;
  const q = 2 * p; // = I_x(ν/2, ½) with x = ν/(ν+t²)
  if (q <= 0.5) {
    const x = invRegIncBetaLower(q, 0.5 * nu, 0.5);
    if (x === 0) return -Infinity;
    return -Math.sqrt((nu * (1 - x)) / x);
  }
  // central: y = t²/(ν+t²) solves I_y(½, ν/2) = 1 − q, without forming 1 − x
  const y = invRegIncBetaLower(1 - q, 0.5, 0.5 * nu);
  return -Math.sqrt((nu * y) / (1 - y));
}

/** T's p-quantile, 0 ≤ p ≤ 1. */
export function studentTQuantile(p: number, nu: number): number {
  return p <= 0.5 ? lowerQuantile(p, nu) : -lowerQuantile(1 - p, nu);
}

/** T's quantile at upper-tail probability q (accurate for tiny q). */
export function studentTQuantileUpper(q: number, nu: number): number {
  return -lowerQuantile(q, nu);
}

/** u → t with P(T ≤ t) = Φ(u), using the tail on u's side. */
function tFromStandardNormal(u: number, nu: number): number {
  return u <= 0 ? lowerQuantile(normalCdf(u), nu) : -lowerQuantile(normalCdf(-u), nu);
}

/** t → u with Φ(u) = P(T ≤ t), using the tail on t's side. */
function standardNormalFromT(t: number, nu: number): number {
  return t <= 0 ? normalQuantile(lowerTail(t, nu)) : normalQuantileUpper(lowerTail(-t, nu));
}

/** X = loc + scale·T_ν. Mean loc (ν > 1), sd scale·√(ν/(ν−2)) (ν > 2, else Infinity). */
export class StudentTDistribution implements Distribution {
  readonly name = 'studentt' as const;
  readonly mean: number;
  readonly sd: number;
  readonly params: Readonly<Record<string, number>>;
  constructor(
    readonly loc: number,
    readonly scale: number,
    readonly dof: number,
  ) {
    this.mean = loc;
    this.sd = dof > 2 ? scale * Math.sqrt(dof / (dof - 2)) : Infinity;
    this.params = Object.freeze({ loc, scale, dof });
  }
  pdf(x: number): number {
    return studentTPdf((x - this.loc) / this.scale, this.dof) / this.scale;
  }
  cdf(x: number): number {
    return studentTCdf((x - this.loc) / this.scale, this.dof);
  }
  sf(x: number): number {
    return studentTSf((x - this.loc) / this.scale, this.dof);
  }
  quantile(p: number): number {
    return this.loc + this.scale * studentTQuantile(p, this.dof);
  }
  fromStandardNormal(u: number): number {
    return clampFinite(this.loc + this.scale * tFromStandardNormal(u, this.dof));
  }
  toStandardNormal(x: number): number {
    return standardNormalFromT((x - this.loc) / this.scale, this.dof);
  }
}

/**
 * ln X = loc + scale·T_ν (the predictive of a lognormal population). Every moment of X is infinite,
 * so `mean` and `sd` are those of the lognormal with the same ln-location and ln-scale,
 * exp(loc + scale²/2) and mean·√(exp(scale²) − 1): a central value for starting points and
 * tables only. Probabilities and quantiles are exact.
 */
export class LogStudentTDistribution implements Distribution {
  readonly name = 'logstudentt' as const;
  readonly mean: number;
  readonly sd: number;
  readonly params: Readonly<Record<string, number>>;
  constructor(
    readonly loc: number,
    readonly scale: number,
    readonly dof: number,
  ) {
    this.mean = Math.exp(loc + 0.5 * scale * scale);
    this.sd = this.mean * Math.sqrt(Math.expm1(scale * scale));
    this.params = Object.freeze({ loc, scale, dof });
  }
  pdf(x: number): number {
    if (!(x > 0)) return 0;
    return studentTPdf((Math.log(x) - this.loc) / this.scale, this.dof) / (this.scale * x);
  }
  cdf(x: number): number {
    if (!(x > 0)) return 0;
    return studentTCdf((Math.log(x) - this.loc) / this.scale, this.dof);
  }
  sf(x: number): number {
    if (!(x > 0)) return 1;
    return studentTSf((Math.log(x) - this.loc) / this.scale, this.dof);
  }
  quantile(p: number): number {
    return Math.exp(this.loc + this.scale * studentTQuantile(p, this.dof));
  }
  fromStandardNormal(u: number): number {
    return clampFinite(Math.exp(this.loc + this.scale * tFromStandardNormal(u, this.dof)));
  }
  toStandardNormal(x: number): number {
    if (!(x > 0)) return -Infinity;
    return standardNormalFromT((Math.log(x) - this.loc) / this.scale, this.dof);
  }
}
