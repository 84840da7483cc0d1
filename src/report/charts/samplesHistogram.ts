/** Overlaid histograms of resistance (θ × capacity) and demand, with the FORM design point. */
import type { ReportInput, SamplesSummary } from '../reportInput.js';
import { displayUnit, formatNumber, toDisplay, type UnitSystem } from '../displayUnits.js';
import { PALETTE } from '../chartStyle.js';
import { axisTitle, chartBase } from './chartBase.js';
import type { ChartSpec } from './chartSpec.js';
import { histogramBins, sampleQuantile } from './histogramBins.js';

export const RESISTANCE_LABEL = 'resistance θ × capacity';
export const DEMAND_LABEL = 'demand (sum of loads)';
const BIN_COUNT = 48;

export function samplesHistogramChart(_input: ReportInput, samples: SamplesSummary, system: UnitSystem): ChartSpec {
  const unit = displayUnit('force', system);
  const r = samples.resistance.map((v) => toDisplay(v, unit));
  const s = samples.demand.map((v) => toDisplay(v, unit));
  // the failing tails (low resistance, high demand) are shown whole; only the harmless ends are trimmed at 0.1 %
  const dp = toDisplay(samples.designPoint.demand, unit);
  const lo = Math.min(Math.min(...r), sampleQuantile(s, 0.001), dp);
  const hi = Math.max(sampleQuantile(r, 0.999), Math.max(...s), dp);
  const bars = [
    ...histogramBins(r, lo, hi, BIN_COUNT).map((b) => ({ ...b, series: RESISTANCE_LABEL })),
    ...histogramBins(s, lo, hi, BIN_COUNT).map((b) => ({ ...b, series: DEMAND_LABEL })),
  ].filter((b) => b.density > 0);
  // log density: a tail bin holding one sample in thousands still shows; bars start below the smallest
  const floor = bars.length > 0 ? Math.min(...bars.map((b) => b.density)) / 2 : 1;
  const title = 'Resistance and demand';
  const subtitle = [
    `${formatNumber(samples.resistance.length, 4)} resistance and ${formatNumber(samples.demand.length, 4)} demand samples shown (of ${formatNumber(samples.totalSamples, 4)} drawn).`,
    'Density on a log scale, so the tails where demand exceeds resistance show.',
    `Green line: FORM design point, where resistance = demand = ${formatNumber(dp)} ${unit.label}.`,
  ];
  return {
    name: 'samples-histogram',
    title,
    spec: {
      ...chartBase(title, subtitle),
      width: 460,
      height: 240,
      layer: [
        {
          name: 'histogramBars',
          data: { values: bars },
          mark: { type: 'rect', opacity: 0.55 },
          encoding: {
            x: { field: 'x0', type: 'quantitative', title: axisTitle('axial force', unit.label), scale: { domain: [lo, hi], nice: false } },
            x2: { field: 'x1' },
            y: { field: 'density', type: 'quantitative', title: 'probability density (log)', scale: { type: 'log', domainMin: floor }, axis: { labels: false, ticks: false } },
            y2: { datum: floor },
            color: {
              field: 'series',
              type: 'nominal',
              title: null,
              scale: { domain: [RESISTANCE_LABEL, DEMAND_LABEL], range: [PALETTE.resistance, PALETTE.load] },
            },
          },
        },
        {
          name: 'designPoint',
          data: { values: [{ x: dp, label: 'design point' }] },
          layer: [
            { mark: { type: 'rule', color: PALETTE.accent, strokeWidth: 2 }, encoding: { x: { field: 'x', type: 'quantitative' } } },
            { mark: { type: 'text', align: 'left', baseline: 'top', dx: 4, y: 2, color: PALETTE.accent }, encoding: { x: { field: 'x', type: 'quantitative' }, text: { field: 'label' } } },
          ],
        },
      ],
    },
  };
}
