/** Types shared by the column mechanics. SI units throughout (N, m, Pa, N·m/rad). */

export type Frame = 'braced' | 'sway';

/**
 * End restraint of the column, dimensionless.
 * bottom/top: R = k L / (E I) of the rotational spring (0 pinned, Infinity fixed).
 * lateral: T = kT L³ / (E I) of a translational spring at the top (sway frames only; default 0).
 */
export interface EndRestraint {
  bottom: number;
  top: number;
  lateral?: number;
}

export interface CriticalLoadResult {
  /** elastic critical load (N); 0 for a mechanism */
  Pcr: number;
  /** φ = L √(Pcr / EI) */
  phi: number;
  /** effective length factor K = π / φ; Infinity for a mechanism */
  K: number;
}

/** Buckled shape w(ξ) = A sin φξ + B cos φξ + C ξ + D, ξ = x/L, normalised to max|w| = 1. */
export interface ModeShape {
  readonly frame: Frame;
  readonly phi: number;
  /** coefficients of the normalised shape: w = A sin(φξ) + B cos(φξ) + C ξ + D */
  readonly A: number;
  readonly B: number;
  readonly C: number;
  readonly D: number;
  /** w(ξ), ξ ∈ [0, 1]; max|w| = 1 (braced: from the chord; sway: from the vertical through the base) */
  sample(xi: number): number;
  /** d²w/dξ² */
  curvature(xi: number): number;
  /** ξ where |w| is largest (the value there is +1) */
  readonly maxDeflectionAt: number;
  /** max |d²w/dξ²| over [0, 1] for the normalised shape */
  readonly maxCurvature: number;
  /** ξ where |w''| is largest */
  readonly maxCurvatureAt: number;
  /** c = EI max|w''| / (Pcr max|w|) (docs/mechanics.md); 0 for a mechanism (no curvature) */
  readonly curvatureFactor: number;
  /** zeros of w'' strictly inside (0, 1), increasing */
  readonly inflectionPoints: readonly number[];
  /** zeros of w'' in the closed interval [0, 1] (includes pinned ends) */
  readonly curvatureZeros: readonly number[];
  /**
   * Effective length / L: distance between consecutive zeros of w'' in [0, 1] when there are two;
   * otherwise the spacing π/φ of the zeros of the continued sinusoid (the equivalent pinned column,
   * e.g. 2 for a flagpole); Infinity for a mechanism.
   */
  readonly effectiveLength: number;
  /** true when effectiveLength was measured between two zeros of w'' inside the column */
  readonly effectiveLengthFromInflections: boolean;
}

export type StrengthModel =
  | 'first-yield'
  | 'aisc360-e3'
  | 'en1993-a0'
  | 'en1993-a'
  | 'en1993-b'
  | 'en1993-c'
  | 'en1993-d'
  | 'first-yield-en1993-a0'
  | 'first-yield-en1993-a'
  | 'first-yield-en1993-b'
  | 'first-yield-en1993-c'
  | 'first-yield-en1993-d'
  | 'first-yield-en1993-a0-plus-bow'
  | 'first-yield-en1993-a-plus-bow'
  | 'first-yield-en1993-b-plus-bow'
  | 'first-yield-en1993-c-plus-bow'
  | 'first-yield-en1993-d-plus-bow'
  | 'plastic-zone';

/** The models a scenario may name, in the order the outputs list them. */
export const STRENGTH_MODELS: readonly StrengthModel[] = [
  'first-yield',
  'aisc360-e3',
  'en1993-a0',
  'en1993-a',
  'en1993-b',
  'en1993-c',
  'en1993-d',
  'first-yield-en1993-a0',
  'first-yield-en1993-a',
  'first-yield-en1993-b',
  'first-yield-en1993-c',
  'first-yield-en1993-d',
  'first-yield-en1993-a0-plus-bow',
  'first-yield-en1993-a-plus-bow',
  'first-yield-en1993-b-plus-bow',
  'first-yield-en1993-c-plus-bow',
  'first-yield-en1993-d-plus-bow',
  'plastic-zone',
];

/**
 * The models evaluated here in closed form from Pcr (all but `plastic-zone`, which needs the section
 * by its dimensions and is traced by plasticZone/ through limitState/plasticZoneStrength.ts).
 */
export const CLOSED_FORM_STRENGTH_MODELS: readonly StrengthModel[] = STRENGTH_MODELS.filter((m) => m !== 'plastic-zone');

/** Everything the strength models need (SI). bow = e0, either sign (|e0| is used). */
export interface ColumnState {
  E: number;
  fy: number;
  A: number;
  I: number;
  S: number;
  L: number;
  bow: number;
  frame: Frame;
  r: EndRestraint;
  /** end eccentricities of the axial load (m; same sign = single curvature); absent = concentric */
  eccentricity?: { bottom: number; top: number };
  /**
   * transverse actions per unit of axial load, all scaled together with it (docs/beam-column.md): a uniform
   * line load along the height w/P (1/m) and a horizontal force at the top H/P (dimensionless; sway only; an
   * out-of-plumb φ adds φ); absent = none. Applied end moments are in `eccentricity` (M/P).
   */
  transverse?: { line: number; top: number };
  /**
   * a stepped member (docs/mechanics.md): A, I and S above hold over the lowest `from` metres (a corroded
   * zone) and this sound section above it; R and T stay referred to E·I of the zone. Absent = prismatic.
   */
  sound?: SoundSection;
}

/** The section above a corroded zone near the base (SI). */
export interface SoundSection {
  /** height of the zone below it (m), 0 < from < L */
  from: number;
  A: number;
  I: number;
  S: number;
}

export interface CapacityResult {
  /** axial resistance (N); 0 for a mechanism */
  capacity: number;
  Pcr: number;
  K: number;
  /** curvature factor of the first mode (0 for a mechanism) */
  c: number;
}
