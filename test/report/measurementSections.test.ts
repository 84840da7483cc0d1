// The report sections "What the measurements changed" and "Which test buys most" and their charts.
// common practice: count the rendered marks against the data that went in.
import { describe, expect, it } from 'vitest';
import { buildCharts } from '../../src/report/charts/allCharts.js';
import { chartToSvg, compileChart } from '../../src/report/renderChart.js';
import { buildReportDocument } from '../../src/report/reportSections.js';
import type { ReportInput } from '../../src/report/reportInput.js';
import { countMarks } from './svgMarks.js';
import { demoReportInput } from './fixture.js';

// invented numbers (a display check, not a check of any result)
function withEvidence(): ReportInput {
  const points = Array.from({ length: 21 }, (_, i) => ({ x: 0.5e6 + i * 0.1e6, prior: Math.exp(-((i - 6) ** 2) / 20), posterior: Math.exp(-((i - 12) ** 2) / 6) }));
  return {
    ...demoReportInput(),
    measurements: {
      target: 3.8,
      before: { beta: 3.1, pf: 1e-3, meets: false },
      afterTests: { beta: 3.6, pf: 1.6e-4, meets: false },
      after: { beta: 3.9, pf: 4.8e-5, meets: true },
      survival: { loads: [{ path: 'evidence[0].load', mean: 1e6, random: false, date: 'winter' }], beta: 3.9, pf: 4.8e-5, pSurvival: 0.97, rho: 0.5, converged: true, mc: { pf: 5e-5, cov: 0.2, samples: 400000, survived: 390000, failures: 20, seed: 1 },
        importance: { pf: 4.6e-5, beta: 3.91, cov: 0.09, samples: 1536, hits: 700, centre: 'the design point of failure and survival together', survivalMethod: 'mc', seed: 1 },
        check: { agrees: true, reason: 'importance sampling gives β = 3.91 (…), which agrees with FORM’s β = 3.90', method: 'is' } },
      densities: [{ path: 'column.ends.bottom.rotation', description: 'bottom connection rotational stiffness', kind: 'rotationalStiffness', points, tests: [1.6e6, 1.8e6, 1.9e6] }],
    },
    testPlans: {
      betaNow: 3.9, target: 3.8, outcomes: 40, seed: 1, defaults: false, survivalIncluded: true,
      plans: [
        { label: 'two coupons', variable: 'column.material.fy', description: 'yield strength', tests: 2, tested: 'this_one', measurementCov: 0.03, betaMean: 3.95, beta05: 3.7, beta50: 3.95, beta95: 4.2, pMeet: 0.7, expectedGain: 0.05 },
        { label: 'three base tests', variable: 'column.ends.bottom.rotation', description: 'bottom', tests: 3, tested: 'similar', betaMean: 3.9, beta05: 3.75, beta50: 3.9, beta95: 4.0, pMeet: 0.6, expectedGain: 0 },
      ],
    },
  };
}

describe('measurement sections', () => {
  const input = withEvidence();
  const charts = buildCharts(input, 'si');
  it('builds the density and plan charts, which compile and draw their marks', async () => {
    const density = charts.find((c) => c.name === 'measurement-density-1')!;
    const plans = charts.find((c) => c.name === 'test-plans')!;
    expect(density).toBeDefined();
    expect(plans).toBeDefined();
    compileChart(density.spec);
    compileChart(plans.spec);
    const svg = await chartToSvg(plans.spec);
    expect(countMarks(svg, 'betaMedian')).toBe(2);
    const dsvg = await chartToSvg(density.spec);
    expect(countMarks(dsvg, 'testTicks')).toBe(3);
  });
  it('puts both sections after the target, with β before and after and the ranking', () => {
    const doc = buildReportDocument(input, 'si', charts);
    const ids = doc.sections.map((s) => s.id);
    expect(ids.indexOf('measurements')).toBeGreaterThan(ids.indexOf('target'));
    const m = doc.sections.find((s) => s.id === 'measurements')!;
    expect(m.title).toBe('What the measurements changed');
    const table = m.blocks.find((b) => b.kind === 'table');
    expect(table && table.kind === 'table' ? table.rows.map((r) => r[1]) : []).toEqual(['3.10', '3.60', '3.90']);
    expect(m.blocks.some((b) => b.kind === 'chart' && b.name === 'measurement-density-1')).toBe(true);
    const p = doc.sections.find((s) => s.id === 'testPlans')!;
    const ptable = p.blocks.find((b) => b.kind === 'table');
    expect(ptable && ptable.kind === 'table' ? ptable.rows.map((r) => r[1]) : []).toEqual(['two coupons', 'three base tests']);
  });
  it('states the importance-sampling check of the survival step beside the Monte Carlo one', () => {
    const m = buildReportDocument(input, 'si', charts).sections.find((s) => s.id === 'measurements')!;
    const texts = m.blocks.flatMap((b) => (b.kind === 'paragraph' || b.kind === 'callout' ? [b.text] : []));
    const survival = texts.find((t) => t.startsWith('Survived load'))!;
    expect(survival).toMatch(/Importance sampling \(1536 samples centred at the design point of failure and survival together, P\(h > 0\) by crude Monte Carlo, seed 1\): pf = .*β = 3\.91 \(CoV 0\.09\)/);
    expect(survival).toMatch(/Crude Monte Carlo check \(400000 samples/);
    expect(texts.some((t) => /checked by its importance-sampling ratio.*Importance sampling gives β = 3\.91/.test(t))).toBe(true);
  });
  it('leaves both out without evidence', () => {
    const doc = buildReportDocument(demoReportInput(), 'si', buildCharts(demoReportInput(), 'si'));
    expect(doc.sections.map((s) => s.id)).not.toContain('measurements');
  });
});
