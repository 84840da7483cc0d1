/** Sweep results: β along one varied input (line), or over two (heat map). */
import type { ReportInput, SweepResults } from '../reportInput.js';
import { displayUnit, formatBeta, toDisplay, type UnitSystem } from '../displayUnits.js';
import { PALETTE } from '../chartStyle.js';
import { axisTitle, chartBase } from './chartBase.js';
import type { ChartSpec, VegaLiteSpec } from './chartSpec.js';

export function sweepChart(input: ReportInput, sweep: SweepResults, system: UnitSystem): ChartSpec {
  const target = input.reliability.target;
  const varied = sweep.varied.map((v) => ({ ...v, unit: displayUnit(v.kind, system) }));
  if (varied.length < 1 || varied.length > 2) throw new Error(`sweep chart needs 1 or 2 varied paths, got ${varied.length}`);
  const rows = sweep.rows.map((r) => {
    const row: Record<string, number | string> = { beta: r.beta, betaLabel: formatBeta(r.beta) };
    varied.forEach((v, i) => (row[`v${i}`] = toDisplay(r.values[v.path], v.unit)));
    return row;
  });
  const axis = (i: number) => axisTitle(varied[i].path, varied[i].unit.label);
  // two lines (path, unit) so a long path does not stretch the heat map
  const axisLines = (i: number) => (varied[i].unit.label === '' ? varied[i].path : [varied[i].path, `[${varied[i].unit.label}]`]);
  const title = varied.length === 1 ? `Sweep: β against ${varied[0].path}` : `Sweep: β over ${varied[0].path} and ${varied[1].path}`;
  const method = sweep.method.toUpperCase();
  if (varied.length === 1) {
    const layers: VegaLiteSpec[] = [
      {
        name: 'sweepLine',
        data: { values: rows },
        mark: { type: 'line', point: { filled: true, size: 30 }, color: PALETTE.resistance },
        encoding: {
          x: { field: 'v0', type: 'quantitative', title: axis(0), scale: { zero: false } },
          y: { field: 'beta', type: 'quantitative', title: `reliability index β (${method})`, scale: { zero: false } },
        },
      },
      {
        name: 'targetLine',
        data: { values: [{ y: target.beta }] },
        mark: { type: 'rule', color: PALETTE.target, strokeDash: [6, 4], strokeWidth: 1.5 },
        encoding: { y: { field: 'y', type: 'quantitative' } },
      },
    ];
    return {
      name: 'sweep',
      title,
      spec: { ...chartBase(title, `Red dashed: target β = ${formatBeta(target.beta)} (${target.source}).`), width: 460, height: 260, layer: layers },
    };
  }
  const x = { field: 'v0', type: 'ordinal', title: axis(0), axis: { format: '.3~r', formatType: 'number', labelAngle: 0 } };
  const y = { field: 'v1', type: 'ordinal', title: axisLines(1), sort: 'descending', axis: { format: '.3~r', formatType: 'number' } };
  return {
    name: 'sweep',
    title,
    spec: {
      ...chartBase(title, `Cells: reliability index β (${method}); outlined cells meet the target β = ${formatBeta(target.beta)}.`),
      width: { step: 60 },
      height: { step: 40 },
      data: { values: rows.map((r) => ({ ...r, meets: (r.beta as number) >= target.beta })) },
      layer: [
        {
          name: 'sweepCells',
          mark: { type: 'rect', strokeWidth: 2 },
          encoding: {
            x,
            y,
            color: { field: 'beta', type: 'quantitative', title: 'β', scale: { scheme: 'blues' } },
            stroke: { condition: { test: 'datum.meets', value: PALETTE.ink }, value: null },
          },
        },
        {
          name: 'sweepLabels',
          mark: { type: 'text', fontSize: 10 },
          encoding: {
            x,
            y,
            text: { field: 'betaLabel' },
            color: { condition: { test: `datum.beta > ${Math.max(...sweep.rows.map((r) => r.beta)) * 0.6 + Math.min(...sweep.rows.map((r) => r.beta)) * 0.4}`, value: 'white' }, value: PALETTE.ink },
          },
        },
      ],
    },
  };
}
