/**
 * The shape every marginal distribution offers to the rest of the program.
 * Parameters are SI numbers; which DistSpec fields a distribution needs is set by
 * docs/scenario-format.md and checked in makeDistribution.ts.
 */

/**
 * 'studentt' and 'logstudentt' are not typed by users: they are the posterior predictive
 * distributions that test evidence produces (src/evidence/, docs/evidence.md), so DIST_NAMES
 * (the names a scenario may give) leaves them out.
 */
export type DistName = 'normal' | 'lognormal' | 'gumbel' | 'uniform' | 'truncnormal' | 'weibull' | 'beta' | 'studentt' | 'logstudentt';

export const DIST_NAMES: readonly DistName[] = [
  'normal',
  'lognormal',
  'gumbel',
  'uniform',
  'truncnormal',
  'weibull',
  'beta',
];

export interface DistSpec {
  dist: DistName;
  mean?: number;
  sd?: number;
  cov?: number;
  min?: number;
  max?: number;
  /** studentt / logstudentt only: location, scale (of ln X for logstudentt) and degrees of freedom. */
  loc?: number;
  scale?: number;
  dof?: number;
}

export interface Distribution {
  readonly name: DistName;
  /** Mean of the variable itself (for truncnormal: of the truncated variable). */
  readonly mean: number;
  /** Standard deviation of the variable itself. */
  readonly sd: number;
  /** The fitted parameters (lambda, zeta, loc, scale, shape ...). */
  readonly params: Readonly<Record<string, number>>;
  pdf(x: number): number;
  cdf(x: number): number;
  /** 1 − F(x) without cancellation. */
  sf(x: number): number;
  /** F⁻¹(p). */
  quantile(p: number): number;
  /** F⁻¹(Φ(u)), accurate in both tails (uses the upper tail for u > 0). */
  fromStandardNormal(u: number): number;
  /** Φ⁻¹(F(x)), accurate in both tails. */
  toStandardNormal(x: number): number;
}

/** A user-facing error about distribution parameters or correlations (message only, no path). */
export class DistributionError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'DistributionError';
  }
}
