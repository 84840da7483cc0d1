/**
 * The restraint study about either principal axis: the ends about the governing axis are varied,
 * β is the whole column's (min over both axes), and the other axis alone may cap it.
 * Scenarios are invented; the checks are identities of the method, not outside values (common practice).
 */
import { describe, expect, it } from 'vitest';
import { buildColumnModel } from '../../src/limitState/columnModel.js';
import { withEndStiffness } from '../../src/limitState/scenarioEdits.js';
import { loadScenario } from '../../src/scenario/loadScenario.js';
import type { Scenario } from '../../src/scenario/types.js';
import { scenarioForm } from '../../src/studies/columnForm.js';
import { columnRestraint, restraintAxis, restraintJson, studiedEnds } from '../../src/studies/columnRestraint.js';

/** Invented two-axis column: stiff about y, weak and nearly pinned about z. */
function twoAxes(zTop = 'pinned'): string {
  return `stanchion: 1
title: two-axis test column
column:
  length: 4.5 m
  frame: braced
  section: {area: 5380 mm^2, inertia: 36.9e6 mm^4, section_modulus: 389e3 mm^3, inertia_z: 13.4e6 mm^4, section_modulus_z: 134e3 mm^3}
  material:
    E: {dist: lognormal, mean: 205 GPa, cov: 0.03}
    fy: {dist: lognormal, mean: 290 MPa, cov: 0.07}
  ends:
    bottom: {rotation: {dist: lognormal, mean: 3 MN m/rad, cov: 0.4}}
    top: {rotation: {dist: lognormal, mean: 0.5 MN m/rad, cov: 0.5}}
  axis_z:
    ends:
      bottom: {rotation: {dist: lognormal, mean: 0.1 MN m/rad, cov: 0.5}}
      top: ${zTop}
    curve: c
loads:
  dead: {dist: normal, mean: 500 kN, cov: 0.1}
  imposed: {dist: gumbel, mean: 90 kN, cov: 0.25}
model_factor: {dist: lognormal, mean: 1.0, cov: 0.05}
strength: en1993-b
target_beta: 3.8
analysis: {seed: 7}
`;
}

const load = (text: string): Scenario => loadScenario(text, 'test.yaml');
const FAST = { method: 'form' as const, maps: false };

describe('restraint about the governing axis z', () => {
  const s = load(twoAxes());

  it('chooses z by the lower β of each axis alone, and studies the z ends given as springs', () => {
    const c = restraintAxis(s);
    expect(c.axis).toBe('z');
    expect(c.basis).toBe('governing');
    expect(c.betaAlone!.z).toBeLessThan(c.betaAlone!.y);
    expect(c.betaAlone!.z).toBeLessThan(3.8);
    expect(c.betaAlone!.y).toBeGreaterThan(3.8);
    expect(studiedEnds(s, undefined, 'z')).toEqual(['bottom']);
    expect(studiedEnds(s, undefined, 'y')).toEqual(['bottom', 'top']);
  });

  it('finds the stiffness about z at which the whole column reaches the target', async () => {
    const r = await columnRestraint(s, FAST);
    expect(r.axis?.axis).toBe('z');
    expect(r.study.outcome).toBe('reached');
    const k = r.study.required.bottom as number;
    expect(k).toBeGreaterThan(1e5); // more than assumed: β about z alone is short of the target
    // the root, re-evaluated independently: the z bottom spring at k, CoV kept, whole-column FORM β = target
    const at = withEndStiffness(s, 'bottom', s.column.axisZ!.ends.bottom.type === 'rotation' ? s.column.axisZ!.ends.bottom.k : { kind: 'fixed', value: 0 }, k / 1e5, 'z');
    expect(scenarioForm(at).beta).toBeCloseTo(3.8, 3);
    // the y ends were not touched
    expect(at.column.ends).toEqual(s.column.ends);
    // the other axis's own β is reported and does not cap the target
    expect(r.axis!.other).toMatchObject({ axis: 'y', capsTarget: false });
    expect(r.axis!.other.beta).toBeCloseTo(scenarioForm(s, 'y').beta, 10);
    expect(r.sentence).toMatch(/The requirement is about axis z \(the governing axis/);
    expect(r.sentence).toMatch(/Axis y alone has β = \d\.\d\d whatever the stiffness about z/);
    const json = restraintJson(r);
    expect(json.axis).toBe('z');
    expect(json.other_axis).toMatchObject({ axis: 'y', caps_target: false });
  }, 30_000);

  it('uses E·I_z in R = kL/EI: the fixity factor at the requirement (Monforton and Wu 1963: R/(R+3))', async () => {
    const r = await columnRestraint(s, FAST);
    const k = r.study.required.bottom as number;
    const st = buildColumnModel(s).axes[1].state(buildColumnModel(s).mean);
    const R = (k * s.column.length) / (st.E * st.I);
    expect(st.I).toBeCloseTo(13.4e-6, 12);
    expect(r.fixityAtRequired.bottom).toBeCloseTo(R / (R + 3), 10);
    // an end about z given as pinned is studied from E·I_z / L
    const both = await columnRestraint(s, { ...FAST, end: 'both' });
    expect(both.base.top).toEqual({ kind: 'fixed', value: (st.E * st.I) / s.column.length });
    expect(both.notes.join(' ')).toMatch(/top end about z is given as pinned; .* EI_z\/L/);
  }, 30_000);

  it('the requirement moves with the z ends: a top spring about z lowers what the bottom needs', async () => {
    const pinnedTop = await columnRestraint(s, FAST);
    const sprung = await columnRestraint(load(twoAxes('{rotation: {dist: lognormal, mean: 0.4 MN m/rad, cov: 0.5}}')), { ...FAST, end: 'bottom' });
    expect(sprung.axis?.axis).toBe('z');
    expect(sprung.study.required.bottom as number).toBeLessThan(pinnedTop.study.required.bottom as number);
  }, 30_000);

  it('the joint classes are those of the ends about z', async () => {
    const r = await columnRestraint(s, FAST);
    const classes = r.axis!.jointClasses;
    expect(classes.map((c) => c.end)).toEqual(['bottom', 'top']);
    expect(classes[0].stiffnessMean).toBeCloseTo(1e5, 3);
    expect(classes[1].rule).toBe('given');
  }, 30_000);
});

describe('the other axis caps β', () => {
  it('studied about y while z alone falls short: no stiffness about y reaches the target, and it says why', async () => {
    const s = load(twoAxes());
    const r = await columnRestraint(s, { ...FAST, axis: 'y' });
    expect(r.axis).toMatchObject({ axis: 'y', basis: 'asked' });
    expect(r.axis!.other.capsTarget).toBe(true);
    expect(r.study.outcome).toBe('unreachable');
    // with rigid ends about y the column is no better than axis z alone
    expect(r.study.fixed.beta).toBeLessThanOrEqual(r.axis!.other.beta + 1e-3);
    expect(r.sentence).toMatch(/No stiffness about y reaches the target because axis z alone has β = \d\.\d\d < 3\.80/);
    expect(restraintJson(r).other_axis).toMatchObject({ axis: 'z', caps_target: true });
  }, 30_000);
});

describe('one axis: nothing changes', () => {
  const one = twoAxes().replace(/ {2}axis_z:\n(?: {4}.*\n)+/, '').replace(/, inertia_z: [^,]+, section_modulus_z: [^}]+/, '');

  it('a one-axis column has no axis facts, no axis keys, and refuses an axis z', async () => {
    const s = load(one);
    expect(s.column.axisZ).toBeUndefined();
    const r = await columnRestraint(s, FAST);
    expect(r.axis).toBeUndefined();
    expect(Object.keys(restraintJson(r)).filter((k) => k.includes('axis'))).toEqual([]);
    expect(() => restraintAxis(s, 'z')).toThrow(/one axis/);
  }, 30_000);

  it('a z axis that never governs (I_z = I_y, the same curve, rigid z ends) leaves the study about y bit for bit the same', async () => {
    // capacity about z ≥ about y at every x (K_z = 0.5 ≤ K_y), so min over the axes is the y capacity exactly
    const same = twoAxes('fixed').replace('    curve: c\n', '').replace('inertia_z: 13.4e6 mm^4, section_modulus_z: 134e3 mm^3', 'inertia_z: 36.9e6 mm^4, section_modulus_z: 389e3 mm^3')
      .replace('bottom: {rotation: {dist: lognormal, mean: 0.1 MN m/rad, cov: 0.5}}', 'bottom: fixed');
    const a = await columnRestraint(load(one), FAST);
    const b = await columnRestraint(load(same), FAST);
    expect(b.axis?.axis).toBe('y');
    expect(b.study.required).toEqual(a.study.required);
    expect(b.study.curve.map((p) => p.beta)).toEqual(a.study.curve.map((p) => p.beta));
  }, 30_000);
});
