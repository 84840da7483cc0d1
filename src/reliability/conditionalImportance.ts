/**
 * P(g ≤ 0 | h > 0) = P(g ≤ 0 ∩ h > 0) / P(h > 0) by importance sampling in standard normal space
 * (docs/evidence.md §5). Knows nothing of columns: g and h are any two limit states on the same
 * variables, h > 0 the survived event.
 *
 * Joint: a standard normal density shifted to a centre c, u = c + z, weight
 *     w = φ(u)/φ(u − c) = exp(−c·z − |c|²/2)
 * (Melchers & Beck, Structural Reliability Analysis and Prediction, 3rd ed., 2018, importance
 * sampling). c is the most probable point of the joint domain {g ≤ 0, h ≥ 0}: g's FORM design
 * point when the survival holds there; otherwise the point nearest the origin on both linearised
 * boundaries, found by repeated linearisation (jointDesignPoint below). Any c keeps the estimate
 * unbiased; c only sets its variance.
 * Survival: crude Monte Carlo when FORM says it was likely (Φ(β_h) ≥ SURVIVAL_IS_BELOW), else
 * importance sampling at h's design point (the nearest point of h = 0 is the centre for h > 0 as
 * well as for h ≤ 0).
 * Ratio: CoV² = CoV_J² + CoV_S² (delta method); the two estimates use independent streams, so
 * the covariance term vanishes.
 */
import { checkedLimitState, type CheckedLimitState } from './checkedLimitState.js';
import { betaOf, type ConditionalCheck, type ConditionalFormResult, type ConditionedProblem } from './conditionalFailure.js';
import { DEFAULT_STEP, finiteDifferenceGradient } from './finiteDifferenceGradient.js';
import { BETA_TOLERANCE, statisticalInterval } from './formCheck.js';
import { CONDITIONAL_IS_STREAM_BASE } from './streams.js';
import { isEstimate } from './importanceSampling.js';
import { normalCdf } from '../probability/normal.js';
import { normalStream } from '../probability/rng.js';
import { throwIfInterrupted } from '../runtime/interruptFlag.js';

/** The default target CoV of the ratio. */
export const CONDITIONAL_IS_TARGET_COV = 0.1;
/** Largest number of samples of each of the two estimates. */
export const CONDITIONAL_IS_MAX_SAMPLES = 100_000;
/** Below this FORM probability of the survival, P(h > 0) is estimated by importance sampling too. */
export const SURVIVAL_IS_BELOW = 0.05;
/** Samples between looks at the stopping rule. */
const CHUNK = 256;
/** Hits needed before a variance estimate is trusted (as importanceSampling.ts). */
const MIN_HITS = 10;
const MAX_CENTRE_ITERATIONS = 30;

/** Where the joint estimate is centred. */
export type ConditionalCentre = 'failure_design_point' | 'joint_design_point' | 'origin';

export interface SampledProbability {
  p: number;
  cov: number;
  samples: number;
  /** samples inside the event */
  hits: number;
  method: 'mc' | 'is';
}

export interface ConditionalImportanceResult {
  /** P(g ≤ 0 | h > 0), its CoV (delta method) and β */
  pf: number;
  cov: number;
  beta: number;
  /** P(g ≤ 0 ∩ h > 0) */
  joint: SampledProbability;
  /** P(h > 0) */
  survival: SampledProbability;
  /** samples of both estimates */
  samples: number;
  /** calls of g and h, the centre's search included */
  calls: number;
  centre: ConditionalCentre;
  centreU: number[];
  /** the search for the joint design point met its tolerance (always true for the other centres) */
  centreConverged: boolean;
  /** stopped at the target CoV rather than at the largest number of samples */
  reachedTarget: boolean;
  targetCov: number;
  seed: number;
}

export interface ConditionalImportanceOptions {
  seed: number;
  targetCov?: number;
  maxSamples?: number;
}

/** Weighted mean (at most 1) and CoV of n samples with Σ w·1 and Σ w²·1 (w = 1 for crude Monte Carlo): importanceSampling.ts's estimator. */
function weightedEstimate(n: number, sumW: number, sumW2: number): { p: number; cov: number } {
  const e = isEstimate(n, sumW, sumW2);
  return { p: e.pf, cov: e.cov };
}

const dot = (a: ArrayLike<number>, b: ArrayLike<number>): number => {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * b[i];
  return s;
};

/**
 * Samples `inside(u)` around `centre` (null: crude Monte Carlo) on its own stream until
 * `done(estimate)` at a chunk boundary or `max` samples.
 */
function sampleEvent(
  n: number,
  centre: readonly number[] | null,
  inside: (u: Float64Array) => boolean,
  stream: () => number,
  max: number,
  done: (e: { p: number; cov: number }, hits: number) => boolean,
): SampledProbability & { reached: boolean } {
  const u = new Float64Array(n);
  const z = new Float64Array(n);
  const c = centre ?? new Array<number>(n).fill(0);
  const halfC2 = 0.5 * dot(c, c);
  let sumW = 0;
  let sumW2 = 0;
  let hits = 0;
  let k = 0;
  while (k < max) {
    throwIfInterrupted('conditional importance sampling');
    const end = Math.min(max, k + CHUNK);
    for (; k < end; k++) {
      for (let i = 0; i < n; i++) {
        z[i] = stream();
        u[i] = c[i] + z[i];
      }
      if (!inside(u)) continue;
      const w = centre ? Math.exp(-dot(c, z) - halfC2) : 1;
      hits++;
      sumW += w;
      sumW2 += w * w;
    }
    if (hits >= MIN_HITS && done(weightedEstimate(k, sumW, sumW2), hits)) {
      return { ...weightedEstimate(k, sumW, sumW2), samples: k, hits, method: centre ? 'is' : 'mc', reached: true };
    }
  }
  return { ...weightedEstimate(k, sumW, sumW2), samples: k, hits, method: centre ? 'is' : 'mc', reached: false };
}

/**
 * The point nearest the origin of {g ≤ 0, h ≥ 0}: at each step both limit states are linearised
 * at the current point (central differences) and the nearest point of the two half-spaces
 * {a·v ≤ b} ∩ {c·v ≥ d} is taken. That small quadratic programme is solved exactly by trying
 * each active set (none, g, h, both) and keeping the nearest feasible candidate (the optimum of a
 * convex programme is the nearest point of its own active set). Exact in one step for linear g
 * and h.
 */
export function jointDesignPoint(G: CheckedLimitState, H: CheckedLimitState, start: readonly number[]): { u: number[]; converged: boolean } {
  const n = start.length;
  let u: Float64Array = Float64Array.from(start);
  const a = new Float64Array(n);
  const c = new Float64Array(n);
  const work = new Float64Array(n);
  const step = DEFAULT_STEP.central;
  for (let it = 0; it < MAX_CENTRE_ITERATIONS; it++) {
    const g0 = G(u);
    const h0 = H(u);
    finiteDifferenceGradient(G, u, g0, 'central', step, a, work);
    finiteDifferenceGradient(H, u, h0, 'central', step, c, work);
    const b = dot(a, u) - g0;
    const d = dot(c, u) - h0;
    const aa = dot(a, a);
    const cc = dot(c, c);
    const ac = dot(a, c);
    const candidates: Float64Array[] = [new Float64Array(n)];
    if (aa > 0) candidates.push(a.map((ai) => (ai * b) / aa));
    if (cc > 0) candidates.push(c.map((ci) => (ci * d) / cc));
    const det = aa * cc - ac * ac;
    if (det > 1e-12 * aa * cc) {
      // v = λa + μc with a·v = b, c·v = d
      const lambda = (b * cc - d * ac) / det;
      const mu = (d * aa - b * ac) / det;
      candidates.push(a.map((ai, i) => lambda * ai + mu * c[i]));
    }
    const slack = 1e-12 * (1 + Math.abs(b) + Math.abs(d));
    let best: Float64Array | null = null;
    for (const v of candidates) {
      if (dot(a, v) > b + slack || dot(c, v) < d - slack) continue;
      if (!best || dot(v, v) < dot(best, best)) best = v;
    }
    // the two linearised domains do not meet: no nearer point to offer
    if (!best) return { u: Array.from(u), converged: false };
    let move = 0;
    for (let i = 0; i < n; i++) move = Math.max(move, Math.abs(best[i] - u[i]));
    u = best;
    if (move <= 1e-6 * Math.max(1, Math.sqrt(dot(u, u)))) return { u: Array.from(u), converged: true };
  }
  return { u: Array.from(u), converged: false };
}

/**
 * The estimate, given the conditional FORM result of the same problem (its two design points
 * choose the centres). Undefined when FORM already knows the answer exactly (g never or always
 * fails, β_g = ±∞). Same seed, same numbers.
 */
export function conditionalImportance(
  problem: ConditionedProblem,
  formResult: ConditionalFormResult,
  opts: ConditionalImportanceOptions,
): ConditionalImportanceResult | undefined {
  const { failure, proof } = formResult;
  if (!Number.isFinite(failure.beta)) return undefined;
  const n = problem.transform.n;
  const targetCov = opts.targetCov ?? CONDITIONAL_IS_TARGET_COV;
  const max = opts.maxSamples ?? CONDITIONAL_IS_MAX_SAMPLES;
  const method = 'conditional importance sampling';
  const G = checkedLimitState(problem, method);
  const H = checkedLimitState({ names: problem.names, transform: problem.transform, g: problem.h }, method);

  // P(h > 0) first: the joint estimate stops on the CoV of the ratio
  const useIs = Number.isFinite(proof.beta) && normalCdf(proof.beta) < SURVIVAL_IS_BELOW;
  const survival = sampleEvent(
    n, useIs ? proof.designPointU : null, (u) => H(u) > 0,
    normalStream(opts.seed, CONDITIONAL_IS_STREAM_BASE + 1), max,
    (e) => e.cov <= targetCov / 2,
  );

  let centre: ConditionalCentre;
  let centreU: number[];
  let centreConverged = true;
  const origin = new Float64Array(n);
  if (failure.originFails && H(origin) > 0) {
    // the joint event is not rare: sample around the origin (crude Monte Carlo with weights 1)
    centre = 'origin';
    centreU = Array.from(origin);
  } else if (H(Float64Array.from(failure.designPointU)) > 0) {
    centre = 'failure_design_point';
    centreU = failure.designPointU.slice();
  } else {
    centre = 'joint_design_point';
    const found = jointDesignPoint(G, H, failure.designPointU);
    centreU = found.u;
    centreConverged = found.converged;
  }

  const joint = sampleEvent(
    n, centreU, (u) => G(u) <= 0 && H(u) > 0,
    normalStream(opts.seed, CONDITIONAL_IS_STREAM_BASE), max,
    (e) => Math.hypot(e.cov, survival.cov) <= targetCov,
  );
  const pf = joint.hits > 0 && survival.p > 0 ? Math.min(1, joint.p / survival.p) : 0;
  const cov = joint.hits > 0 ? Math.hypot(joint.cov, survival.cov) : Infinity;
  const strip = ({ reached: _r, ...rest }: SampledProbability & { reached: boolean }): SampledProbability => rest;
  return {
    pf, cov, beta: betaOf(pf),
    joint: strip(joint), survival: strip(survival),
    samples: joint.samples + survival.samples,
    calls: G.calls() + H.calls(),
    centre, centreU, centreConverged,
    reachedTarget: joint.reached && cov <= targetCov,
    targetCov, seed: opts.seed,
  };
}

/** The centre in words (terminal, report). */
export const CENTRE_WORDS: Record<ConditionalCentre, string> = {
  failure_design_point: "g's design point",
  joint_design_point: 'the design point of failure and survival together',
  origin: 'the origin',
};

/**
 * Does the importance-sampling ratio confirm FORM's conditional β? The rule of FORM's own
 * sampling check (formCheck.ts): FORM's β within the estimate's CHECK_SIGMAS interval on pf,
 * widened by BETA_TOLERANCE. Undefined when no sample fell in the joint domain (no estimate).
 */
export function importanceCheck(formBeta: number, r: ConditionalImportanceResult): ConditionalCheck | undefined {
  if (r.joint.hits === 0 || !Number.isFinite(r.cov) || !(r.pf > 0)) return undefined;
  const [low, high] = statisticalInterval(r.pf, r.cov);
  const agrees = formBeta >= low - BETA_TOLERANCE && formBeta <= high + BETA_TOLERANCE;
  return {
    agrees,
    method: 'is',
    estimate: { beta: r.beta, pf: r.pf, upperBound: false },
    reason: `importance sampling gives β = ${r.beta.toFixed(2)} (${r.samples} samples centred at ${CENTRE_WORDS[r.centre]}, CoV ${(100 * r.cov).toFixed(0)} %), ${agrees ? 'which agrees with' : 'which disagrees with'} FORM's β = ${formBeta.toFixed(2)}`,
  };
}
