/**
 * First-order reliability method: improved HL-RF from the origin of u-space, then searches from
 * other starts for further design points, combined as a series system.
 *
 * β = ‖u*‖ when g(0) > 0; when g(0) <= 0 the origin already fails and β = −‖u*‖ (pf > ½).
 * pf = Φ(−β), computed as normalSf(β) (never 1 − Φ(β)). α = u* / β, importance α² (sums to 1).
 *
 * Doubtful searches. A gradient component that vanishes, or whose one-sided differences differ
 * in sign (an effect symmetric in u_i, e.g. of |u_i|: a bow whose sign is unknown), gives HL-RF
 * no direction along u_i: it converges where that component is zero, which may be a saddle of
 * the distance on the limit state rather than its closest point. Every such direction, at the
 * start and at each converged point, is searched again from starts offset along it, both signs.
 * The converged points whose Φ(−β) is not negligible beside the nearest one's are combined as a
 * linearised series system (seriesSystem.ts).
 *
 * Cost. The gradient is taken by forward differences (n calls per step). Blind restarts are made
 * only when the first search gives reason to doubt it: it did not converge (four restarts), or it
 * converged at β < NEAR_ORIGIN_BETA, where the mirror image −u* may fail as well (the mirror).
 * A caller that knows of several failure modes, or `thorough`, asks for the full scan: the mirror
 * and ±b along every axis. The one-sided differences that detect doubt cost n more calls at the
 * start and at each converged point (the backward side; the forward side is the gradient's).
 */
import { normalSf } from '../probability/normal.js';
import type { DesignPointCandidate, FormResult, FormSystem, ReliabilityProblem } from './types.js';
import { checkedLimitState } from './checkedLimitState.js';
import { DEFAULT_STEP, doubtfulComponents, type DifferenceScheme } from './finiteDifferenceGradient.js';
import { improvedHlrf, type HlrfOutcome, type HlrfSettings } from './improvedHlrf.js';
import { gammaImportance } from './gammaImportance.js';
import { seriesSystemFailure } from './seriesSystem.js';
import { norm } from './vector.js';

export interface FormOptions {
  /** Default 100. */
  maxIterations?: number;
  /** |g(u)|/|g(0)| at convergence (default 1e-8). */
  tolG?: number;
  /** Distance of u from the line of ∇g, relative to max(1, ‖u‖) (default 1e-7). */
  tolU?: number;
  /** Default 'forward' (n calls per gradient; 'central' costs 2n). */
  differences?: DifferenceScheme;
  /** Finite-difference step in u (default 1e-5 central, 1e-7 forward). */
  step?: number;
  /**
   * Extra starts that do not depend on doubt: the mirror image −u*, then ±b along each axis.
   * Default: none after a converged search with β >= NEAR_ORIGIN_BETA, 1 (the mirror) below it,
   * 4 after a failed one; 0 turns them off.
   */
  restarts?: number;
  /** Quasi-Newton curvature in the search steps (default true; false: plain improved HL-RF). */
  curvature?: boolean;
  /** The full restart scan: the mirror and ±b along every axis (2n + 1 extra searches). */
  thorough?: boolean;
  /** Search again along doubtful directions (default true; see the file comment). */
  probeDoubtful?: boolean;
  /** Starting point in u-space (default the origin). */
  start?: ArrayLike<number>;
  /** Seed of the multinormal integration when three or more design points count (default fixed). */
  seed?: number;
}

/** A design point enters the series system when its Φ(−β) is at least this share of the nearest one's. */
export const SYSTEM_PF_SHARE = 0.01;
/** Blind restarts after a failed search from the origin. */
const RESCUE_RESTARTS = 4;
/** Share of ‖u*‖ under which a component of a converged point may hide a kink or a flat gradient. */
const DOUBT_SHARE = 1e-2;
/** Below this β the origin is close to the limit state and the mirror image −u* is searched too. */
export const NEAR_ORIGIN_BETA = 1;
/** Offset of the doubtful-direction starts, in standard deviations. */
const PROBE_OFFSET = 1;
/** At most this many doubtful directions are searched (kinks before flat components). */
const MAX_PROBE_DIRECTIONS = 8;

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


/**
 * Differences and tolerances for a g with jumps of about `gNoise` (ReliabilityProblem.gNoise), or
 * null for a smooth g. With ε = gNoise/|g(0)|: central differences with h = ∛ε (the balance of the
 * truncation h²·g''' against the jump ε/h, for g''' of the order of g(0)), kept within [1e-3, 0.1];
 * |g|/|g(0)| < 3ε (the search cannot tell g from 0 much closer than its jumps; β moves by about
 * 3ε·β at most); the distance from the gradient line within 3ε/h, a few times the gradient's own
 * relative error (β is stationary there, so it moves by the square of that).
 */
function noisySettings(gNoise: number | undefined, g0: number): { scheme: DifferenceScheme; step: number; tolG: number; tolU: number } | null {
  if (!(gNoise !== undefined && gNoise > 0 && Math.abs(g0) > 0)) return null;
  const eps = gNoise / Math.abs(g0);
  const step = Math.min(0.1, Math.max(1e-3, Math.cbrt(eps)));
  return { scheme: 'central', step, tolG: Math.max(1e-8, 3 * eps), tolU: Math.max(1e-7, (3 * eps) / step) };
}

export function form(problem: ReliabilityProblem, opts: FormOptions = {}): FormResult {
  const n = problem.transform.n;
  if (problem.names.length !== n) throw new Error(`problem has ${problem.names.length} names for ${n} variables`);
  const G = checkedLimitState(problem, 'FORM');
  const origin = new Float64Array(n);
  const g0 = G(origin);
  const originFails = g0 <= 0;
  const noisy = noisySettings(problem.gNoise, g0);
  const scheme = opts.differences ?? noisy?.scheme ?? 'forward';
  const settings: HlrfSettings = {
    maxIterations: opts.maxIterations ?? 100,
    tolG: opts.tolG ?? noisy?.tolG ?? 1e-8,
    tolU: opts.tolU ?? noisy?.tolU ?? 1e-7,
    scheme,
    step: opts.step ?? noisy?.step ?? DEFAULT_STEP[scheme],
    gScale: Math.abs(g0) > 0 ? Math.abs(g0) : 1,
    betaSign: originFails ? -1 : 1,
    curvature: opts.curvature ?? true,
  };
  const start = opts.start ?? origin;
  const main = improvedHlrf(G, start, opts.start === undefined ? g0 : undefined, settings);
  const warnings: string[] = [];
  const found: HlrfOutcome[] = [main];
  const b = main.converged ? Math.max(1, norm(main.u)) : 1;

  // Blind restarts: the mirror image of the design point, then ±b along each axis.
  const restarts = originFails ? 0 : opts.restarts ?? defaultRestarts(main, n, opts.thorough === true);
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
  for (const s of starts) found.push(improvedHlrf(G, s, undefined, settings));

  // Doubtful directions: at the start, and at every converged point, searched once each.
  const doubtful = new Set<number>();
  if (!originFails && opts.probeDoubtful !== false) {
    const probed = new Set<number>();
    // each point's directions once: the backward side costs n calls with forward differences
    const known = new Map<Float64Array, number[]>();
    const directionsAt = (r: HlrfOutcome, atStart: boolean): number[] => {
      const sides = atStart ? r.sidesAtStart : r.sides;
      const cached = known.get(sides);
      if (cached) return cached;
      if (scheme === 'forward') backwardSides(G, atStart ? Float64Array.from(start) : r.u, atStart ? g0Start(r) : r.g, settings.step, sides, !atStart);
      const dirs = rankDoubtful(sides);
      known.set(sides, dirs);
      return dirs;
    };
    const g0Start = (r: HlrfOutcome): number => (opts.start === undefined ? g0 : r.history[0].g);
    const probeAround = (centre: Float64Array, dirs: number[]): void => {
      for (const i of dirs) {
        doubtful.add(i);
        if (probed.has(i) || probed.size >= MAX_PROBE_DIRECTIONS) continue;
        probed.add(i);
        for (const sign of [1, -1]) {
          const s = Float64Array.from(centre);
          s[i] += sign * PROBE_OFFSET;
          const r = improvedHlrf(G, s, undefined, settings);
          found.push(r);
          if (r.converged) probeAround(r.u, directionsAt(r, false));
        }
      }
    };
    // around the start, where that doubt was seen: a forward-difference search leaves a kink
    // towards one side, so its end point need not lie on the doubtful line any more
    probeAround(Float64Array.from(start), directionsAt(main, true));
    for (const r of found.slice()) if (r.converged) probeAround(r.u, directionsAt(r, false));
  }

  // The nearest converged point is the design point.
  let best = main;
  for (const r of found) {
    if (r === main || !r.converged) continue;
    if (!best.converged || norm(r.u) < norm(best.u) - 1e-9 * b) best = r;
  }
  if (best !== main) {
    warnings.push(main.converged
      ? `another start found a closer design point than the search from the origin (β ${norm(main.u).toPrecision(6)} → ${norm(best.u).toPrecision(6)})`
      : `the search from the origin failed (${main.reason}); a restart converged`);
  }
  const betaBest = norm(best.u);
  const others: DesignPointCandidate[] = [];
  const x = new Float64Array(n);
  if (!originFails) {
    // one point found twice lands within the search's own tolerance of itself (wider for a noisy g)
    const same = Math.max(1e-3, settings.tolU) * b;
    for (const r of found) {
      if (r === best || !r.converged) continue;
      if (norm(r.u.map((v, i) => v - best.u[i])) <= same) continue;
      if (others.some((o) => norm(r.u.map((v, i) => v - o.designPointU[i])) <= same)) continue;
      const beta = norm(r.u);
      if (!(beta > 0) || normalSf(beta) < SYSTEM_PF_SHARE * normalSf(betaBest)) continue;
      problem.transform.toPhysical(r.u, x);
      others.push({ beta, designPointU: Array.from(r.u), designPointX: Array.from(x), alpha: Array.from(r.u, (v) => v / beta) });
    }
    others.sort((p, q) => p.beta - q.beta);
  }
  // No design point: β = ±∞ is the result (pf = 0, or 1 when every point fails), not an error.
  const unreachable = noDesignPoint(best, originFails);
  if (unreachable) {
    warnings.push(originFails
      ? `no design point: g stayed <= 0 along the whole search, out to |u| = ${norm(best.u).toPrecision(3)}; failure is certain (pf = 1) to double precision`
      : `no design point: g stayed > 0 along the whole search, out to |u| = ${norm(best.u).toPrecision(3)}; failure is impossible or its probability is below ${normalSf(NO_DESIGN_POINT_BEYOND).toPrecision(2)} (β = +∞)`);
  }
  const multipleDesignPoints = others.length > 0;
  const doubtfulNames = [...doubtful].sort((i, j) => i - j).map((i) => problem.names[i]);
  if (doubtfulNames.length > 0) {
    warnings.push(`the gradient of g vanishes or changes sign along ${doubtfulNames.join(', ')}: searched again from starts offset along ${doubtfulNames.length === 1 ? 'it' : 'them'}`);
  }
  if (!best.converged && !unreachable) warnings.push(`FORM did not converge: ${best.reason}`);
  if (originFails) warnings.push(`g at the origin of u-space is ${g0} <= 0: the median point already fails, β is negative`);

  const beta = unreachable ? (originFails ? -Infinity : Infinity) : (originFails ? -1 : 1) * betaBest;
  const gradNorm = norm(best.gradient);
  const uNorm = norm(best.u);
  const rawAlpha = unreachable
    ? Array.from(best.u, (v) => (originFails ? -v : v) / uNorm) // the direction the search went
    : beta !== 0 ? Array.from(best.u, (v) => v / beta) : Array.from(best.gradient, (v) => -v / gradNorm);
  // a search that never left the origin on a g with no slope there (a column that is a mechanism
  // whatever the variables) has no direction: no variable matters, rather than 0/0
  const flat = rawAlpha.some((a) => !Number.isFinite(a));
  const alpha = flat ? rawAlpha.map(() => 0) : rawAlpha;
  if (flat) warnings.push('g has no slope at the point the search ended (every variable leaves it unchanged there): the importance factors α are set to 0');
  problem.transform.toPhysical(best.u, x);
  const governing: DesignPointCandidate = { beta, designPointU: Array.from(best.u), designPointX: Array.from(x), alpha };
  const system = formSystem(governing, others, opts.seed);
  if (multipleDesignPoints) {
    warnings.push(`${others.length + 1} design points (β ${[betaBest, ...others.map((o) => o.beta)].map((v) => v.toPrecision(4)).join(', ')}): as a series system β = ${system.beta.toPrecision(4)}, pf = ${system.pf.toPrecision(3)} (${system.method}); SORM sees only the nearest`);
  }
  const result: FormResult = {
    names: problem.names.slice(),
    beta,
    pf: normalSf(beta),
    converged: best.converged,
    iterations: best.iterations,
    designPointU: governing.designPointU,
    designPointX: governing.designPointX,
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
    doubtfulDirections: doubtfulNames,
    system,
    warnings,
  };
  if (best.reason !== undefined) result.reason = best.reason;
  return result;
}

/** The series system of the design points that count; one point gives exactly FORM's β and pf. */
function formSystem(governing: DesignPointCandidate, others: DesignPointCandidate[], seed: number | undefined): FormSystem {
  const points = [governing, ...others];
  if (others.length === 0 || !(governing.beta > 0)) {
    const pf = normalSf(governing.beta);
    return { beta: governing.beta, pf, method: 'one design point: Φ(−β)', bounds: { lower: pf, upper: pf }, designPoints: [governing] };
  }
  const s = seriesSystemFailure(points.map((p) => p.beta), points.map((p) => p.alpha), seed === undefined ? undefined : { seed });
  return { ...s, designPoints: points };
}

/** Doubtful components, kinks (one-sided differences of opposite sign) before flat ones. */
function rankDoubtful(sides: Float64Array): number[] {
  const n = sides.length / 2;
  const kink = (i: number): number => (sides[i] * sides[n + i] < 0 ? 0 : 1);
  return doubtfulComponents(sides).sort((i, j) => kink(i) - kink(j) || i - j);
}

/** Blind restarts by default: see the file comment. */
function defaultRestarts(main: HlrfOutcome, n: number, thorough: boolean): number {
  if (thorough) return 1 + 2 * n;
  if (!main.converged) return RESCUE_RESTARTS;
  return norm(main.u) < NEAR_ORIGIN_BETA ? 1 : 0;
}

/**
 * The backward one-sided differences at u into sides[n + i] (one call each). The forward scheme's
 * gradient already holds the forward side in sides[i]; together they tell a kink from a slope.
 * At a converged point (`converged`) u is parallel to ∇g, so a component that vanishes or kinks
 * has u_i ≈ 0: only components with |u_i| <= DOUBT_SHARE·max(1, ‖u‖) are probed, the others
 * keep the forward side on both sides.
 */
function backwardSides(G: (u: Float64Array) => number, u: Float64Array, g: number, h: number, sides: Float64Array, converged: boolean): void {
  const n = u.length;
  const work = Float64Array.from(u);
  const small = DOUBT_SHARE * Math.max(1, norm(u));
  for (let i = 0; i < n; i++) {
    if (converged && Math.abs(u[i]) > small) {
      sides[n + i] = sides[i];
      continue;
    }
    work[i] = u[i] - h;
    sides[n + i] = (g - G(work)) / h;
    work[i] = u[i];
  }
}
