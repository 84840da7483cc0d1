/**
 * Sobol index estimators on the outputs of the A, B, A_B^(i) design, over a set of row
 * indices (all rows for the estimate, a resample for the bootstrap).
 *
 * First order (Saltelli et al. 2010, Comput. Phys. Commun. 181, eq. (b) of table 2):
 *   V_i ≈ (1/N) Σ_j f(B)_j (f(A_B^(i))_j − f(A)_j)
 * Total (Jansen 1999):
 *   V_Ti ≈ (1/2N) Σ_j (f(A)_j − f(A_B^(i))_j)²
 * Both divided by the variance of the 2N outputs of A and B together.
 */
export interface DesignOutputs {
  fA: Float64Array;
  fB: Float64Array;
  fAB: Float64Array;
}

/** Writes S_i into first[i] and S_Ti into total[i]; returns the output variance used. */
export function sobolEstimates(
  out: DesignOutputs,
  n: number,
  d: number,
  rows: Int32Array,
  first: Float64Array,
  total: Float64Array,
): number {
  const m = rows.length;
  let sum = 0;
  for (let k = 0; k < m; k++) sum += out.fA[rows[k]] + out.fB[rows[k]];
  const mean = sum / (2 * m);
  let ss = 0;
  for (let k = 0; k < m; k++) {
    const da = out.fA[rows[k]] - mean;
    const db = out.fB[rows[k]] - mean;
    ss += da * da + db * db;
  }
  const variance = ss / (2 * m - 1);
  for (let i = 0; i < d; i++) {
    const block = i * n;
    let vFirst = 0;
    let vTotal = 0;
    for (let k = 0; k < m; k++) {
      const j = rows[k];
      const fa = out.fA[j];
      const fab = out.fAB[block + j];
      vFirst += out.fB[j] * (fab - fa);
      vTotal += (fa - fab) * (fa - fab);
    }
    first[i] = vFirst / m / variance;
    total[i] = vTotal / (2 * m) / variance;
  }
  return variance;
}
