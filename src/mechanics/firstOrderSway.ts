import type { EndRestraint } from './types.js';

/**
 * First-order (P = 0) bending moment of the spring-restrained sway member under a uniform line load w
 * along the height and a horizontal force H at the top, per unit axial load (docs/beam-column.md,
 * "EN 1993-1-1 in a sway frame"): m(ξ) = q m_w(ξ) + h m_H(ξ) (m), q = (w/P) L², h = (H/P) L, returned as the
 * quadratic c0 + c1 ξ + c2 ξ². Sign as in beamColumn.ts: M = −EI v''.
 *
 * On the column with EI = L = 1: v'''' = w, v = Cξ + Bξ² + Aξ³ + wξ⁴/24 (v(0) = 0), with
 *   bottom spring  R v'(0) − v''(0) = 0,  top spring  R v'(1) + v''(1) = 0,
 *   top shear      v'''(1) = T v(1) − H          (the P = 0 form of beamColumn.ts's conditions),
 * each scaled by 1/(1+R) (or 1/(1+T)) so that R = ∞ needs no special case; M = −(2B + 6Aξ + wξ²/2).
 * A mechanism at P = 0 (no restraint against sway) has no solution: NaN.
 */
export function firstOrderSwayMoment(r: EndRestraint, q: number, h: number): { c0: number; c1: number; c2: number } {
  const aB = 1 / (1 + r.bottom);
  const bB = r.bottom === Infinity ? 1 : r.bottom / (1 + r.bottom);
  const aT = 1 / (1 + r.top);
  const bT = r.top === Infinity ? 1 : r.top / (1 + r.top);
  const T = r.lateral ?? 0;
  const aL = 1 / (1 + T);
  const bL = T === Infinity ? 1 : T / (1 + T);
  // rows [A B C | rhs] with w = q and H = h (the solution is linear in both)
  const m = [
    [0, -2 * aB, bB, 0],
    [3 * bT + 6 * aT, 2 * bT + 2 * aT, bT, -bT * q / 6 - aT * q / 2],
    [6 * aL - bL, -bL, -bL, -aL * h - aL * q + (bL * q) / 24],
  ];
  for (let col = 0; col < 3; col++) {
    let piv = col;
    for (let row = col + 1; row < 3; row++) if (Math.abs(m[row]![col]!) > Math.abs(m[piv]![col]!)) piv = row;
    [m[col], m[piv]] = [m[piv]!, m[col]!];
    for (let row = col + 1; row < 3; row++) {
      const f = m[row]![col]! / m[col]![col]!;
      for (let k = col; k < 4; k++) m[row]![k]! -= f * m[col]![k]!;
    }
  }
  const x = [0, 0, 0];
  for (let row = 2; row >= 0; row--) {
    let t = m[row]![3]!;
    for (let k = row + 1; k < 3; k++) t -= m[row]![k]! * x[k]!;
    x[row] = t / m[row]![row]!;
  }
  const [A, B] = [x[0]!, x[1]!];
  return { c0: -2 * B, c1: -6 * A, c2: -q / 2 };
}
