/**
 * Eigenvalues of a real symmetric matrix by the cyclic Jacobi method (Golub & Van Loan,
 * Matrix Computations, §8.5): slow for large n but simple and accurate to rounding for the
 * (n−1)×(n−1) curvature matrices SORM needs. Returned in increasing order.
 */
import { throwIfInterrupted } from '../runtime/interruptFlag.js';

export function symmetricEigenvalues(input: number[][]): number[] {
  const n = input.length;
  const a = input.map((row) => row.slice());
  for (let sweep = 0; sweep < 100; sweep++) {
    let off = 0;
    let scale = 0;
    for (let i = 0; i < n; i++) {
      scale += a[i][i] * a[i][i];
      for (let j = i + 1; j < n; j++) off += a[i][j] * a[i][j];
    }
    if (off <= 1e-30 * (scale + off) || off === 0) break;
    for (let p = 0; p < n; p++) {
      throwIfInterrupted('SORM'); // a sweep is O(n³): seconds for a thousand variables
      for (let q = p + 1; q < n; q++) {
        if (a[p][q] === 0) continue;
        // Rotation zeroing a[p][q]: t = tan θ chosen as the smaller root.
        const theta = (a[q][q] - a[p][p]) / (2 * a[p][q]);
        const t = Math.sign(theta || 1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
        const c = 1 / Math.sqrt(t * t + 1);
        const s = t * c;
        for (let k = 0; k < n; k++) {
          const akp = a[k][p];
          const akq = a[k][q];
          a[k][p] = c * akp - s * akq;
          a[k][q] = s * akp + c * akq;
        }
        for (let k = 0; k < n; k++) {
          const apk = a[p][k];
          const aqk = a[q][k];
          a[p][k] = c * apk - s * aqk;
          a[q][k] = s * apk + c * aqk;
        }
      }
    }
  }
  return a.map((row, i) => row[i]).sort((x, y) => x - y);
}
