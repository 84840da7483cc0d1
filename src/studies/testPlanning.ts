/**
 * Which test on the structure buys most: pre-posterior analysis of candidate test plans
 * (Raiffa & Schlaifer 1961; Benjamin & Cornell 1970, ch. 5; updating of existing structures:
 * EN 1990:2002 Annex D, ISO 13822:2010 §6–7). For each plan, `outcomes` test results are drawn
 * from the prior predictive (seeded), each updates the variable by the same conjugate update
 * the scenario reader uses (evidence/updatedSpec.ts), and FORM gives the β the assessment would
 * then have (started at today's design point). Summaries: the spread of that β, the probability
 * that it meets the target, the expected gain E[β after] − β now. Plans are ranked by the
 * probability of meeting the target, then by the expected gain.
 */
import { buildColumnModel } from '../limitState/columnModel.js';
import { problemFromModel } from '../limitState/columnRecipe.js';
import { withScalar } from '../limitState/scenarioEdits.js';
import { describePath } from '../limitState/quantityKind.js';
import { itemOutcome, populationOutcome } from '../evidence/preposterior.js';
import { EvidenceError } from '../evidence/evidenceError.js';
import { normalStream, uniformStream } from '../probability/rng.js';
import { form } from '../reliability/form.js';
import { conditionalForm } from '../reliability/conditionalFailure.js';
import { TEST_PLAN_STREAM_BASE } from '../reliability/streams.js';
import { planRefusal } from '../scenario/readTestPlans.js';
import { InputError } from '../scenario/inputError.js';
import type { Scenario, TestPlan } from '../scenario/types.js';
import { scalarAt } from '../scenario/variables.js';
import { throwIfInterrupted } from '../runtime/interruptFlag.js';
import { survivalProblem } from './survivalStudy.js';
import type { TestPlanRow, TestPlansReport } from '../report/reportInput.js';

export const DEFAULT_OUTCOMES = 40;
/** measurement CoV of a default plan's test of this item (stated in every output) */
export const DEFAULT_MEASUREMENT_COV = 0.1;
const DEFAULT_TEST_COUNTS = [1, 3, 5];
const DEFAULT_VARIABLES = 3;

export interface TestPlanStudy extends TestPlansReport {
  calls: number;
  /** outcomes whose FORM did not converge (their β is still used) */
  unconverged: number;
}

/** β of a scenario as the assessment would state it: FORM, given the survived loads if any. */
function betaOf(s: Scenario, start: ArrayLike<number> | undefined): { beta: number; calls: number; converged: boolean; u: number[] } {
  if (s.survivedLoads && s.survivedLoads.length > 0) {
    const r = conditionalForm(survivalProblem(s), { restarts: 0 });
    return { beta: r.beta, calls: r.calls, converged: r.converged, u: r.failure.designPointU };
  }
  const model = buildColumnModel(s);
  if (model.names.length === 0) return { beta: model.g(model.mean) > 0 ? Infinity : -Infinity, calls: 1, converged: true, u: [] };
  const r = form(problemFromModel(model), { restarts: 0, ...(start && start.length === model.names.length ? { start } : {}) });
  return { beta: r.system.beta, calls: r.calls, converged: r.converged, u: r.designPointU };
}

/** 1, 3 and 5 tests on each of the three variables that matter most (FORM α²) and can be tested. */
export function defaultTestPlans(s: Scenario, updatedByMeasurements: readonly string[] = []): TestPlan[] {
  const model = buildColumnModel(s);
  if (model.names.length === 0) return [];
  const r = form(problemFromModel(model), { restarts: 0 });
  const ranked = model.names
    .map((path, i) => ({ path, importance: r.importance[i] ?? 0 }))
    .filter((v) => {
      const similar = s.evidence?.[v.path]?.tested === 'similar';
      if (similar && updatedByMeasurements.includes(v.path)) return false;
      return planRefusal(s, v.path, similar ? 'similar' : 'this_one') === null;
    })
    .sort((a, b) => b.importance - a.importance)
    .slice(0, DEFAULT_VARIABLES);
  return ranked.flatMap((v) => {
    const similar = s.evidence?.[v.path]?.tested === 'similar';
    return DEFAULT_TEST_COUNTS.map((n) => (similar ? { variable: v.path, tests: n, tested: 'similar' as const } : { variable: v.path, tests: n, tested: 'this_one' as const, measurementCov: DEFAULT_MEASUREMENT_COV }));
  });
}

function quantileSorted(xs: readonly number[], p: number): number {
  const pos = p * (xs.length - 1);
  const i = Math.floor(pos);
  const f = pos - i;
  if (i + 1 >= xs.length || f === 0 || xs[i] === xs[i + 1]) return xs[i];
  // β = ±∞ (an outcome with failure certain or impossible) has no straight line to a neighbour: the nearer one
  if (!Number.isFinite(xs[i]) || !Number.isFinite(xs[i + 1])) return f < 0.5 ? xs[i] : xs[i + 1];
  return xs[i] + f * (xs[i + 1] - xs[i]);
}

export function planLabel(p: TestPlan): string {
  return p.label ?? `${p.tests} test${p.tests === 1 ? '' : 's'} ${p.tested === 'this_one' ? 'of this item' : 'of similar items'}: ${describePath(p.variable)}`;
}

/**
 * `s` is the scenario the assessment uses: after its measurements through the model, if any
 * (their variables are then listed in `updatedByMeasurements`). A plan of more tests of similar
 * items rebuilds its variable from the test results alone, which would drop the measurements'
 * update: such a plan on such a variable is refused (plans of this item start from the posterior).
 */
export function planTests(s: Scenario, opts: { seed: number; outcomes?: number; plans?: readonly TestPlan[]; updatedByMeasurements?: readonly string[] }): TestPlanStudy {
  const outcomes = opts.outcomes ?? DEFAULT_OUTCOMES;
  const defaults = opts.plans === undefined && s.testPlans === undefined;
  const measured = opts.updatedByMeasurements ?? [];
  const plans = opts.plans ?? s.testPlans ?? defaultTestPlans(s, measured);
  plans.forEach((plan, k) => {
    if (plan.tested === 'similar' && measured.includes(plan.variable)) {
      throw new InputError(`test_plans[${k}]`, `${plan.variable} is also updated by the measurements through the model; a plan of more tests of similar items would set that update aside: plan a test of another variable`);
    }
  });
  const target = s.targetBeta;
  const now = betaOf(s, undefined);
  let calls = now.calls;
  let unconverged = 0;
  const rows: TestPlanRow[] = plans.map((plan, k) => {
    const scalar = scalarAt(s, plan.variable);
    if (!scalar || scalar.kind !== 'random') throw new Error(`planTests: ${plan.variable} is not random`);
    const normal = normalStream(opts.seed, TEST_PLAN_STREAM_BASE + k);
    const uniform = uniformStream(opts.seed, TEST_PLAN_STREAM_BASE + 2 ** 31 + k);
    const record = s.evidence?.[plan.variable];
    const betas: number[] = [];
    for (let j = 0; j < outcomes; j++) {
      throwIfInterrupted('test planning');
      let spec;
      try {
        spec = plan.tested === 'similar' && record
          ? populationOutcome(record.prior, record, plan.tests, uniform, normal)
          : itemOutcome(scalar.spec, plan.tests, plan.measurementCov ?? DEFAULT_MEASUREMENT_COV, normal);
      } catch (e) {
        if (e instanceof EvidenceError) throw new Error(`planTests: a simulated outcome could not be updated: ${e.message}`);
        throw e;
      }
      const r = betaOf(withScalar(s, plan.variable, { kind: 'random', spec }), now.u);
      calls += r.calls;
      if (!r.converged) unconverged++;
      betas.push(r.beta);
    }
    const sorted = [...betas].sort((a, b) => a - b);
    const finite = sorted.filter(Number.isFinite);
    const mean = finite.length === sorted.length ? finite.reduce((a, b) => a + b, 0) / finite.length : NaN;
    return {
      label: planLabel(plan),
      variable: plan.variable,
      description: describePath(plan.variable),
      tests: plan.tests,
      tested: plan.tested,
      ...(plan.measurementCov !== undefined ? { measurementCov: plan.measurementCov } : plan.tested === 'this_one' ? { measurementCov: DEFAULT_MEASUREMENT_COV } : {}),
      betaMean: mean,
      beta05: quantileSorted(sorted, 0.05),
      beta50: quantileSorted(sorted, 0.5),
      beta95: quantileSorted(sorted, 0.95),
      pMeet: betas.filter((b) => b >= target).length / betas.length,
      expectedGain: mean - now.beta,
    };
  });
  rows.sort((a, b) => b.pMeet - a.pMeet || b.expectedGain - a.expectedGain);
  return {
    betaNow: now.beta, target, outcomes, seed: opts.seed, defaults,
    survivalIncluded: (s.survivedLoads?.length ?? 0) > 0,
    plans: rows, calls, unconverged,
  };
}
