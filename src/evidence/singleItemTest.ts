/**
 * Tests of this one item (this connection, this column), read with a known measurement error:
 * the prior of the item's value X ~ N(m₀, s₀²) and readings yⱼ = X + eⱼ, eⱼ ~ N(0, σₘ²) give the
 * posterior X ~ N(m₁, s₁²) with 1/s₁² = 1/s₀² + k/σₘ² and m₁ = s₁²(m₀/s₀² + Σyⱼ/σₘ²)
 * (normal–normal conjugacy; Gelman et al., Bayesian Data Analysis, 3rd ed., 2013, §2.5).
 * A lognormal item is updated the same way in ln X (ln-space measurement sd √ln(1 + V²)),
 * so its posterior is again lognormal. Exact.
 */
import { EvidenceError } from './evidenceError.js';
import { logMeasurementSd, logMoments } from './lognormalPopulation.js';

export function updateNormalItem(priorMean: number, priorSd: number, readings: readonly number[], measurementSd: number): { mean: number; sd: number } {
  if (readings.length === 0) throw new EvidenceError('no test results were given');
  if (!(priorSd > 0) || !Number.isFinite(priorSd)) throw new EvidenceError(`the prior sd must be finite and > 0, got ${priorSd}`);
  if (!(measurementSd > 0) || !Number.isFinite(measurementSd)) {
    throw new EvidenceError(`a test of this item needs its measurement error: an sd (or CoV) > 0, got ${measurementSd}`);
  }
  let sum = 0;
  for (const y of readings) {
    if (!Number.isFinite(y)) throw new EvidenceError(`a test result is not a finite number (${y})`);
    sum += y;
  }
  const precision = 1 / (priorSd * priorSd) + readings.length / (measurementSd * measurementSd);
  const mean = (priorMean / (priorSd * priorSd) + sum / (measurementSd * measurementSd)) / precision;
  return { mean, sd: Math.sqrt(1 / precision) };
}

/** Posterior ln-mean λ₁ and ln-sd ζ₁ of a lognormal item (prior mean and sd of X; measurement CoV). */
export function updateLognormalItem(priorMean: number, priorSd: number, readings: readonly number[], measurementCov: number): { lambda: number; zeta: number } {
  if (!(priorMean > 0)) throw new EvidenceError(`a lognormal prior needs a mean > 0, got ${priorMean}`);
  for (const y of readings) if (!(y > 0)) throw new EvidenceError(`a lognormal variable's test results must all be > 0, got ${y}`);
  const prior = logMoments(priorMean, priorSd);
  const post = updateNormalItem(prior.lambda, prior.zeta, readings.map(Math.log), logMeasurementSd(measurementCov));
  return { lambda: post.mean, zeta: post.sd };
}
