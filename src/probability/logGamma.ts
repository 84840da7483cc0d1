/**
 * ln Γ(x) for x > 0 by the Lanczos approximation (g = 7, 9 terms; C. Lanczos, SIAM J.
 * Numer. Anal. B1 (1964) 86–96; coefficient set as commonly tabulated, ~1e-15 relative).
 * Arguments below 1/2 are shifted up with Γ(x) = Γ(x + 1)/x.
 */
const LANCZOS_G = 7;
const LANCZOS = [
  0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313,
  -176.61502916214059, 12.507343278686905, -0.13857109526572012, 9.9843695780195716e-6,
  1.5056327351493116e-7,
];
const HALF_LN_2PI = 0.91893853320467274178;

export function logGamma(x: number): number {
  if (!(x > 0)) return x === 0 ? Infinity : NaN;
  if (x < 0.5) return logGamma(x + 1) - Math.log(x);
  const y = x - 1;
  let sum = LANCZOS[0];
  for (let i = 1; i < LANCZOS.length; i++) sum += LANCZOS[i] / (y + i);
  const t = y + LANCZOS_G + 0.5;
  return HALF_LN_2PI + (y + 0.5) * Math.log(t) - t + Math.log(sum);
}

/** Γ(x) for x > 0 (overflows to Infinity beyond x ≈ 171.6). */
export function gammaFunction(x: number): number {
  return Math.exp(logGamma(x));
}

/** ln B(a, b) = ln Γ(a) + ln Γ(b) − ln Γ(a + b). */
export function logBeta(a: number, b: number): number {
  return logGamma(a) + logGamma(b) - logGamma(a + b);
}
