// A sweep case's scenario built from the shape-checked base (each varied value checked against its
// own field's rule) must be the scenario the whole shape check gives, key order included, and a
// refused value must get the whole check's message. The scenarios are invented for the test; a consistency
// check of two code paths (common practice), no outside value.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { InputError } from '../../src/scenario/inputError.js';
import { scenarioShape } from '../../src/scenario/scenarioShape.js';
import { checkSweepPaths, parseSweepBase, scenarioWithValues, scenarioWithValuesChecked, shapedCase, treeWithValues, type SweepBase } from '../../src/studies/applySweepValues.js';
import type { SweepValue } from '../../src/studies/sweepTypes.js';

const WIDE = `stanchion: 1
title: shaped sweep test column
column:
  length: 4.5 m
  frame: braced
  section: {area: 6000 mm^2, inertia: 15e6 mm^4, section_modulus: 150e3 mm^3}
  material:
    E: {dist: lognormal, mean: 200 GPa, cov: 0.03}
    fy:
      dist: lognormal
      mean: 300 MPa
      cov: 0.07
      evidence: {tests: [312 MPa, 298 MPa, 331 MPa, 305 MPa]}
  ends:
    bottom: {series: {connection: {dist: lognormal, mean: 2 MN m/rad, cov: 0.4}, foundation: 8 MN m/rad}}
    top: {rotation: {dist: weibull, mean: 0.3 MN m/rad, sd: 0.1 MN m/rad}}
  imperfection:
    bow: {dist: normal, mean: L/1000, sd: L/2000}
loads:
  dead: {dist: normal, mean: 300 kN, cov: 0.10, kind: permanent}
  wind: {value: 40 kN, eccentricity: {top: 30 mm, bottom: {dist: normal, mean: 10 mm, sd: 3 mm}}}
model_factor: {dist: lognormal, mean: 1.0, cov: 0.05}
strength: first-yield
target: {beta: 3.8, period: 50 years}
correlation:
  - [column.material.E, model_factor, 0.2]
analysis: {seed: 3, methods: [form]}
`;

const bases: [string, SweepBase][] = [
  ['wide.yaml', parseSweepBase(WIDE, 'wide.yaml')],
  ...['braced-base-plate.yaml', 'sway-canopy-post.yaml', 'timber-store-post.yaml'].map((f): [string, SweepBase] => {
    const path = join(__dirname, '..', '..', 'scenarios', f);
    return [f, parseSweepBase(readFileSync(path, 'utf8'), f)];
  }),
];

const GOOD: Record<string, SweepValue>[] = [
  { 'column.length': '6.3 m' },
  { 'loads.dead.mean': '250 kN', 'column.length': '3 m' },
  { 'loads.dead.sd': '20 kN' }, // drops the file's cov, adds sd in the shape's key order
  { 'loads.dead.sd': '20 kN', 'loads.dead.cov': 0.12 },
  { 'loads.dead.cov': 0.2 },
  { 'model_factor.cov': 0.1, 'model_factor.mean': 1.1 },
  { 'column.material.E': '210 GPa' }, // a random variable replaced by a fixed value
  { 'column.material.E.cov': 0.05 },
  { 'column.ends.bottom': 'pinned' },
  { 'column.imperfection.bow.mean': 'L/500' },
  { 'column.section.area': '7000 mm^2' },
  { 'column.ends.bottom.series.connection.mean': '5 MN m/rad' },
  { 'column.ends.top.rotation.cov': 0.3 },
  { 'loads.wind.value': '60 kN' },
  { 'loads.wind.eccentricity.top': '45 mm' },
  { 'loads.imposed.mean': '120 kN' },
  { 'column.material.fy.mean': '320 MPa' },
  { 'strength': 'en1993-b' },
];

const BAD: Record<string, SweepValue>[] = [
  { 'column.length': 5 }, // shape: no unit
  { 'loads.dead.mean': 'heavy' }, // shape: not a quantity
  { 'loads.dead.mean': '-50 kN' }, // meaning: below the field's domain
  { 'loads.dead.dist': 'uniform' }, // a different distribution: the branch changes
  { 'model_factor.cov': -0.1 },
  { 'column.length': '0 m' },
  { 'strength': 'en1993-q' },
  { 'column.ends.bottom': 'hinged' },
  { 'loads.dead.mean': '250 kN', 'column.length': 6 },
];

function errorOf(fn: () => unknown): InputError | string {
  try {
    fn();
  } catch (err) {
    if (err instanceof InputError) return err;
    return `${(err as Error).name}: ${(err as Error).message}`;
  }
  return 'no error';
}

/** Values whose paths are all in this base (planEdit refuses the others the same way in both). */
function applicable(b: SweepBase, values: Record<string, SweepValue>): boolean {
  return errorOf(() => checkSweepPaths(b, Object.keys(values))) === 'no error';
}

afterEach(() => vi.restoreAllMocks());

describe('scenarioWithValues on the shape-checked base', () => {
  it('gives the scenario of the whole shape check, key order included, without shape-checking the whole scenario', () => {
    let compared = 0;
    for (const [name, b] of bases) {
      for (const values of GOOD) {
        if (!applicable(b, values)) continue;
        const checked = errorOf(() => scenarioWithValuesChecked(b, values));
        expect(shapedCase(b, values), `${name} ${JSON.stringify(values)}`).not.toBeNull();
        if (checked !== 'no error') {
          // a good value for one base may break a rule of another (e.g. a length with a fixed bow): same message both ways
          const fast = errorOf(() => scenarioWithValues(b, values));
          expect(fast, `${name} ${JSON.stringify(values)}`).toEqual(checked);
          continue;
        }
        const spy = vi.spyOn(scenarioShape, 'safeParse');
        const fast = scenarioWithValues(b, values);
        expect(spy, `${name} ${JSON.stringify(values)} took the whole check`).not.toHaveBeenCalled();
        spy.mockRestore();
        expect(JSON.stringify(fast), `${name} ${JSON.stringify(values)}`).toBe(JSON.stringify(scenarioWithValuesChecked(b, values)));
        // the data the meaning stage reads: the whole check's output, keys in the same order
        expect(JSON.stringify(shapedCase(b, values)), `${name} ${JSON.stringify(values)}`).toBe(JSON.stringify(scenarioShape.parse(treeWithValues(b, values).value)));
        compared++;
      }
    }
    expect(compared).toBeGreaterThan(40);
  });

  it('a value its field refuses gets exactly the message of the whole check (field, line, text)', () => {
    let compared = 0;
    for (const [name, b] of bases) {
      for (const values of BAD) {
        if (!applicable(b, values)) continue;
        const checked = errorOf(() => scenarioWithValuesChecked(b, values));
        expect(checked, `${name} ${JSON.stringify(values)}`).toBeInstanceOf(InputError);
        const fast = errorOf(() => scenarioWithValues(b, values));
        expect(fast).toBeInstanceOf(InputError);
        const [f, c] = [fast as InputError, checked as InputError];
        expect([f.field, f.line, f.message], `${name} ${JSON.stringify(values)}`).toEqual([c.field, c.line, c.message]);
        compared++;
      }
    }
    expect(compared).toBeGreaterThan(25);
  });

  it('leaves the base untouched: cases share what they do not edit', () => {
    const [, b] = bases[0];
    const before = JSON.stringify(b.shaped);
    scenarioWithValues(b, { 'loads.dead.sd': '20 kN', 'column.length': '5 m' });
    scenarioWithValues(b, { 'column.ends.bottom.series.connection.mean': '5 MN m/rad' });
    expect(JSON.stringify(b.shaped)).toBe(before);
    expect(Object.isFrozen(b.shaped.column.ends)).toBe(true);
    expect(scenarioWithValues(b, { 'loads.dead.mean': '310 kN' }).loads[0]).not.toEqual(scenarioWithValues(b, { 'loads.dead.mean': '320 kN' }).loads[0]);
  });
});
