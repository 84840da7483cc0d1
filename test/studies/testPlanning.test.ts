// Ranking of candidate test plans (pre-posterior analysis) on a small invented scenario.
import { describe, expect, it } from 'vitest';
import { loadScenario } from '../../src/scenario/loadScenario.js';
import { planTests, defaultTestPlans } from '../../src/studies/testPlanning.js';

// invented scenario: a base spring known only roughly (CoV 0.6) and a well-known E (CoV 0.02)
const text = `stanchion: 1
title: planning check (invented)
column:
  length: 5 m
  frame: braced
  section: {area: 6000 mm^2, inertia: 15e6 mm^4, section_modulus: 150e3 mm^3}
  material:
    E: {dist: lognormal, mean: 200 GPa, cov: 0.02}
    fy: 300 MPa
  ends:
    bottom: {rotation: {dist: lognormal, mean: 1.0 MN m/rad, cov: 0.6}}
    top: pinned
  imperfection: {bow: L/1000}
loads:
  dead: {dist: lognormal, mean: 560 kN, cov: 0.08}
strength: first-yield
target_beta: 3.0
test_plans:
  - {variable: column.material.E, tests: 5, measurement_cov: 0.02}
  - {variable: column.ends.bottom.rotation, tests: 5, measurement_cov: 0.05}
`;

describe('plan-tests ranking', () => {
  const s = loadScenario(text, 'plans.yaml');
  it('testing the dominant, poorly known variable ranks above testing a well-known one', () => {
    // common practice: a test can only move β as far as the tested variable's share of the uncertainty
    const r = planTests(s, { seed: 5, outcomes: 20 });
    expect(r.plans[0].variable).toBe('column.ends.bottom.rotation');
    const spread = (v: string) => { const p = r.plans.find((x) => x.variable === v)!; return p.beta95 - p.beta05; };
    expect(spread('column.ends.bottom.rotation')).toBeGreaterThan(5 * spread('column.material.E'));
    expect(Math.abs(r.plans.find((x) => x.variable === 'column.material.E')!.expectedGain)).toBeLessThan(0.05);
  });
  it('same seed, same ranking and numbers; another seed, other numbers', () => {
    // common practice: seeded simulation
    const a = planTests(s, { seed: 5, outcomes: 10 });
    const b = planTests(s, { seed: 5, outcomes: 10 });
    const c = planTests(s, { seed: 6, outcomes: 10 });
    expect(b.plans).toEqual(a.plans);
    expect(c.plans[0].betaMean).not.toBe(a.plans[0].betaMean);
  });
  it('default plans: 1, 3 and 5 tests on the testable variables, the most important first', () => {
    // common practice: defaults follow FORM's importance factors
    const plans = defaultTestPlans(s);
    expect(plans.map((p) => p.tests)).toEqual([1, 3, 5, 1, 3, 5]);
    expect(plans[0].variable).toBe('column.ends.bottom.rotation');
  });
});
