/**
 * Linearised series system: failure when any of m half-spaces α_iᵀu ≥ β_i is entered, u the
 * independent standard normals. With Y_i = α_iᵀu (unit variances, correlation R_ij = α_i·α_j)
 *
 *   pf = P(∪ {Y_i ≥ β_i}) = 1 − Φ_m(β; R)                 (Ditlevsen & Madsen 1996, ch. 14)
 *
 * 1 − Φ_m loses every digit when pf is small, so the union is written as a sum of positive,
 * disjoint terms, the points sorted by β (most likely first):
 *
 *   pf = Σ_k P(Y_k ≥ β_k, Y_j < β_j for all j < k).
 *
 * Term 0 is Φ(−β_0) exactly (so one design point gives exactly Φ(−β)). Term 1 is a 1-D integral
 * (adaptive Gauss–Legendre, deterministic). Terms k ≥ 2 use Genz's separation of variables
 * (Genz 1992, J. Comput. Graph. Stat. 1:141–149) with the variable bounded below taken first,
 * so each term keeps its relative accuracy, integrated by randomised rank-1 lattice rules
 * (Genz & Bretz 2009, "Computation of Multivariate Normal and t Probabilities", §4.2) whose
 * random shifts come from the seeded streams. Ditlevsen's bounds (Ditlevsen 1979, J. Struct.
 * Mech. 7:453–472) are given as well; they bracket pf, and the estimate is kept inside them.
 */
import { normalCdf, normalQuantile, normalQuantileUpper, normalSf } from '../probability/normal.js';
import { uniformStream } from '../probability/rng.js';
import { SERIES_STREAM_BASE } from './streams.js';

export interface SeriesSystemResult { pf: number; beta: number; method: string; bounds: { lower: number; upper: number } }

/** Default seed of the lattice shifts when the caller gives none. */
const DEFAULT_SEED = 20260101;
/** Correlations this close to ±1 are treated as exactly ±1 (the 1-D integrand becomes a step). */
const UNIT_RHO = 1 - 1e-12;
/** Absolute tolerance of the 1-D integral over (0, 1), i.e. relative to the term's Φ(−β). */
const QUADRATURE_TOL = 1e-13;
const QUADRATURE_MAX_DEPTH = 48;
/** Randomised lattice: shifts per estimate, first lattice size, largest lattice size. */
const LATTICE_SHIFTS = 12;
const LATTICE_FIRST = 1021;
const LATTICE_MAX = 65521;
/** Stop refining a lattice term when 3 standard errors fall below this share of its value. */
const LATTICE_REL_ERROR = 1e-3;

/** Linearised series system: failure if any α_iᵀu ≥ β_i (α_i unit vectors in standard normal space). */
export function seriesSystemFailure(betas: readonly number[], alphas: readonly (readonly number[])[], opts?: { seed?: number }): SeriesSystemResult {
  const m = betas.length;
  checkInput(betas, alphas);
  const seed = opts?.seed ?? DEFAULT_SEED;
  const order = Array.from({ length: m }, (_, i) => i).sort((a, b) => betas[a] - betas[b] || a - b);
  const beta = order.map((i) => betas[i]);
  const unit = order.map((i) => normalised(alphas[i]));
  const rho = unit.map((a) => unit.map((b) => clampUnit(dotOf(a, b))));
  const marginal = beta.map((b) => normalSf(b));

  if (m === 1) {
    return { pf: marginal[0], beta: beta[0], method: 'one design point: Φ(−β)', bounds: { lower: marginal[0], upper: marginal[0] } };
  }
  const bounds = ditlevsenBounds(beta, rho, marginal);
  let pf = marginal[0] + firstOutsideSecondInside(beta[1], beta[0], rho[1][0]);
  let method = 'bivariate normal by adaptive Gauss–Legendre quadrature';
  let worstRelError = 0;
  let latticeSize = 0;
  for (let k = 2; k < m; k++) {
    const term = latticeTerm(k, beta, rho, marginal[k], seed);
    pf += term.value;
    latticeSize = Math.max(latticeSize, term.points);
    if (term.value > 0) worstRelError = Math.max(worstRelError, term.error / term.value);
  }
  if (m > 2) {
    method = `multinormal by Genz's separation of variables, randomised lattice (${LATTICE_SHIFTS} shifts × ≤ ${latticeSize} points, seed ${seed}, ≤ ${(100 * worstRelError).toPrecision(2)} % per term at 3 s.e.)`;
  }
  // The bounds are exact; sampling or rounding error must not carry the estimate outside them.
  pf = Math.min(Math.max(pf, bounds.lower), bounds.upper);
  return { pf, beta: normalQuantileUpper(pf), method, bounds };
}

function checkInput(betas: readonly number[], alphas: readonly (readonly number[])[]): void {
  if (betas.length === 0) throw new Error('seriesSystemFailure: at least one design point is needed');
  if (alphas.length !== betas.length) throw new Error(`seriesSystemFailure: ${betas.length} β but ${alphas.length} α vectors`);
  const n = alphas[0].length;
  for (let i = 0; i < betas.length; i++) {
    if (Number.isNaN(betas[i])) throw new Error(`seriesSystemFailure: β[${i}] is NaN`);
    if (alphas[i].length !== n) throw new Error(`seriesSystemFailure: α[${i}] has ${alphas[i].length} components, α[0] has ${n}`);
    if (!alphas[i].every(Number.isFinite)) throw new Error(`seriesSystemFailure: α[${i}] has a non-finite component`);
  }
}

function dotOf(a: readonly number[], b: readonly number[]): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * b[i];
  return s;
}

function normalised(a: readonly number[]): number[] {
  const length = Math.sqrt(dotOf(a, a));
  if (!(length > 0)) throw new Error('seriesSystemFailure: an α vector has zero length');
  return a.map((v) => v / length);
}

function clampUnit(r: number): number {
  return r > 1 ? 1 : r < -1 ? -1 : r;
}

/**
 * Ditlevsen's bounds with the points in order of decreasing marginal pf:
 *   lower = P1 + Σ_{i≥2} max(0, P_i − Σ_{j<i} P_ij),  upper = Σ P_i − Σ_{i≥2} max_{j<i} P_ij.
 */
function ditlevsenBounds(beta: number[], rho: number[][], marginal: number[]): { lower: number; upper: number } {
  let lower = marginal[0];
  let upper = marginal[0];
  for (let i = 1; i < beta.length; i++) {
    let sum = 0;
    let largest = 0;
    for (let j = 0; j < i; j++) {
      const both = bothOutside(beta[i], beta[j], rho[i][j]);
      sum += both;
      largest = Math.max(largest, both);
    }
    lower += Math.max(0, marginal[i] - sum);
    upper += marginal[i] - largest;
  }
  return { lower: Math.min(lower, 1), upper: Math.min(upper, 1) };
}

/** P(Y_a ≥ β_a, Y_b < β_b), corr(Y_a, Y_b) = ρ. */
export function firstOutsideSecondInside(betaA: number, betaB: number, rho: number): number {
  return bivariateTerm(betaA, betaB, rho, false);
}

/** P(Y_a ≥ β_a, Y_b ≥ β_b), corr(Y_a, Y_b) = ρ. */
export function bothOutside(betaA: number, betaB: number, rho: number): number {
  return bivariateTerm(betaA, betaB, rho, true);
}

/**
 * P(Y_a ≥ β_a, Y_b ≷ β_b) = Φ(−β_a) ∫₀¹ P(Y_b ≷ β_b | Y_a = z(v)) dv with z(v) = Φ⁻¹(1 − vΦ(−β_a)):
 * the conditional law of Y_b is N(ρz, 1 − ρ²). Conditioning on the rarer variable keeps the
 * relative accuracy of small probabilities; the integrand lies in [0, 1].
 */
function bivariateTerm(betaA: number, betaB: number, rho: number, bOutside: boolean): number {
  const tailA = normalSf(betaA);
  if (tailA === 0) return 0;
  if (rho >= UNIT_RHO) {
    // Y_b = Y_a.
    if (bOutside) return normalSf(Math.max(betaA, betaB));
    return betaB > betaA ? tailA - normalSf(betaB) : 0;
  }
  if (rho <= -UNIT_RHO) {
    // Y_b = −Y_a: Y_b ≥ β_b ⇔ Y_a ≤ −β_b.
    if (bOutside) return -betaB > betaA ? normalSf(betaA) - normalSf(-betaB) : 0;
    return normalSf(Math.max(betaA, -betaB));
  }
  const s = Math.sqrt((1 - rho) * (1 + rho));
  const integrand = (v: number): number => {
    const z = normalQuantileUpper(v * tailA);
    const t = (betaB - rho * z) / s;
    return bOutside ? normalSf(t) : normalCdf(t);
  };
  return tailA * adaptiveGaussLegendre(integrand, 0, 1);
}

// 20-point Gauss–Legendre nodes and weights on (−1, 1), by Newton on P_20 (no tabulated digits).
const GL_ORDER = 20;
const [GL_NODES, GL_WEIGHTS] = gaussLegendre(GL_ORDER);

function gaussLegendre(n: number): [Float64Array, Float64Array] {
  const x = new Float64Array(n);
  const w = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let z = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5));
    let dp = 0;
    for (let it = 0; it < 100; it++) {
      let p0 = 1;
      let p1 = z;
      for (let k = 2; k <= n; k++) {
        const p2 = ((2 * k - 1) * z * p1 - (k - 1) * p0) / k;
        p0 = p1;
        p1 = p2;
      }
      dp = (n * (z * p1 - p0)) / (z * z - 1);
      const dz = p1 / dp;
      z -= dz;
      if (Math.abs(dz) < 1e-16) break;
    }
    x[i] = z;
    w[i] = 2 / ((1 - z * z) * dp * dp);
  }
  return [x, w];
}

function gaussLegendreOn(f: (v: number) => number, a: number, b: number): number {
  const half = 0.5 * (b - a);
  const mid = 0.5 * (a + b);
  let s = 0;
  for (let i = 0; i < GL_ORDER; i++) s += GL_WEIGHTS[i] * f(mid + half * GL_NODES[i]);
  return half * s;
}

/** Interval halving until the two halves agree with the whole to the tolerance. */
function adaptiveGaussLegendre(f: (v: number) => number, a: number, b: number): number {
  const refine = (lo: number, hi: number, whole: number, tol: number, depth: number): number => {
    const mid = 0.5 * (lo + hi);
    const left = gaussLegendreOn(f, lo, mid);
    const right = gaussLegendreOn(f, mid, hi);
    const both = left + right;
    if (Math.abs(both - whole) <= tol || depth >= QUADRATURE_MAX_DEPTH) return both;
    return refine(lo, mid, left, tol / 2, depth + 1) + refine(mid, hi, right, tol / 2, depth + 1);
  };
  return refine(a, b, gaussLegendreOn(f, a, b), QUADRATURE_TOL, 0);
}

/**
 * Lower-triangular L with L Lᵀ = C for a positive semi-definite C. A variable that is a linear
 * combination of earlier ones gets a zero column (its constraint is then decided by them).
 */
function choleskySemiDefinite(c: number[][]): number[][] {
  const n = c.length;
  const l = c.map(() => new Array<number>(n).fill(0));
  for (let j = 0; j < n; j++) {
    let d = c[j][j];
    for (let k = 0; k < j; k++) d -= l[j][k] * l[j][k];
    if (d <= 1e-12) continue;
    const ljj = Math.sqrt(d);
    l[j][j] = ljj;
    for (let i = j + 1; i < n; i++) {
      let s = c[i][j];
      for (let k = 0; k < j; k++) s -= l[i][k] * l[j][k];
      l[i][j] = s / ljj;
    }
  }
  return l;
}

function isPrime(p: number): boolean {
  if (p < 2) return false;
  for (let d = 2; d * d <= p; d++) if (p % d === 0) return false;
  return true;
}

/** √p of the first `dims` primes: the generator of a Richtmyer (Kronecker) lattice. */
function richtmyerGenerator(dims: number): Float64Array {
  const g = new Float64Array(dims);
  for (let p = 2, i = 0; i < dims; p++) if (isPrime(p)) g[i++] = Math.sqrt(p);
  return g;
}

/**
 * Term k: P(Y_k ≥ β_k, Y_j < β_j, j < k) by separation of variables with Y_k first:
 *   Φ(−β_k) · E[ Π_{j} Φ((β_j − Σ_{i<j} L_ji w_i) / L_jj) ], w drawn in turn from the truncated
 * conditionals; k uniforms per point. Each of LATTICE_SHIFTS randomly shifted (and tent-
 * transformed) lattices gives an unbiased estimate; their spread gives the standard error.
 */
function latticeTerm(k: number, beta: number[], rho: number[][], tail: number, seed: number): { value: number; error: number; points: number } {
  if (tail === 0) return { value: 0, error: 0, points: 0 };
  const idx = [k, ...Array.from({ length: k }, (_, j) => j)];
  const l = choleskySemiDefinite(idx.map((a) => idx.map((b) => rho[a][b])));
  const bound = idx.map((i) => beta[i]);
  const dims = k;
  const generator = richtmyerGenerator(dims);
  const uniform = uniformStream(seed, SERIES_STREAM_BASE + k);
  const w = new Float64Array(k + 1);
  const point = new Float64Array(dims);
  const integrand = (): number => {
    w[0] = normalQuantileUpper(tail * point[0]);
    let product = 1;
    for (let j = 1; j <= k; j++) {
      let mean = 0;
      for (let i = 0; i < j; i++) mean += l[j][i] * w[i];
      const ljj = l[j][j];
      if (ljj === 0) {
        if (!(mean < bound[j])) return 0;
        w[j] = 0;
        continue;
      }
      const inside = normalCdf((bound[j] - mean) / ljj);
      if (inside === 0) return 0;
      product *= inside;
      if (j < k) w[j] = normalQuantile(Math.min(Math.max(point[j] * inside, Number.MIN_VALUE), inside));
    }
    return product;
  };
  let size = LATTICE_FIRST;
  let mean = 0;
  let error = Infinity;
  const shift = new Float64Array(dims);
  for (;;) {
    let sum = 0;
    let sumSq = 0;
    for (let r = 0; r < LATTICE_SHIFTS; r++) {
      for (let d = 0; d < dims; d++) shift[d] = uniform();
      let s = 0;
      for (let p = 1; p <= size; p++) {
        for (let d = 0; d < dims; d++) {
          const frac = (p * generator[d] + shift[d]) % 1;
          const tent = Math.abs(2 * frac - 1);
          // Keep strictly inside (0, 1): Φ⁻¹ of 0 or 1 is infinite.
          point[d] = Math.min(Math.max(tent, 1e-300), 1 - 1e-16);
        }
        s += integrand();
      }
      const estimate = s / size;
      sum += estimate;
      sumSq += estimate * estimate;
    }
    mean = sum / LATTICE_SHIFTS;
    const variance = Math.max(0, (sumSq - LATTICE_SHIFTS * mean * mean) / (LATTICE_SHIFTS - 1));
    error = 3 * Math.sqrt(variance / LATTICE_SHIFTS);
    if (error <= LATTICE_REL_ERROR * mean || size >= LATTICE_MAX) break;
    size = nextPrimeAbove(Math.min(2 * size, LATTICE_MAX - 1));
  }
  return { value: tail * mean, error: tail * error, points: size };
}

function nextPrimeAbove(n: number): number {
  let p = n + 1;
  while (!isPrime(p)) p++;
  return p;
}
