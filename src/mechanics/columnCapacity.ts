import { aiscCapacity } from './aisc360.js';
import { aiscEccentricCapacity } from './aiscInteraction.js';
import { criticalLoad } from './criticalLoad.js';
import { EN_IMPERFECTION, enCapacity } from './en1993.js';
import { enEccentricCapacity } from './en1993Interaction.js';
import { equivalentBowAmplitude, equivalentBowCapacity } from './equivalentBow.js';
import { eccentricFirstYieldCapacity } from './eccentricFirstYield.js';
import { firstYieldCapacity } from './firstYield.js';
import { modeShape } from './modeShape.js';
import { steppedColumnCapacity } from './steppedCapacity.js';
import { steppedBeamColumnOf, steppedEccentricFirstYieldCapacity } from './steppedBeamColumn.js';
import { strengthModelKind } from './strengthModelKind.js';
import type { CapacityResult, ColumnState, SoundSection, StrengthModel } from './types.js';

/**
 * first-yield of a stepped member under end couples, a line load or a top force: the exact stepped
 * second-order solution, each segment checked with its own section (steppedBeamColumn.ts). A section
 * with no modulus, area or strength anywhere takes no bending (as for the prismatic column).
 */
function steppedEccentricCapacity(model: StrengthModel, s: ColumnState, sound: SoundSection): CapacityResult {
  const member = steppedBeamColumnOf(s, sound);
  const { Pcr, K, mode } = member;
  const c = Math.max(mode.zoneFactor, mode.upperFactor);
  if (!(s.S > 0 && s.A > 0 && s.fy > 0 && sound.S > 0 && sound.A > 0)) return { capacity: 0, Pcr, K, c };
  // the equivalent bow of EN 1993-1-1 §5.3.2(11) for each segment as the critical cross-section, the larger
  // amplitude taken (conservative); plus the measured bow in the -plus-bow form
  const kind = strengthModelKind(model)!;
  const bow =
    kind.family === 'first-yield'
      ? s.bow
      : Math.max(
          equivalentBowAmplitude(EN_IMPERFECTION[kind.curve!], s.A, s.S, s.fy, Pcr, mode.zoneFactor),
          equivalentBowAmplitude(EN_IMPERFECTION[kind.curve!], sound.A, sound.S, s.fy, Pcr, mode.upperFactor),
        ) + (kind.usesBow ? Math.abs(s.bow) : 0);
  const capacity = steppedEccentricFirstYieldCapacity({ ...member, bow }, { A1: s.A, S1: s.S, A2: sound.A, S2: sound.S, fy: s.fy });
  return { capacity, Pcr, K, c };
}

/** Capacity from Pcr and c for a strength model (shared by the exact and the fast path). */
export function capacityFromPcr(model: StrengthModel, A: number, S: number, fy: number, bow: number, Pcr: number, c: number): number {
  const kind = strengthModelKind(model);
  if (!kind) throw new RangeError(`unknown strength model '${String(model)}'`);
  switch (kind.family) {
    case 'first-yield':
      return firstYieldCapacity(A, S, fy, Pcr, bow, c);
    case 'aisc360-e3':
      return aiscCapacity(A, fy, Pcr);
    case 'en1993':
      return enCapacity(EN_IMPERFECTION[kind.curve!], A, fy, Pcr);
    case 'equivalent-bow':
      return equivalentBowCapacity(EN_IMPERFECTION[kind.curve!], A, S, fy, Pcr, c, kind.usesBow ? bow : 0);
    case 'plastic-zone':
      throw new RangeError(PLASTIC_ZONE_ELSEWHERE);
  }
}

/** plastic-zone needs the section by its dimensions, which ColumnState does not carry. */
const PLASTIC_ZONE_ELSEWHERE = 'plastic-zone is not a closed-form model: limitState/plasticZoneStrength.ts evaluates it';

export function isStrengthModel(s: string): s is StrengthModel {
  return strengthModelKind(s) !== undefined;
}

/** No eccentricity and no transverse action that acts on this frame. */
function isConcentric(s: ColumnState): boolean {
  const e = s.eccentricity;
  const t = s.transverse;
  return (e === undefined || (e.bottom === 0 && e.top === 0)) && (t === undefined || (t.line === 0 && (s.frame !== 'sway' || t.top === 0)));
}

/** A stepped member (corroded zone) under concentric load: the stepped solver gives Pcr, the mode and the capacity. */
export function usesSteppedSolver(s: ColumnState): boolean {
  return s.sound !== undefined && isConcentric(s);
}

/**
 * Axial capacity of the restrained column (docs/mechanics.md), exact path: critical load from the
 * characteristic equation, c from the closed-form first mode. A mechanism gives capacity 0.
 * A stepped member (`s.sound`, a corroded zone near the base) under concentric load takes the stepped
 * solver (steppedCapacity.ts); with eccentric or transverse actions first-yield takes the exact stepped
 * beam-column (steppedBeamColumn.ts), while the interaction checks (en1993-*, aisc360-e3) use the zone's
 * section over the whole length (the conservative reduction: their member formulas are for prismatic members).
 */
export function columnCapacity(model: StrengthModel, s: ColumnState): CapacityResult {
  if (!isStrengthModel(model)) throw new RangeError(`unknown strength model '${String(model)}'`);
  if (usesSteppedSolver(s)) return steppedColumnCapacity(model, s, s.sound!);
  const family = strengthModelKind(model)!.family;
  if (s.sound !== undefined && (family === 'first-yield' || family === 'equivalent-bow')) return steppedEccentricCapacity(model, s, s.sound);
  const { Pcr, phi, K } = criticalLoad(s.E * s.I, s.L, s.frame, s.r);
  const mode = modeShape(s.frame, s.r, phi);
  const c = mode.curvatureFactor;
  const e = s.eccentricity ?? { bottom: 0, top: 0 };
  const t = s.transverse ?? { line: 0, top: 0 };
  // top force and out-of-plumb act only where the top may move
  const topRatio = s.frame === 'sway' ? t.top : 0;
  // no eccentricity and no transverse action take the concentric path untouched, so its results stay the same bit for bit
  if (e.bottom === 0 && e.top === 0 && t.line === 0 && topRatio === 0) {
    return { capacity: capacityFromPcr(model, s.A, s.S, s.fy, s.bow, Pcr, c), Pcr, K, c };
  }
  // no section modulus (or no area, no strength) takes no bending: any first-order moment, which grows
  // with the load, yields it at once (the interaction checks would divide by zero)
  if (!(s.S > 0 && s.A > 0 && s.fy > 0)) return { capacity: 0, Pcr, K, c };
  // per unit axial load as lengths (every action scaled with the axial load): q = (w/P) L², h = (H/P) L
  const actions = t.line === 0 && topRatio === 0 ? {} : { q: t.line * s.L * s.L, h: topRatio * s.L };
  const kind = strengthModelKind(model)!;
  switch (kind.family) {
    case 'plastic-zone':
      throw new RangeError(PLASTIC_ZONE_ELSEWHERE);
    case 'first-yield': {
      const capacity = eccentricFirstYieldCapacity({
        A: s.A, S: s.S, fy: s.fy, EI: s.E * s.I, L: s.L, frame: s.frame, r: s.r, bow: s.bow, eB: e.bottom, eT: e.top, ...actions, Pcr, mode,
      });
      return { capacity, Pcr, K, c };
    }
    case 'en1993': {
      const capacity = enEccentricCapacity({
        alpha: EN_IMPERFECTION[kind.curve!], A: s.A, S: s.S, fy: s.fy, Pcr, eB: e.bottom, eT: e.top, ...actions, r: s.r, frame: s.frame,
      });
      return { capacity, Pcr, K, c };
    }
    case 'aisc360-e3': {
      const capacity = aiscEccentricCapacity({
        A: s.A, S: s.S, fy: s.fy, EI: s.E * s.I, L: s.L, frame: s.frame, r: s.r, eB: e.bottom, eT: e.top, ...actions, Pcr,
      });
      return { capacity, Pcr, K, c };
    }
    case 'equivalent-bow': {
      // EN 1993-1-1 §5.2.2(3)a: second-order analysis with the member imperfection of §5.3.2(11) (the
      // equivalent bow affine to the first mode, amplitude e0/c) and the elastic cross-section check:
      // the first-yield beam-column with that bow (plus the measured bow in the -plus-bow form)
      const bow = equivalentBowAmplitude(EN_IMPERFECTION[kind.curve!], s.A, s.S, s.fy, Pcr, c) + (kind.usesBow ? Math.abs(s.bow) : 0);
      const capacity = eccentricFirstYieldCapacity({
        A: s.A, S: s.S, fy: s.fy, EI: s.E * s.I, L: s.L, frame: s.frame, r: s.r, bow, eB: e.bottom, eT: e.top, ...actions, Pcr, mode,
      });
      return { capacity, Pcr, K, c };
    }
  }
}
