/**
 * The likelihood of one reading through a model: the reading y of a positive quantity whose model
 * value is ŷ, with a multiplicative measurement error of CoV V, ln y ~ N(ln ŷ, ζ²), ζ² = ln(1 + V²)
 * (a lognormal error keeps readings positive and makes V the error's CoV: Melchers, Structural
 * Reliability Analysis and Prediction, 2nd ed., 1999, App. A). A model value that is not positive
 * (a column with no lateral stiffness left has no frequency) cannot have produced the reading.
 */
import { EvidenceError } from './evidenceError.js';

const HALF_LOG_TWO_PI = 0.5 * Math.log(2 * Math.PI);

/** ζ = √ln(1 + V²) of a measurement CoV V > 0. */
export function readingLogSd(cov: number): number {
  if (!(cov > 0 && Number.isFinite(cov))) throw new EvidenceError(`the measurement CoV must be a finite number > 0, got ${cov}`);
  return Math.sqrt(Math.log1p(cov * cov));
}

/** ln p(y | ŷ) with ln-space error sd ζ; −∞ when ŷ ≤ 0 or is not finite. */
export function readingLogLikelihood(reading: number, modelValue: number, logSd: number): number {
  if (!(modelValue > 0 && Number.isFinite(modelValue))) return -Infinity;
  const z = (Math.log(reading) - Math.log(modelValue)) / logSd;
  return -0.5 * z * z - Math.log(logSd) - Math.log(reading) - HALF_LOG_TWO_PI;
}
