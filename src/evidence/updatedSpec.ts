/**
 * Test results of one normal or lognormal variable → its updated distribution (a DistSpec, SI).
 * The one place that chooses which conjugate update applies (docs/evidence.md): the scenario
 * reader calls it once per variable, test planning once per simulated outcome.
 */
import type { DistSpec } from '../probability/distribution.js';
import { makeDistribution } from '../probability/makeDistribution.js';
import { updateLognormalKnownVariance, updateLognormalUnknownVariance } from './lognormalPopulation.js';
import { updateNormalKnownVariance, updateNormalUnknownVariance } from './normalPopulation.js';
import { updateLognormalItem, updateNormalItem } from './singleItemTest.js';

export interface TestSet {
  /** SI */
  readonly tests: readonly number[];
  readonly tested: 'similar' | 'this_one';
  readonly scatter: 'unknown' | 'known';
  readonly priorWeight: number;
  readonly measurementSd?: number;
  readonly measurementCov?: number;
}

export function lognormalSpec(lambda: number, zeta: number): DistSpec {
  const mean = Math.exp(lambda + 0.5 * zeta * zeta);
  return { dist: 'lognormal', mean, sd: mean * Math.sqrt(Math.expm1(zeta * zeta)) };
}

/** The measurement error on the scale each update works on: sd in X's units and CoV at the sample mean. */
export function measurementErrors(t: TestSet): { errorSd: number; errorCov: number } {
  const sampleMean = t.tests.reduce((a, b) => a + b, 0) / t.tests.length;
  return {
    errorSd: t.measurementSd ?? (t.measurementCov ?? 0) * Math.abs(sampleMean),
    errorCov: t.measurementCov ?? (t.measurementSd ?? 0) / sampleMean,
  };
}

/** Throws EvidenceError (message only) when the tests cannot update `prior`. */
export function updatedSpec(prior: DistSpec, t: TestSet): { spec: DistSpec; method: string } {
  if (prior.dist !== 'normal' && prior.dist !== 'lognormal') throw new Error(`updatedSpec: ${prior.dist} is not updatable`);
  const d = makeDistribution(prior);
  const mean = d.mean;
  const sd = d.sd;
  const { errorSd, errorCov } = measurementErrors(t);
  const tests = t.tests;
  const priorWeight = t.priorWeight;
  if (t.tested === 'this_one') {
    let spec: DistSpec;
    if (prior.dist === 'normal') {
      const post = updateNormalItem(mean, sd, tests, errorSd);
      spec = { dist: 'normal', mean: post.mean, sd: post.sd };
    } else {
      const post = updateLognormalItem(mean, sd, tests, errorCov);
      spec = lognormalSpec(post.lambda, post.zeta);
    }
    const method = `test${tests.length === 1 ? '' : 's'} of this item: ${prior.dist} prior and reading${tests.length === 1 ? '' : 's'} with measurement error, conjugate update${prior.dist === 'lognormal' ? ' on ln X' : ''}`;
    return { spec, method };
  }
  if (t.scatter === 'known') {
    let spec: DistSpec;
    if (prior.dist === 'normal') {
      const p = updateNormalKnownVariance(tests, sd, errorSd, mean, priorWeight);
      spec = { dist: 'normal', mean: p.mean, sd: p.sd };
    } else {
      const p = updateLognormalKnownVariance(tests, sd / mean, errorCov, mean, priorWeight);
      spec = lognormalSpec(p.mean, p.sd);
    }
    return { spec, method: `population with known scatter, unknown mean${priorWeight > 0 ? ` (prior worth ${priorWeight} tests)` : ''}: ${prior.dist} predictive` };
  }
  const belief = priorWeight > 0 ? { mean, sd, tests: priorWeight } : undefined;
  let spec: DistSpec;
  if (prior.dist === 'normal') {
    const p = updateNormalUnknownVariance(tests, errorSd, belief).predictive;
    spec = { dist: 'studentt', loc: p.loc, scale: p.scale, dof: p.dof };
  } else {
    const p = updateLognormalUnknownVariance(tests, errorCov, belief);
    spec = { dist: 'logstudentt', loc: p.loc, scale: p.scale, dof: p.dof };
  }
  const method = `population with unknown mean and scatter${priorWeight > 0 ? ` (prior worth ${priorWeight} tests)` : ' (non-informative prior)'}: ${spec.dist === 'studentt' ? 'Student-t' : 'log-Student-t'} predictive`;
  return { spec, method };
}
