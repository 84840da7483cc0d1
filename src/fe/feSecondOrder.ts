import { choleskyInPlace } from './cholesky.js';
import { assembleColumn, type FeFrame, type FeRestraint } from './columnModel.js';
import { elasticStiffness, geometricStiffness } from './hermiteBeamElement.js';

/**
 * Linear second-order (P-δ) solve of the bowed column by finite elements, a check on the closed form
 * of mechanics/endSpringMoments.ts that shares no code with it. With the initial shape w0 as Hermite
 * nodal values and v = w − w0, stationarity of ½∫EI v''² − ½P∫(w'² − w0'²) + springs gives
 *   (K − λ Kg) v = λ Kg w0,   λ = P L²/EI,
 * on the dimensionless column of columnModel.ts (EI = L = 1, DOFs w and dw/dξ; lengths stay in m).
 * Valid below the first finite-element critical load, where K − λ Kg is positive definite.
 */

export interface FeNodalShape {
  /** w at each node (m) and dw/dξ at each node (m), nodes at ξ = i/elements */
  w: Float64Array;
  slope: Float64Array;
}

export interface FeSecondOrderResult {
  /** added deflection v = w − w0 as nodal values */
  v: FeNodalShape;
  /** end rotations dv/dx (rad) */
  rotation: { bottom: number; top: number };
  /** moment the end spring or support applies, k·θ (N·m); from the nodal equilibrium of the elements */
  springMoment: { bottom: number; top: number };
  /** largest |M| = EI |v''| (N·m) from the nodal moments of element equilibrium, refined by a parabola, and where (m) */
  memberMax: number;
  memberMaxAt: number;
  /** bending moment M = −EI v'' (N·m) at each node, from element equilibrium (averaged between the two elements at an inner node) */
  nodeMoment: Float64Array;
}

function solveCholesky(Lc: Float64Array, n: number, b: Float64Array): Float64Array {
  const y = Float64Array.from(b);
  for (let i = 0; i < n; i++) {
    let t = y[i];
    for (let k = 0; k < i; k++) t -= Lc[i * n + k] * y[k];
    y[i] = t / Lc[i * n + i];
  }
  for (let i = n - 1; i >= 0; i--) {
    let t = y[i];
    for (let k = i + 1; k < n; k++) t -= Lc[k * n + i] * y[k];
    y[i] = t / Lc[i * n + i];
  }
  return y;
}

function fullVector(shape: FeNodalShape): Float64Array {
  const nodes = shape.w.length;
  const out = new Float64Array(2 * nodes);
  for (let i = 0; i < nodes; i++) {
    out[2 * i] = shape.w[i];
    out[2 * i + 1] = shape.slope[i];
  }
  return out;
}

function splitVector(full: Float64Array): FeNodalShape {
  const nodes = full.length / 2;
  const w = new Float64Array(nodes);
  const slope = new Float64Array(nodes);
  for (let i = 0; i < nodes; i++) {
    w[i] = full[2 * i];
    slope[i] = full[2 * i + 1];
  }
  return { w, slope };
}

/** Largest |w| of the Hermite interpolant (sampled finely inside each element) and its value's sign. */
function signedMax(full: Float64Array, elements: number): number {
  const h = 1 / elements;
  const SUB = 32;
  let best = 0;
  for (let el = 0; el < elements; el++) {
    const o = 2 * el;
    for (let j = 0; j <= SUB; j++) {
      const s = j / SUB;
      const s2 = s * s;
      const s3 = s2 * s;
      const w =
        (1 - 3 * s2 + 2 * s3) * full[o] + h * (s - 2 * s2 + s3) * full[o + 1] +
        (3 * s2 - 2 * s3) * full[o + 2] + h * (s3 - s2) * full[o + 3];
      if (Math.abs(w) > Math.abs(best)) best = w;
    }
  }
  return best;
}

/**
 * First buckling mode by inverse iteration (x ← K⁻¹ Kg x converges to the eigenvector of the smallest
 * λ), normalised so that the largest |w| is +1 (braced: w is measured from the chord, as both ends are
 * held; sway: from the vertical through the base).
 */
export function feFirstMode(frame: FeFrame, r: FeRestraint, elements: number, iterations = 400): FeNodalShape {
  const { n, K, Kg, keep } = assembleColumn(frame, r, elements);
  const Lc = choleskyInPlace(Float64Array.from(K), n);
  let x: Float64Array = new Float64Array(n).fill(1);
  const y = new Float64Array(n);
  for (let it = 0; it < iterations; it++) {
    for (let i = 0; i < n; i++) {
      let t = 0;
      for (let j = 0; j < n; j++) t += Kg[i * n + j] * x[j];
      y[i] = t;
    }
    const next = solveCholesky(Lc, n, y);
    let norm = 0;
    let at = 0;
    for (let i = 0; i < n; i++) if (Math.abs(next[i]) > norm) { norm = Math.abs(next[i]); at = i; }
    const s = next[at] > 0 ? norm : -norm; // keep the sign fixed so successive iterates compare
    let change = 0;
    for (let i = 0; i < n; i++) {
      next[i] /= s;
      change = Math.max(change, Math.abs(next[i] - x[i]));
    }
    x = next;
    if (change < 1e-13) break;
  }
  const full = new Float64Array(2 * (elements + 1));
  keep.forEach((d, i) => (full[d] = x[i]));
  const m = signedMax(full, elements);
  for (let i = 0; i < full.length; i++) full[i] /= m;
  return splitVector(full);
}

/**
 * The second-order response to the initial shape w0 (nodal values, m) under P (N), and to external
 * couples (N·m) applied to the end nodes, positive when they turn the node towards +w going up
 * (a load P at eccentricity e on the +w side gives +P·e at the bottom and −P·e at the top), to a
 * uniform line load `line` (N/m, consistent nodal loads of the Hermite element) and to a horizontal
 * force `top` (N) at the top node (acts only where the top may move: sway), both positive towards +w.
 * `stiffnessAt(ξ)` (optional): E·I relative to `EI` along the height, piecewise constant (a stepped
 * member; the steps must fall on element boundaries), R and T referred to `EI`.
 */
export function feSecondOrder(
  EI: number,
  L: number,
  frame: FeFrame,
  r: FeRestraint,
  P: number,
  w0: FeNodalShape,
  endCouples: { bottom: number; top: number } = { bottom: 0, top: 0 },
  actions: { line: number; top: number } = { line: 0, top: 0 },
  stiffnessAt?: (xi: number) => number,
): FeSecondOrderResult {
  const elements = w0.w.length - 1;
  const lambda = (P * L * L) / EI;
  // a stepped member: EI of each element relative to EI (R and T refer to EI), taken at its middle
  const relative = (el: number): number => (stiffnessAt === undefined ? 1 : stiffnessAt((el + 0.5) / elements));
  const { n, K, Kg, keep } = assembleColumn(frame, r, elements, relative);
  const N = 2 * (elements + 1);
  const h = 1 / elements;
  const ke = elasticStiffness(h);
  const kg = geometricStiffness(h);
  const w0f = fullVector(w0);
  // right-hand side λ Kg_full w0, restricted to the free DOFs
  const gw0 = new Float64Array(N);
  for (let el = 0; el < elements; el++) {
    const o = 2 * el;
    for (let i = 0; i < 4; i++) for (let j = 0; j < 4; j++) gw0[o + i] += kg[i * 4 + j] * w0f[o + j];
  }
  const A = new Float64Array(n * n);
  for (let i = 0; i < n * n; i++) A[i] = K[i] - lambda * Kg[i];
  // a couple M on dv/dx = (dv/dξ)/L does the work of M L²/EI on the dimensionless slope DOF
  const fExt = new Float64Array(N);
  fExt[1] = (endCouples.bottom * L * L) / EI;
  fExt[N - 1] = (endCouples.top * L * L) / EI;
  fExt[N - 2] += (actions.top * L * L * L) / EI;
  // element load vector of the line load on the dimensionless element: W h/2, W h²/12, W h/2, −W h²/12
  const W = (actions.line * L * L * L * L) / EI;
  const fl = [(W * h) / 2, (W * h * h) / 12, (W * h) / 2, (-W * h * h) / 12];
  for (let el = 0; el < elements; el++) for (let i = 0; i < 4; i++) fExt[2 * el + i] += fl[i];
  const rhs = Float64Array.from(keep, (d) => lambda * gw0[d] + fExt[d]);
  const vFree = solveCholesky(choleskyInPlace(A, n), n, rhs);
  const v = new Float64Array(N);
  keep.forEach((d, i) => (v[d] = vFree[i]));
  // internal nodal forces of the elements: what the spring or support must supply at each end, and
  // (with M = −EI v'') the bending moment at each node: +f[θ1] at an element's first node, −f[θ2] at its second
  const fInt = new Float64Array(N);
  const nodeMoment = new Float64Array(elements + 1);
  const toMoment = EI / (L * L);
  for (let el = 0; el < elements; el++) {
    const o = 2 * el;
    const ei = relative(el);
    const fe = [0, 0, 0, 0];
    for (let i = 0; i < 4; i++) {
      for (let j = 0; j < 4; j++) fe[i] += (ei * ke[i * 4 + j] - lambda * kg[i * 4 + j]) * v[o + j] - lambda * kg[i * 4 + j] * w0f[o + j];
      fe[i] -= fl[i]; // the element's own load is not an end force
      fInt[o + i] += fe[i];
    }
    const share = (node: number) => (node === 0 || node === elements ? 1 : 0.5);
    nodeMoment[el] += share(el) * fe[1] * toMoment;
    nodeMoment[el + 1] -= share(el + 1) * fe[3] * toMoment;
  }
  // largest |M|: the largest nodal value, refined by the parabola through it and its neighbours
  let k = 0;
  for (let i = 1; i <= elements; i++) if (Math.abs(nodeMoment[i]) > Math.abs(nodeMoment[k])) k = i;
  let memberMax = Math.abs(nodeMoment[k]);
  let memberMaxAt = k * h * L;
  if (k > 0 && k < elements) {
    const a = Math.abs(nodeMoment[k - 1]), b = memberMax, c = Math.abs(nodeMoment[k + 1]);
    const curv = a - 2 * b + c;
    if (curv < 0) {
      const t = (0.5 * (a - c)) / curv; // vertex offset in elements, |t| ≤ ½
      memberMax = b - 0.25 * (a - c) * t;
      memberMaxAt = (k + t) * h * L;
    }
  }
  return {
    v: splitVector(v),
    rotation: { bottom: v[1] / L, top: v[N - 1] / L },
    // the spring (or support) supplies what the applied couple leaves over of the element end forces
    springMoment: { bottom: ((endCouples.bottom * L * L) / EI - fInt[1]) * toMoment, top: ((endCouples.top * L * L) / EI - fInt[N - 1]) * toMoment },
    memberMax,
    memberMaxAt,
    nodeMoment,
  };
}
