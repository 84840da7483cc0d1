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
