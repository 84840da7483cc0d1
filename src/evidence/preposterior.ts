/**
 * One simulated outcome of a planned test, drawn from the prior predictive, and the updated
 * distribution it would give (pre-posterior analysis: Raiffa & Schlaifer, Applied Statistical
 * Decision Theory, 1961, ch. 3–5; Benjamin & Cornell, Probability, Statistics, and Decision for
 * Civil Engineers, 1970, ch. 5). Plain numbers; random numbers come from the caller's seeded streams.
 */
import type { DistSpec } from '../probability/distribution.js';
import { makeDistribution } from '../probability/makeDistribution.js';
import { studentTQuantile } from '../probability/studentTDist.js';
import { logMeasurementSd, logMoments } from './lognormalPopulation.js';
import { updateNormalUnknownVariance } from './normalPopulation.js';
import { measurementErrors, updatedSpec, type TestSet } from './updatedSpec.js';

/**
 * Tests of this item: the true value X from the current distribution, n readings with an error of
 * CoV `measurementCov` (sd = CoV × the current mean for a normal X; on ln X for a lognormal X).
 */
export function itemOutcome(current: DistSpec, n: number, measurementCov: number, normal: () => number): DistSpec {
  const d = makeDistribution(current);
  const tests: number[] = [];
  if (current.dist === 'normal') {
    const errorSd = measurementCov * Math.abs(d.mean);
    const x = d.mean + d.sd * normal();
    for (let j = 0; j < n; j++) tests.push(x + errorSd * normal());
    return updatedSpec(current, { tests, tested: 'this_one', scatter: 'unknown', priorWeight: 0, measurementSd: errorSd }).spec;
  }
  if (current.dist !== 'lognormal') throw new Error(`itemOutcome: ${current.dist} is not updatable`);
  const { lambda, zeta } = logMoments(d.mean, d.sd);
  const zetaM = logMeasurementSd(measurementCov);
  const lnX = lambda + zeta * normal();
  for (let j = 0; j < n; j++) tests.push(Math.exp(lnX + zetaM * normal()));
  return updatedSpec(current, { tests, tested: 'this_one', scatter: 'unknown', priorWeight: 0, measurementCov }).spec;
}

/**
 * n more tests of similar items, read like the ones in `existing`: each new reading from the
 * posterior predictive of a reading given all readings so far (drawing them one by one is the
 * same as drawing the population's parameters first), then the update on every test together.
 * `prior` is the distribution as written (before any test).
 */
export function populationOutcome(prior: DistSpec, existing: TestSet, n: number, uniform: () => number, normal: () => number): DistSpec {
  const log = prior.dist === 'lognormal';
  const d = makeDistribution(prior);
  const { errorSd, errorCov } = measurementErrors(existing);
  const errorInSpace = log ? logMeasurementSd(errorCov) : errorSd;
  const toSpace = (v: number) => (log ? Math.log(v) : v);
  const fromSpace = (v: number) => (log ? Math.exp(v) : v);
  const priorInSpace = log ? (() => { const m = logMoments(d.mean, d.sd); return { mean: m.lambda, sd: m.zeta }; })() : { mean: d.mean, sd: d.sd };
  const readings = existing.tests.map(toSpace);
  for (let j = 0; j < n; j++) {
    let next: number;
    if (existing.scatter === 'unknown') {
      const belief = existing.priorWeight > 0 ? { ...priorInSpace, tests: existing.priorWeight } : undefined;
      const u = updateNormalUnknownVariance(readings, errorInSpace, belief);
      next = u.location + Math.sqrt(u.readingVariance * (1 + 1 / u.kappa)) * studentTQuantile(uniform(), u.dof);
    } else {
      // known scatter σ (ln: ζ of the written CoV): μ | data ~ N(μₙ, vₙ), a reading ~ N(μₙ, vₙ + σ² + σₘ²)
      const sigma = priorInSpace.sd;
      const readingVariance = sigma * sigma + errorInSpace * errorInSpace;
      const priorPrecision = existing.priorWeight / (sigma * sigma);
      const precision = priorPrecision + readings.length / readingVariance;
      const mean = (priorPrecision * priorInSpace.mean + readings.reduce((a, b) => a + b, 0) / readingVariance) / precision;
      next = mean + Math.sqrt(1 / precision + readingVariance) * normal();
    }
    readings.push(next);
  }
  return updatedSpec(prior, { ...existing, tests: readings.map(fromSpace) }).spec;
}
