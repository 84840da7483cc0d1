import { residualStressAt } from './residualStress.js';
import type { BendingAxis, SectionDimensions, SectionFamily } from './types.js';

/**
 * A cross-section cut into fibres (small patches): for each, its area, its lever arm from the
 * centroid in the buckling plane, and its residual stress (tension positive). Only what the beam
 * element needs: three Float64Arrays of equal length.
 */
export interface FibreSection {
  readonly area: Float64Array;
  readonly lever: Float64Array;
  readonly residual: Float64Array;
  /** total area (m²) */
  readonly A: number;
  /** second moment of area about the bending axis (m⁴), summed over the fibres */
  readonly I: number;
  /** elastic section modulus I / max|lever of the outer edge| (m³) */
  readonly W: number;
}

/** One patch before the bending axis is chosen: d along the depth h, w along the width b. */
export interface Patch {
  d: number;
  w: number;
  /** half extents of the patch along d and w */
  hd: number;
  hw: number;
  area: number;
  plate: number;
}

/** A rectangle [d0,d1]×[w0,w1] cut into nd × nw patches, tagged with its plate number. */
function plate(out: Patch[], id: number, d0: number, d1: number, w0: number, w1: number, nd: number, nw: number): void {
  const hd = (d1 - d0) / nd;
  const hw = (w1 - w0) / nw;
  for (let i = 0; i < nd; i++) {
    for (let j = 0; j < nw; j++) out.push({ d: d0 + (i + 0.5) * hd, w: w0 + (j + 0.5) * hw, hd: hd / 2, hw: hw / 2, area: hd * hw, plate: id });
  }
}

/** Plate numbers the residual patterns refer to. */
export const PLATE = { topFlange: 0, bottomFlange: 1, web: 2, wall: 3, solid: 4 } as const;

function patches(s: SectionDimensions, fineness: number): { list: Patch[]; halfDepth: number; halfWidth: number } {
  const list: Patch[] = [];
  const n = fineness;
  switch (s.shape) {
    case 'i': {
      const hw = s.h / 2 - s.tf;
      plate(list, PLATE.topFlange, hw, s.h / 2, -s.b / 2, s.b / 2, 2, n);
      plate(list, PLATE.bottomFlange, -s.h / 2, -hw, -s.b / 2, s.b / 2, 2, n);
      plate(list, PLATE.web, -hw, hw, -s.tw / 2, s.tw / 2, n, 2);
      return { list, halfDepth: s.h / 2, halfWidth: s.b / 2 };
    }
    case 'rhs': {
      const hw = s.h / 2 - s.t;
      plate(list, PLATE.wall, hw, s.h / 2, -s.b / 2, s.b / 2, 2, n);
      plate(list, PLATE.wall, -s.h / 2, -hw, -s.b / 2, s.b / 2, 2, n);
      plate(list, PLATE.wall, -hw, hw, -s.b / 2, -s.b / 2 + s.t, n, 2);
      plate(list, PLATE.wall, -hw, hw, s.b / 2 - s.t, s.b / 2, n, 2);
      return { list, halfDepth: s.h / 2, halfWidth: s.b / 2 };
    }
    case 'chs': {
      const segments = 4 * n;
      const ro = s.D / 2;
      for (let layer = 0; layer < 2; layer++) {
        const r0 = ro - (layer + 1) * (s.t / 2);
        const r1 = r0 + s.t / 2;
        const rm = (2 / 3) * (r1 ** 3 - r0 ** 3) / (r1 ** 2 - r0 ** 2); // centroid radius of the sector
        const area = (Math.PI * (r1 * r1 - r0 * r0)) / segments;
        for (let k = 0; k < segments; k++) {
          const a = ((k + 0.5) * 2 * Math.PI) / segments;
          list.push({ d: rm * Math.cos(a), w: rm * Math.sin(a), hd: 0, hw: 0, area, plate: PLATE.wall });
        }
      }
      return { list, halfDepth: ro, halfWidth: ro };
    }
    case 'rect':
      plate(list, PLATE.solid, -s.h / 2, s.h / 2, -s.b / 2, s.b / 2, n, n);
      return { list, halfDepth: s.h / 2, halfWidth: s.b / 2 };
  }
}

/**
 * Fibres of the section for bending about `axis`, with the family's residual stresses scaled by
 * `residualScale`. `fineness` is the number of patches across a plate (16 by default).
 */
export function fibreSection(
  s: SectionDimensions, family: SectionFamily, axis: BendingAxis, fy: number, residualScale = 1, fineness = 16,
): FibreSection {
  const { list, halfDepth, halfWidth } = patches(s, fineness);
  const residual = residualStressAt(s, family, fy, residualScale, list);
  const n = list.length;
  const area = new Float64Array(n);
  const lever = new Float64Array(n);
  let A = 0;
  let I = 0;
  for (let i = 0; i < n; i++) {
    area[i] = list[i].area;
    lever[i] = axis === 'y' ? list[i].d : list[i].w;
    A += area[i];
    I += area[i] * lever[i] * lever[i];
  }
  return { area, lever, residual, A, I, W: I / (axis === 'y' ? halfDepth : halfWidth) };
}
