/**
 * Input of the plastic-zone column model (SI: m, Pa, N, N·m/rad, N/m). A plain object, so the
 * scenario, the surrogate builder and the tests can all fill it without knowing each other.
 */

/** Cross-section by its dimensions (no root fillets, sharp corners). */
export type SectionDimensions =
  | { readonly shape: 'i'; readonly h: number; readonly b: number; readonly tw: number; readonly tf: number }
  | { readonly shape: 'rhs'; readonly h: number; readonly b: number; readonly t: number }
  | { readonly shape: 'chs'; readonly D: number; readonly t: number }
  | { readonly shape: 'rect'; readonly h: number; readonly b: number };

/** Manufacturing family: it chooses the residual-stress pattern (residualStress.ts). */
export type SectionFamily = 'rolled' | 'welded' | 'hollow' | 'solid';

/** Bending axis: 'y' the major axis (the lever arm runs along h), 'z' the minor axis (along b). */
export type BendingAxis = 'y' | 'z';

export interface PlasticZoneInput {
  readonly section: SectionDimensions;
  readonly family: SectionFamily;
  readonly axis: BendingAxis;
  /** Young's modulus (Pa) */
  readonly E: number;
  /** yield strength (Pa) */
  readonly fy: number;
  /** linear strain-hardening modulus after yield (Pa); default 0 (elastic–perfectly plastic) */
  readonly hardening?: number;
  /** column length (m) */
  readonly L: number;
  readonly frame: 'braced' | 'sway';
  /** rotational end springs (N·m/rad); 0 pinned, Infinity fixed */
  readonly kBottom: number;
  readonly kTop: number;
  /** lateral spring at the top (N/m), sway frames only; default 0 */
  readonly kLateral?: number;
  /** bow amplitude e0 (m), either sign */
  readonly e0: number;
  /** 'half-sine' (pinned-column shape) or 'mode' (affine to the first elastic buckling mode); default 'mode' */
  readonly bowShape?: 'half-sine' | 'mode';
  /** end eccentricities of the axial load (m; same sign = single curvature) */
  readonly eccentricity?: { readonly bottom: number; readonly top: number };
  /** multiplier of the family's residual-stress pattern (1 = the pattern as defined); default 1 */
  readonly residualScale?: number;
  /** number of beam elements along the column; default 16 */
  readonly elements?: number;
}

export interface PlasticZoneResult {
  /** peak axial load (N): the capacity; 0 for a mechanism */
  readonly capacity: number;
  /** squash load A·fy of the discretised section (N) */
  readonly squashLoad: number;
  /** lateral displacement of the controlled node at the peak (m) */
  readonly deflectionAtPeak: number;
  /** load steps and Newton iterations used */
  readonly steps: number;
  readonly iterations: number;
}
