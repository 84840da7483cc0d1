/**
 * Flexural buckling resistance χ·A·fy of EN 1993-1-1:2005 §6.3.1.2 (Eqs. 6.47/6.49, Table 6.1 — numbers
 * from memory), with λ̄ = √(A fy / Ncr) from the exact elastic critical load (no partial factor):
 *   χ = 1/(Φ + √(Φ² − λ̄²)) ≤ 1,  Φ = ½[1 + α(λ̄ − 0.2) + λ̄²];  χ = 1 for λ̄ ≤ 0.2.
 */
export type EnCurve = 'a0' | 'a' | 'b' | 'c' | 'd';

/** Imperfection factors α of Table 6.1. */
export const EN_IMPERFECTION: Readonly<Record<EnCurve, number>> = { a0: 0.13, a: 0.21, b: 0.34, c: 0.49, d: 0.76 };

export function enReductionFactor(alpha: number, lambdaBar: number): number {
  if (lambdaBar <= 0.2) return 1;
  if (lambdaBar === Infinity) return 0;
  const Phi = 0.5 * (1 + alpha * (lambdaBar - 0.2) + lambdaBar * lambdaBar);
  const chi = 1 / (Phi + Math.sqrt(Phi * Phi - lambdaBar * lambdaBar));
  return chi < 1 ? chi : 1;
}

export function enCapacity(alpha: number, A: number, fy: number, Pcr: number): number {
  if (!(Pcr > 0)) return 0;
  return enReductionFactor(alpha, Math.sqrt((A * fy) / Pcr)) * A * fy;
}
