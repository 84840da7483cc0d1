/**
 * First-yield (Perry–Robertson / Ayrton–Perry) axial capacity of an imperfect column whose initial
 * bow is affine to its first buckling mode (docs/mechanics.md):
 *   P/A + P e0 c / (S (1 − P/Pcr)) = fy,   the smaller positive root.
 * Ayrton & Perry, The Engineer 62, 1886; Robertson, ICE Selected Engineering Paper 28, 1925;
 * Timoshenko & Gere 1961 ch. 1 (amplification y0/(1 − P/Pcr)). In stresses, with σE = Pcr/A and
 * η = c|e0|A/S:  σ = ½[fy + (1+η)σE − √((fy + (1+η)σE)² − 4 fy σE)], evaluated here in the
 * cancellation-free form σ = 2 fy σE / (b + √(b² − 4 fy σE)), b = fy + (1+η)σE.
 * Pcr = 0 (a mechanism) gives 0.
 */
export function firstYieldCapacity(A: number, S: number, fy: number, Pcr: number, bow: number, c: number): number {
  if (!(Pcr > 0)) return 0;
  const sigmaE = Pcr / A;
  // a straight column has no bending, whatever S is (S = 0 would give 0/0)
  const eta = bow === 0 ? 0 : (c * Math.abs(bow) * A) / S;
  const b = fy + (1 + eta) * sigmaE;
  const disc = b * b - 4 * fy * sigmaE;
  const sigma = (2 * fy * sigmaE) / (b + Math.sqrt(disc > 0 ? disc : 0));
  return sigma * A;
}
