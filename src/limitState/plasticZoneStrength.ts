/**
 * strength: plastic-zone in the limit state. The scenario gives the section by its dimensions
 * (`column.section.shape`); everything else comes from x as for the other models. The end springs
 * are the scenario's R = kL/EI turned back into k with the scenario's E·I, so a spring means the
 * same stiffness in every model. The bow's sign is free (|e0|; with eccentricities the worse side).
 */
import { plasticZoneCapacity } from '../plasticZone/plasticZoneCapacity.js';
import type { PlasticZoneInput } from '../plasticZone/types.js';
import type { SectionShape } from '../scenario/types.js';
import type { Frame } from '../mechanics/types.js';

export interface PlasticZoneSample {
  E: number;
  fy: number;
  /** the scenario's E·I, which turns R back into k */
  EI: number;
  L: number;
  bow: number;
  RBottom: number;
  RTop: number;
  /** T = kT L³ / EI (sway) */
  lateral: number;
  eccBottom: number;
  eccTop: number;
}

export function plasticZoneCapacityOf(shape: SectionShape, frame: Frame, p: PlasticZoneSample): number {
  const k = (R: number): number => (R === Infinity ? Infinity : (R * p.EI) / p.L);
  const input: PlasticZoneInput = {
    section: { shape: 'i', h: shape.h, b: shape.b, tw: shape.tw, tf: shape.tf },
    family: shape.family,
    axis: shape.axis,
    E: p.E,
    fy: p.fy,
    L: p.L,
    frame,
    kBottom: k(p.RBottom),
    kTop: k(p.RTop),
    kLateral: frame === 'sway' ? (p.lateral * p.EI) / p.L ** 3 : 0,
    e0: Math.abs(p.bow),
    ...(p.eccBottom !== 0 || p.eccTop !== 0 ? { eccentricity: { bottom: p.eccBottom, top: p.eccTop } } : {}),
  };
  return plasticZoneCapacity(input).capacity;
}
