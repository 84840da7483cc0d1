import { describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from './runCli.js';

// The demo scenario with its bow made of unknown sign (mean 0, sd L/1000); invented data.
function symmetricBowScenario(): string {
  const text = readFileSync('scenarios/braced-base-plate.yaml', 'utf8')
    .replace(/bow: \{dist: normal, mean: L\/1500, sd: L\/3000\}/, 'bow: {dist: normal, mean: 0 mm, sd: L/1000}');
  expect(text).toMatch(/mean: 0 mm, sd: L\/1000/);
  const dir = mkdtempSync(join(tmpdir(), 'stanchion-bow-'));
  const file = join(dir, 'symmetric-bow.yaml');
  writeFileSync(file, text);
  return file;
}

describe('assess --methods form,sorm on a bow of unknown sign', () => {
  const file = symmetricBowScenario();

  it('does not say MEETS (Monte Carlo puts β near 3.3, below the target 3.8)', async () => {
    const r = await runCli(['assess', file, '--methods', 'form,sorm', '--json']);
    expect(r.status, r.stderr).toBe(0);
    const rel = JSON.parse(r.stdout).reliability;
    // common practice: the MC reference of test/studies/symmetricBow.test.ts (β ≈ 3.3 with 400 000 samples)
    expect(rel.meets_target).toBe(false);
    expect(rel.governing.beta).toBeLessThan(3.5);
    expect(rel.governing.beta).toBeGreaterThan(3.1);
    expect(rel.form.system.design_points.length).toBeGreaterThanOrEqual(2);
    expect(rel.form.doubtful_directions).toContain('column.imperfection.bow');
    expect(rel.form.check.agrees).toBe(true);
    expect(rel.form.beta).toBeGreaterThan(rel.form.system.beta); // contract keys stay those of the governing point
  });
});
