import { describe, expect, it } from 'vitest';
import { choleskyInPlace } from '../../src/fe/cholesky.js';
import { generalizedEigenvalues } from '../../src/fe/generalizedEigenvalues.js';
import { symmetricEigenvalues } from '../../src/fe/symmetricEigenvalues.js';

describe('dense symmetric eigenvalues', () => {
  // source: eigenvalues of the tridiagonal Toeplitz matrix tridiag(−1, 2, −1): 2 − 2cos(kπ/(n+1)) (standard result, e.g. Strang, Linear Algebra; from memory)
  it('tridiagonal Toeplitz', () => {
    for (const n of [1, 2, 7, 60]) {
      const a = new Float64Array(n * n);
      for (let i = 0; i < n; i++) {
        a[i * n + i] = 2;
        if (i > 0) a[i * n + i - 1] = a[(i - 1) * n + i] = -1;
      }
      const ev = symmetricEigenvalues(a, n);
      for (let k = 1; k <= n; k++) expect(Math.abs(ev[k - 1] - (2 - 2 * Math.cos((k * Math.PI) / (n + 1))))).toBeLessThan(1e-12);
    }
  });
  // common practice: similarity invariants — trace and Frobenius norm equal the sum of λ and of λ²
  it('dense matrix invariants', () => {
    const n = 40;
    const a = new Float64Array(n * n);
    for (let i = 0; i < n; i++) for (let j = 0; j <= i; j++) a[i * n + j] = a[j * n + i] = Math.sin(1 + i * 7.3 + j * 3.1) + (i === j ? 3 : 0);
    let tr = 0, fro = 0;
    for (let i = 0; i < n; i++) tr += a[i * n + i];
    for (let k = 0; k < n * n; k++) fro += a[k] * a[k];
    const ev = symmetricEigenvalues(Float64Array.from(a), n);
    expect(Math.abs(ev.reduce((s, v) => s + v, 0) - tr)).toBeLessThan(1e-10);
    expect(Math.abs(ev.reduce((s, v) => s + v * v, 0) - fro)).toBeLessThan(1e-9);
    for (let i = 1; i < n; i++) expect(ev[i]).toBeGreaterThanOrEqual(ev[i - 1]);
  });
  // common practice: K v = λ M v with diagonal matrices has λ = K_ii / M_ii
  it('generalized problem and Cholesky', () => {
    const K = Float64Array.from([4, 0, 0, 0, 9, 0, 0, 0, 1]);
    const M = Float64Array.from([2, 0, 0, 0, 1, 0, 0, 0, 4]);
    generalizedEigenvalues(K, M, 3).forEach((v, i) => expect(Math.abs(v - [0.25, 2, 9][i])).toBeLessThan(1e-14));
    expect(() => choleskyInPlace(Float64Array.from([1, 2, 2, 1]), 2)).toThrow();
  });
});
