// An optional `source:` note on a random variable: kept verbatim, printed in the report's Inputs
// table beside both sd and CoV; anything but a text is refused naming the field.
import { describe, expect, it } from 'vitest';
import { stringify } from 'yaml';
import { loadScenario } from '../../src/scenario/loadScenario.js';
import { assessmentReportInput } from '../../src/studies/assessmentReport.js';
import { assessColumn } from '../../src/studies/columnAssessment.js';
import { baseObject, inputErrorOf, loadChanged, type Json } from './helpers.js';

describe('source of a random variable', () => {
  it('is kept as written for the variables that have one', () => {
    const s = loadChanged((o) => {
      const m = (o.column as Json).material as Json;
      (m.fy as Json).source = 'mill certificates, 12 heats (invented)';
      ((o.loads as Json).dead as Json).source = 'site survey 2024 (invented)';
    });
    expect(s.sources).toEqual({ 'column.material.fy': 'mill certificates, 12 heats (invented)', 'loads.dead': 'site survey 2024 (invented)' });
  });

  it('refuses a source that is not a text, naming the field', () => {
    const o = baseObject();
    (((o.column as Json).material as Json).E as Json).source = 42;
    const e = inputErrorOf(() => loadScenario(stringify(o), 'bad.yaml'));
    expect(e.field).toBe('column.material.E.source');
    expect(e.message).toMatch(/text/);
  });

  it('reaches the Inputs rows with both sd and CoV', async () => {
    const s = loadChanged((o) => {
      (((o.column as Json).material as Json).fy as Json).source = 'mill certificates (invented)';
      (o.analysis as Json).methods = ['form'];
    });
    const a = await assessColumn(s, { methods: ['form'], reliabilityOnly: true });
    const rows = assessmentReportInput(a, { version: '0', date: '2026-01-01T00:00:00Z', command: 'test' }).inputs;
    const fy = rows.find((r) => r.path === 'column.material.fy')!;
    expect(fy.source).toBe('mill certificates (invented)');
    // the scenario gives mean 310 MPa and CoV 0.07: sd = 0.07 × 310 MPa = 21.7 MPa (common practice: sd = CoV × mean)
    expect(fy.parameters.cov).toBeCloseTo(0.07, 12);
    expect(fy.parameters.sd).toBeCloseTo(21.7e6, 0);
    const bow = rows.find((r) => r.path === 'column.imperfection.bow')!;
    // the scenario gives mean L/1500 and sd L/3000: CoV = 0.5
    expect(bow.parameters.cov).toBeCloseTo(0.5, 12);
    expect(rows.find((r) => r.path === 'column.material.E')!.source).toBeUndefined();
  });
});
