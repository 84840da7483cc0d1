/**
 * The bridge from a scenario to numbers: which scenario values are random (and where each one
 * sits in the vector x), and the column's capacity, demand and limit state at any x.
 * g(x) = θ·capacity(x) − Σ loads (docs/mechanics.md). Hot path: no allocation per call.
 */
import { noteEvaluation } from './evaluationCount.js';
import type { Distribution } from '../probability/distribution.js';
import { combinationDistributions, defaultCombination } from '../loads/combinationDistributions.js';
import type { LoadCombination } from '../loads/loadCombinations.js';
import { columnCapacity } from '../mechanics/columnCapacity.js';
import { makeFastCapacityFromRatio } from '../mechanics/fastColumn.js';
import type { ColumnState } from '../mechanics/types.js';
import type { End, Scalar, Scenario, StrengthModel } from '../scenario/types.js';
import { AXIS_Z, corrosionScalars, randomVariables } from '../scenario/variables.js';
import { AREA, ELASTIC_MODULUS_Y, ELASTIC_MODULUS_Z, INERTIA_Y, INERTIA_Z, PROPERTY_COUNT } from '../sections/sectionProperties.js';
import { sectionWriter } from '../sections/sectionDimensions.js';
import { restraintRatio } from '../scenario/restraintRatio.js';
import { flexibleComponents, seriesComponentPath, seriesStiffness } from '../scenario/seriesEnd.js';
import { resolveStrengthModel, type ModelFactorUsed } from './strengthChoice.js';
import { read, slotOf, type Slot } from './slots.js';
import { makeColumnBlockG, type ColumnBlockG } from './columnBlock.js';
import { sectionZone } from './sectionZone.js';
import type { SoundSection } from '../mechanics/types.js';
import { PATH_NOISE } from '../plasticZone/plasticZoneCapacity.js';
import { makePlasticZoneCapacity, makePlasticZoneDirect, type PlasticZoneCapacityFn, type PlasticZoneSample } from './plasticZoneStrength.js';

export interface ColumnModel {
  /** the scenario as its strength model sees it (resolveStrengthModel): default model factor in, ignored bow out */
  readonly scenario: Scenario;
  /** the model factor in use and where it comes from */
  readonly modelFactorUsed: ModelFactorUsed;
  /** the bow was random but the strength model ignores it: it is fixed at its mean */
  readonly bowDropped: boolean;
  /** the load combination whose marginals `dists` holds */
  readonly combination: LoadCombination;
  /** contract paths of the random variables, in the order of x */
  readonly names: string[];
  readonly dists: Distribution[];
  /** Pearson correlation of x (null when independent) */
  readonly correlation: number[][] | null;
  /** every random variable at its mean */
  readonly mean: Float64Array;
  capacity(x: Float64Array): number;
  demand(x: Float64Array): number;
  modelFactor(x: Float64Array): number;
  /** θ·capacity − demand */
  g(x: Float64Array): number;
  /** g over a block of samples, bit-identical to g (columnBlock.ts); null where only g applies (eccentric loads, a lateral spring) */
  readonly gBlock: ColumnBlockG | null;
  /** demand / (θ·capacity), as in `check` when x is the mean */
  utilization(x: Float64Array): number;
  /** everything the mechanics needs at x, about the axis y (allocates: not for hot loops) */
  state(x: Float64Array): ColumnState;
  /** the principal axes checked: y alone, or y and z (capacity is the smaller) */
  readonly axes: readonly AxisModel[];
  /** relative size of the jumps in `capacity` (0: smooth; plastic-zone traced at every evaluation: PATH_NOISE) */
  readonly capacityNoise: number;
}

export type AxisName = 'y' | 'z';

/** One principal axis of the column (docs/sections.md). */
export interface AxisModel {
  readonly name: AxisName;
  /** the strength model about this axis (about z its EN 1993-1-1 curve may differ) */
  readonly strength: StrengthModel;
  capacity(x: Float64Array): number;
  /** allocates: not for hot loops */
  state(x: Float64Array): ColumnState;
  /** capacity when the section is already written for x (the hot path) */
  capacityAfterWrite(x: Float64Array): number;
  /** capacity at full accuracy: plastic-zone by its full model even when sampling reads its table; else `capacity` */
  capacityFull(x: Float64Array): number;
}

interface AxisParts {
  readonly I: (x: Float64Array) => number;
  readonly S: (x: Float64Array) => number;
  readonly bow: Slot;
  readonly bottom: EndRatio;
  readonly top: EndRatio;
  readonly lateral: Slot | null;
  readonly strength: StrengthModel;
  /** the load eccentricities bend about this axis */
  readonly eccentric: boolean;
  /** the section above a corroded zone (a stepped member), null when the loss covers the whole length */
  readonly sound: SoundSection | null;
}

/**
 * Where A, I and S come from at x: the scenario's slots (properties given), or a section recomputed
 * from its dimensions less the sampled corrosion loss (`write` fills a buffer once per call).
 */
interface SectionSource {
  write(x: Float64Array): void;
  /** the corrosion loss per face at x (0 for a section given by its properties) */
  primaryLoss(x: Float64Array): number;
  secondaryLoss(x: Float64Array): number;
  A(x: Float64Array): number;
  Iy(x: Float64Array): number;
  Sy(x: Float64Array): number;
  Iz(x: Float64Array): number;
  Sz(x: Float64Array): number;
}

function sectionSource(s: Scenario, names: readonly string[]): SectionSource {
  const section = s.column.section;
  const geometry = section.geometry;
  if (geometry === undefined) {
    const A = slotOf(section.area, 'column.section.area', names);
    const I = slotOf(section.inertia, 'column.section.inertia', names);
    const S = slotOf(section.sectionModulus, 'column.section.section_modulus', names);
    const Iz = section.inertiaZ === undefined ? I : slotOf(section.inertiaZ, 'column.section.inertia_z', names);
    const Sz = section.sectionModulusZ === undefined ? S : slotOf(section.sectionModulusZ, 'column.section.section_modulus_z', names);
    return {
      write: () => {},
      primaryLoss: () => 0,
      secondaryLoss: () => 0,
      A: (x) => read(A, x),
      Iy: (x) => read(I, x),
      Sy: (x) => read(S, x),
      Iz: (x) => read(Iz, x),
      Sz: (x) => read(Sz, x),
    };
  }
  // reduced dimensions → properties, a few dozen operations and no allocation per sample
  const writer = sectionWriter(geometry.dimensions);
  const props = new Float64Array(PROPERTY_COUNT);
  const corrosion = corrosionScalars(geometry);
  const primary = corrosion.length === 0 ? null : slotOf(corrosion[0]!.scalar, corrosion[0]!.path, names);
  const secondary = corrosion.length === 0 ? null : corrosion.length === 1 ? primary : slotOf(corrosion[1]!.scalar, corrosion[1]!.path, names);
  return {
    write: (x) => writer(props, primary === null ? 0 : read(primary, x), secondary === null ? 0 : read(secondary, x)),
    primaryLoss: (x) => (primary === null ? 0 : read(primary, x)),
    secondaryLoss: (x) => (secondary === null ? 0 : read(secondary, x)),
    A: () => props[AREA],
    Iy: () => props[INERTIA_Y],
    Sy: () => props[ELASTIC_MODULUS_Y],
    Iz: () => props[INERTIA_Z],
    Sz: () => props[ELASTIC_MODULUS_Z],
  };
}

/**
 * R = kL/EI. Far out in u-space both k and EI can overflow (∞/∞) or vanish (0/0): a rigid spring
 * stays rigid and anything else is taken as no restraint, so R is never NaN.
 */
function ratioOf(k: number, L: number, EI: number): number {
  const R = (k * L) / EI;
  return R === R ? R : k === Infinity ? Infinity : 0;
}

/** Beyond this E·I (N·m²) the column's formulas overflow; real columns are below 1e12. */
const EI_OVERFLOW = 1e250;

/** An end as a function of (x, EI) → R = kL/EI. */
type EndRatio = (x: Float64Array, EI: number) => number;

function endRatio(end: End, path: string, names: readonly string[], s: Scenario): EndRatio {
  const L = s.column.length;
  switch (end.type) {
    case 'pinned':
      return () => 0;
    case 'fixed':
      return () => Infinity;
    case 'rotation': {
      const k = slotOf(end.k, `${path}.rotation`, names);
      return (x, EI) => ratioOf(read(k, x), L, EI);
    }
    case 'ratio': {
      const input = slotOf(end.input, `${path}.${end.from}`, names);
      const from = end.from;
      const frame = s.column.frame;
      if (input.index < 0) {
        const R = end.R;
        return () => R;
      }
      return (x) => restraintRatio(from, frame, x[input.index]);
    }
    case 'series': {
      // springs in series: 1/k = Σ 1/k_i (seriesEnd.ts); rigid components add nothing
      const parts = flexibleComponents(end.components).map((c) => slotOf(c.k, seriesComponentPath(path, c.name), names));
      const n = parts.length;
      const k = new Float64Array(n); // reused on every call: no allocation on the hot path
      return (x, EI) => {
        for (let i = 0; i < n; i++) k[i] = read(parts[i], x);
        return ratioOf(seriesStiffness(k, n), L, EI);
      };
    }
  }
}

function correlationMatrix(s: Scenario, names: readonly string[]): number[][] | null {
  if (s.correlation.length === 0) return null;
  const n = names.length;
  const R: number[][] = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? 1 : 0)));
  for (const { a, b, rho } of s.correlation) {
    const i = names.indexOf(a);
    const j = names.indexOf(b);
    if (i < 0 || j < 0) throw new Error(`correlation names ${a} / ${b} which are not random variables`);
    R[i][j] = rho;
    R[j][i] = rho;
  }
  return R;
}

/**
 * Far out in u-space θ·capacity or the load can overflow (θ → 1e308): the margin is then simply
 * enormous. Resistance, demand and margin are each held within ±G_LIMIT so that g stays finite and differences of it (the FORM gradient)
 * do too; such points are hopelessly far from any design point, so the cap changes no answer.
 */
const G_LIMIT = 1e300;
function finiteMargin(g: number): number {
  return g > G_LIMIT ? G_LIMIT : g < -G_LIMIT ? -G_LIMIT : g;
}

/**
 * θ·capacity − load, held finite (g, and any other margin on the same resistance: a survived load's h).
 * θ underflowing to 0 against an overflowing capacity is no resistance, not 0·∞ = NaN.
 */
export function resistanceMargin(theta: number, capacity: number, load: number): number {
  const resistance = theta === 0 ? 0 : theta * capacity;
  return finiteMargin(finiteMargin(resistance) - finiteMargin(load));
}

/** `combination` (default: defaultCombination) sets each load's period; see loads/. */
/**
 * `onlyAxis`: the capacity (and g) about that axis alone, for the failure probability of each axis;
 * default the smaller of the two.
 */
export function buildColumnModel(given: Scenario, combination: LoadCombination = defaultCombination(given), onlyAxis?: AxisName): ColumnModel {
  const resolved = resolveStrengthModel(given);
  const s = resolved.scenario;
  const vars = randomVariables(s);
  const names = vars.map((v) => v.path);
  const dists = combinationDistributions(vars, combination);
  const mean = Float64Array.from(dists, (d) => d.mean);
  const c = s.column;
  const L = c.length;
  const E = slotOf(c.material.E, 'column.material.E', names);
  const fy = slotOf(c.material.fy, 'column.material.fy', names);
  const theta = slotOf(s.modelFactor, 'model_factor', names);
  const loads = s.loads.map((l) => slotOf(l.value, l.path, names));
  // end eccentricities per load (docs/beam-column.md); a load without any reads fixed 0
  const zero: Slot = { index: -1, value: 0 };
  const eccTop = s.loads.map((l) => (l.eccentricity ? slotOf(l.eccentricity.top, `${l.path}.eccentricity.top`, names) : zero));
  const eccBottom = s.loads.map((l) => (l.eccentricity ? slotOf(l.eccentricity.bottom, `${l.path}.eccentricity.bottom`, names) : zero));
  // applied end moments, line load and top force per load (docs/beam-column.md), and the out-of-plumb
  const momTop = s.loads.map((l) => (l.moments ? slotOf(l.moments.top, `${l.path}.moments.top`, names) : zero));
  const momBottom = s.loads.map((l) => (l.moments ? slotOf(l.moments.bottom, `${l.path}.moments.bottom`, names) : zero));
  const line = s.loads.map((l) => (l.transverse ? slotOf(l.transverse, `${l.path}.transverse`, names) : zero));
  const horizontal = s.loads.map((l) => (l.horizontal ? slotOf(l.horizontal, `${l.path}.horizontal`, names) : zero));
  const plumb = c.outOfPlumb === undefined ? zero : slotOf(c.outOfPlumb, 'column.imperfection.out_of_plumb', names);
  const live = (e: Slot) => e.index >= 0 || e.value !== 0;
  const transverse = [...line, ...horizontal, plumb].some(live);
  const eccentric = [...eccTop, ...eccBottom, ...momTop, ...momBottom].some(live) || transverse;
  const side = new Float64Array(2);
  // every load scaled together: the end couples are Σ P_i e_i + Σ M_i, i.e. the total load at the
  // load-weighted eccentricity; written to ecc[0] (bottom), ecc[1] (top). The line load and the top force
  // (with P·φ of the out-of-plumb) per unit of total axial load go to side[0] (1/m), side[1]. No column in
  // tension carries any of them (as for eccentricities: the tool is for compression members).
  const ecc = new Float64Array(2);
  const effectiveEccentricity = (x: Float64Array): void => {
    let sum = 0, mB = 0, mT = 0, w = 0, h = 0;
    for (let k = 0; k < loads.length; k++) {
      const p = read(loads[k], x);
      sum += p;
      mB += p * read(eccBottom[k], x);
      mT += p * read(eccTop[k], x);
    }
    for (let k = 0; k < loads.length; k++) {
      mB += read(momBottom[k], x);
      mT += read(momTop[k], x);
      w += read(line[k], x);
      h += read(horizontal[k], x);
    }
    ecc[0] = sum > 0 ? mB / sum : 0;
    ecc[1] = sum > 0 ? mT / sum : 0;
    side[0] = sum > 0 ? w / sum : 0;
    side[1] = sum > 0 ? h / sum + read(plumb, x) : 0;
  };
  const section = sectionSource(s, names);
  const zone = sectionZone(s);
  const frame = c.frame;

  /** One principal axis: its stiffness, modulus, bow, ends and strength model. */
  const makeAxis = (name: AxisName, parts: AxisParts): AxisModel => {
    const { I, S, bow, bottom, top, lateral, strength, sound } = parts;
    const A = section.A;
    const axisEccentric = parts.eccentric && eccentric;
    const plastic = strength === 'plastic-zone' ? plasticZoneAxis(name) : null;
    const fast = plastic === null ? makeFastCapacityFromRatio(frame, strength) : null;
    // A lateral spring that is zero everywhere lets the tabulated fast path serve every sample.
    const lateralAlwaysZero = lateral === null || (lateral.index < 0 && lateral.value === 0);
    // one object literal of a fixed shape, the optional parts assigned after: object spreads here
    // cost more than the column solve on the exact paths (measured on sway and stepped columns)
    const state = (x: Float64Array): ColumnState => {
      const e = read(E, x);
      const i = I(x);
      const EI = e * i;
      const st: ColumnState = {
        E: e,
        fy: read(fy, x),
        A: A(x),
        I: i,
        S: S(x),
        L,
        bow: read(bow, x),
        frame,
        r: {
          bottom: bottom(x, EI),
          top: top(x, EI),
          lateral: lateral === null ? 0 : (read(lateral, x) * L * L * L) / EI,
        },
      };
      if (axisEccentric) {
        effectiveEccentricity(x);
        st.eccentricity = { bottom: ecc[0], top: ecc[1] };
        if (transverse) st.transverse = { line: side[0], top: side[1] };
      }
      if (sound !== null) st.sound = sound;
      return st;
    };
    /** the section must already be written for x (section.write) */
    const capacity = (x: Float64Array): number => {
      const e = read(E, x);
      const i = I(x);
      const EI = e * i;
      // A sample on the zero bound of a stiffness or strength (uniform or truncnormal with min 0, a
      // far tail that underflows) carries no load: capacity 0 is the answer, not an error.
      if (!(EI > 0) || !(A(x) * read(fy, x) > 0)) return 0;
      // An overflowed stiffness (E or I pushed to the largest doubles by a far FORM step, nowhere
      // near a design point) cannot buckle: the squash load, rather than ∞/∞ = NaN in the formulas.
      if (!(EI < EI_OVERFLOW)) return A(x) * read(fy, x);
      // the plastic-zone model takes the corroded section over the whole length (a zone gives it no credit)
      if (plastic !== null) return plastic.sampled(plasticSample(x, e, EI));
      // the tabulated path knows only the prismatic column: a stepped member takes the exact one
      if (sound !== null) return columnCapacity(strength, state(x)).capacity;
      if (axisEccentric) {
        effectiveEccentricity(x);
        // the tabulated path knows only the concentric column: an eccentric sample takes the exact one
        if (ecc[0] !== 0 || ecc[1] !== 0 || side[0] !== 0 || side[1] !== 0) return columnCapacity(strength, state(x)).capacity;
      }
      if (lateralAlwaysZero && fast !== null) {
        return fast(e, read(fy, x), A(x), i, S(x), L, read(bow, x), bottom(x, EI), top(x, EI));
      }
      return columnCapacity(strength, state(x)).capacity;
    };
    return {
      name,
      strength,
      capacity: (x) => {
        section.write(x);
        return capacity(x);
      },
      state: (x) => {
        section.write(x);
        return state(x);
      },
      capacityAfterWrite: capacity,
      capacityFull:
        plastic === null
          ? (x) => {
              section.write(x);
              return capacity(x);
            }
          : (x) => {
              section.write(x);
              const e = read(E, x);
              const EI = e * I(x);
              if (!(EI > 0) || !(A(x) * read(fy, x) > 0)) return 0;
              return plastic.full(plasticSample(x, e, EI));
            },
    };
    /** the plastic-zone model's input at x (one object per axis, refilled: no allocation per call) */
    function plasticSample(x: Float64Array, e: number, EI: number): PlasticZoneSample {
      if (axisEccentric) effectiveEccentricity(x);
      const p = plasticInput;
      p.E = e;
      p.fy = read(fy, x);
      p.EI = EI;
      p.bow = read(bow, x);
      p.RBottom = bottom(x, EI);
      p.RTop = top(x, EI);
      p.lateral = lateral === null ? 0 : (read(lateral, x) * L * L * L) / EI;
      p.eccBottom = axisEccentric ? ecc[0] : 0;
      p.eccTop = axisEccentric ? ecc[1] : 0;
      p.primaryLoss = section.primaryLoss(x);
      p.secondaryLoss = section.secondaryLoss(x);
      return p;
    }
  };

  const plasticInput: PlasticZoneSample = {
    E: 0, fy: 0, EI: 0, L, bow: 0, RBottom: 0, RTop: 0, lateral: 0, eccBottom: 0, eccTop: 0, primaryLoss: 0, secondaryLoss: 0,
  };
  /**
   * strength: plastic-zone about one axis (docs/plastic-zone.md): `sampled` as analysis.plastic_zone
   * asks (default the cached table), `full` always the full model (check at the means).
   */
  function plasticZoneAxis(name: AxisName): { sampled: PlasticZoneCapacityFn; full: PlasticZoneCapacityFn } {
    const geometry = c.section.geometry;
    if (geometry === undefined) throw new Error('plastic-zone without the section by its dimensions: buildScenario lets no such scenario through');
    const how = s.analysis.plasticZone ?? 'table';
    const full = makePlasticZoneDirect(geometry.dimensions, name, frame);
    const sampled = makePlasticZoneCapacity(geometry.dimensions, name, frame, how, (n, path) =>
      process.stderr.write(
        `stanchion: building the plastic-zone table of this section about ${name} (${n} full evaluations, up to a few minutes, once; cached as ${path})\n`,
      ));
    return { sampled, full };
  }

  const axisY = makeAxis('y', {
    I: section.Iy,
    S: section.Sy,
    bow: slotOf(c.bow, 'column.imperfection.bow', names),
    bottom: endRatio(c.ends.bottom, 'column.ends.bottom', names, s),
    top: endRatio(c.ends.top, 'column.ends.top', names, s),
    lateral: c.ends.lateral === null ? null : slotOf(c.ends.lateral, 'column.ends.lateral', names),
    strength: s.strength,
    eccentric: true,
    sound: zone?.y ?? null,
  });
  const z = c.axisZ;
  const axisZ =
    z === undefined
      ? null
      : makeAxis('z', {
          I: section.Iz,
          S: section.Sz,
          bow: slotOf(z.bow, `${AXIS_Z}.imperfection.bow`, names),
          bottom: endRatio(z.ends.bottom, `${AXIS_Z}.ends.bottom`, names, s),
          top: endRatio(z.ends.top, `${AXIS_Z}.ends.top`, names, s),
          lateral: z.ends.lateral === null ? null : slotOf(z.ends.lateral, `${AXIS_Z}.ends.lateral`, names),
          strength: z.strength,
          // eccentricities act in the plane of bending about y (docs/beam-column.md)
          eccentric: false,
          sound: zone?.z ?? null,
        });
  const axes: AxisModel[] = axisZ === null ? [axisY] : [axisY, axisZ];
  const only = onlyAxis === undefined ? null : onlyAxis === 'z' ? axisZ : axisY;
  if (onlyAxis === 'z' && only === null) throw new Error('the scenario has no axis z');
  const yCapacity = axisY.capacityAfterWrite;
  const zCapacity = axisZ?.capacityAfterWrite;

  const capacity =
    only !== null
      ? (x: Float64Array): number => {
          noteEvaluation();
          return only.capacity(x);
        }
      : zCapacity === undefined
        ? (x: Float64Array): number => {
            noteEvaluation();
            section.write(x);
            return yCapacity(x);
          }
        : (x: Float64Array): number => {
            noteEvaluation();
            section.write(x);
            const cy = yCapacity(x);
            const cz = zCapacity(x);
            return cz < cy ? cz : cy;
          };
  const state = axisY.state;
  const demand = (x: Float64Array): number => {
    let sum = 0;
    for (let k = 0; k < loads.length; k++) sum += read(loads[k], x);
    return sum;
  };
  const modelFactor = (x: Float64Array): number => read(theta, x);
  // built on first use: most models (sweep cases, studies) never sample in blocks
  let block: ColumnBlockG | null = null;
  // The block form knows one axis with its properties given as values (no section recomputed from
  // dimensions), concentric loads and no lateral spring: every other column keeps the one-sample g.
  const yLateral = c.ends.lateral === null ? null : slotOf(c.ends.lateral, 'column.ends.lateral', names);
  const lateralAlwaysZero = yLateral === null || (yLateral.index < 0 && yLateral.value === 0);
  const blockable = !eccentric && lateralAlwaysZero && axisZ === null && onlyAxis !== 'z' && c.section.geometry === undefined;
  const gBlock: ColumnBlockG | null = !blockable ? null : (columns, count, out) => {
    block ??= makeColumnBlockG({
      names, L, frame, strength: s.strength, E, fy,
      A: slotOf(c.section.area, 'column.section.area', names),
      I: slotOf(c.section.inertia, 'column.section.inertia', names),
      S: slotOf(c.section.sectionModulus, 'column.section.section_modulus', names),
      bow: slotOf(c.bow, 'column.imperfection.bow', names),
      theta, loads, bottom: c.ends.bottom, top: c.ends.top, finiteMargin,
    });
    block(columns, count, out);
  };

  return {
    scenario: s,
    modelFactorUsed: resolved.modelFactor,
    bowDropped: resolved.bowDropped,
    combination,
    names,
    dists,
    correlation: correlationMatrix(s, names),
    mean,
    capacity,
    demand,
    modelFactor,
    g: (x) => resistanceMargin(modelFactor(x), capacity(x), demand(x)),
    gBlock,
    utilization: (x) => demand(x) / (modelFactor(x) * capacity(x)),
    state,
    axes,
    capacityNoise: s.strength === 'plastic-zone' && (s.analysis.plasticZone ?? 'table') === 'direct' ? PATH_NOISE : 0,
  };
}
