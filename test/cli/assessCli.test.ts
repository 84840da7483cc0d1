import { describe, expect, it } from 'vitest';
import { existsSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli, runCliOnText } from './runCli.js';

// Checks of docs/json-output.md (common practice for a CLI: one JSON document on stdout).
describe('stanchion assess (end to end)', () => {
  it('prints the contract JSON; importance sums to 1; tornado sorted by swing', async () => {
    const r = await runCli(['assess', 'scenarios/braced-base-plate.yaml', '--json', '--methods', 'form,sorm,mc', '--samples', '50000', '--seed', '3']);
    expect(r.status, r.stderr).toBe(0);
    const doc = JSON.parse(r.stdout);
    expect(Object.keys(doc.reliability)).toEqual(expect.arrayContaining(['form', 'sorm', 'mc']));
    expect(doc.reliability.is).toBeUndefined(); // only the methods that ran appear
    const f = doc.reliability.form;
    expect(f.converged).toBe(true);
    const sum = Object.values(f.importance as Record<string, number>).reduce((a, b) => a + b, 0);
    expect(sum).toBeCloseTo(1, 10);
    expect(f.design_point).toHaveProperty('loads.dead');
    expect(f.design_point['column.material.E']).toBeGreaterThan(1e9); // physical units: Pa
    const mc = doc.reliability.mc;
    expect(mc.samples).toBe(50000);
    expect(mc.ci95[0]).toBeLessThanOrEqual(mc.pf);
    expect(mc.ci95[1]).toBeGreaterThanOrEqual(mc.pf);
    const swings = doc.sensitivity.tornado.map((t: { low: number; high: number }) => Math.abs(t.high - t.low));
    expect(swings).toEqual([...swings].sort((a: number, b: number) => b - a));
    expect(doc.sensitivity.tornado).toHaveLength(Object.keys(f.importance).length);
    expect(doc.meta.seed).toBe(3);
    expect(doc.meta.scenario_sha256).toMatch(/^[0-9a-f]{64}$/);
    expect(doc.restraint.required.bottom).toBeGreaterThan(0);
    // docs/json-output.md: reliability.by_strength_model [{strength, beta, model_factor: {mean, cov}}]
    const rows = doc.reliability.by_strength_model as { strength: string; beta: number; model_factor: { mean: number; cov: number } }[];
    expect(rows.map((m) => m.strength)).toContain('first-yield');
    for (const m of rows) expect(Object.keys(m)).toEqual(expect.arrayContaining(['strength', 'beta', 'model_factor']));
    expect(rows.find((m) => m.strength === 'first-yield')!.beta).toBe(f.beta);
    expect(doc.reliability.model_factor.source).toBe('scenario');
    expect(f.characteristic['loads.imposed'].fractile).toBe(0.95); // EN 1990 4.1.2
    expect(f.partial_factors['loads.imposed'].gamma).toBeGreaterThan(1);
  });

  it('the same seed gives the same numbers with 1 and 2 workers', async () => {
    const args = ['assess', 'scenarios/sway-canopy-post.yaml', '--json', '--methods', 'mc', '--samples', '40000', '--seed', '9'];
    const one = JSON.parse((await runCli([...args, '--workers', '1'])).stdout);
    const two = JSON.parse((await runCli([...args, '--workers', '2'])).stdout);
    expect(two.reliability.mc).toEqual({ ...one.reliability.mc, workers: 2 });
  });

  it('--out writes the report and refuses an existing folder without --force', async () => {
    const dir = join(mkdtempSync(join(tmpdir(), 'stanchion-')), 'report');
    const r = await runCli(['assess', 'scenarios/sway-canopy-post.yaml', '--methods', 'form,sorm', '--out', dir]);
    expect(r.status, r.stderr).toBe(0);
    for (const f of ['report.html', 'result.json', 'summary.md']) expect(existsSync(join(dir, f)), f).toBe(true);
    const result = JSON.parse(readFileSync(join(dir, 'result.json'), 'utf8'));
    expect(result.reliability.form.beta).toBeGreaterThan(0);
    const again = await runCli(['assess', 'scenarios/sway-canopy-post.yaml', '--methods', 'form', '--out', dir]);
    expect(again.status).toBe(2);
    expect(again.stderr).toMatch(/--out/);
  });
});

describe('stanchion restraint (end to end)', () => {
  it('the least stiffness fed back into the scenario gives β = target ± 0.02', async () => {
    // common practice: the study's root, substituted back, must reproduce the target it was solved for
    const r = await runCli(['restraint', 'scenarios/sway-canopy-post.yaml', '--json']);
    expect(r.status, r.stderr).toBe(0);
    const res = JSON.parse(r.stdout).restraint;
    expect(res.ends).toEqual(['bottom']);
    // the FORM root, before the requirement is raised until the governing method confirms it
    const k = (res.required.bottom as number) / (res.verified.raised_by as number);
    expect(k).toBeGreaterThan(0);
    const stiffs = res.curve.map((p: { bottom: number | null }) => p.bottom ?? Infinity);
    expect(stiffs).toEqual([...stiffs].sort((a: number, b: number) => a - b));
    const text = readFileSync('scenarios/sway-canopy-post.yaml', 'utf8').replace(
      /bottom: \{rotation: \{dist: lognormal, mean: [^,]+, cov: 0.4\}\}/,
      `bottom: {rotation: {dist: lognormal, mean: ${k} N m/rad, cov: 0.4}}`,
    );
    const a = await runCliOnText(['assess', '-', '--json', '--methods', 'form'], text);
    expect(a.status, a.stderr).toBe(0);
    expect(Math.abs(JSON.parse(a.stdout).reliability.form.beta - res.target_beta)).toBeLessThan(0.02);
  });
});

describe('assess --studies and meta.calls (end to end)', () => {
  it('--no-studies: the methods only, every call listed in meta.calls; a bad study name exits 2 naming --studies', async () => {
    const r = await runCli(['assess', 'scenarios/braced-base-plate.yaml', '--json', '--methods', 'form,is', '--no-studies', '--target-cov', '0.1']);
    expect(r.status).toBe(0);
    const j = JSON.parse(r.stdout);
    expect(j.meta.studies).toEqual([]);
    expect(j.sensitivity.tornado).toBeUndefined();
    expect(j.restraint).toBeUndefined();
    // common practice: the calls each method reports are the calls listed
    expect(j.meta.calls.form).toBe(j.reliability.form.calls);
    expect(j.meta.calls.is).toBe(j.reliability.is.calls);
    expect(j.reliability.is.cov).toBeLessThanOrEqual(0.1);
    const bad = await runCli(['assess', 'scenarios/braced-base-plate.yaml', '--studies', 'tornado,magic']);
    expect(bad.status).toBe(2);
    expect(bad.stderr).toMatch(/--studies.*unknown study 'magic'/);
    expect(bad.stderr.trim().split('\n')).toHaveLength(1);
  });
});

describe('assess: the default studies follow --methods (end to end)', () => {
  it('--methods mc skips the FORM and costly studies with one line; --studies wins; the scenario default keeps all', async () => {
    const base = ['assess', 'scenarios/braced-base-plate.yaml', '--json', '--samples', '2000', '--seed', '5'];
    const mc = await runCli([...base, '--methods', 'mc']);
    expect(mc.status, mc.stderr).toBe(0);
    const j = JSON.parse(mc.stdout);
    expect(j.meta.studies).toEqual(['tornado']);
    expect(j.meta.calls.sobol).toBeUndefined();
    expect(j.restraint).toBeUndefined();
    const lines = mc.stderr.split('\n').filter((l) => l.includes('were skipped'));
    expect(lines).toHaveLength(1);
    expect(lines[0]).toContain('--studies');
    const wins = await runCli([...base, '--methods', 'mc', '--studies', 'tornado,sobol']);
    expect(wins.status, wins.stderr).toBe(0);
    expect(JSON.parse(wins.stdout).meta.studies).toEqual(['tornado', 'sobol']);
    expect(wins.stderr).not.toContain('were skipped');
  });
});
