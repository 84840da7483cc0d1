/**
 * The column's limit state over a block of samples (one Float64Array per random variable, as the
 * Monte Carlo block sampler fills them): out[b] = g(x_b). Column-wise passes (E·I, the two
 * restraint ratios, the demand, the tabulated capacity, the margin) replace a chain of closure
 * calls per sample. Each pass repeats the one-sample arithmetic of columnModel.ts in the same
 * order, so out[b] is bit-identical to g(x_b) (test/limitState/columnBlock.test.ts).
 *
 * Only the concentric column without a lateral spring has a block form (the tabulated path);
 * eccentric loads and lateral springs keep the one-sample g.
 */
import { makeFastCapacityBlock, type CapacityColumns } from '../mechanics/fastCapacityBlock.js';
import type { Frame, StrengthModel } from '../mechanics/types.js';
import type { End } from '../scenario/types.js';
import { restraintRatio } from '../scenario/restraintRatio.js';
import { flexibleComponents, seriesComponentPath, seriesStiffness } from '../scenario/seriesEnd.js';
import { noteEvaluations } from './evaluationCount.js';
import { slotOf, type Slot } from './slots.js';

/** out[b] = g(x_b) for b < count, x_b[i] = columns[i][b]. */
export type ColumnBlockG = (columns: readonly Float64Array[], count: number, out: Float64Array) => void;

export interface ColumnBlockParts {
  names: readonly string[];
  L: number;
  frame: Frame;
  strength: StrengthModel;
  E: Slot;
  fy: Slot;
  A: Slot;
  I: Slot;
  S: Slot;
  bow: Slot;
  theta: Slot;
  loads: readonly Slot[];
  bottom: End;
  top: End;
  /** the margin clamp of the one-sample g (columnModel.ts) */
  finiteMargin: (g: number) => number;
}

/** A column of values for a slot: the sampled column when random, else the constant (filled on growth). */
type Source = (columns: readonly Float64Array[]) => Float64Array;

/** R = kL/EI of one end for the block, into out. */
type EndRatioBlock = (columns: readonly Float64Array[], EI: Float64Array, count: number, out: Float64Array) => void;

export function makeColumnBlockG(p: ColumnBlockParts): ColumnBlockG {
  let allocated = 0;
  const constants: { slot: Slot; col: Float64Array }[] = [];
  const source = (slot: Slot): Source => {
    if (slot.index >= 0) {
      const index = slot.index;
      return (columns) => columns[index];
    }
    const entry = { slot, col: new Float64Array(0) };
    constants.push(entry);
    return () => entry.col;
  };
  const E = source(p.E), fy = source(p.fy), A = source(p.A), I = source(p.I), S = source(p.S), bow = source(p.bow);
  const theta = source(p.theta);
  const loads = p.loads.map(source);
  const bottom = endRatioBlock(p.bottom, 'column.ends.bottom', p, source);
  const top = endRatioBlock(p.top, 'column.ends.top', p, source);
  const capacityBlock = makeFastCapacityBlock(p.frame, p.strength);
  const finiteMargin = p.finiteMargin;
  const L = p.L;
  let EI = new Float64Array(0), RA = EI, RB = EI, cap = EI, demand = EI;

  const grow = (count: number): void => {
    allocated = count;
    for (const c of constants) c.col = new Float64Array(count).fill(c.slot.value);
    EI = new Float64Array(count);
    RA = new Float64Array(count);
    RB = new Float64Array(count);
    cap = new Float64Array(count);
    demand = new Float64Array(count);
  };

  return (columns, count, out) => {
    if (count > allocated) grow(count);
    const e = E(columns), i = I(columns), th = theta(columns);
    for (let b = 0; b < count; b++) EI[b] = e[b] * i[b];
    bottom(columns, EI, count, RA);
    top(columns, EI, count, RB);
    const cols: CapacityColumns = { E: e, fy: fy(columns), A: A(columns), I: i, S: S(columns), bow: bow(columns), EI, RA, RB };
    capacityBlock(cols, L, count, cap);
    // demand: Σ loads in scenario order, starting from 0 (as the one-sample sum)
    demand.fill(0, 0, count);
    for (const load of loads) {
      const l = load(columns);
      for (let b = 0; b < count; b++) demand[b] += l[b];
    }
    let evaluated = 0;
    for (let b = 0; b < count; b++) {
      const t = th[b];
      // θ = 0: no resistance and, as in the one-sample g, no capacity evaluation counted
      let resistance = 0;
      if (t !== 0) {
        resistance = t * cap[b];
        evaluated++;
      }
      out[b] = finiteMargin(finiteMargin(resistance) - finiteMargin(demand[b]));
    }
    noteEvaluations(evaluated);
  };
}

function endRatioBlock(end: End, path: string, p: ColumnBlockParts, source: (s: Slot) => Source): EndRatioBlock {
  const L = p.L;
  switch (end.type) {
    case 'pinned':
      return (_c, _EI, count, out) => out.fill(0, 0, count);
    case 'fixed':
      return (_c, _EI, count, out) => out.fill(Infinity, 0, count);
    case 'rotation': {
      const k = source(slotOf(end.k, `${path}.rotation`, p.names));
      return (columns, EI, count, out) => {
        const kc = k(columns);
        for (let b = 0; b < count; b++) out[b] = (kc[b] * L) / EI[b];
      };
    }
    case 'ratio': {
      const input = slotOf(end.input, `${path}.${end.from}`, p.names);
      if (input.index < 0) {
        const R = end.R;
        return (_c, _EI, count, out) => out.fill(R, 0, count);
      }
      const from = end.from;
      const frame = p.frame;
      const index = input.index;
      return (columns, _EI, count, out) => {
        const v = columns[index];
        for (let b = 0; b < count; b++) out[b] = restraintRatio(from, frame, v[b]);
      };
    }
    case 'series': {
      const parts = flexibleComponents(end.components).map((c) => source(slotOf(c.k, seriesComponentPath(path, c.name), p.names)));
      const n = parts.length;
      const k = new Float64Array(n);
      return (columns, EI, count, out) => {
        const cols = parts.map((part) => part(columns));
        for (let b = 0; b < count; b++) {
          for (let j = 0; j < n; j++) k[j] = cols[j][b];
          out[b] = (seriesStiffness(k, n) * L) / EI[b];
        }
      };
    }
  }
}
