/**
 * The Nataf transformation between independent standard normals u and physical variables x:
 *   z = L0 u,  x_i = F_i⁻¹(Φ(z_i)),
 * with L0 the Cholesky factor of the equivalent normal correlation matrix R0 (pairwise ρ0
 * from equivalentCorrelation.ts). Both directions use preallocated buffers: no allocation
 * per call, so they can sit in a sampling loop.
 */
import { choleskyLower, lowerSolve, sparseLower, sparseLowerTimes } from './cholesky.js';
import { DistributionError, type Distribution } from './distribution.js';
import { equivalentCorrelation } from './equivalentCorrelation.js';
import { columnInverse } from './columnInverse.js';

export { equivalentCorrelation, physicalCorrelation } from './equivalentCorrelation.js';

export interface IsoTransform {
  readonly n: number;
  toPhysical(u: Float64Array, x: Float64Array): void; // u (indep. std normal) → x
  toStandard(x: Float64Array, u: Float64Array): void;
  /**
   * Optional: many points at once, u row-major (uRows[r·n + i]) → x column-wise (columns[i][r]),
   * for r < count; bit-identical to toPhysical on each row.
   */
  toPhysicalRows?(uRows: Float64Array, count: number, columns: Float64Array[]): void;
}

/** What natafTransform returns: the IsoTransform plus the pieces it was built from. */
export interface NatafTransform extends IsoTransform {
  readonly marginals: readonly Distribution[];
  /** equivalent normal correlation matrix R0 (identity when independent) */
  readonly normalCorrelation: readonly (readonly number[])[];
  /** row-major lower Cholesky factor of R0, or null when the variables are independent */
  readonly lower: Float64Array | null;
  toPhysicalRows(uRows: Float64Array, count: number, columns: Float64Array[]): void;
}

const SYMMETRY_TOLERANCE = 1e-10;

function label(names: readonly string[] | undefined, i: number): string {
  return names?.[i] ?? `#${i + 1}`;
}

function checkCorrelationMatrix(R: number[][], n: number, names?: readonly string[]): void {
  if (R.length !== n || R.some((row) => !Array.isArray(row) || row.length !== n)) {
    throw new DistributionError(`correlation matrix must be ${n} × ${n} (one row and column per random variable)`);
  }
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const r = R[i][j];
      if (!Number.isFinite(r)) throw new DistributionError(`correlation between ${label(names, i)} and ${label(names, j)} is not a finite number`);
      if (i === j) {
        if (Math.abs(r - 1) > SYMMETRY_TOLERANCE) throw new DistributionError(`correlation of ${label(names, i)} with itself must be 1, got ${r}`);
      } else {
        if (Math.abs(r) >= 1) {
          throw new DistributionError(`correlation between ${label(names, i)} and ${label(names, j)} is ${r}; it must lie strictly between -1 and 1`);
        }
        if (Math.abs(r - R[j][i]) > SYMMETRY_TOLERANCE) {
          throw new DistributionError(`correlation matrix is not symmetric at ${label(names, i)}, ${label(names, j)}`);
        }
      }
    }
  }
}

/**
 * Build the transformation. `correlation` is the Pearson correlation matrix of the physical
 * variables (null = independent). `names` (optional) label variables in error messages.
 * Throws DistributionError for |ρ| ≥ 1, an asymmetric or non positive-definite matrix,
 * a correlation the marginals cannot reach, or a non positive-definite R0.
 */
export function natafTransform(
  dists: Distribution[],
  correlation: number[][] | null,
  names?: readonly string[],
): NatafTransform {
  const n = dists.length;
  const marginals = dists.slice();
  const R0: number[][] = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? 1 : 0)));
  let correlated = false;
  if (correlation !== null) {
    checkCorrelationMatrix(correlation, n, names);
    if (choleskyLower(correlation) === null) {
      throw new DistributionError('correlation matrix is not positive definite');
    }
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < i; j++) {
        const rho = 0.5 * (correlation[i][j] + correlation[j][i]);
        if (rho === 0) continue;
        correlated = true;
        try {
          R0[i][j] = R0[j][i] = equivalentCorrelation(marginals[i], marginals[j], rho);
        } catch (e) {
          if (e instanceof DistributionError) {
            throw new DistributionError(`${label(names, j)} and ${label(names, i)}: ${e.message}`);
          }
          throw e;
        }
      }
    }
  }
  const lower = correlated ? choleskyLower(R0) : null;
  if (correlated && lower === null) {
    throw new DistributionError(
      'the equivalent normal correlation matrix (Nataf) is not positive definite; reduce the correlations',
    );
  }
  const z = new Float64Array(n);
  // independent variables have identity rows in L₀: skip the zeros (hot in the FORM self-check)
  const sparse = lower ? sparseLower(lower, n) : null;
  const toPhysical = sparse
    ? (u: Float64Array, x: Float64Array): void => {
        sparseLowerTimes(sparse, u, z);
        for (let i = 0; i < n; i++) x[i] = marginals[i].fromStandardNormal(z[i]);
      }
    : (u: Float64Array, x: Float64Array): void => {
        for (let i = 0; i < n; i++) x[i] = marginals[i].fromStandardNormal(u[i]);
      };
  const toStandard = lower
    ? (x: Float64Array, u: Float64Array): void => {
        for (let i = 0; i < n; i++) z[i] = marginals[i].toStandardNormal(x[i]);
        lowerSolve(lower, n, z, u);
      }
    : (x: Float64Array, u: Float64Array): void => {
        for (let i = 0; i < n; i++) u[i] = marginals[i].toStandardNormal(x[i]);
      };
  // column-wise: z_i = Σ L0[i][k] u_k over the nonzero entries in toPhysical's order (so the same
  // sums, bit for bit), then each marginal's inverse over its whole column
  const inverses = marginals.map(columnInverse);
  const toPhysicalRows = (uRows: Float64Array, count: number, columns: Float64Array[]): void => {
    for (let i = 0; i < n; i++) {
      const col = columns[i];
      if (sparse === null) {
        for (let r = 0, at = i; r < count; r++, at += n) col[r] = uRows[at];
      } else {
        const from = sparse.start[i];
        const to = sparse.start[i + 1];
        for (let r = 0, row = 0; r < count; r++, row += n) {
          let sum = 0;
          for (let e = from; e < to; e++) sum += sparse.value[e] * uRows[row + sparse.column[e]];
          col[r] = sum;
        }
      }
      inverses[i](col, count);
    }
  };
  return { n, marginals, normalCorrelation: R0, lower, toPhysical, toStandard, toPhysicalRows };
}
