/**
 * Inputs that once ended in "internal error" (exit 1): each now ends in a result (exit 0) or an
 * input error naming the field (exit 2). Scenario numbers are invented; the checks are about the
 * outcome class, plus a few facts of the mechanics marked with their source.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
// In this process: the outcome class (result, input error, internal error) is decided by the
// program, not by the executable around it; the executable's own exit codes and stdin are
// checked by optionRefusals, seriesEndCli and newCommand.
import { runCli } from './runCli.js';

const scratch = mkdtempSync(join(tmpdir(), 'stanchion-outcomes-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));
let written = 0;

/** The command on the scenario text, given as a file of its own in place of `-`. */
function runOn(args: string[], text: string) {
  const file = join(scratch, `scenario-${written++}.yaml`);
  writeFileSync(file, text);
  return runCli(args.map((a) => (a === '-' ? file : a)));
}

function scenario(frame: 'braced' | 'sway', E: string, bottom: string, top: string, dead = '{dist: normal, mean: 300 kN, cov: 0.10}'): string {
  return `stanchion: 1
title: invented outcome check
column:
  length: 4 m
  frame: ${frame}
  section: {area: 6640 mm^2, inertia: 15.4e6 mm^4, section_modulus: 152e3 mm^3}
  material:
    E: ${E}
    fy: {dist: lognormal, mean: 300 MPa, cov: 0.07}
  ends:
    bottom: ${bottom}
    top: ${top}
  imperfection: {bow: L/1000}
loads:
  dead: ${dead}
strength: first-yield
`;
}

function assess(text: string, methods = 'form,mc') {
  return runOn(['assess', '-', '--methods', methods, '--samples', '2000', '--json'], text);
}

describe('no valid input ends in an internal error', () => {
  it('a uniform fixity factor inside [0, 1] is assessed by FORM and Monte Carlo', async () => {
    const r = await assess(scenario('braced', '200 GPa', '{fixity: {dist: uniform, min: 0.45, max: 0.75}}', 'pinned'));
    expect(r.status, r.stderr).toBe(0);
    const doc = JSON.parse(r.stdout);
    expect(Number.isFinite(doc.reliability.form.beta)).toBe(true);
  });

  it('fixity factors reaching the bounds 0 (pinned) and 1 (fixed) work in every method', async () => {
    const text = scenario('braced', '200 GPa', '{fixity: {dist: uniform, min: 0, max: 1}}', '{fixity: {dist: beta, min: 0, max: 1, mean: 0.5, sd: 0.2}}', '{dist: normal, mean: 900 kN, cov: 0.10}');
    const r = await assess(text, 'form,sorm,is,mc,subset');
    expect(r.status, r.stderr).toBe(0);
  });

  it.each([
    ['a normal rotational stiffness', scenario('braced', '200 GPa', '{rotation: {dist: normal, mean: 1 MN m/rad, cov: 0.5}}', 'pinned'), 'column.ends.bottom.rotation'],
    ['a normal modulus', scenario('braced', '{dist: normal, mean: 200 GPa, cov: 0.3}', '{rotation: 1 MN m/rad}', 'pinned'), 'column.material.E'],
    ['a gumbel modulus', scenario('braced', '{dist: gumbel, mean: 200 GPa, cov: 0.1}', 'pinned', 'pinned'), 'column.material.E'],
    ['a truncnormal stiffness without min', scenario('braced', '200 GPa', '{rotation: {dist: truncnormal, mean: 1 MN m/rad, sd: 0.5 MN m/rad, max: 3 MN m/rad}}', 'pinned'), 'column.ends.bottom.rotation'],
  ])('%s is refused with exit 2, naming the field and the remedy', async (_label, text, field) => {
    const r = await assess(text);
    expect(r.status).toBe(2);
    expect(r.stderr).toContain(field);
    expect(r.stderr).toContain('lognormal');
    expect(r.stdout).toBe('');
  });

  it('a fixity factor whose distribution leaves [0, 1] is refused with exit 2', async () => {
    const r = await assess(scenario('braced', '200 GPa', '{fixity: {dist: uniform, min: 0.5, max: 1.2}}', 'pinned'));
    expect(r.status).toBe(2);
    expect(r.stderr).toContain('column.ends.bottom.fixity');
  });

  it('a failure that cannot happen is a result: FORM β = +∞ (no design point), Monte Carlo pf = 0', async () => {
    // the load is bounded by its uniform max far below the capacity, which bounded inputs keep high
    const text = `stanchion: 1
title: invented impossible failure
column:
  length: 3 m
  frame: braced
  section: {area: 6640 mm^2, inertia: 15.4e6 mm^4, section_modulus: 152e3 mm^3}
  material: {E: 200 GPa, fy: {dist: uniform, min: 250 MPa, max: 350 MPa}}
  ends: {bottom: fixed, top: pinned}
  imperfection: {bow: L/1000}
loads:
  dead: {dist: uniform, min: 10 kN, max: 20 kN}
model_factor: 1.0
strength: first-yield
`;
    const r = await assess(text, 'form,sorm,is,mc,subset');
    expect(r.status, r.stderr).toBe(0);
    const doc = JSON.parse(r.stdout);
    expect(doc.reliability.form.beta).toBeNull(); // +∞ is written as null (jsonSafe)
    expect(doc.reliability.mc.pf).toBe(0);
    const human = await runOn(['assess', '-', '--methods', 'form,mc', '--samples', '2000'], text);
    expect(human.status, human.stderr).toBe(0);
    expect(human.stdout).toContain('no design point');
  });

  it('a sway column with almost no restraint (G = 1e300) is checked and assessed: Pcr → 0 is a result', async () => {
    const text = scenario('sway', '200 GPa', '{alignment_g: 1e300}', 'pinned');
    const c = await runOn(['check', '-', '--json'], text);
    expect(c.status, c.stderr).toBe(0);
    const check = JSON.parse(c.stdout).check;
    // sway, one end pinned, the other R → 0: φ tan φ = R gives Pcr = R·EI/L² to first order, i.e.
    // R = 6/G (alignment-chart substitution, AISC 360-16 Commentary App. 7, Eq. C-A-7-2; common practice)
    const EI = 200e9 * 15.4e-6;
    expect(check.critical_load / ((6e-300 * EI) / 16)).toBeCloseTo(1, 6);
    const r = await assess(text, 'form,mc');
    expect(r.status, r.stderr).toBe(0);
    expect(JSON.parse(r.stdout).reliability.mc.pf).toBe(1);
  });

  it('the sensitivity studies never move a bounded distribution out of its domain (uniform stiffness, fixity and G from 0)', async () => {
    // the elasticities shift a mean or an sd: a uniform from 0 would reach below 0, which is skipped, not evaluated
    const braced = await assess(scenario('braced', '200 GPa', '{rotation: {dist: uniform, min: 0 kN m/rad, max: 6937 kN m/rad}}', '{fixity: {dist: uniform, min: 0, max: 0.3}}'));
    expect(braced.status, braced.stderr).toBe(0);
    const sway = await assess(scenario('sway', '200 GPa', '{alignment_g: {dist: uniform, min: 0, max: 2}}', 'pinned'));
    expect(sway.status, sway.stderr).toBe(0);
  });

  it('a sway column on a weak lognormal spring (a near-mechanism) is assessed', async () => {
    const r = await assess(scenario('sway', '200 GPa', '{rotation: {dist: lognormal, mean: 1 N m/rad, cov: 0.5}}', 'pinned'));
    expect(r.status, r.stderr).toBe(0);
  });
});

describe('a correlation the marginals cannot carry', () => {
  it('ends in exit 2 naming both variables, not an internal error', async () => {
    // source: Liu & Der Kiureghian 1986 (from memory): lognormals of very different CoV reach only a narrow ρ range
    const text = scenario('braced', '{dist: lognormal, mean: 200 GPa, cov: 0.03}', 'fixed', 'pinned').replace(
      'fy: {dist: lognormal, mean: 300 MPa, cov: 0.07}',
      'fy: {dist: lognormal, mean: 300 MPa, cov: 1.0e9}',
    ) + 'correlation:\n  - [column.material.E, column.material.fy, 0.2]\n';
    const r = await assess(text);
    expect(r.status).toBe(2);
    expect(r.stderr).toContain('column.material.E');
    expect(r.stderr).toContain('column.material.fy');
  });
});
