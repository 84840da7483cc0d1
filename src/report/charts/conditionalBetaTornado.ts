/** Tornado of β with one variable pinned at its 5 % / 95 % quantile and the rest still random. */
import type { ReportInput } from '../reportInput.js';
import { formatBeta } from '../displayUnits.js';
import { PALETTE } from '../chartStyle.js';
import type { ChartSpec } from './chartSpec.js';
import { tornadoSpec } from './tornadoBars.js';
import { droppedNote, namedTornadoRows } from '../variableNames.js';

export function conditionalBetaChart(input: ReportInput): ChartSpec {
  const t = input.sensitivity.conditionalBeta;
  const target = input.reliability.target;
  const named = namedTornadoRows(input, t.rows, t.baseline);
  const title = 'Tornado: conditional reliability index β';
  return {
    name: 'conditional-beta',
    title,
    spec: tornadoSpec({
      title,
      subtitle: [
        'One variable fixed at its 5 % or 95 % quantile, the others still random.',
        `Dark line: β = ${formatBeta(t.baseline)} with all variables random; red dashed: target β = ${formatBeta(target.beta)} (${target.source}).`,
        ...droppedNote(named.dropped, 'reliability index'),
      ],
      valueTitle: 'reliability index β',
      baseline: t.baseline,
      rows: named.rows,
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
