import type { Patch } from './sectionFibres.js';
import type { SectionDimensions, SectionFamily } from './types.js';

/**
 * Residual stresses of a section family (tension positive), averaged over each patch so that the
 * discrete pattern stays self-equilibrated (∫σ_r dA = 0 on every plate; symmetric, so ∫σ_r·lever dA = 0).
 *
 * - rolled I/H (the linear pattern behind the European column curves, ECCS 1976; Beer & Schulz 1970):
 *   peak σ0 = 0.3 fy when h/b > 1.2, 0.5 fy when h/b ≤ 1.2; flanges linear from −σ0 (compression)
 *   at the tips to +σ0 (tension) at the flange–web junction; web linear from +σ0 at the junctions to
 *   −σ0 at mid-depth. Each plate is balanced on its own.
 * - welded I/H: tension fy in a band beside each weld, uniform compression σc = 0.25 fy elsewhere in
 *   the plate; the band width follows from the balance (c = half-plate × σc / (fy + σc)).
 * - hollow (hot-finished) and solid (incl. timber): none.
 * `scale` multiplies σ0 and σc (the band width of the welded pattern follows σc).
 */
const SUBSAMPLES = 32;

export function residualStressAt(
  s: SectionDimensions, family: SectionFamily, fy: number, scale: number, patches: readonly Patch[],
): Float64Array {
  const out = new Float64Array(patches.length);
  if (family === 'hollow' || family === 'solid' || scale === 0) return out;
  if (s.shape !== 'i') throw new RangeError(`the ${family} residual-stress pattern is for I/H sections (got '${s.shape}')`);
  const halfB = s.b / 2;
  const halfWeb = s.h / 2 - s.tf;
  let flangeAt: (w: number) => number;
  let webAt: (d: number) => number;
  if (family === 'rolled') {
    const s0 = (s.h / s.b > 1.2 ? 0.3 : 0.5) * fy * scale;
    flangeAt = (w) => s0 * (1 - (2 * Math.abs(w)) / halfB);
    webAt = (d) => s0 * ((2 * Math.abs(d)) / halfWeb - 1);
  } else {
    const sc = 0.25 * fy * scale;
    const cf = (halfB * sc) / (fy + sc);
    const cw = (halfWeb * sc) / (fy + sc);
    flangeAt = (w) => (Math.abs(w) < cf ? fy : -sc);
    webAt = (d) => (Math.abs(d) > halfWeb - cw ? fy : -sc);
  }
  for (let i = 0; i < patches.length; i++) {
    const p = patches[i];
    const web = p.plate === 2;
    const centre = web ? p.d : p.w;
    const half = web ? p.hd : p.hw;
    let sum = 0;
    for (let k = 0; k < SUBSAMPLES; k++) sum += (web ? webAt : flangeAt)(centre - half + ((k + 0.5) * 2 * half) / SUBSAMPLES);
    out[i] = sum / SUBSAMPLES;
  }
  // remove the discretisation's imbalance of each plate, so the pattern is exactly self-equilibrated;
  // only fibres below yield take the correction (a welded band stays at fy, never above it)
  for (let plate = 0; plate <= 2; plate++) {
    let f = 0;
    let a = 0;
    for (let i = 0; i < patches.length; i++) {
      if (patches[i].plate !== plate) continue;
      f += out[i] * patches[i].area;
      if (Math.abs(out[i]) < 0.99 * fy) a += patches[i].area;
    }
    for (let i = 0; i < patches.length; i++) if (patches[i].plate === plate && Math.abs(out[i]) < 0.99 * fy) out[i] -= f / a;
  }
  return out;
}
