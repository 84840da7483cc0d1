/**
 * Prior against posterior density of one updated variable: by test results (posterior predictive,
 * the tests as ticks) or by measurements through the model (the fitted distribution, the posterior
 * draws as a histogram on the same scale).
 */
import type { MeasurementDensity } from '../reportInput.js';
import { displayUnitFor, toDisplay, type UnitSystem } from '../displayUnits.js';
import { PALETTE } from '../chartStyle.js';
import { axisTitle, chartBase } from './chartBase.js';
import type { ChartSpec } from './chartSpec.js';

export function measurementDensityChart(d: MeasurementDensity, index: number, system: UnitSystem): ChartSpec {
  const mid = d.points[Math.floor(d.points.length / 2)]?.x ?? 1;
  const unit = displayUnitFor(mid, d.kind, system);
  const byModel = d.updatedBy === 'measurements';
  const priorLabel = byModel ? 'before the measurements (prior)' : 'as written (prior)';
  const postLabel = byModel ? 'after (fitted to the posterior draws)' : 'updated (posterior predictive)';
  const values = d.points.flatMap((p) => [
    { x: toDisplay(p.x, unit), density: p.prior, which: priorLabel },
    { x: toDisplay(p.x, unit), density: p.posterior, which: postLabel },
  ]);
  const lo = toDisplay(d.points[0].x, unit);
  const hi = toDisplay(d.points[d.points.length - 1].x, unit);
  const tests = d.tests.map((t) => ({ x: toDisplay(t, unit) })).filter((t) => t.x >= lo && t.x <= hi);
  // a density per display unit: the bins' heights scale by the unit factor like the curves' (both divided by the same peak)
  const bins = (d.histogram ?? [])
    .map((b) => ({ x0: toDisplay(b.x0, unit), x1: toDisplay(b.x1, unit), density: b.density }))
    .filter((b) => b.x0 >= lo && b.x1 <= hi);
  const title = `${byModel ? 'What the measurements changed' : 'What the tests changed'}: ${d.description}`;
  const layer = [
    ...(bins.length > 0
      ? [{
          name: 'posteriorDraws',
          data: { values: bins },
          mark: { type: 'rect', color: PALETTE.accent, opacity: 0.25 },
          encoding: { x: { field: 'x0', type: 'quantitative' }, x2: { field: 'x1' }, y: { field: 'density', type: 'quantitative' }, y2: { datum: 0 } },
        }]
      : []),
    {
      name: 'densityLines',
      data: { values },
      mark: { type: 'line', strokeWidth: 2 },
      encoding: {
        x: { field: 'x', type: 'quantitative', title: axisTitle(d.description, unit.label), scale: { domain: [lo, hi], nice: false } },
        y: { field: 'density', type: 'quantitative', title: 'probability density (larger peak = 1)' },
        color: { field: 'which', type: 'nominal', title: null, scale: { domain: [priorLabel, postLabel], range: [PALETTE.ink, PALETTE.accent] } },
        strokeDash: { field: 'which', type: 'nominal', legend: null, scale: { domain: [priorLabel, postLabel], range: [[4, 3], [1, 0]] } },
      },
    },
    ...(tests.length > 0
      ? [{ name: 'testTicks', data: { values: tests }, mark: { type: 'tick', color: PALETTE.resistance, thickness: 2, size: 14 }, encoding: { x: { field: 'x', type: 'quantitative' }, y: { datum: 0, type: 'quantitative' } } }]
      : []),
  ];
  const notes = byModel
    ? ['Dashed: before the measurements (prior); solid: the distribution fitted to the posterior draws; bars: the draws.', 'Both curves and the bars share one scale (larger curve peak = 1).']
    : ['Dashed: as written (prior); solid: updated (posterior predictive); ticks: the tests as entered.', 'Central 99 % of the prior and 96 % of the update.'];
  return { name: `measurement-density-${index + 1}`, title, spec: { ...chartBase(title, notes), width: 420, height: 220, layer } };
}
