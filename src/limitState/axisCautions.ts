/**
 * What the two-axis check and the corrosion loss leave out, in words for the terminal, the JSON and
 * the report (docs/sections.md). Empty for a one-axis scenario without a corrosion loss.
 */
import type { Scenario } from '../scenario/types.js';

export function axisCautions(s: Scenario): string[] {
  const out: string[] = [];
  if (s.column.axisZ !== undefined) {
    out.push(
      'Two principal axes are checked one at a time and the smaller capacity governs: torsional, flexural-torsional and lateral-torsional buckling are not checked, nor the interaction of bending about both axes; load eccentricities bend about y only.',
    );
  }
  const k = s.column.section.geometry?.corrosion;
  if (k !== undefined) {
    const zone = k.zoneHeight !== undefined ? `it is stated over the lowest ${(k.zoneHeight * 1e3).toFixed(0)} mm, but ` : '';
    out.push(
      `Corrosion loss: ${zone}the reduced section is used over the whole length, for the buckling stiffness as well as the strength (conservative; no credit is taken for sound steel above a corroded zone). Measure the remaining thickness on site; the loss per face is an input, not a prediction.`,
    );
  }
  return out;
}
