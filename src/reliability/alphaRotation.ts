/**
 * Orthonormal basis whose last row is the unit vector α (Gram–Schmidt on α followed by the
 * unit axes), so that y = R u puts the design-point direction on the last axis.
 */
import { norm } from './vector.js';
import { throwIfInterrupted } from '../runtime/interruptFlag.js';

export function alphaRotation(alpha: ArrayLike<number>): number[][] {
  const n = alpha.length;
  const a = Array.from(alpha);
  const len = norm(a);
  if (!(len > 0)) throw new Error('alphaRotation: zero direction');
  const basis: number[][] = [a.map((v) => v / len)];
  // Add the axes in order of least alignment with α, so no near-parallel vector is orthogonalised.
  const axes = Array.from({ length: n }, (_, i) => i).sort((i, j) => Math.abs(a[i]) - Math.abs(a[j]));
  for (const k of axes) {
    if (basis.length === n) break;
    throwIfInterrupted('SORM'); // O(n³) in all: seconds for a thousand variables
    const v = Array.from({ length: n }, (_, i) => (i === k ? 1 : 0));
    for (let pass = 0; pass < 2; pass++) {
      // Twice: classical Gram–Schmidt re-orthogonalised keeps orthogonality to rounding.
      for (const b of basis) {
        let p = 0;
        for (let i = 0; i < n; i++) p += v[i] * b[i];
        for (let i = 0; i < n; i++) v[i] -= p * b[i];
      }
    }
    const vl = norm(v);
    if (vl > 1e-8) basis.push(v.map((x) => x / vl));
  }
  if (basis.length !== n) throw new Error('alphaRotation: could not complete the basis');
  return [...basis.slice(1), basis[0]];
}
