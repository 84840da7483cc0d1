/**
 * Nataf's equivalent normal correlation ρ0 for a pair of marginals (Liu & Der Kiureghian,
 * Prob. Eng. Mech. 1(2), 1986): the correlation of the standard normals (U1, U2) for which
 * X_i = F_i⁻¹(Φ(U_i)) have Pearson correlation ρ, i.e. the root of
 *   ρ = E[ Z1(U1) Z2(ρ0 U1 + √(1 − ρ0²) V) ],  Z_i = (X_i − μ_i)/σ_i, U1, V iid N(0,1),
 * with the expectation by an n × n Gauss–Hermite product rule (default 64 × 64) and ρ0 by
 * Brent's method on [−1, 1].
 *
 * A Student-t (or log-Student-t) marginal may have no finite variance (it comes from updating with
 * a few tests), so Pearson's ρ is undefined for it: its pair's ρ0 is that of the normal (lognormal)
 * marginal with the same location and scale, i.e. the stated correlation keeps the dependence
 * (Gaussian copula) it has between the distributions before updating (docs/evidence.md).
 */
import { DistributionError, type Distribution } from './distribution.js';
import { gaussHermiteNormal } from './gaussHermite.js';
import { LognormalDistribution } from './lognormalDist.js';
import { NormalDistribution } from './normalDist.js';
import { findRootBracketed } from './rootBracketed.js';

/** The marginal whose moments stand in for a heavy-tailed t-family marginal. */
function momentSurrogate(d: Distribution): Distribution {
  if (d.name === 'studentt') return new NormalDistribution(d.params.loc!, d.params.scale!);
  if (d.name === 'logstudentt') return new LognormalDistribution(d.params.loc!, d.params.scale!);
  return d;
}

export const NATAF_QUADRATURE_NODES = 64;

/**
 * ρ0 by marginal pair: a sweep builds the same transform for case after case, and the 64 × 64
 * quadrature inside a root search is the costly part of it. Keyed by both marginals' names and
 * parameters (all a Distribution's law depends on), ρ and the rule size; bounded.
 */
const rho0Cache = new Map<string, number>();
const RHO0_CACHE_LIMIT = 4096;

function marginalKey(d: Distribution): string {
  return `${d.name}${JSON.stringify(d.params)}`;
}

/** Standardized marginal values at the nodes, using the rule's own mean and sd so that
 *  ρ0 = 1 with identical marginals gives exactly ρ = 1. */
function standardizedAt(d: Distribution, nodes: Float64Array, weights: Float64Array): (u: number) => number {
  let mean = 0;
  for (let i = 0; i < nodes.length; i++) mean += weights[i] * d.fromStandardNormal(nodes[i]);
  let variance = 0;
  for (let i = 0; i < nodes.length; i++) {
    const dx = d.fromStandardNormal(nodes[i]) - mean;
    variance += weights[i] * dx * dx;
  }
  const sd = Math.sqrt(variance);
  return (u: number) => (d.fromStandardNormal(u) - mean) / sd;
}

/** ρ(ρ0): the physical correlation produced by the normal-space correlation ρ0. */
export function physicalCorrelation(d1: Distribution, d2: Distribution, rho0: number, n = NATAF_QUADRATURE_NODES): number {
  return correlationMap(d1, d2, n)(rho0);
}

function correlationMap(d1: Distribution, d2: Distribution, n: number): (rho0: number) => number {
  const { nodes, weights } = gaussHermiteNormal(n);
  const z1 = standardizedAt(d1, nodes, weights);
  const z2 = standardizedAt(d2, nodes, weights);
  const z1AtNodes = Float64Array.from(nodes, z1);
  return (rho0: number): number => {
    const c = Math.sqrt(Math.max(0, 1 - rho0 * rho0));
    let total = 0;
    for (let i = 0; i < n; i++) {
      let inner = 0;
      const shift = rho0 * nodes[i];
      for (let j = 0; j < n; j++) inner += weights[j] * z2(shift + c * nodes[j]);
      total += weights[i] * z1AtNodes[i] * inner;
    }
    return total;
  };
}

/**
 * The normal-space correlation ρ0 that gives physical correlation `rho` between d1 and d2.
 * Throws DistributionError if |rho| ≥ 1 or rho is outside what these marginals can reach.
 */
export function equivalentCorrelation(d1: Distribution, d2: Distribution, rho: number, n = NATAF_QUADRATURE_NODES): number {
  if (!Number.isFinite(rho) || Math.abs(rho) >= 1) {
    throw new DistributionError(`correlation ${rho} must lie strictly between -1 and 1`);
  }
  if (rho === 0) return 0;
  d1 = momentSurrogate(d1);
  d2 = momentSurrogate(d2);
  if (d1.name === 'normal' && d2.name === 'normal') return rho; // linear maps keep ρ
  const key = `${marginalKey(d1)}|${marginalKey(d2)}|${rho}|${n}`;
  const known = rho0Cache.get(key);
  if (known !== undefined) return known;
  const rho0 = solveEquivalentCorrelation(d1, d2, rho, n);
  if (rho0Cache.size >= RHO0_CACHE_LIMIT) rho0Cache.clear();
  rho0Cache.set(key, rho0);
  return rho0;
}

function solveEquivalentCorrelation(d1: Distribution, d2: Distribution, rho: number, n: number): number {
  const map = correlationMap(d1, d2, n);
  const lowest = map(-1);
  const highest = map(1);
  if (!(rho > lowest && rho < highest)) {
    throw new DistributionError(
      `correlation ${rho} cannot be reached by a ${d1.name} and a ${d2.name} variable with these parameters ` +
        `(attainable range (${lowest.toFixed(4)}, ${highest.toFixed(4)}))`,
    );
  }
  return findRootBracketed((r0) => map(r0) - rho, -1, 1, { xTolerance: 1e-13 });
}
