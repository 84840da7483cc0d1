import type { Frame } from './types.js';

/**
 * Classification of joints by rotational stiffness, EN 1993-1-8:2005 §5.2.2.5 (clause wording
 * recalled from memory; see docs/mechanics-moments.md). Pure numbers in SI (N·m/rad, N·m², m).
 *
 * Beam-to-column joints (Figure 5.4 zones):
 *   rigid              S_j,ini ≥ k_b E I_b / L_b,  k_b = 8 where the bracing reduces the horizontal
 *                      displacement by at least 80 % (here: frame braced), k_b = 25 otherwise (sway),
 *                      the latter only when K_b/K_c ≥ 0.1 in every storey (else semi-rigid);
 *   nominally pinned   S_j,ini ≤ 0.5 E I_b / L_b;
 *   semi-rigid         in between.
 * Column bases, rigid when (§5.2.2.5(4)), with λ̄0 the relative slenderness of the column taken
 * as pinned at both ends:
 *   braced:  λ̄0 ≤ 0.5;  or 0.5 < λ̄0 < 3.93 and S_j,ini ≥ 7 (2 λ̄0 − 1) E I_c / L_c;
 *            or λ̄0 ≥ 3.93 and S_j,ini ≥ 48 E I_c / L_c;
 *   sway:    S_j,ini ≥ 30 E I_c / L_c.
 * The clause gives no nominally-pinned limit for bases: a base that is not rigid is semi-rigid here.
 */

export type JointClass = 'rigid' | 'semi-rigid' | 'nominally pinned';

/** The stiffness limits of one joint (N·m/rad): rigid at or above `rigidFrom`, pinned at or below `pinnedUpTo`. */
export interface JointBoundaries {
  /** Infinity when no stiffness makes the joint rigid (sway with K_b/K_c < 0.1) */
  rigidFrom: number;
  /** 0 when the clause gives no pinned limit (column bases) */
  pinnedUpTo: number;
  /** which rule set the limits: 'beam' (§5.2.2.5(1)–(2)) or 'base' (§5.2.2.5(4)) */
  rule: 'beam' | 'base';
}

/** k_b of §5.2.2.5(1). */
export function rigidBeamFactor(frame: Frame): number {
  return frame === 'braced' ? 8 : 25;
}

/**
 * Limits for a beam-to-column joint. EIb, Lb: the beam; EIc, Lc: the column (for K_b/K_c = (I_b/L_b)/(I_c/L_c),
 * taken here with each member's own E, i.e. as EI/L ratios).
 */
export function beamJointBoundaries(frame: Frame, EIb: number, Lb: number, EIc: number, Lc: number): JointBoundaries {
  for (const [name, v] of [['beam EI', EIb], ['beam length', Lb], ['column EI', EIc], ['column length', Lc]] as const) {
    if (!(v > 0 && Number.isFinite(v))) throw new RangeError(`${name} must be finite and > 0 (got ${v})`);
  }
  const beam = EIb / Lb;
  const stiffEnoughBeams = frame === 'braced' || beam / (EIc / Lc) >= 0.1;
  return { rigidFrom: stiffEnoughBeams ? rigidBeamFactor(frame) * beam : Infinity, pinnedUpTo: 0.5 * beam, rule: 'beam' };
}

/** The multiple m of E I_c / L_c a column base must reach to count as rigid; 0 when any base is rigid (λ̄0 ≤ 0.5, braced). */
export function rigidBaseFactor(frame: Frame, lambda0: number): number {
  if (!(lambda0 >= 0 && Number.isFinite(lambda0))) throw new RangeError(`relative slenderness must be finite and >= 0 (got ${lambda0})`);
  if (frame === 'sway') return 30;
  if (lambda0 <= 0.5) return 0;
  if (lambda0 < 3.93) return 7 * (2 * lambda0 - 1);
  return 48;
}

/** Limits for a column base. lambda0 = √(A fy / (π² E I_c / L_c²)), the pinned-pinned relative slenderness. */
export function columnBaseBoundaries(frame: Frame, lambda0: number, EIc: number, Lc: number): JointBoundaries {
  if (!(EIc > 0 && Lc > 0)) throw new RangeError('column EI and length must be > 0');
  return { rigidFrom: (rigidBaseFactor(frame, lambda0) * EIc) / Lc, pinnedUpTo: 0, rule: 'base' };
}

/** λ̄0 = √(A fy / Ncr) with Ncr = π² E I / L² (both ends pinned). */
export function pinnedRelativeSlenderness(A: number, fy: number, EI: number, L: number): number {
  return Math.sqrt((A * fy * L * L) / (Math.PI * Math.PI * EI));
}

/** The class of a joint of initial rotational stiffness S (N·m/rad; Infinity = rigid). */
export function classifyJoint(S: number, b: JointBoundaries): JointClass {
  if (!(S >= 0)) throw new RangeError(`joint stiffness must be >= 0 (got ${S})`);
  if (S >= b.rigidFrom) return 'rigid';
  if (S <= b.pinnedUpTo) return 'nominally pinned';
  return 'semi-rigid';
}
