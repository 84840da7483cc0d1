/** Prior against posterior density of one variable updated by test results, the tests as ticks. */
import type { MeasurementDensity } from '../reportInput.js';
import { displayUnitFor, toDisplay, type UnitSystem } from '../displayUnits.js';
import { PALETTE } from '../chartStyle.js';
import { axisTitle, chartBase } from './chartBase.js';
import type { ChartSpec } from './chartSpec.js';

export function measurementDensityChart(d: MeasurementDensity, index: number, system: UnitSystem): ChartSpec {
  const mid = d.points[Math.floor(d.points.length / 2)]?.x ?? 1;
  const unit = displayUnitFor(mid, d.kind, system);
  const values = d.points.flatMap((p) => [
    { x: toDisplay(p.x, unit), density: p.prior, which: 'as written (prior)' },
    { x: toDisplay(p.x, unit), density: p.posterior, which: 'updated (posterior predictive)' },
  ]);
  const lo = toDisplay(d.points[0].x, unit);
  const hi = toDisplay(d.points[d.points.length - 1].x, unit);
  const tests = d.tests.map((t) => ({ x: toDisplay(t, unit) })).filter((t) => t.x >= lo && t.x <= hi);
  const title = `What the tests changed: ${d.description}`;
  const layer = [
    {
      name: 'densityLines',
      data: { values },
      mark: { type: 'line', strokeWidth: 2 },
      encoding: {
        x: { field: 'x', type: 'quantitative', title: axisTitle(d.description, unit.label), scale: { domain: [lo, hi], nice: false } },
        y: { field: 'density', type: 'quantitative', title: 'probability density (larger peak = 1)' },
        color: { field: 'which', type: 'nominal', title: null, scale: { range: [PALETTE.ink, PALETTE.accent] } },
        strokeDash: { field: 'which', type: 'nominal', legend: null, scale: { range: [[4, 3], [1, 0]] } },
      },
    },
    ...(tests.length > 0
      ? [{ name: 'testTicks', data: { values: tests }, mark: { type: 'tick', color: PALETTE.resistance, thickness: 2, size: 14 }, encoding: { x: { field: 'x', type: 'quantitative' }, y: { datum: 0, type: 'quantitative' } } }]
      : []),
  ];
  return { name: `measurement-density-${index + 1}`, title, spec: { ...chartBase(title, ['Dashed: as written (prior); solid: updated (posterior predictive); ticks: the tests as entered.', 'Central 99 % of the prior and 96 % of the update.']), width: 420, height: 220, layer } };
}
