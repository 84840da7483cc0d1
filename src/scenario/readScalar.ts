/**
 * One scenario value (fixed or `{dist: ...}`) → Scalar in SI, with its display unit.
 * Every parameter is read as a quantity of the field's own kind, so `mean: 4 m` in a stress
 * field is a dimension error; the distribution is then built once by makeDistribution so bad
 * parameters are caught here, with the field's path and line.
 */
import { makeDistribution } from '../probability/makeDistribution.js';
import { DistributionError, type DistSpec } from '../probability/distribution.js';
import type { QuantityKind } from './dimensions.js';
import { InputError } from './inputError.js';
import { PURE_NUMBER_UNIT, readQuantity, type DisplayUnit } from './quantity.js';
import { ExpressionError } from './quantityExpression.js';
import { formatPath, lineOf, type PathSegment } from './rawTree.js';
import { readEvidence, type RawEvidence } from './readEvidence.js';
import type { EvidenceRecord, Scalar } from './types.js';

/**
 * Allowed values: `positive` > 0; `nonnegative` >= 0; `fixity` in [0, 1); `alignment` >= 0;
 * `load` >= 0 when fixed, any support when random (a sampled negative load is a tension, which the
 * limit state takes as it comes); `any`.
 * For `positive`, `nonnegative` and `alignment` a random value's whole support must stay >= 0.
 */
export type Domain = 'positive' | 'nonnegative' | 'fixity' | 'alignment' | 'load' | 'any';

export interface FieldRule {
  /** A quantity kind, or 'number' for a pure number. */
  readonly kind: QuantityKind | 'number';
  readonly domain: Domain;
  /** Column length (m) when the symbol L may be used. */
  readonly columnLength?: number;
}

export interface ReadContext {
  readonly lines: ReadonlyMap<string, number>;
  /** Collects the display unit of every field read. */
  readonly units: Record<string, DisplayUnit>;
  /** Collects the `source:` note of every random variable that has one. */
  readonly sources?: Record<string, string>;
  /** Collects the test results that updated a variable (docs/evidence.md). */
  readonly evidence?: Record<string, EvidenceRecord>;
}

type Param = 'mean' | 'sd' | 'cov' | 'min' | 'max';

/** A value as the shape check passed it: fixed, or a random variable's parameters. */
export type RawScalar = string | number | ({ dist: DistSpec['dist'] } & Partial<Record<Param, string | number>>);
const PARAMS: readonly Param[] = ['mean', 'sd', 'cov', 'min', 'max'];

export function fail(ctx: ReadContext, path: readonly PathSegment[], message: string): never {
  throw new InputError(formatPath(path), message, lineOf(ctx.lines, path));
}

/** A value of the field's kind, in SI. */
function readValue(raw: string | number, rule: FieldRule, path: readonly PathSegment[], ctx: ReadContext): { value: number; display: DisplayUnit } {
  if (rule.kind === 'number') {
    if (typeof raw !== 'number') fail(ctx, path, `expected a plain number, got '${raw}'`);
    return { value: raw, display: PURE_NUMBER_UNIT };
  }
  if (typeof raw !== 'string') fail(ctx, path, `expected a quantity with a unit, got a bare number (${raw}): give a unit`);
  try {
    return readQuantity(raw, rule.kind, rule.columnLength);
  } catch (e) {
    if (e instanceof ExpressionError) fail(ctx, path, e.message);
    throw e;
  }
}

function checkFixed(value: number, raw: string | number, rule: FieldRule, path: readonly PathSegment[], ctx: ReadContext): void {
  const shown = typeof raw === 'string' ? raw.trim() : String(raw);
  switch (rule.domain) {
    case 'positive':
      if (!(value > 0)) fail(ctx, path, `must be greater than zero, got ${shown}`);
      break;
    case 'nonnegative':
    case 'alignment':
    case 'load':
      if (!(value >= 0)) fail(ctx, path, `must not be negative, got ${shown}`);
      break;
    case 'fixity':
      if (!(value >= 0 && value < 1)) fail(ctx, path, `a fixity factor must lie in [0, 1) (0 pinned, towards 1 fixed; use 'fixed' for a rigid end), got ${shown}`);
      break;
    case 'any':
      break;
  }
}

/** Lower end of a distribution's support: -Infinity for normal, gumbel and a truncnormal without min. */
function supportMin(spec: DistSpec): number {
  switch (spec.dist) {
    case 'normal':
    case 'gumbel':
    case 'studentt':
      return -Infinity;
    case 'lognormal':
    case 'weibull':
    case 'logstudentt':
      return 0;
    case 'uniform':
    case 'beta':
    case 'truncnormal':
      return spec.min ?? -Infinity;
  }
}

/** Upper end of a distribution's support. */
function supportMax(spec: DistSpec): number {
  return spec.dist === 'uniform' || spec.dist === 'beta' || spec.dist === 'truncnormal' ? (spec.max ?? Infinity) : Infinity;
}

/**
 * True when every value a random variable can take lies in `domain` (the rule checkRandomDomain
 * enforces, without its messages). Parameters the distribution itself refuses give false.
 */
export function supportInsideDomain(spec: DistSpec, domain: Domain): boolean {
  try {
    makeDistribution(spec);
  } catch (e) {
    if (e instanceof DistributionError) return false;
    throw e;
  }
  const lo = supportMin(spec);
  const hi = supportMax(spec);
  switch (domain) {
    case 'positive':
    case 'nonnegative':
    case 'alignment':
      return lo >= 0 && (spec.mean === undefined || spec.mean > 0);
    case 'fixity':
      return lo >= 0 && hi <= 1;
    case 'load':
    case 'any':
      return true;
  }
}

const NONNEGATIVE_ADVICE = 'use lognormal (or weibull), or truncnormal with min >= 0';

/** The support of a random variable must stay inside the field's domain. */
function checkRandomDomain(spec: DistSpec, rule: FieldRule, path: readonly PathSegment[], ctx: ReadContext): void {
  const lo = supportMin(spec);
  const hi = supportMax(spec);
  switch (rule.domain) {
    case 'positive':
    case 'nonnegative':
      if (spec.mean !== undefined && !(spec.mean > 0)) fail(ctx, [...path, 'mean'], `must be greater than zero, got ${spec.mean}`);
      if (spec.dist === 'uniform' && !(spec.max! > 0)) fail(ctx, [...path, 'max'], `must be greater than zero, got ${spec.max}`);
      if (!(lo >= 0)) {
        const where = spec.min !== undefined ? [...path, 'min'] : path;
        const why = spec.min !== undefined ? `must not be negative (this value cannot be), got ${spec.min}` : `a ${spec.dist} variable can become negative, which this value cannot`;
        fail(ctx, where, `${why}: ${NONNEGATIVE_ADVICE}`);
      }
      break;
    case 'fixity':
      if (!(lo >= 0 && hi <= 1)) {
        fail(ctx, path, `a random fixity factor must stay inside [0, 1]: use uniform, truncnormal or beta with min >= 0 and max <= 1 (a ${spec.dist} ${spec.dist === 'uniform' || spec.dist === 'truncnormal' || spec.dist === 'beta' ? 'with these bounds ' : ''}can leave that range)`);
      }
      break;
    case 'alignment':
      if (!(lo >= 0)) {
        fail(ctx, path, `a random G factor must not become negative: use lognormal or weibull, or uniform, truncnormal or beta with min >= 0`);
      }
      break;
    case 'load':
      if (spec.mean !== undefined && !(spec.mean > 0)) fail(ctx, [...path, 'mean'], `must be greater than zero, got ${spec.mean}`);
      if (spec.dist === 'uniform' && !(spec.max! > 0)) fail(ctx, [...path, 'max'], `must be greater than zero, got ${spec.max}`);
      break;
    case 'any':
      break;
  }
}

function readRandom(raw: Exclude<RawScalar, string | number>, rule: FieldRule, path: readonly PathSegment[], ctx: ReadContext): Scalar {
  const spec: DistSpec = { dist: raw.dist };
  const given: Partial<Record<Param, string | number>> = raw;
  let display: DisplayUnit | undefined;
  for (const param of PARAMS) {
    const value = given[param];
    if (value === undefined) continue;
    if (param === 'cov') {
      spec.cov = readValue(value, { kind: 'number', domain: 'any' }, [...path, param], ctx).value;
      continue;
    }
    const read = readValue(value, rule, [...path, param], ctx);
    spec[param] = read.value;
    if (display === undefined || param === 'mean') display = read.display;
  }
  try {
    const dist = makeDistribution(spec);
    if (!Number.isFinite(dist.mean) || !Number.isFinite(dist.sd)) fail(ctx, path, `${spec.dist}: these parameters give a mean or spread that is not finite`);
  } catch (e) {
    if (e instanceof DistributionError) {
      const named = /'(mean|sd|cov|min|max)'/.exec(e.message)?.[1];
      fail(ctx, named !== undefined && given[named as Param] !== undefined ? [...path, named] : path, e.message);
    }
    throw e;
  }
  checkRandomDomain(spec, rule, path, ctx);
  ctx.units[formatPath(path)] = display ?? PURE_NUMBER_UNIT;
  const source = (raw as { source?: unknown }).source;
  if (typeof source === 'string' && source.trim() !== '' && ctx.sources) ctx.sources[formatPath(path)] = source.trim();
  const evidence = (raw as { evidence?: RawEvidence }).evidence;
  if (evidence !== undefined) {
    const updated = readEvidence(spec, evidence, rule.kind, path, ctx.lines);
    if (ctx.evidence) ctx.evidence[formatPath(path)] = updated.record;
    return { kind: 'random', spec: updated.spec };
  }
  return { kind: 'random', spec };
}

/** Reads a fixed or random value at `path`. */
export function readScalar(raw: RawScalar, rule: FieldRule, path: readonly PathSegment[], ctx: ReadContext): Scalar {
  if (typeof raw === 'string' || typeof raw === 'number') {
    const { value, display } = readValue(raw, rule, path, ctx);
    checkFixed(value, raw, rule, path, ctx);
    ctx.units[formatPath(path)] = display;
    return { kind: 'fixed', value };
  }
  return readRandom(raw, rule, path, ctx);
}

/** The mean of a scalar (the value itself when fixed). */
export function meanOf(s: Scalar): number {
  if (s.kind === 'fixed') return s.value;
  return makeDistribution(s.spec).mean;
}
