import type { TestPlanStudy } from './testPlanning.js';

/** `test_plans` of plan-tests --json and of assess --json (SI; β as numbers, null when infinite). */
export function testPlansBlock(p: TestPlanStudy): Record<string, unknown> {
  const num = (v: number) => (Number.isFinite(v) ? v : null);
  return {
      beta_now: num(p.betaNow),
      target_beta: p.target,
      outcomes: p.outcomes,
      defaults: p.defaults,
      survived_loads_included: p.survivalIncluded,
      plans: p.plans.map((r, i) => ({
        rank: i + 1, label: r.label, variable: r.variable, tests: r.tests, tested: r.tested,
        ...(r.measurementCov !== undefined ? { measurement_cov: r.measurementCov } : {}),
        beta_after: { mean: num(r.betaMean), q05: num(r.beta05), q50: num(r.beta50), q95: num(r.beta95) },
        probability_meeting_target: r.pMeet,
        expected_gain: num(r.expectedGain),
      })),
    seed: p.seed,
    unconverged_form: p.unconverged,
  };
}


export function planTestsJson(p: TestPlanStudy, meta: Record<string, unknown>): Record<string, unknown> {
  return { test_plans: testPlansBlock(p), meta: { ...meta, seed: p.seed, calls: p.calls } };
}
