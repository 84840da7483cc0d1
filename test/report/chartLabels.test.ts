// No two text labels of a chart overlap, for every chart of the report, in both unit systems,
// and for a large heat map (20 × 10 cases). common practice: legible charts keep labels apart.
import { describe, expect, it } from 'vitest';
import { buildCharts } from '../../src/report/charts/allCharts.js';
import { sweepChart } from '../../src/report/charts/sweep.js';
import { chartToSvg } from '../../src/report/renderChart.js';
import type { SweepResults } from '../../src/report/reportInput.js';
import { overlappingLabels, svgTextBoxes } from '../support/svgTextBoxes.js';
import { demoReportInput } from './fixture.js';

/** A 20 × 10 sweep of length and base stiffness (invented demo numbers). */
function sweep20x10(): SweepResults {
  const rows = [];
  for (let i = 0; i < 20; i++) {
    for (let j = 0; j < 10; j++) {
      rows.push({ values: { 'column.length': 4 + 0.2 * i, 'column.ends.bottom.rotation': 1e6 * 2 ** (j / 2) }, beta: 5.2 - 0.12 * i + 0.1 * j, pf: 1e-4, utilization: 0.6 });
    }
  }
  return {
    varied: [
      { path: 'column.length', kind: 'length' },
      { path: 'column.ends.bottom.rotation', kind: 'rotationalStiffness' },
    ],
    method: 'form',
    rows,
    meeting: { count: rows.filter((r) => r.beta >= 3.8).length, total: rows.length },
    crossings: [],
  };
}

describe('chart text boxes', () => {
  it('finds an overlap when there is one (the check can fail)', () => {
    const svg = '<svg><g transform="translate(10,10)"><text text-anchor="start" transform="translate(0,20)" font-size="11px">overlapping label</text><text text-anchor="middle" transform="translate(30,22)" font-size="11px">another</text><text transform="translate(0,80)" font-size="11px" opacity="0">hidden</text></g></svg>';
    const boxes = svgTextBoxes(svg);
    expect(boxes.map((b) => b.text)).toEqual(['overlapping label', 'another']);
    expect(boxes[0].x0).toBeCloseTo(10, 6);
    expect(overlappingLabels(boxes)).toHaveLength(1);
    expect(overlappingLabels([boxes[0], { ...boxes[1], y0: boxes[1].y0 + 40, y1: boxes[1].y1 + 40 }])).toHaveLength(0);
  });

  for (const system of ['si', 'us'] as const) {
    it(`keeps every label of every chart apart (${system})`, async () => {
      const input = demoReportInput();
      const charts = [...buildCharts(input, system), { ...sweepChart(input, sweep20x10(), system), name: 'sweep-20x10' }];
      for (const c of charts) {
        const boxes = svgTextBoxes(await chartToSvg(c.spec));
        expect(boxes.length, c.name).toBeGreaterThan(3);
        expect(overlappingLabels(boxes).map(([a, b]) => `${c.name}: "${a.text}" / "${b.text}"`)).toEqual([]);
      }
    });
  }

  it('labels the cells of a 20 × 10 heat map legibly, or not at all', async () => {
    const input = demoReportInput();
    const svg = await chartToSvg(sweepChart(input, sweep20x10(), 'si').spec);
    const sizes = [...svg.matchAll(/font-size="([\d.]+)px"/g)].map((m) => Number(m[1]));
    expect(Math.min(...sizes)).toBeGreaterThanOrEqual(10);
  });
});
