/** Tornado of the capacity: which variable moves the column's strength most. */
import type { ReportInput } from '../reportInput.js';
import { displayUnit, formatQuantity, toDisplay, type UnitSystem } from '../displayUnits.js';
import type { ChartSpec } from './chartSpec.js';
import { axisTitle } from './chartBase.js';
import { tornadoSpec } from './tornadoBars.js';
import { droppedNote, namedTornadoRows } from '../variableNames.js';

export function tornadoCapacityChart(input: ReportInput, system: UnitSystem): ChartSpec {
  const t = input.sensitivity.capacity;
  const unit = displayUnit('force', system);
  const d = (v: number) => toDisplay(v, unit);
  const named = namedTornadoRows(input, t.rows, t.baseline);
  const title = 'Tornado: capacity';
  return {
    name: 'tornado-capacity',
    title,
    spec: tornadoSpec({
      title,
      subtitle: ['Each variable at its 5 % and 95 % quantile, the others at their means.', `Dark line: all variables at their means (${formatQuantity(t.baseline, 'force', system)}).`, ...droppedNote(named.dropped, 'capacity')],
      valueTitle: axisTitle('capacity', unit.label),
      baseline: d(t.baseline),
      rows: named.rows.map((r) => ({ variable: r.variable, low: d(r.low), high: d(r.high) })),
    }),
  };
}
