/**
 * Posterior draws in standard-normal space by adaptive random-walk Metropolis (Haario, Saksman &
 * Tamminen, "An adaptive Metropolis algorithm", Bernoulli 7(2), 2001), several seeded chains.
 *
 * Target: p(u | data) ∝ φ_d(u) · L(u), u ∈ ℝ^d with the independent standard normal prior of the
 * iso-probabilistic transform and ln L given by the caller. Proposal u' = u + s·C ξ, ξ ~ N(0, I).
 * During the warm-up C is the Cholesky factor of the chain's own covariance so far (started at I)
 * and the scale s follows a Robbins–Monro step toward an acceptance rate of 0.25 (started at
 * 2.38/√d, Gelman, Roberts & Gilks 1996); after the warm-up both are frozen, so the kept draws are
 * an ordinary Metropolis chain with the posterior as its stationary distribution.
 * Each chain starts at a prior draw (spread out relative to the posterior, as the R̂ diagnostic
 * wants) and draws only from its own stream: the same seed gives the same draws.
 */
import { choleskyLower, lowerTimes } from '../probability/cholesky.js';
import { normalStream, uniformStream } from '../probability/rng.js';
import { throwIfInterrupted } from '../runtime/interruptFlag.js';
import { EvidenceError } from './evidenceError.js';

/** Stream range of the posterior sampler: chain c draws normals from base + 2c, uniforms from base + 2c + 1. */
export const POSTERIOR_STREAM_BASE = 7 * 2 ** 32; // between the ranges of reliability/streams.ts (0 … 6·2³², then 8·2³²)

export interface PosteriorSamplerOptions {
  seed: number;
  chains?: number;
  /** warm-up iterations per chain (adaptation; discarded) */
  warmup?: number;
  /** kept draws per chain */
  draws?: number;
}

export interface PosteriorDraws {
  readonly dimension: number;
  /** draws[c]: chain c, row-major draws × dimension */
  readonly draws: readonly Float64Array[];
  /** acceptance rate of each chain over the kept draws */
  readonly acceptance: readonly number[];
  /** calls of the log-likelihood */
  readonly calls: number;
}

const TARGET_ACCEPTANCE = 0.25;
const ADAPT_EVERY = 50;
const START_TRIES = 1000;

/** Draws of u from φ_d(u)·exp(logLikelihood(u)); logLikelihood may return −∞ (impossible), never NaN. */
export function samplePosterior(
  dimension: number,
  logLikelihood: (u: Float64Array) => number,
  options: PosteriorSamplerOptions,
): PosteriorDraws {
  const d = dimension;
  const chains = options.chains ?? 4;
  const warmup = options.warmup ?? 2000;
  const kept = options.draws ?? 2000;
  if (!(Number.isInteger(d) && d >= 1)) throw new RangeError(`samplePosterior: dimension must be a positive integer (got ${d})`);
  let calls = 0;
  const logTarget = (u: Float64Array): number => {
    calls++;
    const l = logLikelihood(u);
    if (Number.isNaN(l)) throw new Error('samplePosterior: the log-likelihood returned NaN');
    let q = 0;
    for (let i = 0; i < d; i++) q += u[i] * u[i];
    return l - 0.5 * q;
  };
  const out: Float64Array[] = [];
  const acceptance: number[] = [];
  for (let c = 0; c < chains; c++) {
    const normal = normalStream(options.seed, POSTERIOR_STREAM_BASE + 2 * c);
    const uniform = uniformStream(options.seed, POSTERIOR_STREAM_BASE + 2 * c + 1);
    const u = new Float64Array(d);
    let lp = -Infinity;
    for (let t = 0; t < START_TRIES && lp === -Infinity; t++) {
      for (let i = 0; i < d; i++) u[i] = normal();
      lp = logTarget(u);
    }
    if (lp === -Infinity) throw new EvidenceError(`no starting point of ${START_TRIES} prior draws can explain the measurements: check their values and units`);
    const proposal = new Float64Array(d);
    const step = new Float64Array(d);
    const xi = new Float64Array(d);
    let C: Float64Array = identity(d);
    let scale = 2.38 / Math.sqrt(d);
    // running mean and covariance (Welford) of the warm-up path
    const mean = new Float64Array(d);
    const co = new Float64Array(d * d);
    let count = 0;
    let acceptedBatch = 0;
    const chain = new Float64Array(kept * d);
    let acceptedKept = 0;
    for (let it = 0; it < warmup + kept; it++) {
      if ((it & 255) === 0) throwIfInterrupted('posterior sampling');
      for (let i = 0; i < d; i++) xi[i] = normal();
      lowerTimes(C, d, xi, step);
      for (let i = 0; i < d; i++) proposal[i] = u[i] + scale * step[i];
      const lq = logTarget(proposal);
      const accept = lq >= lp || Math.log(uniform()) < lq - lp;
      if (accept) {
        u.set(proposal);
        lp = lq;
      }
      if (it < warmup) {
        if (accept) acceptedBatch++;
        count++;
        for (let i = 0; i < d; i++) {
          const delta = u[i] - mean[i];
          mean[i] += delta / count;
          for (let j = 0; j <= i; j++) co[i * d + j] += delta * (u[j] - mean[j]);
        }
        if (count % ADAPT_EVERY === 0) {
          const rate = acceptedBatch / ADAPT_EVERY;
          acceptedBatch = 0;
          scale *= Math.exp((rate - TARGET_ACCEPTANCE) / Math.sqrt(count / ADAPT_EVERY));
          // the path's own covariance once it has seen enough moves (a small ridge keeps it positive definite)
          if (count >= 4 * ADAPT_EVERY) {
            const cov: number[][] = Array.from({ length: d }, (_, i) =>
              Array.from({ length: d }, (_, j) => (i >= j ? co[i * d + j] : co[j * d + i]) / (count - 1) + (i === j ? 1e-10 : 0)),
            );
            const L = choleskyLower(cov);
            if (L !== null) C = L;
          }
        }
      } else {
        if (accept) acceptedKept++;
        chain.set(u, (it - warmup) * d);
      }
    }
    out.push(chain);
    acceptance.push(acceptedKept / kept);
  }
  return { dimension: d, draws: out, acceptance, calls };
}

function identity(d: number): Float64Array {
  const I = new Float64Array(d * d);
  for (let i = 0; i < d; i++) I[i * d + i] = 1;
  return I;
}
