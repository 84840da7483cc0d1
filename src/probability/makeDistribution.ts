/**
 * Build a Distribution from a user's DistSpec (docs/scenario-format.md), validating every parameter.
 * Bad input throws DistributionError with a message naming the parameter (no path: the
 * caller knows which variable it was building).
 */
import { BetaDistribution } from './betaDist.js';
import { DIST_NAMES, DistributionError, type Distribution, type DistSpec } from './distribution.js';
import { GumbelDistribution } from './gumbelDist.js';
import { LognormalDistribution } from './lognormalDist.js';
import { NormalDistribution } from './normalDist.js';
import { TruncatedNormalDistribution } from './truncnormalDist.js';
import { UniformDistribution } from './uniformDist.js';
import { WeibullDistribution, weibullCovRange } from './weibullDist.js';
import { LogStudentTDistribution, StudentTDistribution } from './studentTDist.js';

type Field = 'mean' | 'sd' | 'cov' | 'min' | 'max';

const FIELDS: Record<Exclude<DistSpec['dist'], 'studentt' | 'logstudentt'>, { required: Field[]; optional: Field[] }> = {
  normal: { required: ['mean'], optional: ['sd', 'cov'] },
  lognormal: { required: ['mean'], optional: ['sd', 'cov'] },
  gumbel: { required: ['mean'], optional: ['sd', 'cov'] },
  weibull: { required: ['mean'], optional: ['sd', 'cov'] },
  uniform: { required: ['min', 'max'], optional: [] },
  truncnormal: { required: ['mean', 'sd'], optional: ['min', 'max'] },
  beta: { required: ['min', 'max', 'mean', 'sd'], optional: [] },
};

function fail(dist: string, message: string): never {
  throw new DistributionError(`${dist}: ${message}`);
}

/** Checks presence, finiteness and absence of fields the distribution does not take. */
function checkFields(spec: DistSpec & { dist: keyof typeof FIELDS }): void {
  const rule = FIELDS[spec.dist];
  const allowed = new Set<Field>([...rule.required, ...rule.optional]);
  for (const field of ['mean', 'sd', 'cov', 'min', 'max'] as const) {
    const value = spec[field];
    if (value === undefined) {
      if (rule.required.includes(field)) fail(spec.dist, `'${field}' is required`);
      continue;
    }
    if (!allowed.has(field)) {
      fail(spec.dist, `'${field}' is not a parameter of this distribution (it takes ${[...allowed].join(', ')})`);
    }
    if (typeof value !== 'number' || !Number.isFinite(value)) {
      fail(spec.dist, `'${field}' must be a finite number, got ${String(value)}`);
    }
  }
}

/** The standard deviation from exactly one of sd or cov (cov needs a non-zero mean). */
function resolveSd(spec: DistSpec, mean: number): number {
  const { sd, cov } = spec;
  if (sd !== undefined && cov !== undefined) fail(spec.dist, `give either 'sd' or 'cov', not both`);
  if (sd === undefined && cov === undefined) fail(spec.dist, `'sd' or 'cov' is required`);
  if (sd !== undefined) {
    if (!(sd > 0)) fail(spec.dist, `'sd' must be > 0, got ${sd}`);
    return sd;
  }
  if (!(cov! > 0)) fail(spec.dist, `'cov' must be > 0, got ${cov}`);
  if (mean === 0) fail(spec.dist, `'cov' cannot be used with a zero mean; give 'sd'`);
  return cov! * Math.abs(mean);
}

function requirePositiveMean(spec: DistSpec, mean: number): void {
  if (!(mean > 0)) fail(spec.dist, `'mean' must be > 0, got ${mean}`);
}

function checkOrderedBounds(spec: DistSpec, min: number, max: number): void {
  if (!(min < max)) fail(spec.dist, `'min' (${min}) must be less than 'max' (${max})`);
}

export function makeDistribution(spec: DistSpec): Distribution {
  if (spec?.dist === 'studentt' || spec?.dist === 'logstudentt') return makeStudentT(spec);
  if (!spec || !DIST_NAMES.includes(spec.dist)) {
    throw new DistributionError(
      `unknown distribution '${String(spec?.dist)}' (expected one of ${DIST_NAMES.join(', ')})`,
    );
  }
  checkFields(spec as DistSpec & { dist: keyof typeof FIELDS });
  const mean = spec.mean as number;
  switch (spec.dist) {
    case 'normal':
      return new NormalDistribution(mean, resolveSd(spec, mean));
    case 'lognormal': {
      requirePositiveMean(spec, mean);
      return LognormalDistribution.fromMoments(mean, resolveSd(spec, mean));
    }
    case 'gumbel':
      return GumbelDistribution.fromMoments(mean, resolveSd(spec, mean));
    case 'weibull': {
      requirePositiveMean(spec, mean);
      const sd = resolveSd(spec, mean);
      const cov = sd / mean;
      if (cov < weibullCovRange.min || cov > weibullCovRange.max) {
        fail(spec.dist, `coefficient of variation ${cov} is outside the supported range [${weibullCovRange.min.toPrecision(3)}, ${weibullCovRange.max.toPrecision(3)}]`);
      }
      return WeibullDistribution.fromMoments(mean, sd);
    }
    case 'uniform': {
      const { min, max } = spec as { min: number; max: number };
      checkOrderedBounds(spec, min, max);
      return new UniformDistribution(min, max);
    }
    case 'truncnormal':
      return makeTruncnormal(spec, mean);
    case 'beta':
      return makeBeta(spec, mean);
  }
}

function makeTruncnormal(spec: DistSpec, mean: number): Distribution {
  const sd = spec.sd as number;
  if (!(sd > 0)) fail(spec.dist, `'sd' (of the parent normal) must be > 0, got ${sd}`);
  if (spec.min === undefined && spec.max === undefined) {
    fail(spec.dist, `give 'min', 'max' or both (without bounds use 'normal')`);
  }
  const min = spec.min ?? -Infinity;
  const max = spec.max ?? Infinity;
  checkOrderedBounds(spec, min, max);
  const d = new TruncatedNormalDistribution(mean, sd, min, max);
  // Bounds so far out that the parent puts (next to) no probability between them.
  if (!(d.mass > 1e-250)) {
    fail(spec.dist, `[min, max] = [${min}, ${max}] holds no probability of the parent normal (mean ${mean}, sd ${sd})`);
  }
  return d;
}

function makeBeta(spec: DistSpec, mean: number): Distribution {
  const { min, max, sd } = spec as { min: number; max: number; sd: number };
  checkOrderedBounds(spec, min, max);
  if (!(mean > min && mean < max)) fail(spec.dist, `'mean' (${mean}) must lie strictly between 'min' and 'max'`);
  if (!(sd > 0)) fail(spec.dist, `'sd' must be > 0, got ${sd}`);
  const { a, b, nu } = BetaDistribution.shapesFromMoments(mean, sd, min, max);
  if (!(nu > 0)) {
    const limit = Math.sqrt((mean - min) * (max - mean));
    fail(spec.dist, `'sd' (${sd}) is too large for this mean and range: it must be below ${limit.toPrecision(6)}`);
  }
  return new BetaDistribution(a, b, min, max);
}

/** The predictive distributions that test evidence produces (never typed by users). */
function makeStudentT(spec: DistSpec): Distribution {
  const { loc, scale, dof } = spec;
  if (loc === undefined || !Number.isFinite(loc)) fail(spec.dist, `'loc' must be a finite number, got ${String(loc)}`);
  if (scale === undefined || !(scale > 0) || !Number.isFinite(scale)) fail(spec.dist, `'scale' must be a finite number > 0, got ${String(scale)}`);
  if (dof === undefined || !(dof > 0) || !Number.isFinite(dof)) fail(spec.dist, `'dof' must be a finite number > 0, got ${String(dof)}`);
  return spec.dist === 'studentt' ? new StudentTDistribution(loc, scale, dof) : new LogStudentTDistribution(loc, scale, dof);
}
