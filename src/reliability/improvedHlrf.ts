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
    const factor = (dot(grad, u) - g) / (gradNorm * gradNorm);
    for (let i = 0; i < n; i++) {
      d[i] = factor * grad[i] - u[i];
      trial[i] = u[i] + d[i];
    }
    const c = (2 * Math.max(uNorm, norm(trial))) / gradNorm;
    const merit0 = 0.5 * uNorm * uNorm + c * Math.abs(g);
    const slope = dot(u, d) - c * Math.abs(g);
    let lambda = 1;
    let gTrial = 0;
    for (let h = 0; ; h++) {
      for (let i = 0; i < n; i++) trial[i] = u[i] + lambda * d[i];
      gTrial = G(trial);
      const tn = norm(trial);
      const merit = 0.5 * tn * tn + c * Math.abs(gTrial);
      if (merit - merit0 <= ARMIJO_A * lambda * slope || h >= MAX_HALVINGS) break;
      lambda /= 2;
    }
    u.set(trial);
    g = gTrial;
    finiteDifferenceGradient(G, u, g, s.scheme, s.step, grad, work, sides);
    history.push({ iteration: k, beta: s.betaSign * norm(u), g, step: lambda });
  }
}
