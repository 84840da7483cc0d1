/**
 * First-order reliability method: improved HL-RF from the origin of u-space, then a few
 * deterministic restarts to look for other design points.
 *
 * β = ‖u*‖ when g(0) > 0; when g(0) <= 0 the origin already fails and β = −‖u*‖ (pf > ½).
 * pf = Φ(−β), computed as normalSf(β) (never 1 − Φ(β)). α = u* / β, importance α² (sums to 1).
 */
import { normalSf } from '../probability/normal.js';
import type { DesignPointCandidate, FormResult, ReliabilityProblem } from './types.js';
import { checkedLimitState } from './checkedLimitState.js';
import { DEFAULT_STEP, type DifferenceScheme } from './finiteDifferenceGradient.js';
import { improvedHlrf, type HlrfOutcome, type HlrfSettings } from './improvedHlrf.js';
import { gammaImportance } from './gammaImportance.js';
import { norm } from './vector.js';

export interface FormOptions {
  /** Default 100. */
  maxIterations?: number;
  /** |g(u)|/|g(0)| at convergence (default 1e-8). */
  tolG?: number;
  /** Distance of u from the line of ∇g, relative to max(1, ‖u‖) (default 1e-7). */
  tolU?: number;
  /** Default 'central'. */
  differences?: DifferenceScheme;
  /** Finite-difference step in u (default 1e-5 central, 1e-7 forward). */
  step?: number;
  /** Extra starts searching for other design points (default 4; 0 turns the check off). */
  restarts?: number;
  /** Starting point in u-space (default the origin). */
  start?: ArrayLike<number>;
}

/** Beyond this distance Φ(−β) underflows to 0 in doubles (Φ(−37.5) ≈ 4.6e−308). */
const NO_DESIGN_POINT_BEYOND = 37.5;

/**
 * True when a search that did not converge went out past NO_DESIGN_POINT_BEYOND without g ever
 * changing sign: no design point within reach (failure impossible over the support, or certain).
 */
function noDesignPoint(r: HlrfOutcome, originFails: boolean): boolean {
  if (r.converged || !(norm(r.u) >= NO_DESIGN_POINT_BEYOND)) return false;
  return r.history.every((h) => (originFails ? h.g <= 0 : h.g > 0));
}

/** Another design point counts when its Φ(−β) is at least this share of the main one's. */
const SIMILAR_PF_SHARE = 0.1;

export function form(problem: ReliabilityProblem, opts: FormOptions = {}): FormResult {
  const n = problem.transform.n;
  if (problem.names.length !== n) throw new Error(`problem has ${problem.names.length} names for ${n} variables`);
  const G = checkedLimitState(problem, 'FORM');
  const origin = new Float64Array(n);
  const g0 = G(origin);
  const originFails = g0 <= 0;
  const scheme = opts.differences ?? 'central';
  const settings: HlrfSettings = {
    maxIterations: opts.maxIterations ?? 100,
    tolG: opts.tolG ?? 1e-8,
    tolU: opts.tolU ?? 1e-7,
    scheme,
    step: opts.step ?? DEFAULT_STEP[scheme],
    gScale: Math.abs(g0) > 0 ? Math.abs(g0) : 1,
    betaSign: originFails ? -1 : 1,
  };
  const start = opts.start ?? origin;
  const main = improvedHlrf(G, start, opts.start === undefined ? g0 : undefined, settings);
  const warnings: string[] = [];

  // Restarts: the mirror image of the design point, then ±b along each axis. They also rescue
  // a search that failed from the origin (e.g. a gradient that vanishes there).
  const found: HlrfOutcome[] = [main];
  const restarts = originFails ? 0 : opts.restarts ?? 4;
  const b = main.converged ? Math.max(1, norm(main.u)) : 1;
  const starts: Float64Array[] = [];
  if (restarts > 0 && main.converged && norm(main.u) > 0) starts.push(main.u.map((v) => -v));
  for (let i = 0; starts.length < restarts && i < n; i++) {
    for (const sign of [1, -1]) {
      if (starts.length >= restarts) break;
      const s = new Float64Array(n);
      s[i] = sign * b;
      starts.push(s);
    }
  }
  for (const s of starts) {
    const r = improvedHlrf(G, s, undefined, settings);
    if (r.converged) found.push(r);
  }
  // The nearest converged point is the design point; keep distinct others.
  let best = main;
  for (const r of found) {
    if (r === main) continue;
    if (!best.converged || norm(r.u) < norm(best.u) - 1e-9 * b) best = r;
  }
  if (best !== main) {
    warnings.push(main.converged
      ? `a restart found a closer design point than the search from the origin (β ${norm(main.u).toPrecision(6)} → ${norm(best.u).toPrecision(6)})`
      : `the search from the origin failed (${main.reason}); a restart converged`);
  }
  const betaBest = norm(best.u);
  const others: DesignPointCandidate[] = [];
  const x = new Float64Array(n);
  for (const r of found) {
    if (r === best || !r.converged) continue;
    if (norm(r.u.map((v, i) => v - best.u[i])) <= 1e-3 * b) continue;
    if (others.some((o) => norm(r.u.map((v, i) => v - o.designPointU[i])) <= 1e-3 * b)) continue;
    const beta = norm(r.u);
    if (normalSf(beta) < SIMILAR_PF_SHARE * normalSf(betaBest)) continue;
    problem.transform.toPhysical(r.u, x);
    others.push({ beta, designPointU: Array.from(r.u), designPointX: Array.from(x) });
  }
  // No design point: β = ±∞ is the result (pf = 0, or 1 when every point fails), not an error.
  const unreachable = noDesignPoint(best, originFails);
  if (unreachable) {
    warnings.push(originFails
      ? `no design point: g stayed <= 0 along the whole search, out to |u| = ${norm(best.u).toPrecision(3)}; failure is certain (pf = 1) to double precision`
      : `no design point: g stayed > 0 along the whole search, out to |u| = ${norm(best.u).toPrecision(3)}; failure is impossible or its probability is below ${normalSf(NO_DESIGN_POINT_BEYOND).toPrecision(2)} (β = +∞)`);
  }
  const multipleDesignPoints = others.length > 0;
  if (multipleDesignPoints) {
    warnings.push(`${others.length + 1} design points with similar β (${[betaBest, ...others.map((o) => o.beta)].map((v) => v.toPrecision(4)).join(', ')}): FORM and SORM see only one; check with simulation`);
  }
  if (!best.converged && !unreachable) warnings.push(`FORM did not converge: ${best.reason}`);
  if (originFails) warnings.push(`g at the origin of u-space is ${g0} <= 0: the median point already fails, β is negative`);

  const beta = unreachable ? (originFails ? -Infinity : Infinity) : (originFails ? -1 : 1) * betaBest;
  const gradNorm = norm(best.gradient);
  const uNorm = norm(best.u);
  const alpha = unreachable
    ? Array.from(best.u, (v) => (originFails ? -v : v) / uNorm) // the direction the search went
    : beta !== 0 ? Array.from(best.u, (v) => v / beta) : Array.from(best.gradient, (v) => -v / gradNorm);
  problem.transform.toPhysical(best.u, x);
  const result: FormResult = {
    names: problem.names.slice(),
    beta,
    pf: normalSf(beta),
    converged: best.converged,
    iterations: best.iterations,
    designPointU: Array.from(best.u),
    designPointX: Array.from(x),
    alpha,
    importance: alpha.map((a) => a * a),
    gamma: gammaImportance(problem.transform, best.u, alpha),
    gradientU: Array.from(best.gradient),
    history: best.history,
    calls: G.calls(),
    g0,
    originFails,
    multipleDesignPoints,
    otherDesignPoints: others,
    warnings,
  };
  if (best.reason !== undefined) result.reason = best.reason;
  return result;
}
