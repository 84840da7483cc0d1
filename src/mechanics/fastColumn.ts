import { aiscCapacity } from './aisc360.js';
import { WEIGHT_LENGTH, weightsInto } from './characteristicEquation.js';
import { criticalPhiFromWeights, swayPhi } from './criticalLoad.js';
import { EXTREMA_LENGTH, curvatureFactorFromExtrema, modeExtremaInto } from './curvatureFactor.js';
import { EN_IMPERFECTION, enCapacity } from './en1993.js';
import { equivalentBowCapacity } from './equivalentBow.js';
import { firstYieldCapacity } from './firstYield.js';
import { strengthModelKind } from './strengthModelKind.js';
import { interpolateFixityPair, interpolateFixityTable, pairFixityTables, type FixityTable, type FixityTablePair } from './fixityTable.js';
import { shippedOrBuilt, type TableName } from './shippedTables.js';
import { modeCoefficientsInto } from './modeCoefficients.js';
import { ratioFromFixity } from './restraint.js';
import type { Frame, StrengthModel } from './types.js';

/**
 * Fast first-mode critical load and curvature factor for the reliability hot loop (no lateral spring).
 *
 * φ is tabulated once per frame over the fixity factors f = R/(R+3) ∈ [0, 1]² (129 × 129 nodes,
 * read from the shipped file data/fixity-tables.bin after a spot check against the exact solver,
 * or built from it when the file is missing or stale; shippedTables.ts) and interpolated by local bicubic Lagrange polynomials:
 * braced tabulates φ, sway tabulates φ² (linear in f near the mechanism corner, where φ → 0).
 * Measured worst relative error in Pcr ≈ 5e-9 (braced) and ≈ 1e-7 (sway, near the corner). In sway, where
 * f_A + f_B < SWAY_EXACT_CORNER the relative accuracy of a table degrades as Pcr → 0, so the exact
 * (non-allocating) Brent solve is used there. Braced c is tabulated too (bracedCurvatureTable); sway c
 * comes from the closed-form mode at that φ.
 * With a lateral spring (T > 0) call the exact solver (criticalLoad / columnCapacity).
 * Nothing here allocates per call; the scratch arrays are module-level.
 */
export const FAST_TABLE_CELLS = 128;
export const SWAY_EXACT_CORNER = 1e-3;

const tables: { braced?: FixityTable; sway?: FixityTable } = {};
/** Braced c over the fixity factors, built on first use (see bracedCurvatureTable). */
let bracedC: FixityTable | undefined;
/** Braced φ and c interleaved (one pass reads both). */
let bracedPair: FixityTablePair | undefined;
const weights = new Float64Array(WEIGHT_LENGTH);
const coeffs = new Float64Array(3);
const extrema = new Float64Array(EXTREMA_LENGTH);

/** φ (braced) or φ² (sway) at a node of the fixity grid, by the exact solver. */
function phiNode(frame: Frame): (fA: number, fB: number) => number {
  const w = new Float64Array(WEIGHT_LENGTH);
  return (fA, fB) => {
    weightsInto(w, ratioFromFixity(fA), ratioFromFixity(fB), 0);
    const phi = criticalPhiFromWeights(frame, w, 1);
    return frame === 'braced' ? phi : phi * phi;
  };
}

/**
 * Braced frames only: c tabulated like φ. In the first braced mode φ ∈ [π, 2π], so a crest of
 * w'' = −φ² ρ sin(φξ + γ) always lies inside the column and max|w''| = φ²ρ; the deflection has one
 * hump. c = ρ / max|w| is therefore smooth in (f_A, f_B) and interpolates to ~1e-9 (the sway mode's
 * c switches between end and crest values, has kinks, and keeps the closed form).
 */
function bracedCurvatureNode(): (fA: number, fB: number) => number {
  const w = new Float64Array(WEIGHT_LENGTH);
  const ab = new Float64Array(3);
  const ex = new Float64Array(EXTREMA_LENGTH);
  return (fA, fB) => {
    weightsInto(w, ratioFromFixity(fA), ratioFromFixity(fB), 0);
    const phi = criticalPhiFromWeights('braced', w, 1);
    modeCoefficientsInto(ab, 'braced', w, phi);
    modeExtremaInto(ex, ab[0], ab[1], ab[2], phi);
    return curvatureFactorFromExtrema(ex);
  };
}

/** The exact value at a node of each shipped table (shippedTables.ts, writeFixityTables.ts). */
export const TABLE_NODES: Record<TableName, () => (fA: number, fB: number) => number> = {
  bracedPhi: () => phiNode('braced'),
  swayPhiSquared: () => phiNode('sway'),
  bracedCurvature: bracedCurvatureNode,
};

function bracedCurvatureTable(): FixityTable {
  if (bracedC) return bracedC;
  bracedC = shippedOrBuilt('bracedCurvature', FAST_TABLE_CELLS, bracedCurvatureNode());
  return bracedC;
}

function buildTable(frame: Frame): FixityTable {
  return shippedOrBuilt(frame === 'braced' ? 'bracedPhi' : 'swayPhiSquared', FAST_TABLE_CELLS, phiNode(frame));
}

/** The table of a frame, built on first use. */
export function fastTable(frame: Frame): FixityTable {
  const t = tables[frame];
  if (t) return t;
  const built = buildTable(frame);
  tables[frame] = built;
  return built;
}

function fixityOf(R: number): number {
  return R === Infinity ? 1 : R / (R + 3);
}

/** First-mode φ = L√(Pcr/EI) from the restraint ratios R = kL/EI (Infinity = fixed). 0 for a mechanism. */
export function fastPhi(frame: Frame, RBottom: number, RTop: number): number {
  if (!(RBottom >= 0) || !(RTop >= 0)) throw new RangeError('restraint ratios must be >= 0');
  const fA = fixityOf(RBottom);
  const fB = fixityOf(RTop);
  if (frame === 'braced') return interpolateFixityTable(tables.braced ?? fastTable('braced'), fA, fB);
  if (fA + fB < SWAY_EXACT_CORNER) return swayPhi(weightsInto(weights, RBottom, RTop, 0), 1);
  const phi2 = interpolateFixityTable(tables.sway ?? fastTable('sway'), fA, fB);
  return Math.sqrt(phi2);
}

/** Curvature factor c of the first mode at a known root φ (T = 0); 0 for a mechanism. No allocation. */
export function fastCurvatureFactor(frame: Frame, RBottom: number, RTop: number, phi: number): number {
  if (phi === 0) return 0;
  if (frame === 'braced') return interpolateFixityTable(bracedC ?? bracedCurvatureTable(), fixityOf(RBottom), fixityOf(RTop));
  weightsInto(weights, RBottom, RTop, 0);
  modeCoefficientsInto(coeffs, frame, weights, phi);
  modeExtremaInto(extrema, coeffs[0], coeffs[1], coeffs[2], phi);
  return curvatureFactorFromExtrema(extrema);
}

/** Braced φ and c interleaved on one grid (built on first use; fastCapacityBlock.ts reads it too). */
export function bracedFirstYieldTables(): FixityTablePair {
  return bracedPair ?? (bracedPair = pairFixityTables(fastTable('braced'), bracedCurvatureTable()));
}

/** Capacity (N) from SI inputs; bow = e0 (either sign). */
export type FastCapacity = (
  E: number, fy: number, A: number, I: number, S: number, L: number, bow: number, rBottom: number, rTop: number,
) => number;

/**
 * A capacity function for one frame and strength model, taking the rotational spring stiffnesses
 * kBottom, kTop in N·m/rad (0 pinned, Infinity fixed). Same result as columnCapacity within 1e-6.
 */
export function makeFastCapacity(frame: Frame, model: StrengthModel): FastCapacity {
  const byRatio = makeFastCapacityFromRatio(frame, model);
  return (E, fy, A, I, S, L, bow, kBottom, kTop) => {
    const EI = E * I;
    const RA = kBottom === Infinity ? Infinity : (kBottom * L) / EI;
    const RB = kTop === Infinity ? Infinity : (kTop * L) / EI;
    return byRatio(E, fy, A, I, S, L, bow, RA, RB);
  };
}

/** As makeFastCapacity, but the last two arguments are the restraint ratios R = kL/EI. */
export function makeFastCapacityFromRatio(frame: Frame, model: StrengthModel): FastCapacity {
  if (model === 'plastic-zone') throw new RangeError('plastic-zone has no tabulated closed form (limitState/plasticZoneStrength.ts evaluates it)');
  fastTable(frame);
  if (model === 'first-yield') {
    if (frame === 'braced') {
      // φ and c from one pass over both tables (same values as fastPhi / fastCurvatureFactor).
      const tables = bracedFirstYieldTables();
      const pair = new Float64Array(2);
      return (E, fy, A, I, S, L, bow, RA, RB) => {
        if (!(RA >= 0) || !(RB >= 0)) throw new RangeError('restraint ratios must be >= 0');
        interpolateFixityPair(tables, fixityOf(RA), fixityOf(RB), pair);
        const phi = pair[0];
        const Pcr = (phi * phi * E * I) / (L * L);
        return firstYieldCapacity(A, S, fy, Pcr, bow, pair[1]);
      };
    }
    return (E, fy, A, I, S, L, bow, RA, RB) => {
      const phi = fastPhi(frame, RA, RB);
      if (phi === 0) return 0;
      const Pcr = (phi * phi * E * I) / (L * L);
      return firstYieldCapacity(A, S, fy, Pcr, bow, fastCurvatureFactor(frame, RA, RB, phi));
    };
  }
  if (model === 'aisc360-e3') {
    return (E, fy, A, I, _S, L, _bow, RA, RB) => {
      const phi = fastPhi(frame, RA, RB);
      return aiscCapacity(A, fy, (phi * phi * E * I) / (L * L));
    };
  }
  const kind = strengthModelKind(model);
  const alpha = kind?.curve !== undefined ? EN_IMPERFECTION[kind.curve] : undefined;
  if (!kind || alpha === undefined) throw new RangeError(`unknown strength model '${String(model)}'`);
  if (kind.family === 'equivalent-bow') {
    if (frame === 'braced') bracedCurvatureTable();
    const withBow = kind.usesBow;
    return (E, fy, A, I, S, L, bow, RA, RB) => {
      const phi = fastPhi(frame, RA, RB);
      if (phi === 0) return 0;
      const Pcr = (phi * phi * E * I) / (L * L);
      return equivalentBowCapacity(alpha, A, S, fy, Pcr, fastCurvatureFactor(frame, RA, RB, phi), withBow ? bow : 0);
    };
  }
  return (E, fy, A, I, _S, L, _bow, RA, RB) => {
    const phi = fastPhi(frame, RA, RB);
    return enCapacity(alpha, A, fy, (phi * phi * E * I) / (L * L));
  };
}
