import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { ROOT, runCliOnText } from './runCli.js';
import { loadScenario } from '../../src/scenario/loadScenario.js';
import { assessColumn } from '../../src/studies/columnAssessment.js';
import { reliabilityJson } from '../../src/studies/assessmentJson.js';
import { assessmentReportInput } from '../../src/studies/assessmentReport.js';
import { buildReportDocument } from '../../src/report/reportSections.js';
import { endSpringMoments } from '../../src/mechanics/endSpringMoments.js';

function scenario(ends: string, extra = ''): string {
  return `stanchion: 1
title: connection moments oracle
column:
  length: 4 m
  frame: braced
  section: {area: 5000 mm^2, inertia: 20e6 mm^4, section_modulus: 200e3 mm^3}
  material: {E: 200 GPa, fy: 275 MPa}
  ends: ${ends}
  imperfection: {bow: 4 mm}
loads: {dead: 1000 kN${extra}}
strength: first-yield
`;
}

const EI = 200e9 * 20e-6;

describe('connection moments and joint classes in check and assess', () => {
  // source: Timoshenko & Gere, Theory of Elastic Stability, 2nd ed., §1.11–1.12: M_mid = P e0/(1 − P/Pcr), no end moment
  it('check --json, pinned–pinned: zero connection moments, amplified mid-span moment', async () => {
    const r = await runCliOnText(['check', '-', '--json'], scenario('{bottom: pinned, top: pinned}'));
    expect(r.status, r.stderr).toBe(0);
    const c = JSON.parse(r.stdout).check;
    const Pcr = (Math.PI ** 2 * EI) / 16;
    const P = 1e6;
    expect(c.connection_moments.bottom).toBe(0);
    expect(c.connection_moments.top).toBe(0);
    expect(c.connection_moments.member_max / ((P * 0.004) / (1 - P / Pcr))).toBeCloseTo(1, 10);
    expect(c.connection_moments.member_max_at).toBeCloseTo(2, 9);
    const a = (0.004 * (P / Pcr)) / (1 - P / Pcr);
    expect(c.connection_rotations.bottom / ((Math.PI * a) / 4)).toBeCloseTo(1, 10);
    expect(c.connection_response).toMatchObject({ at: 'means', stable: true, axial_load: P });
    expect(c.joint_classification.bottom).toMatchObject({ rule: 'given', class_at_mean: 'nominally pinned' });
  });

  // source: EN 1993-1-8:2005 §5.2.2.5(1)–(2) (from memory): braced, rigid from 8 E I_b/L_b, pinned up to 0.5 E I_b/L_b
  it('a top connection with its beam is classified at the mean stiffness and at its 5 % fractile', async () => {
    const EIbOverL = (200e9 * 100e-6) / 8; // beam 100e6 mm⁴ over 8 m, E of the column
    const mean = 10 * EIbOverL; // well above the rigid limit 8 E I_b/L_b; its 5 % fractile (cov 0.5) is well below
    const ends = `{bottom: fixed, top: {rotation: {dist: lognormal, mean: ${mean} N m/rad, cov: 0.5}, beam: {inertia: 100e6 mm^4, length: 8 m}}}`;
    const r = await runCliOnText(['check', '-', '--json'], scenario(ends));
    expect(r.status, r.stderr).toBe(0);
    const t = JSON.parse(r.stdout).check.joint_classification.top;
    expect(t.rule).toBe('beam');
    expect(t.rigid_from / (8 * EIbOverL)).toBeCloseTo(1, 12);
    expect(t.pinned_up_to / (0.5 * EIbOverL)).toBeCloseTo(1, 12);
    expect(t.class_at_mean).toBe('rigid');
    expect(t.class_at_5pct).toBe('semi-rigid');
    expect(t.stiffness_mean / mean).toBeCloseTo(1, 12);
    expect(t.stiffness_5pct).toBeLessThan(0.5 * mean);
    const human = await runCliOnText(['check', '-'], scenario(ends));
    expect(human.stdout).toMatch(/M_j,Rd/);
    expect(human.stdout).toMatch(/top\s+[\d.]+ kN·m\s+[\d.]+ mrad\s+rigid at the mean k, semi-rigid at its 5 % fractile/);
    expect(human.stdout).toMatch(/Caution/);
  });

  // common practice: bad input names the field, exit 2, nothing on stdout
  it.each([
    ['{bottom: fixed, top: {rotation: 5 MN m/rad, beam: {inertia: 5 m, length: 8 m}}}', /column\.ends\.top\.beam\.inertia/],
    ['{bottom: fixed, top: {rotation: 5 MN m/rad, beam: {inertia: 100e6 mm^4}}}', /column\.ends\.top\.beam\.length/],
    ['{bottom: fixed, top: {rotation: 5 MN m/rad, beam: {inertia: 100e6 mm^4, length: -8 m}}}', /column\.ends\.top\.beam\.length/],
    ['{bottom: fixed, top: {rotation: 5 MN m/rad, beam: {inertia: 100e6 mm^4, length: 8 m, span: 3 m}}}', /span/],
  ])('bad beam %s', async (ends, field) => {
    const r = await runCliOnText(['check', '-', '--json'], scenario(ends));
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(field);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
  });

  // common practice (round trip): the design-point moments are the closed form evaluated at the reported design point
  it('assess: reliability.form.connection_moments at the FORM design point, and in the report', async () => {
    const text = readFileSync(join(ROOT, 'scenarios', 'braced-base-plate.yaml'), 'utf8');
    const s = loadScenario(text, 'braced-base-plate.yaml');
    const a = await assessColumn(s, { methods: ['form'], reliabilityOnly: true });
    const form = reliabilityJson(a).form as Record<string, Record<string, number>>;
    const dp = form.design_point;
    const I = 15.4e-6, L = 5.6;
    const EIdp = dp['column.material.E'] * I;
    const r = { bottom: (dp['column.ends.bottom.rotation'] * L) / EIdp, top: (dp['column.ends.top.rotation'] * L) / EIdp };
    const P = dp['loads.dead'] + dp['loads.imposed'];
    const m = endSpringMoments(EIdp, L, 'braced', r, dp['column.imperfection.bow'], P);
    expect(form.connection_moments.bottom / Math.abs(m.springMoment.bottom)).toBeCloseTo(1, 9);
    expect(form.connection_moments.top / Math.abs(m.springMoment.top)).toBeCloseTo(1, 9);
    expect(form.connection_moments.member_max / m.memberMax).toBeCloseTo(1, 9);
    expect(form.connection_response).toMatchObject({ at: 'form design point', axial_load: P });
    const doc = buildReportDocument(assessmentReportInput(a, { version: 't', date: '2026-01-01T00:00:00Z', command: 'test' }), 'si', []);
    const column = doc.sections.find((x) => x.id === 'column');
    const table = column?.blocks.find((b) => b.kind === 'table' && (b.caption ?? '').startsWith('End connections'));
    expect(table).toBeDefined();
    const text2 = JSON.stringify(column);
    expect(text2).toMatch(/M_j,Rd/);
    expect(text2).toMatch(/design point/);
  });
});
