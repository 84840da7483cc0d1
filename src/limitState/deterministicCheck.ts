/**
 * `stanchion check`: the column with every random variable at its mean (docs/json-output.md).
 * Also the buckled shapes of the first modes, for people and for the report.
 */
import { criticalLoad } from '../mechanics/criticalLoad.js';
import { modeShape } from '../mechanics/modeShape.js';
import { columnCapacity } from '../mechanics/columnCapacity.js';
import { fixityFactor } from '../mechanics/restraint.js';
import type { ColumnState } from '../mechanics/types.js';
import type { ColumnModel } from './columnModel.js';
import { seriesSpringsAt, type SeriesSprings } from './seriesSprings.js';
import type { EndSpringMoments } from '../mechanics/endSpringMoments.js';
import { classificationJson, classifyEnds, connectionJson, connectionResponseAt, type ConnectionResponse, type EndClassification } from './connectionResponse.js';

export interface ModeSummary {
  mode: number;
  critical_load: number;
  effective_length_factor: number;
  /** heights above the base (m) where the curvature changes sign */
  inflection_points: number[];
  /** distance between inflection points (m), or the equivalent pinned length where the shape has fewer than two */
  effective_length: number;
  effective_length_from_inflections: boolean;
  curvature_factor: number;
  /** the normalised shape sampled bottom to top: xi = x/L, w = deflection / max|deflection| */
  shape: { xi: number; w: number }[];
}

export interface CheckResult {
  critical_load: number;
  effective_length_factor: number;
  /** R = kL/EI; null for a fixed end (infinite) */
  restraint_ratio: { bottom: number | null; top: number | null };
  capacity: number;
  demand: number;
  utilization: number;
  fixity_factor: { bottom: number; top: number };
  /** T = kT L³/EI of the lateral spring (sway frames) */
  lateral_ratio: number | null;
  curvature_factor: number;
  strength: string;
  model_factor: number;
  modes: ModeSummary[];
  /** second-order moments and rotations of the end connections under the mean loads */
  connections: ConnectionResponse;
  /** EN 1993-1-8 §5.2.2.5 class of each end at the mean stiffness and at its 5 % fractile */
  jointClasses: EndClassification[];
  /** the components of each end given as springs in series, at the means (null: not a series end) */
  seriesSprings: SeriesSprings;
}

const SHAPE_POINTS = 41;

function finiteOrNull(v: number): number | null {
  return Number.isFinite(v) ? v : null;
}

function summariseMode(state: ColumnState, mode: number): ModeSummary | null {
  const EI = state.E * state.I;
  const { Pcr, phi, K } = criticalLoad(EI, state.L, state.frame, state.r, mode);
  if (!(Pcr > 0)) return null;
  const shape = modeShape(state.frame, state.r, phi);
  return {
    mode,
    critical_load: Pcr,
    effective_length_factor: K,
    inflection_points: shape.inflectionPoints.map((xi) => xi * state.L),
    effective_length: shape.effectiveLength * state.L,
    effective_length_from_inflections: shape.effectiveLengthFromInflections,
    curvature_factor: shape.curvatureFactor,
    shape: Array.from({ length: SHAPE_POINTS }, (_, i) => {
      const xi = i / (SHAPE_POINTS - 1);
      return { xi, w: shape.sample(xi) };
    }),
  };
}

/** Pcr, K and c of the elastic column at a state (what columnCapacity returns besides the capacity). */
function elasticColumn(state: ColumnState): { Pcr: number; K: number; c: number } {
  const { Pcr, phi, K } = criticalLoad(state.E * state.I, state.L, state.frame, state.r);
  return { Pcr, K, c: modeShape(state.frame, state.r, phi).curvatureFactor };
}

export function deterministicCheck(model: ColumnModel, modes = 3): CheckResult {
  const x = model.mean;
  const state = model.state(x);
  // plastic-zone is traced, not closed-form: Pcr, K and c are the elastic column's, the capacity the model's
  const cap =
    model.scenario.strength === 'plastic-zone'
      ? { ...elasticColumn(state), capacity: model.capacity(x) }
      : columnCapacity(model.scenario.strength, state);
  const theta = model.modelFactor(x);
  const demand = model.demand(x);
  const summaries: ModeSummary[] = [];
  for (let m = 1; m <= modes; m++) {
    const s = summariseMode(state, m);
    if (s) summaries.push(s);
  }
  return {
    critical_load: cap.Pcr,
    effective_length_factor: cap.K,
    restraint_ratio: { bottom: finiteOrNull(state.r.bottom), top: finiteOrNull(state.r.top) },
    capacity: cap.capacity,
    demand,
    utilization: demand / (theta * cap.capacity),
    fixity_factor: { bottom: fixityFactor(state.r.bottom), top: fixityFactor(state.r.top) },
    lateral_ratio: state.frame === 'sway' ? (state.r.lateral ?? 0) : null,
    curvature_factor: cap.c,
    strength: model.scenario.strength,
    model_factor: theta,
    modes: summaries,
    connections: connectionResponseAt(model, x),
    jointClasses: classifyEnds(model),
    seriesSprings: seriesSpringsAt(model, x),
  };
}

/** The contract's `check` object: the six contract keys first, the extensions after. */
export function checkJson(c: CheckResult): Record<string, unknown> {
  return {
    critical_load: c.critical_load,
    effective_length_factor: c.effective_length_factor,
    restraint_ratio: c.restraint_ratio,
    capacity: c.capacity,
    demand: c.demand,
    utilization: c.utilization,
    fixity_factor: c.fixity_factor,
    lateral_ratio: c.lateral_ratio,
    curvature_factor: c.curvature_factor,
    strength: c.strength,
    model_factor: c.model_factor,
    modes: c.modes.map((m) => ({
      mode: m.mode,
      critical_load: m.critical_load,
      effective_length_factor: m.effective_length_factor,
      inflection_points: m.inflection_points,
      effective_length: m.effective_length,
    })),
    ...connectionJson(c.connections, 'means'),
    joint_classification: classificationJson(c.jointClasses),
    ...(c.seriesSprings.bottom || c.seriesSprings.top ? { series_springs: c.seriesSprings } : {}),
  };
}
