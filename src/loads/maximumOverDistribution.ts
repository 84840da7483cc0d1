/**
 * The distribution of the largest of n independent values of a load, F_n(x) = F(x)^n, for a
 * real n > 0 (n < 1 goes back from a longer period to a shorter one). A Gumbel stays a Gumbel
 * with the same scale and its location moved by scale·ln n; any other distribution is wrapped
 * and sampled by inverse transform on log-probabilities, so both tails stay accurate:
 *   x = F⁻¹(Φ(u)^(1/n)),  ln Φ(u)^(1/n) = ln Φ(u) / n.
 */
import type { Distribution } from '../probability/distribution.js';
import { gaussHermiteNormal } from '../probability/gaussHermite.js';
import { GumbelDistribution } from '../probability/gumbelDist.js';
import { logNormalCdf, normalQuantileOfLog, powerOfNormalCdf } from '../probability/logProbability.js';

/** Nodes of the quadrature that gives the mean and sd of a wrapped distribution. */
const MOMENT_NODES = 96;
/**
 * Going to a shorter period (n < 1) sends the far lower tail below what Φ can hold in double
 * precision (Φ(u)^(1/n) < 1e-308); such values sit at the base's u = −37, the smallest it
 * represents. Only very small loads are affected, which never govern failure.
 */
const LOWEST_BASE_U = -37;

class MaximumOfDistribution implements Distribution {
  readonly name: Distribution['name'];
  readonly mean: number;
  readonly sd: number;
  readonly params: Readonly<Record<string, number>>;
  constructor(
    private readonly base: Distribution,
    private readonly n: number,
  ) {
    this.name = base.name;
    this.params = Object.freeze({ ...base.params, maximum_of: n });
    // E[X] = ∫ F_n⁻¹(Φ(u)) φ(u) du: Gauss–Hermite in u-space, where the integrand is smooth.
    const { nodes, weights } = gaussHermiteNormal(MOMENT_NODES);
    let m = 0;
    let m2 = 0;
    for (let i = 0; i < nodes.length; i++) {
      const x = this.fromStandardNormal(nodes[i]);
      m += weights[i] * x;
      m2 += weights[i] * x * x;
    }
    this.mean = m;
    this.sd = Math.sqrt(Math.max(0, m2 - m * m));
  }
  private logCdf(x: number): number {
    return this.n * logNormalCdf(this.base.toStandardNormal(x));
  }
  pdf(x: number): number {
    const f = this.base.pdf(x);
    if (f === 0) return 0;
    const logF = logNormalCdf(this.base.toStandardNormal(x));
    return this.n * Math.exp((this.n - 1) * logF) * f;
  }
  cdf(x: number): number {
    return Math.exp(this.logCdf(x));
  }
  sf(x: number): number {
    return -Math.expm1(this.logCdf(x));
  }
  quantile(p: number): number {
    return this.base.quantile(Math.exp(Math.log(p) / this.n));
  }
  fromStandardNormal(u: number): number {
    return this.base.fromStandardNormal(Math.max(LOWEST_BASE_U, powerOfNormalCdf(u, 1 / this.n)));
  }
  toStandardNormal(x: number): number {
    return normalQuantileOfLog(this.logCdf(x));
  }
}

/** The distribution of the largest of n independent copies of `base` (n = 1: `base` itself). */
export function maximumOver(base: Distribution, n: number): Distribution {
  if (!(n > 0) || !Number.isFinite(n)) throw new Error(`maximumOver: n must be a finite number > 0, got ${n}`);
  if (n === 1) return base;
  if (base instanceof GumbelDistribution) return new GumbelDistribution(base.loc + base.scale * Math.log(n), base.scale);
  return new MaximumOfDistribution(base, n);
}
