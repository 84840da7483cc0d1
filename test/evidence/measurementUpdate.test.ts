import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { readingLogSd } from '../../src/evidence/readingLikelihood.js';
import { InputError } from '../../src/scenario/inputError.js';
import { loadScenario } from '../../src/scenario/loadScenario.js';
import { updateScenarioWithEvidence } from '../../src/studies/measurementUpdate.js';
import { runCli } from '../cli/runCli.js';

const BASE = readFileSync(new URL('../../scenarios/braced-base-plate.yaml', import.meta.url), 'utf8');
const BOTTOM = '    bottom: {rotation: {dist: lognormal, mean: 1.2 MN m/rad, cov: 0.5}}   # four-bolt base plate';

function scenarioWith(evidence: string, bottom = BOTTOM): string {
  expect(BASE).toContain(BOTTOM);
  return BASE.replace(BOTTOM, bottom).replace('analysis:', `evidence:\n${evidence}\nanalysis:`);
}

function inputError(text: string): InputError {
  try {
    const s = loadScenario(text, 'measured.yaml');
    updateScenarioWithEvidence(s, 1, { warmup: 100, draws: 100 });
  } catch (e) {
    if (e instanceof InputError) return e;
    throw e;
  }
  throw new Error('no InputError');
}

const ROTATION_TEST = `  - {type: rotation_test, end: bottom, moment: 20 kN m, rotation: 12 mrad, measurement_cov: 0.1}`;

describe('a static rotation test updates the spring it measures', () => {
  // source: Gelman et al., Bayesian Data Analysis, 3rd ed., 2013, §2.5 (normal–normal conjugacy) on ln k:
  // prior ln k ~ N(λ0, ζ0²) (lognormal mean 1.2 MN m/rad, CoV 0.5; Melchers 1999 App. A), reading
  // ln θ = ln(M/k) + e, e ~ N(0, ζm²), ζm² = ln(1 + 0.1²)  ⇒  ln k | θ ~ N(λ1, ζ1²) exactly
  it('posterior of the base-plate stiffness against the closed form, within 4 Monte Carlo standard errors', () => {
    const s = loadScenario(scenarioWith(ROTATION_TEST), 'measured.yaml');
    const { scenario, summary } = updateScenarioWithEvidence(s, 20261202);
    expect(summary).not.toBeNull();
    const zeta0 = Math.sqrt(Math.log(1 + 0.25));
    const lambda0 = Math.log(1.2e6) - zeta0 * zeta0 / 2;
    const zm = readingLogSd(0.1);
    const lnObserved = Math.log(20e3 / 12e-3); // the k that the reading alone implies
    const zeta1 = 1 / Math.sqrt(1 / zeta0 ** 2 + 1 / zm ** 2);
    const lambda1 = zeta1 ** 2 * (lambda0 / zeta0 ** 2 + lnObserved / zm ** 2);
    const v = summary!.variables.find((r) => r.path === 'column.ends.bottom.rotation')!;
    // only the tested spring is informed; E and fy are correlated but do not enter θ = M/k
    expect(summary!.variables.map((r) => r.path)).toEqual(['column.ends.bottom.rotation']);
    expect(v.rhat).toBeLessThan(1.05);
    const se = zeta1 / Math.sqrt(v.ess);
    const fitted = v.fitted as { dist: string; mean: number; sd: number };
    expect(fitted.dist).toBe('lognormal');
    const fittedZeta = Math.sqrt(Math.log(1 + (fitted.sd / fitted.mean) ** 2));
    const fittedLambda = Math.log(fitted.mean) - fittedZeta ** 2 / 2;
    expect(Math.abs(fittedLambda - lambda1)).toBeLessThan(4 * se);
    expect(Math.abs(fittedZeta - zeta1)).toBeLessThan(4 * zeta1 / Math.sqrt(2 * v.ess));
    // the updated scenario carries the fitted spring and no measurements; the rest is untouched
    const k = scenario.column.ends.bottom;
    expect(k.type === 'rotation' && k.k.kind === 'random' ? k.k.spec : null).toEqual(v.fitted);
    expect(scenario.measurements).toBeUndefined();
    expect(scenario.column.material.fy).toEqual(s.column.material.fy);
    expect(scenario.correlation).toEqual(s.correlation);
  });

  it('is reproducible by seed', () => {
    // common practice: the same seed gives the same posterior
    const s = loadScenario(scenarioWith(ROTATION_TEST), 'measured.yaml');
    const a = updateScenarioWithEvidence(s, 5, { warmup: 300, draws: 300 }).summary!;
    const b = updateScenarioWithEvidence(s, 5, { warmup: 300, draws: 300 }).summary!;
    const c = updateScenarioWithEvidence(s, 6, { warmup: 300, draws: 300 }).summary!;
    expect(a.variables).toEqual(b.variables);
    expect(a.variables[0].posterior.mean).not.toBe(c.variables[0].posterior.mean);
  });
});

describe('a natural frequency updates the springs and the stiffness together', () => {
  it('informs E and both springs, carries their posterior correlation, and moves the model toward the reading', () => {
    // common practice: a frequency depends on EI and on both end springs, so the three are updated together and a
    // stiffer spring trades off against a lower E (negative posterior correlation)
    const text = scenarioWith(`  - {type: frequency, value: 14.2 Hz, axial_load: 250 kN, mass_per_length: 52 kg/m, measurement_cov: 0.01}`);
    const s = loadScenario(text, 'measured.yaml');
    const { summary } = updateScenarioWithEvidence(s, 3);
    const paths = summary!.variables.map((v) => v.path);
    expect(paths).toContain('column.material.E');
    expect(paths).toContain('column.ends.bottom.rotation');
    expect(paths).toContain('column.ends.top.rotation');
    expect(paths).not.toContain('column.imperfection.bow');
    const m = summary!.measurements[0];
    expect(Math.abs(m.predictedPosterior - 14.2)).toBeLessThan(Math.abs(m.predictedPrior - 14.2));
    const rho = summary!.correlations.find((c) => c.a === 'column.material.E' && c.b === 'column.ends.bottom.rotation');
    expect(rho?.rho).toBeLessThan(0);
  });
});

describe('bad measurements get one message naming the field', () => {
  // common practice: input errors name the field and say what was expected
  it.each([
    [`  - {type: rotation_test, end: bottom, moment: 20 kN m, rotation: 12 mrad, measurement_cov: 0.1}`, 'column:\n  length', /evidence\[0\]\.end.*pinned/, 'bottom: pinned'],
    [`  - {type: rotation_test, end: bottom, moment: 20 kN, rotation: 12 mrad, measurement_cov: 0.1}`, '', /evidence\[0\]\.moment/, ''],
    [`  - {type: rotation_test, end: bottom, moment: 20 kN m, rotation: 12 mrad, measurement_cov: 0}`, '', /evidence\[0\]\.measurement_cov.*greater than 0/, ''],
    [`  - {type: frequency, value: 4 Hz, axial_load: 250 kN, measurement_cov: 0.02}`, '', /evidence\[0\]\.mass_per_length.*missing/, ''],
    [`  - {type: frequencies, value: 4 Hz}`, '', /evidence\[0\].*unknown evidence type 'frequencies'.*frequency/, ''],
    [`  - {type: frequency, value: -4 Hz, axial_load: 250 kN, mass_per_length: 52 kg/m, measurement_cov: 0.02}`, '', /evidence\[0\]\.value.*greater than zero/, ''],
  ])('%s', (item, _unused, message, bottom) => {
    const text = scenarioWith(item, bottom ? `    ${bottom}` : BOTTOM);
    expect(inputError(text).describe()).toMatch(message);
  });

  it('a test of a spring that is not random informs nothing', () => {
    const text = scenarioWith(ROTATION_TEST, '    bottom: {rotation: 1.2 MN m/rad}');
    expect(inputError(text).describe()).toMatch(/evidence\[0\].*informs no random variable/);
  });

  it('readings no prior draw can explain are refused', () => {
    // a frequency far above anything the column can reach (upper bound: fixed ends, no load)
    const text = scenarioWith(`  - {type: frequency, value: 400 Hz, axial_load: 0 kN, mass_per_length: 52 kg/m, measurement_cov: 0.001}`);
    expect(inputError(text).describe()).toMatch(/evidence\[0\]\.value.*400\.0 Hz.*conflict/);
  });

  it('assess --json carries evidence_update with β before and after and the diagnostics', async () => {
    // common practice: the demo scenario's chains converge (Gelman et al. 2013 §11.4: R̂ < 1.1)
    const r = await runCli(['assess', 'scenarios/measured-shed-column.yaml', '--methods', 'form', '--no-studies', '--json']);
    expect(r.status).toBe(0);
    const json = JSON.parse(r.stdout) as { evidence_update: { beta_prior: number; beta_posterior: number; diagnostics: { converged: boolean; max_rhat: number }; variables: { variable: string }[] } };
    expect(json.evidence_update.diagnostics.converged).toBe(true);
    expect(json.evidence_update.diagnostics.max_rhat).toBeLessThan(1.1);
    expect(Number.isFinite(json.evidence_update.beta_prior)).toBe(true);
    expect(json.evidence_update.beta_posterior).not.toBe(json.evidence_update.beta_prior);
    expect(json.evidence_update.variables.map((v) => v.variable)).toContain('column.ends.top.rotation');
  });
});

describe('a rotation test of an end given as a fixity factor', () => {
  it('updates the fixity factor as a beta on [0, 1] and moves it toward the reading', () => {
    // common practice: k = R·EI/L with R = 3X/(1 − X) (docs/scenario-format.md); the reading implies X_read, and the
    // posterior mean must lie between the prior mean and X_read, inside [0, 1]
    const text = scenarioWith(ROTATION_TEST, '    bottom: {fixity: {dist: beta, min: 0, max: 1, mean: 0.3, sd: 0.15}}');
    const s = loadScenario(text, 'measured.yaml');
    const { scenario, summary } = updateScenarioWithEvidence(s, 9);
    const v = summary!.variables.find((r) => r.path === 'column.ends.bottom.fixity')!;
    expect(v.fitted.dist).toBe('beta');
    const EI = 200e9 * 15.4e-6;
    const R = (20e3 / 12e-3) * 5.6 / EI;
    const xRead = R / (R + 3);
    expect(v.posterior.mean).toBeGreaterThan(Math.min(0.3, xRead));
    expect(v.posterior.mean).toBeLessThan(Math.max(0.3, xRead));
    expect(v.posterior.q05).toBeGreaterThanOrEqual(0);
    expect(v.posterior.q95).toBeLessThan(1);
    expect(scenario.sources?.['column.ends.bottom.fixity']).toMatch(/updated by the measurements evidence\[0\]/);
  });
});
