/**
 * The restraint justification for a column: FORM β as the mean rotational stiffness of the studied
 * ends is multiplied by one common factor (docs/json-output.md `restraint`), the least stiffness that
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
import { scenarioForm, scenarioFormChecked, type BetaPoint, type CheckedBetaPoint } from './columnForm.js';
import { restraintStudy, type RestraintStudyInput, type RestraintStudyResult } from './restraintStudy.js';
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
  /** How the requirement's β was established and checked. */
  verification: RestraintVerification;
  sentence: string;
  notes: string[];
}

/** One FORM β that decides the study, against its sampling check. */
export interface RestraintCheckPoint {
  /** Why this point decides: the requirement, the assessed stiffness, pinned or rigid ends. */
  role: 'required' | 'assessed' | 'pinned' | 'fixed';
  factor: number;
  formBeta: number;
  checkBeta: number;
  checkMethod: string;
  agrees: boolean;
}

export interface RestraintVerification {
  /** 'form' when FORM's β agreed with its check at every deciding point; 'is' when the study was redone with the check's estimates. */
  method: 'form' | 'is';
  checks: RestraintCheckPoint[];
  /** The check's β at the reported requirement (null when there is no finite requirement). */
  verifiedBeta: number | null;
}


/** FORM β and its sampling check at one factor of a study. */
export interface RestraintEvaluators {
  form: (factor: number) => BetaPoint;
  checked: (factor: number) => CheckedBetaPoint;
}

/**
 * The study with FORM β, then FORM checked by sampling where it decides: at the requirement (or
 * at the ideal end that decides) and at the assessed stiffness (factor 1). If the check disagrees
 * anywhere, the whole study is redone on the check's own estimate (same seed and stream at
 * every factor: common random numbers across the root solve) and says so.
 */
export function verifiedRestraintStudy(
  evaluate: RestraintEvaluators,
  input: Omit<RestraintStudyInput, 'betaAtFactor'>,
): { study: RestraintStudyResult; verification: RestraintVerification } {
  const formStudy = restraintStudy({ ...input, betaAtFactor: evaluate.form });
  const checkAt = (role: RestraintCheckPoint['role'], factor: number): RestraintCheckPoint => {
    const p = evaluate.checked(factor);
    const agrees = p.check ? p.check.agrees : true;
    return { role, factor, formBeta: p.beta, checkBeta: p.checkBeta, checkMethod: p.check?.method ?? 'none (nothing random)', agrees };
  };
  const checks = decidingPoints(formStudy).map(([role, f]) => checkAt(role, f));
  const required = checks.find((c) => c.role === 'required');
  if (checks.every((c) => c.agrees)) {
    return { study: formStudy, verification: { method: 'form', checks, verifiedBeta: required ? required.checkBeta : null } };
  }
  const study = restraintStudy({ ...input, betaAtFactor: (f) => {
    const p = evaluate.checked(f);
    return { beta: p.checkBeta, pf: p.checkPf };
  } });
  const again = decidingPoints(study).map(([role, f]) => checkAt(role, f));
  const req = again.find((c) => c.role === 'required');
  return { study, verification: { method: 'is', checks: [...checks, ...again.filter((c) => c.role === 'required')], verifiedBeta: req ? req.checkBeta : null } };
}

/** FORM and its check on the scenario at each factor. */
function scenarioEvaluators(build: (factor: number) => Scenario, seed: number): RestraintEvaluators {
  return { form: (f) => scenarioForm(build(f)), checked: (f) => scenarioFormChecked(build(f), seed) };
}

/** The factors whose β decides the outcome of a study, and the assessed one. */
function decidingPoints(study: RestraintStudyResult): [RestraintCheckPoint['role'], number][] {
  const out: [RestraintCheckPoint['role'], number][] = [];
  if (study.outcome === 'reached' && study.requiredFactor !== null) out.push(['required', study.requiredFactor]);
  if (study.outcome === 'pinned-suffices') out.push(['pinned', 0]);
  if (study.outcome === 'fixed-only' || study.outcome === 'unreachable') out.push(['fixed', Infinity]);
  out.push(['assessed', 1]);
  return out;
}

function verificationSentence(v: RestraintVerification): string {
  const bad = v.checks.filter((c) => !c.agrees);
  if (v.method === 'form') {
    return `FORM's β was confirmed by a sampling check at ${v.checks.map((c) => roleText(c)).join(' and ')}.`;
  }
  const where = bad.map((c) => `${roleText(c)} (FORM β ${c.formBeta.toFixed(2)}, check ${c.checkBeta.toFixed(2)})`).join(' and ');
  return `FORM disagreed with its sampling check at ${where}, so the requirement could not be established by FORM: the study above uses the check's importance-sampling β at every point (common random numbers).`;
}

function roleText(c: RestraintCheckPoint): string {
  return c.role === 'required' ? 'the requirement' : c.role === 'assessed' ? 'the assessed stiffness' : c.role === 'pinned' ? 'pinned ends' : 'rigid ends';
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
  if (e.type === 'rotation') return e.k;
  const model = buildColumnModel(s);
  const st = model.state(model.mean);
  const EI = st.E * st.I;
  const R = e.type === 'ratio' ? e.R : 1;
  const k = (R * EI) / st.L;
  notes.push(
    `the ${end} end is given as ${e.type === 'ratio' ? `a ${e.from === 'fixity' ? 'fixity factor' : 'alignment-chart G'}` : e.type}; ` +
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

  const seed = s.analysis.seed ?? 1;
  const { study, verification } = verifiedRestraintStudy(scenarioEvaluators((f) => edited(f), seed), { baseStiffness, target: s.targetBeta });

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
  const { study: exact, verification: exactVerification } = verifiedRestraintStudy(scenarioEvaluators((fct) => edited(fct, fixedBase), seed), { baseStiffness, target: s.targetBeta });
  if (exactVerification.method !== 'form') {
    notes.push(`with the connections known exactly, FORM disagreed with its sampling check; that K comes from importance sampling`);
  }
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
  const withK =
    kDeterministic !== null && Number.isFinite(kDeterministic)
      ? `${studySentence} With the connections known exactly, the target is reached at K = ${kDeterministic.toFixed(2)}: the largest effective length factor a deterministic check may use.`
      : studySentence;
  const sentence = `${withK} ${verificationSentence(verification)}`;
  return { study, base, fixityAtRequired, kAtRequired, kAtCharacteristic, kDeterministic, verification, sentence, notes };
}

const finite = (v: number): number | null => (Number.isFinite(v) ? v : null);

/** The contract's `restraint` object (docs/json-output.md), with extensions after the contract keys. */
export function restraintJson(r: ColumnRestraintResult): Record<string, unknown> {
  const { study } = r;
  const required: Record<string, number | null> = {};
  for (const e of study.ends) {
    const v = study.required[e];
    required[e] = v === null || v === undefined || !Number.isFinite(v) ? null : v;
  }
  const v = r.verification;
  return {
    ends: study.ends,
    target_beta: study.target,
    required,
    method: v.method,
    verified: { method: 'is', beta: v.verifiedBeta },
    checks: v.checks.map((c) => ({
      role: c.role, factor: finite(c.factor), form_beta: finite(c.formBeta), check_beta: finite(c.checkBeta), check_method: c.checkMethod, agrees: c.agrees,
    })),
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
