/**
 * The shape-checked file → Scenario: units to SI, random variables checked, cross-field rules
 * (lateral only when sway, no mechanism, bow for first-yield, correlation names).
 */
import { readCorrelation } from './readCorrelation.js';
import { readEnds, type RawEnds } from './readEnds.js';
import { readSectionShape } from './readSectionShape.js';
import { fail, readScalar, type ReadContext } from './readScalar.js';
import { PURE_NUMBER_UNIT, readQuantity, type DisplayUnit } from './quantity.js';
import { ExpressionError } from './quantityExpression.js';
import type { RawScalar, ScenarioShape } from './scenarioShape.js';
import type { EvidenceRecord, Load, LoadBasis, Method, Scalar, Scenario, Target } from './types.js';
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
  const { kind, maximum_over, point_in_time, renewal_period, eccentricity: _eccentricity, ...value } = raw;
  if ('value' in value) {
    if (maximum_over !== undefined || point_in_time !== undefined) {
      fail(ctx, [...path, maximum_over !== undefined ? 'maximum_over' : 'point_in_time'], 'applies only to a random load {dist: ...}: a fixed value has no distribution to convert to another period');
    }
    return { value: value.value, ...(kind !== undefined ? { kind } : {}), basis: { type: 'unstated' } };
  }
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
  return { value: value as RawScalar, ...(kind !== undefined ? { kind } : {}), basis };
}

const ZERO: Scalar = { kind: 'fixed', value: 0 };

/**
 * A load's end eccentricities (docs/beam-column.md), or undefined when the file gives none. first-yield,
 * en1993-* and aisc360-e3 have a combined-action check; the equivalent-bow models refuse a non-zero eccentricity.
 */
function readEccentricity(raw: RawLoad, name: string, strength: string, columnLength: number, ctx: ReadContext): Load['eccentricity'] {
  if (typeof raw === 'string' || raw.eccentricity === undefined) return undefined;
  const read = (end: 'top' | 'bottom'): Scalar => {
    const given = raw.eccentricity![end];
    if (given === undefined) return ZERO;
    const path = ['loads', name, 'eccentricity', end];
    const scalar = readScalar(given, { kind: 'length', domain: 'any', columnLength }, path, ctx);
    // the equivalent-bow models (first-yield-en1993-X[-plus-bow]) have no combined-action check
    if (strength.startsWith('first-yield-en1993-') && !(scalar.kind === 'fixed' && scalar.value === 0)) {
      fail(ctx, path, `strength model '${strength}' has no check for eccentric loads: use strength: first-yield, en1993-X (EN 1993-1-1 Eq. 6.61) or aisc360-e3 (AISC 360 H1-1), or drop the eccentricity`);
    }
    return scalar;
  };
  return { top: read('top'), bottom: read('bottom') };
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
  const area = readScalar(c.section.area, positive('area'), ['column', 'section', 'area'], ctx);
  const inertia = readScalar(c.section.inertia, positive('inertia'), ['column', 'section', 'inertia'], ctx);
  const section = {
    area,
    inertia,
    sectionModulus: readScalar(c.section.section_modulus, positive('sectionModulus'), ['column', 'section', 'section_modulus'], ctx),
    ...readSectionShape(c.section.shape, shape.strength, ctx, { area, inertia }),
  };
  const material = {
    E: readScalar(c.material.E, positive('stress'), ['column', 'material', 'E'], ctx),
    fy: readScalar(c.material.fy, positive('stress'), ['column', 'material', 'fy'], ctx),
  };
  const ends = readEnds(c.ends as RawEnds, frame, ctx);

  const rawBow = c.imperfection?.bow;
  let bow: Scalar;
  if (rawBow === undefined) {
    if (shape.strength === 'first-yield' || shape.strength === 'plastic-zone' || shape.strength.endsWith('-plus-bow')) {
      fail(ctx, ['column', 'imperfection', 'bow'], `is required for strength ${shape.strength}: give the bow amplitude of the initial shape, e.g. bow: L/1000`);
    }
    bow = { kind: 'fixed', value: 0 };
  } else {
    bow = readScalar(rawBow, { kind: 'length', domain: 'any', columnLength: length }, ['column', 'imperfection', 'bow'], ctx);
  }

  const loadNames = Object.keys(shape.loads);
  if (loadNames.length === 0) fail(ctx, ['loads'], 'needs at least one axial load, e.g. dead: 420 kN');
  const loads: Load[] = loadNames.map((name) => {
    if (!LOAD_NAME.test(name)) {
      fail(ctx, ['loads', name], `'${name}' is not a usable load name: use letters, digits, _ and - (starting with a letter or _, at most 64 characters)`);
    }
    const time = readLoadTime(shape.loads[name]!, ['loads', name], ctx);
    const value = readScalar(time.value, { kind: 'force', domain: 'load' }, ['loads', name], ctx);
    const eccentricity = readEccentricity(shape.loads[name]!, name, shape.strength, length, ctx);
    return {
      name, path: `loads.${name}`, value, ...(time.kind !== undefined ? { kind: time.kind } : {}), basis: time.basis,
      ...(eccentricity !== undefined ? { eccentricity } : {}),
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
    column: { length, frame, section, material, ends, bow },
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
  const correlation = readCorrelation(shape.correlation as [string, string, number][] | undefined, listScalars(partial), ctx);
  return { ...partial, correlation };
}
