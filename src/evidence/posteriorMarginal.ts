/**
 * A distribution fitted to posterior draws of one variable, so that every reliability method can
 * use the updated variable as an ordinary marginal. A positive variable gets a lognormal with the
 * draws' mean and sd of ln x; any other a normal with their mean and sd. This keeps the first two
 * moments (on the log scale for a lognormal) and drops the shape beyond them: an approximation
 * that the summary states.
 */
import type { DistSpec } from '../probability/distribution.js';
import { EvidenceError } from './evidenceError.js';

export interface PosteriorMoments {
  mean: number;
  sd: number;
  /** 5 % and 95 % fractiles of the draws */
  q05: number;
  q95: number;
}

export function drawMoments(values: Float64Array): PosteriorMoments {
  const n = values.length;
  if (n < 2) throw new EvidenceError('a posterior needs at least two draws');
  let s = 0;
  for (let i = 0; i < n; i++) s += values[i];
  const mean = s / n;
  let ss = 0;
  for (let i = 0; i < n; i++) ss += (values[i] - mean) ** 2;
  const sorted = Float64Array.from(values).sort();
  const at = (p: number): number => sorted[Math.min(n - 1, Math.max(0, Math.round(p * (n - 1))))];
  return { mean, sd: Math.sqrt(ss / (n - 1)), q05: at(0.05), q95: at(0.95) };
}

/** lognormal when every draw is > 0 and `positive`, else normal. */
export function fitPosteriorMarginal(values: Float64Array, positive: boolean): DistSpec {
  const n = values.length;
  let allPositive = positive;
  for (let i = 0; i < n && allPositive; i++) if (!(values[i] > 0)) allPositive = false;
  if (allPositive) {
    const logs = values.map(Math.log);
    const m = drawMoments(logs);
    if (!(m.sd > 0)) throw new EvidenceError('the posterior draws of a variable do not vary: the measurements leave no uncertainty to fit');
    const mean = Math.exp(m.mean + 0.5 * m.sd * m.sd);
    return { dist: 'lognormal', mean, sd: mean * Math.sqrt(Math.expm1(m.sd * m.sd)) };
  }
  const m = drawMoments(values);
  if (!(m.sd > 0)) throw new EvidenceError('the posterior draws of a variable do not vary: the measurements leave no uncertainty to fit');
  return { dist: 'normal', mean: m.mean, sd: m.sd };
}
