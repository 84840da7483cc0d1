// Every command ends with its one-line result; `report written to …` comes last, with a path
// relative to the working folder, after a line saying the report is being written.
import { afterAll, describe, expect, it } from 'vitest';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { basename, join } from 'node:path';
// The first run is the real executable (its launcher passes the command thread's streams on in
// order); the others check what the program itself prints, in this process.
import { ROOT, runCli, runCliProcess } from './runCli.js';

const lastLine = (s: string) => s.trimEnd().split('\n').pop() ?? '';
const scratch = mkdtempSync(join(ROOT, 'result-lines-test-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe('the last line of each command', () => {
  it('assess: the verdict last on stdout, then the report path, relative, last on stderr', () => {
    const out = join(scratch, 'assess');
    const r = runCliProcess(['assess', 'scenarios/braced-base-plate.yaml', '--methods', 'form,sorm', '--out', out]);
    expect(r.status, r.stderr).toBe(0);
    expect(lastLine(r.stdout)).toMatch(/^result: β = \d\.\d\d \((FORM|SORM)[^)]*\) against β = 3\.80 over 50 years \(EN 1990 Annex B\): (MEETS the target|FALLS SHORT of the target by Δβ = \d\.\d\d)$/);
    // the result also leads the summary
    expect(r.stdout.split('\n')[1].trim()).toBe(lastLine(r.stdout));
    const err = r.stderr.trimEnd().split('\n');
    expect(err[err.length - 1]).toBe(`stanchion: report written to ${basename(scratch)}/assess/report.html (${err[err.length - 1].match(/\((\d+) files\)/)?.[1]} files)`);
    expect(err[err.length - 2]).toBe('stanchion: writing the report …');
    expect(existsSync(join(out, 'report.html'))).toBe(true);
  });

  it('assess: Monte Carlo without failure states a bound, never β ∞', async () => {
    // β ≈ 3.9 for this scenario: 2000 samples (pf ≈ 5×10⁻⁵) almost surely see no failure
    const r = await runCli(['assess', 'scenarios/braced-base-plate.yaml', '--methods', 'mc', '--samples', '2000']);
    expect(r.status, r.stderr).toBe(0);
    // source: exact binomial bound 1 − 0.05^(1/2000) = 1.50×10⁻³ (Clopper & Pearson 1934), β = 2.97
    expect(r.stdout).toMatch(/Monte Carlo\s+> 2\.97\s+< 1\.5×10⁻³/);
    expect(lastLine(r.stdout)).toContain('result: β > 2.97 (Monte Carlo)');
    expect(lastLine(r.stdout)).toContain('NOT SHOWN to meet the target');
    expect(r.stdout).not.toContain('∞');
  });

  it('check: a mean-value ratio, said not to be a design check', async () => {
    const r = await runCli(['check', 'scenarios/braced-base-plate.yaml']);
    expect(r.status, r.stderr).toBe(0);
    expect(lastLine(r.stdout)).toMatch(/^result: mean-value ratio \d\.\d{3} \(demand \/ resistance at the means; not a design check/);
    expect(r.stdout).not.toMatch(/^\s*utilization\b/m);
  });

  it('restraint: the least stiffness for the target', async () => {
    const r = await runCli(['restraint', 'scenarios/braced-base-plate.yaml', '--end', 'bottom']);
    expect(r.status, r.stderr).toBe(0);
    expect(lastLine(r.stdout)).toMatch(/^result: for the target β = 3\.80 the mean rotational stiffness must be bottom (at least \d+ kN·m\/rad|: not reachable)/);
  });
});
