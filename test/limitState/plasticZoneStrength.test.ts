import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { buildColumnModel } from '../../src/limitState/columnModel.js';
import { deterministicCheck } from '../../src/limitState/deterministicCheck.js';
import { plasticZoneCapacity } from '../../src/plasticZone/plasticZoneCapacity.js';
import { InputError } from '../../src/scenario/inputError.js';
import { loadScenario } from '../../src/scenario/loadScenario.js';
import { runCliProcess } from '../cli/runCli.js';

const demo = readFileSync(new URL('../../scenarios/braced-base-plate.yaml', import.meta.url), 'utf8');
// the demo's section given by invented plate dimensions close to its stated area and inertia
const SHAPE = '    shape: {type: i, h: 190 mm, b: 190 mm, tw: 9 mm, tf: 14 mm, family: rolled, axis: z}\n';
const withShape = (text: string): string => text.replace(/(    section_modulus: [^\n]*\n)/, `$1${SHAPE}`);
const plastic = (text: string): string => text.replace('strength: first-yield', 'strength: plastic-zone');

function inputError(text: string): InputError {
  try {
    loadScenario(text, 'pz.yaml');
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    return e as InputError;
  }
  throw new Error('expected an InputError');
}

describe('strength: plastic-zone in a scenario', () => {
  it('refuses a scenario without the section by its dimensions, naming the field', () => {
    const e = inputError(plastic(demo));
    expect(e.field).toBe('column.section.shape');
    expect(e.message).toMatch(/plastic-zone needs the section by its dimensions/);
  });

  it('refuses dimensions that do not describe the stated section, or do not fit', () => {
    const wrong = inputError(plastic(withShape(demo)).replace('b: 190 mm, tw', 'b: 300 mm, tw'));
    expect(wrong.field).toBe('column.section.shape');
    expect(wrong.message).toMatch(/column\.section\.(area|inertia)/);
    const thick = inputError(plastic(withShape(demo)).replace('tf: 14 mm', 'tf: 100 mm'));
    expect(thick.field).toBe('column.section.shape.tf');
    const family = inputError(plastic(withShape(demo)).replace('family: rolled', 'family: cast'));
    expect(family.field).toBe('column.section.shape.family');
  });

  it('check: exit 2 and one line naming the field, nothing on stdout', () => {
    const r = runCliProcess(['check', '-'], plastic(demo));
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(/column\.section\.shape.*plastic-zone needs the section by its dimensions/);
    expect(r.stderr).not.toMatch(/\n\s+at /);
  });

  it('capacity at the means is the plastic-zone model with the scenario’s springs, bow and default model factor', () => {
    const s = loadScenario(plastic(withShape(demo)).replace(/model_factor:[^\n]*\n/, ''), 'pz.yaml');
    const model = buildColumnModel(s);
    expect(model.modelFactorUsed).toMatchObject({ source: 'default', mean: 1.0, cov: 0.06 });
    const x = model.mean;
    const st = model.state(x);
    const EI = st.E * st.I;
    const direct = plasticZoneCapacity({
      section: { shape: 'i', h: 0.19, b: 0.19, tw: 0.009, tf: 0.014 }, family: 'rolled', axis: 'z', E: st.E, fy: st.fy, L: st.L,
      frame: 'braced', kBottom: (st.r.bottom * EI) / st.L, kTop: (st.r.top * EI) / st.L, e0: Math.abs(st.bow),
    }).capacity;
    // k → R → k round-trips to the last bits only
    expect(Math.abs(model.capacity(x) / direct - 1)).toBeLessThan(1e-8);
    const check = deterministicCheck(model);
    expect(check.capacity).toBe(model.capacity(x));
    expect(check.strength).toBe('plastic-zone');
    // between the first-yield capacity (no residual stresses) and zero, and above curve d
    const fy = deterministicCheck(buildColumnModel(loadScenario(withShape(demo), 'fy.yaml')));
    expect(direct).toBeLessThan(fy.capacity);
    expect(check.critical_load).toBe(fy.critical_load);
  });

  it('check --json runs with the section by its dimensions (exit 0, strength plastic-zone)', () => {
    const r = runCliProcess(['check', '-', '--json'], plastic(withShape(demo)));
    expect(r.status).toBe(0);
    const check = (JSON.parse(r.stdout) as { check: { strength: string; capacity: number; utilization: number } }).check;
    expect(check.strength).toBe('plastic-zone');
    expect(check.capacity).toBeGreaterThan(0);
    expect(check.utilization).toBeCloseTo(620e3 / check.capacity, 12); // the demo's model_factor has mean 1
  });

  it('reads analysis.plastic_zone (direct by default, or table) and refuses anything else', () => {
    const s = loadScenario(withShape(demo), 'fy.yaml');
    expect(s.column.section.shape).toMatchObject({ type: 'i', family: 'rolled', axis: 'z' });
    expect(s.analysis.plasticZone).toBeUndefined();
    const t = loadScenario(withShape(demo).replace('  seed: 20261201', '  seed: 20261201\n  plastic_zone: table'), 't.yaml');
    expect(t.analysis.plasticZone).toBe('table');
    const e = inputError(withShape(demo).replace('  seed: 20261201', '  seed: 20261201\n  plastic_zone: tabel'));
    expect(e.field).toBe('analysis.plastic_zone');
  });
});
