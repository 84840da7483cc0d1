/**
 * A value pulled back into the finite doubles: ±Infinity becomes ±Number.MAX_VALUE. Inverse CDFs
 * use it so that a finite u (however far out an iteration wanders) always maps to a finite x.
 */
export function clampFinite(x: number): number {
  if (x > Number.MAX_VALUE) return Number.MAX_VALUE;
  if (x < -Number.MAX_VALUE) return -Number.MAX_VALUE;
  return x;
}
