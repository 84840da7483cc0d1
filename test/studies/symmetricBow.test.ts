import { describe, expect, it } from 'vitest';
import { buildColumnModel } from '../../src/limitState/columnModel.js';
import { problemFromModel } from '../../src/limitState/columnRecipe.js';
import { normalQuantileUpper } from '../../src/probability/normal.js';
import { form } from '../../src/reliability/form.js';
import { monteCarlo } from '../../src/reliability/monteCarlo.js';
import { verdict } from '../../src/reliability/verdict.js';
import { loadScenario } from '../../src/scenario/loadScenario.js';
import { checkedGoverning } from '../../src/studies/columnAssessment.js';
import { columnRestraint } from '../../src/studies/columnRestraint.js';

// Demo column (invented; not a real project): a bow of unknown sign, mean 0, sd L/1000.
const SYMMETRIC_BOW = `stanchion: 1
title: Invented column with a bow of unknown sign
column:
  length: 5.6 m
  frame: braced
  section: {area: 6640 mm^2, inertia: 15.4e6 mm^4, section_modulus: 152e3 mm^3}
  material:
    E: {dist: lognormal, mean: 200 GPa, cov: 0.03}
    fy: {dist: lognormal, mean: 300 MPa, cov: 0.07}
  ends:
    bottom: {rotation: {dist: lognormal, mean: 1.2 MN m/rad, cov: 0.5}}
    top: {rotation: {dist: lognormal, mean: 0.25 MN m/rad, cov: 0.5}}
  imperfection:
    bow: {dist: normal, mean: 0 mm, sd: L/1000}
loads:
  dead: {dist: normal, mean: 430 kN, cov: 0.10}
  imposed: {dist: gumbel, mean: 190 kN, cov: 0.25}
model_factor: {dist: lognormal, mean: 1.0, cov: 0.05}
strength: first-yield
target_beta: 3.8
analysis: {seed: 7}
`;

const MC_SAMPLES = 400_000;

describe('a column whose bow has unknown sign (first yield uses |e0|)', () => {
  const scenario = loadScenario(SYMMETRIC_BOW, 'symmetric-bow.yaml');
  const problem = problemFromModel(buildColumnModel(scenario));

  it('FORM finds the two design points (bow of either sign); its system β lies in the Monte Carlo band', async () => {
    const mc = await monteCarlo(problem, { samples: MC_SAMPLES, seed: 11 });
    // common practice: binomial standard error √(p(1 − p)/N); band = MC pf ± 4 s.e. in β, widened by 0.1 for FORM's linearisation
    const se = Math.sqrt((mc.pf * (1 - mc.pf)) / MC_SAMPLES);
    const band = [normalQuantileUpper(mc.pf + 4 * se) - 0.1, normalQuantileUpper(mc.pf - 4 * se) + 0.1];
    expect(mc.failures).toBeGreaterThan(50);
    const f = form(problem);
    expect(f.doubtfulDirections).toContain('column.imperfection.bow');
    expect(f.system.designPoints.length).toBeGreaterThanOrEqual(2);
    const bows = f.system.designPoints.map((p) => p.designPointX[f.names.indexOf('column.imperfection.bow')]);
    expect(Math.min(...bows)).toBeLessThan(0);
    expect(Math.max(...bows)).toBeGreaterThan(0);
    expect(f.system.beta).toBeGreaterThanOrEqual(band[0]);
    expect(f.system.beta).toBeLessThanOrEqual(band[1]);
    // the search that stays at bow = 0 is far outside the band: the failure this guards against
    const stuck = form(problem, { restarts: 0, probeDoubtful: false, differences: 'central' });
    expect(stuck.beta).toBeGreaterThan(band[1] + 1);
  });

  it('a FORM that disagrees with its check never governs the verdict', () => {
    const stuck = form(problem, { restarts: 0, probeDoubtful: false, differences: 'central' });
    const v = verdict({ form: stuck });
    expect(v.trust).toBe('form');
    const g = checkedGoverning(problem, stuck, v, { method: 'form', beta: stuck.system.beta, pf: stuck.system.pf }, 7);
    // common practice: the verdict must rest on the sampling estimate once FORM is refuted
    expect(g.check?.agrees).toBe(false);
    expect(g.governing.method).toBe('is');
    expect(g.governing.beta).toBeLessThan(3.8);
    expect(g.verdict.reason).toMatch(/disagrees with its self-check/);
    expect(g.warning).toMatch(/the verdict rests on the check, not on FORM/);
  });

  it('the restraint study no longer finds pinned ends sufficient, and checks FORM where it decides', async () => {
    const r = await columnRestraint(scenario, { maps: false });
    // common practice: with the bow counted, the assessed column (β ≈ 3.3 < 3.8) needs stiffer connections
    expect(r.study.outcome).toBe('reached');
    expect(r.study.requiredFactor).toBeGreaterThan(1);
    expect(r.verification.checks.map((c) => c.role)).toEqual(['required', 'assessed']);
    expect(r.verification.method).toBe('form');
    expect(r.verification.checks.every((c) => c.agrees)).toBe(true);
    expect(r.sentence).toMatch(/confirmed by a sampling check/);
  });
});
