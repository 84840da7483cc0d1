/**
 * What the end connections carry, and how stiff they are by EN 1993-1-8's joint classes, at one point
 * x of the variables (the means for `check`, the FORM design point for `assess`). The numbers come
 * from mechanics/endSpringMoments.ts, mechanics/beamColumn.ts (mechanics/steppedBeamColumn.ts for a corroded
 * zone) and mechanics/jointClassification.ts; this file only picks the inputs out of the scenario.
 */
import { beamColumnResponse } from '../mechanics/beamColumn.js';
import { steppedBeamColumnOf, steppedResponse } from '../mechanics/steppedBeamColumn.js';
import type { ColumnState, SoundSection } from '../mechanics/types.js';
import { endSpringMoments, unstableResponse, type EndSpringMoments } from '../mechanics/endSpringMoments.js';
import {
  beamJointBoundaries, classifyJoint, columnBaseBoundaries, pinnedRelativeSlenderness,
  type JointBoundaries, type JointClass,
} from '../mechanics/jointClassification.js';
import type { End } from '../scenario/types.js';
import { flexibleComponents, seriesComponentPath } from '../scenario/seriesEnd.js';
import type { ColumnModel } from './columnModel.js';
import { endsAbout, endsPath } from './scenarioEdits.js';

export type EndKey = 'bottom' | 'top';
const END_KEYS: readonly EndKey[] = ['bottom', 'top'];

/**
 * What connectionResponseAt gives: the bowed column's response, with the load's end eccentricities when it
 * has any (applied end moments folded in as M/P) and the transverse actions at that load (line load N/m,
 * top force N including P·φ of the out-of-plumb) when it has any.
 */
export type ConnectionResponse = EndSpringMoments & {
  eccentricity?: { bottom: number; top: number };
  transverse?: { line: number; top: number };
};

/**
 * Second-order moments and rotations at x; the load is the demand (sum of loads) at x. An eccentric
 * load adds its end couples P·e (mechanics/beamColumn.ts): the spring moments then include them.
 */
export function connectionResponseAt(model: ColumnModel, x: Float64Array): ConnectionResponse {
  const st = model.state(x);
  const P = model.demand(x);
  if (st.sound !== undefined && P > 0 && st.E * st.I > 0 && Number.isFinite(st.E * st.I)) return steppedConnectionResponse(st, st.sound, P);
  const bowed = endSpringMoments(st.E * st.I, st.L, st.frame, st.r, st.bow, P);
  const e = st.eccentricity;
  if (e === undefined) return bowed;
  // the actions at this load: every action scales with the axial load (columnModel.ts)
  const t = st.transverse;
  const actions = t === undefined ? undefined : { line: t.line * P, top: st.frame === 'sway' ? t.top * P : 0 };
  const withActions = actions !== undefined && (actions.line !== 0 || actions.top !== 0);
  if (!bowed.stable || (e.bottom === 0 && e.top === 0 && !withActions)) return { ...bowed, eccentricity: e, ...(actions ? { transverse: actions } : {}) };
  const b = beamColumnResponse(st.E * st.I, st.L, st.frame, st.r, st.bow, e.bottom, e.top, P, actions);
  return {
    ...bowed,
    rotation: b.rotation,
    springMoment: b.springMoment,
    memberMax: b.memberMax,
    memberMaxAt: b.memberMaxAt,
    drift: b.drift,
    eccentricity: e,
    ...(actions ? { transverse: actions } : {}),
  };
}

/**
 * A stepped member (a corroded zone near the base): the exact stepped response (mechanics/steppedBeamColumn.ts)
 * under the bow and any end couples, line load and top force, rather than the zone's section over the whole length.
 */
function steppedConnectionResponse(st: ColumnState, sound: SoundSection, P: number): ConnectionResponse {
  const member = steppedBeamColumnOf(st, sound);
  const t = st.transverse;
  const actions = t === undefined ? undefined : { line: t.line * P, top: st.frame === 'sway' ? t.top * P : 0 };
  const extra = { ...(st.eccentricity ? { eccentricity: st.eccentricity } : {}), ...(actions ? { transverse: actions } : {}) };
  const { Pcr, bow } = member;
  if (!(Pcr > 0) || !(P < Pcr)) return { ...unstableResponse(P, bow, Pcr), ...extra };
  const r = steppedResponse(member, P);
  return {
    stable: r.stable, load: P, bow, Pcr, amplification: 1 / (1 - P / Pcr), rotation: r.rotation, springMoment: r.springMoment,
    memberMax: r.memberMax, memberMaxAt: r.memberMaxAt, drift: r.drift, ...extra,
  };
}

/**
 * The JSON blocks (SI): `connection_moments` (contract keys bottom, top, member_max: magnitudes in N·m,
 * the values a joint's moment resistance M_j,Rd is checked against), `connection_rotations` (rad,
 * magnitudes) and `connection_response` (what they were computed from). Non-finite values (load at or
 * above Pcr) become null through jsonSafe / JSON.stringify callers.
 */
export function connectionJson(m: ConnectionResponse, at: 'means' | 'form design point'): Record<string, unknown> {
  const nullIfInfinite = (v: number) => (Number.isFinite(v) ? v : null);
  return {
    connection_moments: {
      bottom: nullIfInfinite(Math.abs(m.springMoment.bottom)),
      top: nullIfInfinite(Math.abs(m.springMoment.top)),
      member_max: nullIfInfinite(m.memberMax),
      member_max_at: Number.isFinite(m.memberMaxAt) ? m.memberMaxAt : null,
    },
    connection_rotations: { bottom: nullIfInfinite(Math.abs(m.rotation.bottom)), top: nullIfInfinite(Math.abs(m.rotation.top)) },
    connection_response: {
      at,
      stable: m.stable,
      axial_load: m.load,
      bow: m.bow,
      critical_load: m.Pcr,
      amplification: nullIfInfinite(m.amplification),
      // the load-weighted end eccentricities (m) whose couples P·e the moments include
      ...(m.eccentricity ? { eccentricity: { bottom: m.eccentricity.bottom, top: m.eccentricity.top } } : {}),
      // the end couples (N·m): P·e of the eccentric loads plus the applied end moments
      ...(m.eccentricity ? { end_couples: { bottom: m.load * m.eccentricity.bottom, top: m.load * m.eccentricity.top } } : {}),
      // the line load along the height (N/m) and the horizontal force at the top (N, with P·φ) the moments include
      ...(m.transverse ? { line_load: m.transverse.line, top_force: m.transverse.top } : {}),
    },
  };
}

export interface EndClassification {
  end: EndKey;
  /** 'given': the scenario says pinned or fixed; 'beam' / 'base': EN 1993-1-8 §5.2.2.5 (1)–(2) / (4); 'none': no rule applies */
  rule: 'given' | 'beam' | 'base' | 'none';
  /** rotational stiffness at the means and at its lower 5 % fractile (N·m/rad; Infinity for fixed) */
  stiffnessMean: number;
  stiffnessLow: number;
  classAtMean: JointClass | null;
  classAtLow: JointClass | null;
  boundaries: JointBoundaries | null;
  note: string;
}

/** The x of the means with this end's stiffness variable moved to its adverse 5 % fractile. */
function lowStiffnessPoint(model: ColumnModel, end: End, path: string): Float64Array {
  const x = Float64Array.from(model.mean);
  if (end.type === 'series') {
    // every random component at its own 5 % fractile: the softest end a reviewer would quote
    for (const c of flexibleComponents(end.components)) {
      const j = model.names.indexOf(seriesComponentPath(path, c.name));
      if (j >= 0) x[j] = model.dists[j].quantile(0.05);
    }
    return x;
  }
  const variable = end.type === 'rotation' ? `${path}.rotation` : end.type === 'ratio' ? `${path}.${end.from}` : null;
  const i = variable === null ? -1 : model.names.indexOf(variable);
  if (i >= 0 && end.type === 'ratio' && end.from === 'alignment_g') x[i] = model.dists[i].quantile(0.95); // larger G, softer end
  else if (i >= 0) x[i] = model.dists[i].quantile(0.05);
  return x;
}

/**
 * Joint class of each end at the mean stiffness and at its 5 % fractile (EN 1993-1-8 §5.2.2.5).
 * `axis` z classifies the ends about z (`column.axis_z.ends`) against the column's E·I_z.
 */
export function classifyEnds(model: ColumnModel, axis: 'y' | 'z' = 'y'): EndClassification[] {
  const s = model.scenario;
  const about = model.axes.find((a) => a.name === axis);
  if (about === undefined) throw new Error(`the scenario has no axis ${axis}`);
  const state = (x: Float64Array) => about.state(x);
  const st = state(model.mean);
  const EIc = st.E * st.I;
  const L = st.L;
  const lambda0 = pinnedRelativeSlenderness(st.A, st.fy, EIc, L);
  const ends = endsAbout(s, axis);
  return END_KEYS.map((key): EndClassification => {
    const end = ends[key];
    const path = `${endsPath(axis)}.${key}`;
    const xLow = lowStiffnessPoint(model, end, path);
    let kMean: number;
    let kLow: number;
    if (end.type === 'rotation') {
      // read k itself, so that a stiffness given as 1.2 MN m/rad reads back exactly
      const i = model.names.indexOf(`${path}.rotation`);
      kMean = end.k.kind === 'fixed' ? end.k.value : model.mean[i];
      kLow = end.k.kind === 'fixed' ? end.k.value : xLow[i];
    } else {
      const low = state(xLow);
      kMean = (st.r[key] * EIc) / L;
      kLow = (low.r[key] * (low.E * low.I)) / L;
    }
    if (end.type === 'pinned' || end.type === 'fixed') {
      const cls: JointClass = end.type === 'pinned' ? 'nominally pinned' : 'rigid';
      return { end: key, rule: 'given', stiffnessMean: kMean, stiffnessLow: kLow, classAtMean: cls, classAtLow: cls, boundaries: null, note: `given as ${end.type}` };
    }
    let boundaries: JointBoundaries;
    let note: string;
    const beam = end.type === 'rotation' || end.type === 'series' ? end.beam : undefined;
    if (beam) {
      const EIb = (beam.E ?? st.E) * beam.inertia;
      boundaries = beamJointBoundaries(s.column.frame, EIb, beam.length, EIc, L);
      note = `beam-to-column joint, E·I_b/L_b = ${(EIb / beam.length).toPrecision(4)} N·m/rad`;
    } else if (key === 'bottom') {
      boundaries = columnBaseBoundaries(s.column.frame, lambda0, EIc, L);
      note = `column base, λ̄0 = ${lambda0.toFixed(3)}`;
    } else {
      return {
        end: key, rule: 'none', stiffnessMean: kMean, stiffnessLow: kLow, classAtMean: null, classAtLow: null, boundaries: null,
        note: 'no beam given: add beam: {inertia, length} to this end to classify the joint',
      };
    }
    return {
      end: key,
      rule: boundaries.rule,
      stiffnessMean: kMean,
      stiffnessLow: kLow,
      classAtMean: classifyJoint(kMean, boundaries),
      classAtLow: classifyJoint(kLow, boundaries),
      boundaries,
      note,
    };
  });
}

export function classificationJson(c: EndClassification[]): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  for (const e of c) {
    out[e.end] = {
      rule: e.rule,
      stiffness_mean: e.stiffnessMean,
      stiffness_5pct: e.stiffnessLow,
      class_at_mean: e.classAtMean,
      class_at_5pct: e.classAtLow,
      rigid_from: e.boundaries ? e.boundaries.rigidFrom : null,
      pinned_up_to: e.boundaries ? e.boundaries.pinnedUpTo : null,
      note: e.note,
    };
  }
  return out;
}
