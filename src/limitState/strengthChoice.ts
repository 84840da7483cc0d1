/**
 * A scenario made ready for one strength model: the model's default model uncertainty where the
 * file gives no `model_factor`, and the bow taken out of the random variables where the model
 * ignores it (it would only sit in the lists with α² = 0). Idempotent: resolving twice changes nothing.
 */
import { defaultModelUncertainty } from '../mechanics/modelUncertainty.js';
import { strengthUsesBow } from '../mechanics/strengthModelKind.js';
import { makeDistribution } from '../probability/makeDistribution.js';
import type { Scenario, StrengthModel } from '../scenario/types.js';
import { withScalar } from './scenarioEdits.js';

export const BOW_PATH = 'column.imperfection.bow';
export const BOW_Z_PATH = 'column.axis_z.imperfection.bow';

export interface ModelFactorUsed {
  /** `scenario`: the file's own model_factor; `default`: the strength model's default */
  readonly source: 'scenario' | 'default';
  /** the strength model whose default it is (the scenario's model when source is `scenario`) */
  readonly strength: StrengthModel;
  /** `fixed` or a distribution name */
  readonly dist: string;
  readonly mean: number;
  readonly cov: number;
  /** where the default comes from; for a scenario value, a note saying so */
  readonly reference: string;
}

export interface ResolvedScenario {
  readonly scenario: Scenario;
  readonly modelFactor: ModelFactorUsed;
  /** the bow was random but the model ignores it, so it is now fixed at its mean */
  readonly bowDropped: boolean;
}

function modelFactorOf(s: Scenario): ModelFactorUsed {
  const d = s.modelFactorDefault;
  const m = s.modelFactor;
  if (m.kind === 'fixed') {
    return { source: 'scenario', strength: s.strength, dist: 'fixed', mean: m.value, cov: 0, reference: 'given in the scenario' };
  }
  const dist = makeDistribution(m.spec);
  const base = { dist: m.spec.dist, mean: dist.mean, cov: dist.sd / dist.mean };
  if (d) return { source: 'default', strength: d.strength, ...base, reference: d.source };
  return { source: 'scenario', strength: s.strength, ...base, reference: 'given in the scenario' };
}

/** The scenario as `strength` sees it (default: the scenario's own strength model). */
export function resolveStrengthModel(s: Scenario, strength: StrengthModel = s.strength): ResolvedScenario {
  let t: Scenario = strength === s.strength ? s : { ...s, strength };
  // the curve chosen about z belongs to the scenario's own model; another model applies about both axes
  if (strength !== s.strength && t.column.axisZ !== undefined) t = { ...t, column: { ...t.column, axisZ: { ...t.column.axisZ, strength } } };
  if (t.modelFactorOmitted && (!t.modelFactorDefault || t.modelFactorDefault.strength !== strength)) {
    const d = defaultModelUncertainty(strength);
    t = {
      ...t,
      modelFactor: { kind: 'random', spec: { dist: d.dist, mean: d.mean, cov: d.cov } },
      modelFactorDefault: { strength, source: d.source },
    };
  }
  let bowDropped = false;
  if (!strengthUsesBow(strength) && t.column.bow.kind === 'random') {
    t = withScalar(t, BOW_PATH, { kind: 'fixed', value: makeDistribution(t.column.bow.spec).mean });
    bowDropped = true;
  }
  const z = t.column.axisZ;
  if (z !== undefined && !strengthUsesBow(z.strength) && z.bow.kind === 'random') {
    t = withScalar(t, BOW_Z_PATH, { kind: 'fixed', value: makeDistribution(z.bow.spec).mean });
    bowDropped = true;
  }
  return { scenario: t, modelFactor: modelFactorOf(t), bowDropped };
}
