import { firstYieldCapacity } from './firstYield.js';
import { fastTable, makeFastCapacityFromRatio, bracedFirstYieldTables } from './fastColumn.js';
import type { Frame, StrengthModel } from './types.js';

/**
 * The tabulated capacity of many samples at once, one column (Float64Array) per input, for the
 * Monte Carlo kernel: one monomorphic loop instead of a chain of closures per sample. Every value
 * is computed with exactly the arithmetic of makeFastCapacityFromRatio (fastColumn.ts), in the
 * same order, so each out[b] is bit-identical to the one-sample function.
 *
 * A sample with E·I ≤ 0 or A·fy ≤ 0 (on the zero bound of a stiffness or strength) carries no
 * load: its capacity is 0, as in the limit state's one-sample path.
 */
export interface CapacityColumns {
  readonly E: Float64Array;
  readonly fy: Float64Array;
  readonly A: Float64Array;
  readonly I: Float64Array;
  readonly S: Float64Array;
  readonly bow: Float64Array;
  /** E·I per sample (the restraint ratios were formed with it). */
  readonly EI: Float64Array;
  /** Restraint ratios R = kL/EI at the bottom and top (Infinity = fixed). */
  readonly RA: Float64Array;
  readonly RB: Float64Array;
}

/** Writes out[b] for b in [0, count). Throws RangeError on a negative restraint ratio (as the one-sample path). */
export type FastCapacityBlock = (cols: CapacityColumns, L: number, count: number, out: Float64Array) => void;

function fixityOf(R: number): number {
  return R === Infinity ? 1 : R / (R + 3);
}

export function makeFastCapacityBlock(frame: Frame, model: StrengthModel): FastCapacityBlock {
  if (frame === 'braced' && model === 'first-yield') return bracedFirstYieldBlock();
  const one = makeFastCapacityFromRatio(frame, model);
  fastTable(frame);
  return (c, L, count, out) => {
    const { E, fy, A, I, S, bow, EI, RA, RB } = c;
    for (let b = 0; b < count; b++) {
      out[b] = !(EI[b] > 0) || !(A[b] * fy[b] > 0) ? 0 : one(E[b], fy[b], A[b], I[b], S[b], L, bow[b], RA[b], RB[b]);
    }
  };
}

/**
 * The demo's path (braced, first yield): φ and c from the interleaved tables, with the body of
 * interpolateFixityPair (fixityTable.ts) written out in the loop (same operations, same order),
 * so nothing is called per sample but the capacity formula.
 */
function bracedFirstYieldBlock(): FastCapacityBlock {
  const t = bracedFirstYieldTables();
  const N = t.cells;
  const n2 = 2 * (N + 1);
  const v = t.values;
  return (c, L, count, out) => {
    const { E, fy, A, I, S, bow, EI, RA, RB } = c;
    for (let b = 0; b < count; b++) {
      const ra = RA[b];
      const rb = RB[b];
      const a = A[b];
      const f = fy[b];
      if (!(EI[b] > 0) || !(a * f > 0)) {
        out[b] = 0;
        continue;
      }
      if (!(ra >= 0) || !(rb >= 0)) throw new RangeError('restraint ratios must be >= 0');
      const x = fixityOf(ra) * N;
      const y = fixityOf(rb) * N;
      let i = Math.floor(x);
      let j = Math.floor(y);
      if (i < 1) i = 1; else if (i > N - 2) i = N - 2;
      if (j < 1) j = 1; else if (j > N - 2) j = N - 2;
      const s = x - i;
      const u = y - j;
      const sa = -s * (s - 1) * (s - 2) / 6, sb = (s + 1) * (s - 1) * (s - 2) / 2;
      const sc = -(s + 1) * s * (s - 2) / 2, sd = (s + 1) * s * (s - 1) / 6;
      const ua = -u * (u - 1) * (u - 2) / 6, ub = (u + 1) * (u - 1) * (u - 2) / 2;
      const uc = -(u + 1) * u * (u - 2) / 2, ud = (u + 1) * u * (u - 1) / 6;
      let phi = 0;
      let cf = 0;
      let r = (i - 1) * n2 + 2 * (j - 1);
      phi += sa * (ua * v[r] + ub * v[r + 2] + uc * v[r + 4] + ud * v[r + 6]);
      cf += sa * (ua * v[r + 1] + ub * v[r + 3] + uc * v[r + 5] + ud * v[r + 7]);
      r += n2;
      phi += sb * (ua * v[r] + ub * v[r + 2] + uc * v[r + 4] + ud * v[r + 6]);
      cf += sb * (ua * v[r + 1] + ub * v[r + 3] + uc * v[r + 5] + ud * v[r + 7]);
      r += n2;
      phi += sc * (ua * v[r] + ub * v[r + 2] + uc * v[r + 4] + ud * v[r + 6]);
      cf += sc * (ua * v[r + 1] + ub * v[r + 3] + uc * v[r + 5] + ud * v[r + 7]);
      r += n2;
      phi += sd * (ua * v[r] + ub * v[r + 2] + uc * v[r + 4] + ud * v[r + 6]);
      cf += sd * (ua * v[r + 1] + ub * v[r + 3] + uc * v[r + 5] + ud * v[r + 7]);
      const Pcr = (phi * phi * E[b] * I[b]) / (L * L);
      out[b] = firstYieldCapacity(a, S[b], f, Pcr, bow[b], cf);
    }
  };
}
