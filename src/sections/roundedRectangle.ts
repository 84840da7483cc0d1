/**
 * A solid rectangle b × h (h along the strong-axis depth) whose four corners are rounded with
 * radius r: the rectangle less four corner spandrels. The hollow sections are an outer less an
 * inner rounded rectangle. Writes [A, Iy, Iz, Wply, Wplz] into `into` from `offset`.
 */
import { spandrelArea, spandrelCentroid, spandrelOwnInertia } from './spandrel.js';

export function roundedRectangle(into: Float64Array, offset: number, b: number, h: number, r: number): void {
  const As = spandrelArea(r);
  const c = spandrelCentroid(r);
  const Is = spandrelOwnInertia(r);
  const dy = h / 2 - c; // corner spandrel centroid from the y axis
  const dz = b / 2 - c;
  into[offset] = b * h - 4 * As;
  into[offset + 1] = (b * h * h * h) / 12 - 4 * (Is + As * dy * dy);
  into[offset + 2] = (h * b * b * b) / 12 - 4 * (Is + As * dz * dz);
  into[offset + 3] = (b * h * h) / 4 - 4 * As * dy;
  into[offset + 4] = (h * b * b) / 4 - 4 * As * dz;
}
