/**
 * The restraint study given survived loads (docs/evidence.md §8): every β of the study is the
 * conditional one, with the studied stiffness edited in both margins, as in the verdict of `assess`.
 */
import { readFileSync } from 'node:fs';
import { beforeAll, describe, expect, it } from 'vitest';
import { loadScenario } from '../../src/scenario/loadScenario.js';
import type { Scenario } from '../../src/scenario/types.js';
import { columnRestraint, restraintJson, type ColumnRestraintResult } from '../../src/studies/columnRestraint.js';
import { assessColumn, DEFAULT_SEED, governingAssessor } from '../../src/studies/columnAssessment.js';
import { updateScenarioWithEvidence } from '../../src/studies/measurementUpdate.js';
import { survivalForm } from '../../src/studies/survivalForm.js';
import { InputError } from '../../src/scenario/inputError.js';
import { withEndStiffness } from '../../src/limitState/scenarioEdits.js';

const read = (file: string): string => readFileSync(file, 'utf8');
const seedOf = (s: Scenario): number => s.analysis.seed ?? DEFAULT_SEED;

/** As `stanchion restraint` runs it: the measurements update the variables first. */
function prepared(text: string, name = 'scenario.yaml'): Scenario {
  const loaded = loadScenario(text, name);
  return updateScenarioWithEvidence(loaded, seedOf(loaded)).scenario;
}

/** The braced demo with one survived load (invented scenario value, a fixed load). */
function bracedWithSurvivedLoad(load: string): string {
  return `${read('scenarios/braced-base-plate.yaml')}\nevidence:\n  - type: survived_load\n    load: ${load}\n`;
}

describe('the shed column after measurements, with a survived load', () => {
  let s: Scenario;
  let r: ColumnRestraintResult;
  let json: Record<string, any>;
  beforeAll(async () => {
    s = prepared(read('scenarios/measured-shed-column.yaml'), 'measured-shed-column.yaml');
    r = await columnRestraint(s, { maps: false, governing: governingAssessor(seedOf(s)) });
    json = restraintJson(r);
  });

  it('its β at the assessed stiffness is the conditional FORM β the verdict of assess reports', async () => {
    // assess as loaded: it runs the measurement update itself
    const a = await assessColumn(loadScenario(read('scenarios/measured-shed-column.yaml'), 'measured-shed-column.yaml'), { methods: ['form'], studies: [], seed: seedOf(s) });
    expect(a.governing.basis).toMatch(/given the survived loads/);
    const assessed = json.checks.find((c: { role: string }) => c.role === 'assessed');
    // the same scenario, the same edit (factor 1), the same conditional FORM: equal to rounding
    expect(assessed.form_beta).toBeCloseTo(a.governing.beta, 9);
    // the importance-sampling check is the verdict's own (same seed, same streams)
    expect(assessed.check_beta).toBeCloseTo(a.measurements!.survival!.importance!.beta, 9);
    expect(assessed.check_method).toBe('importance sampling given the survived loads');
  });

  it('tests, then measurements, then the survival: the study conditions the updated scenario', () => {
    const loaded = loadScenario(read('scenarios/measured-shed-column.yaml'), 'measured-shed-column.yaml');
    // the update consumes the measurements and keeps the survived load for the study
    expect(loaded.measurements?.length).toBe(2);
    expect(s.measurements).toBeUndefined();
    expect(s.survivedLoads?.length).toBe(1);
    const assessed = json.checks.find((c: { role: string }) => c.role === 'assessed');
    expect(assessed.form_beta).toBeCloseTo(survivalForm(s).beta, 12);
    // conditioning the scenario without its measurements gives another β: the order matters and is kept
    const { measurements: _m, ...unmeasured } = loaded;
    expect(Math.abs(survivalForm(unmeasured as Scenario).beta - assessed.form_beta)).toBeGreaterThan(0.01);
  });

  it('says so in the JSON and the sentence; the requirement meets the target given the survival', () => {
    expect(json.conditioned_on_survived_loads).toBe(true);
    expect(json.survived_loads).toEqual(['evidence[2].load']);
    expect(json.form_beta_assessed_without_survived_loads).toBeLessThan(json.checks[1].form_beta);
    expect(json.survival_probability_at_required).toBeGreaterThan(0);
    expect(json.survival_probability_at_required).toBeLessThanOrEqual(1);
    expect(json.sentence).toMatch(/^The target β = 3\.80 given the survived loads needs/);
    expect(json.sentence).toMatch(/FORM's β given the survived loads was confirmed/);
    expect(json.verified.confirmed).toBe(true);
    // the confirmation is the verdict's rule given the survival, at the reported stiffness
    expect(json.verified.beta).toBeGreaterThanOrEqual(3.8 - 1e-6);
    let atRequired = s;
    for (const e of r.study.ends) atRequired = withEndStiffness(atRequired, e as 'bottom' | 'top', r.base[e], r.study.requiredFactor as number);
    expect(survivalForm(atRequired).beta).toBeGreaterThanOrEqual(3.8 - 1e-6);
  });

  it('refuses SORM (no conditional SORM) naming --method', async () => {
    const e = await columnRestraint(s, { method: 'sorm', maps: false }).catch((x: unknown) => x);
    expect(e).toBeInstanceOf(InputError);
    expect((e as InputError).field).toBe('--method');
  });
});

describe('the braced demo with an invented survived load', () => {
  it('a survived load far above the design loads lowers the stiffness needed; a small one changes almost nothing', async () => {
    const plain = prepared(read('scenarios/braced-base-plate.yaml'));
    const heavy = prepared(bracedWithSurvivedLoad('900 kN'));
    const light = prepared(bracedWithSurvivedLoad('50 kN'));
    const without = await columnRestraint(plain, { maps: false });
    const givenHeavy = await columnRestraint(heavy, { maps: false });
    const givenLight = await columnRestraint(light, { maps: false });
    expect(without.study.outcome).toBe('reached');
    expect(givenHeavy.survival).toBeDefined();
    expect(givenHeavy.study.outcome).toBe('reached');
    // the conditional FORM at the requirement is confirmed by its own importance sampling
    expect(givenHeavy.verification.checks.every((c) => c.agrees && c.checkMethod === 'importance sampling given the survived loads')).toBe(true);
    // common practice (proof loading): surviving a load well above the mean design load (620 kN) truncates the weak columns away
    expect(givenHeavy.study.required.bottom as number).toBeLessThan(0.8 * (without.study.required.bottom as number));
    const assessed = (r: ColumnRestraintResult): number => r.verification.checks.find((c) => c.role === 'assessed')!.formBeta;
    expect(assessed(givenHeavy)).toBeGreaterThan(assessed(without));
    // common practice: a load the column was all but certain to carry tells nothing, the requirement is the unconditional one
    expect((givenLight.study.required.bottom as number) / (without.study.required.bottom as number)).toBeCloseTo(1, 2);
  });
});

/** The sway demo without its lateral spring (a pinned base is then a mechanism) and with a survived load. */
function swayWithoutLateral(): Scenario {
  const text = read('scenarios/sway-canopy-post.yaml').replace(/^ {4}lateral: .*$/m, '');
  return loadScenario(`${text}\nevidence:\n  - type: survived_load\n    load: 150 kN\n`, 'sway.yaml');
}

describe('a stiffness at which the column could not have carried the survived load', () => {
  it('is refuted: β given the survival is −∞ there', () => {
    const s = swayWithoutLateral();
    const end = s.column.ends.bottom;
    if (end.type !== 'rotation') throw new Error('expected a rotational spring at the base');
    // common practice: a sway column pinned at both ends with no lateral restraint is a mechanism (no axial capacity)
    const pinned = survivalForm(withEndStiffness(s, 'bottom', end.k, 0));
    expect(pinned.impossible).toBe(true);
    expect(pinned.beta).toBe(-Infinity);
    expect(survivalForm(s).impossible).toBe(false);
  });

  it('β given the survival dips and rises again: the requirement is the stiffness above which it stays at the target', async () => {
    const s = swayWithoutLateral();
    const r = await columnRestraint(s, { maps: false, governing: governingAssessor(seedOf(s)) });
    const assessed = r.verification.checks.find((c) => c.role === 'assessed')!;
    expect(r.study.outcome).toBe('reached');
    // the column as assessed falls short, so the requirement lies above the assessed stiffness
    expect(assessed.formBeta).toBeLessThan(3.8);
    expect(r.study.requiredFactor as number).toBeGreaterThan(1);
    // every point of the curve above the requirement reaches the target; some far below also do
    const f = r.study.requiredFactor as number;
    expect(r.study.curve.filter((p) => p.factor > f * 1.001).every((p) => p.beta >= 3.8)).toBe(true);
    expect(r.study.curve.some((p) => p.factor > 0 && p.factor < f && p.beta >= 3.8)).toBe(true);
    expect(r.notes.join(' ')).toMatch(/with pinned ends the column could not have carried the survived load/);
    expect(r.notes.join(' ')).toMatch(/the requirement is the stiffness above which β stays at the target/);
  });
});
