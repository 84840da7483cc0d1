/**
 * The restraint justification for a column: FORM β as the mean rotational stiffness of the studied
 * ends is multiplied by one common factor (CONTRACT.md §4 `restraint`), the least stiffness that
 * reaches the target, and a sentence a reviewer can read.
 */
import { buildColumnModel } from '../limitState/columnModel.js';
import { withEndStiffness } from '../limitState/scenarioEdits.js';
import { criticalLoad } from '../mechanics/criticalLoad.js';
import { fixityFactor } from '../mechanics/restraint.js';
import { makeDistribution } from '../probability/makeDistribution.js';
import { formatQuantity, type UnitSystem } from '../report/displayUnits.js';
import { InputError } from '../scenario/inputError.js';
import type { Scalar, Scenario } from '../scenario/types.js';
import { scenarioForm } from './columnForm.js';
import { restraintStudy, type RestraintStudyResult } from './restraintStudy.js';
import { restraintSentence } from './restraintSentence.js';

export type EndChoice = 'bottom' | 'top' | 'both';
type EndName = 'bottom' | 'top';

export interface ColumnRestraintResult {
  study: RestraintStudyResult;
  /** base (factor 1) stiffness of each studied end: the scenario's spring, or EI/L for an end given otherwise */
  base: Record<string, Scalar>;
  /** fixity factor and K at the required stiffness (means); null where not reached */
  fixityAtRequired: Record<string, number | null>;
  kAtRequired: number | null;
  /** K with each studied spring at its 5 % fractile when its mean is the required one */
  kAtCharacteristic: number | null;
  /**
   * The deterministic K a code check would need: K of the column whose studied springs are known
   * exactly (no scatter) and just reach the target β; null when even rigid ends fall short.
   */
  kDeterministic: number | null;
  sentence: string;
  notes: string[];
}

/** The ends the study varies: the requested ones, else every end given as a rotational spring. */
export function studiedEnds(s: Scenario, choice?: EndChoice): EndName[] {
  if (choice) return choice === 'both' ? ['bottom', 'top'] : [choice];
  return (['bottom', 'top'] as const).filter((e) => s.column.ends[e].type === 'rotation');
}

function meanValue(v: Scalar): number {
  return v.kind === 'fixed' ? v.value : makeDistribution(v.spec).mean;
}

function baseScalar(s: Scenario, end: EndName, notes: string[]): Scalar {
  const e = s.column.ends[end];
  if (e.type === 'rotation' && meanValue(e.k) > 0) return e.k;
  const model = buildColumnModel(s);
  const st = model.state(model.mean);
  const EI = st.E * st.I;
  // a factor times zero stays zero: an end with no stiffness (or an infinite one) is scaled from EI/L
  const R = e.type === 'ratio' && e.R > 0 && Number.isFinite(e.R) ? e.R : 1;
  const k = (R * EI) / st.L;
  const given = e.type === 'ratio' ? `a ${e.from === 'fixity' ? 'fixity factor' : 'alignment-chart G'}` : e.type === 'rotation' ? 'a spring of zero stiffness' : e.type;
  notes.push(
    `the ${end} end is given as ${given}; ` +
      `the study treats it as a rotational spring of fixed stiffness ${R === 1 ? 'EI/L' : 'R·EI/L'} = ${(k / 1e3).toPrecision(3)} kN·m/rad times the factor`,
  );
  return { kind: 'fixed', value: k };
}

function ratioAt(s: Scenario, k: number): number {
  const model = buildColumnModel(s);
  const st = model.state(model.mean);
  return k === Infinity ? Infinity : (k * st.L) / (st.E * st.I);
}

export function columnRestraint(
  s: Scenario,
  opts: { end?: EndChoice; units?: UnitSystem; grid?: { min?: number; max?: number; points?: number } } = {},
): ColumnRestraintResult {
  const ends = studiedEnds(s, opts.end);
  if (ends.length === 0) {
    throw new InputError(
      '--end',
      'no end of this column is given as a rotational spring ({rotation: ...}); choose the end to study with --end bottom|top|both',
    );
  }
  const notes: string[] = [];
  const base: Record<string, Scalar> = {};
  for (const e of ends) base[e] = baseScalar(s, e, notes);
  /** The scenario with every studied end at factor × its base stiffness (random or known exactly). */
  const edited = (factor: number, bases: Record<string, Scalar> = base): Scenario => {
    let t = s;
    for (const e of ends) t = withEndStiffness(t, e, bases[e], factor);
    return t;
  };
  const baseStiffness: Record<string, number> = {};
  for (const e of ends) baseStiffness[e] = meanValue(base[e]);

  const study = restraintStudy({
    betaAtFactor: (f) => {
      const p = scenarioForm(edited(f));
      return { beta: p.beta, pf: p.pf };
    },
    baseStiffness,
    target: s.targetBeta,
  });

  const kWith = (t: Scenario): number => {
    const model = buildColumnModel(t);
    const st = model.state(model.mean);
    return criticalLoad(st.E * st.I, st.L, st.frame, st.r).K;
  };
  const f = study.requiredFactor;
  const reached = f !== null && Number.isFinite(f);
  const fixityAtRequired: Record<string, number | null> = {};
  for (const e of ends) fixityAtRequired[e] = reached ? fixityFactor(ratioAt(s, (baseStiffness[e] ?? 0) * (f as number))) : null;
  const kAtRequired = reached ? kWith(edited(f as number)) : null;
  let kAtCharacteristic: number | null = null;
  if (reached) {
    let t = s;
    for (const e of ends) {
      const b = base[e];
      const scaled = b.kind === 'fixed' ? b.value * (f as number) : makeDistribution(b.spec).quantile(0.05) * (f as number);
      t = withEndStiffness(t, e, { kind: 'fixed', value: scaled }, 1);
    }
    kAtCharacteristic = kWith(t);
  }
  // the same study with the studied springs known exactly: the K a deterministic check may use
  const fixedBase: Record<string, Scalar> = {};
  for (const e of ends) fixedBase[e] = { kind: 'fixed', value: baseStiffness[e] };
  const exact = restraintStudy({
    betaAtFactor: (fct) => {
      const p = scenarioForm(edited(fct, fixedBase));
      return { beta: p.beta, pf: p.pf };
    },
    baseStiffness,
    target: s.targetBeta,
  });
  const kDeterministic = exact.requiredFactor === null ? null : kWith(edited(exact.requiredFactor, fixedBase));
  const system = opts.units ?? s.displayUnits;
  const studySentence = restraintSentence(study, {
    formatStiffness: (k) => formatQuantity(k, 'rotationalStiffness', system),
    fixityFactor: (_end, k) => fixityFactor(ratioAt(s, k)),
    effectiveLengthFactor: (stiff) => {
      let t = s;
      for (const e of ends) {
        const k = stiff[e];
        t = withEndStiffness(t, e, { kind: 'fixed', value: k === Infinity ? 1 : k }, k === Infinity ? Infinity : 1);
      }
      return kWith(t);
    },
    endLabel: (e) => `the ${e} connection`,
  });
  const sentence =
    kDeterministic !== null && Number.isFinite(kDeterministic)
      ? `${studySentence} With the connections known exactly, the target is reached at K = ${kDeterministic.toFixed(2)}: the largest effective length factor a deterministic check may use.`
      : studySentence;
  return { study, base, fixityAtRequired, kAtRequired, kAtCharacteristic, kDeterministic, sentence, notes };
}

const finite = (v: number): number | null => (Number.isFinite(v) ? v : null);

/** The contract's `restraint` object (CONTRACT.md §4), with extensions after the contract keys. */
export function restraintJson(r: ColumnRestraintResult): Record<string, unknown> {
  const { study } = r;
  const required: Record<string, number | null> = {};
  for (const e of study.ends) {
    const v = study.required[e];
    required[e] = v === null || v === undefined || !Number.isFinite(v) ? null : v;
  }
  return {
    ends: study.ends,
    target_beta: study.target,
    required,
    curve: study.curve.map((p) => {
      const point: Record<string, unknown> = {};
      for (const e of study.ends) point[e] = finite(p.stiffness[e]);
      point.beta = finite(p.beta);
      point.pf = p.pf;
      if (p.ideal) point.ideal = p.ideal;
      point.factor = finite(p.factor);
      return point;
    }),
    outcome: study.outcome,
    fixity_factor: r.fixityAtRequired,
    effective_length_factor: r.kAtRequired,
    effective_length_factor_characteristic: r.kAtCharacteristic,
    effective_length_factor_deterministic: r.kDeterministic,
    sentence: r.sentence,
    notes: r.notes,
  };
}
