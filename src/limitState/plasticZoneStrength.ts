/**
 * strength: plastic-zone in the limit state. The scenario gives the section by its dimensions
 * (`column.section.shape`); everything else comes from x as for the other models. The end springs
 * are the scenario's R = kL/EI turned back into k with the scenario's E·I, so a spring means the
 * same stiffness in every model. The bow's sign is free (|e0|; with eccentricities the worse side),
 * and a bow below MIN_ETA·W/A is raised to it (capacityTable.ts says why).
 * With `analysis.plastic_zone: table` a concentric column without a lateral spring is read from the
 * cached table (built once per section and frame); anything the table does not cover runs the full model.
 */
import { capacityTableFor } from '../plasticZone/tableCache.js';
import { chiAt, fixityOfRatio, MIN_ETA, type CapacityTable } from '../plasticZone/capacityTable.js';
import { plasticZoneCapacity } from '../plasticZone/plasticZoneCapacity.js';
import { fibreSection } from '../plasticZone/sectionFibres.js';
import type { PlasticZoneInput, SectionDimensions } from '../plasticZone/types.js';
import { criticalLoad } from '../mechanics/criticalLoad.js';
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

export type PlasticZoneCapacityFn = (p: PlasticZoneSample) => number;

/** `onBuild` hears of a table build before it starts (it takes a while). */
export function makePlasticZoneCapacity(
  shape: SectionShape, frame: Frame, how: 'direct' | 'table' = 'direct', onBuild?: (evaluations: number, path: string) => void,
): PlasticZoneCapacityFn {
  const section: SectionDimensions = { shape: 'i', h: shape.h, b: shape.b, tw: shape.tw, tf: shape.tf };
  const fib = fibreSection(section, shape.family, shape.axis, 1);
  const coreRadius = fib.W / fib.A;
  let table: CapacityTable | undefined;
  const direct = (p: PlasticZoneSample): number => {
    const k = (R: number): number => (R === Infinity ? Infinity : (R * p.EI) / p.L);
    const input: PlasticZoneInput = {
      section,
      family: shape.family,
      axis: shape.axis,
      E: p.E,
      fy: p.fy,
      L: p.L,
      frame,
      kBottom: k(p.RBottom),
      kTop: k(p.RTop),
      kLateral: frame === 'sway' ? (p.lateral * p.EI) / p.L ** 3 : 0,
      e0: Math.max(Math.abs(p.bow), MIN_ETA * coreRadius),
      ...(p.eccBottom !== 0 || p.eccTop !== 0 ? { eccentricity: { bottom: p.eccBottom, top: p.eccTop } } : {}),
    };
    return plasticZoneCapacity(input).capacity;
  };
  if (how === 'direct') return direct;
  return (p) => {
    if (p.eccBottom !== 0 || p.eccTop !== 0 || (frame === 'sway' && p.lateral !== 0)) return direct(p);
    table ??= capacityTableFor({ section, family: shape.family, axis: shape.axis, frame, elements: 16 }, undefined, undefined, onBuild);
    // λ̄ with the model's own section (its A and I from the dimensions), as the table was built
    const EI = p.E * fib.I;
    const RB = p.RBottom === Infinity ? Infinity : (p.RBottom * p.EI) / EI;
    const RT = p.RTop === Infinity ? Infinity : (p.RTop * p.EI) / EI;
    const { Pcr } = criticalLoad(EI, p.L, frame, { bottom: RB, top: RT });
    if (!(Pcr > 0)) return 0;
    const squash = fib.A * p.fy;
    const eta = Math.max(Math.abs(p.bow) / coreRadius, MIN_ETA);
    const chi = chiAt(table, Math.sqrt(squash / Pcr), fixityOfRatio(RB), fixityOfRatio(RT), eta);
    return Number.isNaN(chi) ? direct(p) : chi * squash;
  };
}
