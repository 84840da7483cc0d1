/**
 * The tornado layout shared by the three tornado charts: for each variable one bar from
 * the baseline to its 5 % value and one to its 95 % value, largest swing on top.
 */
import { PALETTE } from '../chartStyle.js';
import type { TornadoRow } from '../reportInput.js';
import { chartBase } from './chartBase.js';
import type { VegaLiteSpec } from './chartSpec.js';

export const LOW_LABEL = 'variable at its 5 % quantile';
export const HIGH_LABEL = 'variable at its 95 % quantile';

export interface TornadoOptions {
  title: string;
  subtitle?: string | string[];
  valueTitle: string; // x-axis title with unit
  baseline: number; // display units; drawn as a dark rule (say what it is in the subtitle)
  rows: TornadoRow[]; // display units, already sorted
  extraLayers?: VegaLiteSpec[]; // e.g. the target line
}

export function tornadoSpec(o: TornadoOptions): VegaLiteSpec {
  const variables = o.rows.map((r) => r.variable);
  // A bar to ±∞ or to '—' (e.g. β where no design point exists, or FORM did not converge) cannot
  // be drawn on a linear axis: it is left out here, said in the subtitle, and stays in CSV and JSON.
  const all = o.rows
    .flatMap((r) => [
      { variable: r.variable, side: LOW_LABEL, from: o.baseline, to: r.low },
      { variable: r.variable, side: HIGH_LABEL, from: o.baseline, to: r.high },
    ]);
  const segments = all.filter((seg) => Number.isFinite(seg.from) && Number.isFinite(seg.to));
  const dropped = all.length - segments.length;
  const subtitle = dropped === 0 ? o.subtitle : [...(o.subtitle === undefined ? [] : [o.subtitle].flat()), `${dropped} bar${dropped === 1 ? '' : 's'} without a finite end (an infinite or undefined value) not drawn; see the CSV and JSON.`];
  const y = { field: 'variable', type: 'nominal', sort: variables, title: null };
  return {
    ...chartBase(o.title, subtitle),
    width: 420,
    height: { step: 26 },
    layer: [
      {
        name: 'tornadoBars',
        data: { values: segments },
        mark: { type: 'bar', height: 14 },
        encoding: {
          y,
          x: { field: 'from', type: 'quantitative', title: o.valueTitle, scale: { zero: false, nice: true } },
          x2: { field: 'to' },
          color: {
            field: 'side',
            type: 'nominal',
            title: null,
            scale: { domain: [LOW_LABEL, HIGH_LABEL], range: [PALETTE.resistance, PALETTE.load] },
          },
        },
      },
      {
        name: 'baseline',
        data: { values: Number.isFinite(o.baseline) ? [{ x: o.baseline }] : [] },
        mark: { type: 'rule', color: PALETTE.ink, strokeWidth: 1.5 },
        encoding: { x: { field: 'x', type: 'quantitative' } },
      },
      ...(o.extraLayers ?? []),
    ],
  };
}
