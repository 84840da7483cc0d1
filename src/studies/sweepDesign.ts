/**
 * Turning a sweep definition into its case table: a full grid (first axis slowest), a Latin
 * hypercube of M cases (one stratum per case on every axis, seeded), or an explicit list.
 * Each case gets its index as a stable id and a seed derived from (sweep seed, index).
 */
import { uniformStream } from '../probability/rng.js';
import { InputError } from '../scenario/inputError.js';
import { caseSeeds } from './caseSeed.js';
import { pointOnRange, rangeValues, withUnit } from './sweepValues.js';
import type { CaseTable, RangeAxis, SweepDefinition, SweepValue, VaryAxis } from './sweepTypes.js';

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

export function gridCases(axes: VaryAxis[]): Record<string, SweepValue>[] {
  const columns = axes.map((axis) => {
    if (!isRange(axis)) {
      if (axis.values.length === 0) throw new InputError(`vary.${axis.path}`, 'no values');
      return axis.values;
    }
    if (axis.steps === undefined) throw new InputError(`vary.${axis.path}`, 'a grid needs STEPS on every range');
    return rangeValues(axis, axis.steps);
  });
  let rows: Record<string, SweepValue>[] = [{}];
  axes.forEach((axis, a) => {
    const next: Record<string, SweepValue>[] = [];
    for (const row of rows) for (const value of columns[a]) next.push({ ...row, [axis.path]: value });
    rows = next;
  });
  return rows;
}

/** Streams 1 + 2a (stratum order) and 2 + 2a (position inside the stratum) for axis a. */
export function latinHypercubeCases(axes: VaryAxis[], count: number, seed: number): Record<string, SweepValue>[] {
  if (!(Number.isInteger(count) && count >= 1)) throw new InputError('cases', `a Latin hypercube needs cases >= 1, got ${count}`);
  const rows: Record<string, SweepValue>[] = Array.from({ length: count }, () => ({}));
  axes.forEach((axis, a) => {
    if (!isRange(axis)) throw new InputError(`vary.${axis.path}`, 'a Latin hypercube needs a range FROM:TO, not a list');
    const order = uniformStream(seed, 1 + 2 * a);
    const jitter = uniformStream(seed, 2 + 2 * a);
    const strata = Array.from({ length: count }, (_, k) => k);
    for (let k = count - 1; k > 0; k--) {
      const j = Math.floor(order() * (k + 1));
      [strata[k], strata[j]] = [strata[j], strata[k]];
    }
    for (let k = 0; k < count; k++) {
      const u = (strata[k] + jitter()) / count;
      rows[k][axis.path] = withUnit(pointOnRange(axis, u), axis.unit);
    }
  });
  return rows;
}

function listCases(list: Record<string, SweepValue>[] | undefined): { varied: string[]; rows: Record<string, SweepValue>[] } {
  if (!list || list.length === 0) throw new InputError('list', "design 'list' needs a non-empty list of cases");
  const varied = Object.keys(list[0]);
  list.forEach((row, k) => {
    const keys = Object.keys(row);
    if (keys.length !== varied.length || !varied.every((p) => p in row)) {
      throw new InputError(`list[${k}]`, `every case must set the same paths (${varied.join(', ')})`);
    }
  });
  return { varied, rows: list.map((row) => Object.fromEntries(varied.map((p) => [p, row[p]]))) };
}

export function buildCaseTable(def: SweepDefinition): CaseTable {
  let varied: string[];
  let rows: Record<string, SweepValue>[];
  if (def.design === 'list') {
    ({ varied, rows } = listCases(def.list));
  } else {
    if (def.vary.length === 0) throw new InputError('vary', 'nothing is varied');
    varied = def.vary.map((axis) => axis.path);
    rows = def.design === 'grid' ? gridCases(def.vary) : latinHypercubeCases(def.vary, def.cases ?? NaN, def.seed);
  }
  checkDistinctPaths(varied);
  const seeds = caseSeeds(def.seed, rows.length);
  return { varied, cases: rows.map((values, index) => ({ index, seed: seeds[index], values })) };
}
