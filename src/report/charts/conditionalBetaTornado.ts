/** Tornado of β with one variable pinned at its 5 % / 95 % quantile and the rest still random. */
import type { ReportInput } from '../reportInput.js';
import { formatBeta } from '../displayUnits.js';
import { PALETTE } from '../chartStyle.js';
import type { ChartSpec } from './chartSpec.js';
import { tornadoSpec } from './tornadoBars.js';

export function conditionalBetaChart(input: ReportInput): ChartSpec {
  const t = input.sensitivity.conditionalBeta;
  const target = input.reliability.target;
  const title = 'Tornado: conditional reliability index β';
  return {
    name: 'conditional-beta',
    title,
    spec: tornadoSpec({
      title,
      subtitle: [
        'One variable fixed at its 5 % or 95 % quantile, the others still random.',
        `Dark line: β = ${formatBeta(t.baseline)} with all variables random; red dashed: target β = ${formatBeta(target.beta)} (${target.source}).`,
      ],
      valueTitle: 'reliability index β',
      baseline: t.baseline,
      rows: t.rows,
      extraLayers: [
        {
          name: 'targetLine',
          data: { values: [{ x: target.beta }] },
          mark: { type: 'rule', color: PALETTE.target, strokeDash: [6, 4], strokeWidth: 1.5 },
          encoding: { x: { field: 'x', type: 'quantitative' } },
        },
      ],
    }),
  };
}
