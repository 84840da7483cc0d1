/**
 * The spandrel of a radius r: the square r × r less the quarter circle of radius r centred on its
 * far corner. It is the fillet of a rolled I section (added material) and the corner of a rounded
 * rectangle (removed material). Exact closed forms, no fillet approximation.
 */

const QUARTER = Math.PI / 4;

/** (1 − π/4) r² */
export function spandrelArea(r: number): number {
  return (1 - QUARTER) * r * r;
}

/** Distance of the centroid from each straight edge: r (10 − 3π) / (12 − 3π) ≈ 0.2234 r. */
export function spandrelCentroid(r: number): number {
  return (r * (10 - 3 * Math.PI)) / (12 - 3 * Math.PI);
}

/**
 * Second moment about its own centroidal axis parallel to a straight edge: the square's r⁴/3 about
 * the edge, less the quarter circle's about the same edge, moved to the centroid.
 */
export function spandrelOwnInertia(r: number): number {
  const r4 = r * r * r * r;
  const quarterArea = QUARTER * r * r;
  const quarterOffset = (4 * r) / (3 * Math.PI); // quarter-circle centroid from its centre
  const quarterAboutOwn = (Math.PI * r4) / 16 - quarterArea * quarterOffset * quarterOffset;
  const quarterFromEdge = r - quarterOffset;
  const aboutEdge = r4 / 3 - (quarterAboutOwn + quarterArea * quarterFromEdge * quarterFromEdge);
  const c = spandrelCentroid(r);
  return aboutEdge - spandrelArea(r) * c * c;
}
