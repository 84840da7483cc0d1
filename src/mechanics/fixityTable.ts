/**
 * A function of the two fixity factors f_A, f_B ∈ [0, 1] tabulated on a uniform (N+1)×(N+1) grid and
 * interpolated by tensor-product local cubic Lagrange polynomials (4×4 nodes around the point;
 * error O(h⁴) for smooth data). Evaluation allocates nothing.
 */
export interface FixityTable {
  readonly cells: number;
  readonly values: Float64Array;
}

export function buildFixityTable(cells: number, fn: (fA: number, fB: number) => number): FixityTable {
  if (!(Number.isInteger(cells) && cells >= 3)) throw new RangeError('cells must be an integer >= 3');
  const n1 = cells + 1;
  const values = new Float64Array(n1 * n1);
  for (let i = 0; i <= cells; i++) {
    for (let j = 0; j <= cells; j++) values[i * n1 + j] = fn(i / cells, j / cells);
  }
  return { cells, values };
}

export function interpolateFixityTable(t: FixityTable, fA: number, fB: number): number {
  const N = t.cells;
  const n1 = N + 1;
  const v = t.values;
  const x = fA * N;
  const y = fB * N;
  let i = Math.floor(x);
  let j = Math.floor(y);
  if (i < 1) i = 1; else if (i > N - 2) i = N - 2;
  if (j < 1) j = 1; else if (j > N - 2) j = N - 2;
  const s = x - i;
  const u = y - j;
  // cubic Lagrange weights for nodes at offsets −1, 0, 1, 2
  const sa = -s * (s - 1) * (s - 2) / 6, sb = (s + 1) * (s - 1) * (s - 2) / 2;
  const sc = -(s + 1) * s * (s - 2) / 2, sd = (s + 1) * s * (s - 1) / 6;
  const ua = -u * (u - 1) * (u - 2) / 6, ub = (u + 1) * (u - 1) * (u - 2) / 2;
  const uc = -(u + 1) * u * (u - 2) / 2, ud = (u + 1) * u * (u - 1) / 6;
  let acc = 0;
  let row = (i - 1) * n1 + j - 1;
  acc += sa * (ua * v[row] + ub * v[row + 1] + uc * v[row + 2] + ud * v[row + 3]);
  row += n1;
  acc += sb * (ua * v[row] + ub * v[row + 1] + uc * v[row + 2] + ud * v[row + 3]);
  row += n1;
  acc += sc * (ua * v[row] + ub * v[row + 1] + uc * v[row + 2] + ud * v[row + 3]);
  row += n1;
  acc += sd * (ua * v[row] + ub * v[row + 1] + uc * v[row + 2] + ud * v[row + 3]);
  return acc;
}

/** Two tables on one grid, stored interleaved (a, b per node) so that one point reads each cache line once. */
export interface FixityTablePair {
  readonly cells: number;
  readonly values: Float64Array;
}

export function pairFixityTables(a: FixityTable, b: FixityTable): FixityTablePair {
  if (a.cells !== b.cells) throw new RangeError('paired fixity tables must share a grid');
  const values = new Float64Array(2 * a.values.length);
  for (let k = 0; k < a.values.length; k++) {
    values[2 * k] = a.values[k];
    values[2 * k + 1] = b.values[k];
  }
  return { cells: a.cells, values };
}

/**
 * Both tables of a pair at one point, sharing the weights (the braced hot path reads φ and c at
 * the same fixities). out[0], out[1] are exactly what interpolateFixityTable gives for each.
 */
export function interpolateFixityPair(t: FixityTablePair, fA: number, fB: number, out: Float64Array): void {
  const N = t.cells;
  const n2 = 2 * (N + 1);
  const v = t.values;
  const x = fA * N;
  const y = fB * N;
  let i = Math.floor(x);
  let j = Math.floor(y);
  if (i < 1) i = 1; else if (i > N - 2) i = N - 2;
  if (j < 1) j = 1; else if (j > N - 2) j = N - 2;
  const s = x - i;
  const u = y - j;
  const sa = -s * (s - 1) * (s - 2) / 6, sb = (s + 1) * (s - 1) * (s - 2) / 2;
  const sc = -(s + 1) * s * (s - 2) / 2, sd = (s + 1) * s * (s - 1) / 6;
  const ua = -u * (u - 1) * (u - 2) / 6, ub = (u + 1) * (u - 1) * (u - 2) / 2;
  const uc = -(u + 1) * u * (u - 2) / 2, ud = (u + 1) * u * (u - 1) / 6;
  let accA = 0;
  let accB = 0;
  let r = (i - 1) * n2 + 2 * (j - 1);
  accA += sa * (ua * v[r] + ub * v[r + 2] + uc * v[r + 4] + ud * v[r + 6]);
  accB += sa * (ua * v[r + 1] + ub * v[r + 3] + uc * v[r + 5] + ud * v[r + 7]);
  r += n2;
  accA += sb * (ua * v[r] + ub * v[r + 2] + uc * v[r + 4] + ud * v[r + 6]);
  accB += sb * (ua * v[r + 1] + ub * v[r + 3] + uc * v[r + 5] + ud * v[r + 7]);
  r += n2;
  accA += sc * (ua * v[r] + ub * v[r + 2] + uc * v[r + 4] + ud * v[r + 6]);
  accB += sc * (ua * v[r + 1] + ub * v[r + 3] + uc * v[r + 5] + ud * v[r + 7]);
  r += n2;
  accA += sd * (ua * v[r] + ub * v[r + 2] + uc * v[r + 4] + ud * v[r + 6]);
  accB += sd * (ua * v[r + 1] + ub * v[r + 3] + uc * v[r + 5] + ud * v[r + 7]);
  out[0] = accA;
  out[1] = accB;
}
