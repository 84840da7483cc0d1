import { criticalLoad } from '../mechanics/criticalLoad.js';
import { throwIfInterrupted } from '../runtime/interruptFlag.js';
import { plasticZoneCapacity } from './plasticZoneCapacity.js';
import { fibreSection } from './sectionFibres.js';
import type { BendingAxis, SectionDimensions, SectionFamily } from './types.js';

/**
 * A tabulated plastic-zone capacity for sampling: χ = N_u / (A fy) on a grid of the dimensionless
 * parameters of one section (its shape ratios, family, axis) and frame:
 *   λ̄ = √(A fy / Pcr) with Pcr of the restrained column (mechanics/criticalLoad.ts),
 *   f_B, f_T = R/(R + 3) the fixity factors of the end springs (R = kL/EI; 1 = rigid),
 *   η = |e0| A / W the bow over the core radius (mode-affine bow), interpolated in √η (near λ̄ = 1
 *   the capacity falls like √η for small bows, Perry's formula).
 * Built at E/fy = 210 GPa / 235 MPa; χ depends on E and fy only through λ̄ (the residual stresses
 * scale with fy), which the table's test checks at other values. Read by multilinear interpolation
 * in the four parameters. Outside the grid, with a lateral spring, an end eccentricity or a
 * mechanism node among the corners, `chiAt` returns NaN and the caller runs the full model.
 */
export interface TableGrid {
  readonly lambdaBar: readonly number[];
  readonly fixity: readonly number[];
  readonly eta: readonly number[];
}

/**
 * The smallest bow the model is asked about, η = |e0| A/W = 0.01 (0.3 mm on a 200 mm H section):
 * a nearly straight stocky column makes the path to the peak a bifurcation that the displacement
 * control does not follow reliably, and no real column is straighter. limitState/ raises smaller bows to it.
 */
export const MIN_ETA = 0.01;

/** The grid used by `analysis.plastic_zone: table`: 11 × 5 × 5 × 6 = 1650 full evaluations per section and frame. */
export const DEFAULT_GRID: TableGrid = {
  lambdaBar: [0.2, 0.4, 0.6, 0.8, 1.0, 1.2, 1.4, 1.7, 2.0, 2.5, 3.0],
  fixity: [0, 0.25, 0.5, 0.75, 1],
  eta: [MIN_ETA, 0.04, 0.12, 0.25, 0.5, 1.0],
};

/** What a table is for (part of its cache key). */
export interface TableSubject {
  readonly section: SectionDimensions;
  readonly family: SectionFamily;
  readonly axis: BendingAxis;
  readonly frame: 'braced' | 'sway';
  readonly elements: number;
}

export interface CapacityTable {
  readonly subject: TableSubject;
  readonly grid: TableGrid;
  /** χ at the nodes, λ̄ fastest, then f_B, f_T, η; NaN at a mechanism */
  readonly chi: Float64Array;
  /** wall time of the build (ms), 0 when read from disk */
  readonly buildMs: number;
}


const REF_E = 210e9;
const REF_FY = 235e6;

const ratioOf = (f: number): number => (f >= 1 ? Infinity : (3 * f) / (1 - f));

export function tableSize(g: TableGrid): number {
  return g.lambdaBar.length * g.fixity.length * g.fixity.length * g.eta.length;
}

/** Every node by the full model. `onProgress(done, total)` may report progress. */
export function buildCapacityTable(subject: TableSubject, grid: TableGrid = DEFAULT_GRID, onProgress?: (done: number, total: number) => void): CapacityTable {
  const t0 = performance.now();
  const fib = fibreSection(subject.section, subject.family, subject.axis, REF_FY);
  const EI = REF_E * fib.I;
  const squash = fib.A * REF_FY;
  const nl = grid.lambdaBar.length;
  const nf = grid.fixity.length;
  const chi = new Float64Array(tableSize(grid));
  let done = 0;
  for (let ie = 0; ie < grid.eta.length; ie++) {
    for (let it = 0; it < nf; it++) {
      for (let ib = 0; ib < nf; ib++) {
        const RB = ratioOf(grid.fixity[ib]);
        const RT = ratioOf(grid.fixity[it]);
        // φ of the restrained column does not depend on L at fixed R: L follows from λ̄
        const { phi } = criticalLoad(1, 1, subject.frame, { bottom: RB, top: RT });
        for (let il = 0; il < nl; il++) {
          const index = il + nl * (ib + nf * (it + nf * ie));
          done++;
          if (!(phi > 0)) {
            chi[index] = NaN;
            continue;
          }
          throwIfInterrupted('the plastic-zone table build');
          const L = grid.lambdaBar[il] * phi * Math.sqrt(EI / squash);
          const e0 = grid.eta[ie] * (fib.W / fib.A);
          const r = plasticZoneCapacity({
            section: subject.section, family: subject.family, axis: subject.axis, E: REF_E, fy: REF_FY, L, frame: subject.frame,
            kBottom: RB === Infinity ? Infinity : (RB * EI) / L, kTop: RT === Infinity ? Infinity : (RT * EI) / L, e0,
            elements: subject.elements,
          });
          chi[index] = r.capacity / r.squashLoad;
        }
        onProgress?.(done, chi.length);
      }
    }
  }
  return { subject, grid, chi, buildMs: performance.now() - t0 };
}

/** Cell [k, k+1] holding v and the weight of k+1 (in √ of the coordinate when `root`); false outside. */
function cell(nodes: readonly number[], v: number, out: Float64Array, slot: number, root = false): boolean {
  const n = nodes.length;
  if (!(v >= nodes[0] && v <= nodes[n - 1])) return false;
  let k = 0;
  while (k < n - 2 && v > nodes[k + 1]) k++;
  out[2 * slot] = k;
  out[2 * slot + 1] = root
    ? (Math.sqrt(v) - Math.sqrt(nodes[k])) / (Math.sqrt(nodes[k + 1]) - Math.sqrt(nodes[k]))
    : (v - nodes[k]) / (nodes[k + 1] - nodes[k]);
  return true;
}

const cells = new Float64Array(8);

/** χ by multilinear interpolation; NaN outside the grid or next to a mechanism node. */
export function chiAt(t: CapacityTable, lambdaBar: number, fB: number, fT: number, eta: number): number {
  const g = t.grid;
  if (!cell(g.lambdaBar, lambdaBar, cells, 0) || !cell(g.fixity, fB, cells, 1) || !cell(g.fixity, fT, cells, 2) || !cell(g.eta, eta, cells, 3, true)) return NaN;
  const nl = g.lambdaBar.length;
  const nf = g.fixity.length;
  let sum = 0;
  for (let corner = 0; corner < 16; corner++) {
    let w = 1;
    let index = 0;
    let stride = 1;
    for (let d = 0; d < 4; d++) {
      const up = (corner >> d) & 1;
      const k = cells[2 * d] + up;
      const s = cells[2 * d + 1];
      w *= up ? s : 1 - s;
      index += k * stride;
      stride *= d === 0 ? nl : d === 3 ? 0 : nf;
    }
    if (w === 0) continue;
    const v = t.chi[index];
    if (Number.isNaN(v)) return NaN;
    sum += w * v;
  }
  return sum;
}

/** Fixity factor f = R/(R + 3) (1 for a rigid end). */
export function fixityOfRatio(R: number): number {
  return R === Infinity ? 1 : R / (R + 3);
}
