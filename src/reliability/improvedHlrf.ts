/**
 * One improved HL-RF search (Zhang & Der Kiureghian 1995) for the point of the surface G(u) = 0
 * closest to the origin of u-space.
 *
 * Direction (the HL-RF step):  d = [(∇G·u − G)/|∇G|²] ∇G − u
 * Merit:                        m(u) = ½|u|² + c|G(u)|,  c = 2·max(|u|, |u + d|)/|∇G| > |u|/|∇G|
 * Step λ = 1, ½, ¼, ... until the Armijo condition m(u + λd) − m(u) <= a λ ∇m·d holds, with
 * ∇m·d = u·d − c|G| (because ∇G·d = −G). The factor 2·max(...) also lets the full step pass
 * at the origin, where |u| = 0.
 * Converged when |G| <= tolG·scale (scale = |G(0)|) and u is parallel to ∇G:
 * |u − (â·u) â| <= tolU·max(1, |u|), â = ∇G/|∇G|.
 *
 * Curvature (settings.curvature). HL-RF is the SQP step of  min ½|u|²  s.t.  G(u) = 0  with the
 * Hessian of the Lagrangian L = ½|u|² + μG taken as I, which makes it converge only linearly on a
 * curved surface (a factor of about κβ per step). With `curvature` the inverse Hessian H is built
 * by BFGS updates from the gradients the search computes anyway (s = Δu, y = Δ∇L at the new μ;
 * skipped unless sᵀy > 0, so H stays positive definite), and the step is the SQP step
 *   d = −H(u + μ∇G),  μ = (G − ∇Gᵀ H u) / (∇Gᵀ H ∇G)
 * (Nocedal & Wright 2006, Numerical Optimization, §18.1 and §6.1), superlinear near u*. With
 * H = I it is exactly the HL-RF direction. The merit weight is c >= 2|μ|, so d descends m
 * whenever H is positive definite; H is reset to I after a step that needed halving.
 */
import { finiteDifferenceGradient, type DifferenceScheme } from './finiteDifferenceGradient.js';
import { dot, norm } from './vector.js';
import type { FormStep } from './types.js';

export interface HlrfSettings {
  maxIterations: number;
  tolG: number;
  tolU: number;
  scheme: DifferenceScheme;
  step: number;
  /** |G| scale for the convergence test (|g(0)|, or |∇G(0)| when g(0) = 0). */
  gScale: number;
  /** Sign attached to ‖u‖ in the history: −1 when the origin fails. */
  betaSign: number;
  /** Quasi-Newton (BFGS) curvature in the step (see the file comment); false: plain HL-RF. */
  curvature?: boolean;
}

export interface HlrfOutcome {
  u: Float64Array;
  g: number;
  gradient: Float64Array;
  converged: boolean;
  reason?: string;
  iterations: number;
  history: FormStep[];
  /** One-sided differences at the start and at the returned point (forward, then backward; see finiteDifferenceGradient). */
  sidesAtStart: Float64Array;
  sides: Float64Array;
}

const ARMIJO_A = 1e-4;
const MAX_HALVINGS = 30;

export function improvedHlrf(
  G: (u: Float64Array) => number,
  start: ArrayLike<number>,
  gAtStart: number | undefined,
  s: HlrfSettings,
): HlrfOutcome {
  const n = start.length;
  const u = Float64Array.from(start);
  const grad = new Float64Array(n);
  const work = new Float64Array(n);
  const d = new Float64Array(n);
  const trial = new Float64Array(n);
  let g = gAtStart ?? G(u);
  const sides = new Float64Array(2 * n);
  finiteDifferenceGradient(G, u, g, s.scheme, s.step, grad, work, sides);
  const sidesAtStart = sides.slice();
  const history: FormStep[] = [{ iteration: 0, beta: s.betaSign * norm(u), g, step: 0 }];
  const H = s.curvature ? identity(n) : undefined;
  const hu = new Float64Array(n);
  const hg = new Float64Array(n);
  const step = new Float64Array(n);
  const lagOld = new Float64Array(n);
  const lagNew = new Float64Array(n);

  for (let k = 1; ; k++) {
    const gradNorm = norm(grad);
    if (!(gradNorm > 0)) {
      return { u, g, gradient: grad, converged: false, reason: 'the gradient of g vanished (flat limit state)', iterations: k - 1, history, sidesAtStart, sides };
    }
    const along = dot(grad, u) / gradNorm;
    let offAxis = 0;
    for (let i = 0; i < n; i++) {
      const r = u[i] - (along * grad[i]) / gradNorm;
      offAxis += r * r;
    }
    const uNorm = norm(u);
    if (Math.abs(g) <= s.tolG * s.gScale && Math.sqrt(offAxis) <= s.tolU * Math.max(1, uNorm)) {
      return { u, g, gradient: grad, converged: true, iterations: k - 1, history, sidesAtStart, sides };
    }
    if (k > s.maxIterations) {
      return {
        u, g, gradient: grad, converged: false, iterations: k - 1, history, sidesAtStart, sides,
        reason: `no convergence in ${s.maxIterations} iterations (|g|/scale = ${(Math.abs(g) / s.gScale).toExponential(2)})`,
      };
    }
    let mu = 0;
    if (H) {
      // SQP step with the BFGS inverse Hessian H: d = −H(u + μ∇G)
      matVec(H, u, hu);
      matVec(H, grad, hg);
      mu = (g - dot(grad, hu)) / dot(grad, hg);
      for (let i = 0; i < n; i++) d[i] = -(hu[i] + mu * hg[i]);
    } else {
      const factor = (dot(grad, u) - g) / (gradNorm * gradNorm);
      mu = -factor;
      for (let i = 0; i < n; i++) d[i] = factor * grad[i] - u[i];
    }
    for (let i = 0; i < n; i++) trial[i] = u[i] + d[i];
    const c = Math.max((2 * Math.max(uNorm, norm(trial))) / gradNorm, 2 * Math.abs(mu));
    const merit0 = 0.5 * uNorm * uNorm + c * Math.abs(g);
    const slope = dot(u, d) - c * Math.abs(g);
    let lambda = 1;
    let gTrial = 0;
    let halvings = 0;
    for (let h = 0; ; h++) {
      for (let i = 0; i < n; i++) trial[i] = u[i] + lambda * d[i];
      gTrial = G(trial);
      const tn = norm(trial);
      const merit = 0.5 * tn * tn + c * Math.abs(gTrial);
      if (merit - merit0 <= ARMIJO_A * lambda * slope || h >= MAX_HALVINGS) break;
      lambda /= 2;
      halvings++;
    }
    if (H) {
      lagrangianGradient(lagOld, u, grad, mu);
      for (let i = 0; i < n; i++) step[i] = trial[i] - u[i];
    }
    u.set(trial);
    g = gTrial;
    finiteDifferenceGradient(G, u, g, s.scheme, s.step, grad, work, sides);
    if (H) {
      if (halvings > 0) resetIdentity(H);
      else {
        lagrangianGradient(lagNew, u, grad, mu);
        for (let i = 0; i < n; i++) lagNew[i] -= lagOld[i];
        bfgsInverseUpdate(H, step, lagNew, hu);
      }
    }
    history.push({ iteration: k, beta: s.betaSign * norm(u), g, step: lambda });
  }
}

function identity(n: number): Float64Array[] {
  return Array.from({ length: n }, (_, i) => {
    const row = new Float64Array(n);
    row[i] = 1;
    return row;
  });
}

function resetIdentity(H: Float64Array[]): void {
  for (let i = 0; i < H.length; i++) {
    H[i].fill(0);
    H[i][i] = 1;
  }
}

function matVec(H: Float64Array[], v: Float64Array, out: Float64Array): void {
  for (let i = 0; i < H.length; i++) out[i] = dot(H[i], v);
}

/** ∇L = u + μ∇G. */
function lagrangianGradient(out: Float64Array, u: Float64Array, grad: Float64Array, mu: number): void {
  for (let i = 0; i < u.length; i++) out[i] = u[i] + mu * grad[i];
}

/**
 * BFGS update of the inverse Hessian: H ← (I − ρsyᵀ) H (I − ρysᵀ) + ρssᵀ, ρ = 1/yᵀs
 * (Nocedal & Wright 2006, Eq. 6.17). Skipped unless yᵀs > 0 (H stays positive definite).
 * `hy` is scratch.
 */
function bfgsInverseUpdate(H: Float64Array[], s: Float64Array, y: Float64Array, hy: Float64Array): void {
  const ys = dot(y, s);
  if (!(ys > 1e-12 * norm(y) * norm(s))) return;
  const rho = 1 / ys;
  matVec(H, y, hy);
  const yHy = dot(y, hy);
  const n = s.length;
  // H is symmetric: H' = H − ρ(Hy sᵀ + s yᵀH) + (ρ² yᵀHy + ρ) s sᵀ
  const k = rho * rho * yHy + rho;
  for (let i = 0; i < n; i++) {
    const row = H[i];
    for (let j = 0; j < n; j++) row[j] += -rho * (hy[i] * s[j] + s[i] * hy[j]) + k * s[i] * s[j];
  }
}
