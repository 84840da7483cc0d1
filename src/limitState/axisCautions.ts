/**
 * What the two-axis check and the corrosion loss leave out, in words for the terminal, the JSON and
 * the report (docs/sections.md). Empty for a one-axis scenario without a corrosion loss.
 */
import { strengthModelKind } from '../mechanics/strengthModelKind.js';
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
    const measure = 'Measure the remaining thickness on site; the loss per face is an input, not a prediction.';
    const h = k.zoneHeight;
    if (h === undefined || !(h < s.column.length)) {
      out.push(`Corrosion loss: the reduced section is used over the whole length, for the buckling stiffness as well as the strength. ${measure}`);
    } else {
      const bent = s.loads.some((l) => l.eccentricity || l.moments || l.transverse || l.horizontal) || s.column.outOfPlumb !== undefined;
      out.push(
        `Corrosion loss in the lowest ${(h * 1e3).toFixed(0)} mm: the column is taken as a stepped member, the reduced section in the zone and the sound one above it. Its critical load and first mode are exact; first-yield checks each part with its own section, and the code curves take λ̄ from the stepped critical load with the zone's A·fy (the weakest cross-section with the member's true stiffness, an engineering approximation).` +
          (bent
            ? ['first-yield', 'equivalent-bow'].includes(strengthModelKind(s.strength)?.family ?? '')
              ? ' About the axis bent by eccentric loads, applied moments or transverse actions (y), the stepped member is solved to second order and each part checked for first yield with its own section.'
              : ' About the axis bent by eccentric loads, applied moments or transverse actions (y), the reduced section is used over the whole length (conservative: the interaction check\'s member formulas are for prismatic members).'
            : '') +
          ` ${measure}`,
      );
    }
  }
  return out;
}
