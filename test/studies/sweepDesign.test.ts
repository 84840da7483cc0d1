import { describe, expect, it } from 'vitest';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { InputError } from '../../src/scenario/inputError.js';
import { buildCaseTable, iterateCases } from '../../src/studies/sweepDesign.js';
import type { CaseTable } from '../../src/studies/sweepTypes.js';

const allCases = (t: CaseTable) => [...iterateCases(t)];
import { parseSweepFile } from '../../src/studies/sweepFile.js';
import { parseShardOption, parseVaryOption } from '../../src/studies/varyOption.js';

describe('--vary and --shard', () => {
  it('reads linear, log, range-only and list forms, keeping units as text', () => {
    expect(parseVaryOption('column.length=3 m:6 m:4')).toEqual({ path: 'column.length', scale: 'linear', from: 3, to: 6, unit: 'm', steps: 4 });
    expect(parseVaryOption('k=log:0.5 MN m/rad:20 MN  m/rad:8')).toMatchObject({ scale: 'log', from: 0.5, to: 20, unit: 'MN m/rad' });
    expect(parseVaryOption('model_factor=0.9:1.1')).toEqual({ path: 'model_factor', scale: 'linear', from: 0.9, to: 1.1, unit: '' });
    expect(parseVaryOption('strength=first-yield,en1993-b')).toEqual({ path: 'strength', values: ['first-yield', 'en1993-b'] });
    expect(parseVaryOption('x=1,2.5')).toEqual({ path: 'x', values: [1, 2.5] });
  });
  it('rejects malformed options with an InputError', () => {
    for (const bad of ['nopath', '=1:2:3', 'a=1 m:2 kN:3', 'a=log:0:1:3', 'a=1:2:0', 'a=1:2:3:4']) {
      expect(() => parseVaryOption(bad), bad).toThrow(InputError);
    }
    expect(parseShardOption('2/3')).toEqual({ index: 2, count: 3 });
    expect(() => parseShardOption('3/3')).toThrow(InputError);
  });
});

describe('case tables', () => {
  it('builds a full grid, first axis slowest, with rounded values and units', () => {
    const table = buildCaseTable({
      design: 'grid',
      seed: 9,
      vary: [parseVaryOption('a=0:0.3:4'), parseVaryOption('b=log:1 kN:100 kN:3')],
    });
    expect(table.varied).toEqual(['a', 'b']);
    expect(table.count).toBe(12);
    expect(allCases(table).map((c) => c.values.a).slice(0, 4)).toEqual([0, 0, 0, 0.1]);
    // 0.1 + 0.2 noise is rounded away; log steps 1, 10, 100 kN (common practice: geometric spacing)
    expect(allCases(table).map((c) => c.values.a).filter((_, k) => k % 3 === 0)).toEqual([0, 0.1, 0.2, 0.3]);
    expect(allCases(table).slice(0, 3).map((c) => c.values.b)).toEqual(['1 kN', '10 kN', '100 kN']);
    expect(allCases(table).map((c) => c.index)).toEqual([...Array(12).keys()]);
  });

  it('gives each case a seed that depends only on (sweep seed, index)', () => {
    const small = buildCaseTable({ design: 'grid', seed: 4, vary: [parseVaryOption('a=0:1:3')] });
    const large = buildCaseTable({ design: 'grid', seed: 4, vary: [parseVaryOption('a=0:1:7')] });
    expect(allCases(large).slice(0, 3).map((c) => c.seed)).toEqual(allCases(small).map((c) => c.seed));
    const other = buildCaseTable({ design: 'grid', seed: 5, vary: [parseVaryOption('a=0:1:3')] });
    expect(allCases(other)[0].seed).not.toBe(allCases(small)[0].seed);
    expect(new Set(allCases(large).map((c) => c.seed)).size).toBe(7);
  });

  it('draws a Latin hypercube with one case per stratum on every axis (McKay et al. 1979, from memory)', () => {
    const m = 50;
    const def = { design: 'lhs' as const, seed: 77, cases: m, vary: [parseVaryOption('a=10:20'), parseVaryOption('b=log:1 MPa:100 MPa')] };
    const table = buildCaseTable(def);
    expect(table.count).toBe(m);
    const strataA = allCases(table).map((c) => Math.floor(((c.values.a as number) - 10) / (10 / m)));
    expect([...strataA].sort((x, y) => x - y)).toEqual([...Array(m).keys()]);
    const strataB = allCases(table).map((c) => Math.floor(Math.log10(Number.parseFloat(c.values.b as string)) / (2 / m)));
    expect([...strataB].sort((x, y) => x - y)).toEqual([...Array(m).keys()]);
    expect(allCases(buildCaseTable(def))).toEqual(allCases(table));
    expect(allCases(buildCaseTable({ ...def, seed: 78 }))[0].values).not.toEqual(allCases(table)[0].values);
  });
});

describe('sweep file', () => {
  it('reads YAML with ranges, lists and the text form; resolves the scenario', () => {
    const text = `
scenario: ../m4.yaml
design: grid
seed: 12
methods: [form]
vary:
  - {path: column.ends.bottom.rotation.mean, from: 0.5 MN m/rad, to: 20 MN m/rad, steps: 3, scale: log}
  - {path: loads.dead.mean, values: [400 kN, 420 kN]}
  - "model_factor=0.9:1.1:2"
`;
    // the scenario is found beside the sweep file, whatever folder that is
    const folder = join(tmpdir(), 'sweeps');
    const def = parseSweepFile(text, join(folder, 's.yaml'));
    expect(def.scenario).toBe(resolve(folder, '../m4.yaml'));
    expect(def.methods).toEqual(['form']);
    const table = buildCaseTable(def);
    expect(table.count).toBe(12);
    expect(allCases(table)[11].values).toEqual({ 'column.ends.bottom.rotation.mean': '20 MN m/rad', 'loads.dead.mean': '420 kN', model_factor: 1.1 });
  });

  it('reads an explicit list from JSON', () => {
    const def = parseSweepFile(JSON.stringify({ design: 'list', list: [{ a: 1, b: '2 m' }, { a: 3, b: '4 m' }] }), 'x.json');
    const table = buildCaseTable(def);
    expect(table.varied).toEqual(['a', 'b']);
    expect(allCases(table)[1].values).toEqual({ a: 3, b: '4 m' });
  });

  it('names the field of a mistake', () => {
    const fieldOf = (text: string): string => {
      try {
        buildCaseTable(parseSweepFile(text, 'x.yaml'));
      } catch (error) {
        return (error as InputError).field;
      }
      return 'none';
    };
    expect(fieldOf('design: cube')).toBe('design');
    expect(fieldOf('design: lhs\nvary: ["a=0:1"]')).toBe('cases');
    expect(fieldOf('vary: [{path: a, from: 1 m, to: 2 s, steps: 2}]')).toBe('vary[0]');
    expect(fieldOf('design: list\nlist: [{a: 1}, {b: 2}]')).toBe('list[1]');
    expect(fieldOf('vary: ["a=0:1:2", "a=1:2:2"]')).toBe('vary');
  });
});
