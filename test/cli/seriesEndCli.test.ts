import { describe, expect, it } from 'vitest';
import { runCliOnText } from './runCli.js';

function scenario(bottom: string): string {
  return `stanchion: 1
title: series end on the command line
column:
  length: 5.6 m
  frame: braced
  section: {area: 6640 mm^2, inertia: 15.4e6 mm^4, section_modulus: 152e3 mm^3}
  material: {E: 200 GPa, fy: {dist: lognormal, mean: 300 MPa, cov: 0.07}}
  ends:
    bottom:
${bottom}
    top:
      series: {connection: 900 kN m/rad, beam: rigid}
  imperfection: {bow: L/1000}
loads:
  dead: {dist: normal, mean: 900 kN, cov: 0.10, kind: permanent}
model_factor: 1.0
strength: first-yield
target_beta: 3.8
analysis: {seed: 7}
`;
}
const GOOD = `      series:
        connection: {dist: lognormal, mean: 2.5 MN m/rad, cov: 0.4}
        foundation: {dist: lognormal, mean: 8 MN m/rad, cov: 0.5}`;

describe('series end springs (end to end)', () => {
  it('assess: each component is a variable with an importance factor; connection moments use the effective k', async () => {
    const r = await runCliOnText(['assess', '-', '--json', '--methods', 'form,sorm', '--no-studies'], scenario(GOOD));
    expect(r.status, r.stderr).toBe(0);
    const d = JSON.parse(r.stdout);
    const importance = d.reliability.form.importance;
    expect(importance).toHaveProperty(['column.ends.bottom.series.connection']);
    expect(importance).toHaveProperty(['column.ends.bottom.series.foundation']);
    expect(Number.isFinite(d.reliability.form.beta)).toBe(true);
    // hand value, springs in series (common practice): k = 1/(1/2.5 + 1/8) MN·m/rad; R = k·5.6 m / (200 GPa × 15.4e6 mm⁴) = 3.4632035
    expect(d.check.restraint_ratio.bottom).toBeCloseTo(3.4632035, 6);
    const k = 1 / (1 / 2.5e6 + 1 / 8e6);
    expect(d.check.connection_moments.bottom).toBeCloseTo(k * d.check.connection_rotations.bottom, 6); // M = k·θ
    expect(d.check.series_springs.bottom.effective_stiffness).toBeCloseTo(k, 3);
  });

  it('check prints the components and the effective stiffness', async () => {
    const r = await runCliOnText(['check', '-'], scenario(GOOD));
    expect(r.status, r.stderr).toBe(0);
    expect(r.stdout).toMatch(/bottom end, springs in series .*connection 2500 kN·m\/rad \(mean\) \+ foundation 8000 kN·m\/rad \(mean\) → effective k = 1905 kN·m\/rad/);
    expect(r.stdout).toMatch(/top end, springs in series .*connection 900 kN·m\/rad \+ beam rigid → effective k = 900 kN·m\/rad/);
  });

  it.each([
    ['a negative mean', '      series: {connection: 2.5 MN m/rad, foundation: {dist: normal, mean: -8 MN m/rad, sd: 1 MN m/rad}}', 'column.ends.bottom.series.foundation'],
    ['a normal spring reaching below zero', '      series: {connection: {dist: normal, mean: 2.5 MN m/rad, cov: 0.4}}', 'column.ends.bottom.series.connection'],
    ['a word other than rigid', '      series: {connection: stiff}', 'column.ends.bottom.series.connection'],
    ['a force instead of a stiffness', '      series: {connection: 25 kN}', 'column.ends.bottom.series.connection'],
    ['no component', '      series: {}', 'column.ends.bottom.series'],
    ['a bad component name', "      series: {'2nd plate': 3 MN m/rad}", 'column.ends.bottom.series.2nd plate'],
  ])('refuses %s: exit 2 naming the field, nothing on stdout', async (_what, bottom, field) => {
    const r = await runCliOnText(['check', '-', '--json'], scenario(bottom));
    expect(r.status, r.stderr).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toContain(field);
    expect(r.stderr).not.toMatch(/\n\s+at /); // no stack trace
  });
});
