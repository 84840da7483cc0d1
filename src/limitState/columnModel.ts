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
import type { End, Scalar, Scenario } from '../scenario/types.js';
import { randomVariables } from '../scenario/variables.js';
import { restraintRatio } from '../scenario/restraintRatio.js';
import { flexibleComponents, seriesComponentPath, seriesStiffness } from '../scenario/seriesEnd.js';
import { resolveStrengthModel, type ModelFactorUsed } from './strengthChoice.js';
import { makePlasticZoneCapacity } from './plasticZoneStrength.js';

/** Where a value comes from: x[index] when random, else the fixed value. */
interface Slot {
  readonly index: number;
  readonly value: number;
}

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
  /** demand / (θ·capacity), as in `check` when x is the mean */
  utilization(x: Float64Array): number;
  /** everything the mechanics needs at x (allocates: not for hot loops) */
  state(x: Float64Array): ColumnState;
}

function slotOf(scalar: Scalar, path: string, names: readonly string[]): Slot {
  if (scalar.kind === 'fixed') return { index: -1, value: scalar.value };
  const index = names.indexOf(path);
  if (index < 0) throw new Error(`random variable ${path} is missing from the variable list`);
  return { index, value: NaN };
}

function read(slot: Slot, x: Float64Array): number {
  return slot.index < 0 ? slot.value : x[slot.index];
}

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
      return (x, EI) => (read(k, x) * L) / EI;
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
        return (seriesStiffness(k, n) * L) / EI;
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

/** `combination` (default: defaultCombination) sets each load's period; see loads/. */
export function buildColumnModel(given: Scenario, combination: LoadCombination = defaultCombination(given)): ColumnModel {
  const resolved = resolveStrengthModel(given);
  const s = resolved.scenario;
  const vars = randomVariables(s);
  const names = vars.map((v) => v.path);
  const dists = combinationDistributions(vars, combination);
  const mean = Float64Array.from(dists, (d) => d.mean);
  const c = s.column;
  const L = c.length;
  const A = slotOf(c.section.area, 'column.section.area', names);
  const I = slotOf(c.section.inertia, 'column.section.inertia', names);
  const S = slotOf(c.section.sectionModulus, 'column.section.section_modulus', names);
  const E = slotOf(c.material.E, 'column.material.E', names);
  const fy = slotOf(c.material.fy, 'column.material.fy', names);
  const bow = slotOf(c.bow, 'column.imperfection.bow', names);
  const theta = slotOf(s.modelFactor, 'model_factor', names);
  const loads = s.loads.map((l) => slotOf(l.value, l.path, names));
  // end eccentricities per load (docs/beam-column.md); a load without any reads fixed 0
  const zero: Slot = { index: -1, value: 0 };
  const eccTop = s.loads.map((l) => (l.eccentricity ? slotOf(l.eccentricity.top, `${l.path}.eccentricity.top`, names) : zero));
  const eccBottom = s.loads.map((l) => (l.eccentricity ? slotOf(l.eccentricity.bottom, `${l.path}.eccentricity.bottom`, names) : zero));
  const eccentric = [...eccTop, ...eccBottom].some((e) => e.index >= 0 || e.value !== 0);
  // every load scaled together: the end couples are Σ P_i e_i, i.e. the total load at the
  // load-weighted eccentricity; written to ecc[0] (bottom), ecc[1] (top). No column in tension is eccentric.
  const ecc = new Float64Array(2);
  const effectiveEccentricity = (x: Float64Array): void => {
    let sum = 0, mB = 0, mT = 0;
    for (let k = 0; k < loads.length; k++) {
      const p = read(loads[k], x);
      sum += p;
      mB += p * read(eccBottom[k], x);
      mT += p * read(eccTop[k], x);
    }
    ecc[0] = sum > 0 ? mB / sum : 0;
    ecc[1] = sum > 0 ? mT / sum : 0;
  };
  const lateral = c.ends.lateral === null ? null : slotOf(c.ends.lateral, 'column.ends.lateral', names);
  const bottom = endRatio(c.ends.bottom, 'column.ends.bottom', names, s);
  const top = endRatio(c.ends.top, 'column.ends.top', names, s);
  const frame = c.frame;
  const strength = s.strength;
  const plasticShape = strength === 'plastic-zone' ? c.section.shape : undefined;
  if (strength === 'plastic-zone' && plasticShape === undefined) throw new Error('plastic-zone without column.section.shape: buildScenario lets no such scenario through');
  const fast = plasticShape ? null : makeFastCapacityFromRatio(frame, strength);
  const plasticCapacity = plasticShape
    ? makePlasticZoneCapacity(plasticShape, frame, s.analysis.plasticZone ?? 'direct', (n, path) =>
        process.stderr.write(`stanchion: building the plastic-zone table for this section (${n} full evaluations, once; cached as ${path})\n`))
    : null;
  // A lateral spring that is zero everywhere lets the tabulated fast path serve every sample.
  const lateralAlwaysZero = lateral === null || (lateral.index < 0 && lateral.value === 0);

  const state = (x: Float64Array): ColumnState => {
    const EI = read(E, x) * read(I, x);
    if (eccentric) effectiveEccentricity(x);
    return {
      ...(eccentric ? { eccentricity: { bottom: ecc[0], top: ecc[1] } } : {}),
      E: read(E, x),
      fy: read(fy, x),
      A: read(A, x),
      I: read(I, x),
      S: read(S, x),
      L,
      bow: read(bow, x),
      frame,
      r: {
        bottom: bottom(x, EI),
        top: top(x, EI),
        lateral: lateral === null ? 0 : (read(lateral, x) * L * L * L) / EI,
      },
    };
  };

  const capacity = (x: Float64Array): number => {
    noteEvaluation();
    const e = read(E, x);
    const i = read(I, x);
    const EI = e * i;
    // A sample on the zero bound of a stiffness or strength (uniform or truncnormal with min 0, a
    // far tail that underflows) carries no load: capacity 0 is the answer, not an error.
    if (!(EI > 0) || !(read(A, x) * read(fy, x) > 0)) return 0;
    if (plasticCapacity) {
      if (eccentric) effectiveEccentricity(x);
      return plasticCapacity({
        E: e, fy: read(fy, x), EI, L, bow: read(bow, x), RBottom: bottom(x, EI), RTop: top(x, EI),
        lateral: lateral === null ? 0 : (read(lateral, x) * L * L * L) / EI,
        eccBottom: eccentric ? ecc[0] : 0, eccTop: eccentric ? ecc[1] : 0,
      });
    }
    if (eccentric) {
      effectiveEccentricity(x);
      // the tabulated path knows only the concentric column: an eccentric sample takes the exact one
      if (ecc[0] !== 0 || ecc[1] !== 0) return columnCapacity(strength, state(x)).capacity;
    }
    if (lateralAlwaysZero && fast) {
      return fast(e, read(fy, x), read(A, x), i, read(S, x), L, read(bow, x), bottom(x, EI), top(x, EI));
    }
    return columnCapacity(strength, state(x)).capacity;
  };
  const demand = (x: Float64Array): number => {
    let sum = 0;
    for (let k = 0; k < loads.length; k++) sum += read(loads[k], x);
    return sum;
  };
  const modelFactor = (x: Float64Array): number => read(theta, x);

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
    g: (x) => {
      const theta = modelFactor(x);
      // θ underflowing to 0 against an overflowing capacity is no resistance, not 0·∞ = NaN
      const resistance = theta === 0 ? 0 : theta * capacity(x);
      return finiteMargin(finiteMargin(resistance) - finiteMargin(demand(x)));
    },
    utilization: (x) => demand(x) / (modelFactor(x) * capacity(x)),
    state,
  };
}
