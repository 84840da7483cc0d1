/**
 * `stanchion restraint` on a scenario with a survived load names the conditioning in its
 * terminal lines and its JSON (docs/evidence.md §8, docs/json-output.md `restraint`); a scenario
 * without one keeps its numbers (test/studies/restraintReference.test.ts).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { runCli, type CliRun } from './runCli.js';

describe('restraint given the survived loads, on the shed demo', () => {
  let text: CliRun;
  let json: CliRun;
  beforeAll(async () => {
    text = await runCli(['restraint', 'scenarios/measured-shed-column.yaml']);
    json = await runCli(['restraint', 'scenarios/measured-shed-column.yaml', '--json']);
  });

  it('the terminal header, sentence, notes and result line say that β is given the survived loads', () => {
    expect(text.status, text.stderr).toBe(0);
    expect(text.stdout).toMatch(/^ {2}FORM β given the survived loads as the mean stiffness of the bottom and top connections is scaled/m);
    expect(text.stdout).toMatch(/The target β = 3\.80 given the survived loads needs/);
    expect(text.stdout).toMatch(/note: every β of this study is given the survived loads \(evidence\[2\]\.load\)/);
    expect(text.stdout).toMatch(/^result: for the target β = 3\.80 given the survived loads the mean rotational stiffness must be bottom at least [\d.]+ kN·m\/rad; top at least [\d.]+ kN·m\/rad$/m);
    expect(text.stdout).toMatch(/Caution: stanchion supports, and does not replace, the judgement of a licensed engineer/);
    // the measurements were applied before the study, the survival conditions it
    expect(text.stderr).toMatch(/measurement\(s\) updated its variables before the study/);
  });

  it('the JSON says so and both outputs state the same requirement', () => {
    expect(json.status, json.stderr).toBe(0);
    const r = JSON.parse(json.stdout).restraint;
    expect(r.conditioned_on_survived_loads).toBe(true);
    expect(r.survived_loads).toEqual(['evidence[2].load']);
    expect(r.checks.map((c: { check_method: string }) => c.check_method)).toContain('importance sampling given the survived loads');
    expect(r.sentence).toMatch(/given the survived loads/);
    const kN = (x: number): string => Math.round(x / 1e3).toString();
    expect(text.stdout).toContain(`bottom at least ${kN(r.required.bottom)} kN·m/rad`);
  });

  it('refuses --method sorm with the field named and exit code 2', async () => {
    const r = await runCli(['restraint', 'scenarios/measured-shed-column.yaml', '--method', 'sorm']);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/--method/);
    expect(r.stderr).toMatch(/expected form or is/);
    expect(r.stderr).not.toMatch(/\n\s+at /);
    expect(r.stdout).toBe('');
  });
});
