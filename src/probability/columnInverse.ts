/**
 * F⁻¹(Φ(u)) over a column of u values in place, bit-identical to calling the marginal's own
 * `fromStandardNormal` on each entry. Each distribution class gets its own loop, so the call in
 * the loop always meets one class (V8 inlines it) instead of every marginal of the problem in
 * turn; the normal and lognormal are written out (the same expressions as their classes).
 */
import type { Distribution } from './distribution.js';
import { clampFinite } from './clampFinite.js';
import { GumbelDistribution } from './gumbelDist.js';
import { LognormalDistribution } from './lognormalDist.js';
import { NormalDistribution } from './normalDist.js';

/** In place: col[s] = d.fromStandardNormal(col[s]) for s < count. */
export type ColumnInverse = (col: Float64Array, count: number) => void;

export function columnInverse(d: Distribution): ColumnInverse {
  // exact class only: a subclass may override fromStandardNormal
  if (d.constructor === NormalDistribution) {
    const { mean, sd } = d as NormalDistribution;
    return (col, count) => {
      for (let s = 0; s < count; s++) col[s] = clampFinite(mean + sd * col[s]);
    };
  }
  if (d.constructor === LognormalDistribution) {
    const { lambda, zeta } = d as LognormalDistribution;
    return (col, count) => {
      for (let s = 0; s < count; s++) col[s] = clampFinite(Math.exp(lambda + zeta * col[s]));
    };
  }
  if (d.constructor === GumbelDistribution) {
    const g = d as GumbelDistribution;
    return (col, count) => {
      for (let s = 0; s < count; s++) col[s] = g.fromStandardNormal(col[s]);
    };
  }
  return (col, count) => {
    for (let s = 0; s < count; s++) col[s] = d.fromStandardNormal(col[s]);
  };
}
