/**
 * A cheap self-check of FORM before FORM (or SORM) alone decides anything.
 *
 * Defensive mixture importance sampling (Hesterberg 1995, Technometrics 37:185–194): a share
 * w0 of the samples from φ(u) itself, the rest from φ(u − u_i*) around each design point of
 * FORM's system in proportion to its Φ(−β_i), with the weight φ(u)/q(u) of the whole mixture
 * q = w0 φ + Σ w_i φ(· − u_i*). The weight never exceeds 1/w0, so a failure region that FORM
 * missed but that carries more than about 1/(w0 N) of probability still shows up. When FORM's
 * pf is large the check is plain Monte Carlo. Fixed seed: the same problem always gets the same
 * check.
 *
 * Sequential: the samples come in batches of FORM_CHECK_BATCH, each with the same mixture
 * allocation, and the check stops after a batch once agreement is shown (see `agreementShown`),
 * up to the budget. A disagreement, or a run where nothing failed, always gets the full budget:
 * there the check's own estimate replaces FORM's and should be as precise as the budget allows.
 *
 * FORM agrees when its (system) β lies in the check's band: the check's pf ± CHECK_SIGMAS
 * standard deviations on the log scale, converted to β and widened by BETA_TOLERANCE for the
 * linearisation error FORM is allowed.
 */
import { normalQuantileUpper, normalSf } from '../probability/normal.js';
import { BlockRng } from '../probability/blockRng.js';
import { fillNormal } from '../probability/ziggurat.js';
import { batchLimitState } from './batchLimitState.js';
import { FORM_CHECK_STREAM_BASE } from './streams.js';
import type { FormResult, ReliabilityProblem } from './types.js';

export interface FormCheckOptions {
  seed?: number;
  /** Most limit-state calls (default 4000); the check stops sooner once agreement is shown. */
  samples?: number;
}

export interface FormCheckResult {
  method: 'importance sampling' | 'Monte Carlo';
  pf: number;
  /** Infinity when no sample failed. */
  cov: number;
  /** −Φ⁻¹(pf); Infinity when pf = 0. */
  beta: number;
  samples: number;
  failures: number;
  calls: number;
  seed: number;
  /** β values consistent with the check: [low, high] (statistical band widened by BETA_TOLERANCE). */
  betaBand: [number, number];
  /**
   * When no sample failed: a 95 % upper bound on pf from the plain Monte Carlo share of the
   * samples (rule of three, 3/N); otherwise null.
   */
  upperBound: number | null;
  /** FORM's system β lies within the band. */
  agrees: boolean;
  /** One plain sentence. */
  reason: string;
}

export const FORM_CHECK_SAMPLES = 4000;
export const FORM_CHECK_SEED = 1;
/** Samples per batch of the sequential check. */
export const FORM_CHECK_BATCH = 500;
/** Standard deviations of the check allowed (log scale). */
export const CHECK_SIGMAS = 4;
/** β difference FORM may show for its linearisation alone. */
export const BETA_TOLERANCE = 0.1;
/** Share of the samples drawn from the unshifted standard normal. */
const DEFENSIVE_SHARE = 0.2;
/** At or above this pf the check is crude Monte Carlo. */
const LARGE_PF = 0.05;

export function checkForm(problem: ReliabilityProblem, f: FormResult, opts: FormCheckOptions = {}): FormCheckResult {
  const n = problem.transform.n;
  const total = opts.samples ?? FORM_CHECK_SAMPLES;
  const seed = opts.seed ?? FORM_CHECK_SEED;
  if (!(Number.isInteger(total) && total >= 100)) throw new Error(`checkForm: samples must be an integer >= 100, got ${total}`);
  const G = batchLimitState(problem, 'FORM check', FORM_CHECK_BATCH);
  const crude = f.originFails || !(f.system.beta > 0) || f.system.pf >= LARGE_PF || !f.converged;
  const centres = crude ? [] : f.system.designPoints.map((p) => Float64Array.from(p.designPointU));
  const halfSquare = centres.map((c) => 0.5 * c.reduce((s, v) => s + v * v, 0));
  const pfs = crude ? [] : f.system.designPoints.map((p) => normalSf(p.beta));
  const formBeta = f.system.beta;
  // The block sampler's generator (ziggurat normals). fillNormal draws one stream whatever the
  // chunk sizes, so filling each batch's rows straight from it gives the same numbers in the
  // same order as drawing them one at a time.
  const rng = new BlockRng(seed, FORM_CHECK_STREAM_BASE);
  const uRows = new Float64Array(FORM_CHECK_BATCH * n);
  const gRows = new Float64Array(FORM_CHECK_BATCH);
  const exponents = new Float64Array(centres.length);
  let sumW = 0;
  let sumW2 = 0;
  let failures = 0;
  let drawn = 0;
  let defensiveDrawn = 0;
  while (drawn < total) {
    const size = Math.min(FORM_CHECK_BATCH, total - drawn);
    // Deterministic allocation within the batch; the mixture weights are the batch's realised
    // shares, which keeps each batch, and so their sum, unbiased.
    const counts = allocate(size, pfs);
    const share = counts.map((c) => c / size);
    // the batch's points in drawing order (component by component), then g over all of them
    let rows = 0;
    for (let k = 0; k < counts.length; k++) rows += counts[k];
    fillNormal(rng, uRows, rows * n);
    for (let k = 1, at = counts[0] * n; k < counts.length; k++) {
      const c = centres[k - 1];
      for (let j = 0; j < counts[k]; j++) for (let i = 0; i < n; i++, at++) uRows[at] += c[i];
    }
    G.evaluate(uRows, rows, gRows);
    for (let r = 0; r < rows; r++) {
      if (gRows[r] > 0) continue;
      const row = r * n;
      failures++;
      // φ(u)/q(u) = 1 / (w0 + Σ w_i exp(u·c_i − |c_i|²/2)), summed without overflow.
      let largest = 0;
      for (let m = 0; m < centres.length; m++) {
        let d = 0;
        const c = centres[m];
        for (let i = 0; i < n; i++) d += uRows[row + i] * c[i];
        exponents[m] = d - halfSquare[m];
        if (exponents[m] > largest) largest = exponents[m];
      }
      let scaled = share[0] * Math.exp(-largest);
      for (let m = 0; m < centres.length; m++) scaled += share[m + 1] * Math.exp(exponents[m] - largest);
      const w = Math.exp(-largest) / scaled;
      sumW += w;
      sumW2 += w * w;
    }
    drawn += size;
    defensiveDrawn += counts[0];
    if (drawn < total && failures > 0 && agreementShown(estimate(sumW, sumW2, drawn), formBeta)) break;
  }
  const { pf, cov } = estimate(sumW, sumW2, drawn);
  const beta = pf > 0 ? normalQuantileUpper(pf) : Infinity;
  const method = crude ? 'Monte Carlo' : 'importance sampling';
  const what = `${method === 'Monte Carlo' ? 'a Monte Carlo' : 'an importance-sampling'} check (${drawn} samples, seed ${seed})`;
  if (failures === 0) {
    // common practice: zero failures in N independent samples bound p by 3/N at 95 % (rule of three)
    const upperBound = Math.min(1, 3 / defensiveDrawn);
    const band: [number, number] = [crude ? normalQuantileUpper(upperBound) - BETA_TOLERANCE : Infinity, Infinity];
    const agrees = formBeta >= band[0];
    return {
      method, pf, cov, beta, samples: drawn, failures, calls: G.calls(), seed, betaBand: band, agrees, upperBound,
      reason: agrees
        ? `FORM's β = ${formBeta.toFixed(2)} agrees with ${what}: no sample failed, so pf is below about ${upperBound.toPrecision(2)}.`
        : `FORM's β = ${formBeta.toFixed(2)} is not confirmed by ${what}: no sample failed, not even near its design point, so that point is not where failure is; pf is only known to be below about ${upperBound.toPrecision(2)}.`,
    };
  }
  const interval = statisticalInterval(pf, cov);
  const band: [number, number] = [interval[0] - BETA_TOLERANCE, interval[1] + BETA_TOLERANCE];
  const agrees = formBeta >= band[0] && formBeta <= band[1];
  const upperBound = null;
  const checkText = `${what}: β = ${beta.toFixed(2)} (pf ${pf.toPrecision(3)}, CoV ${(100 * cov).toFixed(0)} %)`;
  return {
    method, pf, cov, beta, samples: drawn, failures, calls: G.calls(), seed, betaBand: band, agrees, upperBound,
    reason: agrees
      ? `FORM's β = ${formBeta.toFixed(2)} agrees with ${checkText}.`
      : `FORM's β = ${formBeta.toFixed(2)} disagrees with ${checkText}; the gap exceeds ${CHECK_SIGMAS} standard deviations plus ${BETA_TOLERANCE} in β.`,
  };
}

function estimate(sumW: number, sumW2: number, count: number): { pf: number; cov: number } {
  const pf = sumW / count;
  const variance = Math.max(0, sumW2 / count - pf * pf) / (count - 1);
  return { pf, cov: pf > 0 ? Math.sqrt(variance) / pf : Infinity };
}

/** β from pf · e^(±CHECK_SIGMAS·s), s the log-scale standard deviation: [low, high]. */
export function statisticalInterval(pf: number, cov: number): [number, number] {
  const s = Math.sqrt(Math.log1p(cov * cov));
  return [normalQuantileUpper(Math.min(1, pf * Math.exp(CHECK_SIGMAS * s))), normalQuantileUpper(pf * Math.exp(-CHECK_SIGMAS * s))];
}

/**
 * Agreement shown before the budget is spent: the check's whole CHECK_SIGMAS interval in β lies
 * within BETA_TOLERANCE of FORM's β. That says, at the confidence of the full check, that the true
 * β is within the tolerance of FORM's, which is more than the full check's agreement (the two
 * intervals merely overlap), so stopping here never lets through a FORM the full budget would have
 * refuted for a reason beyond chance.
 */
function agreementShown(e: { pf: number; cov: number }, formBeta: number): boolean {
  if (!(e.pf > 0 && Number.isFinite(e.cov))) return false;
  const [low, high] = statisticalInterval(e.pf, e.cov);
  return low >= formBeta - BETA_TOLERANCE && high <= formBeta + BETA_TOLERANCE;
}

/** The estimate to put against a target when the check governs: its pf, or its upper bound when nothing failed. */
export function checkEstimate(check: FormCheckResult): { beta: number; pf: number } {
  const pf = check.upperBound ?? check.pf;
  return { pf, beta: normalQuantileUpper(pf) };
}

/** Does a β (e.g. SORM's) lie in the check's band? */
export function withinCheckBand(check: FormCheckResult, beta: number): boolean {
  return beta >= check.betaBand[0] && beta <= check.betaBand[1];
}

/** Samples per component: the defensive share first, then the rest ∝ the design points' Φ(−β). */
function allocate(total: number, pfs: number[]): number[] {
  if (pfs.length === 0) return [total];
  const defensive = Math.round(DEFENSIVE_SHARE * total);
  const rest = total - defensive;
  const total0 = pfs.reduce((a, b) => a + b, 0);
  const weights = total0 > 0 ? pfs : pfs.map(() => 1); // every Φ(−β) underflowed: equal shares
  const sum = total0 > 0 ? total0 : pfs.length;
  const counts = weights.map((p) => Math.floor((rest * p) / sum));
  let left = rest - counts.reduce((a, b) => a + b, 0);
  for (let i = 0; left > 0; i = (i + 1) % counts.length, left--) counts[i]++;
  return [defensive, ...counts];
}
