/** Conversions between end-restraint measures. R = k L / (E I) (dimensionless rotational stiffness). */

function checkNonNegative(name: string, v: number): void {
  if (!(v >= 0)) throw new RangeError(`${name} must be >= 0 (got ${v})`);
}

/** R = k L / (E I); k = Infinity (fixed) gives Infinity. */
export function restraintRatio(k: number, L: number, EI: number): number {
  checkNonNegative('rotational stiffness', k);
  if (!(L > 0) || !(EI > 0)) throw new RangeError('L and EI must be > 0');
  return k === Infinity ? Infinity : (k * L) / EI;
}

/** Rotational stiffness k = R E I / L from the ratio. */
export function stiffnessFromRatio(R: number, L: number, EI: number): number {
  checkNonNegative('restraint ratio', R);
  return R === Infinity ? Infinity : (R * EI) / L;
}

/**
 * Fixity factor f = R / (R + 3) ∈ [0, 1] (Monforton and Wu, 1963): 0 pinned, 1 fixed.
 * It is the ratio of the end rotation of a spring-restrained end to that of a pinned end under end moment
 * in a fixed-far-end member, and maps R ∈ [0, ∞] onto a finite interval.
 */
export function fixityFactor(R: number): number {
  checkNonNegative('restraint ratio', R);
  return R === Infinity ? 1 : R / (R + 3);
}

/** Inverse of fixityFactor: R = 3 f / (1 − f); f = 1 gives Infinity. */
export function ratioFromFixity(f: number): number {
  if (!(f >= 0 && f <= 1)) throw new RangeError(`fixity must be in [0, 1] (got ${f})`);
  return f === 1 ? Infinity : (3 * f) / (1 - f);
}

/**
 * Restraint ratio equivalent to an alignment-chart end factor G:
 * R = 2/G (braced), R = 6/G (sway); G = 0 ⇒ fixed (Infinity), G = Infinity ⇒ pinned (0).
 *
 * With these substitutions the alignment-chart equations (AISC 360-16 Commentary App. 7,
 * Eqs. C-A-7-1 and C-A-7-2; Julian and Lawrence 1959) become exactly the characteristic equations of
 * the spring-restrained column (docs/verification.md §M3). The charts' assumptions carry over:
 * elastic behaviour; prismatic members; rigid joints; girders bent in single curvature with equal and
 * opposite end rotations when braced (end stiffness 2EI/L) and in double curvature with equal rotations
 * in sway (6EI/L); every column buckles at once with the same L√(P/EI); the joint restraint is shared
 * among the columns in proportion to their EI/L; no significant axial force in the girders.
 * G = Σ(EI/L)_columns / Σ(EI/L)_girders.
 */
export function ratioFromAlignmentG(G: number, frame: 'braced' | 'sway'): number {
  checkNonNegative('G', G);
  const num = frame === 'braced' ? 2 : 6;
  if (G === 0) return Infinity;
  if (G === Infinity) return 0;
  return num / G;
}
