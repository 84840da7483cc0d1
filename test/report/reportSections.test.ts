// The words of the report follow the numbers they are given. common practice: check the verdicts both ways.
import { describe, expect, it } from 'vitest';
import { buildReportDocument } from '../../src/report/reportSections.js';
import { SECTION_TITLES, sectionOrder, type Block, type ReportDocument } from '../../src/report/reportDocument.js';
import { renderMarkdown } from '../../src/report/markdownReport.js';
import { buildCharts } from '../../src/report/charts/allCharts.js';
import { STANDING_CAUTIONS } from '../../src/report/standingCautions.js';
import { csvTables, toCsv } from '../../src/report/csvTables.js';
import type { ReportInput } from '../../src/report/reportInput.js';
import { demoReportInput } from './fixture.js';

function doc(input: ReportInput, system: 'si' | 'us' = 'si'): ReportDocument {
  return buildReportDocument(input, system, buildCharts(input, system));
}

function sectionText(d: ReportDocument, id: keyof typeof SECTION_TITLES): string {
  const s = d.sections.find((x) => x.id === id);
  if (!s) return '';
  const text = (b: Block): string =>
    b.kind === 'table' ? [b.caption ?? '', ...b.head, ...b.rows.flat()].join(' ') : b.kind === 'result' ? [b.headline, ...b.items.map((i) => `${i.label}: ${i.text}`)].join('\n') : b.kind === 'list' ? b.items.join(' ') : 'text' in b ? b.text : b.kind;
  return s.blocks.map(text).join('\n');
}

describe('report document', () => {
  it('opens with the result, then its own subject, details, and the scenario appendix last', () => {
    const assess = doc(demoReportInput()).sections.map((s) => s.id);
    // the fixture has no evidence and no test plans: those two sections are left out
    expect(assess).toEqual(sectionOrder('assessment').filter((id) => id !== 'measurements' && id !== 'testPlans'));
    expect(assess.slice(0, 3)).toEqual(['result', 'target', 'restraint']);
    expect(assess.slice(-2)).toEqual(['inputs', 'reproducibility']);
    const restraint = doc({ ...demoReportInput(), subject: 'restraint' }).sections.map((s) => s.id);
    expect(restraint.slice(0, 2)).toEqual(['result', 'restraint']);
    const sweep = doc({ ...demoReportInput(), subject: 'sweep' }).sections.map((s) => s.id);
    expect(sweep.slice(0, 2)).toEqual(['result', 'sweep']);
    expect(sweep.slice(-3)).toEqual(['inputs', 'sweepCases', 'reproducibility']);
    expect(Object.keys(SECTION_TITLES).sort()).toEqual([...new Set([...sectionOrder('assessment'), ...sectionOrder('sweep')])].sort());
  });

  it('puts the verdict, the target source, the method, the restraint and the driver in the result box', () => {
    const box = doc(demoReportInput()).sections[0].blocks[0];
    expect(box.kind).toBe('result');
    if (box.kind !== 'result') return;
    expect(box.tone).toBe('warn');
    expect(box.headline).toContain('FALLS SHORT of the target by Δβ = 0.61'); // 3.80 − 3.194 from the fixture
    const text = box.items.map((i) => `${i.label}: ${i.text}`).join('\n');
    expect(text).toContain('EN 1990 Annex C');
    expect(text).toMatch(/Governing method: /);
    expect(text).toMatch(/Restraint required: bottom: at least \d/);
    expect(text).toContain('Leading driver: Rotational stiffness of the base plate'); // the fixture's description, not the path
    expect(text).not.toContain('column.ends.bottom.rotation');
    expect(text).toContain('licensed engineer');
    const meets = demoReportInput();
    meets.reliability.governing = { method: 'form', beta: 4.1, pf: 2.07e-5 };
    const okBox = doc(meets).sections[0].blocks[0];
    expect(okBox.kind === 'result' && okBox.tone === 'ok' && okBox.headline.startsWith('MEETS')).toBe(true);
  });

  it('names the governing principal axis in the result box when there are two (docs/sections.md)', () => {
    const input = demoReportInput();
    expect(JSON.stringify(doc(input).sections[0])).not.toContain('Governing axis');
    input.axes = { governing: 'z', governingAtMeans: 'y', y: { beta: 4.2, pf: 1.3e-5 }, z: { beta: 3.46, pf: 2.7e-4 } };
    const box = doc(input).sections[0].blocks[0];
    if (box.kind !== 'result') throw new Error('no result box');
    const line = box.items.find((i) => i.label === 'Governing axis');
    expect(line?.text).toBe('z: β 3.46 about z alone, 4.20 about y alone (FORM; the column fails when either axis does; at the means axis y has the smaller capacity)');
  });

  it('states Monte Carlo without failure as a one-sided bound, never β ∞', () => {
    const input = demoReportInput();
    // source: exact binomial bound 1 − 0.05^(1/n) (Clopper & Pearson 1934); n = 2×10⁶ gives 1.5×10⁻⁶, β 4.67
    input.reliability.mc = { ...input.reliability.mc!, failures: 0, pf: 0, beta: Infinity, samples: 2e6, zeroFailureBound: { pf: 1.4979e-6, beta: 4.6725 } };
    const t = sectionText(doc(input), 'methods');
    expect(t).toContain('> 4.67');
    expect(t).toContain('< 1.5×10⁻⁶');
    expect(t).not.toContain('∞');
  });

  it('uses the variable descriptions outside the Inputs table, and keeps the path there', () => {
    const d = doc(demoReportInput());
    for (const id of ['sensitivity', 'partialFactors', 'result'] as const) expect(sectionText(d, id)).not.toMatch(/column\.(ends|material|imperfection)\./);
    const inputs = sectionText(d, 'inputs');
    expect(inputs).toContain('column.ends.bottom.rotation');
    expect(inputs).toContain('Rotational stiffness of the base plate');
  });

  it('writes each pf column in one form and clips Sobol indices into [0, 1], marked', () => {
    const input = demoReportInput();
    input.sensitivity.sobol = { samples: 4096, rows: [{ variable: 'loads.dead', first: -0.03, firstCi95: [-0.08, 0.02], total: 0.02, totalCi95: [0, 0.05] }] };
    const s = sectionText(doc(input), 'sensitivity');
    expect(s).toContain('0.00*');
    expect(s).toContain('shown clipped');
    expect(s).toContain('α²');
    const pfColumn = doc(input).sections.find((x) => x.id === 'methods')!.blocks.find((b) => b.kind === 'table' && b.head[2] === 'pf');
    const cells = pfColumn && pfColumn.kind === 'table' ? pfColumn.rows.map((r) => r[2]) : [];
    expect(cells.length).toBeGreaterThan(1);
    expect(cells.every((c) => c.includes('×10'))).toBe(true);
  });

  it('says the column falls short when β < target, and by how much', () => {
    const t = sectionText(doc(demoReportInput()), 'target');
    expect(t).toContain('FALLS SHORT OF');
    expect(t).toContain('Δβ = 0.61'); // 3.80 − 3.194 from the fixture
    expect(t).toContain('EN 1990 Annex C');
  });

  it('says the column meets the target when β ≥ target', () => {
    const input = demoReportInput();
    input.reliability.governing = { method: 'form', beta: 4.1, pf: 2.07e-5 };
    input.reliability.target = { beta: 3.8, source: 'ISO 13822' };
    const t = sectionText(doc(input), 'target');
    expect(t).toContain('MEETS');
    expect(t).not.toContain('FALLS SHORT');
    expect(t).toContain('ISO 13822');
  });

  it('carries the standing cautions and this run’s cautions', () => {
    const input = demoReportInput();
    const t = sectionText(doc(input), 'cautions');
    for (const c of STANDING_CAUTIONS) expect(t).toContain(c);
    for (const c of input.cautions) expect(t).toContain(c);
    expect(t).toContain('licensed engineer');
  });

  it('shows the reproducibility facts', () => {
    const input = demoReportInput();
    const t = sectionText(doc(input), 'reproducibility');
    expect(t).toContain(input.meta.scenarioSha256);
    expect(t).toContain(String(input.meta.seed));
    expect(t).toContain(input.meta.toolVersion);
    expect(t).toContain(input.meta.date);
    expect(t).toContain(input.meta.commandLine);
  });

  it('converts displayed values to US customary units on request', () => {
    const us = sectionText(doc(demoReportInput(), 'us'), 'inputs');
    // 760 kN / 4.4482216152605 kN per kip = 170.9 kip (NIST SP 811 factor, see displayUnits.test.ts)
    expect(us).toContain('171 kip');
    // 310 MPa / 6.894757 MPa per ksi = 44.96 ksi
    expect(us).toContain('45 ksi');
    const si = sectionText(doc(demoReportInput(), 'si'), 'inputs');
    expect(si).toContain('760 kN');
    expect(si).toContain('310 MPa');
  });

  it('drops input columns that no variable uses', () => {
    const inputs = doc(demoReportInput()).sections.find((s) => s.id === 'inputs');
    const table = inputs?.blocks.find((b) => b.kind === 'table');
    expect(table && table.kind === 'table' ? table.head : []).toEqual(['variable', 'description', 'distribution', 'mean or value', 'sd', 'CoV']);
  });

  it('names the axis of a restraint study on a two-axis column, the other axis and its joint classes', () => {
    const base = demoReportInput();
    const classes = [{ end: 'bottom' as const, rule: 'base' as const, stiffnessMean: 1e5, stiffnessLow: 5e4, classAtMean: 'semi-rigid' as const, classAtLow: 'semi-rigid' as const, rigidFrom: 7.7e5, pinnedUpTo: 2.2e4, note: 'column base about z' }];
    const restraint = { ...base.restraint!, axis: { axis: 'z' as const, basis: 'governing' as const, otherAxis: 'y' as const, otherBeta: 3.9, capsTarget: false, classes } };
    const input = { ...base, restraint };
    const t = sectionText(doc(input), 'restraint');
    expect(t).toContain('Stiffness about z at which β equals the target');
    expect(t).toContain('The stiffnesses are about axis z (the governing axis); K is about z.');
    expect(t).toContain('axis y alone has β = 3.90 at every stiffness studied');
    const curve = buildCharts(input, 'si').find((c) => c.name === 'restraint-curve')!;
    expect(JSON.stringify(curve.spec)).toContain('about z');
    expect(JSON.stringify(curve.spec)).toContain('axis y alone: β = 3.90');
    // the joint-class limits drawn are those about z, not the check's (about y)
    const limits = JSON.stringify((curve.spec.layer as { name?: string; data?: unknown }[]).find((l) => l.name === 'jointClassLimits')?.data);
    expect(limits).toContain(`"k":0.77,"label":"bottom rigid from here"`); // 7.7e5 N·m/rad shown in MN·m/rad
    const capped = sectionText(doc({ ...base, restraint: { ...restraint, axis: { ...restraint.axis, otherBeta: 3.5, capsTarget: true } } }), 'result');
    expect(capped).toContain('none about z: axis y alone has β = 3.50, below the target');
  });

  it('says so when there is no restraint study', () => {
    const t = sectionText(doc({ ...demoReportInput(), restraint: undefined }), 'restraint');
    expect(t).toContain('no restraint study');
  });

  // common practice: a partial factor is only comparable to γ_M, γ_G, γ_Q against characteristic values; the mean-based ratio is named apart
  it('shows β by strength model, the model factor used, and characteristic-based partial factors', () => {
    const d = doc(demoReportInput());
    const target = sectionText(d, 'target');
    expect(target).toContain('first-yield (chosen)');
    expect(target).toContain('en1993-b');
    expect(sectionText(d, 'model')).toContain('the default of strength model first-yield');
    const pf = sectionText(d, 'partialFactors');
    expect(pf).toContain('implied partial factor');
    expect(pf).toContain('design/mean ratio');
    expect(pf).toContain('EN 1990 4.1.2');
    expect(csvTables(demoReportInput())['strength-models.csv'].split('\n')[1]).toBe('first-yield,3.91,1,0.1,default,yes,');
  });

  it('renders compact Markdown with linked PNG charts', () => {
    const md = renderMarkdown(doc(demoReportInput()));
    expect(md).toContain('![Column sketch](charts/column-sketch.png)');
    expect(md).toContain('![Tornado: utilization](charts/tornado-utilization.png)');
    expect(md).toMatch(/\| method \| β \| pf \|/);
  });
});

describe('CSV tables', () => {
  it('quotes per RFC 4180 and writes infinities readably', () => {
    // source: RFC 4180 §2 (fields with commas, quotes or line breaks are quoted; quotes doubled)
    expect(toCsv(['a', 'b'], [['x,y', 'say "hi"'], [Infinity, null]])).toBe('a,b\n"x,y","say ""hi"""\ninf,\n');
  });

  it('writes one row per sample, tornado entry and curve point', () => {
    const input = demoReportInput();
    const t = csvTables(input);
    const lines = (s: string) => s.trimEnd().split('\n').length - 1;
    expect(lines(t['samples.csv'])).toBe(5000);
    expect(lines(t['samples-summary.csv'])).toBe(2);
    expect(lines(t['tornado.csv'])).toBe(3 * 7);
    expect(lines(t['restraint-curve.csv'])).toBe(input.restraint!.curve.length);
    expect(lines(t['sweep.csv'])).toBe(input.sweep!.rows.length);
    expect(t['restraint-curve.csv']).toContain('inf');
  });

  it('summarises the samples: the mean of the demand matches the data', () => {
    const input = demoReportInput();
    const row = csvTables(input)['samples-summary.csv'].split('\n')[2].split(',');
    const mean = input.samples!.demand.reduce((a, b) => a + b, 0) / input.samples!.demand.length;
    expect(row[0]).toBe('demand');
    expect(Number(row[3])).toBeCloseTo(mean, 6);
  });
});
