import { factorBanded } from './bandedLdl.js';
import { assembleSystem, columnSetup } from './columnSetup.js';
import { HALF_BANDWIDTH } from './fibreColumn.js';
import type { PlasticZoneInput } from './types.js';

/**
 * Elastic critical load of the discretised column: the smallest P at which the tangent stiffness of
 * the straight, elastically compressed column (no bow, no residual stress) stops being positive
 * definite, found by bisection on the count of negative pivots (Sylvester's law of inertia). It
 * checks the element's bending and geometric stiffness against the exact solver.
 */
export function discreteCriticalLoad(input: PlasticZoneInput, relTol = 1e-10): number {
  const setup = columnSetup({ ...input, e0: 0, residualScale: 0 }, Infinity);
  const n = setup.column.dofs;
  const K = new Float64Array(n * n);
  const fint = new Float64Array(n);
  const d = new Float64Array(n);
  const EA = input.E * setup.fibres.A;
  const unstable = (P: number): boolean => {
    for (let i = 0; i <= setup.column.elements; i++) d[3 * i] = (-P * ((i * input.L) / setup.column.elements)) / EA;
    assembleSystem(setup, d, K, fint);
    const f = factorBanded(K, n, HALF_BANDWIDTH);
    return f.singular || f.negativePivots > 0;
  };
  let hi = Math.max(setup.Pcr, 1e-12) * 2;
  let lo = 0;
  for (let k = 0; k < 60 && !unstable(hi); k++) {
    lo = hi;
    hi *= 2;
  }
  while (hi - lo > relTol * hi) {
    const mid = 0.5 * (lo + hi);
    if (unstable(mid)) hi = mid;
    else lo = mid;
  }
  return 0.5 * (lo + hi);
}
