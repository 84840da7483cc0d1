/** FORM importance factors α²: the share of each variable in the failure probability. */
import type { ReportInput } from '../reportInput.js';
import { PALETTE } from '../chartStyle.js';
import { chartBase } from './chartBase.js';
import type { ChartSpec } from './chartSpec.js';

import { variableNamer } from '../variableNames.js';

// the sign of α: FORM moves a variable down (α < 0) when low values are the harmful ones
export const RESISTANCE_SIDE = 'unfavourable when low (design value below the mean)';
export const LOAD_SIDE = 'unfavourable when high (design value above the mean)';

export function importanceChart(input: ReportInput): ChartSpec {
  const name = variableNamer(input);
  const rows = [...input.sensitivity.importance]
    .sort((a, b) => b.alphaSquared - a.alphaSquared)
    .map((r) => ({
      variable: name(r.variable),
      alpha2: r.alphaSquared,
      side: r.alpha < 0 ? RESISTANCE_SIDE : LOAD_SIDE,
      label: `${(100 * r.alphaSquared).toFixed(1)} %`,
    }));
  const y = { field: 'variable', type: 'nominal', sort: rows.map((r) => r.variable), title: null };
  const title = 'Importance factors α² (FORM)';
  return {
    name: 'importance',
    title,
    spec: {
      ...chartBase(title, ['Share of each variable in the reliability index; they sum to 100 %.', 'Colour: the side FORM moved the variable to at the design point.']),
      width: 420,
      height: { step: 26 },
      data: { values: rows },
      layer: [
        {
          name: 'importanceBars',
          mark: { type: 'bar', height: 14 },
          encoding: {
            y,
            x: { field: 'alpha2', type: 'quantitative', title: 'α²', axis: { format: '.0%' }, scale: { domain: [0, 1] } },
            color: {
              field: 'side',
              type: 'nominal',
              title: null,
              scale: { domain: [RESISTANCE_SIDE, LOAD_SIDE], range: [PALETTE.resistance, PALETTE.load] },
              legend: { direction: 'vertical' },
            },
          },
        },
        {
          name: 'importanceLabels',
          mark: { type: 'text', align: 'left', dx: 4, baseline: 'middle' },
          encoding: { y, x: { field: 'alpha2', type: 'quantitative' }, text: { field: 'label' } },
        },
      ],
    },
  };
}
