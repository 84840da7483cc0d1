/**
 * A lognormal population updated through the logarithm: ln X is a normal population, so the
 * updating of normalPopulation.ts applies to ln yᵢ and the predictive of X is a log-Student-t
 * (unknown variance) or a lognormal (known variance). EN 1990:2002 Annex D, D7.2(2) works the
 * characteristic value of a lognormal variable the same way, on the logarithms.
 *
 * The prior {mean, sd} of X becomes that of ln X through ζ² = ln(1 + V²), λ = ln μ − ζ²/2.
 * A measurement sd σₘ given in X's units becomes ζₘ = √ln(1 + (σₘ/ȳ)²) at the sample mean ȳ
 * (a first-order conversion, exact for a constant measurement CoV σₘ/ȳ).
 */
import { EvidenceError } from './evidenceError.js';
import { updateNormalKnownVariance, updateNormalUnknownVariance, type PriorBelief } from './normalPopulation.js';
import type { Predictive } from './predictive.js';

/** ln-space mean and sd of a lognormal variable with mean μ and sd σ. */
export function logMoments(mean: number, sd: number): { lambda: number; zeta: number } {
  const zeta2 = Math.log1p((sd / mean) ** 2);
  return { lambda: Math.log(mean) - 0.5 * zeta2, zeta: Math.sqrt(zeta2) };
}

/** ln-space sd of a measurement error with CoV v: √ln(1 + v²). */
export function logMeasurementSd(cov: number): number {
  return Math.sqrt(Math.log1p(cov * cov));
}

function logsOf(values: readonly number[]): number[] {
  return values.map((v) => {
    if (!(v > 0) || !Number.isFinite(v)) throw new EvidenceError(`a lognormal variable's test results must all be > 0, got ${v}`);
    return Math.log(v);
  });
}

function sampleMean(values: readonly number[]): number {
  return values.reduce((a, b) => a + b, 0) / values.length;
}

/** Unknown mean and variance of ln X: predictive of ln X is Student-t. measurementCov = σₘ/ȳ. */
export function updateLognormalUnknownVariance(values: readonly number[], measurementCov: number, prior?: PriorBelief): Predictive & { family: 'studentt' } {
  const logs = logsOf(values);
  const logPrior = prior ? { ...priorInLogs(prior), tests: prior.tests } : undefined;
  return updateNormalUnknownVariance(logs, logMeasurementSd(measurementCov), logPrior).predictive;
}

/** Known CoV of X (so known sd ζ of ln X): predictive of ln X is normal. */
export function updateLognormalKnownVariance(values: readonly number[], cov: number, measurementCov: number, priorMean?: number, priorTests = 0): Predictive & { family: 'normal' } {
  const logs = logsOf(values);
  const zeta = logMeasurementSd(cov);
  const priorLambda = priorMean === undefined ? undefined : Math.log(priorMean) - 0.5 * zeta * zeta;
  return updateNormalKnownVariance(logs, zeta, logMeasurementSd(measurementCov), priorLambda, priorTests);
}

function priorInLogs(prior: PriorBelief): { mean: number; sd: number } {
  if (!(prior.mean > 0)) throw new EvidenceError(`a lognormal prior needs a mean > 0, got ${prior.mean}`);
  const { lambda, zeta } = logMoments(prior.mean, prior.sd);
  return { mean: lambda, sd: zeta };
}

/** The measurement CoV at the sample mean from a measurement sd in X's units. */
export function measurementCovAtMean(values: readonly number[], measurementSd: number): number {
  return measurementSd / sampleMean(values);
}
