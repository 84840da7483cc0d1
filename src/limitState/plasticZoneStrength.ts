/**
 * strength: plastic-zone in the limit state, about one principal axis. The section is the scenario's
 * `column.section` by its dimensions (sections/): its family chooses the residual stresses (an I/H
 * with a root fillet r > 0 is rolled, r = 0 welded; hollow sections and solid rectangles have none),
 * and the sampled corrosion loss is taken off the dimensions exactly as sections/sectionDimensions.ts
 * does. The fibre model has sharp corners: no root fillets or corner radii (docs/plastic-zone.md §6).
 * The end springs are the scenario's R = kL/EI turned back into k with the scenario's E·I, so a spring
 * means the same stiffness in every model. The bow's sign is free (|e0|; with eccentricities the worse
 * side), and a bow below MIN_ETA·W/A is raised to it (capacityTable.ts says why).
 * `table`: a concentric column without a lateral spring is read from the cached table of the sound
 * section (built once per section, axis and frame); a corroded sample enters it with its own A, I and
 * W (χ read at its own λ̄ and η, times its own squash load). Anything the table does not cover runs the
 * full model.
 */
import { cacheFolder, capacityTableFor } from '../plasticZone/tableCache.js';
import { chiAt, DEFAULT_GRID, fixityOfRatio, MIN_ETA, type CapacityTable, type TableGrid } from '../plasticZone/capacityTable.js';
import { plasticZoneCapacity } from '../plasticZone/plasticZoneCapacity.js';
import { plateProperties } from '../plasticZone/plateProperties.js';
import { fibreSection } from '../plasticZone/sectionFibres.js';
import type { BendingAxis, PlasticZoneInput, SectionDimensions as FibreDimensions, SectionFamily } from '../plasticZone/types.js';
import { criticalLoad } from '../mechanics/criticalLoad.js';
import type { Frame } from '../mechanics/types.js';
import type { SectionDimensions } from '../sections/sectionDimensions.js';

export interface PlasticZoneSample {
  E: number;
  fy: number;
  /** the scenario's E·I about this axis, which turns R back into k */
  EI: number;
  L: number;
  bow: number;
  RBottom: number;
  RTop: number;
  /** T = kT L³ / EI (sway) */
  lateral: number;
  eccBottom: number;
  eccTop: number;
  /** corrosion loss per exposed face (m): the flanges' (or the only one), the web's */
  primaryLoss: number;
  secondaryLoss: number;
}

export type PlasticZoneCapacityFn = (p: PlasticZoneSample) => number;

export type PlasticZoneEvaluation = 'direct' | 'table';

/** The residual-stress family of a section given by its dimensions. */
export function sectionFamily(d: SectionDimensions): SectionFamily {
  switch (d.shape) {
    case 'i':
      return d.r > 0 ? 'rolled' : 'welded';
    case 'rhs':
    case 'chs':
      return 'hollow';
    case 'rect':
      return 'solid';
  }
}

/** The fibre model's plates of `d` less the losses (as sections/sectionDimensions.ts), or null when a plate is eaten through. */
export function reducedPlates(d: SectionDimensions, primary: number, secondary: number): FibreDimensions | null {
  switch (d.shape) {
    case 'i': {
      const tf = d.tf - 2 * primary, tw = d.tw - 2 * secondary, b = d.b - 2 * primary;
      return tf > 0 && tw > 0 && b > tw ? { shape: 'i', h: d.h - 2 * primary, b, tw, tf } : null;
    }
    case 'rhs':
      return d.t - primary > 0 ? { shape: 'rhs', h: d.h - 2 * primary, b: d.b - 2 * primary, t: d.t - primary } : null;
    case 'chs':
      return d.t - primary > 0 ? { shape: 'chs', D: d.D - 2 * primary, t: d.t - primary } : null;
    case 'rect':
      return d.b - 2 * primary > 0 && d.h - 2 * primary > 0 ? { shape: 'rect', b: d.b - 2 * primary, h: d.h - 2 * primary } : null;
  }
}

/** The full model at one sample: what `check` uses, and what the table falls back on. */
export function makePlasticZoneDirect(dims: SectionDimensions, axis: BendingAxis, frame: Frame): PlasticZoneCapacityFn {
  const family = sectionFamily(dims);
  return (p) => {
    const section = reducedPlates(dims, p.primaryLoss, p.secondaryLoss);
    if (section === null) return 0;
    const plates = plateProperties(section, axis);
    const k = (R: number): number => (R === Infinity ? Infinity : (R * p.EI) / p.L);
    const input: PlasticZoneInput = {
      section,
      family,
      axis,
      E: p.E,
      fy: p.fy,
      L: p.L,
      frame,
      kBottom: k(p.RBottom),
      kTop: k(p.RTop),
      kLateral: frame === 'sway' ? (p.lateral * p.EI) / p.L ** 3 : 0,
      e0: Math.max(Math.abs(p.bow), (MIN_ETA * plates.W) / plates.A),
      ...(p.eccBottom !== 0 || p.eccTop !== 0 ? { eccentricity: { bottom: p.eccBottom, top: p.eccTop } } : {}),
    };
    return plasticZoneCapacity(input).capacity;
  };
}

/** Where the table comes from: the default grid of 16 elements in the user's cache, or (tests) a small one elsewhere. */
export interface TableSource {
  readonly grid?: TableGrid;
  readonly folder?: string;
  readonly elements?: number;
}

/**
 * The model as `analysis.plastic_zone` asks. `onBuild` hears of a table build before it starts (it
 * takes minutes); the table is built on the first sample that needs it, never before.
 */
export function makePlasticZoneCapacity(
  dims: SectionDimensions, axis: BendingAxis, frame: Frame, how: PlasticZoneEvaluation, onBuild?: (evaluations: number, path: string) => void,
  source: TableSource = {},
): PlasticZoneCapacityFn {
  const direct = makePlasticZoneDirect(dims, axis, frame);
  if (how === 'direct') return direct;
  const family = sectionFamily(dims);
  const sound = reducedPlates(dims, 0, 0)!;
  const fib = fibreSection(sound, family, axis, 1);
  const soundPlates = plateProperties(sound, axis);
  // A, I, W of the fibre section less the sample's loss: the fibres' own values scaled by the plate
  // formulas' ratios, so that a sound sample reads exactly the λ̄ and η the table was built with
  let lastPrimary = 0, lastSecondary = 0, A = fib.A, I = fib.I, W = fib.W;
  const reduce = (primary: number, secondary: number): void => {
    if (primary === lastPrimary && secondary === lastSecondary) return;
    lastPrimary = primary;
    lastSecondary = secondary;
    const plates = reducedPlates(dims, primary, secondary);
    if (plates === null) {
      A = 0;
      return;
    }
    const r = plateProperties(plates, axis);
    A = (fib.A * r.A) / soundPlates.A;
    I = (fib.I * r.I) / soundPlates.I;
    W = (fib.W * r.W) / soundPlates.W;
  };
  let table: CapacityTable | undefined;
  return (p) => {
    if (p.eccBottom !== 0 || p.eccTop !== 0 || (frame === 'sway' && p.lateral !== 0)) return direct(p);
    reduce(p.primaryLoss, p.secondaryLoss);
    if (!(A > 0)) return 0;
    table ??= capacityTableFor({ section: sound, family, axis, frame, elements: source.elements ?? 16 }, source.grid ?? DEFAULT_GRID, source.folder ?? cacheFolder(), onBuild);
    // λ̄ with the model's own section (its A and I from the plates), as the table was built
    const EI = p.E * I;
    const RB = p.RBottom === Infinity ? Infinity : (p.RBottom * p.EI) / EI;
    const RT = p.RTop === Infinity ? Infinity : (p.RTop * p.EI) / EI;
    const { Pcr } = criticalLoad(EI, p.L, frame, { bottom: RB, top: RT });
    if (!(Pcr > 0)) return 0;
    const squash = A * p.fy;
    const eta = Math.max((Math.abs(p.bow) * A) / W, MIN_ETA);
    const chi = chiAt(table, Math.sqrt(squash / Pcr), fixityOfRatio(RB), fixityOfRatio(RT), eta);
    return Number.isNaN(chi) ? direct(p) : chi * squash;
  };
}
