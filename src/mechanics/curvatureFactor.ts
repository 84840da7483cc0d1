/**
 * Extremes of a mode w(ξ) = A sin φξ + B(cos φξ − 1) + Cξ on [0, 1], in closed form.
 * w'' = −φ² g with g(θ) = A sin θ + B cos θ = ρ sin(θ + γ), θ = φξ, ρ = √(A² + B²), γ = atan2(B, A);
 * w'  = φ ρ cos(θ + δ) + C with δ = atan2(B, A) as well, so the interior extremes of w sit where
 * cos(θ + δ) = −C/(φρ).
 * c = EI max|w''| / (Pcr max|w|) = max|g| / max|w| (docs/mechanics.md; φ² cancels).
 */

export const EX_MAX_W = 0; // max |w|
export const EX_MAX_W_AT = 1; // ξ of max |w|
export const EX_W_AT_MAX = 2; // signed w there
export const EX_MAX_G = 3; // max |g| = max |w''| / φ²
export const EX_MAX_G_AT = 4; // ξ of max |g|
export const EXTREMA_LENGTH = 5;

const TWO_PI = 2 * Math.PI;

function wAt(A: number, B: number, C: number, phi: number, xi: number): number {
  const t = phi * xi;
  return A * Math.sin(t) + B * (Math.cos(t) - 1) + C * xi;
}

/** Writes the extremes into out (length EXTREMA_LENGTH). No allocation. */
export function modeExtremaInto(out: Float64Array, A: number, B: number, C: number, phi: number): Float64Array {
  // deflection: endpoints, then stationary points
  let best = 0;
  let bestAt = 0;
  let bestVal = 0;
  const w1 = wAt(A, B, C, phi, 1);
  if (Math.abs(w1) > best) { best = Math.abs(w1); bestAt = 1; bestVal = w1; }
  const rho = Math.sqrt(A * A + B * B); // not Math.hypot: slow in V8, and A, B are O(1) here
  const delta = Math.atan2(B, A);
  if (rho > 0 && phi > 0) {
    const q = -C / (phi * rho);
    if (q >= -1 && q <= 1) {
      const a = Math.acos(q);
      for (let sgn = -1; sgn <= 1; sgn += 2) {
        const theta0 = sgn * a - delta;
        const kStart = Math.ceil(-theta0 / TWO_PI);
        const kEnd = Math.floor((phi - theta0) / TWO_PI);
        for (let k = kStart; k <= kEnd; k++) {
          const xi = (theta0 + k * TWO_PI) / phi;
          if (xi < 0 || xi > 1) continue;
          const v = wAt(A, B, C, phi, xi);
          if (Math.abs(v) > best) { best = Math.abs(v); bestAt = xi; bestVal = v; }
        }
      }
    }
  }
  out[EX_MAX_W] = best;
  out[EX_MAX_W_AT] = bestAt;
  out[EX_W_AT_MAX] = bestVal;
  // curvature: ρ if a crest of ρ sin(θ + γ) falls in [0, φ], else the larger end value
  let g = Math.abs(B);
  let gAt = 0;
  const gEnd = Math.abs(A * Math.sin(phi) + B * Math.cos(phi));
  if (gEnd > g) { g = gEnd; gAt = 1; }
  if (rho > 0 && phi > 0) {
    let crest = (Math.PI / 2 - delta) % Math.PI; // γ = δ here
    if (crest < 0) crest += Math.PI;
    if (crest <= phi) { g = rho; gAt = crest / phi; }
  }
  out[EX_MAX_G] = g;
  out[EX_MAX_G_AT] = gAt;
  return out;
}

/** c from the unnormalised coefficients; 0 when the mode has no curvature (a mechanism). */
export function curvatureFactorFromExtrema(ex: Float64Array): number {
  return ex[EX_MAX_W] > 0 ? ex[EX_MAX_G] / ex[EX_MAX_W] : 0;
}
