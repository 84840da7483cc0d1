/**
 * Two views of a restraint requirement, both by FORM to keep them affordable:
 *
 * - an iso-β map over (k_bottom, k_top): FORM β on a coarse 7 × 7 grid of mean stiffnesses
 *   (log-spaced from 1/30 to 30 times the assumed ones, each end keeping its CoV), refined by
 *   cubic convolution in log k (Keys 1981, a = −1/2) and contoured by marching squares; plus
 *   the two ideal-end asymptotes of the target contour (the stiffness one end needs when the
 *   other is rigid). Cost: 49 FORM analyses and two root solves.
 * - the required mean stiffness (and its 5 % fractile) against the stiffness's coefficient of
 *   variation: "how precisely must this connection be known". One root solve per CoV.
 *
 * With survived loads the caller passes their conditional FORM as `betaOf` (about twice a FORM).
 */
import { supportInsideDomain } from '../scenario/readScalar.js';
import { withMoments, withEndStiffness } from '../limitState/scenarioEdits.js';
import { makeDistribution } from '../probability/makeDistribution.js';
import type { Scalar, Scenario } from '../scenario/types.js';
import { throwIfInterrupted } from '../runtime/interruptFlag.js';
import { scenarioForm } from './columnForm.js';
import { logGrid, restraintStudy } from './restraintStudy.js';

export interface ContourSegment {
  level: number;
  /** mean stiffnesses (N·m/rad) of the two ends of the segment */
  bottom: [number, number];
  top: [number, number];
}

export interface RestraintContourMap {
  /** grid stiffnesses, N·m/rad */
  bottom: number[];
  top: number[];
  /** FORM β at [i bottom][j top] */
  beta: number[][];
  levels: number[];
  segments: ContourSegment[];
  /** the assessed means */
  assessed: { bottom: number; top: number };
  /** required stiffness of one end when the other is rigid (null: not reached) */
  asymptotes: { bottomWithTopRigid: number | null; topWithBottomRigid: number | null };
  /** FORM analyses spent */
  calls: number;
}

export interface CovRequirementPoint {
  cov: number;
  /** required mean per studied end (N·m/rad); null when not reached by a finite stiffness */
  mean: Record<string, number | null>;
  characteristic: Record<string, number | null>;
}

export interface RestraintMaps {
  contour?: RestraintContourMap;
  covCurve?: { points: CovRequirementPoint[]; assessedCov: number; calls: number };
}

export interface RestraintMapsInput {
  ends: ('bottom' | 'top')[];
  base: Record<string, Scalar>;
  edited: (factor: number, bases?: Record<string, Scalar>) => Scenario;
  target: number;
  required: Record<string, number> | null;
  /** the principal axis whose ends are varied (default y) */
  axis?: 'y' | 'z';
  /** β of an edited scenario (default FORM, `scenarioForm`; given survived loads, their conditional FORM) */
  betaOf?: (s: Scenario) => { beta: number; pf: number };
  /** which crossing of the target is a requirement (restraintStudy.ts; default 'first') */
  crossing?: 'first' | 'last';
}

const GRID_POINTS = 7;
const REFINE = 4;
const COVS = [0.05, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6];
const BETA_CLAMP: [number, number] = [-8, 12];

const meanOf = (v: Scalar): number => (v.kind === 'fixed' ? v.value : makeDistribution(v.spec).mean);

export function restraintMaps(s: Scenario, input: RestraintMapsInput): RestraintMaps {
  const out: RestraintMaps = {};
  if (input.ends.length === 2) out.contour = contourMap(s, input);
  const random = input.ends.filter((e) => input.base[e].kind === 'random');
  if (random.length > 0) out.covCurve = covCurve(input, random);
  return out;
}

function contourMap(s: Scenario, input: RestraintMapsInput): RestraintContourMap {
  const kb = meanOf(input.base.bottom);
  const kt = meanOf(input.base.top);
  const factors = logGrid(1 / 30, 30, GRID_POINTS);
  const axis = input.axis ?? 'y';
  const at = (fb: number, ft: number): number => {
    throwIfInterrupted('the restraint map');
    let t = withEndStiffness(s, 'bottom', input.base.bottom, fb, axis);
    t = withEndStiffness(t, 'top', input.base.top, ft, axis);
    const b = (input.betaOf ?? scenarioForm)(t).beta;
    return Math.min(BETA_CLAMP[1], Math.max(BETA_CLAMP[0], b));
  };
  const beta = factors.map((fb) => factors.map((ft) => at(fb, ft)));
  let calls = GRID_POINTS * GRID_POINTS;
  const asymptote = (end: 'bottom' | 'top'): number | null => {
    const other = end === 'bottom' ? 'top' : 'bottom';
    const rigidOther = withEndStiffness(s, other, input.base[other], Infinity, axis);
    const r = restraintStudy({
      baseStiffness: { [end]: meanOf(input.base[end]) },
      target: input.target,
      grid: { min: 0.01, max: 100, points: 7 },
      tolerance: 1e-4,
      crossing: input.crossing,
      betaAtFactor: (f) => (input.betaOf ?? scenarioForm)(withEndStiffness(rigidOther, end, input.base[end], f, axis)),
    });
    calls += r.calls;
    return r.outcome === 'reached' ? (r.required[end] as number) : null;
  };
  const asymptotes = { bottomWithTopRigid: asymptote('bottom'), topWithBottomRigid: asymptote('top') };
  const flat = beta.flat();
  const levels = contourLevels(Math.min(...flat), Math.max(...flat), input.target);
  const logB = factors.map((f) => Math.log10(f * kb));
  const logT = factors.map((f) => Math.log10(f * kt));
  const fine = refineGrid(beta, REFINE);
  const xs = refineAxis(logB, REFINE);
  const ys = refineAxis(logT, REFINE);
  const segments: ContourSegment[] = [];
  for (const level of levels) {
    for (const seg of marchingSquares(fine, xs, ys, level)) {
      segments.push({ level, bottom: [10 ** seg[0], 10 ** seg[2]], top: [10 ** seg[1], 10 ** seg[3]] });
    }
  }
  return {
    bottom: factors.map((f) => f * kb),
    top: factors.map((f) => f * kt),
    beta,
    levels,
    segments,
    assessed: { bottom: kb, top: kt },
    asymptotes,
    calls,
  };
}

/** The target, plus levels at steps of 0.5 (or 1 over a wide range) inside the range, not too close to the target. */
export function contourLevels(min: number, max: number, target: number): number[] {
  const step = max - min > 4 ? 1 : 0.5;
  const out = [target];
  for (let v = Math.ceil(min / step) * step; v <= max; v += step) {
    if (Math.abs(v - target) >= step / 2 && v > min && v < max) out.push(v);
  }
  return out.sort((a, b) => a - b);
}

/** Keys' cubic convolution kernel, a = −1/2 (Keys 1981). */
function keys(t: number): number {
  const x = Math.abs(t);
  if (x <= 1) return 1.5 * x ** 3 - 2.5 * x ** 2 + 1;
  if (x < 2) return -0.5 * x ** 3 + 2.5 * x ** 2 - 4 * x + 2;
  return 0;
}

/** Value at fractional index p of a sequence, by cubic convolution (ends extended linearly). */
function interpolate(v: readonly number[], p: number): number {
  const n = v.length;
  const at = (k: number): number => (k < 0 ? 2 * v[0] - v[Math.min(-k, n - 1)] : k >= n ? 2 * v[n - 1] - v[Math.max(2 * (n - 1) - k, 0)] : v[k]);
  const i = Math.floor(p);
  let sum = 0;
  for (let k = i - 1; k <= i + 2; k++) sum += at(k) * keys(p - k);
  return sum;
}

export function refineAxis(v: readonly number[], r: number): number[] {
  const out: number[] = [];
  for (let i = 0; i < v.length - 1; i++) for (let k = 0; k < r; k++) out.push(v[i] + ((v[i + 1] - v[i]) * k) / r);
  out.push(v[v.length - 1]);
  return out;
}

/** A grid refined r times in both directions by separable cubic convolution. */
export function refineGrid(z: readonly (readonly number[])[], r: number): number[][] {
  const rows = z.map((row) => refineSeq(row, r));
  const m = rows[0].length;
  const cols: number[][] = [];
  for (let j = 0; j < m; j++) cols.push(refineSeq(rows.map((row) => row[j]), r));
  return cols[0].map((_, i) => cols.map((c) => c[i]));
}

function refineSeq(v: readonly number[], r: number): number[] {
  const out: number[] = [];
  for (let p = 0; p <= (v.length - 1) * r; p++) out.push(interpolate(v, p / r));
  return out;
}

/** Segments [x1, y1, x2, y2] of the level line of z[i][j] over (xs[i], ys[j]), linear on each cell edge. */
export function marchingSquares(z: readonly (readonly number[])[], xs: readonly number[], ys: readonly number[], level: number): [number, number, number, number][] {
  const segs: [number, number, number, number][] = [];
  const cross = (x1: number, y1: number, z1: number, x2: number, y2: number, z2: number): [number, number] => {
    const t = (level - z1) / (z2 - z1);
    return [x1 + t * (x2 - x1), y1 + t * (y2 - y1)];
  };
  for (let i = 0; i < xs.length - 1; i++) {
    for (let j = 0; j < ys.length - 1; j++) {
      // corners anticlockwise: (i,j) (i+1,j) (i+1,j+1) (i,j+1)
      const c: [number, number, number][] = [
        [xs[i], ys[j], z[i][j]], [xs[i + 1], ys[j], z[i + 1][j]], [xs[i + 1], ys[j + 1], z[i + 1][j + 1]], [xs[i], ys[j + 1], z[i][j + 1]],
      ];
      const pts: [number, number][] = [];
      for (let k = 0; k < 4; k++) {
        const a = c[k];
        const b = c[(k + 1) % 4];
        if ((a[2] < level) !== (b[2] < level)) pts.push(cross(a[0], a[1], a[2], b[0], b[1], b[2]));
      }
      if (pts.length === 2) segs.push([pts[0][0], pts[0][1], pts[1][0], pts[1][1]]);
      else if (pts.length === 4) {
        // saddle: decide by the centre value
        const centre = (c[0][2] + c[1][2] + c[2][2] + c[3][2]) / 4;
        const firstBelow = c[0][2] < level;
        if ((centre < level) === firstBelow) {
          segs.push([pts[0][0], pts[0][1], pts[1][0], pts[1][1]], [pts[2][0], pts[2][1], pts[3][0], pts[3][1]]);
        } else {
          segs.push([pts[0][0], pts[0][1], pts[3][0], pts[3][1]], [pts[1][0], pts[1][1], pts[2][0], pts[2][1]]);
        }
      }
    }
  }
  return segs;
}

function nullByEnd(ends: readonly string[]): Record<string, number | null> {
  return Object.fromEntries(ends.map((e) => [e, null]));
}

function covCurve(input: RestraintMapsInput, random: ('bottom' | 'top')[]): NonNullable<RestraintMaps['covCurve']> {
  const first = input.base[random[0]];
  const assessedCov = first.kind === 'random' ? makeDistribution(first.spec).sd / makeDistribution(first.spec).mean : 0;
  let calls = 0;
  const points: CovRequirementPoint[] = COVS.map((cov) => {
    throwIfInterrupted('the restraint study');
    const bases: Record<string, Scalar> = { ...input.base };
    for (const e of random) {
      const b = input.base[e];
      if (b.kind !== 'random') continue;
      const m = makeDistribution(b.spec).mean;
      bases[e] = { kind: 'random', spec: withMoments(b.spec, m, cov * m) };
    }
    // a bounded family (uniform, beta, truncnormal) cannot take every CoV at this mean without
    // reaching below zero stiffness: that point is left out rather than computed on a non-physical spring
    const outside = random.some((e) => {
      const b = bases[e];
      return b.kind === 'random' && !supportInsideDomain(b.spec, 'nonnegative');
    });
    if (outside) return { cov, mean: nullByEnd(input.ends), characteristic: nullByEnd(input.ends) };
    const baseStiffness = Object.fromEntries(input.ends.map((e) => [e, meanOf(bases[e])]));
    const r = restraintStudy({
      baseStiffness,
      target: input.target,
      grid: { min: 0.01, max: 100, points: 7 },
      tolerance: 1e-4,
      crossing: input.crossing,
      betaAtFactor: (f) => (input.betaOf ?? scenarioForm)(input.edited(f, bases)),
    });
    calls += r.calls;
    const f = r.outcome === 'reached' ? (r.requiredFactor as number) : null;
    const mean: Record<string, number | null> = {};
    const characteristic: Record<string, number | null> = {};
    for (const e of input.ends) {
      const b = bases[e];
      mean[e] = f === null ? null : f * baseStiffness[e];
      characteristic[e] = f === null ? null : b.kind === 'fixed' ? f * b.value : f * makeDistribution(b.spec).quantile(0.05);
    }
    return { cov, mean, characteristic };
  });
  return { points, assessedCov, calls };
}

const fin = (v: number | null): number | null => (v !== null && Number.isFinite(v) ? v : null);

/** JSON of the maps (SI). */
export function restraintMapsJson(m: RestraintMaps): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  if (m.contour) {
    const c = m.contour;
    out.contour = {
      bottom: c.bottom, top: c.top, beta: c.beta, levels: c.levels, assessed: c.assessed,
      asymptotes: { bottom_with_top_rigid: c.asymptotes.bottomWithTopRigid, top_with_bottom_rigid: c.asymptotes.topWithBottomRigid },
      form_analyses: c.calls,
    };
  }
  if (m.covCurve) {
    out.cov_curve = {
      assessed_cov: m.covCurve.assessedCov,
      form_analyses: m.covCurve.calls,
      points: m.covCurve.points.map((p) => ({
        cov: p.cov,
        mean: Object.fromEntries(Object.entries(p.mean).map(([k, v]) => [k, fin(v)])),
        characteristic: Object.fromEntries(Object.entries(p.characteristic).map(([k, v]) => [k, fin(v)])),
      })),
    };
  }
  return out;
}
