/**
 * Subset simulation (Au & Beck 2001, Prob. Eng. Mech. 16(4):263–277) with conditional sampling
 * in u-space (Papaioannou, Betz, Zwirglmaier & Straub 2015, Prob. Eng. Mech. 41): a candidate
 * v = sqrt(1 − σ²)·u + σ·ξ, ξ ~ N(0, I), leaves N(0, I) invariant, so it is accepted exactly
 * when it stays in the current intermediate failure domain G(v) <= b.
 *
 * Level 0 draws N independent samples; each further level keeps the p0·N lowest g as seeds,
 * sets b halfway between the p0·N-th and the next g, and grows each seed into a chain of 1/p0
 * states. Stops when at least p0·N samples fail (g <= 0): pf = Π p_i.
 * CoV² ≈ Σ (1 − p_i)/(N p_i)·(1 + γ_i), γ_i = 2 Σ_k (1 − k/Ns) ρ_i(k) from the indicator's
 * correlation along the chains (Au & Beck 2001); levels are treated as independent, so this
 * slightly understates the true CoV.
 */
import { normalStream } from '../probability/rng.js';
import type { ReliabilityProblem, SubsetLevel, SubsetResult } from './types.js';
import { checkedLimitState } from './checkedLimitState.js';
import { SUBSET_STREAM_BASE } from './streams.js';
import { betaFromPf } from './monteCarlo.js';

export interface SubsetOptions {
  seed: number;
  /** Samples per level N (default 1000); N·p0 must be a whole number dividing N. */
  samplesPerLevel?: number;
  /** Conditional probability of each intermediate level (default 0.1). */
  p0?: number;
  /** Cap on the number of levels (default 20, i.e. pf down to about p0^20). */
  maxLevels?: number;
  /** Spread σ of the conditional-sampling proposal (default 0.6). */
  proposalSd?: number;
  /** Run number: independent runs with one seed use different streams. */
  run?: number;
}

/** Streams reserved for the levels of one run. */
const STREAMS_PER_RUN = 1000;
/** Independent runs at most when a target CoV is asked for. */
export const SUBSET_MAX_RUNS = 100;

export interface SubsetTargetOptions extends SubsetOptions {
  /** Add independent runs (streams of run 0, 1, 2, ...) until the CoV of their mean is at or below this. */
  targetCov?: number;
  /** Cap on the runs (default SUBSET_MAX_RUNS). */
  maxRuns?: number;
}

/**
 * Subset simulation to a target CoV. One run's CoV is fixed by N and the number of levels, so
 * the estimate is refined by independent runs: pf = mean of the runs' pf_k, and
 * Var = Σ (CoV_k pf_k)² / K² (independent runs). Stops as soon as that CoV reaches the target.
 * Without a target it is exactly one run. The levels reported are the first run's.
 */
export function subsetToTargetCov(problem: ReliabilityProblem, opts: SubsetTargetOptions): SubsetResult {
  const first = subsetSimulation(problem, { ...opts, run: opts.run ?? 0 });
  const target = opts.targetCov;
  if (target === undefined || !(first.cov > target)) return first;
  const maxRuns = Math.min(opts.maxRuns ?? SUBSET_MAX_RUNS, Math.floor(4294967296 / STREAMS_PER_RUN));
  const runs = [first];
  let estimate = { pf: first.pf, cov: first.cov };
  while (runs.length < maxRuns && !(estimate.cov <= target)) {
    runs.push(subsetSimulation(problem, { ...opts, run: (opts.run ?? 0) + runs.length }));
    estimate = meanOfRuns(runs);
  }
  const warnings = [...new Set(runs.flatMap((r) => r.warnings))];
  if (!(estimate.cov <= target)) warnings.push(`the target CoV ${target} was not reached in ${runs.length} independent runs (CoV ${estimate.cov.toPrecision(2)})`);
  return {
    ...first,
    pf: estimate.pf,
    cov: estimate.cov,
    beta: betaFromPf(estimate.pf),
    calls: runs.reduce((a, r) => a + r.calls, 0),
    converged: runs.every((r) => r.converged),
    runs: runs.length,
    warnings,
  };
}

function meanOfRuns(runs: SubsetResult[]): { pf: number; cov: number } {
  const k = runs.length;
  const pf = runs.reduce((a, r) => a + r.pf, 0) / k;
  const variance = runs.reduce((a, r) => a + (r.cov * r.pf) ** 2, 0) / (k * k);
  return { pf, cov: pf > 0 ? Math.sqrt(variance) / pf : Infinity };
}

export function subsetSimulation(problem: ReliabilityProblem, opts: SubsetOptions): SubsetResult {
  const n = problem.transform.n;
  const N = opts.samplesPerLevel ?? 1000;
  const p0 = opts.p0 ?? 0.1;
  const maxLevels = Math.min(opts.maxLevels ?? 20, STREAMS_PER_RUN);
  const sigma = opts.proposalSd ?? 0.6;
  const nc = Math.round(p0 * N);
  if (!(p0 > 0 && p0 < 1) || nc < 1 || N % nc !== 0 || Math.abs(nc - p0 * N) > 1e-9 * N) {
    throw new Error(`subset simulation needs N·p0 to be a whole number dividing N (N = ${N}, p0 = ${p0})`);
  }
  if (!(sigma > 0 && sigma <= 1)) throw new Error(`proposal spread must be in (0, 1], got ${sigma}`);
  const ns = N / nc;
  const rho = Math.sqrt(1 - sigma * sigma);
  const G = checkedLimitState(problem, 'subset simulation');
  const streamBase = SUBSET_STREAM_BASE + (opts.run ?? 0) * STREAMS_PER_RUN;

  let U = new Float64Array(N * n);
  let gv = new Float64Array(N);
  let nextU = new Float64Array(N * n);
  let nextG = new Float64Array(N);
  const candidate = new Float64Array(n);
  const row = new Float64Array(n);

  const first = normalStream(opts.seed, streamBase);
  for (let s = 0; s < N; s++) {
    for (let i = 0; i < n; i++) row[i] = first();
    U.set(row, s * n);
    gv[s] = G(row);
  }

  const levels: SubsetLevel[] = [];
  const warnings: string[] = [];
  let converged = false;
  for (let level = 0; ; level++) {
    const order = Array.from({ length: N }, (_, i) => i).sort((a, b) => gv[a] - gv[b] || a - b);
    let failures = 0;
    for (let s = 0; s < N; s++) if (gv[s] <= 0) failures++;
    if (failures >= nc || level === maxLevels - 1) {
      levels.push({ threshold: 0, p: failures / N, gamma: level === 0 ? 0 : chainCorrelationFactor(gv, 0, nc, ns) });
      converged = failures >= nc;
      break;
    }
    const b = (gv[order[nc - 1]] + gv[order[nc]]) / 2;
    let below = 0;
    for (let s = 0; s < N; s++) if (gv[s] <= b) below++;
    levels.push({ threshold: b, p: below / N, gamma: level === 0 ? 0 : chainCorrelationFactor(gv, b, nc, ns) });

    // Grow each seed into a chain of ns states, chain j at positions j·ns ... j·ns + ns − 1.
    const normal = normalStream(opts.seed, streamBase + level + 1);
    for (let j = 0; j < nc; j++) {
      const seedIndex = order[j];
      let at = j * ns;
      for (let i = 0; i < n; i++) row[i] = U[seedIndex * n + i];
      let gRow = gv[seedIndex];
      nextU.set(row, at * n);
      nextG[at] = gRow;
      for (let step = 1; step < ns; step++) {
        for (let i = 0; i < n; i++) candidate[i] = rho * row[i] + sigma * normal();
        const gc = G(candidate);
        if (gc <= b) {
          row.set(candidate);
          gRow = gc;
        }
        at++;
        nextU.set(row, at * n);
        nextG[at] = gRow;
      }
    }
    [U, nextU] = [nextU, U];
    [gv, nextG] = [nextG, gv];
  }

  let pf = 1;
  let cov2 = 0;
  for (const l of levels) {
    pf *= l.p;
    cov2 += l.p > 0 ? ((1 - l.p) / (N * l.p)) * (1 + l.gamma) : Infinity;
  }
  if (!converged) {
    warnings.push(`subset simulation stopped at the cap of ${maxLevels} levels before reaching g <= 0${pf === 0 ? ': pf is below about ' + (p0 ** (maxLevels - 1) / N).toExponential(1) : ''}`);
  }
  return { pf, cov: Math.sqrt(cov2), beta: betaFromPf(pf), calls: G.calls(), levels, converged, seed: opts.seed, warnings };
}

/**
 * γ = 2 Σ_{k=1}^{ns−1} (1 − k/ns) ρ(k), ρ(k) = R(k)/R(0) of the indicator 1[g <= b] along the
 * nc chains of length ns (Au & Beck 2001, eq. for the correlated estimator).
 */
export function chainCorrelationFactor(gv: Float64Array, b: number, nc: number, ns: number): number {
  const N = nc * ns;
  let hits = 0;
  for (let s = 0; s < N; s++) if (gv[s] <= b) hits++;
  const p = hits / N;
  const r0 = p * (1 - p);
  if (!(r0 > 0)) return 0;
  let gamma = 0;
  for (let k = 1; k < ns; k++) {
    let sum = 0;
    for (let j = 0; j < nc; j++) {
      const base = j * ns;
      for (let l = 0; l + k < ns; l++) if (gv[base + l] <= b && gv[base + l + k] <= b) sum++;
    }
    const rk = sum / (N - k * nc) - p * p;
    gamma += 2 * (1 - k / ns) * (rk / r0);
  }
  return Math.max(0, gamma);
}
