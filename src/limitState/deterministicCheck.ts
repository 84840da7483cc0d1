/**
 * `stanchion check`: the column with every random variable at its mean (docs/json-output.md).
 * Also the buckled shapes of the first modes, for people and for the report.
 */
import { criticalLoad } from '../mechanics/criticalLoad.js';
import { modeShape } from '../mechanics/modeShape.js';
import { columnCapacity, usesSteppedSolver } from '../mechanics/columnCapacity.js';
import { steppedMemberOf } from '../mechanics/steppedColumn.js';
import { fixityFactor } from '../mechanics/restraint.js';
import type { CapacityResult, ColumnState } from '../mechanics/types.js';
import type { AxisModel, AxisName, ColumnModel } from './columnModel.js';
import { meanOf } from '../scenario/readScalar.js';
import { namedProperties, PROPERTY_COUNT, type SectionProperties } from '../sections/sectionProperties.js';
import { sectionWriter } from '../sections/sectionDimensions.js';
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
  /** two principal axes: each at the means and which governs (the keys above are the governing axis'); null: one axis */
  axes: AxesCheck | null;
  /** a section given by its dimensions (null: by its properties) */
  sectionProperties: SectionPropertiesCheck | null;
}

const SHAPE_POINTS = 41;

function finiteOrNull(v: number): number | null {
  return Number.isFinite(v) ? v : null;
}

/**
 * The first mode of a stepped member (a corroded zone): K = π/φ with φ referred to E·I of the zone, as
 * R is; inflection points where the moment changes sign (a grid of 400 steps, then bisection). The
 * stepped solver gives the lowest mode only, so no higher modes are listed.
 */
function summariseSteppedMode(state: ColumnState): ModeSummary | null {
  const sound = state.sound!;
  const { Pcr, K, mode: shape } = steppedMemberOf(state, sound);
  if (!(Pcr > 0)) return null;
  const inflections: number[] = [];
  const steps = 400;
  let x0 = 0;
  let m0 = shape.moment(0);
  for (let i = 1; i <= steps; i++) {
    const x1 = i / steps;
    const m1 = shape.moment(x1);
    if (m0 !== 0 && m1 !== 0 && (m0 > 0) !== (m1 > 0)) {
      let lo = x0, hi = x1, mlo = m0;
      for (let k = 0; k < 60; k++) {
        const mid = 0.5 * (lo + hi);
        const mm = shape.moment(mid);
        if ((mm > 0) === (mlo > 0)) { lo = mid; mlo = mm; } else hi = mid;
      }
      inflections.push(0.5 * (lo + hi) * state.L);
    }
    x0 = x1;
    m0 = m1;
  }
  return {
    mode: 1,
    critical_load: Pcr,
    effective_length_factor: K,
    inflection_points: inflections,
    effective_length: K * state.L,
    effective_length_from_inflections: false,
    curvature_factor: Math.max(shape.zoneFactor, shape.upperFactor),
    shape: Array.from({ length: SHAPE_POINTS }, (_, i) => {
      const xi = i / (SHAPE_POINTS - 1);
      return { xi, w: shape.sample(xi) };
    }),
  };
}

function summariseMode(state: ColumnState, mode: number): ModeSummary | null {
  if (usesSteppedSolver(state)) return mode === 1 ? summariseSteppedMode(state) : null;
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

/** One principal axis at the means (two-axis scenarios). */
export interface AxisCheck {
  axis: AxisName;
  strength: string;
  critical_load: number;
  effective_length_factor: number;
  restraint_ratio: { bottom: number | null; top: number | null };
  fixity_factor: { bottom: number; top: number };
  curvature_factor: number;
  capacity: number;
  utilization: number;
}

/** The axes at the means and which one governs (the smaller capacity; y on a tie). */
export interface AxesCheck {
  y: AxisCheck;
  z: AxisCheck;
  governing: AxisName;
}

/** Pcr, K and c of the elastic column at a state (what columnCapacity returns besides the capacity). */
function elasticColumn(state: ColumnState): { Pcr: number; K: number; c: number } {
  const { Pcr, phi, K } = criticalLoad(state.E * state.I, state.L, state.frame, state.r);
  return { Pcr, K, c: modeShape(state.frame, state.r, phi).curvatureFactor };
}

/**
 * The capacity about one axis at x with Pcr, K and c. plastic-zone is traced, not closed-form: Pcr, K
 * and c are the elastic column's, the capacity the full model's (never its table, which `check` does not build).
 */
function axisCapacity(axis: AxisModel, state: ColumnState, x: Float64Array): CapacityResult {
  return axis.strength === 'plastic-zone' ? { ...elasticColumn(state), capacity: axis.capacityFull(x) } : columnCapacity(axis.strength, state);
}

function axisCheck(axis: AxisModel, x: Float64Array, demand: number, theta: number): { check: AxisCheck; state: ColumnState; cap: CapacityResult } {
  const state = axis.state(x);
  const cap = axisCapacity(axis, state, x);
  return {
    state,
    cap,
    check: {
      axis: axis.name,
      strength: axis.strength,
      critical_load: cap.Pcr,
      effective_length_factor: cap.K,
      restraint_ratio: { bottom: finiteOrNull(state.r.bottom), top: finiteOrNull(state.r.top) },
      fixity_factor: { bottom: fixityFactor(state.r.bottom), top: fixityFactor(state.r.top) },
      curvature_factor: cap.c,
      capacity: cap.capacity,
      utilization: demand / (theta * cap.capacity),
    },
  };
}

/** The section given by its dimensions: properties of the sound section and at the mean loss. */
export interface SectionPropertiesCheck {
  shape: string;
  gross: SectionProperties;
  at_mean_loss: SectionProperties;
  corrosion: { loss_per_face: { primary: number; secondary: number }; per_plate: boolean; zone_height: number | null } | null;
}

function sectionPropertiesAt(model: ColumnModel): SectionPropertiesCheck | null {
  const g = model.scenario.column.section.geometry;
  if (g === undefined) return null;
  const write = sectionWriter(g.dimensions);
  const p = new Float64Array(PROPERTY_COUNT);
  write(p, 0, 0);
  const gross = namedProperties(p);
  const k = g.corrosion;
  const primary = k ? meanOf(k.primary) : 0;
  const secondary = k ? meanOf(k.secondary) : 0;
  write(p, primary, secondary);
  return {
    shape: g.dimensions.shape,
    gross,
    at_mean_loss: namedProperties(p),
    corrosion: k ? { loss_per_face: { primary, secondary }, per_plate: k.perPlate, zone_height: k.zoneHeight ?? null } : null,
  };
}

/** The numbers a sweep row keeps of the check (what deterministicCheck computes first). */
export type CheckCore = Pick<CheckResult, 'critical_load' | 'effective_length_factor' | 'capacity' | 'demand' | 'utilization'>;

/** The capacity and demand at the means only (about the governing axis): no mode shapes, connection moments or joint classes. */
export function checkCore(model: ColumnModel): CheckCore {
  return coreAt(model, model.mean).core;
}

/** The governing axis at x (the smaller capacity; y on a tie), its state and capacity. */
function coreAt(model: ColumnModel, x: Float64Array) {
  const theta = model.modelFactor(x);
  const demand = model.demand(x);
  let state: ColumnState;
  let strength = model.scenario.strength;
  let axes: AxesCheck | null = null;
  let cap: CapacityResult;
  if (model.axes.length === 2) {
    const y = axisCheck(model.axes[0]!, x, demand, theta);
    const z = axisCheck(model.axes[1]!, x, demand, theta);
    const governing = z.check.capacity < y.check.capacity ? z : y;
    axes = { y: y.check, z: z.check, governing: governing.check.axis };
    state = governing.state;
    strength = governing.check.strength as typeof strength;
    cap = governing.cap;
  } else {
    state = model.state(x);
    cap = axisCapacity(model.axes[0]!, state, x);
  }
  const core: CheckCore = { critical_load: cap.Pcr, effective_length_factor: cap.K, capacity: cap.capacity, demand, utilization: demand / (theta * cap.capacity) };
  return { core, cap, theta, state, strength, axes };
}

export function deterministicCheck(model: ColumnModel, modes = 3): CheckResult {
  const x = model.mean;
  const { core, cap, theta, state, strength, axes } = coreAt(model, x);
  const { demand } = core;
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
    utilization: core.utilization,
    fixity_factor: { bottom: fixityFactor(state.r.bottom), top: fixityFactor(state.r.top) },
    lateral_ratio: state.frame === 'sway' ? (state.r.lateral ?? 0) : null,
    curvature_factor: cap.c,
    strength,
    model_factor: theta,
    modes: summaries,
    axes,
    sectionProperties: sectionPropertiesAt(model),
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
    ...(c.axes !== null ? { axes: c.axes, governing_axis: c.axes.governing } : {}),
    ...(c.sectionProperties !== null ? { section_properties: c.sectionProperties } : {}),
  };
}
