// The steps of the evidence on the example scenario: as written → with the test results → with the
// measurements through the model → given the survived loads, computed once and shown the same way
// in the JSON, the report and the verdict (docs/evidence.md §8).
// Each step's β is checked against FORM run afresh on the scenario that step stands for: the same
// method on the same distributions must give the same number (common practice: a sequence of
// updates is only meaningful if its first step is the scenario without evidence).
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { buildCharts } from '../../src/report/charts/allCharts.js';
import { chartToSvg } from '../../src/report/renderChart.js';
import { buildReportDocument } from '../../src/report/reportSections.js';
import { loadScenario } from '../../src/scenario/loadScenario.js';
import type { Scenario } from '../../src/scenario/types.js';
import { assessColumn, type Assessment } from '../../src/studies/columnAssessment.js';
import { assessmentJson } from '../../src/studies/assessmentJson.js';
import { assessmentReportInput } from '../../src/studies/assessmentReport.js';
import { scenarioForm } from '../../src/studies/columnForm.js';
import { survivalStudy } from '../../src/studies/survivalStudy.js';
import { countMarks } from '../report/svgMarks.js';
import { runCli } from '../cli/runCli.js';
import { InputError } from '../../src/scenario/inputError.js';
import { defaultTestPlans, planTests } from '../../src/studies/testPlanning.js';

const TEXT = readFileSync(new URL('../../scenarios/measured-shed-column.yaml', import.meta.url), 'utf8');
const META = { version: 'test', date: '2026-01-01T00:00:00Z', command: 'test' };

/** The example without its sibling tests (the variable keeps the distribution written above them). */
function withoutTests(t: string): string {
  const out = t.replace(/\n {8}evidence: +# three sibling[\s\S]*?source: load tests[^\n]*/, '');
  expect(out).not.toBe(t);
  return out;
}

/** The example without its scenario-level evidence (measurements and survived loads) and plans. */
function withoutStructureEvidence(t: string): string {
  const out = t.replace(/^evidence: [\s\S]*?(?=^analysis:)/m, '');
  expect(out).not.toBe(t);
  return out;
}

const load = (t: string): Scenario => loadScenario(t, 'measured-shed-column.yaml');

let cached: Promise<Assessment> | undefined;
const assessed = (): Promise<Assessment> => (cached ??= assessColumn(load(TEXT), { methods: ['form'], studies: [] }));

describe('the steps of the evidence (example scenario)', () => {
  it('runs every step in order, the first on the scenario as written and each on its own scenario', async () => {
    const a = await assessed();
    const m = a.measurements!;
    expect(m.steps.map((s) => s.step)).toEqual(['as_written', 'tests', 'measurements', 'survival']);
    const [asWritten, tests, measured, survived] = m.steps;
    // as written: the same file with every evidence entry deleted
    const plain = scenarioForm(load(withoutTests(withoutStructureEvidence(TEXT))));
    expect(asWritten.beta).toBeCloseTo(plain.beta, 9);
    // with the test results: the file without its measurements and survived loads
    expect(tests.beta).toBeCloseTo(scenarioForm(load(withoutStructureEvidence(TEXT))).beta, 9);
    // with the measurements: the updated scenario the assessment used, and the assessment's own FORM
    expect(measured.beta).toBeCloseTo(scenarioForm(a.scenario).beta, 9);
    expect(measured.beta).toBeCloseTo(a.form.system.beta, 2);
    // given the survived loads: the survival study on that updated scenario
    expect(survived.beta).toBeCloseTo(survivalStudy(a.scenario, { seed: a.seed, samples: 0 }).beta, 9);
    // the named states are the steps
    expect(m.before).toEqual({ beta: asWritten.beta, pf: asWritten.pf, meets: asWritten.meets });
    expect(m.afterTests!.beta).toBe(tests.beta);
    expect(m.afterMeasurements!.beta).toBe(measured.beta);
    expect(m.after.beta).toBe(survived.beta);
    for (const s of m.steps) expect(s.meets).toBe(s.beta >= m.target);
    // the measurement update's own before and after are the same two steps
    expect(a.measurementUpdate!.betaPrior).toBe(tests.beta);
    expect(a.measurementUpdate!.betaPosterior).toBe(measured.beta);
  });

  it('rests the verdict on the β given the survived loads and keeps the one without them', async () => {
    const a = await assessed();
    const sv = a.measurements!.survival!;
    expect(sv.check).toBeDefined();
    const expected = sv.check!.agrees ? sv.beta : sv.check!.estimate.beta;
    expect(a.governing.beta).toBe(expected);
    expect(a.governing.basis).toMatch(/survived loads/);
    expect(a.governingUnconditional!.beta).toBeCloseTo(a.form.system.beta, 12);
    expect(a.verdict.reason).toMatch(/The verdict rests on the conditional β/);
  });

  it('checks the conditional FORM β of the example by importance sampling, which agrees with it', async () => {
    const a = await assessed();
    const sv = a.measurements!.survival!;
    // the example's conditional FORM β (README's worked example; unchanged by the new check)
    expect(sv.beta).toBeCloseTo(3.83, 2);
    const r = sv.importance!;
    expect(r.cov).toBeLessThanOrEqual(0.1); // the default target CoV
    expect(r.reachedTarget).toBe(true);
    expect(r.joint.hits).toBeGreaterThan(10);
    // the importance-sampling check decides, and agrees: FORM's β within 4 standard errors + 0.1 of it (formCheck.ts rule)
    expect(sv.check!.method).toBe('is');
    expect(sv.importanceCheck!.agrees).toBe(true);
    expect(Math.abs(r.beta - sv.beta)).toBeLessThan(0.2);
    // the crude Monte Carlo check is kept beside it, with its own verdict
    expect(sv.mcCheck!.method).toBe('mc');
    expect(a.governing.basis).toBe('FORM given the survived loads, checked by importance sampling');
    // importance sampling of the ratio with P(h > 0) ≈ 0.92 by crude sampling: a few thousand calls, not 800 000
    expect(r.survival.method).toBe('mc');
    expect(r.calls).toBeLessThan(20_000);
  });

  it('writes the steps to result.json under measurements, beside evidence_update', async () => {
    const a = await assessed();
    const doc = JSON.parse(JSON.stringify(assessmentJson(a, META)));
    const m = doc.measurements;
    expect(m.steps.map((s: { step: string }) => s.step)).toEqual(['as_written', 'tests', 'measurements', 'survival']);
    expect(m.before.beta).toBe(m.steps[0].beta);
    expect(m.after_tests.beta).toBe(m.steps[1].beta);
    expect(m.after_measurements.beta).toBe(m.steps[2].beta);
    expect(m.after.beta).toBe(m.steps[3].beta);
    expect(doc.evidence_update.beta_prior).toBe(m.after_tests.beta);
    expect(doc.evidence_update.beta_posterior).toBe(m.after_measurements.beta);
    expect(typeof m.survival.mc_agrees).toBe('boolean');
    expect(typeof m.survival.importance_agrees).toBe('boolean');
    expect(m.survival.check_method).toBe('is');
    expect(Object.keys(m.survival.importance)).toEqual(['pf', 'beta', 'cov', 'samples', 'calls', 'centre', 'centre_u', 'centre_converged', 'joint', 'survival', 'target_cov', 'reached_target', 'seed']);
    expect(m.survival.importance.beta).toBe(a.measurements!.survival!.importance!.beta);
    expect(doc.reliability.governing.beta).toBe(a.governing.beta);
    expect(doc.reliability.governing_unconditional.beta).toBe(a.governingUnconditional!.beta);
    expect(doc.reliability.meets_target).toBe(a.governing.beta >= doc.reliability.target_beta);
  });

  it('shows the readings, the sampler and a prior-against-posterior chart with the draws for each updated variable', async () => {
    const a = await assessed();
    const input = assessmentReportInput(a, META);
    const charts = buildCharts(input, 'si');
    const doc = buildReportDocument(input, 'si', charts);
    const section = doc.sections.find((s) => s.id === 'measurements')!;
    const tables = section.blocks.filter((b) => b.kind === 'table');
    const steps = tables[0];
    expect(steps.kind === 'table' && steps.rows.map((r) => r[0])).toEqual(a.measurements!.steps.map((s) => s.label));
    expect(steps.kind === 'table' && steps.rows.map((r) => r[1])).toEqual(a.measurements!.steps.map((s) => s.beta.toFixed(2)));
    const readings = tables.find((t) => t.kind === 'table' && t.head.includes('model after'));
    expect(readings && readings.kind === 'table' ? readings.rows.map((r) => r[0]) : []).toEqual(['evidence[0]', 'evidence[1]']);
    const diagnostics = tables.find((t) => t.kind === 'table' && t.head.includes('R̂'));
    const updated = a.measurementUpdate!.summary.variables;
    expect(diagnostics && diagnostics.kind === 'table' ? diagnostics.rows.length : 0).toBe(updated.length);
    expect(section.blocks.some((b) => (b.kind === 'paragraph' || b.kind === 'callout') && /Sampler: adaptive Metropolis.*R̂.*ESS/.test(b.text))).toBe(true);
    // one chart for the sibling tests, then one per variable the sampler updated, each in the section
    const densities = input.measurements!.densities;
    expect(densities.map((d) => d.updatedBy)).toEqual(['tests', ...updated.map(() => 'measurements')]);
    expect(densities.slice(1).map((d) => d.path)).toEqual(updated.map((v) => v.path));
    densities.forEach((_, i) => expect(section.blocks.some((b) => b.kind === 'chart' && b.name === `measurement-density-${i + 1}`)).toBe(true));
    // the draws' histogram is drawn, one bar per bin inside the plotted range
    const top = charts.find((c) => c.name === `measurement-density-${densities.length}`)!;
    expect(top.title).toMatch(/^What the measurements changed: /);
    // the curve before the update is the dashed one whatever the labels' alphabetical order
    const lines = (top.spec as { layer: { name: string; encoding: { strokeDash: { scale: { domain: string[]; range: number[][] } } } }[] }).layer.find((l) => l.name === 'densityLines')!;
    expect(lines.encoding.strokeDash.scale.domain[0]).toMatch(/before/);
    expect(lines.encoding.strokeDash.scale.range[0]).toEqual([4, 3]);
    const svg = await chartToSvg(top.spec);
    expect(countMarks(svg, 'posteriorDraws')).toBeGreaterThan(20);
    // a histogram of the draws integrates to (almost) one before the common scaling
    const h = updated[updated.length - 1].histogram;
    const mass = h.density.reduce((s, d) => s + d * h.width, 0);
    expect(mass).toBeGreaterThan(0.99);
    expect(mass).toBeLessThanOrEqual(1 + 1e-12);
  });
});

describe('test plans on the example, after its measurements through the model', () => {
  it('plan-tests starts from the β the assessment ends with (the updated scenario, given the survived loads)', async () => {
    const a = await assessed();
    const r = await runCli(['plan-tests', 'scenarios/measured-shed-column.yaml', '--json', '--outcomes', '10']);
    expect(r.status).toBe(0);
    const p = JSON.parse(r.stdout).test_plans;
    expect(p.survived_loads_included).toBe(true);
    expect(p.plans).toHaveLength(3);
    expect(p.beta_now).toBeCloseTo(a.measurements!.after.beta, 9);
  });

  it('refuses more tests of similar items on a variable the measurements also updated, naming the plan', () => {
    const s = load(TEXT);
    const bottom = 'column.ends.bottom.rotation';
    let err: unknown;
    try {
      planTests(s, { seed: 1, outcomes: 10, plans: [{ variable: bottom, tests: 3, tested: 'similar' }], updatedByMeasurements: [bottom] });
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(InputError);
    expect((err as InputError).field).toBe('test_plans[0]');
    expect(defaultTestPlans(s, [bottom]).some((p) => p.variable === bottom)).toBe(false);
    expect(defaultTestPlans(s).some((p) => p.variable === bottom)).toBe(true);
  });
});
