/**
 * Crude Monte Carlo draws as column-wise passes over blocks of samples: one Float64Array per
 * variable, filled variable by variable, then handed to g one sample at a time.
 *
 * With a Nataf transform (probability/nataf.ts) the draws skip u-space where they can:
 * - an independent normal or lognormal variable: ziggurat normals z, then μ + σz or exp(λ + ζz);
 * - any other independent variable: its own inverse CDF of a uniform, x = F⁻¹(U) (no Φ⁻¹, no Φ;
 *   written out for the Gumbel);
 * - the correlated variables only: z = L₀ u over that block (L₀ the Cholesky factor of R₀
 *   restricted to them; R₀ is the identity elsewhere), then x = F⁻¹(Φ(z)).
 * Each is an exact draw from the same joint distribution as x = T(u), u ~ N(0, I).
 * Any other transform: ziggurat u, then transform.toPhysical per sample.
 *
 * Column order and block size fix which random number goes where, so a chunk's samples depend
 * only on its (seed, stream): the same whatever the number of workers.
 */
import { BlockRng } from '../probability/blockRng.js';
import { choleskyLower } from '../probability/cholesky.js';
import type { Distribution } from '../probability/distribution.js';
import { LognormalDistribution } from '../probability/lognormalDist.js';
import type { IsoTransform, NatafTransform } from '../probability/nataf.js';
import { NormalDistribution } from '../probability/normalDist.js';
import { fillNormal } from '../probability/ziggurat.js';
import { GumbelDistribution } from '../probability/gumbelDist.js';

/** Samples per block: 8 variables × 512 × 8 bytes stay within a first-level cache. */
export const BLOCK_SIZE = 512;

/** Fills `columns[i][0 … count)` with the next `count` draws of variable i. */
export type BlockFiller = (rng: BlockRng, count: number) => void;

export interface BlockSampler {
  /** One column per physical variable, BLOCK_SIZE long. */
  readonly columns: Float64Array[];
  readonly fill: BlockFiller;
}

function isNataf(t: IsoTransform): t is NatafTransform {
  const c = t as Partial<NatafTransform>;
  return Array.isArray(c.marginals) && Array.isArray(c.normalCorrelation) && c.marginals.length === t.n;
}

export function makeBlockSampler(transform: IsoTransform): BlockSampler {
  const n = transform.n;
  const columns = Array.from({ length: n }, () => new Float64Array(BLOCK_SIZE));
  if (!isNataf(transform)) return { columns, fill: generalFiller(transform, columns) };
  return { columns, fill: natafFiller(transform, columns) };
}

/** u ~ N(0, I) column-wise, then x = T(u) per sample. */
function generalFiller(transform: IsoTransform, columns: Float64Array[]): BlockFiller {
  const n = transform.n;
  const uCols = Array.from({ length: n }, () => new Float64Array(BLOCK_SIZE));
  const u = new Float64Array(n);
  const x = new Float64Array(n);
  return (rng, count) => {
    for (let i = 0; i < n; i++) fillNormal(rng, uCols[i], count);
    for (let s = 0; s < count; s++) {
      for (let i = 0; i < n; i++) u[i] = uCols[i][s];
      transform.toPhysical(u, x);
      for (let i = 0; i < n; i++) columns[i][s] = x[i];
    }
  };
}

type ColumnPass = (rng: BlockRng, count: number) => void;

function natafFiller(t: NatafTransform, columns: Float64Array[]): BlockFiller {
  const n = t.n;
  const R0 = t.normalCorrelation;
  const correlated: number[] = [];
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      if (i !== j && R0[i][j] !== 0) {
        correlated.push(i);
        break;
      }
    }
  }
  const passes: ColumnPass[] = [];
  for (let i = 0; i < n; i++) {
    if (!correlated.includes(i)) passes.push(independentPass(t.marginals[i], columns[i]));
  }
  if (correlated.length > 0) passes.push(correlatedPass(correlated, R0, t.marginals, columns));
  return (rng, count) => {
    for (const pass of passes) pass(rng, count);
  };
}

/** In place: col[s] = F⁻¹(Φ(col[s])), written out for the normal and lognormal. */
function fromNormalPass(d: Distribution, col: Float64Array): (count: number) => void {
  if (d instanceof NormalDistribution) {
    const mean = d.mean;
    const sd = d.sd;
    return (count) => {
      for (let s = 0; s < count; s++) col[s] = mean + sd * col[s];
    };
  }
  if (d instanceof LognormalDistribution) {
    const lambda = d.lambda;
    const zeta = d.zeta;
    return (count) => {
      for (let s = 0; s < count; s++) col[s] = Math.exp(lambda + zeta * col[s]);
    };
  }
  return (count) => {
    for (let s = 0; s < count; s++) col[s] = d.fromStandardNormal(col[s]);
  };
}

function independentPass(d: Distribution, col: Float64Array): ColumnPass {
  if (d instanceof NormalDistribution || d instanceof LognormalDistribution) {
    const toPhysical = fromNormalPass(d, col);
    return (rng, count) => {
      fillNormal(rng, col, count);
      toPhysical(count);
    };
  }
  if (d instanceof GumbelDistribution) {
    // F⁻¹(U) = loc − scale ln(−ln U); U is an exact double, so ln U keeps its accuracy near 1.
    const loc = d.loc;
    const scale = d.scale;
    return (rng, count) => {
      rng.fillUniform(col, count);
      for (let s = 0; s < count; s++) col[s] = loc - scale * Math.log(-Math.log(col[s]));
    };
  }
  return (rng, count) => {
    rng.fillUniform(col, count);
    for (let s = 0; s < count; s++) col[s] = d.quantile(col[s]);
  };
}

/** z = L₀ u over the correlated variables only, column-wise (axpy per entry of L₀). */
function correlatedPass(
  idx: number[],
  R0: readonly (readonly number[])[],
  marginals: readonly Distribution[],
  columns: Float64Array[],
): ColumnPass {
  const m = idx.length;
  const L = choleskyLower(idx.map((i) => idx.map((j) => R0[i][j])));
  // natafTransform already factored the whole R₀; a principal block of a positive-definite matrix is positive definite.
  if (L === null) throw new Error('correlated block of R0 is not positive definite');
  const u = Array.from({ length: m }, () => new Float64Array(BLOCK_SIZE));
  const toPhysical = idx.map((i) => fromNormalPass(marginals[i], columns[i]));
  return (rng, count) => {
    for (let a = 0; a < m; a++) fillNormal(rng, u[a], count);
    for (let a = 0; a < m; a++) {
      const col = columns[idx[a]];
      col.fill(0, 0, count);
      for (let b = 0; b <= a; b++) {
        const l = L[a * m + b];
        if (l === 0) continue;
        const ub = u[b];
        for (let s = 0; s < count; s++) col[s] += l * ub[s];
      }
      toPhysical[a](count);
    }
  };
}
