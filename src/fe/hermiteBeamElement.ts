/**
 * Two-node Hermite-cubic beam element (DOFs w1, θ1, w2, θ2), length h, EI = 1.
 * Elastic stiffness (1/h³)[12, 6h, −12, 6h; 6h, 4h², −6h, 2h²; …] and consistent geometric stiffness
 * (1/(30h))[36, 3h, −36, 3h; 3h, 4h², −3h, −h²; …] per unit axial load: the standard forms,
 * e.g. Przemieniecki, Theory of Matrix Structural Analysis, 1968 (from memory).
 */
export function elasticStiffness(h: number): Float64Array {
  const a = 1 / (h * h * h);
  return Float64Array.from([
    12, 6 * h, -12, 6 * h,
    6 * h, 4 * h * h, -6 * h, 2 * h * h,
    -12, -6 * h, 12, -6 * h,
    6 * h, 2 * h * h, -6 * h, 4 * h * h,
  ].map((v) => v * a));
}

export function geometricStiffness(h: number): Float64Array {
  const a = 1 / (30 * h);
  return Float64Array.from([
    36, 3 * h, -36, 3 * h,
    3 * h, 4 * h * h, -3 * h, -h * h,
    -36, -3 * h, 36, -3 * h,
    3 * h, -h * h, -3 * h, 4 * h * h,
  ].map((v) => v * a));
}

/**
 * Consistent mass matrix per unit mass per length: (h/420)[156, 22h, 54, −13h; 22h, 4h², 13h, −3h²;
 * 54, 13h, 156, −22h; −13h, −3h², −22h, 4h²] (the standard form from the same Hermite shape
 * functions, e.g. Przemieniecki 1968, ch. 11; from memory).
 */
export function consistentMass(h: number): Float64Array {
  const a = h / 420;
  return Float64Array.from([
    156, 22 * h, 54, -13 * h,
    22 * h, 4 * h * h, 13 * h, -3 * h * h,
    54, 13 * h, 156, -22 * h,
    -13 * h, -3 * h * h, -22 * h, 4 * h * h,
  ].map((v) => v * a));
}
