import { W_ALPHA_A, W_ALPHA_B, W_BETA_A, W_BETA_B, W_TAU, W_UPS } from './characteristicEquation.js';
import type { Frame } from './types.js';

/**
 * Null vector (A, B, C) of the boundary-condition matrix at a root φ, for
 * y = A sin φξ + B cos φξ + Cξ + D with D = −B (from y(0) = 0). Rows (homogeneous weights, R = α/β):
 *   β_A y''(0) − α_A y'(0) = 0:   [−α_A φ, −β_A φ², −α_A]
 *   β_B y''(1) + α_B y'(1) = 0:   [α_B φ cos φ − β_B φ² sin φ, −β_B φ² cos φ − α_B φ sin φ, α_B]
 *   braced y(1) = 0:              [sin φ, cos φ − 1, 1]
 *   sway υφ²C − τ y(1) = 0:        [τ sin φ, τ(cos φ − 1), τ − υφ²]
 * At a root the rows have rank 2; the null vector is the cross product of the best-conditioned pair
 * of (normalised) rows. Writes (A, B, C) into out[0..2]. No allocation.
 */
export function modeCoefficientsInto(out: Float64Array, frame: Frame, w: Float64Array, phi: number): Float64Array {
  const s = Math.sin(phi);
  const c = Math.cos(phi);
  const p2 = phi * phi;
  const aA = w[W_ALPHA_A];
  const bA = w[W_BETA_A];
  const aB = w[W_ALPHA_B];
  const bB = w[W_BETA_B];
  let x1 = -aA * phi, y1 = -bA * p2, z1 = -aA;
  let x2 = aB * phi * c - bB * p2 * s, y2 = -bB * p2 * c - aB * phi * s, z2 = aB;
  let x3: number, y3: number, z3: number;
  if (frame === 'braced') {
    x3 = s; y3 = c - 1; z3 = 1;
  } else {
    const t = w[W_TAU];
    x3 = t * s; y3 = t * (c - 1); z3 = t - w[W_UPS] * p2;
  }
  // scale by the largest entry first: near a mechanism φ ~ 1e−150 and the squares would underflow
  let n = Math.max(Math.abs(x1), Math.abs(y1), Math.abs(z1));
  x1 /= n; y1 /= n; z1 /= n;
  n = Math.sqrt(x1 * x1 + y1 * y1 + z1 * z1);
  x1 /= n; y1 /= n; z1 /= n;
  n = Math.max(Math.abs(x2), Math.abs(y2), Math.abs(z2));
  x2 /= n; y2 /= n; z2 /= n;
  n = Math.sqrt(x2 * x2 + y2 * y2 + z2 * z2);
  x2 /= n; y2 /= n; z2 /= n;
  n = Math.max(Math.abs(x3), Math.abs(y3), Math.abs(z3));
  x3 /= n; y3 /= n; z3 /= n;
  n = Math.sqrt(x3 * x3 + y3 * y3 + z3 * z3);
  x3 /= n; y3 /= n; z3 /= n;
  // the three pairwise cross products; keep the largest
  const ax = y1 * z2 - z1 * y2, ay = z1 * x2 - x1 * z2, az = x1 * y2 - y1 * x2;
  const bx = y1 * z3 - z1 * y3, by = z1 * x3 - x1 * z3, bz = x1 * y3 - y1 * x3;
  const cx = y2 * z3 - z2 * y3, cy = z2 * x3 - x2 * z3, cz = x2 * y3 - y2 * x3;
  const na = ax * ax + ay * ay + az * az;
  const nb = bx * bx + by * by + bz * bz;
  const nc = cx * cx + cy * cy + cz * cz;
  if (na >= nb && na >= nc) {
    out[0] = ax; out[1] = ay; out[2] = az;
  } else if (nb >= nc) {
    out[0] = bx; out[1] = by; out[2] = bz;
  } else {
    out[0] = cx; out[1] = cy; out[2] = cz;
  }
  if (!(Math.max(na, nb, nc) > 0)) throw new Error('modeCoefficients: boundary-condition matrix has rank < 2');
  return out;
}
