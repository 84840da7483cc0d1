import { describe, expect, it } from 'vitest';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { ROOT, runCli, runCliOnText } from './runCli.js';

const scenarios = readdirSync(join(ROOT, 'scenarios')).filter((f) => /\.ya?ml$/.test(f) && !f.startsWith('sweep'));

describe('stanchion check (end to end)', () => {
  it.each(scenarios)('%s: contract JSON with finite numbers', async (file) => {
    const r = await runCli(['check', join('scenarios', file), '--json']);
    expect(r.status, r.stderr).toBe(0);
    const doc = JSON.parse(r.stdout); // exactly one JSON document on stdout (docs/json-output.md)
    const c = doc.check;
    for (const key of ['critical_load', 'effective_length_factor', 'capacity', 'demand', 'utilization']) {
      expect(Number.isFinite(c[key]), key).toBe(true);
    }
    expect(c.utilization).toBeCloseTo(c.demand / (c.model_factor * c.capacity), 12);
    // K = π / (L √(Pcr/EI)) is between the ideal bounds: common practice (braced 0.5–1, sway ≥ 1)
    expect(c.effective_length_factor).toBeGreaterThanOrEqual(0.5);
    expect(c).toHaveProperty('restraint_ratio.bottom');
    expect(c).toHaveProperty('restraint_ratio.top');
  });

  it('reads the scenario from stdin with -', async () => {
    const text = readFileSync(join(ROOT, 'scenarios', 'braced-base-plate.yaml'), 'utf8');
    const fromFile = await runCli(['check', 'scenarios/braced-base-plate.yaml', '--json']);
    const fromStdin = await runCli(['check', '-', '--json'], text);
    expect(fromStdin.status, fromStdin.stderr).toBe(0);
    expect(JSON.parse(fromStdin.stdout)).toEqual(JSON.parse(fromFile.stdout));
  });

  it('a fixed-fixed column with every value fixed buckles at 4π²EI/L² (K = 0.5)', async () => {
    // source: Timoshenko & Gere, Theory of Elastic Stability, 1961, ch. 2 (from memory): fixed–fixed Pcr = 4π²EI/L²
    const yaml = `stanchion: 1
title: fixed-fixed oracle
column:
  length: 4 m
  frame: braced
  section: {area: 5000 mm^2, inertia: 20e6 mm^4, section_modulus: 200e3 mm^3}
  material: {E: 200 GPa, fy: 275 MPa}
  ends: {bottom: fixed, top: fixed}
  imperfection: {bow: 4 mm}
loads: {dead: 500 kN}
strength: first-yield
`;
    const r = await runCliOnText(['check', '-', '--json'], yaml);
    expect(r.status, r.stderr).toBe(0);
    const c = JSON.parse(r.stdout).check;
    const EI = 200e9 * 20e-6;
    expect(c.critical_load / ((4 * Math.PI ** 2 * EI) / 16)).toBeCloseTo(1, 9);
    expect(c.effective_length_factor).toBeCloseTo(0.5, 9);
    expect(c.restraint_ratio).toEqual({ bottom: null, top: null }); // docs/json-output.md: fixed → null
    // source: docs/verification.md §M4 worked example 3 (Perry–Robertson with c = 1/2, Ayrton & Perry 1886): 1300.13 kN
    expect(c.capacity / 1e3).toBeCloseTo(1300.13, 1);
  });

  it('human output names the quantities with units and ends with the caution', async () => {
    const r = await runCli(['check', 'scenarios/sway-canopy-post.yaml']);
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/critical load Pcr\s+[\d.]+ kN/);
    expect(r.stdout).toMatch(/licensed engineer/); // common practice: every output carries the caution
  });
});

describe('bad input: one line naming the field, exit 2, no stack trace', () => {
  const bad: [string, string, RegExp][] = [
    ['unknown key', 'colum: {}', /colum/],
  ];
  const base = readFileSync(join(ROOT, 'scenarios', 'braced-base-plate.yaml'), 'utf8');

  it('a wrong dimension for E', async () => {
    const text = base.replace('E: {dist: lognormal, mean: 200 GPa, cov: 0.03}', 'E: 4 m');
    const r = await runCliOnText(['check', '-'], text);
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/column\.material\.E/);
    expect(r.stderr).not.toMatch(/\bat .*\.js:\d+/);
  });

  it('a missing file, an unknown option and an unknown method', async () => {
    for (const args of [
      ['check', 'no/such/file.yaml'],
      ['check', 'scenarios/braced-base-plate.yaml', '--frobnicate'],
      ['assess', 'scenarios/braced-base-plate.yaml', '--methods', 'form,magic'],
      ['assess', 'scenarios/braced-base-plate.yaml', '--samples', '-5'],
    ]) {
      const r = await runCli(args);
      expect(r.status, args.join(' ')).toBe(2);
      expect(r.stderr).not.toMatch(/\bat .*\.js:\d+/);
    }
  });

  it.each(bad)('%s is reported plainly', async (_name, snippet, field) => {
    const r = await runCli(['check', '-'], `stanchion: 1\n${snippet}\n`);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(field);
  });
});
