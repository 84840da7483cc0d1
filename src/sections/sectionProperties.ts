/**
 * Section properties of a cross-section about its two principal axes (y = strong, z = weak),
 * written into a caller's Float64Array so that a limit state can recompute them per sample
 * without allocating (docs/sections.md).
 */

/** Slots of the output array. */
export const AREA = 0;
export const INERTIA_Y = 1;
export const INERTIA_Z = 2;
export const ELASTIC_MODULUS_Y = 3;
export const ELASTIC_MODULUS_Z = 4;
export const PLASTIC_MODULUS_Y = 5;
export const PLASTIC_MODULUS_Z = 6;
export const RADIUS_Y = 7;
export const RADIUS_Z = 8;
export const PROPERTY_COUNT = 9;

/** The same numbers by name (SI: m², m⁴, m³, m), for people and JSON. */
export interface SectionProperties {
  readonly A: number;
  readonly Iy: number;
  readonly Iz: number;
  readonly Wel_y: number;
  readonly Wel_z: number;
  readonly Wpl_y: number;
  readonly Wpl_z: number;
  readonly iy: number;
  readonly iz: number;
}

export function namedProperties(p: Float64Array): SectionProperties {
  return {
    A: p[AREA],
    Iy: p[INERTIA_Y],
    Iz: p[INERTIA_Z],
    Wel_y: p[ELASTIC_MODULUS_Y],
    Wel_z: p[ELASTIC_MODULUS_Z],
    Wpl_y: p[PLASTIC_MODULUS_Y],
    Wpl_z: p[PLASTIC_MODULUS_Z],
    iy: p[RADIUS_Y],
    iz: p[RADIUS_Z],
  };
}

/** A section that has lost all its material (a corrosion loss through a plate): every property 0. */
export function writeLostSection(out: Float64Array): void {
  for (let k = 0; k < PROPERTY_COUNT; k++) out[k] = 0;
}

/** Fills the slots that follow from A, I and the extreme fibre distances. */
export function writeDerived(out: Float64Array, A: number, Iy: number, Iz: number, halfDepthY: number, halfDepthZ: number, Wply: number, Wplz: number): void {
  out[AREA] = A;
  out[INERTIA_Y] = Iy;
  out[INERTIA_Z] = Iz;
  out[ELASTIC_MODULUS_Y] = Iy / halfDepthY;
  out[ELASTIC_MODULUS_Z] = Iz / halfDepthZ;
  out[PLASTIC_MODULUS_Y] = Wply;
  out[PLASTIC_MODULUS_Z] = Wplz;
  out[RADIUS_Y] = Math.sqrt(Iy / A);
  out[RADIUS_Z] = Math.sqrt(Iz / A);
}
