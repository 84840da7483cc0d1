/**
 * Turning a sweep definition into its case table: a full grid (first axis slowest), a Latin
 * hypercube of M cases (one stratum per case on every axis, seeded), or an explicit list.
 * No case is built until asked for: a grid decodes case i from i (mixed radix), a Latin
 * hypercube keeps one position per case and axis in a typed array, a list reads its row.
 * Seeds come in index order from caseSeed.ts (iterateCases).
 */
import { uniformStream } from '../probability/rng.js';
import { InputError } from '../scenario/inputError.js';
import { caseSeedStream } from './caseSeed.js';
import { pointOnRange, withUnit } from './sweepValues.js';
import type { CaseTable, RangeAxis, Shard, SweepCase, SweepDefinition, SweepValue, VaryAxis } from './sweepTypes.js';

/**
 * The most cases a sweep may have. The journal, sweep.csv and sweep.json each take a few
 * hundred bytes per case (some gigabytes each at this count) and merging keeps about 20 bytes
 * of index per case; beyond it the files are too large to open or to finish in a working day.
 */
export const MAX_SWEEP_CASES = 10_000_000;
/** A Latin hypercube keeps 8 bytes per case and axis in memory; beyond a million cases its
 * stratification buys nothing over plain random sampling. */
export const MAX_LHS_CASES = 1_000_000;

export const CASE_CAP_REASON =
  `a sweep has at most ${MAX_SWEEP_CASES.toExponential(0)} cases (its journal, sweep.csv and sweep.json take a few hundred bytes per case each)`;

function isRange(axis: VaryAxis): axis is RangeAxis {
  return 'from' in axis;
}

function checkDistinctPaths(paths: string[]): void {
  const seen = new Set<string>();
  for (const p of paths) {
    if (seen.has(p)) throw new InputError('vary', `path '${p}' is varied twice`);
    seen.add(p);
  }
}

/** Number of points on a grid axis. */
export function axisLength(axis: VaryAxis): number {
  if (!isRange(axis)) return axis.values.length;
  return axis.steps ?? NaN;
}

/** The k-th point of a grid axis (the same numbers rangeValues gives). */
export function axisValue(axis: VaryAxis, k: number): SweepValue {
  if (!isRange(axis)) return axis.values[k];
  const steps = axis.steps as number;
  return withUnit(steps === 1 ? axis.from : pointOnRange(axis, k / (steps - 1)), axis.unit);
}

function gridTable(axes: VaryAxis[], seed: number): CaseTable {
  let count = 1;
  for (const axis of axes) {
    const n = axisLength(axis);
    if (!isRange(axis) && n === 0) throw new InputError(`vary.${axis.path}`, 'no values');
    if (Number.isNaN(n)) throw new InputError(`vary.${axis.path}`, 'a grid needs STEPS on every range');
    count *= n;
    if (count > MAX_SWEEP_CASES) {
      throw new InputError('vary', `the grid has ${axes.map(axisLength).join(' × ')} cases; ${CASE_CAP_REASON}`);
    }
  }
  const lengths = axes.map(axisLength);
  const valuesAt = (index: number): Record<string, SweepValue> => {
    const values: Record<string, SweepValue> = {};
    let rest = index;
    for (let a = axes.length - 1; a >= 0; a--) {
      values[axes[a].path] = axisValue(axes[a], rest % lengths[a]);
      rest = Math.floor(rest / lengths[a]);
    }
    // keep the axes' order in the record (first axis first)
    return Object.fromEntries(axes.map((axis) => [axis.path, values[axis.path]]));
  };
  return { varied: axes.map((a) => a.path), count, seed, valuesAt };
}

/** Streams 1 + 2a (stratum order) and 2 + 2a (position inside the stratum) for axis a. */
function latinHypercubeTable(axes: VaryAxis[], count: number, seed: number): CaseTable {
  if (!(Number.isInteger(count) && count >= 1)) throw new InputError('cases', `a Latin hypercube needs cases >= 1, got ${count}`);
  if (count > MAX_LHS_CASES) {
    throw new InputError('cases', `a Latin hypercube has at most ${MAX_LHS_CASES} cases (it keeps 8 bytes per case and axis in memory), got ${count}`);
  }
  const ranges = axes.map((axis) => {
    if (!isRange(axis)) throw new InputError(`vary.${axis.path}`, 'a Latin hypercube needs a range FROM:TO, not a list');
    return axis;
  });
  const positions = ranges.map((_, a) => {
    const order = uniformStream(seed, 1 + 2 * a);
    const jitter = uniformStream(seed, 2 + 2 * a);
    const strata = new Uint32Array(count);
    for (let k = 0; k < count; k++) strata[k] = k;
    for (let k = count - 1; k > 0; k--) {
      const j = Math.floor(order() * (k + 1));
      const t = strata[k];
      strata[k] = strata[j];
      strata[j] = t;
    }
    const u = new Float64Array(count);
    for (let k = 0; k < count; k++) u[k] = (strata[k] + jitter()) / count;
    return u;
  });
  const valuesAt = (index: number): Record<string, SweepValue> =>
    Object.fromEntries(ranges.map((axis, a) => [axis.path, withUnit(pointOnRange(axis, positions[a][index]), axis.unit)]));
  return { varied: ranges.map((a) => a.path), count, seed, valuesAt };
}

function listTable(list: Record<string, SweepValue>[] | undefined, seed: number): CaseTable {
  if (!list || list.length === 0) throw new InputError('list', "design 'list' needs a non-empty list of cases");
  if (list.length > MAX_SWEEP_CASES) throw new InputError('list', `${list.length} cases; ${CASE_CAP_REASON}`);
  const varied = Object.keys(list[0]);
  list.forEach((row, k) => {
    const keys = Object.keys(row);
    if (keys.length !== varied.length || !varied.every((p) => p in row)) {
      throw new InputError(`list[${k}]`, `every case must set the same paths (${varied.join(', ')})`);
    }
  });
  const valuesAt = (index: number): Record<string, SweepValue> => Object.fromEntries(varied.map((p) => [p, list[index][p]]));
  return { varied, count: list.length, seed, valuesAt };
}

export function buildCaseTable(def: SweepDefinition): CaseTable {
  if (def.design === 'list') {
    const table = listTable(def.list, def.seed);
    checkDistinctPaths(table.varied);
    return table;
  }
  if (def.vary.length === 0) throw new InputError('vary', 'nothing is varied');
  checkDistinctPaths(def.vary.map((axis) => axis.path));
  return def.design === 'grid' ? gridTable(def.vary, def.seed) : latinHypercubeTable(def.vary, def.cases ?? NaN, def.seed);
}

export function checkShard(shard: Shard): void {
  if (!(Number.isInteger(shard.count) && shard.count >= 1 && Number.isInteger(shard.index) && shard.index >= 0 && shard.index < shard.count)) {
    throw new Error(`bad shard ${shard.index}/${shard.count}`);
  }
}

/** How many cases shard I/N takes: the indices k < count with k % N == I. */
export function shardSize(count: number, shard: Shard): number {
  return shard.index < count ? Math.floor((count - 1 - shard.index) / shard.count) + 1 : 0;
}

/**
 * The cases of a shard in index order, built one at a time (seeds are drawn for every index,
 * so case k's seed is the same in every shard). `skip(k)` leaves case k out unbuilt.
 */
export function* iterateCases(table: CaseTable, shard: Shard = { index: 0, count: 1 }, skip?: (index: number) => boolean): Generator<SweepCase> {
  checkShard(shard);
  const nextSeed = caseSeedStream(table.seed);
  for (let index = 0; index < table.count; index++) {
    const seed = nextSeed();
    if (index % shard.count !== shard.index || skip?.(index)) continue;
    yield { index, seed, values: table.valuesAt(index) };
  }
}
