import { factorBanded, solveBanded } from './bandedLdl.js';
import { assembleSystem, columnSetup, type ColumnSetup } from './columnSetup.js';
import { HALF_BANDWIDTH } from './fibreColumn.js';
import type { PlasticZoneInput, PlasticZoneResult } from './types.js';

/**
 * Capacity of the column by the plastic-zone model: the axial load is traced under displacement
 * control (Batoz & Dhatt 1979: each Newton iteration solves K a = F and K b = R and picks δλ so that
 * the controlled quantity stays put), through the limit point; the peak load factor is the capacity.
 * The controlled quantity t = v_c / v_ref + (−u_top) / u_ref adds the largest lateral displacement
 * and the axial shortening, each scaled by its linear value at the reference load: both grow up to
 * the peak, the lateral one keeps a slender column's path, the axial one a stocky column's, where a
 * plateau near the squash load makes the lateral one a poor guide. Near the peak the step is halved from the last point
 * before it until the three points around the peak are within REFINEMENTS halvings, and a parabola
 * through them gives the peak.
 */
/**
 * The traced peak is piecewise smooth in the column's parameters, with jumps where the number of
 * load steps or halvings changes. Measured (rolled 200 × 200 × 9 × 15, 4.8 m, 400 points over ±10 %
 * of fy, e0 and a spring): second differences 1e-7 to 1e-6 of the capacity where smooth, jumps up to
 * 1e-4. A search on the full model (FORM) must not look closer than this.
 */
export const PATH_NOISE = 1e-4;

const MAX_STEPS = 400;
const MAX_ITERATIONS = 30;
const REFINEMENTS = 5;
const GROWTH = 1.5;
const TOLERANCE = 1e-9;
const BACKTRACKS = 4;

interface PathPoint {
  x: number;
  lambda: number;
  d: Float64Array;
  plastic: Float64Array;
}

/**
 * The sign of a bow is free (|e0| is used): with end eccentricities, both sides are traced and the
 * lower capacity is kept, as the elastic beam-column does (mechanics/beamColumn.ts).
 */
export function plasticZoneCapacity(input: PlasticZoneInput): PlasticZoneResult {
  const e = input.eccentricity;
  const eccentric = e !== undefined && (e.bottom !== 0 || e.top !== 0);
  const first = capacityWithBow(input, Math.abs(input.e0));
  if (!eccentric || input.e0 === 0) return first;
  const other = capacityWithBow(input, -Math.abs(input.e0));
  return other.capacity < first.capacity
    ? { ...other, steps: first.steps + other.steps, iterations: first.iterations + other.iterations }
    : { ...first, steps: first.steps + other.steps, iterations: first.iterations + other.iterations };
}

function capacityWithBow(input: PlasticZoneInput, e0: number): PlasticZoneResult {
  const setup = columnSetup({ ...input, e0 });
  if (!(setup.Pcr > 0)) return { capacity: 0, squashLoad: setup.squashLoad, deflectionAtPeak: 0, steps: 0, iterations: 0 };
  return traceToPeak(setup, input.L);
}

function traceToPeak(s: ColumnSetup, L: number): PlasticZoneResult {
  const n = s.column.dofs;
  const F = s.reference;
  const K = new Float64Array(n * n);
  const fint = new Float64Array(n);
  const a = new Float64Array(n);
  const b = new Float64Array(n);
  const d = new Float64Array(n);
  const Fh = new Float64Array(n);
  for (let i = 0; i < n; i++) Fh[i] = s.held[i] ? 0 : F[i];
  const forceScale = s.squashLoad;
  let iterations = 0;

  // control dof: the lateral dof that moves most in the first linear response
  assembleSystem(s, d, K, fint);
  factorBanded(K, n, HALF_BANDWIDTH);
  a.set(Fh);
  solveBanded(K, n, HALF_BANDWIDTH, a);
  let c = -1;
  for (let i = 1; i < n; i += 3) if (!s.held[i] && (c < 0 || Math.abs(a[i]) > Math.abs(a[c]))) c = i;
  if (c < 0 || a[c] === 0) throw new Error('plastic-zone: no lateral displacement to follow');
  const top = n - 3;
  const lambdaRef = Math.min(s.squashLoad, s.Pcr);
  const w = new Float64Array(n);
  w[c] = 1 / (a[c] * lambdaRef); // sign included: the controlled lateral part grows positive
  w[top] = 1 / (a[top] * lambdaRef);
  const control = (v: Float64Array): number => w[c] * v[c] + w[top] * v[top];
  let step = 0.1;

  let lambda = 0;
  let current: PathPoint = { x: 0, lambda: 0, d: d.slice(), plastic: s.column.saveState() };
  const path: PathPoint[] = [current];
  let refinements = 0;
  let steps = 0;
  let best = 0;
  let bestX = 0;

  const residualNorm = (): number => {
    let r = 0;
    for (let i = 0; i < n; i++) {
      if (s.held[i]) continue;
      const ri = (lambda * F[i] - fint[i]) * (i % 3 === 2 ? 1 / L : 1);
      r += ri * ri;
    }
    return Math.sqrt(r) / forceScale;
  };

  const inc = new Float64Array(n);
  /**
   * One displacement-controlled step of size dx from `current`; false when Newton fails. A corrector
   * that raises the residual is halved (at most BACKTRACKS times): fibres that switch between
   * elastic and plastic can otherwise make plain Newton cycle between two states.
   */
  const tryStep = (dx: number): boolean => {
    d.set(current.d);
    lambda = current.lambda;
    s.column.restoreState(current.plastic);
    let first = true;
    let previous = Infinity;
    let incLambda = 0;
    let backtracks = 0;
    for (let it = 0; it < MAX_ITERATIONS; it++) {
      iterations++;
      assembleSystem(s, d, K, fint);
      const rn = residualNorm();
      if (!first && rn < TOLERANCE) return true;
      if (!first && rn > previous && backtracks < BACKTRACKS && incLambda !== 0) {
        backtracks++;
        for (let i = 0; i < n; i++) {
          inc[i] *= 0.5;
          d[i] -= inc[i];
        }
        incLambda *= 0.5;
        lambda -= incLambda;
        continue;
      }
      backtracks = 0;
      previous = first ? Infinity : rn;
      const f = factorBanded(K, n, HALF_BANDWIDTH);
      if (f.singular) return false;
      a.set(Fh);
      solveBanded(K, n, HALF_BANDWIDTH, a);
      for (let i = 0; i < n; i++) b[i] = s.held[i] ? 0 : lambda * F[i] - fint[i];
      solveBanded(K, n, HALF_BANDWIDTH, b);
      const wa = control(a);
      if (wa === 0 || !Number.isFinite(wa)) return false;
      const target = first ? dx : 0;
      const dl = (target - control(b)) / wa;
      for (let i = 0; i < n; i++) {
        inc[i] = b[i] + dl * a[i];
        d[i] += inc[i];
      }
      // the predictor sets the step; only correctors are ever halved
      incLambda = first ? 0 : dl;
      lambda += dl;
      if (!Number.isFinite(lambda)) return false;
      first = false;
    }
    return false;
  };

  while (steps < MAX_STEPS) {
    if (step < 1e-9) break;
    if (!tryStep(step)) {
      step /= 2;
      continue;
    }
    steps++;
    s.column.commit();
    const next: PathPoint = { x: current.x + step, lambda, d: d.slice(), plastic: s.column.saveState() };
    path.push(next);
    current = next;
    if (lambda > best) {
      best = lambda;
      bestX = d[c];
    }
    const k = path.length - 1;
    if (k >= 2 && path[k].lambda < path[k - 1].lambda) {
      if (refinements >= REFINEMENTS) break;
      // the peak lies between points k−2 and k: restart from k−2 with half the step
      refinements++;
      const restart = path[k - 2];
      path.length = k - 1;
      current = restart;
      step /= 2;
      continue;
    }
    if (Math.abs(d[c]) > 0.2 * L) break; // far past any peak of a real column
    if (refinements === 0) step *= GROWTH;
  }
  const k = path.length - 1;
  let capacity = best;
  let deflection = bestX;
  if (k >= 2 && path[k].lambda < path[k - 1].lambda) {
    const p = parabolaPeak(path[k - 2], path[k - 1], path[k]);
    if (p.lambda >= path[k - 1].lambda) {
      capacity = p.lambda;
      const p1 = path[k - 1];
      const p2 = p.x > p1.x ? path[k] : path[k - 2];
      deflection = p1.d[c] + ((p.x - p1.x) / (p2.x - p1.x)) * (p2.d[c] - p1.d[c]);
    }
  }
  return { capacity, squashLoad: s.squashLoad, deflectionAtPeak: Math.abs(deflection), steps, iterations };
}

/** Vertex of the parabola through three points with the middle one highest. */
function parabolaPeak(p0: PathPoint, p1: PathPoint, p2: PathPoint): { x: number; lambda: number } {
  const f01 = (p1.lambda - p0.lambda) / (p1.x - p0.x);
  const f12 = (p2.lambda - p1.lambda) / (p2.x - p1.x);
  const q = (f12 - f01) / (p2.x - p0.x);
  if (!(q < 0)) return { x: p1.x, lambda: p1.lambda };
  const x = 0.5 * (p0.x + p1.x) - f01 / (2 * q);
  const lo = Math.min(p0.x, p2.x);
  const hi = Math.max(p0.x, p2.x);
  if (x < lo || x > hi) return { x: p1.x, lambda: p1.lambda };
  return { x, lambda: p0.lambda + f01 * (x - p0.x) + q * (x - p0.x) * (x - p1.x) };
}
