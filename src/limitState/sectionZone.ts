/**
 * A corrosion loss confined to a zone near the base (docs/sections.md): the sound section above the
 * zone, about each axis, for the stepped member of the mechanics (ColumnState.sound). The sound
 * section has no loss, so it is computed once. null when the loss covers the whole length (no zone, or
 * a zone as high as the column): the reduced section then holds everywhere, as before.
 */
import type { SoundSection } from '../mechanics/types.js';
import type { Scenario } from '../scenario/types.js';
import { sectionWriter } from '../sections/sectionDimensions.js';
import { AREA, ELASTIC_MODULUS_Y, ELASTIC_MODULUS_Z, INERTIA_Y, INERTIA_Z, PROPERTY_COUNT } from '../sections/sectionProperties.js';

export interface SectionZone {
  /** zone height (m) */
  readonly height: number;
  /** the section above the zone about y and about z */
  readonly y: SoundSection;
  readonly z: SoundSection;
}

export function sectionZone(s: Scenario): SectionZone | null {
  const geometry = s.column.section.geometry;
  const height = geometry?.corrosion?.zoneHeight;
  if (geometry === undefined || height === undefined || !(height > 0 && height < s.column.length)) return null;
  const props = new Float64Array(PROPERTY_COUNT);
  sectionWriter(geometry.dimensions)(props, 0, 0);
  return {
    height,
    y: { from: height, A: props[AREA], I: props[INERTIA_Y], S: props[ELASTIC_MODULUS_Y] },
    z: { from: height, A: props[AREA], I: props[INERTIA_Z], S: props[ELASTIC_MODULUS_Z] },
  };
}
