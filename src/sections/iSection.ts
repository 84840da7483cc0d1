/**
 * Doubly symmetric I or H section from h, b, tw, tf and the root radius r of its four fillets
 * (rolled); a welded section has r = 0 (or r = the throat a of its fillet welds, which adds the
 * weld's triangle as a fillet: treated as a radius, a small overestimate). y is the axis parallel to
 * the flanges (strong), z the web's axis. Composite of two flanges, the web between them and four
 * spandrel fillets, each exact (docs/sections.md).
 */
import { spandrelArea, spandrelCentroid, spandrelOwnInertia } from './spandrel.js';
import { writeDerived } from './sectionProperties.js';

export function writeISection(out: Float64Array, h: number, b: number, tw: number, tf: number, r: number): void {
  const hw = h - 2 * tf; // clear web height between the flanges
  const As = spandrelArea(r);
  const c = spandrelCentroid(r);
  const Is = spandrelOwnInertia(r);
  const A = 2 * b * tf + hw * tw + 4 * As;

  // strong axis: flanges at ±(h − tf)/2, fillets' centroids at ±(hw/2 − c)
  const dFlange = (h - tf) / 2;
  const dFilletY = hw / 2 - c;
  const Iy = 2 * ((b * tf * tf * tf) / 12 + b * tf * dFlange * dFlange) + (tw * hw * hw * hw) / 12 + 4 * (Is + As * dFilletY * dFilletY);
  // weak axis: fillets' centroids at ±(tw/2 + c)
  const dFilletZ = tw / 2 + c;
  const Iz = 2 * ((tf * b * b * b) / 12) + (hw * tw * tw * tw) / 12 + 4 * (Is + As * dFilletZ * dFilletZ);

  // plastic moduli: twice the first moment of one half about the (symmetric) plastic neutral axis
  const Wply = b * tf * (h - tf) + (tw * hw * hw) / 4 + 4 * As * dFilletY;
  const Wplz = (tf * b * b) / 2 + (hw * tw * tw) / 4 + 4 * As * dFilletZ;
  writeDerived(out, A, Iy, Iz, h / 2, b / 2, Wply, Wplz);
}
