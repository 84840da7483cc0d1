import { describe, expect, it } from 'vitest';
import { existsSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from './runCli.js';

// CLI behaviour checks (common practice): --out writes a complete report for restraint and sweep too.
describe('reports from restraint and sweep', () => {
  it('restraint --out writes the report; the deterministic K needs no more restraint than the random one', async () => {
    const dir = join(mkdtempSync(join(tmpdir(), 'stanchion-')), 'restraint');
    const r = await runCli(['restraint', 'scenarios/sway-canopy-post.yaml', '--json', '--out', dir]);
    expect(r.status, r.stderr).toBe(0);
    const res = JSON.parse(r.stdout).restraint;
    // common practice: springs known exactly (no scatter) reach the same target with less mean
    // stiffness, so their effective length factor is at least the one at the required mean stiffness
    expect(res.effective_length_factor_deterministic).toBeGreaterThanOrEqual(res.effective_length_factor);
    expect(res.sentence).toMatch(/if the stiffness were known exactly \(this scenario's statistics and strength model\); not a partial-factor code check/);
    expect(res.sentence).not.toMatch(/may use/);
    for (const f of ['report.html', 'result.json', 'restraint-curve.csv', 'charts/restraint-curve.svg']) {
      expect(existsSync(join(dir, f)), f).toBe(true);
    }
    expect(readFileSync(join(dir, 'report.html'), 'utf8')).toMatch(/Restraint justification/);
  });

  it('a finished sweep writes OUT/report with the sweep chart, values converted to SI', async () => {
    const out = join(mkdtempSync(join(tmpdir(), 'stanchion-')), 'sweep');
    const r = await runCli([
      'sweep',
      'scenarios/braced-base-plate.yaml',
      '--vary',
      'column.length=4000 mm:6000 mm:3',
      '--out',
      out,
      '--json',
    ]);
    expect(r.status, r.stderr).toBe(0);
    const doc = JSON.parse(r.stdout).sweep;
    expect(doc.report).toBe(join(out, 'report', 'report.html'));
    expect(existsSync(join(out, 'report', 'charts', 'sweep.svg'))).toBe(true);
    const html = readFileSync(join(out, 'report', 'report.html'), 'utf8');
    expect(html).toMatch(/Parameter sweep/);
    // 4000 mm is shown as 4 m: the swept strings were read as quantities, not as bare numbers
    const svg = readFileSync(join(out, 'report', 'charts', 'sweep.svg'), 'utf8');
    expect(svg).toMatch(/>4<\/text>|>4\.0<\/text>/);
  });
});
