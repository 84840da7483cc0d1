// Every chart spec compiles with vega-lite, renders to SVG with vega, and draws the marks it should.
// common practice: count the rendered marks against the data that went in.
import { beforeAll, describe, expect, it } from 'vitest';
import { buildCharts } from '../../src/report/charts/allCharts.js';
import type { ChartSpec } from '../../src/report/charts/chartSpec.js';
import { chartToSvg, compileChart } from '../../src/report/renderChart.js';
import { CHART_FONT } from '../../src/report/chartStyle.js';
import { histogramBins, sampleQuantile } from '../../src/report/charts/histogramBins.js';
import { sweepChart } from '../../src/report/charts/sweep.js';
import { displayUnit, toDisplay } from '../../src/report/displayUnits.js';
import { overlappingTexts } from './svgTextBoxes.js';
import { countMarks, svgTexts } from './svgMarks.js';
import { demoReportInput, demoSweep2D } from './fixture.js';

const input = demoReportInput();
const charts = buildCharts(input, 'si');
const svgs: Record<string, string> = {};

function chart(name: string): ChartSpec {
  const c = charts.find((x) => x.name === name);
  if (!c) throw new Error(`no chart ${name}`);
  return c;
}

beforeAll(async () => {
  for (const c of charts) svgs[c.name] = await chartToSvg(c.spec);
});

describe('chart set', () => {
  it('builds every chart for a full input', () => {
    expect(charts.map((c) => c.name).sort()).toEqual(
      ['conditional-beta', 'importance', 'mc-convergence', 'mode-shapes', 'restraint-curve', 'samples-histogram', 'sweep', 'tornado-capacity', 'tornado-utilization'].sort(),
    );
  });

  it('leaves out charts without data', () => {
    const bare = { ...demoReportInput(), samples: undefined, sweep: undefined, restraint: undefined };
    bare.reliability = { ...bare.reliability, mc: undefined };
    const names = buildCharts(bare, 'si').map((c) => c.name);
    expect(names).not.toContain('samples-histogram');
    expect(names).not.toContain('mc-convergence');
    expect(names).not.toContain('restraint-curve');
    expect(names).not.toContain('sweep');
    expect(names).toContain('tornado-utilization');
  });

  it('compiles every spec and titles every SVG, in the shipped font', () => {
    for (const c of charts) {
      expect(() => compileChart(c.spec)).not.toThrow();
      const svg = svgs[c.name];
      expect(svg.startsWith('<svg')).toBe(true);
      expect(svgTexts(svg)).toContain(c.title);
      const families = new Set([...svg.matchAll(/font-family="([^"]*)"/g)].map((m) => m[1]));
      expect([...families]).toEqual([CHART_FONT]);
    }
  });
});

describe('tornado charts', () => {
  const description = (path: string) => input.inputs.find((r) => r.path === path)!.description;
  const moving = (t: { baseline: number; rows: { variable: string; low: number; high: number }[] }) => t.rows.filter((r) => r.low !== t.baseline || r.high !== t.baseline);

  it('draw two bars per variable that moves, under its description, and the baseline', () => {
    for (const [name, t] of [
      ['tornado-utilization', input.sensitivity.utilization],
      ['tornado-capacity', input.sensitivity.capacity],
      ['conditional-beta', input.sensitivity.conditionalBeta],
    ] as const) {
      expect(countMarks(svgs[name], 'tornadoBars')).toBe(2 * moving(t).length);
      expect(countMarks(svgs[name], 'baseline')).toBe(1);
      const texts = svgTexts(svgs[name]);
      for (const r of moving(t)) expect(texts).toContain(description(r.variable));
      expect(texts.join(' ')).not.toMatch(/column\.(ends|material|imperfection)\./);
    }
  });

  it('name the variables a tornado leaves out because they move nothing', () => {
    // the fixture's loads and model factor leave the capacity where it is
    expect(svgTexts(svgs['tornado-capacity']).join(' ')).toContain('Not shown (no effect on the capacity): Dead load, Imposed load, 50-year maximum, Model uncertainty on the capacity.');
  });

  it('put the largest swing on top', () => {
    const texts = svgTexts(svgs['tornado-utilization']);
    const first = texts.indexOf(description(input.sensitivity.utilization.rows[0].variable));
    const last = texts.indexOf(description(input.sensitivity.utilization.rows[input.sensitivity.utilization.rows.length - 1].variable));
    expect(first).toBeGreaterThanOrEqual(0);
    expect(first).toBeLessThan(last);
  });

  it('conditional β shows the target line', () => {
    expect(countMarks(svgs['conditional-beta'], 'targetLine')).toBe(1);
    expect(svgTexts(svgs['conditional-beta']).join(' ')).toContain('EN 1990 Annex C');
  });
});

describe('importance factors', () => {
  it('draw one bar and one percentage per variable', () => {
    const n = input.sensitivity.importance.length;
    expect(countMarks(svgs.importance, 'importanceBars')).toBe(n);
    expect(countMarks(svgs.importance, 'importanceLabels')).toBe(n);
    expect(svgTexts(svgs.importance)).toContain('31.0 %');
  });
});

describe('restraint curve', () => {
  it('uses a log stiffness axis', () => {
    const vg = compileChart(chart('restraint-curve').spec) as { scales?: { type?: string }[] };
    expect((vg.scales ?? []).some((s) => s.type === 'log')).toBe(true);
  });

  it('marks the target and both ideal cases', () => {
    const svg = svgs['restraint-curve'];
    expect(countMarks(svg, 'targetLine')).toBe(1);
    expect(countMarks(svg, 'pinnedIdeal')).toBe(1);
    expect(countMarks(svg, 'fixedIdeal')).toBe(1);
    const text = svgTexts(svg).join(' | ');
    expect(text).toContain('ideal pinned: β = 1.42');
    expect(text).toContain('ideal fixed: β = 4.33');
    expect(text).toContain('target β = 3.80 (EN 1990 Annex C)');
    // the crossing value is printed next to the requirement line (common practice for a chart a reviewer reads)
    expect(text).toMatch(/bottom: [\d.]+ (kN|MN)·m\/rad/);
    expect(text.match(/as assessed/g)?.length).toBe(1);
    expect(overlappingTexts(svg)).toEqual([]);
  });
});

describe('samples histogram', () => {
  it('draws one bar per non-empty bin of each series and the design point', () => {
    const s = input.samples!;
    const u = displayUnit('force', 'si');
    const r = s.resistance.map((v) => toDisplay(v, u));
    const d = s.demand.map((v) => toDisplay(v, u));
    const dp = toDisplay(s.designPoint.demand, u);
    const lo = Math.min(sampleQuantile(r, 0.001), sampleQuantile(d, 0.001), dp);
    const hi = Math.max(sampleQuantile(r, 0.999), sampleQuantile(d, 0.999), dp);
    const bars = [...histogramBins(r, lo, hi, 48), ...histogramBins(d, lo, hi, 48)].filter((b) => b.density > 0).length;
    expect(countMarks(svgs['samples-histogram'], 'histogramBars')).toBe(bars);
    expect(svgTexts(svgs['samples-histogram'])).toContain('design point');
  });
});

describe('Monte Carlo convergence', () => {
  it('draws the band, the estimate and the final value on a log sample axis', () => {
    const svg = svgs['mc-convergence'];
    expect(countMarks(svg, 'confidenceBand')).toBe(1);
    expect(countMarks(svg, 'estimateLine')).toBe(1);
    expect(countMarks(svg, 'finalEstimate')).toBe(1);
    const vg = compileChart(chart('mc-convergence').spec) as { scales?: { type?: string }[] };
    expect((vg.scales ?? []).some((s) => s.type === 'log')).toBe(true);
  });
});

describe('mode shapes', () => {
  it('draws one line per mode, every inflection point and the effective length', () => {
    const svg = svgs['mode-shapes'];
    const modes = input.check.modeShapes;
    expect(countMarks(svg, 'modeLines')).toBe(modes.length);
    expect(countMarks(svg, 'inflectionPoints')).toBe(modes.reduce((n, m) => n + m.inflectionPoints.length, 0));
    const k = input.check.effectiveLengthFactor;
    expect(svgTexts(svg)).toContain(`Le = ${k.toFixed(3)} L`);
  });
});

describe('sweep', () => {
  it('draws a line with the target for one varied path', () => {
    const svg = svgs.sweep;
    expect(countMarks(svg, 'sweepLine')).toBeGreaterThanOrEqual(1);
    expect(countMarks(svg, 'targetLine')).toBe(1);
  });

  it('draws a heat map cell and label per row for two varied paths', async () => {
    const sw = demoSweep2D();
    const svg = await chartToSvg(sweepChart(input, sw, 'si').spec);
    expect(countMarks(svg, 'sweepCells')).toBe(sw.rows.length);
    expect(countMarks(svg, 'sweepLabels')).toBe(sw.rows.length);
  });

  it('refuses three varied paths', () => {
    const sw = demoSweep2D();
    sw.varied.push({ path: 'loads.dead', kind: 'force' });
    expect(() => sweepChart(input, sw, 'si')).toThrow(/1 or 2/);
  });
});

describe('histogram bins', () => {
  it('integrate to one over the range', () => {
    const values = Array.from({ length: 1000 }, (_, i) => i / 999);
    const bins = histogramBins(values, 0, 1, 10);
    const area = bins.reduce((a, b) => a + b.density * (b.x1 - b.x0), 0);
    expect(area).toBeCloseTo(1, 12);
  });
});
