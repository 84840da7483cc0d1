/**
 * Nominal compressive strength Pn = Fcr·Ag of AISC 360-16 §E3 (Eqs. E3-1..E3-3, from memory), with
 * Fe = Pcr/A from the exact elastic critical load (no resistance factor):
 *   Fcr = 0.658^(Fy/Fe)·Fy   when Fy/Fe ≤ 2.25
 *   Fcr = 0.877·Fe           otherwise.
 * The specification states the branch either as Lc/r ≤ 4.71√(E/Fy) or as Fy/Fe ≤ 2.25; they differ
 * slightly (4.71 is 1.5π rounded, i.e. Fy/Fe = 2.2477). We branch on Fy/Fe ≤ 2.25 because Fe is what
 * we have (Lc/r would have to be back-computed from Pcr). At Fy/Fe = 2.25 the two branches give
 * Fcr/Fy = 0.389949 and 0.389778: a 0.044 % jump, so the capacity is discontinuous there.
 */
export const AISC_BRANCH_LIMIT = 2.25;

export function aiscCriticalStress(Fy: number, Fe: number): number {
  if (!(Fe > 0)) return 0;
  const ratio = Fy / Fe;
  return ratio <= AISC_BRANCH_LIMIT ? Math.pow(0.658, ratio) * Fy : 0.877 * Fe;
}

export function aiscCapacity(A: number, Fy: number, Pcr: number): number {
  return aiscCriticalStress(Fy, Pcr / A) * A;
}
