/**
 * Conjugate updating of a normal population N(μ, σ²) from test results y₁…yₙ of members of it
 * (coupons of the same steel, stiffnesses of sibling connections), each read with a known
 * measurement error of sd σₘ. Formulas and sources: docs/evidence.md.
 *
 * Unknown μ and σ²: the normal–inverse-χ² prior (Gelman et al., Bayesian Data Analysis, 3rd ed.,
 * 2013, §3.3) with κ₀ = n₀ and ν₀ = n₀ − 1, so that a prior "worth n₀ tests" with mean m₀ and sd
 * s₀ gives exactly the answer of pooling n₀ earlier tests with that mean and sd; n₀ = 0 is the
 * non-informative prior p(μ, σ²) ∝ 1/σ², whose predictive gives the "V_X unknown" k_n of
 * EN 1990:2002 Annex D, Table D1.
 * Known σ: a normal prior on μ worth n₀ tests (n₀ = 0: flat); the predictive gives the
 * "V_X known" k_n of the same table.
 */
import { EvidenceError } from './evidenceError.js';
import type { Predictive } from './predictive.js';
import { sampleStatistics } from './sampleStatistics.js';

export interface PriorBelief {
  /** Prior mean of the population (m₀). */
  readonly mean: number;
  /** Prior sd of the population (s₀; with a known variance, σ itself). */
  readonly sd: number;
  /** How many tests the prior is worth (n₀ ≥ 0; 0 = it carries no weight). */
  readonly tests: number;
}

export interface UnknownVarianceUpdate {
  readonly predictive: Predictive & { family: 'studentt' };
  readonly n: number;
  /** κₙ, νₙ, μₙ, σₙ² of the normal–inverse-χ² posterior of the observed readings. */
  readonly kappa: number;
  readonly dof: number;
  readonly location: number;
  readonly readingVariance: number;
}

function checkPrior(prior: PriorBelief): void {
  if (!(prior.tests >= 0) || !Number.isFinite(prior.tests)) throw new EvidenceError(`the prior's weight in tests must be a finite number >= 0, got ${prior.tests}`);
  if (!Number.isFinite(prior.mean)) throw new EvidenceError(`the prior mean must be finite, got ${prior.mean}`);
  if (!(prior.sd > 0) || !Number.isFinite(prior.sd)) throw new EvidenceError(`the prior sd must be finite and > 0, got ${prior.sd}`);
}

function checkMeasurementSd(sd: number): void {
  if (!(sd >= 0) || !Number.isFinite(sd)) throw new EvidenceError(`the measurement sd must be a finite number >= 0, got ${sd}`);
}

/**
 * Unknown mean and variance. Readings yᵢ = xᵢ + eᵢ have variance τ² = σ² + σₘ²; the posterior of
 * (μ, τ²) is conjugate, and the predictive of a new member's true value is taken as
 * t_νₙ(μₙ, σₙ²(1 + 1/κₙ) − σₘ²): the reading's predictive with the measurement's own variance
 * removed. It is exact for σₘ = 0 and an approximation otherwise (docs/evidence.md).
 */
export function updateNormalUnknownVariance(values: readonly number[], measurementSd: number, prior?: PriorBelief): UnknownVarianceUpdate {
  checkMeasurementSd(measurementSd);
  const s = sampleStatistics(values);
  const n0 = prior?.tests ?? 0;
  if (prior) checkPrior(prior);
  if (n0 > 0 && n0 < 1) throw new EvidenceError(`with an unknown variance the prior's weight in tests must be 0 or at least 1, got ${n0}`);
  const kappa0 = n0;
  const nu0 = n0 - 1;
  const kappa = kappa0 + s.n;
  const dof = nu0 + s.n;
  if (!(dof >= 2)) {
    throw new EvidenceError(`${s.n} test result${s.n === 1 ? '' : 's'} cannot estimate an unknown scatter: give at least ${Math.ceil(3 - n0)} (with an unknown variance the predictive needs n + prior tests >= 3), or take the variance as known`);
  }
  const location = prior ? (kappa0 * prior.mean + s.n * s.mean) / kappa : s.mean;
  // νₙσₙ² = ν₀s₀² + (n − 1)s² + κ₀n/κₙ (ȳ − m₀)²  (BDA3 §3.3); no prior: only (n − 1)s²
  const priorSs = prior && n0 > 0 ? nu0 * prior.sd * prior.sd + ((kappa0 * s.n) / kappa) * (s.mean - prior.mean) ** 2 : 0;
  const readingVariance = (priorSs + (s.n - 1) * s.variance) / dof;
  if (!(readingVariance > 0)) throw new EvidenceError('the test results do not scatter at all, so they cannot estimate an unknown variance: take the variance as known');
  const predictiveVariance = readingVariance * (1 + 1 / kappa) - measurementSd * measurementSd;
  if (!(readingVariance > measurementSd * measurementSd)) {
    throw new EvidenceError(`the test results scatter less (sd ${Math.sqrt(readingVariance).toPrecision(4)}) than their measurement error (sd ${measurementSd.toPrecision(4)}) alone would make them: take the variance as known`);
  }
  return { predictive: { family: 'studentt', loc: location, scale: Math.sqrt(predictiveVariance), dof }, n: s.n, kappa, dof, location, readingVariance };
}

/**
 * Known population sd σ, unknown mean. Readings yᵢ ~ N(μ, σ² + σₘ²); prior μ ~ N(m₀, σ²/n₀).
 * Posterior μ ~ N(μₙ, vₙ) with 1/vₙ = n₀/σ² + n/(σ² + σₘ²); predictive of a new member
 * N(μₙ, σ² + vₙ). Exact.
 */
export function updateNormalKnownVariance(values: readonly number[], sigma: number, measurementSd: number, priorMean?: number, priorTests = 0): Predictive & { family: 'normal' } {
  checkMeasurementSd(measurementSd);
  if (!(sigma > 0) || !Number.isFinite(sigma)) throw new EvidenceError(`the known population sd must be finite and > 0, got ${sigma}`);
  if (!(priorTests >= 0) || !Number.isFinite(priorTests)) throw new EvidenceError(`the prior's weight in tests must be a finite number >= 0, got ${priorTests}`);
  if (priorTests > 0 && !Number.isFinite(priorMean)) throw new EvidenceError(`the prior mean must be finite, got ${priorMean}`);
  const s = sampleStatistics(values);
  const readingVariance = sigma * sigma + measurementSd * measurementSd;
  const priorPrecision = priorTests > 0 ? priorTests / (sigma * sigma) : 0;
  const dataPrecision = s.n / readingVariance;
  const precision = priorPrecision + dataPrecision;
  const mean = ((priorPrecision > 0 ? priorPrecision * (priorMean as number) : 0) + dataPrecision * s.mean) / precision;
  return { family: 'normal', mean, sd: Math.sqrt(sigma * sigma + 1 / precision) };
}
