/**
 * Restraint ratio R = k L / (E I) from the other ways a scenario may state an end: a fixity
 * factor X = R/(R+3) (Monforton and Wu, 1963) or an alignment-chart G (R = 2/G braced, 6/G
 * sway). The conversions themselves live with the mechanics; this picks the one a field names.
 */
import { ratioFromAlignmentG, ratioFromFixity } from '../mechanics/restraint.js';
import type { Frame } from './types.js';

export { ratioFromAlignmentG, ratioFromFixity };

export function restraintRatio(from: 'fixity' | 'alignment_g', frame: Frame, input: number): number {
  return from === 'fixity' ? ratioFromFixity(input) : ratioFromAlignmentG(input, frame);
}
