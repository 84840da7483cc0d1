/**
 * The shape-checked file → Scenario: units to SI, random variables checked, cross-field rules
 * (lateral only when sway, no mechanism, bow for first-yield, correlation names).
 */
import { readCorrelation } from './readCorrelation.js';
import { readEnds, type RawEnds } from './readEnds.js';
import { readMeasurements } from './readMeasurements.js';
import { fail, readScalar, type ReadContext } from './readScalar.js';
import { PURE_NUMBER_UNIT, readQuantity, type DisplayUnit } from './quantity.js';
import { ExpressionError } from './quantityExpression.js';
import type { RawScalar, ScenarioShape } from './scenarioShape.js';
import type { AxisZ, EvidenceRecord, Load, LoadBasis, Method, Scalar, Scenario, StrengthModel, Target } from './types.js';
import { readSection } from './readSection.js';
import { readStructureEvidence } from './readStructureEvidence.js';
import { readTestPlans } from './readTestPlans.js';
import { parsePeriod } from './readPeriod.js';
import { betaOverPeriods } from '../probability/logProbability.js';
import type { PathSegment } from './rawTree.js';
import { listScalars } from './variables.js';

const LOAD_NAME = /^[\p{L}_][\p{L}\p{N}_-]{0,63}$/u;
const DEFAULT_TARGET_BETA = 3.8;
const DEFAULT_REFERENCE_PERIOD_YEARS = 50;
/** Targets outside these bounds are refused; outside the inner ones they draw a warning. */
export const TARGET_BETA_LIMITS = { refuse: [0.5, 8], warn: [1.5, 5.5] } as const;

type RawLoad = ScenarioShape['loads'][string];

function periodAt(ctx: ReadContext, path: readonly PathSegment[], text: unknown): number {
  const p = parsePeriod(text);
  if ('error' in p) fail(ctx, path, p.error);
  return p.years;
}

/** The load's kind and time basis, and its value without those keys. */
function readLoadTime(raw: RawLoad, path: readonly PathSegment[], ctx: ReadContext): { value: RawScalar; kind?: Load['kind']; basis: LoadBasis } {
  if (typeof raw === 'string') return { value: raw, basis: { type: 'unstated' } };
  const { kind, maximum_over, point_in_time, renewal_period, eccentricity: _eccentricity, moments, transverse, horizontal, ...value } = raw;
  // a fixed axial force may still carry random actions (a wind load with no axial part): their distributions have a period
  const isRandom = (v: unknown) => typeof v === 'object' && v !== null && 'dist' in v;
  const randomAction = isRandom(transverse) || isRandom(horizontal) || isRandom(moments?.top) || isRandom(moments?.bottom);
  if ('value' in value && !randomAction) {
    if (maximum_over !== undefined || point_in_time !== undefined) {
      fail(ctx, [...path, maximum_over !== undefined ? 'maximum_over' : 'point_in_time'], 'applies only to a random load {dist: ...}: a fixed value has no distribution to convert to another period');
    }
    return { value: value.value, ...(kind !== undefined ? { kind } : {}), basis: { type: 'unstated' } };
  }
  const axial: RawScalar = 'value' in value ? value.value : (value as RawScalar);
  if (maximum_over !== undefined && point_in_time === true) {
    fail(ctx, [...path, 'point_in_time'], 'give either maximum_over or point_in_time: true, not both (one load has one time basis)');
  }
  if (renewal_period !== undefined && point_in_time !== true) {
    fail(ctx, [...path, 'renewal_period'], 'only applies with point_in_time: true (how often a point-in-time load takes a new value)');
  }
  let basis: LoadBasis = { type: 'unstated' };
  if (maximum_over !== undefined) basis = { type: 'maximum', years: periodAt(ctx, [...path, 'maximum_over'], maximum_over) };
  else if (point_in_time === true) {
    basis =
      renewal_period === undefined
        ? { type: 'point-in-time' }
        : { type: 'point-in-time', renewalYears: periodAt(ctx, [...path, 'renewal_period'], renewal_period) };
  }
  if (kind !== 'permanent' && basis.type === 'point-in-time' && basis.renewalYears === undefined) {
    fail(ctx, [...path, 'renewal_period'], 'is missing: a time-varying point-in-time load needs how often it takes an independent new value (e.g. renewal_period: 1 year), so that its maximum over the reference period is known');
  }
  if (kind === 'permanent' && basis.type === 'maximum') {
    fail(ctx, [...path, 'maximum_over'], 'a permanent load has no maximum over a period: drop maximum_over, or give the load another kind');
  }
  return { value: axial, ...(kind !== undefined ? { kind } : {}), basis };
}

const ZERO: Scalar = { kind: 'fixed', value: 0 };

function readBow(raw: Parameters<typeof readScalar>[0] | undefined, strength: string, length: number, path: PathSegment[], ctx: ReadContext): Scalar {
  if (raw !== undefined) return readScalar(raw, { kind: 'length', domain: 'any', columnLength: length }, path, ctx);
  if (strength === 'first-yield' || strength === 'plastic-zone' || strength.endsWith('-plus-bow')) {
    fail(ctx, path, `is required for strength ${strength}: give the bow amplitude of the initial shape, e.g. bow: L/1000`);
  }
  return ZERO;
}

/** `column.axis_z`: the ends, bow and (EN 1993-1-1) curve about the second principal axis. */
function readAxisZ(raw: NonNullable<ScenarioShape['column']['axis_z']>, frame: Scenario['column']['frame'], strength: StrengthModel, length: number, ctx: ReadContext): AxisZ {
  const ends = readEnds(raw.ends as RawEnds, frame, ctx, ['column', 'axis_z', 'ends']);
  const bow = readBow(raw.imperfection?.bow, strength, length, ['column', 'axis_z', 'imperfection', 'bow'], ctx);
  let strengthZ: StrengthModel = strength;
  if (raw.curve !== undefined) {
    if (!/^en1993-(a0|a|b|c|d)$/.test(strength)) {
      fail(ctx, ['column', 'axis_z', 'curve'], `applies with strength en1993-a0 | a | b | c | d (EN 1993-1-1 buckling curves), not with ${strength}; remove it or change the strength model`);
    }
    strengthZ = `en1993-${raw.curve}` as StrengthModel;
  }
  return { ends, bow, strength: strengthZ };
}

/**
 * A load's end eccentricities (docs/beam-column.md), or undefined when the file gives none. Every closed-form
 * strength model has a combined-action check (the equivalent-bow models: second-order analysis with their bow).
 */
function readEccentricity(raw: RawLoad, name: string, columnLength: number, ctx: ReadContext): Load['eccentricity'] {
  if (typeof raw === 'string' || raw.eccentricity === undefined) return undefined;
  const read = (end: 'top' | 'bottom'): Scalar => {
    const given = raw.eccentricity![end];
    if (given === undefined) return ZERO;
    const path = ['loads', name, 'eccentricity', end];
    return readScalar(given, { kind: 'length', domain: 'any', columnLength }, path, ctx);
  };
  return { top: read('top'), bottom: read('bottom') };
}

/** True when the value is given and is not a fixed zero. */
function nonZero(s: Scalar | undefined): boolean {
  return s !== undefined && !(s.kind === 'fixed' && s.value === 0);
}

/**
 * A load's actions besides its axial force and eccentricities (docs/beam-column.md): applied end moments,
 * a uniform line load along the height and a horizontal force at the top (sway frames only). Each is
 * fixed or random, may take either sign, and is scaled together with every load.
 */
function readActions(raw: RawLoad, name: string, shape: ScenarioShape, ctx: ReadContext): Pick<Load, 'moments' | 'transverse' | 'horizontal'> {
  if (typeof raw === 'string') return {};
  const strength = shape.strength;
  const refuse = (path: PathSegment[], scalar: Scalar, what: string): void => {
    if (!nonZero(scalar)) return;
    // the plastic-zone model loads the column by its ends only (axial force and end couples)
    if (strength === 'plastic-zone' && what !== 'applied end moments') {
      fail(ctx, path, `strength model 'plastic-zone' takes end eccentricities and end moments but not ${what}: use strength: first-yield, en1993-X or aisc360-e3, or drop it`);
    }
  };
  const out: { moments?: Load['moments']; transverse?: Scalar; horizontal?: Scalar } = {};
  if (raw.moments !== undefined) {
    const read = (end: 'top' | 'bottom'): Scalar => {
      const given = raw.moments![end];
      if (given === undefined) return ZERO;
      const path = ['loads', name, 'moments', end];
      const scalar = readScalar(given, { kind: 'moment', domain: 'any' }, path, ctx);
      refuse(path, scalar, 'applied end moments');
      return scalar;
    };
    out.moments = { top: read('top'), bottom: read('bottom') };
  }
  if (raw.transverse !== undefined) {
    const path = ['loads', name, 'transverse'];
    out.transverse = readScalar(raw.transverse, { kind: 'lineLoad', domain: 'any' }, path, ctx);
    refuse(path, out.transverse, 'a transverse load along the height');
  }
  if (raw.horizontal !== undefined) {
    const path = ['loads', name, 'horizontal'];
    out.horizontal = readScalar(raw.horizontal, { kind: 'force', domain: 'any' }, path, ctx);
    if (nonZero(out.horizontal)) {
      if (shape.column.frame !== 'sway') fail(ctx, path, 'a horizontal force at the top applies only to a sway frame (in a braced frame the bracing takes it); remove it or set frame: sway');
    }
    refuse(path, out.horizontal, 'a horizontal force at the top');
  }
  return out;
}

/** EN 1993-1-1 §5.3.2(3): φ = φ0 αh αm, φ0 = 1/200, αh = 2/√h (h in m) within [2/3, 1], αm = √(0.5(1 + 1/m)) with m = 1 column. */
export function en1993OutOfPlumb(heightM: number): number {
  const ah = Math.min(1, Math.max(2 / 3, 2 / Math.sqrt(heightM)));
  return (1 / 200) * ah * 1;
}

function readOutOfPlumb(shape: ScenarioShape, length: number, ctx: ReadContext): Scalar | undefined {
  const raw = shape.column.imperfection?.out_of_plumb;
  if (raw === undefined) return undefined;
  const path = ['column', 'imperfection', 'out_of_plumb'];
  const scalar: Scalar = raw === 'en1993' ? { kind: 'fixed', value: en1993OutOfPlumb(length) } : readScalar(raw, { kind: 'number', domain: 'any' }, path, ctx);
  if (raw === 'en1993') ctx.units['column.imperfection.out_of_plumb'] = PURE_NUMBER_UNIT;
  if (nonZero(scalar)) {
    if (shape.column.frame !== 'sway') fail(ctx, path, 'an out-of-plumb applies only to a sway frame (a braced column\'s ends do not move sideways relative to each other; its imperfection is the bow); remove it or set frame: sway');
    if (shape.strength === 'plastic-zone') {
      fail(ctx, path, `strength model 'plastic-zone' takes no out-of-plumb (its bow is affine to the first buckling mode, which includes the sway): use strength: first-yield, en1993-X or aisc360-e3, or drop it`);
    }
  }
  if (scalar.kind === 'fixed' && !(Math.abs(scalar.value) < 0.1)) fail(ctx, path, `must be a small angle in radians (|φ| < 0.1), got ${scalar.value}`);
  return scalar;
}

function readTarget(shape: ScenarioShape, referenceYears: number, ctx: ReadContext): Target {
  const t = shape.target;
  if (t !== undefined && shape.target_beta !== undefined) fail(ctx, ['target_beta'], 'give the target once: either target: {beta, ...} or target_beta, not both');
  if (t !== undefined && shape.target_source !== undefined) fail(ctx, ['target_source'], 'give the source inside target: {beta, period, source}, not also as target_source');
  const beta = t?.beta ?? shape.target_beta ?? DEFAULT_TARGET_BETA;
  const field: PathSegment[] = t !== undefined ? ['target', 'beta'] : ['target_beta'];
  const [lo, hi] = TARGET_BETA_LIMITS.refuse;
  if (!(beta >= lo && beta <= hi)) fail(ctx, field, `must be a reliability index between ${lo} and ${hi}, got ${beta}`);
  const periodYears = t?.period === undefined ? referenceYears : periodAt(ctx, ['target', 'period'], t.period);
  const betaAnnual = betaOverPeriods(beta, 1 / periodYears);
  const betaReferencePeriod = betaOverPeriods(beta, referenceYears / periodYears);
  const source = t?.source ?? shape.target_source;
  return {
    beta,
    periodYears,
    betaAnnual,
    betaReferencePeriod,
    ...(source !== undefined ? { source } : {}),
    ...(t?.consequence_class !== undefined ? { consequenceClass: t.consequence_class } : {}),
  };
}

export interface Provenance {
  readonly fileName: string;
  readonly format: 'yaml' | 'json';
  readonly sha256: string;
}

export function buildScenario(shape: ScenarioShape, lines: ReadonlyMap<string, number>, provenance: Provenance): Scenario {
  const units: Record<string, DisplayUnit> = {};
  const sources: Record<string, string> = {};
  const evidence: Record<string, EvidenceRecord> = {};
  const ctx: ReadContext = { lines, units, sources, evidence };
  const c = shape.column;
  const frame = c.frame;

  if (typeof c.length !== 'string') {
    fail(ctx, ['column', 'length'], 'must be a fixed quantity (e.g. 4.2 m), not a random variable: the length defines the model geometry and L in expressions; put the uncertainty in the ends, the bow or the loads');
  }
  let length: number;
  try {
    const q = readQuantity(c.length, 'length');
    length = q.value;
    units['column.length'] = q.display;
  } catch (e) {
    if (e instanceof ExpressionError) fail(ctx, ['column', 'length'], e.message);
    throw e;
  }
  if (!(length > 0)) fail(ctx, ['column', 'length'], `must be greater than zero, got ${c.length}`);

  const positive = (kind: Parameters<typeof readScalar>[1]['kind']) => ({ kind, domain: 'positive' as const });
  const section = readSection(c.section, length, c.axis_z !== undefined, ctx);
  if (shape.strength === 'plastic-zone' && section.geometry === undefined) {
    fail(ctx, ['column', 'section', 'shape'], 'is missing: strength plastic-zone needs the section by its dimensions (its fibres and residual stresses), e.g. shape: i, h: 200 mm, b: 200 mm, tw: 9 mm, tf: 15 mm, r: 18 mm (docs/sections.md)');
  }
  const material = {
    E: readScalar(c.material.E, positive('stress'), ['column', 'material', 'E'], ctx),
    fy: readScalar(c.material.fy, positive('stress'), ['column', 'material', 'fy'], ctx),
  };
  const ends = readEnds(c.ends as RawEnds, frame, ctx);

  const bow = readBow(c.imperfection?.bow, shape.strength, length, ['column', 'imperfection', 'bow'], ctx);
  const axisZ = c.axis_z === undefined ? undefined : readAxisZ(c.axis_z, frame, shape.strength, length, ctx);

  const outOfPlumb = readOutOfPlumb(shape, length, ctx);

  const loadNames = Object.keys(shape.loads);
  if (loadNames.length === 0) fail(ctx, ['loads'], 'needs at least one axial load, e.g. dead: 420 kN');
  const loads: Load[] = loadNames.map((name) => {
    if (!LOAD_NAME.test(name)) {
      fail(ctx, ['loads', name], `'${name}' is not a usable load name: use letters, digits, _ and - (starting with a letter or _, at most 64 characters)`);
    }
    const time = readLoadTime(shape.loads[name]!, ['loads', name], ctx);
    const value = readScalar(time.value, { kind: 'force', domain: 'load' }, ['loads', name], ctx);
    const eccentricity = readEccentricity(shape.loads[name]!, name, length, ctx);
    const actions = readActions(shape.loads[name]!, name, shape, ctx);
    return {
      name, path: `loads.${name}`, value, ...(time.kind !== undefined ? { kind: time.kind } : {}), basis: time.basis,
      ...(eccentricity !== undefined ? { eccentricity } : {}),
      ...actions,
    };
  });

  const modelFactor: Scalar =
    shape.model_factor === undefined ? { kind: 'fixed', value: 1 } : readScalar(shape.model_factor, { kind: 'number', domain: 'positive' }, ['model_factor'], ctx);
  if (shape.model_factor === undefined) units['model_factor'] = PURE_NUMBER_UNIT;

  const referencePeriodYears = shape.reference_period === undefined ? DEFAULT_REFERENCE_PERIOD_YEARS : periodAt(ctx, ['reference_period'], shape.reference_period);
  const target = readTarget(shape, referencePeriodYears, ctx);

  const a = shape.analysis ?? {};
  if (a.methods !== undefined) {
    const dup = a.methods.find((m, i) => a.methods!.indexOf(m) !== i);
    if (dup !== undefined) fail(ctx, ['analysis', 'methods'], `lists '${dup}' twice`);
  }

  const partial = {
    version: 1 as const,
    title: shape.title ?? '',
    fileName: provenance.fileName,
    format: provenance.format,
    sha256: provenance.sha256,
    column: { length, frame, section, material, ends, bow, ...(axisZ !== undefined ? { axisZ } : {}), ...(outOfPlumb !== undefined ? { outOfPlumb } : {}) },
    loads,
    modelFactor,
    ...(shape.model_factor === undefined ? { modelFactorOmitted: true } : {}),
    strength: shape.strength,
    targetBeta: target.betaReferencePeriod,
    ...(target.source !== undefined ? { targetSource: target.source } : {}),
    referencePeriodYears,
    target,
    analysis: {
      ...(a.seed !== undefined ? { seed: a.seed } : {}),
      ...(a.methods !== undefined ? { methods: a.methods as Method[] } : {}),
      ...(a.mc_samples !== undefined ? { mcSamples: a.mc_samples } : {}),
      ...(a.is_samples !== undefined ? { isSamples: a.is_samples } : {}),
      ...(a.subset_samples !== undefined ? { subsetSamples: a.subset_samples } : {}),
      ...(a.workers !== undefined ? { workers: a.workers } : {}),
      ...(a.plastic_zone !== undefined ? { plasticZone: a.plastic_zone } : {}),
    },
    displayUnits: shape.display_units ?? 'si',
    units,
    sources,
    ...(Object.keys(evidence).length > 0 ? { evidence } : {}),
  };
  const { survivedLoads } = readStructureEvidence(shape.evidence, ctx);
  const testPlans = readTestPlans(shape.test_plans, partial, lines);
  const withEvidence = {
    ...partial,
    ...(survivedLoads.length > 0 ? { survivedLoads } : {}),
    ...(testPlans !== undefined ? { testPlans } : {}),
  };
  const correlation = readCorrelation(shape.correlation as [string, string, number][] | undefined, listScalars(partial), ctx);
  const measurements = readMeasurements(shape.evidence, ends, ctx);
  return { ...withEvidence, correlation, ...(measurements !== undefined ? { measurements } : {}) };
}
