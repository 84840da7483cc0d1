/**
 * Second-order reliability at the FORM design point u*: Hessian of G(u) by central finite
 * differences, rotated to the basis whose last axis is α (Gram–Schmidt), the (n−1)×(n−1)
 * block divided by |∇G| gives the curvature matrix; its eigenvalues are the principal
 * curvatures fed to Breitung, Hohenbichler–Rackwitz and Tvedt (sormFormulas.ts).
 * `pf` is Tvedt's when it is valid, else Hohenbichler–Rackwitz, else Breitung, else FORM's.
 */
import type { FormResult, ReliabilityProblem, SormFormula, SormResult } from './types.js';
import { checkedLimitState } from './checkedLimitState.js';
import { alphaRotation } from './alphaRotation.js';
import { symmetricEigenvalues } from './symmetricEigenvalues.js';
import { breitung, hohenbichlerRackwitz, tvedt } from './sormFormulas.js';
import { throwIfInterrupted } from '../runtime/interruptFlag.js';
import { betaFromPf } from './monteCarlo.js';
import { norm } from './vector.js';

export interface SormOptions {
  /** Finite-difference step of the Hessian in u (default 1e-3). */
  step?: number;
}

/**
 * 1e-3 for a smooth g. For a g with jumps of gNoise (ReliabilityProblem.gNoise) a curvature
 * κ = g''/|∇g| read from second differences errs by about gNoise/(h²|∇g|): h keeps that below 0.01,
 * within [1e-3, 0.5].
 */
function hessianStep(gNoise: number | undefined, gradientNorm: number): number {
  if (!(gNoise !== undefined && gNoise > 0 && gradientNorm > 0)) return 1e-3;
  return Math.min(0.5, Math.max(1e-3, Math.sqrt((100 * gNoise) / gradientNorm)));
}

/** The three formulas differing by more than this share is worth a warning. */
const DISAGREEMENT = 0.1;

export function sorm(problem: ReliabilityProblem, formResult: FormResult, opts: SormOptions = {}): SormResult {
  const n = problem.transform.n;
  const beta = formResult.beta;
  const warnings: string[] = [];
  if (!formResult.converged) warnings.push('FORM did not converge: the curvatures are taken at an unconverged point');
  if (!(beta > 0)) {
    warnings.push('β <= 0 (the origin fails): the asymptotic SORM formulas do not apply; pf is FORM\'s');
    return { beta, pf: formResult.pf, used: 'form', breitung: null, hohenbichlerRackwitz: null, tvedt: null, curvatures: [], calls: 0, warnings };
  }
  const G = checkedLimitState(problem, 'SORM');
  const hessian = finiteDifferenceHessian(G, Float64Array.from(formResult.designPointU), opts.step ?? hessianStep(problem.gNoise, norm(formResult.gradientU)));
  const curvatures = principalCurvatures(hessian, formResult.alpha, norm(formResult.gradientU));

  const b = breitung(beta, curvatures);
  const hr = hohenbichlerRackwitz(beta, curvatures);
  const tv = tvedt(beta, curvatures);
  const invalid = curvatures.filter((k) => beta * k <= -1);
  if (invalid.length > 0) {
    warnings.push(`β·κ <= −1 for κ = ${invalid.map((k) => k.toPrecision(4)).join(', ')}: Breitung and Tvedt are not defined (the surface curves towards the origin faster than the β-sphere)`);
  }
  if (hr === null) warnings.push('Hohenbichler–Rackwitz is not defined for these curvatures');
  let used: SormFormula;
  let pf: number;
  if (tv !== null) [used, pf] = ['tvedt', tv];
  else if (hr !== null) [used, pf] = ['hohenbichler-rackwitz', hr];
  else if (b !== null) [used, pf] = ['breitung', b];
  else {
    [used, pf] = ['form', formResult.pf];
    warnings.push('no SORM formula is valid: pf is FORM\'s');
  }
  const valid = [b, hr, tv].filter((v): v is number => v !== null);
  if (valid.length >= 2) {
    const spread = Math.max(...valid) / Math.min(...valid) - 1;
    if (spread > DISAGREEMENT) {
      warnings.push(`the SORM formulas differ by ${(100 * spread).toFixed(0)} %: the curvatures are too large for asymptotic formulas, check with simulation`);
    }
  }
  return { beta: betaFromPf(pf), pf, used, breitung: b, hohenbichlerRackwitz: hr, tvedt: tv, curvatures, calls: G.calls(), warnings };
}

/** Central-difference Hessian: diagonal from 3 points, off-diagonal from 4 (2n² + 1 calls). */
export function finiteDifferenceHessian(G: (u: Float64Array) => number, u0: Float64Array, h: number): number[][] {
  const n = u0.length;
  const u = Float64Array.from(u0);
  const g0 = G(u);
  const H: number[][] = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  const at = (i: number, di: number, j: number, dj: number): number => {
    u.set(u0);
    u[i] += di;
    u[j] += dj;
    return G(u);
  };
  for (let i = 0; i < n; i++) {
    H[i][i] = (at(i, h, i, 0) - 2 * g0 + at(i, -h, i, 0)) / (h * h);
    for (let j = 0; j < i; j++) {
      const v = (at(i, h, j, h) - at(i, h, j, -h) - at(i, -h, j, h) + at(i, -h, j, -h)) / (4 * h * h);
      H[i][j] = v;
      H[j][i] = v;
    }
  }
  return H;
}

/**
 * Eigenvalues of the (n−1)×(n−1) block of R H Rᵀ / |∇G|, R the rotation whose last row is α
 * (sign: κ > 0 when the surface bends away from the origin, since ∇G = −|∇G| α at u*).
 */
export function principalCurvatures(hessian: number[][], alpha: ArrayLike<number>, gradNorm: number): number[] {
  const n = hessian.length;
  if (n < 2) return [];
  const R = alphaRotation(alpha);
  const m = n - 1;
  const RH: number[][] = Array.from({ length: m }, (_, i) => {
    throwIfInterrupted('SORM');
    return Array.from({ length: n }, (_, j) => {
      let s = 0;
      for (let k = 0; k < n; k++) s += R[i][k] * hessian[k][j];
      return s;
    });
  });
  const block: number[][] = Array.from({ length: m }, (_, i) => {
    throwIfInterrupted('SORM');
    return Array.from({ length: m }, (_, j) => {
      let s = 0;
      for (let k = 0; k < n; k++) s += RH[i][k] * R[j][k];
      return s / gradNorm;
    });
  });
  for (let i = 0; i < m; i++) for (let j = 0; j < i; j++) block[i][j] = block[j][i] = (block[i][j] + block[j][i]) / 2;
  return symmetricEigenvalues(block);
}
