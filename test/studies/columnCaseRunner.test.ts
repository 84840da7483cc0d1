import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import YAML from 'yaml';
import { buildColumnModel } from '../../src/limitState/columnModel.js';
import { deterministicCheck } from '../../src/limitState/deterministicCheck.js';
import { InputError } from '../../src/scenario/inputError.js';
import { loadScenario } from '../../src/scenario/loadScenario.js';
import { scenarioForm } from '../../src/studies/columnForm.js';
import { applySweepValues, checkSweepPaths, parseSweepBase, scenarioWithValues } from '../../src/studies/applySweepValues.js';
import { columnCaseRunner } from '../../src/studies/columnCaseRunner.js';
import { mergeSweep } from '../../src/studies/mergeSweep.js';
import { runSweep } from '../../src/studies/runSweep.js';
import { buildCaseTable } from '../../src/studies/sweepDesign.js';
import { sweepCsv } from '../../src/studies/sweepOutput.js';
import type { CaseResult } from '../../src/studies/sweepTypes.js';

// common practice: a parametric study changes one input and leaves the rest of the file alone.
// The scenario is invented for the test.
const TEXT = `stanchion: 1
title: sweep test column
column:
  length: 5 m
  frame: braced
  section: {area: 6000 mm^2, inertia: 15e6 mm^4, section_modulus: 150e3 mm^3}
  material:
    E: {dist: lognormal, mean: 200 GPa, cov: 0.03}
    fy: {dist: lognormal, mean: 300 MPa, cov: 0.07}
  ends:
    bottom: {rotation: {dist: lognormal, mean: 1 MN m/rad, cov: 0.5}}
    top: pinned
  imperfection:
    bow: {dist: normal, mean: L/1500, sd: L/3000}
loads:
  dead: {dist: normal, mean: 380 kN, cov: 0.10}
  imposed: {dist: gumbel, mean: 150 kN, cov: 0.25}
model_factor: {dist: lognormal, mean: 1.0, cov: 0.05}
strength: first-yield
target_beta: 3.8
`;
const FILE = 'sweep-test.yaml';
const base = parseSweepBase(TEXT, FILE);
const tmp = mkdtempSync(join(tmpdir(), 'stanchion-column-runner-'));
afterAll(() => rmSync(tmp, { recursive: true, force: true }));

function asNumber(r: CaseResult, key: string): number {
  const v = r[key];
  if (typeof v !== 'number') throw new Error(`${key} is ${String(v)}`);
  return v;
}

describe('applySweepValues', () => {
  it('sets a plain value, and expressions of L follow it', () => {
    const s = scenarioWithValues(base, { 'column.length': '6.3 m' });
    expect(s.column.length).toBe(6.3);
    const bow = s.column.bow;
    expect(bow.kind).toBe('random');
    if (bow.kind === 'random') {
      expect(bow.spec.mean).toBeCloseTo(6.3 / 1500, 15);
      expect(bow.spec.sd).toBeCloseTo(6.3 / 3000, 15);
    }
  });

  it('sets a distribution parameter, converting its unit and keeping the rest of the variable', () => {
    const s = scenarioWithValues(base, { 'column.ends.bottom.rotation.mean': '2500 kN m/rad' });
    const end = s.column.ends.bottom;
    expect(end.type).toBe('rotation');
    if (end.type === 'rotation' && end.k.kind === 'random') {
      expect(end.k.spec.mean).toBeCloseTo(2.5e6, 6);
      expect(end.k.spec.cov).toBe(0.5);
      expect(end.k.spec.dist).toBe('lognormal');
    } else {
      throw new Error('the base-plate spring should stay random');
    }
  });

  it('a standard deviation replaces the coefficient of variation given in the file', () => {
    const s = scenarioWithValues(base, { 'loads.dead.sd': '20 kN' });
    const dead = s.loads.find((l) => l.path === 'loads.dead');
    expect(dead?.value.kind).toBe('random');
    if (dead?.value.kind === 'random') {
      expect(dead.value.spec.sd).toBeCloseTo(20e3, 9);
      expect(dead.value.spec.cov).toBeUndefined();
    }
  });

  it('keeps the comments and the line of every other field', () => {
    const commented = TEXT.replace('  length: 5 m', '  length: 5 m   # measured on site');
    const text = applySweepValues(parseSweepBase(commented, FILE), { 'loads.dead.mean': '400 kN' });
    expect(text).toContain('# measured on site');
    const lineOf = (t: string, needle: string) => t.split('\n').findIndex((l) => l.includes(needle));
    expect(lineOf(text, 'imposed:')).toBe(lineOf(commented, 'imposed:'));
  });

  it('edits a JSON scenario as JSON', () => {
    const json = JSON.stringify(YAML.parse(TEXT));
    const fromJson = scenarioWithValues(parseSweepBase(json, 'sweep-test.json'), { 'column.length': '4.4 m' });
    const fromYaml = scenarioWithValues(base, { 'column.length': '4.4 m' });
    expect(fromJson.format).toBe('json');
    expect(fromJson.column).toEqual(fromYaml.column);
  });

  it('an unknown path is an InputError naming the field it came from', () => {
    const caught = (paths: string[]): InputError => {
      try {
        checkSweepPaths(base, paths, () => '--vary');
      } catch (err) {
        if (err instanceof InputError) return err;
        throw err;
      }
      throw new Error('no error');
    };
    const typo = caught(['column.lenght']);
    expect(typo.field).toBe('--vary');
    expect(typo.message).toMatch(/column\.lenght.*not in the scenario.*length/);
    expect(caught(['column.ends.bottom.rotation.maen']).message).toMatch(/did you mean 'mean'/);
    expect(caught(['column.ends.top.rotation.mean']).message).toMatch(/column\.ends\.top.*plain value/);
    expect(caught(['column.length.mean']).message).toMatch(/plain value/);
    expect(() => scenarioWithValues(base, { 'loads.snow.mean': '10 kN' })).toThrow(InputError);
  });

  it('a value without the unit its field needs gets the scenario reader\'s error', () => {
    let error: unknown = null;
    try {
      scenarioWithValues(base, { 'column.length': 5 });
    } catch (err) {
      error = err;
    }
    expect(error).toBeInstanceOf(InputError);
    expect((error as InputError).field).toBe('column.length');
    expect((error as InputError).message).toMatch(/unit/);
  });
});

describe('columnCaseRunner', () => {
  const run = columnCaseRunner({ scenarioText: TEXT, fileName: FILE });

  it('applies the case values: the check matches the scenario edited by hand', async () => {
    const r = await run({ index: 0, seed: 1, values: { 'column.length': '6 m', 'loads.dead.mean': '300 kN' } });
    const byHand = loadScenario(TEXT.replace('length: 5 m', 'length: 6 m').replace('mean: 380 kN', 'mean: 300 kN'), FILE);
    const check = deterministicCheck(buildColumnModel(byHand));
    expect(asNumber(r, 'utilization')).toBe(check.utilization);
    expect(asNumber(r, 'capacity')).toBe(check.capacity);
    expect(asNumber(r, 'demand')).toBeCloseTo(300e3 + 150e3, 6);
    expect(asNumber(r, 'beta_form')).toBe(scenarioForm(byHand).beta);
    expect(r.converged_form).toBe(true);
    expect(Object.keys(r).some((k) => k.endsWith('_mc'))).toBe(false); // default methods: form only
  });

  it('β rises with base-plate stiffness and falls with length (common practice)', async () => {
    const beta = async (k: string, L: string) =>
      asNumber(await run({ index: 0, seed: 1, values: { 'column.ends.bottom.rotation.mean': k, 'column.length': L } }), 'beta_form');
    // common practice: a stiffer connection or a shorter column buckles at a higher load
    expect(await beta('5 MN m/rad', '5 m')).toBeGreaterThan(await beta('0.5 MN m/rad', '5 m'));
    expect(await beta('1 MN m/rad', '4 m')).toBeGreaterThan(await beta('1 MN m/rad', '6 m'));
  });

  it('every method gives finite numbers; IS and MC agree within 4 standard errors; a seed repeats', async () => {
    const all = columnCaseRunner({ scenarioText: TEXT, fileName: FILE, methods: ['form', 'sorm', 'is', 'mc', 'subset'], samples: 40_000 });
    // a long column on a soft base: pf of a few per cent, so 40 000 samples see many failures
    const c = { index: 3, seed: 77, values: { 'column.length': '7 m', 'column.ends.bottom.rotation.mean': '0.3 MN m/rad' } };
    const r = await all(c);
    for (const key of ['beta_form', 'pf_form', 'beta_sorm', 'pf_sorm', 'pf_is', 'cov_is', 'pf_mc', 'cov_mc', 'pf_subset', 'cov_subset']) {
      expect(Number.isFinite(asNumber(r, key)), key).toBe(true);
    }
    const pfMc = asNumber(r, 'pf_mc');
    const pfIs = asNumber(r, 'pf_is');
    expect(pfMc).toBeGreaterThan(0.005);
    expect(asNumber(r, 'samples_mc')).toBe(40_000);
    const seMc = Math.sqrt((pfMc * (1 - pfMc)) / 40_000);
    const seIs = asNumber(r, 'cov_is') * pfIs;
    expect(Math.abs(pfMc - pfIs)).toBeLessThan(4 * Math.hypot(seMc, seIs));
    expect(await all(c)).toEqual(r);
  });

  it('a failing case throws (the sweep engine records it)', async () => {
    // the message names the field, since the journal keeps only the message
    await expect(run({ index: 0, seed: 1, values: { 'column.material.E.cov': -0.2 } })).rejects.toThrow(/^column\.material\.E\.cov.*cov/);
  });

  it('runs a tiny grid through the sweep engine: one row per case, finite β', async () => {
    const table = buildCaseTable({
      design: 'grid',
      seed: 5,
      vary: [
        { path: 'column.ends.bottom.rotation.mean', scale: 'log', from: 0.2, to: 20, unit: 'MN m/rad', steps: 3 },
        { path: 'column.length', values: ['4 m', '6 m'] },
      ],
    });
    const done = await runSweep({ table, runCase: run, stateDir: join(tmp, 'state') });
    expect(done.ran).toBe(6);
    expect(done.errors).toBe(0);
    const csv = sweepCsv(mergeSweep(done.journal)).trim().split('\n');
    expect(csv).toHaveLength(7);
    const header = csv[0].split(',');
    const betaColumn = header.indexOf('beta_form');
    expect(betaColumn).toBeGreaterThan(2);
    for (const line of csv.slice(1)) expect(Number.isFinite(Number(line.split(',')[betaColumn]))).toBe(true);
    expect(readFileSync(done.journal, 'utf8')).toContain('0.2 MN m/rad');
  });
});
