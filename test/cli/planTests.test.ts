// plan-tests and the evidence of the demo scenario through the command line.
import { describe, expect, it } from 'vitest';
import { mkdtempSync, writeFileSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli, ROOT } from './runCli.js';

const DEMO = 'scenarios/tested-base-plate.yaml';

function scenarioWith(edit: (t: string) => string): string {
  const dir = mkdtempSync(join(tmpdir(), 'stanchion-plans-'));
  const file = join(dir, 'edited.yaml');
  writeFileSync(file, edit(readFileSync(join(ROOT, DEMO), 'utf8')));
  return file;
}

describe('stanchion plan-tests', () => {
  it('ranks the scenario’s plans by the probability of meeting the target (JSON)', async () => {
    const r = await runCli(['plan-tests', DEMO, '--json', '--outcomes', '10']);
    expect(r.status).toBe(0);
    const doc = JSON.parse(r.stdout);
    const plans = doc.test_plans.plans;
    expect(plans).toHaveLength(4);
    // common practice: a ranking is sorted by its first key
    for (let i = 1; i < plans.length; i++) expect(plans[i - 1].probability_meeting_target).toBeGreaterThanOrEqual(plans[i].probability_meeting_target);
    expect(doc.test_plans.survived_loads_included).toBe(true);
  });
  it('refuses a bad --outcomes with exit 2 and names the option', async () => {
    const r = await runCli(['plan-tests', DEMO, '--outcomes', '5']);
    expect(r.status).toBe(2); // common practice: usage errors exit 2
    expect(r.stderr).toMatch(/--outcomes/);
    expect(r.stdout).toBe('');
  });
  it('refuses a plan on a fixed value, naming the field', async () => {
    const file = scenarioWith((t) => t.replace('{variable: column.ends.bottom.rotation, tests: 3, tested: similar}', '{variable: column.section.area, tests: 3, measurement_cov: 0.1}'));
    const r = await runCli(['plan-tests', file]);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/test_plans\[0\]\.variable/);
    expect(r.stderr).toMatch(/fixed/);
    expect(r.stderr.split('\n').filter((l) => l.trim() !== '')).toHaveLength(1);
  });
  it('refuses an unknown evidence type, naming the field', async () => {
    const file = scenarioWith((t) => t.replace('type: survived_load', 'type: survived_lode'));
    const r = await runCli(['check', file]);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/evidence\[0\]/);
    expect(r.stderr).toMatch(/survived_load/);
  });
});

describe('assess with evidence: β before and after', () => {
  it('reports β as written, with the tests and given the survived load', async () => {
    const r = await runCli(['assess', DEMO, '--json', '--methods', 'form', '--no-studies']);
    expect(r.status).toBe(0);
    const m = JSON.parse(r.stdout).measurements;
    // common practice: tests that find a stiffer base, and a survived load, can only raise β here
    expect(m.after_tests.beta).toBeGreaterThan(m.before.beta);
    expect(m.after.beta).toBeGreaterThan(m.after_tests.beta);
    expect(m.survival.model_factor_shared).toBe(true);
    expect(m.survival.mc.samples).toBeGreaterThan(0);
    expect(JSON.parse(r.stdout).test_plans.plans.length).toBe(4);
  });
});
