import { createHash } from 'node:crypto';
import { describe, expect, test } from 'vitest';
import { loadScenario } from '../../src/scenario/loadScenario.js';
import { randomVariables, listScalars, scalarAt } from '../../src/scenario/variables.js';
import { restraintRatio } from '../../src/scenario/restraintRatio.js';
import { FORMAT_EXAMPLE } from './formatExample.js';
import { baseObject, column, loadChanged, sub } from './helpers.js';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('the example of docs/scenario-format.md', () => {
  const s = loadScenario(FORMAT_EXAMPLE, 'm4.yaml');

  test('SI numbers', () => {
    // common practice: SI prefixes (BIPM SI Brochure, 9th ed.): mm² = 1e-6 m², mm⁴ = 1e-12 m⁴, mm³ = 1e-9 m³
    expect(s.column.length).toBe(4.2);
    expect(s.column.frame).toBe('braced');
    expect(s.column.section.area).toEqual({ kind: 'fixed', value: expect.closeTo(7.64e-3, 15) });
    expect(s.column.section.area.kind === 'fixed' && rel(s.column.section.area.value, 7.64e-3)).toBeLessThan(1e-14);
    expect(s.column.section.inertia.kind === 'fixed' && rel(s.column.section.inertia.value, 25.1e-6)).toBeLessThan(1e-14);
    expect(s.column.section.sectionModulus.kind === 'fixed' && rel(s.column.section.sectionModulus.value, 281e-6)).toBeLessThan(1e-14);
    expect(s.column.material.E).toEqual({ kind: 'random', spec: { dist: 'lognormal', mean: 200e9, cov: 0.03 } });
    expect(s.column.material.fy).toEqual({ kind: 'random', spec: { dist: 'lognormal', mean: 310e6, cov: 0.07 } });
    expect(s.column.ends.bottom).toEqual({ type: 'rotation', k: { kind: 'random', spec: { dist: 'lognormal', mean: 2.5e6, cov: 0.5 } } });
    expect(s.column.ends.top).toEqual({ type: 'pinned' });
    expect(s.column.ends.lateral).toBeNull(); // braced: the `lateral: 0 kN/m` of the example has no effect
    const bow = s.column.bow;
    expect(bow.kind).toBe('random');
    if (bow.kind === 'random') {
      expect(bow.spec.dist).toBe('normal');
      expect(rel(bow.spec.mean!, 0.0028)).toBeLessThan(1e-14); // L/1500, L = 4.2 m
      expect(rel(bow.spec.sd!, 0.0014)).toBeLessThan(1e-14); // L/3000
    }
    expect(s.loads).toEqual([
      { name: 'dead', path: 'loads.dead', value: { kind: 'random', spec: { dist: 'normal', mean: 420e3, cov: 0.1 } }, basis: { type: 'unstated' } },
      { name: 'imposed', path: 'loads.imposed', value: { kind: 'random', spec: { dist: 'gumbel', mean: 160e3, cov: 0.25 } }, basis: { type: 'unstated' } },
    ]);
    expect(s.modelFactor).toEqual({ kind: 'random', spec: { dist: 'lognormal', mean: 1, cov: 0.05 } });
    expect(s.strength).toBe('first-yield');
    expect(s.targetBeta).toBe(3.8);
    expect(s.correlation).toEqual([{ a: 'column.material.E', b: 'column.material.fy', rho: 0.2 }]);
    expect(s.analysis).toEqual({ seed: 20261201, methods: ['form', 'sorm', 'is', 'mc'], mcSamples: 1_000_000 });
    expect(s.title).toBe('Cold-store mezzanine, column M4');
    expect(s.displayUnits).toBe('si');
  });

  test('random variables by contract path, in a stable order', () => {
    expect(randomVariables(s).map((v) => v.path)).toEqual([
      'column.material.E',
      'column.material.fy',
      'column.ends.bottom.rotation',
      'column.imperfection.bow',
      'loads.dead',
      'loads.imposed',
      'model_factor',
    ]);
    expect(listScalars(s)[0]).toEqual({ path: 'column.length', scalar: { kind: 'fixed', value: 4.2 } });
    expect(scalarAt(s, 'column.section.area')?.kind).toBe('fixed');
  });

  test('display units as written', () => {
    expect(s.units['column.material.E']).toEqual({ unit: 'GPa', factor: 1e9 });
    expect(s.units['column.material.fy']).toEqual({ unit: 'MPa', factor: 1e6 });
    expect(s.units['column.ends.bottom.rotation']).toEqual({ unit: 'MN m/rad', factor: 1e6 });
    expect(s.units['column.section.area']).toEqual({ unit: 'mm^2', factor: expect.closeTo(1e-6, 20) });
    expect(s.units['loads.dead']).toEqual({ unit: 'kN', factor: 1000 });
    expect(s.units['column.imperfection.bow']?.unit).toBe('mm');
    expect(s.units['model_factor']).toEqual({ unit: '', factor: 1 });
  });

  test('the SHA-256 of the text is kept', () => {
    // common practice: SHA-256 of the UTF-8 bytes, lower-case hex
    expect(s.sha256).toBe(createHash('sha256').update(Buffer.from(FORMAT_EXAMPLE, 'utf8')).digest('hex'));
    expect(s.sha256).toMatch(/^[0-9a-f]{64}$/);
  });
});

describe('YAML and JSON', () => {
  const fromYaml = loadScenario(FORMAT_EXAMPLE, 'm4.yaml');
  const json = JSON.stringify(baseObject(), null, 2);
  const strip = (x: object) => ({ ...x, sha256: '', fileName: '', format: '' });

  test('give the same scenario', () => {
    const fromJson = loadScenario(json, 'm4.json');
    expect(fromJson.format).toBe('json');
    expect(strip(fromJson)).toEqual(strip(fromYaml));
  });
  test('stdin is read as JSON when it starts with {, else as YAML', () => {
    expect(loadScenario(`  ${json}`, '-').format).toBe('json');
    expect(loadScenario(FORMAT_EXAMPLE, '-').format).toBe('yaml');
    expect(strip(loadScenario(json, '-'))).toEqual(strip(fromYaml));
  });
  test('a .yml file and a flow-style YAML file read the same', () => {
    expect(strip(loadScenario(json, 'm4.yml'))).toEqual(strip(fromYaml)); // JSON is valid YAML 1.2
  });
});

describe('defaults and options', () => {
  test('model_factor 1, target_beta 3.8, no correlation, empty analysis', () => {
    const s = loadChanged((o) => {
      delete o['model_factor'];
      delete o['target_beta'];
      delete o['correlation'];
      delete o['analysis'];
      delete o['title'];
    });
    expect(s.modelFactor).toEqual({ kind: 'fixed', value: 1 });
    expect(s.targetBeta).toBe(3.8);
    expect(s.correlation).toEqual([]);
    expect(s.analysis).toEqual({});
    expect(s.title).toBe('');
  });
  test('bow may be left out for a code strength curve (then 0)', () => {
    const s = loadChanged((o) => {
      delete column(o)['imperfection'];
      o['strength'] = 'en1993-b';
    });
    expect(s.column.bow).toEqual({ kind: 'fixed', value: 0 });
  });
  test('all analysis options, target_source, display_units and $schema', () => {
    const s = loadChanged((o) => {
      o['$schema'] = '../schema/scenario.schema.json';
      o['analysis'] = { seed: 0, methods: ['subset', 'form'], mc_samples: 10, is_samples: 20, subset_samples: 30, workers: 2 };
      o['target_source'] = 'ISO 13822';
      o['display_units'] = 'us';
    });
    expect(s.analysis).toEqual({ seed: 0, methods: ['subset', 'form'], mcSamples: 10, isSamples: 20, subsetSamples: 30, workers: 2 });
    expect(s.targetSource).toBe('ISO 13822');
    expect(s.displayUnits).toBe('us');
  });
  test('deterministic values, US units', () => {
    const s = loadChanged((o) => {
      sub(o, 'column', 'material')['E'] = '29000 ksi';
      delete o['correlation'];
      o['loads'] = { dead: '95 kips', live: '40 kip' };
    });
    // source: NIST SP 811: 1 ksi = 6.894 757 MPa, 1 kip = 4.448 222 kN
    expect(s.column.material.E.kind === 'fixed' && rel(s.column.material.E.value, 29000 * 6.894757293168361e6)).toBeLessThan(1e-12);
    expect(s.loads.map((l) => l.value)).toEqual([
      { kind: 'fixed', value: expect.closeTo(95 * 4448.2216152605, 6) },
      { kind: 'fixed', value: expect.closeTo(40 * 4448.2216152605, 6) },
    ]);
    expect(s.units['loads.dead']?.unit).toBe('kips');
  });
});

describe('ends', () => {
  const withEnds = (bottom: unknown, top: unknown, frame = 'braced', lateral?: unknown) =>
    loadChanged((o) => {
      const c = column(o);
      c['frame'] = frame;
      c['ends'] = lateral === undefined ? { bottom, top } : { bottom, top, lateral };
      delete o['correlation'];
    });

  test('fixed, fixity and alignment_g', () => {
    const s = withEnds('fixed', { fixity: 0.5 });
    expect(s.column.ends.bottom).toEqual({ type: 'fixed' });
    // source: docs/scenario-format.md: X = R/(R+3) ⇒ R = 3X/(1−X) = 3 for X = 0.5
    expect(s.column.ends.top).toEqual({ type: 'ratio', from: 'fixity', input: { kind: 'fixed', value: 0.5 }, R: 3 });
    const braced = withEnds({ alignment_g: 2 }, 'pinned');
    expect(braced.column.ends.bottom).toMatchObject({ type: 'ratio', from: 'alignment_g', R: 1 }); // R = 2/G
    const sway = withEnds({ alignment_g: 2 }, 'pinned', 'sway');
    expect(sway.column.ends.bottom).toMatchObject({ R: 3 }); // R = 6/G
    expect(withEnds({ alignment_g: 0 }, 'pinned').column.ends.bottom).toEqual({ type: 'fixed' }); // G = 0: rigid
  });
  test('random fixity inside [0, 1] and its ratio at the mean', () => {
    const s = withEnds({ fixity: { dist: 'uniform', min: 0.2, max: 0.6 } }, 'pinned');
    expect(s.column.ends.bottom).toEqual({ type: 'ratio', from: 'fixity', input: { kind: 'random', spec: { dist: 'uniform', min: 0.2, max: 0.6 } }, R: expect.closeTo(2, 12) });
    expect(randomVariables(s).map((v) => v.path)).toContain('column.ends.bottom.fixity');
    expect(restraintRatio('fixity', 'braced', 0.75)).toBeCloseTo(9, 12);
    withEnds({ fixity: { dist: 'beta', min: 0, max: 1, mean: 0.4, sd: 0.1 } }, 'pinned');
    withEnds({ fixity: { dist: 'truncnormal', mean: 0.4, sd: 0.2, min: 0, max: 1 } }, 'pinned');
  });
  test('sway: lateral spring, default 0', () => {
    const s = withEnds('pinned', 'pinned', 'sway', { dist: 'lognormal', mean: '300 kN/m', cov: 0.3 });
    expect(s.column.ends.lateral).toEqual({ kind: 'random', spec: { dist: 'lognormal', mean: 3e5, cov: 0.3 } });
    expect(randomVariables(s).map((v) => v.path)).toContain('column.ends.lateral');
    expect(withEnds({ rotation: '5 MN m/rad' }, 'pinned', 'sway').column.ends.lateral).toEqual({ kind: 'fixed', value: 0 });
  });
});

describe('many loads', () => {
  test('three hundred loads keep their file order', () => {
    const names = Array.from({ length: 300 }, (_, i) => `load_${299 - i}`);
    const s = loadChanged((o) => {
      o['loads'] = Object.fromEntries(names.map((n, i) => [n, `${i + 1} kN`]));
    });
    expect(s.loads.map((l) => l.name)).toEqual(names);
    expect(s.loads[299]!.value).toEqual({ kind: 'fixed', value: 300e3 });
  });
  test('unicode load names', () => {
    const s = loadChanged((o) => {
      o['loads'] = { Eigengewicht: '100 kN', 'neige_été': '20 kN' };
    });
    expect(s.loads.map((l) => l.path)).toEqual(['loads.Eigengewicht', 'loads.neige_été']);
  });
});
