import { describe, expect, test } from 'vitest';
import { loadScenario } from '../../src/scenario/loadScenario.js';
import { FORMAT_EXAMPLE } from './formatExample.js';
import { column, inputErrorOf, loadChanged, sub, type Json } from './helpers.js';

// Line numbers refer to FORMAT_EXAMPLE (source: docs/scenario-format.md, copied verbatim).
const edit = (from: string, to: string) => {
  expect(FORMAT_EXAMPLE).toContain(from);
  return FORMAT_EXAMPLE.replace(from, to);
};
const errorIn = (text: string, fileName = 'm4.yaml') => inputErrorOf(() => loadScenario(text, fileName));
const errorAfter = (change: (o: Json) => void, fileName?: string) => inputErrorOf(() => loadChanged(change, fileName));

describe('syntax errors name the line', () => {
  test('malformed YAML', () => {
    const e = errorIn(edit('    inertia: 25.1e6 mm^4', '    inertia: [25.1e6 mm^4'));
    expect(e.field).toBe('m4.yaml');
    expect(e.message).toMatch(/^is not valid YAML/);
    expect(e.line).toBeGreaterThanOrEqual(8);
  });
  test('duplicate keys', () => {
    const e = errorIn(edit('  frame: braced ', '  frame: braced\n  frame: sway '));
    expect(e.message).toMatch(/unique/);
    expect(e.line).toBe(6);
  });
  test('malformed JSON', () => {
    const e = errorIn('{\n  "stanchion": 1,\n  "title": "x",,\n}', 'm.json');
    expect(e.field).toBe('m.json');
    expect(e.message).toMatch(/^is not valid JSON/);
    expect(e.line).toBe(3);
  });
  test('an empty file, a list, a scalar', () => {
    expect(errorIn('  \n', 'a.yaml').message).toMatch(/empty/);
    expect(errorIn('- 1\n- 2\n').message).toMatch(/expected a scenario/);
    expect(errorIn('42').message).toMatch(/expected a scenario/);
  });
  test('anchors and aliases are refused', () => {
    const e = errorIn(edit("    fy: {dist: lognormal, mean: 310 MPa, cov: 0.07}", '    fy: &x 310 MPa').replace('  ends:', '  ends:\n    extra: *x'));
    expect(e.message).toMatch(/alias/);
  });
});

describe('quantities', () => {
  test('E: 4 m names field, line and both dimensions', () => {
    const e = errorIn(edit('    E: {dist: lognormal, mean: 200 GPa, cov: 0.03}', '    E: 4 m'));
    expect(e.describe()).toBe('column.material.E (line 11): expected a stress (e.g. 200 GPa), got a length (4 m) (units accepted for a stress: Pa, kPa, MPa, GPa, N/mm², psi, ksi)');
  });
  test('a random parameter of the wrong dimension', () => {
    const e = errorIn(edit('mean: 310 MPa', 'mean: 310 kN'));
    expect(e.field).toBe('column.material.fy.mean');
    expect(e.line).toBe(12);
    expect(e.message).toMatch(/expected a stress .* got a force/);
  });
  test('unknown unit', () => {
    const e = errorIn(edit('length: 4.2 m', 'length: 4.2 meterz'));
    expect(e.field).toBe('column.length');
    expect(e.line).toBe(4);
    expect(e.message).toMatch(/'meterz'/);
  });
  test('a bare number where a unit is required', () => {
    const e = errorIn(edit('area: 7640 mm^2', 'area: 7640'));
    expect(e.field).toBe('column.section.area');
    expect(e.line).toBe(7);
    expect(e.message).toMatch(/bare number \(7640\): give a unit/);
  });
  test('"NaN", "Infinity" and .nan are refused', () => {
    expect(errorIn(edit('area: 7640 mm^2', 'area: NaN')).message).toMatch(/not a finite/);
    expect(errorIn(edit('area: 7640 mm^2', 'area: Infinity mm^2')).message).toMatch(/not a finite/);
    expect(errorIn(edit('target_beta: 3.8', 'target_beta: .nan')).field).toBe('target_beta');
    expect(errorIn(edit('target_beta: 3.8', 'target_beta: "3.8"')).message).toMatch(/plain number/);
    expect(errorIn(edit('target_beta: 3.8', 'target_beta: .inf')).message).toMatch(/not a finite/);
  });
  test('bow expressions: functions and other symbols', () => {
    for (const bad of ['sqrt(L)', 'import("fs")', 'evaluate("L")', 'x = L', 'L.toString', 'L/E', '"L"']) {
      const e = errorIn(edit('mean: L/1500', `mean: '${bad}'`));
      expect(e.field).toBe('column.imperfection.bow.mean');
      expect(e.line).toBe(18);
    }
  });
  test('negative or zero sizes', () => {
    expect(errorIn(edit('area: 7640 mm^2', 'area: -7640 mm^2')).message).toMatch(/greater than zero/);
    expect(errorIn(edit('length: 4.2 m', 'length: 0 m')).message).toMatch(/greater than zero/);
    expect(errorIn(edit('mean: 420 kN', 'mean: -420 kN')).field).toBe('loads.dead.mean');
  });
  test('L outside a length', () => {
    expect(errorIn(edit('area: 7640 mm^2', 'area: 2 L^2')).message).toMatch(/only allowed where a length/);
  });
});

describe('random variables', () => {
  const E = (o: Json) => sub(o, 'column', 'material');
  test.each([
    [{ dist: 'lognormal', mean: '200 GPa', cov: 0 }, 'column.material.E.cov', /cov.*> 0/],
    [{ dist: 'lognormal', mean: '200 GPa', cov: -0.1 }, 'column.material.E.cov', /cov.*> 0/],
    [{ dist: 'normal', mean: '200 GPa', sd: '0 GPa' }, 'column.material.E.sd', /sd.*> 0/],
    [{ dist: 'normal', mean: '200 GPa', sd: '-1 GPa' }, 'column.material.E.sd', /sd.*> 0/],
    [{ dist: 'normal', mean: '200 GPa', sd: '1 GPa', cov: 0.1 }, 'column.material.E.sd', /not both/],
    [{ dist: 'normal', mean: '200 GPa' }, 'column.material.E', /'sd' or 'cov' is required/],
    [{ dist: 'uniform', min: '210 GPa', max: '190 GPa' }, 'column.material.E.min', /less than/],
    [{ dist: 'uniform', min: '200 GPa', max: '200 GPa' }, 'column.material.E.min', /less than/],
    [{ dist: 'uniform', min: '190 GPa' }, 'column.material.E.max', /missing/],
    [{ dist: 'normal', sd: '1 GPa' }, 'column.material.E.mean', /missing: give a stress/],
    [{ dist: 'normal', mean: '200 GPa', cov: 0.1, shape: 2 }, 'column.material.E.shape', /unknown key 'shape'/],
    [{ dist: 'uniform', min: '190 GPa', max: '210 GPa', mean: '200 GPa' }, 'column.material.E.mean', /unknown key 'mean'/],
    [{ dist: 'lognormall', mean: '200 GPa', cov: 0.1 }, 'column.material.E.dist', /unknown distribution 'lognormall' \(did you mean 'lognormal'\?\)/],
    [{ mean: '200 GPa', cov: 0.1 }, 'column.material.E.dist', /needs dist/],
    [{ dist: 'normal', mean: 200, cov: 0.1 }, 'column.material.E.mean', /bare number \(200\): give a unit/],
    [{ dist: 'normal', mean: '200 GPa', cov: '0.1' }, 'column.material.E.cov', /plain number/],
    [{ dist: 'beta', min: '100 GPa', max: '300 GPa', mean: '200 GPa', sd: '150 GPa' }, 'column.material.E.sd', /beta/],
    [{ dist: 'truncnormal', mean: '200 GPa', sd: '10 GPa' }, 'column.material.E', /min.*max/],
  ])('%j', (value, field, why) => {
    const e = errorAfter((o) => {
      E(o)['E'] = value;
    });
    expect(e.field).toBe(field);
    expect(e.message).toMatch(why);
    expect(e.line).toBeGreaterThan(10); // the YAML written by the test puts E on its own lines
  });
  test('a random column length is refused with the reason', () => {
    const e = errorAfter((o) => {
      column(o)['length'] = { dist: 'normal', mean: '4.2 m', cov: 0.01 };
    });
    expect(e.field).toBe('column.length');
    expect(e.message).toMatch(/fixed quantity .* geometry/);
  });
});

describe('ends', () => {
  const ends = (o: Json) => sub(o, 'column', 'ends');
  test.each([
    [{ fixity: 1 }, 'column.ends.top.fixity', /\[0, 1\)/],
    [{ fixity: -0.1 }, 'column.ends.top.fixity', /\[0, 1\)/],
    [{ fixity: { dist: 'normal', mean: 0.5, sd: 0.1 } }, 'column.ends.top.fixity', /uniform, truncnormal or beta/],
    [{ fixity: { dist: 'lognormal', mean: 0.5, cov: 0.1 } }, 'column.ends.top.fixity', /inside \[0, 1\]/],
    [{ fixity: { dist: 'uniform', min: 0.5, max: 1.5 } }, 'column.ends.top.fixity', /max <= 1/],
    [{ fixity: '0.5' }, 'column.ends.top.fixity', /plain number/],
    [{ alignment_g: -1 }, 'column.ends.top.alignment_g', /negative/],
    [{ alignment_g: { dist: 'normal', mean: 2, sd: 0.5 } }, 'column.ends.top.alignment_g', /must not become negative/],
    [{ rotation: '-1 kN m/rad' }, 'column.ends.top.rotation', /negative/],
    [{ rotation: '5 kN m' }, 'column.ends.top.rotation', /got a moment/],
    [{ rotation: 5 }, 'column.ends.top.rotation', /bare number/],
    [{ rotaton: '5 kN m/rad' }, 'column.ends.top', /unknown key 'rotaton' \(did you mean 'rotation'\?\)/],
    [{ rotation: '5 kN m/rad', fixity: 0.5 }, 'column.ends.top', /only one of rotation, fixity/],
    ['pin', 'column.ends.top', /unknown end condition 'pin'/],
    [{}, 'column.ends.top', /is empty/],
  ])('top: %j', (top, field, why) => {
    const e = errorAfter((o) => {
      ends(o)['top'] = top;
    });
    expect(e.field).toBe(field);
    expect(e.message).toMatch(why);
    expect(e.line).toBeGreaterThan(12); // the YAML written by the test puts ends on their own lines
  });
  test('a real lateral spring on a braced column', () => {
    const e = errorIn(edit('lateral: 0 kN/m', 'lateral: 50 kN/m'));
    expect(e.field).toBe('column.ends.lateral');
    expect(e.line).toBe(16);
    expect(e.message).toMatch(/only applies to a sway frame/);
  });
  test('a sway column with pinned ends and no lateral spring', () => {
    const e = errorIn(edit('frame: braced', 'frame: sway').replace('bottom: {rotation: {dist: lognormal, mean: 2.5 MN m/rad, cov: 0.5}}', 'bottom: pinned'));
    expect(e.describe()).toBe(
      'column.ends (line 13): a sway column with pinned ends and no lateral spring is a mechanism (it has no stiffness against sway); give a rotational or lateral restraint',
    );
    // zero springs and zero fixity are no restraint either
    const zero = errorAfter((o) => {
      column(o)['frame'] = 'sway';
      o['column'] = { ...column(o), ends: { bottom: { rotation: '0 kN m/rad' }, top: { fixity: 0 }, lateral: '0 kN/m' } };
    });
    expect(zero.message).toMatch(/mechanism/);
  });
});

describe('other keys', () => {
  test('unknown keys, with the nearest valid key', () => {
    const e = errorIn(edit('strength: first-yield', 'strenght: first-yield'));
    expect(e.field).toBe('strenght');
    expect(e.line).toBe(23);
    expect(e.message).toMatch(/unknown key 'strenght' \(did you mean 'strength'\?\)/);
    const deep = errorIn(edit('    section_modulus:', '    section_modulos:'));
    expect(deep.field).toBe('column.section.section_modulos');
    expect(deep.message).toMatch(/did you mean 'section_modulus'/);
    expect(errorIn(edit('title:', 'tilte:')).message).toMatch(/did you mean 'title'/);
  });
  test('format version', () => {
    expect(errorIn(edit('stanchion: 1 ', 'stanchion: 2 ')).describe()).toMatch(/^stanchion \(line 1\): must be 1/);
    expect(errorIn(FORMAT_EXAMPLE.replace(/^stanchion: 1.*\n/, '')).field).toBe('stanchion');
  });
  test('missing required parts name their path', () => {
    expect(errorAfter((o) => delete sub(o, 'column', 'section')['inertia']).describe()).toMatch(/^column\.section\.inertia \(line 6\): is missing/);
    expect(errorAfter((o) => delete o['loads']).field).toBe('loads');
    expect(errorAfter((o) => delete o['strength']).field).toBe('strength');
    expect(errorAfter((o) => delete column(o)['frame']).field).toBe('column.frame');
  });
  test('enumerations', () => {
    expect(errorIn(edit('frame: braced', 'frame: brace')).message).toMatch(/did you mean 'braced'/);
    expect(errorIn(edit('strength: first-yield', 'strength: en1993-e')).field).toBe('strength');
    expect(errorAfter((o) => (o['display_units'] = 'imperial')).field).toBe('display_units');
  });
  test('loads', () => {
    expect(errorAfter((o) => (o['loads'] = {})).message).toMatch(/at least one/);
    expect(errorAfter((o) => (o['loads'] = { 'dead.load': '1 kN' })).message).toMatch(/not a usable load name/);
    expect(errorAfter((o) => (o['loads'] = ['1 kN'])).field).toBe('loads');
    expect(errorIn(edit('  dead: {dist: normal, mean: 420 kN, cov: 0.10}', '  __proto__: 420 kN')).message).toMatch(/not an allowed key/);
  });
  test('bow is required for first-yield', () => {
    const e = errorAfter((o) => delete column(o)['imperfection']);
    expect(e.field).toBe('column.imperfection.bow');
    expect(e.message).toMatch(/required for strength first-yield/);
  });
  test('target_beta must be a usable reliability index', () => {
    expect(errorIn(edit('target_beta: 3.8', 'target_beta: -1')).describe()).toMatch(/^target_beta \(line 24\): must be a reliability index between 0.5 and 8/);
    expect(errorIn(edit('target_beta: 3.8', 'target_beta: 9')).field).toBe('target_beta');
  });
  test.each([
    [[['column.material.E', 'column.material.G', 0.2]], /not a random variable .*did you mean 'column.material.E'/],
    [[['column.material.E', 'column.length', 0.2]], /fixed value/],
    [[['column.material.E', 'column.section.area', 0.2]], /fixed value/],
    [[['column.material.E', 'column.material.fy', 1]], /strictly between -1 and 1/],
    [[['column.material.E', 'column.material.fy', -1.5]], /strictly between -1 and 1/],
    [[['column.material.E', 'column.material.E', 0.5]], /itself/],
    [[['column.material.E', 'column.material.fy', 0.2], ['column.material.fy', 'column.material.E', 0.3]], /already given in correlation\[0\]/],
    [[['column.material.E', 'column.material.fy']], /\[variable, variable, rho\]/],
    [['column.material.E'], /\[variable, variable, rho\]/],
  ])('correlation %j', (value, why) => {
    const e = errorAfter((o) => (o['correlation'] = value));
    expect(e.field).toMatch(/^correlation/);
    expect(e.message).toMatch(why);
    expect(e.line).toBeGreaterThanOrEqual(25);
  });
  test.each([
    [{ seed: -1 }, 'analysis.seed'],
    [{ seed: 1.5 }, 'analysis.seed'],
    [{ seed: '7' }, 'analysis.seed'],
    [{ methods: ['form', 'montecarlo'] }, 'analysis.methods[1]'],
    [{ methods: ['form', 'form'] }, 'analysis.methods'],
    [{ methods: [] }, 'analysis.methods'],
    [{ mc_samples: 0 }, 'analysis.mc_samples'],
    [{ workers: 2.5 }, 'analysis.workers'],
    [{ sampels: 5 }, 'analysis.sampels'],
  ])('analysis %j', (value, field) => {
    const e = errorAfter((o) => (o['analysis'] = value));
    expect(e.field).toBe(field);
  });
  test('errors in JSON files name the line too', () => {
    const e = errorAfter((o) => (sub(o, 'column', 'material')['E'] = '4 m'), 'm4.json');
    expect(e.field).toBe('column.material.E');
    expect(e.line).toBeGreaterThan(1);
  });
});

describe('physical supports: a value that cannot be negative gets no distribution that can', () => {
  // common practice: stiffness, modulus, strength and section properties are >= 0 by definition
  const set = (path: string[], value: unknown) => (o: Json) => {
    sub(o, ...path.slice(0, -1))[path[path.length - 1]!] = value;
  };
  test.each([
    [['column', 'material', 'E'], { dist: 'normal', mean: '200 GPa', cov: 0.1 }, 'column.material.E'],
    [['column', 'material', 'fy'], { dist: 'gumbel', mean: '310 MPa', cov: 0.1 }, 'column.material.fy'],
    [['column', 'section', 'area'], { dist: 'truncnormal', mean: '7640 mm^2', sd: '100 mm^2', max: '9000 mm^2' }, 'column.section.area'],
    [['column', 'section', 'inertia'], { dist: 'truncnormal', mean: '25e6 mm^4', sd: '1e6 mm^4', min: '-1 mm^4' }, 'column.section.inertia.min'],
    [['column', 'section', 'section_modulus'], { dist: 'uniform', min: '-1 mm^3', max: '300e3 mm^3' }, 'column.section.section_modulus.min'],
    [['column', 'material', 'E'], { dist: 'beta', min: '-10 GPa', max: '400 GPa', mean: '200 GPa', sd: '10 GPa' }, 'column.material.E.min'],
    [['column', 'ends', 'top'], { rotation: { dist: 'normal', mean: '2 MN m/rad', cov: 0.3 } }, 'column.ends.top.rotation'],
    [['model_factor'], { dist: 'normal', mean: 1, cov: 0.1 }, 'model_factor'],
  ])('%j → %j', (path, value, field) => {
    const e = errorAfter(set(path, value));
    expect(e.field).toBe(field);
    expect(e.message).toMatch(/lognormal.*truncnormal with min >= 0/);
  });
  test('a lateral spring on a sway column', () => {
    const e = errorAfter((o) => {
      column(o)['frame'] = 'sway';
      sub(o, 'column', 'ends')['lateral'] = { dist: 'normal', mean: '500 kN/m', cov: 0.2 };
    });
    expect(e.field).toBe('column.ends.lateral');
  });
  test.each([
    [{ dist: 'lognormal', mean: '200 GPa', cov: 0.05 }],
    [{ dist: 'weibull', mean: '200 GPa', cov: 0.05 }],
    [{ dist: 'truncnormal', mean: '200 GPa', sd: '50 GPa', min: '0 GPa' }],
    [{ dist: 'uniform', min: '0 GPa', max: '400 GPa' }],
    [{ dist: 'beta', min: '0 GPa', max: '400 GPa', mean: '200 GPa', sd: '20 GPa' }],
  ])('accepted: %j', (value) => {
    expect(() => loadChanged((o) => { sub(o, 'column', 'material')['E'] = value; })).not.toThrow();
  });
  test('loads may stay normal or gumbel (a sampled negative load is a tension)', () => {
    expect(() => loadChanged((o) => { sub(o, 'loads')['dead'] = { dist: 'normal', mean: '420 kN', cov: 0.8 }; })).not.toThrow();
  });
  test.each([
    [{ dist: 'uniform', min: 0, max: 1 }],
    [{ dist: 'beta', min: 0, max: 1, mean: 0.5, sd: 0.2 }],
    [{ dist: 'truncnormal', min: 0, max: 1, mean: 0.9, sd: 0.5 }],
  ])('a fixity factor on all of [0, 1] is accepted: %j', (fixity) => {
    expect(() => loadChanged((o) => { sub(o, 'column', 'ends')['top'] = { fixity }; })).not.toThrow();
  });
});
