/**
 * Checking a sweep's cases before the first one runs, so that a bad value is reported at
 * once (exit 2, nothing written) instead of after cases have run and been journalled.
 *
 * Up to FULL_CHECK_CASES cases, every case is checked in full (about 2 ms each: the base
 * scenario with the case's values set, read by the scenario validator and built into a
 * model). A larger sweep would spend minutes on that, so it checks what its cases are made
 * of instead: every value of every listed axis and both ends of every range (with the other
 * axes at their first value), every corner (each axis at its first or last value, up to 2^10
 * corners), and for a list design every distinct value of each path. A grid case only
 * combines those values, and a point of a range (grid or Latin hypercube) lies between the
 * range's ends, which the scenario's rules (bounds such as > 0) accept when both ends pass. That catches every rule of one value, and rules between values (a min below a
 * max) at their extremes. A combination that still fails is recorded in the case's error
 * column when it runs; it does not stop the sweep.
 */
import type { CaseTable, RangeAxis, SweepDefinition, SweepValue, VaryAxis } from './sweepTypes.js';
import { axisLength, axisValue } from './sweepDesign.js';
import { withUnit } from './sweepValues.js';

export const FULL_CHECK_CASES = 2000;
const MAX_CORNER_AXES = 10;

/** `check(values, index)` throws for a bad case; index is null for a combination built here. */
export type CaseCheck = (values: Record<string, SweepValue>, index: number | null) => void;

function isRange(axis: VaryAxis): axis is RangeAxis {
  return 'from' in axis;
}

/** First and last value of an axis as the cases see them. */
function axisEnds(def: SweepDefinition, axis: VaryAxis): SweepValue[] {
  if (def.design === 'lhs' && isRange(axis)) return [withUnit(axis.from, axis.unit), withUnit(axis.to, axis.unit)];
  const n = axisLength(axis);
  return n === 1 ? [axisValue(axis, 0)] : [axisValue(axis, 0), axisValue(axis, n - 1)];
}

function* corners(ends: SweepValue[][], paths: string[]): Generator<Record<string, SweepValue>> {
  const total = ends.reduce((n, e) => n * e.length, 1);
  for (let k = 0; k < total; k++) {
    const values: Record<string, SweepValue> = {};
    let rest = k;
    paths.forEach((p, a) => {
      values[p] = ends[a][rest % ends[a].length];
      rest = Math.floor(rest / ends[a].length);
    });
    yield values;
  }
}

/** Runs `check` on every case, or on what the cases are made of (see above). Returns the number of checks. */
export function checkSweepCases(table: CaseTable, def: SweepDefinition, check: CaseCheck): number {
  let checks = 0;
  const run = (values: Record<string, SweepValue>, index: number | null): void => {
    check(values, index);
    checks += 1;
  };
  if (table.count <= FULL_CHECK_CASES) {
    for (let k = 0; k < table.count; k++) run(table.valuesAt(k), k);
    return checks;
  }
  const first = table.valuesAt(0);
  run(first, 0);
  run(table.valuesAt(table.count - 1), table.count - 1);
  const seen = new Set<string>();
  const once = (values: Record<string, SweepValue>): void => {
    const key = JSON.stringify(values);
    if (seen.has(key)) return;
    seen.add(key);
    run(values, null);
  };
  if (def.design === 'list') {
    for (const p of table.varied) {
      const distinct = new Set<SweepValue>();
      for (let k = 0; k < table.count; k++) distinct.add(table.valuesAt(k)[p]);
      for (const v of distinct) once({ ...first, [p]: v });
    }
    return checks;
  }
  for (const axis of def.vary) {
    // a range's points lie between its ends; a list's values are checked one by one
    const values = isRange(axis) ? axisEnds(def, axis) : axis.values;
    for (const v of values) once({ ...first, [axis.path]: v });
  }
  if (def.vary.length <= MAX_CORNER_AXES) {
    for (const values of corners(def.vary.map((a) => axisEnds(def, a)), table.varied)) once(values);
  }
  return checks;
}
