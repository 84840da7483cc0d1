import type { FibreSection } from './sectionFibres.js';

/**
 * The discretised column: N two-node beam elements along x ∈ [0, L] (x up from the base), three
 * degrees of freedom per node (u axial, v lateral, θ = dv/dx). Kinematics of moderate rotations
 * (total Lagrangian, second order; adequate for flexural buckling, Bažant & Cedolin 1991 §1.9):
 *   ε(x, y) = ē_m − y·v'',   ē_m = (1/Le) ∫ (u' + w0'·v' + ½ v'²) dx over the element
 * with w0 the initial bow (stress-free geometry), u linear and v cubic Hermite in each element, and
 * the fibres integrated at three Gauss points per element. Averaging the membrane strain over the
 * element removes membrane locking (a linear u cannot balance the quadratic ½ v'² pointwise, which
 * would stiffen the bent column spuriously). Each fibre is elastic–plastic with
 * linear hardening H (H = 0: perfectly plastic) and starts at its residual stress σ_r.
 */
export const GAUSS_POINTS = 3;
const GAUSS_XI = [0.5 - 0.5 * Math.sqrt(0.6), 0.5, 0.5 + 0.5 * Math.sqrt(0.6)];
const GAUSS_W = [5 / 18, 8 / 18, 5 / 18];

export interface FibreColumnSpec {
  readonly fibres: FibreSection;
  readonly E: number;
  readonly fy: number;
  readonly hardening: number;
  readonly L: number;
  readonly elements: number;
  /** slope of the initial bow dw0/dx at x */
  readonly bowSlope: (x: number) => number;
}

export interface FibreColumn {
  readonly dofs: number;
  readonly elements: number;
  readonly L: number;
  /**
   * Tangent stiffness `K` (dense row-major dofs×dofs; only the band of half-width 5 is written) and
   * internal forces `fint` at displacements d, from the committed plastic state; the trial plastic
   * state is kept for `commit`.
   */
  assemble(d: Float64Array, K: Float64Array, fint: Float64Array): void;
  /** accept the last assembled plastic state as the converged one */
  commit(): void;
  /** copy / restore the committed plastic state */
  saveState(): Float64Array;
  restoreState(saved: Float64Array): void;
}

export const HALF_BANDWIDTH = 5;

export function fibreColumn(spec: FibreColumnSpec): FibreColumn {
  const { fibres, E, fy, hardening: H, L, elements: ne } = spec;
  const nf = fibres.area.length;
  const { area, lever, residual } = fibres;
  const Le = L / ne;
  const dofs = 3 * (ne + 1);
  const points = ne * GAUSS_POINTS;
  // per Gauss point: bow slope and Hermite derivatives (the same in every element)
  const w0p = new Float64Array(points);
  for (let e = 0; e < ne; e++) for (let g = 0; g < GAUSS_POINTS; g++) w0p[e * GAUSS_POINTS + g] = spec.bowSlope((e + GAUSS_XI[g]) * Le);
  const dN = new Float64Array(4 * GAUSS_POINTS);
  const ddN = new Float64Array(4 * GAUSS_POINTS);
  for (let g = 0; g < GAUSS_POINTS; g++) {
    const s = GAUSS_XI[g];
    dN.set([(-6 * s + 6 * s * s) / Le, 1 - 4 * s + 3 * s * s, (6 * s - 6 * s * s) / Le, -2 * s + 3 * s * s], 4 * g);
    ddN.set([(-6 + 12 * s) / (Le * Le), (-4 + 6 * s) / Le, (6 - 12 * s) / (Le * Le), (-2 + 6 * s) / Le], 4 * g);
  }
  const VDOF = [1, 2, 4, 5];
  let plastic = new Float64Array(2 * points * nf); // [εp, α] per fibre per point, committed
  let trial = new Float64Array(2 * points * nf);
  const bm = new Float64Array(6);
  const bb = new Float64Array(6);
  const fe = new Float64Array(6);
  const ke = new Float64Array(36);
  const gvv = new Float64Array(16);
  const Ep = H > 0 ? (E * H) / (E + H) : 0;

  function assemble(d: Float64Array, K: Float64Array, fint: Float64Array): void {
    K.fill(0);
    fint.fill(0);
    for (let e = 0; e < ne; e++) {
      const o = 3 * e;
      fe.fill(0);
      ke.fill(0);
      // membrane strain and its gradient averaged over the element (no membrane locking)
      bm.fill(0);
      bm[0] = -1 / Le;
      bm[3] = 1 / Le;
      let em = (d[o + 3] - d[o]) / Le;
      gvv.fill(0);
      for (let g = 0; g < GAUSS_POINTS; g++) {
        const q = e * GAUSS_POINTS + g;
        let vp = 0;
        for (let k = 0; k < 4; k++) vp += dN[4 * g + k] * d[o + VDOF[k]];
        em += GAUSS_W[g] * (w0p[q] * vp + 0.5 * vp * vp);
        const slope = w0p[q] + vp;
        for (let k = 0; k < 4; k++) {
          bm[VDOF[k]] += GAUSS_W[g] * slope * dN[4 * g + k];
          for (let j = 0; j < 4; j++) gvv[4 * k + j] += GAUSS_W[g] * dN[4 * g + k] * dN[4 * g + j];
        }
      }
      let Nint = 0;
      for (let g = 0; g < GAUSS_POINTS; g++) {
        const q = e * GAUSS_POINTS + g;
        let vpp = 0;
        for (let k = 0; k < 4; k++) vpp += ddN[4 * g + k] * d[o + VDOF[k]];
        let N = 0;
        let M = 0;
        let D11 = 0;
        let D12 = 0;
        let D22 = 0;
        const base = 2 * q * nf;
        for (let f = 0; f < nf; f++) {
          const y = lever[f];
          const eps = em - y * vpp;
          const ip = base + 2 * f;
          let ep = plastic[ip];
          let alpha = plastic[ip + 1];
          let sig = E * (eps - ep) + residual[f];
          const over = Math.abs(sig) - (fy + H * alpha);
          let Et = E;
          if (over > 0) {
            const dg = over / (E + H);
            const sign = sig > 0 ? 1 : -1;
            sig -= E * dg * sign;
            ep += dg * sign;
            alpha += dg;
            Et = Ep;
          }
          trial[ip] = ep;
          trial[ip + 1] = alpha;
          const a = area[f];
          N += sig * a;
          M -= sig * y * a;
          const ea = Et * a;
          D11 += ea;
          D12 -= ea * y;
          D22 += ea * y * y;
        }
        bb[0] = 0;
        bb[3] = 0;
        for (let k = 0; k < 4; k++) bb[VDOF[k]] = ddN[4 * g + k];
        const w = GAUSS_W[g] * Le;
        Nint += w * N;
        for (let i = 0; i < 6; i++) {
          fe[i] += w * (bm[i] * N + bb[i] * M);
          const ci = w * (D11 * bm[i] + D12 * bb[i]);
          const di = w * (D12 * bm[i] + D22 * bb[i]);
          for (let j = 0; j < 6; j++) ke[6 * i + j] += ci * bm[j] + di * bb[j];
        }
      }
      // geometric stiffness (∫N dx) · ∂²ē_m/∂v∂v, with ∂²ē_m/∂v_i∂v_j = (1/Le)∫ dN_i dN_j dx
      for (let i = 0; i < 4; i++) for (let j = 0; j < 4; j++) ke[6 * VDOF[i] + VDOF[j]] += Nint * gvv[4 * i + j];
      for (let i = 0; i < 6; i++) {
        fint[o + i] += fe[i];
        const row = (o + i) * dofs + o;
        for (let j = 0; j < 6; j++) K[row + j] += ke[6 * i + j];
      }
    }
  }

  return {
    dofs,
    elements: ne,
    L,
    assemble,
    commit() {
      const t = plastic;
      plastic = trial;
      trial = t;
    },
    saveState: () => plastic.slice(),
    restoreState(saved) {
      plastic.set(saved);
    },
  };
}
