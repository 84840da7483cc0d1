import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { buildColumnModel } from '../../src/limitState/columnModel.js';
import { deterministicCheck } from '../../src/limitState/deterministicCheck.js';
import { makePlasticZoneCapacity, makePlasticZoneDirect, reducedPlates, sectionFamily, type PlasticZoneSample } from '../../src/limitState/plasticZoneStrength.js';
import { plasticZoneCapacity } from '../../src/plasticZone/plasticZoneCapacity.js';
import { plateProperties } from '../../src/plasticZone/plateProperties.js';
import { fibreSection } from '../../src/plasticZone/sectionFibres.js';
import { AREA, ELASTIC_MODULUS_Y, ELASTIC_MODULUS_Z, INERTIA_Y, INERTIA_Z, PROPERTY_COUNT } from '../../src/sections/sectionProperties.js';
import { sectionWriter, type SectionDimensions } from '../../src/sections/sectionDimensions.js';
import { InputError } from '../../src/scenario/inputError.js';
import { loadScenario } from '../../src/scenario/loadScenario.js';
import { runCliOnText } from '../cli/runCli.js';
import { problemFromModel } from '../../src/limitState/columnRecipe.js';
import { form } from '../../src/reliability/form.js';
import { betaByStrengthModel } from '../../src/studies/strengthComparison.js';

const demo = readFileSync(new URL('../../scenarios/plastic-zone-column.yaml', import.meta.url), 'utf8');
const braced = readFileSync(new URL('../../scenarios/braced-base-plate.yaml', import.meta.url), 'utf8');
const folder = mkdtempSync(join(tmpdir(), 'stanchion-pz-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));

function inputError(text: string): InputError {
  try {
    loadScenario(text, 'pz.yaml');
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    return e as InputError;
  }
  throw new Error('expected an InputError');
}

describe('strength: plastic-zone with the section by its dimensions', () => {
  it('refuses a section given by its properties, a line load and an out-of-plumb, naming the field', () => {
    const e = inputError(braced.replace('strength: first-yield', 'strength: plastic-zone'));
    expect(e.field).toBe('column.section.shape');
    expect(e.message).toMatch(/plastic-zone needs the section by its dimensions/);
    const line = inputError(demo.replace('kind: permanent}', 'kind: permanent, transverse: 1 kN/m}'));
    expect(line.field).toBe('loads.dead.transverse');
    expect(line.message).toMatch(/plastic-zone.*not a transverse load/);
    const plumb = inputError(demo.replace('frame: braced', 'frame: sway').replace('    bow: {dist: normal, mean: L/1500, sd: L/3000}\n  axis_z', '    bow: {dist: normal, mean: L/1500, sd: L/3000}\n    out_of_plumb: en1993\n  axis_z'));
    expect(plumb.field).toBe('column.imperfection.out_of_plumb');
  });

  it('takes the family from the section: rolled I/H with a root radius, welded without, none for hollow and solid', () => {
    expect(sectionFamily({ shape: 'i', h: 0.2, b: 0.2, tw: 0.009, tf: 0.015, r: 0.018 })).toBe('rolled');
    expect(sectionFamily({ shape: 'i', h: 0.2, b: 0.2, tw: 0.009, tf: 0.015, r: 0 })).toBe('welded');
    expect(sectionFamily({ shape: 'rhs', h: 0.2, b: 0.1, t: 0.008, ro: 0.016, ri: 0.008 })).toBe('hollow');
    expect(sectionFamily({ shape: 'chs', D: 0.2, t: 0.008 })).toBe('hollow');
    expect(sectionFamily({ shape: 'rect', b: 0.1, h: 0.2 })).toBe('solid');
  });

  it('takes a corrosion loss off the plates exactly as the section writer does (sharp corners: equal properties)', () => {
    const cases: SectionDimensions[] = [
      { shape: 'i', h: 0.2, b: 0.2, tw: 0.009, tf: 0.015, r: 0 },
      { shape: 'rhs', h: 0.2, b: 0.1, t: 0.008, ro: 0, ri: 0 },
      { shape: 'chs', D: 0.2, t: 0.008 },
      { shape: 'rect', b: 0.1, h: 0.2 },
    ];
    const p = new Float64Array(PROPERTY_COUNT);
    for (const d of cases) {
      sectionWriter(d)(p, 0.0012, 0.0007);
      const plates = reducedPlates(d, 0.0012, 0.0007)!;
      const y = plateProperties(plates, 'y');
      const z = plateProperties(plates, 'z');
      expect(Math.abs(y.A / p[AREA] - 1), d.shape).toBeLessThan(1e-12);
      expect(Math.abs(y.I / p[INERTIA_Y] - 1), d.shape).toBeLessThan(1e-12);
      expect(Math.abs(z.I / p[INERTIA_Z] - 1), d.shape).toBeLessThan(1e-12);
      expect(Math.abs(y.W / p[ELASTIC_MODULUS_Y] - 1), d.shape).toBeLessThan(1e-12);
      expect(Math.abs(z.W / p[ELASTIC_MODULUS_Z] - 1), d.shape).toBeLessThan(1e-12);
    }
    expect(reducedPlates(cases[0]!, 0.008, 0)).toBeNull(); // a flange eaten through
  });

  it('check: each axis by the full model with its own ends and bow, at the mean loss, and no table built', () => {
    const s = loadScenario(demo, 'pz.yaml');
    const model = buildColumnModel(s);
    expect(s.analysis.plasticZone).toBe('table');
    expect(model.modelFactorUsed).toMatchObject({ source: 'default', mean: 1.0, cov: 0.06 });
    const x = model.mean;
    const loss = x[model.names.indexOf('column.section.corrosion.loss')]!;
    const section = reducedPlates(s.column.section.geometry!.dimensions, loss, loss)!;
    const expected = model.axes.map((axis) => {
      const st = axis.state(x);
      const EI = st.E * st.I;
      return plasticZoneCapacity({
        section, family: 'rolled', axis: axis.name, E: st.E, fy: st.fy, L: st.L, frame: 'braced',
        kBottom: st.r.bottom === Infinity ? Infinity : (st.r.bottom * EI) / st.L, kTop: (st.r.top * EI) / st.L, e0: Math.abs(st.bow),
      }).capacity;
    });
    const before = cacheFiles();
    const check = deterministicCheck(model);
    expect(cacheFiles()).toEqual(before);
    // k → R → k round-trips to the last bits only
    expect(Math.abs(check.axes!.y.capacity / expected[0]! - 1)).toBeLessThan(1e-8);
    expect(Math.abs(check.axes!.z.capacity / expected[1]! - 1)).toBeLessThan(1e-8);
    expect(check.axes!.governing).toBe('z');
    expect(check.capacity).toBe(check.axes!.z.capacity);
    expect(check.strength).toBe('plastic-zone');
    // below the first-yield capacity of the same column (no residual stresses, no plastic reserve at a bow this small): common practice
    const fy = deterministicCheck(buildColumnModel(loadScenario(demo.replace(/^strength: plastic-zone/m, 'strength: first-yield'), 'fy.yaml')));
    expect(check.capacity).toBeLessThan(fy.capacity);
    expect(check.critical_load).toBe(fy.critical_load);
  });

  it('table: a corroded sample reads the sound section’s χ at its own λ̄ and η, within 0.5 % of the full model at 1 mm loss', () => {
    // small grid around the point so that the interpolation error stays below the corrosion approximation
    const dims: SectionDimensions = { shape: 'i', h: 0.2, b: 0.2, tw: 0.009, tf: 0.015, r: 0.018 };
    const grid = { lambdaBar: [0.9, 1.0, 1.1], fixity: [0, 0.25, 0.5], eta: [0.04, 0.12] };
    const sound = reducedPlates(dims, 0, 0)!;
    const fib = fibreSection(sound, 'rolled', 'z', 1);
    const E = 210e9, fy = 235e6, L = 3.5;
    // a sample on a grid node of the sound section: the same column through the table and directly
    const sample = (loss: number): PlasticZoneSample => {
      const plates = reducedPlates(dims, loss, loss)!;
      const r = plateProperties(plates, 'z');
      const EI = E * (fib.I * r.I) / plateProperties(sound, 'z').I;
      return { E, fy, EI, L, bow: 0.003, RBottom: 1, RTop: 0, lateral: 0, eccBottom: 0, eccTop: 0, primaryLoss: loss, secondaryLoss: loss };
    };
    let builds = 0;
    const table = makePlasticZoneCapacity(dims, 'z', 'braced', 'table', () => builds++, { grid, folder, elements: 16 });
    const direct = makePlasticZoneDirect(dims, 'z', 'braced');
    for (const loss of [0, 0.001]) {
      const t = table(sample(loss));
      const d = direct(sample(loss));
      expect(Math.abs(t / d - 1), `loss ${loss}`).toBeLessThan(loss === 0 ? 0.01 : 0.015);
    }
    expect(builds).toBe(1);
    // the corrosion approximation alone: χ of the corroded section against the sound one at equal λ̄, fixities and η
    const chi = (plates: typeof sound): number => {
      const f = fibreSection(plates, 'rolled', 'z', fy);
      const EI = E * f.I;
      const Lc = 1.0 * Math.PI * Math.sqrt(EI / (f.A * fy));
      const r = plasticZoneCapacity({ section: plates, family: 'rolled', axis: 'z', E, fy, L: Lc, frame: 'braced', kBottom: 0, kTop: 0, e0: (0.12 * f.W) / f.A });
      return r.capacity / r.squashLoad;
    };
    const shift = chi(reducedPlates(dims, 0.001, 0.001)!) / chi(sound) - 1;
    expect(Math.abs(shift)).toBeLessThan(0.005);
  });

  it('check --json on the demo: exit 0, both axes plastic-zone', async () => {
    const r = await runCliOnText(['check', '-', '--json'], demo);
    expect(r.status).toBe(0);
    const check = (JSON.parse(r.stdout) as { check: { strength: string; capacity: number; axes: { y: { strength: string }; z: { strength: string } } } }).check;
    expect(check.strength).toBe('plastic-zone');
    expect(check.axes.y.strength).toBe('plastic-zone');
    expect(check.axes.z.strength).toBe('plastic-zone');
    expect(check.capacity).toBeGreaterThan(0);
  });

  it('joins the β-by-strength-model table of a section by its dimensions; not with a line load', () => {
    // the chosen model's row reuses the assessment's FORM (here a stand-in), so no plastic-zone run is needed
    const s = loadScenario(demo, 'pz.yaml');
    const stand = form(problemFromModel(buildColumnModel(loadScenario(demo.replace(/^strength: plastic-zone/m, 'strength: en1993-b'), 'b.yaml'))));
    const rows = betaByStrengthModel(s, stand);
    expect(rows.at(-1)).toMatchObject({ strength: 'plastic-zone', chosen: true, beta: stand.beta });
    expect(rows.find((r) => r.strength === 'en1993-b')!.beta).toBeCloseTo(stand.beta, 6);
    const facade = loadScenario(readFileSync(new URL('../../scenarios/facade-h-column.yaml', import.meta.url), 'utf8'), 'f.yaml');
    const f = form(problemFromModel(buildColumnModel(facade)));
    expect(betaByStrengthModel(facade, f).find((r) => r.strength === 'plastic-zone')).toMatchObject({ beta: null, note: 'takes no line load, top force or out-of-plumb' });
    // chosen another model on a section by its dimensions: listed, not run (its table takes minutes to build)
    const other = loadScenario(demo.replace(/^strength: plastic-zone/m, 'strength: en1993-b'), 'b.yaml');
    expect(betaByStrengthModel(other, stand).find((r) => r.strength === 'plastic-zone')).toMatchObject({ beta: null, chosen: false, note: expect.stringMatching(/^not run here/) });
  });

  it('reads analysis.plastic_zone (table by default, or direct) and refuses anything else', () => {
    const without = demo.replace(/  plastic_zone: table[^\n]*\n/, '');
    expect(loadScenario(without, 'd.yaml').analysis.plasticZone).toBeUndefined();
    expect(loadScenario(without.replace('  seed: 20261203', '  seed: 20261203\n  plastic_zone: direct'), 't.yaml').analysis.plasticZone).toBe('direct');
    const e = inputError(without.replace('  seed: 20261203', '  seed: 20261203\n  plastic_zone: tabel'));
    expect(e.field).toBe('analysis.plastic_zone');
  });
});

function cacheFiles(): string[] {
  try {
    return readdirSync(process.env.STANCHION_CACHE_DIR ?? folder).sort();
  } catch {
    return [];
  }
}
