import { aiscCapacity } from './aisc360.js';
import { EN_IMPERFECTION, enCapacity } from './en1993.js';
import { equivalentBowCapacity } from './equivalentBow.js';
import { firstYieldCapacity } from './firstYield.js';
import { steppedMemberOf } from './steppedColumn.js';
import { strengthModelKind } from './strengthModelKind.js';
import type { CapacityResult, ColumnState, SoundSection, StrengthModel } from './types.js';

/**
 * Axial capacity of a concentrically loaded column whose section A, I, S (a corroded zone) holds over
 * the lowest `sound.from` of its length and the sound section above (docs/mechanics.md, "A stepped
 * member"). Pcr is the stepped member's own (steppedColumn.ts); R = kL/(E·I) in `s.r` is referred to
 * the zone's I, and so are K = π/φ and φ = L√(Pcr/(E·I)).
 *
 * - first-yield: the bow is affine to the stepped first mode, so the bending moment along the height is
 *   N·e0·m(x)/(1 − N/Ncr) with m = E·I(x)·w''/(Ncr max|w|) (exact for a bow affine to the mode). The
 *   stress N/A(x) + |M(x)|/S(x) rises with N in each segment, so the member's capacity is the smaller of
 *   the two segments' first-yield loads, each with its own section and its own largest m.
 * - en1993-X, aisc360-e3: the weakest cross-section with the member's true stiffness: λ̄ = √(A_zone fy/Ncr)
 *   and N = χ(λ̄) A_zone fy. An engineering approximation: the curves were calibrated on prismatic members,
 *   where the section that yields is also the one that sets the stiffness; here the zone sets the
 *   squash load and the whole member sets Ncr. It lies between the whole-length reduction (same A, lower
 *   Ncr) and the sound member (higher A and Ncr).
 * - first-yield-en1993-X(-plus-bow): the EN 1993-1-1 §5.3.2(11) equivalent bow, taken with each segment as
 *   the critical cross-section in turn (its own A, S and largest m), the smaller capacity governing.
 *   Without a measured bow the zone gives exactly χ(λ̄)·A_zone·fy as above.
 */
export function steppedColumnCapacity(model: StrengthModel, s: ColumnState, sound: SoundSection): CapacityResult {
  const kind = strengthModelKind(model);
  if (!kind) throw new RangeError(`unknown strength model '${String(model)}'`);
  const { Pcr, K, mode } = steppedMemberOf(s, sound);
  const cZone = mode.zoneFactor;
  const cUpper = mode.upperFactor;
  const c = Math.max(cZone, cUpper);
  let capacity: number;
  switch (kind.family) {
    case 'first-yield':
      capacity = Math.min(
        firstYieldCapacity(s.A, s.S, s.fy, Pcr, s.bow, cZone),
        firstYieldCapacity(sound.A, sound.S, s.fy, Pcr, s.bow, cUpper),
      );
      break;
    case 'aisc360-e3':
      capacity = aiscCapacity(s.A, s.fy, Pcr);
      break;
    case 'en1993':
      capacity = enCapacity(EN_IMPERFECTION[kind.curve!], s.A, s.fy, Pcr);
      break;
    case 'equivalent-bow': {
      const alpha = EN_IMPERFECTION[kind.curve!];
      const bow = kind.usesBow ? s.bow : 0;
      capacity = Math.min(
        equivalentBowCapacity(alpha, s.A, s.S, s.fy, Pcr, cZone, bow),
        equivalentBowCapacity(alpha, sound.A, sound.S, s.fy, Pcr, cUpper, bow),
      );
      break;
    }
    case 'plastic-zone':
      // the fibre model is not a closed form: limitState routes it before any stepped member
      throw new Error('the plastic-zone model has no stepped closed form');
  }
  return { capacity, Pcr, K, c };
}
