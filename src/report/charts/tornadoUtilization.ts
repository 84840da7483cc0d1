/** Tornado of the utilization (docs/json-output.md `tornado`): which variable moves the check most. */
import type { ReportInput } from '../reportInput.js';
import { formatNumber } from '../displayUnits.js';
import type { ChartSpec } from './chartSpec.js';
import { tornadoSpec } from './tornadoBars.js';
import { droppedNote, namedTornadoRows } from '../variableNames.js';

export function tornadoUtilizationChart(input: ReportInput): ChartSpec {
  const t = input.sensitivity.utilization;
  const named = namedTornadoRows(input, t.rows, t.baseline);
  const title = 'Tornado: utilization';
  return {
    name: 'tornado-utilization',
    title,
    spec: tornadoSpec({
      title,
      subtitle: ['Each variable at its 5 % and 95 % quantile, the others at their means.', `Dark line: all variables at their means (${formatNumber(t.baseline)}).`, ...droppedNote(named.dropped, 'utilization')],
      valueTitle: 'utilization = demand / (θ × capacity)',
      baseline: t.baseline,
      rows: named.rows,
    }),
  };
}
