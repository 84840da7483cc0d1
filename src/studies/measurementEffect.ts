/**
 * What the measurements changed (docs/evidence.md §5–6): β with every distribution as written
 * (test results ignored, no survived load), β with the updated distributions, and β given the
 * survived loads; the verdict each time; prior and posterior densities of each updated variable.
 * FORM throughout (the before-and-after comparison uses one method), with the survival's own
 * Monte Carlo check.
 */
import { withScalar } from '../limitState/scenarioEdits.js';
import { quantityKindOf, describePath } from '../limitState/quantityKind.js';
import { makeDistribution } from '../probability/makeDistribution.js';
import type { Scenario } from '../scenario/types.js';
import { scalarAt } from '../scenario/variables.js';
import { scenarioForm } from './columnForm.js';
import { survivalStudy, type SurvivalStudy } from './survivalStudy.js';
import type { MeasurementDensity } from '../report/reportInput.js';

export interface BetaState {
  beta: number;
  pf: number;
  meets: boolean;
}

export interface MeasurementEffect {
  target: number;
  /** every distribution as written, no survived load */
  before: BetaState;
  /** test results applied (present when any variable has them) */
  afterTests?: BetaState;
  /** everything applied: the tests, then the survived loads */
  after: BetaState;
  survival?: SurvivalStudy;
  densities: MeasurementDensity[];
}

/** The scenario as written: each updated variable back to its prior, no structure evidence, no plans. */
export function scenarioAsWritten(s: Scenario): Scenario {
  let out: Scenario = s;
  for (const [path, record] of Object.entries(s.evidence ?? {})) out = withScalar(out, path, { kind: 'random', spec: record.prior });
  const { evidence: _e, survivedLoads: _l, testPlans: _p, ...rest } = out;
  return rest;
}

const DENSITY_POINTS = 121;

function densities(s: Scenario): MeasurementDensity[] {
  return Object.entries(s.evidence ?? {}).map(([path, record]) => {
    const scalar = scalarAt(s, path);
    if (!scalar || scalar.kind !== 'random') throw new Error(`${path} is not random`);
    const prior = makeDistribution(record.prior);
    const post = makeDistribution(scalar.spec);
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
    };
  });
}

const state = (beta: number, pf: number, target: number): BetaState => ({ beta, pf, meets: beta >= target });

export function measurementEffect(s: Scenario, seed: number): MeasurementEffect {
  const target = s.targetBeta;
  const asWritten = scenarioAsWritten(s);
  const b0 = scenarioForm(asWritten);
  const before = state(b0.beta, b0.pf, target);
  let afterTests: BetaState | undefined;
  if (s.evidence) {
    const b1 = scenarioForm(s);
    afterTests = state(b1.beta, b1.pf, target);
  }
  let survival: SurvivalStudy | undefined;
  if (s.survivedLoads && s.survivedLoads.length > 0) survival = survivalStudy(s, { seed });
  const after = survival ? state(survival.beta, survival.pf, target) : (afterTests ?? before);
  return { target, before, ...(afterTests ? { afterTests } : {}), after, ...(survival ? { survival } : {}), densities: densities(s) };
}
