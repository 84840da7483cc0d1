/**
 * The survived load's margin h = θ·capacity − max P_i is held finite like g: far out in u-space
 * (FORM on h steps there from a flat region where fy has dropped to 0) a lognormal modulus and a
 * lognormal model factor both reach the largest double, and θ·capacity overflowed to +∞, which
 * ended `assess` (the test plans' β given the survival) with an internal error. Numbers invented: a
 * robustness check (common practice), no outside value.
 */
import { describe, expect, it } from 'vitest';
import { loadScenario } from '../../src/scenario/loadScenario.js';
import { buildColumnModel } from '../../src/limitState/columnModel.js';
import { survivalProblem } from '../../src/studies/survivalStudy.js';
import { planTests } from '../../src/studies/testPlanning.js';

const TEXT = `stanchion: 1
title: invented timber post with a survived load and a test plan
column:
  length: 9.42 m
  frame: braced
  section: {area: 22630 mm^2, inertia: 1007000 mm^4, section_modulus: 125800 mm^3}
  material:
    E: {dist: lognormal, mean: 3940 MPa, cov: 1.2}
    fy: {dist: weibull, mean: 16.2 MPa, cov: 0.6}
  ends: {bottom: {fixity: 0.999999}, top: {alignment_g: 0}}
  imperfection: {bow: {dist: uniform, min: 0 m, max: L/500}}
loads:
  load_0: {dist: weibull, mean: 184 kN, cov: 1}
  load_1: {dist: truncnormal, mean: 184 kN, sd: 18.4 kN, max: 551.9 kN}
strength: en1993-d
evidence:
  - {type: survived_load, load: 0.465 kN}
test_plans:
  - {variable: column.material.E, tests: 3, tested: this_one, measurement_cov: 0.1}
`;

describe('the survived load margin far out in u-space', () => {
  const s = loadScenario(TEXT, 'survival.yaml');

  it('h stays finite where θ and E are the largest double, with the sign of g', () => {
    const p = survivalProblem(s);
    const x = Float64Array.from(buildColumnModel(s).mean);
    const model = buildColumnModel(s);
    x[p.names.indexOf('column.material.E')] = Number.MAX_VALUE;
    x[p.names.indexOf('model_factor')] = Number.MAX_VALUE;
    const hx = Float64Array.from({ length: p.names.length }, (_, i) => (i < x.length ? x[i]! : 465));
    expect(model.names).toContain('model_factor');
    expect(Number.isFinite(p.h(hx))).toBe(true);
    expect(p.h(hx)).toBeGreaterThan(0);
    expect(Number.isFinite(p.g(hx))).toBe(true);
  });

  it('the test plans given the survival end in a result, with no NaN among the β percentiles', () => {
    const study = planTests(s, { seed: 20261201, outcomes: 40 });
    expect(study.plans).toHaveLength(1);
    const row = study.plans[0]!;
    // here some outcomes leave failure certain (β = −∞): a percentile between two of them is −∞, not NaN
    for (const b of [row.beta05, row.beta50, row.beta95]) expect(b).not.toBeNaN();
    expect(row.beta05).toBeLessThanOrEqual(row.beta50);
    expect(row.beta50).toBeLessThanOrEqual(row.beta95);
  });
});
