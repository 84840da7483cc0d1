/**
 * Restraint ratio R = k L / (E I) from the other ways a scenario may state an end.
 * Fixity factor X = R/(R+3) (Monforton and Wu, 1963, as in CONTRACT.md §2) ⇒ R = 3X/(1−X).
 * Alignment-chart G ⇒ R = 2/G braced, 6/G sway (a far end bent in double curvature braced,
 * in antisymmetric sway; G = 0 is rigid).
 */
import type { Frame } from './types.js';

export function ratioFromFixity(x: number): number {
  return x >= 1 ? Infinity : (3 * x) / (1 - x);
}

export function ratioFromAlignmentG(g: number, frame: Frame): number {
  return (frame === 'braced' ? 2 : 6) / g; // g = 0 → Infinity (rigid)
}

export function restraintRatio(from: 'fixity' | 'alignment_g', frame: Frame, input: number): number {
  return from === 'fixity' ? ratioFromFixity(input) : ratioFromAlignmentG(input, frame);
}
