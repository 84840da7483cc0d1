/**
 * How much end restraint does the target reliability need?
 *
 * The mean rotational stiffness of every studied end is `factor × baseStiffness[end]` (one
 * common factor, each end keeping its CoV — that is the caller's business inside
 * `betaAtFactor`). β is computed on a logarithmic grid of factors plus the two ideal cases,
 * pinned (factor exactly 0) and rigid (factor Infinity). The least factor that reaches the
 * target is then found by a Brent root solve of β(factor) − target in log(factor), inside
 * the first grid interval where β crosses the target (the grid is extended by decades when
 * the crossing lies beyond it) — the answer is not read off the grid.
 */
import { throwIfInterrupted } from '../runtime/interruptFlag.js';
import { findRootBracketed } from '../probability/rootBracketed.js';

export interface BetaPoint {
  beta: number;
  pf: number;
}

/** A logarithmic grid (defaults 0.01 … 100, 13 points) or explicit positive factors. */
export type RestraintGrid = { min?: number; max?: number; points?: number } | readonly number[];

export interface RestraintStudyInput {
  /** β and pf with every studied end's mean stiffness = factor × base (0 pinned, Infinity rigid). */
  betaAtFactor: (factor: number) => BetaPoint;
  /** Mean rotational stiffness at factor 1, N·m/rad, per studied end (e.g. {bottom: 2.5e6}). */
  baseStiffness: Readonly<Record<string, number>>;
  target: number;
  grid?: RestraintGrid;
  /** Absolute tolerance on ln(factor) of the root (default 1e-6). */
  tolerance?: number;
  /**
   * Which crossing of the target is the requirement: 'first' (default), the least factor that
   * reaches it; 'last', the one above which every grid point reaches it. They agree when β rises
   * with the stiffness. β given a survived load need not (a low stiffness makes the survival
   * unlikely, and so proves much once it happened): 'last' keeps "at least this stiffness" true
   * for every stiffness above it on the grid.
   */
  crossing?: 'first' | 'last';
}

export type RestraintIdeal = 'pinned' | 'fixed';

export interface RestraintCurvePoint {
  factor: number;
  /** Mean rotational stiffness per studied end, N·m/rad (Infinity for rigid). */
  stiffness: Record<string, number>;
  beta: number;
  pf: number;
  ideal?: RestraintIdeal;
}

/**
 * reached: a finite factor reaches the target; pinned-suffices: even pinned ends do;
 * fixed-only: only rigid ends do (no finite stiffness found within 9 decades above the grid);
 * unreachable: even rigid ends fall short.
 */
export type RestraintOutcome = 'reached' | 'pinned-suffices' | 'fixed-only' | 'unreachable';

export interface RestraintStudyResult {
  ends: string[];
  target: number;
  outcome: RestraintOutcome;
  /** 0 when pinned suffices, Infinity when only rigid ends do, null when unreachable. */
  requiredFactor: number | null;
  /** Required mean stiffness per end (N·m/rad); null per end when unreachable. */
  required: Record<string, number | null>;
  /** Baseline (factor 1) stiffness, echoed. */
  baseStiffness: Record<string, number>;
  pinned: BetaPoint;
  fixed: BetaPoint;
  /** Every point computed (grid, extensions, root iterates, ideals), in increasing stiffness. */
  curve: RestraintCurvePoint[];
  /** Calls of betaAtFactor. */
  calls: number;
}

const EXTRA_DECADES = 9;

export function logGrid(min: number, max: number, points: number): number[] {
  if (!(min > 0 && max > min && Number.isFinite(max))) throw new Error(`log grid needs 0 < min < max, got ${min}, ${max}`);
  if (!Number.isInteger(points) || points < 2) throw new Error(`log grid needs >= 2 points, got ${points}`);
  const step = Math.log(max / min) / (points - 1);
  return Array.from({ length: points }, (_, k) => (k === points - 1 ? max : min * Math.exp(k * step)));
}

function gridFactors(grid: RestraintGrid | undefined): number[] {
  if (Array.isArray(grid)) {
    const factors = [...(grid as readonly number[])].sort((a, b) => a - b);
    for (const f of factors) {
      if (!(f > 0 && Number.isFinite(f))) throw new Error(`restraint grid factors must be positive and finite, got ${f}`);
    }
    if (factors.length === 0) throw new Error('restraint grid is empty');
    return factors;
  }
  const g = (grid ?? {}) as { min?: number; max?: number; points?: number };
  return logGrid(g.min ?? 0.01, g.max ?? 100, g.points ?? 13);
}

/** |β − target| beyond this is as far as the root search needs to know (β itself is at most ~38 in doubles). */
const BETA_SPAN = 100;

export function restraintStudy(input: RestraintStudyInput): RestraintStudyResult {
  const ends = Object.keys(input.baseStiffness);
  if (ends.length === 0) throw new Error('restraintStudy: no studied end');
  for (const end of ends) {
    const k = input.baseStiffness[end];
    if (!(k > 0 && Number.isFinite(k))) throw new Error(`restraintStudy: base stiffness of ${end} must be positive, got ${k}`);
  }
  const { target } = input;
  if (!Number.isFinite(target)) throw new Error(`restraintStudy: target must be finite, got ${target}`);

  const computed = new Map<number, BetaPoint>();
  const at = (factor: number): BetaPoint => {
    const known = computed.get(factor);
    if (known) return known;
    throwIfInterrupted('the restraint study');
    const point = input.betaAtFactor(factor);
    if (!Number.isFinite(point.beta) && Math.abs(point.beta) !== Infinity) {
      throw new Error(`restraintStudy: β is ${point.beta} at factor ${factor}`);
    }
    computed.set(factor, point);
    return point;
  };
  const reaches = (factor: number): boolean => at(factor).beta >= target;

  const pinned = at(0);
  const fixed = at(Infinity);
  const grid = gridFactors(input.grid);
  for (const f of grid) at(f);

  let outcome: RestraintOutcome;
  let requiredFactor: number | null;
  // 'last': the last grid point (pinned included) short of the target, if any
  const lastShort = input.crossing === 'last' ? [0, ...grid].filter((f) => !reaches(f)).pop() : undefined;
  if (input.crossing === 'last' ? lastShort === undefined : pinned.beta >= target) {
    outcome = 'pinned-suffices';
    requiredFactor = 0;
  } else {
    let hi = lastShort === undefined || lastShort === 0 ? grid.find(reaches) : grid.find((f) => f > lastShort);
    let lo: number | undefined;
    if (hi === undefined) {
      for (let f = grid[grid.length - 1], k = 0; k < EXTRA_DECADES && fixed.beta >= target; k++) {
        lo = f;
        f *= 10;
        if (reaches(f)) {
          hi = f;
          break;
        }
      }
    } else {
      const k = grid.indexOf(hi);
      lo = k > 0 ? grid[k - 1] : undefined;
      // the crossing lies below the grid: step down by decades towards pinned
      for (let f = hi, step = 0; lo === undefined; step++) {
        if (step > 30) throw new Error('restraintStudy: β does not fall towards its pinned value as the factor goes to 0');
        f /= 10;
        if (reaches(f)) hi = f;
        else lo = f;
      }
    }
    if (hi !== undefined && lo !== undefined) {
      const tolerance = input.tolerance ?? 1e-6;
      // β = ±∞ at a bracket end (a survival impossible at that stiffness, failure certain or impossible)
      // keeps its sign but not its size: the root search interpolates, and ∞ − ∞ would give NaN
      const margin = (t: number): number => Math.max(-BETA_SPAN, Math.min(BETA_SPAN, at(Math.exp(t)).beta - target));
      const root = findRootBracketed(margin, Math.log(lo), Math.log(hi), { xTolerance: tolerance });
      outcome = 'reached';
      requiredFactor = Math.exp(root);
    } else if (fixed.beta >= target) {
      outcome = 'fixed-only';
      requiredFactor = Infinity;
    } else {
      outcome = 'unreachable';
      requiredFactor = null;
    }
  }

  const stiffnessAt = (factor: number): Record<string, number> =>
    Object.fromEntries(ends.map((end) => [end, factor === Infinity ? Infinity : factor * input.baseStiffness[end]]));
  const required: Record<string, number | null> =
    requiredFactor === null ? Object.fromEntries(ends.map((end) => [end, null])) : stiffnessAt(requiredFactor);
  const curve = [...computed.entries()]
    .sort((a, b) => a[0] - b[0])
    .map(([factor, point]): RestraintCurvePoint => {
      const entry: RestraintCurvePoint = { factor, stiffness: stiffnessAt(factor), beta: point.beta, pf: point.pf };
      if (factor === 0) entry.ideal = 'pinned';
      if (factor === Infinity) entry.ideal = 'fixed';
      return entry;
    });
  return {
    ends,
    target,
    outcome,
    requiredFactor,
    required,
    baseStiffness: { ...input.baseStiffness },
    pinned,
    fixed,
    curve,
    calls: computed.size,
  };
}
