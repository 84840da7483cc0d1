import { mkdtempSync, existsSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { updateLognormalUnknownVariance } from '../../src/evidence/lognormalPopulation.js';
import { makeDistribution } from '../../src/probability/makeDistribution.js';
import { InputError } from '../../src/scenario/inputError.js';
import { loadScenario } from '../../src/scenario/loadScenario.js';
import { runCli } from '../cli/runCli.js';

const BASE = readFileSync(new URL('../../scenarios/braced-base-plate.yaml', import.meta.url), 'utf8');
const FY_LINE = '    fy: {dist: lognormal, mean: 300 MPa, cov: 0.07}';
const BOW_LINE = '    bow: {dist: normal, mean: L/1500, sd: L/3000}';

function withFy(evidence: string): string {
  expect(BASE).toContain(FY_LINE);
  return BASE.replace(FY_LINE, `    fy: {dist: lognormal, mean: 300 MPa, cov: 0.07, evidence: ${evidence}}`);
}

function inputError(text: string): InputError {
  try {
    loadScenario(text, 'evidence.yaml');
  } catch (e) {
    if (e instanceof InputError) return e;
    throw e;
  }
  throw new Error('no InputError');
}

describe('evidence in a scenario', () => {
  it('replaces the written distribution by the posterior predictive (units converted first)', () => {
    const s = loadScenario(withFy('{tests: [312 MPa, 298 MPa, 331 MPa, 305 MPa], measurement_sd: 5 MPa}'), 'evidence.yaml');
    const spec = s.column.material.fy.kind === 'random' ? s.column.material.fy.spec : undefined;
    const expected = updateLognormalUnknownVariance([312e6, 298e6, 331e6, 305e6], 5e6 / 311.5e6);
    expect(spec).toEqual({ dist: 'logstudentt', loc: expected.loc, scale: expected.scale, dof: 3 });
    const record = s.evidence?.['column.material.fy'];
    expect(record?.tests).toEqual([312e6, 298e6, 331e6, 305e6]);
    expect(record?.prior).toEqual({ dist: 'lognormal', mean: 300e6, cov: 0.07 });
  });

  it('a test of this one item updates the normal bow by normal–normal conjugacy (BDA3 §2.5)', () => {
    const text = BASE.replace(BOW_LINE, '    bow: {dist: normal, mean: L/1500, sd: L/3000, evidence: {tests: [6 mm], tested: this_one, measurement_sd: 1 mm}}');
    const s = loadScenario(text, 'evidence.yaml');
    const bow = s.column.bow.kind === 'random' ? s.column.bow.spec : undefined;
    const m0 = 5.6 / 1500;
    const s0 = 5.6 / 3000;
    const precision = 1 / s0 ** 2 + 1 / 1e-6;
    expect(bow?.dist).toBe('normal');
    expect(Math.abs(bow!.sd! - Math.sqrt(1 / precision))).toBeLessThan(1e-15);
    expect(Math.abs(bow!.mean! - (m0 / s0 ** 2 + 6e-3 / 1e-6) / precision)).toBeLessThan(1e-15);
  });

  it('scatter: known keeps the written CoV and gives a lognormal (EN 1990:2002 Annex D, "V_X known")', () => {
    const s = loadScenario(withFy('{tests: [312 MPa, 298 MPa, 331 MPa], scatter: known}'), 'evidence.yaml');
    const spec = s.column.material.fy.kind === 'random' ? s.column.material.fy.spec : undefined;
    expect(spec?.dist).toBe('lognormal');
    const zeta2 = Math.log1p(0.07 ** 2);
    const lnMean = [312, 298, 331].reduce((a, v) => a + Math.log(v * 1e6), 0) / 3;
    // 5 % fractile exp(m_y − 1.645 ζ √(1 + 1/n))
    const x05 = makeDistribution(spec!).quantile(0.05);
    expect(Math.abs(x05 / Math.exp(lnMean - 1.6448536269514722 * Math.sqrt(zeta2 * (1 + 1 / 3))) - 1)).toBeLessThan(1e-12);
  });

  it.each([
    ['{tests: [312 MPa, 298 MPa]}', 'column.material.fy.evidence', /at least 3/],
    ['{tests: [312 MPa, 298 mm, 305 MPa]}', 'column.material.fy.evidence.tests[1]', /stress|MPa|dimension/i],
    ['{tests: [312 MPa, -298 MPa, 305 MPa]}', 'column.material.fy.evidence.tests[1]', /greater than zero/],
    ['{tests: [312 MPa, 298 MPa, 305 MPa], measurement_sd: 5 MPa, measurement_cov: 0.02}', 'column.material.fy.evidence.measurement_cov', /not both/],
    ['{tests: [312 MPa], tested: this_one}', 'column.material.fy.evidence', /measurement error/],
    ['{tests: [312 MPa, 298 MPa, 305 MPa], tested: this_one, scatter: known, measurement_cov: 0.02}', 'column.material.fy.evidence.scatter', /similar items only/],
    ['{tests: [312 MPa, 298 MPa, 305 MPa], prior_weight: -1}', 'column.material.fy.evidence.prior_weight', />= 0/],
    ['{tests: [300 MPa, 301 MPa, 302 MPa], measurement_sd: 5 MPa}', 'column.material.fy.evidence', /measurement error/],
    ['{tests: []}', 'column.material.fy.evidence.tests', /at least one/],
    ['{tests: [312 MPa, 298 MPa, 305 MPa], scater: known}', 'column.material.fy.evidence.scater', /unknown key 'scater'.*scatter/],
  ])('%s is refused at %s', (evidence, field, message) => {
    const e = inputError(withFy(evidence));
    expect(e.field).toBe(field);
    expect(e.message).toMatch(message);
  });

  it('refuses evidence on a load and on a distribution it cannot update', () => {
    const onLoad = BASE.replace('dead: {dist: normal, mean: 430 kN, cov: 0.10, kind: permanent}', 'dead: {dist: normal, mean: 430 kN, cov: 0.10, kind: permanent, evidence: {tests: [400 kN, 420 kN, 450 kN]}}');
    expect(onLoad).not.toBe(BASE);
    expect(inputError(onLoad).field).toBe('loads.dead.evidence');
    const onGumbel = BASE.replace('imposed: {dist: gumbel, mean: 190 kN, cov: 0.25,', 'imposed: {dist: gumbel, mean: 190 kN, cov: 0.25, evidence: {tests: [1 kN]},');
    expect(inputError(onGumbel).message).toMatch(/unknown key 'evidence'/);
  });
});

describe('evidence through the CLI', () => {
  const dir = mkdtempSync(join(tmpdir(), 'stanchion-evidence-'));

  it('assess lists each updated variable before and after, and result.json carries them', async () => {
    const file = join(dir, 'ok.yaml');
    writeFileSync(file, withFy('{tests: [312 MPa, 298 MPa, 331 MPa, 305 MPa], measurement_sd: 5 MPa}'));
    const r = await runCli(['assess', file, '--methods', 'form', '--json']);
    expect(r.status).toBe(0);
    const doc = JSON.parse(r.stdout) as { evidence: { variable: string; tests: number[]; prior: { fractile_05: number }; posterior: { dist: string; dof: number; fractile_05: number } }[] };
    expect(doc.evidence).toHaveLength(1);
    expect(doc.evidence[0].variable).toBe('column.material.fy');
    expect(doc.evidence[0].posterior).toMatchObject({ dist: 'logstudentt', dof: 3 });
    const text = await runCli(['assess', file, '--methods', 'form']);
    expect(text.stdout).toMatch(/yield strength\s+4\s+before\s+lognormal/);
    expect(text.stdout).toMatch(/after\s+log-Student-t \(ν = 3\)/);
  });

  it('bad evidence: exit 2, one message naming the field, nothing written', async () => {
    const file = join(dir, 'bad.yaml');
    writeFileSync(file, withFy('{tests: [312 MPa, 298 MPa]}'));
    const out = join(dir, 'out');
    const r = await runCli(['assess', file, '--methods', 'form', '--out', out]);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/column\.material\.fy\.evidence/);
    expect(r.stderr).not.toMatch(/\n\s+at /); // no stack trace
    expect(existsSync(out)).toBe(false);
  });
});
