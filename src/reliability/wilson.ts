/**
 * Wilson score interval for a binomial proportion k/N (Wilson 1927, JASA 22:209; recommended by
 * Agresti & Coull 1998): (p + z²/2N)/(1 + z²/N) ± z/(1 + z²/N)·sqrt(p(1−p)/N + z²/4N²).
 * Unlike the normal approximation it stays inside [0, 1] and is honest at k = 0.
 */
export const Z95 = 1.959963984540054;

export function wilsonInterval(failures: number, samples: number, z: number = Z95): [number, number] {
  if (samples <= 0) return [0, 1];
  const p = failures / samples;
  const z2n = (z * z) / samples;
  const denom = 1 + z2n;
  const centre = (p + z2n / 2) / denom;
  const half = (z / denom) * Math.sqrt((p * (1 - p)) / samples + (z * z) / (4 * samples * samples));
  const lo = failures === 0 ? 0 : Math.max(0, centre - half);
  const hi = failures === samples ? 1 : Math.min(1, centre + half);
  return [lo, hi];
}
