/**
 * What the evidence changed (docs/evidence.md §8): one sequence of steps, each adding one kind of
 * evidence to the one before,
 *   as written (no evidence) → with the test results → with the measurements through the model
 *   → given the survived loads,
 * with FORM's β and the verdict at each step (one method throughout, so that each change is the
 * evidence's alone); steps that do not apply are left out. The survived-load step adds its own
 * Monte Carlo check. Also the prior and posterior densities of every updated variable.
 * Computed once here; terminal, JSON and report show these numbers and no others.
 */
import { withScalar } from '../limitState/scenarioEdits.js';
import { quantityKindOf, describePath } from '../limitState/quantityKind.js';
import { makeDistribution } from '../probability/makeDistribution.js';
import type { Scenario } from '../scenario/types.js';
import { scalarAt } from '../scenario/variables.js';
import { scenarioForm } from './columnForm.js';
import { survivalStudy, type SurvivalStudy } from './survivalStudy.js';
import type { MeasurementDensity } from '../report/reportInput.js';
import type { MeasurementUpdateResult } from './measurementUpdate.js';

export interface BetaState {
  beta: number;
  pf: number;
  meets: boolean;
}

export type EvidenceStepName = 'as_written' | 'tests' | 'measurements' | 'survival';

export interface EvidenceStep extends BetaState {
  step: EvidenceStepName;
  label: string;
}

export const EVIDENCE_STEP_LABELS: Record<EvidenceStepName, string> = {
  as_written: 'as written (no evidence)',
  tests: 'with the test results',
  measurements: 'and the measurements through the model',
  survival: 'and given the survived loads',
};

export interface MeasurementEffect {
  target: number;
  /** the steps in order; the first is always `as_written`, the last is `after` */
  steps: EvidenceStep[];
  /** every distribution as written: no test result, no measurement, no survived load */
  before: BetaState;
  /** test results applied (present when any variable has them) */
  afterTests?: BetaState;
  /** test results and the measurements through the model (present when the scenario has measurements) */
  afterMeasurements?: BetaState;
  /** everything applied: the last step */
  after: BetaState;
  survival?: SurvivalStudy;
  densities: MeasurementDensity[];
}

/** The scenario as written: each tested variable back to its prior, no measurements, no survived loads, no plans. */
export function scenarioAsWritten(s: Scenario): Scenario {
  let out: Scenario = s;
  for (const [path, record] of Object.entries(s.evidence ?? {})) out = withScalar(out, path, { kind: 'random', spec: record.prior });
  const { evidence: _e, survivedLoads: _l, testPlans: _p, measurements: _m, ...rest } = out;
  return rest;
}

/** The scenario with its test results only: no measurements, no survived loads. */
export function scenarioWithTests(s: Scenario): Scenario {
  const { survivedLoads: _l, testPlans: _p, measurements: _m, ...rest } = s;
  return rest;
}

const DENSITY_POINTS = 121;

/** Prior and updated density of each variable updated by test results (the update of the tests alone). */
function testDensities(s: Scenario): MeasurementDensity[] {
  return Object.entries(s.evidence ?? {}).map(([path, record]) => {
    const scalar = scalarAt(s, path);
    if (!scalar || scalar.kind !== 'random') throw new Error(`${path} is not random`);
    const prior = makeDistribution(record.prior);
    const post = makeDistribution(record.result ?? scalar.spec);
    // the central 99 % of the prior and 96 % of the update: the heavy tail of a Student-t predictive would flatten the picture
    const lo = Math.min(prior.quantile(0.005), post.quantile(0.02));
    const hi = Math.max(prior.quantile(0.995), post.quantile(0.98));
    const xs = Array.from({ length: DENSITY_POINTS }, (_, i) => lo + ((hi - lo) * i) / (DENSITY_POINTS - 1));
    const p = xs.map((x) => prior.pdf(x));
    const q = xs.map((x) => post.pdf(x));
    const top = Math.max(...p, ...q);
    return {
      path,
      description: describePath(path),
      kind: quantityKindOf(path),
      points: xs.map((x, i) => ({ x, prior: p[i] / top, posterior: q[i] / top })),
      tests: [...record.tests],
      updatedBy: 'tests' as const,
    };
  });
}

/**
 * Each variable the measurements updated: the distribution the sampler started from, the one
 * fitted to the posterior draws, and the draws' histogram, on one scale (the larger curve peak = 1).
 */
function measurementDensities(r: MeasurementUpdateResult): MeasurementDensity[] {
  return r.summary.variables.map((v) => {
    const prior = makeDistribution(v.priorSpec);
    const post = makeDistribution(v.fitted);
    const h = v.histogram;
    const lo = Math.min(prior.quantile(0.005), post.quantile(0.002), h.lo);
    const hi = Math.max(prior.quantile(0.995), post.quantile(0.998), h.lo + h.width * h.density.length);
    const xs = Array.from({ length: DENSITY_POINTS }, (_, i) => lo + ((hi - lo) * i) / (DENSITY_POINTS - 1));
    const p = xs.map((x) => prior.pdf(x));
    const q = xs.map((x) => post.pdf(x));
    const top = Math.max(...p, ...q);
    return {
      path: v.path,
      description: v.description,
      kind: v.kind,
      points: xs.map((x, i) => ({ x, prior: p[i] / top, posterior: q[i] / top })),
      tests: [],
      updatedBy: 'measurements' as const,
      histogram: h.density.map((d, k) => ({ x0: h.lo + k * h.width, x1: h.lo + (k + 1) * h.width, density: d / top })),
    };
  });
}

const state = (beta: number, pf: number, target: number): BetaState => ({ beta, pf, meets: beta >= target });

/**
 * The steps of the evidence for a scenario as loaded (`original`, its measurements not yet used)
 * and, when it has measurements, their update (measurementUpdate.ts): the update's own FORM runs
 * are the "with the test results" and "and the measurements" steps, so nothing is computed twice.
 */
export function measurementEffect(
  original: Scenario,
  seed: number,
  update?: { scenario: Scenario; result: MeasurementUpdateResult } | null,
  opts: { targetCov?: number } = {},
): MeasurementEffect {
  const target = original.targetBeta;
  const steps: EvidenceStep[] = [];
  const push = (step: EvidenceStepName, beta: number, pf: number): BetaState => {
    const b = state(beta, pf, target);
    steps.push({ step, label: EVIDENCE_STEP_LABELS[step], ...b });
    return b;
  };
  const b0 = scenarioForm(scenarioAsWritten(original));
  const before = push('as_written', b0.beta, b0.pf);
  let afterTests: BetaState | undefined;
  if (original.evidence) {
    if (update) afterTests = push('tests', update.result.betaPrior, update.result.pfPrior);
    else {
      const b1 = scenarioForm(scenarioWithTests(original));
      afterTests = push('tests', b1.beta, b1.pf);
    }
  }
  const afterMeasurements = update ? push('measurements', update.result.betaPosterior, update.result.pfPosterior) : undefined;
  const last = update ? update.scenario : original;
  let survival: SurvivalStudy | undefined;
  if (last.survivedLoads && last.survivedLoads.length > 0) {
    survival = survivalStudy(last, { seed, targetCov: opts.targetCov });
    push('survival', survival.beta, survival.pf);
  }
  const after = steps[steps.length - 1];
  return {
    target,
    steps,
    before,
    ...(afterTests ? { afterTests } : {}),
    ...(afterMeasurements ? { afterMeasurements } : {}),
    after: { beta: after.beta, pf: after.pf, meets: after.meets },
    ...(survival ? { survival } : {}),
    densities: [...testDensities(original), ...(update ? measurementDensities(update.result) : [])],
  };
}
