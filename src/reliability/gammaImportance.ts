/**
 * Order-free importance vector (Der Kiureghian 2005, Engineering Design Reliability Handbook
 * ch. 14): γ = α J_{u,x} D / |α J_{u,x} D|, with J_{u,x} = ∂u/∂x at the design point and
 * D = diag(sqrt(diag(J_{x,u} J_{x,u}ᵀ))) the standard deviations of the linearised x.
 * Unlike α (which depends on the Cholesky order of correlated variables), γ does not depend on
 * the order of the variables; for independent variables γ = α.
 * J_{x,u} by central differences of the transform (no limit-state calls).
 * Where a bounded variable sits on its bound at the design point its row of J_{x,u} is zero and
 * J_{u,x} does not exist; γ is then not defined and α is returned (γ = α when independent).
 */
import type { IsoTransform } from '../probability/nataf.js';
import { invertMatrix } from './matrixInverse.js';
import { norm } from './vector.js';

export function gammaImportance(transform: IsoTransform, uStar: ArrayLike<number>, alpha: ArrayLike<number>, h = 1e-5): number[] {
  const n = transform.n;
  const u = Float64Array.from(uStar);
  const xp = new Float64Array(n);
  const xm = new Float64Array(n);
  // jxu[i][j] = ∂x_i/∂u_j
  const jxu: number[][] = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (let j = 0; j < n; j++) {
    const uj = u[j];
    u[j] = uj + h;
    transform.toPhysical(u, xp);
    u[j] = uj - h;
    transform.toPhysical(u, xm);
    u[j] = uj;
    for (let i = 0; i < n; i++) jxu[i][j] = (xp[i] - xm[i]) / (2 * h);
  }
  const jux = invertMatrix(jxu);
  if (jux === null) return Array.from(alpha);
  const gamma = new Array<number>(n).fill(0);
  for (let j = 0; j < n; j++) {
    let sd = 0;
    for (let k = 0; k < n; k++) sd += jxu[j][k] * jxu[j][k];
    let s = 0;
    for (let i = 0; i < n; i++) s += alpha[i] * jux[i][j];
    gamma[j] = s * Math.sqrt(sd);
  }
  const len = norm(gamma);
  return gamma.map((v) => v / len);
}
