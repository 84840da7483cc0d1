/**
 * The restraint justification for a column: FORM β as the mean rotational stiffness of the studied
 * ends is multiplied by one common factor (docs/json-output.md `restraint`), the least stiffness that
 * reaches the target, and a sentence a reviewer can read. With survived loads every β of the study
 * is the one given the survival (docs/evidence.md §8), as in the verdict of `assess`.
 */
import { buildColumnModel, type AxisName } from '../limitState/columnModel.js';
import { endsAbout, endsPath, scaleScalar, withEndStiffness, withScalar } from '../limitState/scenarioEdits.js';
import { classifyEnds, type EndClassification } from '../limitState/connectionResponse.js';
import { criticalLoad } from '../mechanics/criticalLoad.js';
import { fixityFactor } from '../mechanics/restraint.js';
import { makeDistribution } from '../probability/makeDistribution.js';
import { formatQuantity, type UnitSystem } from '../report/displayUnits.js';
import { InputError } from '../scenario/inputError.js';
import type { Scalar, Scenario } from '../scenario/types.js';
import { flexibleComponents, scaledComponents, seriesComponentPath, seriesStiffnessAtMeans } from '../scenario/seriesEnd.js';
import { findRootBracketed } from '../probability/rootBracketed.js';
import { scenarioAlphas, scenarioForm, scenarioFormChecked, scenarioSorm, type BetaPoint, type CheckedBetaPoint } from './columnForm.js';
import { restraintStudy, type RestraintStudyInput, type RestraintStudyResult } from './restraintStudy.js';
import { EQUIVALENT_K_LABEL, restraintSentence, type ShortfallFacts } from './restraintSentence.js';
import { designAlpha, endRequirement, type DesignAlphaChoice, type EndRequirement } from './restraintRequirement.js';
import { restraintMaps, restraintMapsJson, type RestraintMaps } from './restraintMaps.js';
import { requirePossibleSurvival, survivalForm, survivalFormChecked, survivalGoverningBeta } from './survivalForm.js';

export type EndChoice = 'bottom' | 'top' | 'both';
type EndName = 'bottom' | 'top';

/** The principal axis whose ends a study varies, and the other axis's own β (two-axis columns only). */
export interface RestraintAxisFacts {
  /** the axis whose ends are varied */
  axis: AxisName;
  /** 'asked' with `--axis`; 'governing' when chosen as the axis with the lower FORM β alone */
  basis: 'asked' | 'governing';
  /** FORM β of each axis alone at the assessed stiffness */
  betaAlone: Record<AxisName, number>;
  /** the other axis: its β alone does not depend on the varied ends, so it is its β at the requirement too */
  other: { axis: AxisName; beta: number; pf: number; capsTarget: boolean };
  /** joint classes of the ends about the studied axis (EN 1993-1-8 §5.2.2.5) */
  jointClasses: EndClassification[];
}

export interface ColumnRestraintResult {
  study: RestraintStudyResult;
  /** the axis studied; absent for a one-axis column (its ends are the only ones) */
  axis?: RestraintAxisFacts;
  /** base (factor 1) stiffness of each studied end: the scenario's spring, or EI/L for an end given otherwise */
  base: Record<string, Scalar>;
  /** fixity factor and K at the required stiffness (means); null where not reached */
  fixityAtRequired: Record<string, number | null>;
  kAtRequired: number | null;
  /** K with each studied spring at its 5 % fractile when its mean is the required one */
  kAtCharacteristic: number | null;
  /**
   * The reliability-equivalent K: K of the column whose studied springs are known exactly (no
   * scatter) and just reach the target β. Not a partial-factor code check. null when even rigid
   * ends fall short, or when it would contradict the verdict at the assessed stiffness.
   */
  kDeterministic: number | null;
  /** K with every studied end at its EN 1990 Annex C design stiffness */
  kDesign: number | null;
  /** K at the means as assessed */
  kAssessed: number;
  /** per studied end: mean, CoV, 5 % and design stiffness, fixity factor at the mean (null unless reached) */
  requirement: Record<string, EndRequirement & { fixityFactor: number }> | null;
  /** the method that solved for the requirement */
  method: RestraintMethod;
  /** the assessment at the reported stiffness (null without an assessor or a finite requirement) */
  confirmation: RestraintConfirmation | null;
  /** when even rigid ends fall short: the loads at which the target is met */
  shortfall: ShortfallFacts | null;
  /** contour map over both ends and the required stiffness against its CoV (absent when not asked) */
  maps?: RestraintMaps;
  /** How the requirement's β was established and checked. */
  verification: RestraintVerification;
  /**
   * Present when the scenario has survived loads: every β of the study is given the survival
   * (conditional FORM, checked by conditional importance sampling), with the stiffness edited in
   * both the failure and the survival margin.
   */
  survival?: RestraintSurvivalFacts;
  sentence: string;
  notes: string[];
}

/** What the study conditioned on, and the assessed β without it. */
export interface RestraintSurvivalFacts {
  /** the evidence entries of the survived loads (e.g. `evidence[2]`) */
  paths: string[];
  /** FORM β at the assessed stiffness without the survived loads, for comparison */
  formBetaWithout: number;
  /** P(the column carries the survived load) by FORM, beforehand, at the reported requirement (null: none reached) */
  pSurvivalAtRequired: number | null;
  /** the largest stiffness factor studied at which the column could not have carried the survived load (β taken as −∞); null: none */
  impossibleUpTo: number | null;
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
  /** 'form' when FORM's β agreed with its check at every deciding point; 'is' when the study was redone with the check's estimates; the chosen method with `--method`. */
  method: 'form' | 'sorm' | 'is';
  checks: RestraintCheckPoint[];
  /** The check's β at the reported requirement (null when there is no finite requirement). */
  verifiedBeta: number | null;
}


/** A β with its sampling check: the unconditional one (columnForm.ts) or the one given survived loads (survivalForm.ts). */
export interface RestraintCheckedPoint extends BetaPoint {
  check?: { agrees: boolean; method: string };
  checkBeta: number;
  checkPf: number;
  /** why there is no check (default: nothing random) */
  noCheck?: string;
}

/** FORM β and its sampling check at one factor of a study. */
export interface RestraintEvaluators {
  form: (factor: number) => BetaPoint;
  checked: (factor: number) => RestraintCheckedPoint | CheckedBetaPoint;
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
    const none = ('noCheck' in p && p.noCheck) || 'none (nothing random)';
    return { role, factor, formBeta: p.beta, checkBeta: p.checkBeta, checkMethod: p.check?.method ?? none, agrees };
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

/**
 * Conditional FORM and its conditional importance-sampling check at each factor (survived loads).
 * `impossible` collects the factors at which the survival could not have happened.
 */
function survivalEvaluators(build: (factor: number) => Scenario, seed: number, impossible: Set<number>): RestraintEvaluators {
  const seen = <T extends { impossible: boolean }>(f: number, p: T): T => {
    if (p.impossible) impossible.add(f);
    return p;
  };
  return { form: (f) => seen(f, survivalForm(build(f))), checked: (f) => seen(f, survivalFormChecked(build(f), seed)) };
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

function verificationSentence(v: RestraintVerification, conditioned = false): string {
  const bad = v.checks.filter((c) => !c.agrees);
  const given = conditioned ? ` ${GIVEN_SURVIVAL}` : '';
  if (v.method === 'form') {
    if (!conditioned) return `FORM's β was confirmed by a sampling check at ${v.checks.map((c) => roleText(c)).join(' and ')}.`;
    // given survived loads a point may have no check at all (no sample survived the load there)
    const checked = v.checks.filter((c) => !c.checkMethod.startsWith('none'));
    const unchecked = v.checks.filter((c) => c.checkMethod.startsWith('none'));
    const confirmed = checked.length ? `FORM's β${given} was confirmed by a sampling check of the same conditional probability at ${checked.map((c) => roleText(c)).join(' and ')}.` : '';
    const open = unchecked.length ? `${confirmed ? ' ' : ''}At ${unchecked.map((c) => `${roleText(c)} (${c.checkMethod})`).join(' and ')} FORM's β${given} stands unchecked.` : '';
    return confirmed + open;
  }
  const where = bad.map((c) => `${roleText(c)} (FORM β ${c.formBeta.toFixed(2)}, check ${c.checkBeta.toFixed(2)})`).join(' and ');
  return `FORM${given} disagreed with its sampling check at ${where}, so the requirement could not be established by FORM: the study above uses the check's ${conditioned ? 'estimate' : 'importance-sampling β'} at every point (common random numbers).`;
}

function roleText(c: RestraintCheckPoint): string {
  return c.role === 'required' ? 'the requirement' : c.role === 'assessed' ? 'the assessed stiffness' : c.role === 'pinned' ? 'pinned ends' : 'rigid ends';
}

/** The ends the study varies (about `axis`): the requested ones, else every end given as a rotational spring. */
export function studiedEnds(s: Scenario, choice?: EndChoice, axis: AxisName = 'y'): EndName[] {
  if (choice) return choice === 'both' ? ['bottom', 'top'] : [choice];
  const ends = endsAbout(s, axis);
  return (['bottom', 'top'] as const).filter((e) => ends[e].type === 'rotation' || ends[e].type === 'series');
}

/**
 * The axis a restraint study varies: the one asked for, else (two axes) the one with the lower FORM β
 * alone, y on a tie. The column's β is min over its axes, so the study must vary the governing one.
 */
export interface AxisChoice {
  axis: AxisName;
  basis: 'asked' | 'governing';
  /** FORM β of each axis alone; null for a one-axis column */
  betaAlone: Record<AxisName, number> | null;
}

export function restraintAxis(s: Scenario, asked?: AxisName): AxisChoice {
  if (s.column.axisZ === undefined) {
    if (asked === 'z') throw new InputError('--axis', "expected y: this column has one axis (no column.axis_z), so its ends are column.ends, about y");
    return { axis: 'y', basis: asked ? 'asked' : 'governing', betaAlone: null };
  }
  const betaAlone = { y: scenarioForm(s, 'y').beta, z: scenarioForm(s, 'z').beta };
  if (asked) return { axis: asked, basis: 'asked', betaAlone };
  return { axis: betaAlone.z < betaAlone.y ? 'z' : 'y', basis: 'governing', betaAlone };
}

function meanValue(v: Scalar): number {
  return v.kind === 'fixed' ? v.value : makeDistribution(v.spec).mean;
}

/** The column's state at the means about an axis (E·I about it: I_z from the section at the mean loss). */
function stateAbout(s: Scenario, axis: AxisName) {
  const model = buildColumnModel(s);
  const about = model.axes.find((a) => a.name === axis);
  if (about === undefined) throw new Error(`the scenario has no axis ${axis}`);
  return about.state(model.mean);
}

function baseScalar(s: Scenario, end: EndName, axis: AxisName, notes: string[]): Scalar {
  const e = endsAbout(s, axis)[end];
  if (e.type === 'rotation' && meanValue(e.k) > 0) return e.k;
  if (e.type === 'series' && seriesStiffnessAtMeans(e) > 0) return seriesBase(e, end, notes);
  const st = stateAbout(s, axis);
  const EI = st.E * st.I;
  // a factor times zero stays zero: an end with no stiffness (or an infinite one) is scaled from EI/L
  const R = e.type === 'ratio' && e.R > 0 && Number.isFinite(e.R) ? e.R : 1;
  const k = (R * EI) / st.L;
  const given = e.type === 'ratio' ? `a ${e.from === 'fixity' ? 'fixity factor' : 'alignment-chart G'}` : e.type === 'rotation' ? 'a spring of zero stiffness' : e.type;
  const ei = axis === 'z' ? 'EI_z' : 'EI';
  notes.push(
    `the ${end} end${axis === 'z' ? ' about z' : ''} is given as ${given}; ` +
      `the study treats it as a rotational spring of fixed stiffness ${R === 1 ? `${ei}/L` : `R·${ei}/L`} = ${(k / 1e3).toPrecision(3)} kN·m/rad times the factor`,
  );
  return { kind: 'fixed', value: k };
}

/**
 * A series end is studied through one variable: its `connection` component when it has one (the
 * flexibility a reviewer argues about; the others stay as given), else all components scaled by one
 * factor, the requirement then being the effective stiffness 1/Σ(1/k_i) at the means.
 */
function seriesBase(e: Extract<Scenario['column']['ends']['bottom'], { type: 'series' }>, end: EndName, notes: string[]): Scalar {
  const scaled = scaledComponents(e);
  const others = flexibleComponents(e.components).map((c) => c.name).filter((n) => !scaled.includes(n));
  const single = scaled.length === 1 ? flexibleComponents(e.components).find((c) => c.name === scaled[0]) : undefined;
  if (scaled.length === 1 && scaled[0] === 'connection') {
    notes.push(
      `the ${end} end is springs in series; the study scales only its connection component${others.length ? ` (${listText(others)} kept as given)` : ''}, so the requirement is the connection's own stiffness and rigid means a rigid connection`,
    );
    return single!.k;
  }
  if (single) return single.k;
  notes.push(
    `the ${end} end is springs in series with no component named connection; the study scales every component (${listText(scaled)}) by one factor, so the requirement is the effective stiffness 1/Σ(1/k_i) with every component at its mean`,
  );
  return { kind: 'fixed', value: seriesStiffnessAtMeans(e) };
}

function listText(names: readonly string[]): string {
  return names.length <= 1 ? names.join('') : `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`;
}

/** The contract path of the variable a study scales at this end (a path no variable has when several are scaled). */
function studiedVariable(s: Scenario, end: EndName, axis: AxisName): string {
  const e = endsAbout(s, axis)[end];
  const path = `${endsPath(axis)}.${end}`;
  if (e.type !== 'series') return `${path}.rotation`;
  const scaled = scaledComponents(e);
  return scaled.length === 1 ? seriesComponentPath(path, scaled[0]) : `${path}.series`;
}

function ratioOfEnd(s: Scenario, end: EndName, axis: AxisName): number {
  return stateAbout(s, axis).r[end];
}

function ratioAt(s: Scenario, k: number, axis: AxisName): number {
  const st = stateAbout(s, axis);
  return k === Infinity ? Infinity : (k * st.L) / (st.E * st.I);
}

export type RestraintMethod = 'form' | 'sorm' | 'is';

/** The governing β of an assessment (as `stanchion assess` decides it) of a scenario. */
export interface GoverningBeta {
  method: string;
  beta: number;
}
export type GoverningAssessor = (s: Scenario) => Promise<GoverningBeta>;

export interface ColumnRestraintOptions {
  end?: EndChoice;
  /** the principal axis whose ends are varied (default: the one with the lower β alone; y for one axis) */
  axis?: AxisName;
  /** the axis already chosen by `restraintAxis` for these options (saves its two FORM analyses) */
  axisChoice?: AxisChoice;
  units?: UnitSystem;
  /** the method that solves for the requirement; default: FORM, or its importance-sampling check where they disagree */
  method?: RestraintMethod;
  /** α of the design stiffness: FORM's own (default) or the EN 1990 Annex C standard reading */
  designAlpha?: DesignAlphaChoice;
  /** assess a scenario with the governing method: confirms (and if need be raises) the requirement */
  governing?: GoverningAssessor;
  /** the contour map and the required-stiffness-against-CoV curve (default true) */
  maps?: boolean;
}

/** How `stanchion assess` confirmed the reported requirement. */
export interface RestraintConfirmation {
  /** governing method of the assessment at the reported stiffness */
  method: string;
  beta: number;
  /** the method's own root factor, before any raise */
  rootFactor: number;
  /** reported factor / root factor (1 when not raised) */
  raisedBy: number;
  confirmed: boolean;
}

const MAX_RAISES = 8;
/** β short of the target by less than this is the root solve's own rounding, not a shortfall (a root by the governing method itself). */
const ROOT_BETA_SLACK = 1e-6;
/** the largest single raise, in ln(factor): ×4 */
const MAX_RAISE_STEP = Math.log(4);

/**
 * Assess at the method's root; while the governing β falls short of the target, raise the factor
 * by the shortfall over the local slope dβ/d ln(factor) of the study curve (at least 1 %).
 */
export async function confirmRequirement(
  study: RestraintStudyResult,
  edited: (f: number) => Scenario,
  governing: GoverningAssessor,
): Promise<RestraintConfirmation> {
  const root = study.requiredFactor as number;
  const pts = study.curve.filter((p) => p.ideal === undefined && p.factor > 0);
  const below = pts.filter((p) => p.factor < root * 0.999).pop();
  const above = pts.find((p) => p.factor > root * 1.001);
  const slope = below && above ? (above.beta - below.beta) / Math.log(above.factor / below.factor) : 0;
  let f = root;
  let g = await governing(edited(f));
  let previous: { lnF: number; beta: number } | null = null;
  for (let k = 0; k < MAX_RAISES && g.beta < study.target - ROOT_BETA_SLACK; k++) {
    // from the second raise on, the governing method's own slope (secant) where it is flatter than
    // the study curve's: near a cap set by the other axis the governing β rises ever more slowly
    const secant = previous === null ? 0 : (g.beta - previous.beta) / (Math.log(f) - previous.lnF);
    const s = secant > 1e-3 && secant < slope ? secant : slope;
    // a β of ±∞ on either side (a survival impossible below some stiffness) makes the slope or the
    // shortfall infinite: then the plain 10 % raise, never ∞/∞ = NaN
    const raw = s > 1e-3 ? Math.min(Math.max((study.target - g.beta) / s + 0.002 / s, 0.01), MAX_RAISE_STEP) : 0.1;
    const step = Number.isFinite(raw) ? raw : 0.1;
    previous = { lnF: Math.log(f), beta: g.beta };
    f *= Math.exp(step);
    g = await governing(edited(f));
  }
  return { method: g.method, beta: g.beta, rootFactor: root, raisedBy: f / root, confirmed: g.beta >= study.target - ROOT_BETA_SLACK };
}

export async function columnRestraint(s: Scenario, opts: ColumnRestraintOptions = {}): Promise<ColumnRestraintResult> {
  const chosen = opts.axisChoice ?? restraintAxis(s, opts.axis);
  const axis = chosen.axis;
  const ends = studiedEnds(s, opts.end, axis);
  if (ends.length === 0) {
    const where = s.column.axisZ === undefined ? '' : ` about ${axis} (${endsPath(axis)})`;
    throw new InputError(
      '--end',
      `no end of this column${where} is given as a rotational spring ({rotation: ...}); choose the end to study with --end bottom|top|both${s.column.axisZ === undefined ? '' : ' or the axis with --axis y|z'}`,
    );
  }
  // survived loads: every β below is the one given the survival (docs/evidence.md §8)
  const conditioned = (s.survivedLoads?.length ?? 0) > 0;
  if (conditioned) {
    if (opts.method === 'sorm') throw new InputError('--method', 'expected form or is: this scenario has survived loads, and β given the survival is computed by FORM (two margins) or importance sampling, not by SORM');
    requirePossibleSurvival(s);
  }
  // factors of the study (not of the known-stiffness variant) at which the survival could not have happened
  const impossible = new Set<number>();
  const notes: string[] = [];
  const base: Record<string, Scalar> = {};
  for (const e of ends) base[e] = baseScalar(s, e, axis, notes);
  /** The scenario with every studied end at factor × its base stiffness (random or known exactly). */
  const edited = (factor: number, bases: Record<string, Scalar> = base): Scenario => {
    let t = s;
    for (const e of ends) t = withEndStiffness(t, e, bases[e], factor, axis);
    return t;
  };
  const baseStiffness: Record<string, number> = {};
  for (const e of ends) baseStiffness[e] = meanValue(base[e]);
  const seed = s.analysis.seed ?? 1;
  const target = s.targetBeta;
  // given survived loads β need not rise with the stiffness: the requirement is the crossing above which it stays reached
  const crossing = conditioned ? { crossing: 'last' as const } : {};

  const solve = (build: (f: number) => Scenario, seen = impossible) => {
    const evaluate = conditioned ? survivalEvaluators(build, seed, seen) : scenarioEvaluators(build, seed);
    if (!opts.method) return verifiedRestraintStudy(evaluate, { baseStiffness, target, ...crossing });
    const betaAt = methodEvaluator(opts.method, build, seed, conditioned);
    const study = restraintStudy({ baseStiffness, target, betaAtFactor: betaAt, ...crossing });
    return { study, verification: { method: opts.method, checks: [], verifiedBeta: null } as RestraintVerification };
  };
  const solved = solve((f) => edited(f));
  let study = solved.study;
  const verification = solved.verification;
  // the verdict's own rule given the survived loads replaces the unconditional assessment
  const governing: GoverningAssessor | undefined = opts.governing && conditioned
    ? async (t) => survivalGoverningBeta(t, seed)
    : opts.governing;

  let confirmation: RestraintConfirmation | null = null;
  if (governing && study.outcome === 'reached' && study.requiredFactor !== null) {
    confirmation = await confirmRequirement(study, (f) => edited(f), governing);
    if (confirmation.raisedBy !== 1) {
      const f = confirmation.rootFactor * confirmation.raisedBy;
      const required = Object.fromEntries(ends.map((e) => [e, f * baseStiffness[e]]));
      study = { ...study, requiredFactor: f, required };
    }
    if (!confirmation.confirmed) {
      notes.push(`the assessment with the governing method (${confirmation.method}) still gives β = ${confirmation.beta.toFixed(2)} at the reported stiffness after ${MAX_RAISES} raises; treat the requirement as not established`);
    }
  }

  /** K about the studied axis at the means */
  const kWith = (t: Scenario): number => {
    const st = stateAbout(t, axis);
    return criticalLoad(st.E * st.I, st.L, st.frame, st.r).K;
  };
  /** K with the studied ends known exactly at these stiffnesses (Infinity: rigid). */
  const kAtStiffness = (stiff: Record<string, number>): number => {
    let t = s;
    for (const e of ends) {
      const k = stiff[e];
      t = withEndStiffness(t, e, { kind: 'fixed', value: k === Infinity ? 1 : k }, k === Infinity ? Infinity : 1, axis);
    }
    return kWith(t);
  };
  const f = study.requiredFactor;
  const reached = study.outcome === 'reached' && f !== null && Number.isFinite(f) && f > 0;
  const fixityAtRequired: Record<string, number | null> = {};
  for (const e of ends) {
    // a series end: R of the whole end (its other components included), at the means
    const R = endsAbout(s, axis)[e].type === 'series' ? (reached ? ratioOfEnd(edited(f as number), e, axis) : 0) : ratioAt(s, (baseStiffness[e] ?? 0) * (f as number), axis);
    fixityAtRequired[e] = reached ? fixityFactor(R) : null;
  }
  const kAtRequired = reached ? kWith(edited(f as number)) : null;

  let requirement: ColumnRestraintResult['requirement'] = null;
  let kDesign: number | null = null;
  let kAtCharacteristic: number | null = null;
  if (reached) {
    const at = edited(f as number);
    const { names, alpha } = scenarioAlphas(at);
    requirement = {};
    for (const e of ends) {
      const a = designAlpha(alpha, names.indexOf(studiedVariable(s, e, axis)), opts.designAlpha ?? 'form');
      const q = endRequirement(base[e], f as number, target, a);
      requirement[e] = { ...q, fixityFactor: fixityAtRequired[e] as number };
    }
    kDesign = kAtStiffness(Object.fromEntries(ends.map((e) => [e, requirement![e].design])));
    kAtCharacteristic = kAtStiffness(Object.fromEntries(ends.map((e) => [e, requirement![e].characteristic])));
  }

  // the same study with the studied springs known exactly: the reliability-equivalent K
  const fixedBase: Record<string, Scalar> = {};
  for (const e of ends) fixedBase[e] = { kind: 'fixed', value: baseStiffness[e] };
  // known exactly, a stiffness too low to carry the survived load is simply refuted: not noted
  const exact = solve((fct) => edited(fct, fixedBase), new Set<number>());
  if (exact.verification.method === 'is' && !opts.method) {
    notes.push('with the connections known exactly, FORM disagreed with its sampling check; that K comes from importance sampling');
  }
  let kDeterministic = exact.study.requiredFactor === null ? null : kWith(edited(exact.study.requiredFactor, fixedBase));
  // never print a K that contradicts the verdict at the assessed stiffness
  const kAssessed = kWith(s);
  const assessed = governing ? await governing(s) : null;
  const assessedBeta = assessed ? assessed.beta : study.curve.find((p) => p.factor === 1)?.beta ?? NaN;
  if (kDeterministic !== null && Number.isFinite(kDeterministic) && Number.isFinite(assessedBeta)) {
    const meets = assessedBeta >= target;
    if (meets !== kAssessed <= kDeterministic + 1e-9) {
      notes.push(
        `the K at which β reaches the target with the stiffness known exactly is not given: it would ${meets ? 'fail' : 'pass'} the column as assessed (K = ${kAssessed.toFixed(2)} at the means), which ${meets ? 'meets' : 'does not meet'} the target (β = ${assessedBeta.toFixed(2)})`,
      );
      kDeterministic = null;
    }
  }
  if (kDeterministic !== null && !Number.isFinite(kDeterministic)) kDeterministic = null;

  let shortfall: ShortfallFacts | undefined;
  if (study.outcome === 'unreachable') shortfall = loadsForTarget(edited(Infinity), target, opts.method ?? verification.method, seed, conditioned);

  const system = opts.units ?? s.displayUnits;
  const wording = { formatStiffness: (k: number) => formatQuantity(k, 'rotationalStiffness', system), ...(conditioned ? { condition: GIVEN_SURVIVAL } : {}) };
  const facts = reached && requirement && kAtRequired !== null && kDesign !== null
    ? { reached: { requirement, k: kAtRequired, kDesign, factor: f as number } }
    : { shortfall };
  // two axes: the column's β is that of min over both, so the other axis alone bounds it from above
  let axisFacts: RestraintAxisFacts | undefined;
  if (s.column.axisZ !== undefined && chosen.betaAlone !== null) {
    const otherName: AxisName = axis === 'y' ? 'z' : 'y';
    const other = scenarioForm(s, otherName);
    axisFacts = {
      axis,
      basis: chosen.basis,
      betaAlone: chosen.betaAlone,
      other: { axis: otherName, beta: other.beta, pf: other.pf, capsTarget: other.beta < target },
      jointClasses: classifyEnds(buildColumnModel(s), axis),
    };
  }
  const parts = [...(axisFacts ? [axisLead(axisFacts, ends)] : []), restraintSentence(study, wording, facts)];
  if (axisFacts) parts.push(otherAxisSentence(axisFacts, target));
  if (kDeterministic !== null) parts.push(`${EQUIVALENT_K_LABEL}: ${kDeterministic.toFixed(2)}.`);
  parts.push(opts.method ? methodSentence(opts.method, confirmation, conditioned) : `${verificationSentence(verification, conditioned)}${confirmation ? ` ${confirmationSentence(confirmation, conditioned)}` : ''}`);
  const sentence = parts.join(' ');

  const maps = opts.maps === false
    ? undefined
    : restraintMaps(s, { ends, base, edited, target, required: reached ? study.required as Record<string, number> : null, axis, ...(conditioned ? { betaOf: survivalForm, ...crossing } : {}) });
  let survival: RestraintSurvivalFacts | undefined;
  if (conditioned) {
    const refuted = [...impossible].filter((x) => Number.isFinite(x));
    survival = {
      paths: s.survivedLoads!.map((l) => l.path),
      formBetaWithout: scenarioForm(s).beta,
      pSurvivalAtRequired: reached ? survivalForm(edited(study.requiredFactor as number)).pSurvival : null,
      impossibleUpTo: refuted.length ? Math.max(...refuted) : null,
    };
    notes.push(...survivalNotes(survival, reached, axisFacts !== undefined));
    const early = reached ? study.curve.filter((p) => p.factor > 0 && p.factor < (f as number) && p.beta >= target) : [];
    if (early.length > 0) {
      notes.push(
        `β given the survived loads also reaches the target at some lower stiffnesses (${early.length === 1 ? 'one point' : `${early.length} points`} of the curve, up to ${wording.formatStiffness(Math.max(...early.map((p) => p.factor)) * (baseStiffness[ends[0]] ?? 0))} at the ${ends[0]} connection): there the survival was unlikely and so proves much; the requirement is the stiffness above which β stays at the target`,
      );
    }
  }
  return {
    study, ...(axisFacts ? { axis: axisFacts } : {}), base, fixityAtRequired, kAtRequired, kAtCharacteristic, kDeterministic, kDesign, kAssessed, requirement,
    method: opts.method ?? verification.method, confirmation, shortfall: shortfall ?? null, verification, ...(survival ? { survival } : {}), sentence, notes, maps,
  };
}

/** The phrase every conditioned sentence carries. */
const GIVEN_SURVIVAL = 'given the survived loads';

/** What the conditioned study leaves unconditioned, and where the survival could not have happened. */
function survivalNotes(f: RestraintSurvivalFacts, reached: boolean, twoAxes: boolean): string[] {
  const out = [
    `every β of this study is given the survived loads (${listText(f.paths)}), with the studied stiffness changed in the column that carried them as well; without them FORM gives β = ${f.formBetaWithout.toFixed(2)} at the assessed stiffness`,
  ];
  // a small value says the survival, not the stiffness, carries the reliability there: that stiffness is hardly consistent with the survival
  if (f.pSurvivalAtRequired !== null) out.push(`with the reported stiffness the column would have carried the survived load with probability ${f.pSurvivalAtRequired.toPrecision(2)} (FORM, before knowing it did)`);
  if (reached) out.push("the design stiffness's α is FORM's α of the failure margin alone (before the survival): the design-value method has no α for a conditional probability");
  if (twoAxes) out.push('the choice of axis and the other axis\'s own β are without the survived loads');
  if (f.impossibleUpTo !== null) {
    const where = f.impossibleUpTo === 0 ? 'with pinned ends' : `at ${f.impossibleUpTo.toPrecision(3)} times the stiffness assumed and below`;
    out.push(`${where} the column could not have carried the survived load (its survival has probability zero there), so such a stiffness is refuted by it; β is taken as −∞ there`);
  }
  return out;
}

/** How far above the target the other axis's own β must be before its mode stops adding to the column's pf (in β). */
const CLOSE_MARGIN = 0.5;

/** Which axis the requirement is about, and why that one. */
function axisLead(a: RestraintAxisFacts, ends: readonly EndName[]): string {
  const why = a.basis === 'asked'
    ? 'as asked'
    : `the governing axis: alone, axis y has β = ${a.betaAlone.y.toFixed(2)} and axis z β = ${a.betaAlone.z.toFixed(2)}`;
  return `The requirement is about axis ${a.axis} (${why}): the ${listText([...ends])} ${ends.length > 1 ? 'ends' : 'end'} about ${a.axis} (${endsPath(a.axis)}) ${ends.length > 1 ? 'are' : 'is'} varied, the ends about ${a.other.axis} stay as given, and β is the whole column's (it fails when either axis does).`;
}

/** The other axis's own β, and whether it alone keeps the column below the target. */
function otherAxisSentence(a: RestraintAxisFacts, target: number): string {
  const o = a.other;
  if (o.capsTarget) {
    return `No stiffness about ${a.axis} reaches the target because axis ${o.axis} alone has β = ${o.beta.toFixed(2)} < ${target.toFixed(2)}: the ${o.axis} restraint, the load or the column itself must change.`;
  }
  // close above the target, both axes fail with similar probability near the requirement: their series system needs more
  const close = o.beta - target < CLOSE_MARGIN
    ? ` Being close to it, near the requirement both axes fail with similar probability and the column's β stays below either axis's own, so more stiffness is needed than axis ${a.axis} alone would need (and FORM's design point may lie on axis ${o.axis}).`
    : '';
  return `Axis ${o.axis} alone has β = ${o.beta.toFixed(2)} whatever the stiffness about ${a.axis} (its own ends as given), above the target ${target.toFixed(2)}.${close}`;
}

/**
 * β of a scenario by the chosen method; IS is the self-check's importance sampling with one seed at
 * every factor (common random numbers). `conditioned`: given the survived loads (no SORM there).
 */
function methodEvaluator(method: RestraintMethod, build: (f: number) => Scenario, seed: number, conditioned = false): (f: number) => BetaPoint {
  if (conditioned) {
    if (method === 'form') return (f) => survivalForm(build(f));
    return (f) => {
      const p = survivalFormChecked(build(f), seed);
      return { beta: p.checkBeta, pf: p.checkPf, converged: p.converged };
    };
  }
  if (method === 'form') return (f) => scenarioForm(build(f));
  if (method === 'sorm') return (f) => scenarioSorm(build(f));
  return (f) => {
    const p = scenarioFormChecked(build(f), seed);
    return { beta: p.checkBeta, pf: p.checkPf, converged: p.converged };
  };
}

/** The load factor at which the target is met with the studied ends rigid (bisection-safe root in ln λ). */
function loadsForTarget(rigid: Scenario, target: number, method: RestraintMethod, seed: number, conditioned: boolean): ShortfallFacts {
  const scaled = (lambda: number): Scenario => {
    let t = rigid;
    for (const l of rigid.loads) t = withScalar(t, l.path, scaleScalar(l.value, lambda));
    return t;
  };
  const model = buildColumnModel(rigid);
  const utilizationRigid = model.utilization(model.mean);
  const betaAt = methodEvaluator(method, scaled, seed, conditioned);
  const lo = Math.log(0.01);
  if (!(betaAt(Math.exp(lo)).beta >= target)) return { loadFactor: null, utilizationRigid };
  const root = findRootBracketed((t) => betaAt(Math.exp(t)).beta - target, lo, 0, { xTolerance: 1e-4 });
  return { loadFactor: Math.exp(root), utilizationRigid };
}

const METHOD_LABEL: Record<string, string> = { form: 'FORM', sorm: 'SORM', is: 'importance sampling', mc: 'Monte Carlo', subset: 'subset simulation' };

function confirmationSentence(c: RestraintConfirmation, conditioned = false): string {
  const label = METHOD_LABEL[c.method] ?? c.method;
  const pct = (c.raisedBy - 1) * 100;
  const raised = c.raisedBy > 1 ? ` after the requirement was raised ${pct >= 10 ? pct.toFixed(0) : pct.toPrecision(2)} % above the root, because at the root it fell short` : '';
  return `Assessed at the reported stiffness, the governing method (${label}) gives β = ${c.beta.toFixed(2)}${conditioned ? ` ${GIVEN_SURVIVAL}` : ''}${raised}.`;
}

function methodSentence(method: RestraintMethod, c: RestraintConfirmation | null, conditioned = false): string {
  const how = conditioned ? `${METHOD_LABEL[method]} ${GIVEN_SURVIVAL}` : METHOD_LABEL[method];
  return `The requirement was solved with ${how}${method === 'is' ? ' (one seed at every stiffness: common random numbers)' : ''}.${c ? ` ${confirmationSentence(c, conditioned)}` : ''}`;
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
    method: r.method,
    verified: r.confirmation
      ? { method: r.confirmation.method, beta: finite(r.confirmation.beta), confirmed: r.confirmation.confirmed, root_factor: r.confirmation.rootFactor, raised_by: r.confirmation.raisedBy }
      : { method: 'is', beta: v.verifiedBeta },
    requirement: r.requirement
      ? Object.fromEntries(Object.entries(r.requirement).map(([e, q]) => [e, {
          mean: q.mean, cov: q.cov, characteristic: q.characteristic, design: q.design,
          effective_length_factor: r.kAtRequired, effective_length_factor_design: r.kDesign,
          fixity_factor: q.fixityFactor, alpha: q.alpha, alpha_basis: q.alphaBasis, design_fractile: q.designFractile,
        }]))
      : null,
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
    effective_length_factor_design: r.kDesign,
    effective_length_factor_assessed: r.kAssessed,
    shortfall: r.shortfall ? { load_factor: r.shortfall.loadFactor, utilization_rigid: r.shortfall.utilizationRigid } : null,
    // two axes only: a one-axis column's JSON is as before
    ...(r.axis ? {
      axis: r.axis.axis,
      axis_basis: r.axis.basis,
      axis_beta_alone: { y: finite(r.axis.betaAlone.y), z: finite(r.axis.betaAlone.z) },
      other_axis: { axis: r.axis.other.axis, beta: finite(r.axis.other.beta), pf: r.axis.other.pf, caps_target: r.axis.other.capsTarget },
    } : {}),
    ...(r.maps ? { maps: restraintMapsJson(r.maps) } : {}),
    // survived loads (docs/evidence.md §8): whether every β above is given them
    conditioned_on_survived_loads: r.survival !== undefined,
    ...(r.survival ? {
      survived_loads: r.survival.paths,
      form_beta_assessed_without_survived_loads: finite(r.survival.formBetaWithout),
      survival_probability_at_required: r.survival.pSurvivalAtRequired,
    } : {}),
    sentence: r.sentence,
    notes: r.notes,
  };
}
