/**
 * Sweep results: β along one varied input (line, the target crossings marked), or over two
 * (heat map on a diverging scale centred on the target, with a bold contour where β crosses it).
 */
import type { ReportInput, SweepResults } from '../reportInput.js';
import { displayUnit, formatBeta, formatNumber, toDisplay, type UnitSystem } from '../displayUnits.js';
import { PALETTE } from '../chartStyle.js';
import { axisTitle, chartBase } from './chartBase.js';
import type { ChartSpec, VegaLiteSpec } from './chartSpec.js';
import { variableNamer } from '../variableNames.js';

const PARAMETER = /^(.*)\.(mean|sd|cov|min|max)$/;
/** Cells are labelled only while the grid is small enough for text of this size to fit. */
const CELL_FONT = 11;
const MAX_LABELLED_CELLS = 120;

/** A readable name for a swept path; a distribution parameter is named after its variable. */
export function sweptName(input: Pick<ReportInput, 'inputs'>, path: string): string {
  const name = variableNamer(input);
  const m = PARAMETER.exec(path);
  if (m && name(m[1]) !== m[1]) return `${name(m[1])} (${m[2] === 'cov' ? 'CoV' : m[2]})`;
  return name(path);
}

function distinctSorted(xs: number[]): number[] {
  return [...new Set(xs)].sort((a, b) => a - b);
}

export function sweepChart(input: ReportInput, sweep: SweepResults, system: UnitSystem): ChartSpec {
  const target = input.reliability.target;
  const varied = sweep.varied.map((v) => ({ ...v, unit: displayUnit(v.kind, system), name: sweptName(input, v.path) }));
  if (varied.length < 1 || varied.length > 2) throw new Error(`sweep chart needs 1 or 2 varied paths, got ${varied.length}`);
  const method = sweep.method.toUpperCase();
  const title = varied.length === 1 ? `Sweep: β against ${varied[0].name}` : `Sweep: β over ${varied[0].name} and ${varied[1].name}`;
  const meets = `${sweep.meeting.count} of ${sweep.meeting.total} cases meet the target β = ${formatBeta(target.beta)} (${target.source}).`;
  if (varied.length === 1) {
    const v = varied[0];
    const rows = sweep.rows.map((r) => ({ v0: toDisplay(r.values[v.path], v.unit), beta: r.beta }));
    const crossings = sweep.crossings.map((x) => ({ x: toDisplay(x, v.unit), label: `β = target at ${formatNumber(toDisplay(x, v.unit))}${v.unit.label ? ` ${v.unit.label}` : ''}` }));
    const x = { field: 'v0', type: 'quantitative', title: axisTitle(v.name, v.unit.label), scale: { zero: false } };
    const layers: VegaLiteSpec[] = [
      {
        name: 'sweepLine',
        data: { values: rows },
        mark: { type: 'line', point: { filled: true, size: 30 }, color: PALETTE.resistance },
        encoding: { x, y: { field: 'beta', type: 'quantitative', title: `reliability index β (${method})`, scale: { zero: false } } },
      },
      {
        name: 'targetLine',
        data: { values: [{ y: target.beta }] },
        mark: { type: 'rule', color: PALETTE.target, strokeDash: [6, 4], strokeWidth: 1.5 },
        encoding: { y: { field: 'y', type: 'quantitative' } },
      },
    ];
    if (crossings.length > 0) {
      layers.push({
        name: 'targetCrossing',
        data: { values: crossings },
        layer: [
          { mark: { type: 'rule', color: PALETTE.accent, strokeWidth: 1.5 }, encoding: { x: { field: 'x', type: 'quantitative' } } },
          // the label at the top, beside the rule
          { mark: { type: 'text', align: 'left', baseline: 'top', dx: 4, y: 4, color: PALETTE.accent }, encoding: { x: { field: 'x', type: 'quantitative' }, text: { field: 'label' } } },
        ],
      });
    }
    const subtitle = [`Red dashed: target β = ${formatBeta(target.beta)}; green: where β crosses it (interpolated between cases).`, meets];
    return { name: 'sweep', title, spec: { ...chartBase(title, subtitle), width: 460, height: 260, layer: layers } };
  }
  // two varied inputs: cells on an index grid, so the target contour can run along cell edges
  const xs = distinctSorted(sweep.rows.map((r) => r.values[varied[0].path]));
  const ys = distinctSorted(sweep.rows.map((r) => r.values[varied[1].path]));
  const cells = sweep.rows.map((r) => ({ i: xs.indexOf(r.values[varied[0].path]), j: ys.indexOf(r.values[varied[1].path]), beta: r.beta, betaLabel: formatBeta(r.beta) }));
  const grid = new Map(cells.map((c) => [`${c.i},${c.j}`, c.beta >= target.beta]));
  const edges: { x: number; y: number; x2: number; y2: number }[] = [];
  for (const c of cells) {
    const here = c.beta >= target.beta;
    const right = grid.get(`${c.i + 1},${c.j}`);
    const up = grid.get(`${c.i},${c.j + 1}`);
    if (right !== undefined && right !== here) edges.push({ x: c.i + 0.5, y: c.j - 0.5, x2: c.i + 0.5, y2: c.j + 0.5 });
    if (up !== undefined && up !== here) edges.push({ x: c.i - 0.5, y: c.j + 0.5, x2: c.i + 0.5, y2: c.j + 0.5 });
  }
  const tick = (values: number[], i: number) => values.map((v) => formatNumber(toDisplay(v, varied[i].unit)));
  const axisFor = (i: number, values: number[]) => ({
    values: values.map((_, k) => k),
    labelExpr: `${JSON.stringify(tick(values, i))}[datum.value]`,
    grid: false,
    tickCount: values.length,
    ...(i === 0 ? { labelAngle: values.length > 8 ? -45 : 0, labelOverlap: 'greedy' } : { labelOverlap: 'greedy' }),
  });
  const cellW = Math.max(24, Math.min(60, Math.floor(600 / xs.length)));
  const cellH = Math.max(18, Math.min(40, Math.floor(400 / ys.length)));
  const x = { field: 'i', type: 'quantitative', title: axisTitle(varied[0].name, varied[0].unit.label), scale: { domain: [-0.5, xs.length - 0.5], nice: false, zero: false }, axis: axisFor(0, xs) };
  const y = { field: 'j', type: 'quantitative', title: axisTitle(varied[1].name, varied[1].unit.label), scale: { domain: [-0.5, ys.length - 0.5], nice: false, zero: false }, axis: axisFor(1, ys) };
  const betas = cells.map((c) => c.beta);
  const reach = Math.max(0.25, ...betas.map((b) => Math.abs(b - target.beta)));
  // a cell label fits when "3.85" at CELL_FONT is narrower than the cell (DejaVu Sans digits ≈ 0.64 em)
  const labelled = cells.length <= MAX_LABELLED_CELLS && cellW >= 4 * 0.64 * CELL_FONT + 4 && cellH >= CELL_FONT + 4;
  const layers: VegaLiteSpec[] = [
    {
      name: 'sweepCells',
      data: { values: cells },
      mark: { type: 'rect', stroke: 'white', strokeWidth: 0.5 },
      encoding: {
        x: { ...x, field: 'x0' },
        x2: { field: 'x1' },
        y: { ...y, field: 'y0' },
        y2: { field: 'y1' },
        color: {
          field: 'beta',
          type: 'quantitative',
          title: ['β', `target ${formatBeta(target.beta)}`],
          // diverging, centred on the target: red falls short, blue meets
          scale: { scheme: 'redblue', domain: [target.beta - reach, target.beta + reach], domainMid: target.beta, clamp: true },
        },
      },
      transform: [{ calculate: 'datum.i - 0.5', as: 'x0' }, { calculate: 'datum.i + 0.5', as: 'x1' }, { calculate: 'datum.j - 0.5', as: 'y0' }, { calculate: 'datum.j + 0.5', as: 'y1' }],
    },
    {
      name: 'targetContour',
      data: { values: edges },
      mark: { type: 'rule', color: PALETTE.ink, strokeWidth: 3, strokeCap: 'square' },
      encoding: { x: { field: 'x', type: 'quantitative', scale: x.scale }, y: { field: 'y', type: 'quantitative', scale: y.scale }, x2: { field: 'x2' }, y2: { field: 'y2' } },
    },
  ];
  if (labelled) {
    layers.push({
      name: 'sweepLabels',
      data: { values: cells },
      mark: { type: 'text', fontSize: CELL_FONT },
      encoding: {
        x: { field: 'i', type: 'quantitative', scale: x.scale },
        y: { field: 'j', type: 'quantitative', scale: y.scale },
        text: { field: 'betaLabel' },
        // white on the dark ends of the scale, ink near the target
        color: { condition: { test: `abs(datum.beta - ${target.beta}) > ${0.6 * reach}`, value: 'white' }, value: PALETTE.ink },
      },
    });
  }
  const subtitle = [`Cells: reliability index β (${method}); red falls short of the target, blue meets it; bold line: the target contour.`, meets];
  return {
    name: 'sweep',
    title,
    spec: { ...chartBase(title, subtitle), width: cellW * xs.length, height: cellH * ys.length, layer: layers },
  };
}
