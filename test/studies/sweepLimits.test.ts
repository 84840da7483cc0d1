/**
 * Sweeps stay bounded and checked: cases built lazily by index, a cap on their number,
 * strict sweep files, journal lines checked against the sweep before they reach any output.
 * common practice: refuse bad input before writing; never let a foreign row into results.
 */
import { createHash } from 'node:crypto';
import { appendFileSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { InputError } from '../../src/scenario/inputError.js';
import type { CaseRunner } from '../../src/studies/caseRunner.js';
import { checkSweepCases, FULL_CHECK_CASES } from '../../src/studies/checkSweepCases.js';
import { mergeSweep, mergeSweepOf } from '../../src/studies/mergeSweep.js';
import { runSweep } from '../../src/studies/runSweep.js';
import { buildCaseTable, iterateCases, MAX_SWEEP_CASES } from '../../src/studies/sweepDesign.js';
import { parseSweepFile } from '../../src/studies/sweepFile.js';
import { sweepFingerprint } from '../../src/studies/sweepFingerprint.js';
import { sweepJson, sweepJsonEntry } from '../../src/studies/sweepOutput.js';
import type { SweepDefinition, SweepValue } from '../../src/studies/sweepTypes.js';
import { parseVaryOption } from '../../src/studies/varyOption.js';
import { cappedWorkers } from '../../src/cli/sweepCommand.js';

const root = mkdtempSync(join(tmpdir(), 'stanchion-limits-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));

const errorOf = (f: () => unknown): InputError => {
  try {
    f();
  } catch (error) {
    if (error instanceof InputError) return error;
    throw error;
  }
  throw new Error('no InputError');
};

describe('lazy cases and the cap', () => {
  it('computes any case of a ten-million-case grid from its index alone', () => {
    const table = buildCaseTable({ design: 'grid', seed: 1, vary: [parseVaryOption('a=0:999:1000'), parseVaryOption('b=1 m:10000 m:10000')] });
    expect(table.count).toBe(MAX_SWEEP_CASES);
    // mixed-radix decoding, first axis slowest (common practice)
    expect(table.valuesAt(MAX_SWEEP_CASES - 1)).toEqual({ a: 999, b: '10000 m' });
    expect(table.valuesAt(12_345)).toEqual({ a: 1, b: '2346 m' });
  });

  it('refuses a grid or list beyond the cap, and a Latin hypercube beyond a million, saying why', () => {
    const grid = errorOf(() => buildCaseTable({ design: 'grid', seed: 1, vary: [parseVaryOption('a=0:1:1000'), parseVaryOption('b=0:1:1000'), parseVaryOption('c=0:1:1000')] }));
    expect(grid.field).toBe('vary');
    expect(grid.message).toMatch(/1000 × 1000 × 1000 cases; a sweep has at most 1e\+7 cases \(its journal/);
    const lhs = errorOf(() => buildCaseTable({ design: 'lhs', seed: 1, cases: 2_000_000, vary: [parseVaryOption('a=0:1')] }));
    expect(lhs.field).toBe('cases');
    expect(lhs.message).toMatch(/at most 1000000/);
  });

  it('hashes the same canonical text as the whole table would give (common practice: stable fingerprint)', () => {
    const table = buildCaseTable({ design: 'grid', seed: 8, vary: [parseVaryOption('x=1:3:3'), parseVaryOption('L=2 m:3 m:2')] });
    const cases = [...iterateCases(table)].map((c) => [c.index, c.seed, table.varied.map((p) => c.values[p])]);
    const expected = createHash('sha256').update(JSON.stringify({ varied: table.varied, cases, identity: { m: 1 } })).digest('hex');
    expect(sweepFingerprint(table, { m: 1 })).toBe(expected);
  });
});

describe('strict sweep files', () => {
  const fieldAndMessage = (text: string): string => {
    const e = errorOf(() => parseSweepFile(text, 'x.yaml'));
    return `${e.field}: ${e.message}`;
  };
  it('refuses unknown keys with the nearest valid name, and numbers that are not numbers', () => {
    expect(fieldAndMessage('sead: 3\nvary: ["a=0:1:2"]')).toMatch(/^sead: unknown key \(did you mean 'seed'\?\)/);
    expect(fieldAndMessage('vary: [{path: a, from: 0, to: 1, step: 3}]')).toMatch(/^vary\[0\]\.step: unknown key \(did you mean 'steps'\?\)/);
    expect(fieldAndMessage('seed: true\nvary: ["a=0:1:2"]')).toBe('seed: expected a whole number >= 0, got true');
    expect(fieldAndMessage('seed: -1\nvary: ["a=0:1:2"]')).toMatch(/^seed: /);
    expect(fieldAndMessage('seed: 1.5\nvary: ["a=0:1:2"]')).toMatch(/^seed: /);
    expect(fieldAndMessage('vary: [{path: a, from: 0, to: 1, steps: "3"}]')).toMatch(/^vary\[0\]\.steps: expected a whole number >= 1/);
    expect(fieldAndMessage('design: lhs\ncases: true\nvary: ["a=0:1"]')).toMatch(/^cases: /);
    expect(fieldAndMessage('vary: [{path: a, values: [1, 2], from: 0}]')).toMatch(/^vary\[0\]\.from: /);
  });
});

describe('checking cases before the first runs', () => {
  const bad = (values: Record<string, SweepValue>): void => {
    if (values.a === -5) throw new InputError('a', 'must be > 0');
  };
  it('checks every case of a small sweep, so a bad value in the middle of a list is found', () => {
    const def: SweepDefinition = { design: 'grid', seed: 1, vary: [parseVaryOption('a=1,2,-5,4'), parseVaryOption('b=0:1:3')] };
    const seen: (number | null)[] = [];
    expect(() => checkSweepCases(buildCaseTable(def), def, (v, k) => (seen.push(k), bad(v)))).toThrow(/must be > 0/);
    expect(seen.at(-1)).toBe(6); // case 6 = a[2], b[0]
  });
  it('in a large sweep, checks every listed value and the ends of every range, not every case', () => {
    const def: SweepDefinition = { design: 'grid', seed: 1, vary: [parseVaryOption('a=1,2,3,-5,6'), parseVaryOption('b=0:1:1000')] };
    const table = buildCaseTable(def);
    expect(table.count).toBeGreaterThan(FULL_CHECK_CASES);
    let checks = 0;
    expect(() => checkSweepCases(table, def, (v) => (checks++, bad(v)))).toThrow(/must be > 0/);
    const fine: SweepDefinition = { ...def, vary: [parseVaryOption('a=1,2,3,5,6'), parseVaryOption('b=0:1:1000')] };
    const seenB = new Set<SweepValue>();
    const n = checkSweepCases(buildCaseTable(fine), fine, (v) => seenB.add(v.b));
    expect(n).toBeLessThan(20);
    expect([...seenB].sort()).toEqual([0, 1]);
  });
});

describe('journal lines that do not belong are refused with their line', () => {
  const table = buildCaseTable({ design: 'grid', seed: 3, vary: [parseVaryOption('x=1:4:4')] });
  const runner: CaseRunner = (c) => ({ y: (c.values.x as number) * 2, flag: c.index === 2 });
  const fresh = async (name: string, shard = { index: 0, count: 1 }): Promise<string> =>
    (await runSweep({ table, runCase: runner, stateDir: join(root, name), shard, definition: { design: 'grid', seed: 3, vary: [parseVaryOption('x=1:4:4')] } })).journal;

  it('a case outside the sweep, of another shard, twice, with wrong values or seed, or a damaged line', async () => {
    const cases = [...iterateCases(table)];
    const tamper: [string, string, RegExp][] = [
      ['range', JSON.stringify({ case: 99, seed: 1, values: { x: 1 }, result: {} }), /case 99 does not exist in this sweep/],
      ['twice', JSON.stringify({ case: 1, seed: cases[1].seed, values: { x: 2 }, result: { y: 4, flag: false } }), /case 1 is recorded twice/],
      ['values', null as unknown as string, /case 1 has x = 7, but this sweep's case 1 has 2/],
      ['seed', null as unknown as string, /case 1 has seed 5, but this sweep's case 1 has seed/],
      ['damaged', '{"case": 1, oops}', /damaged: the line is not a JSON record/],
    ];
    for (const [name, line, message] of tamper) {
      const journal = await fresh(name);
      const lines = readFileSync(journal, 'utf8').split('\n');
      if (name === 'values' || name === 'seed') {
        const row = JSON.parse(lines[2]);
        if (name === 'values') row.values.x = 7;
        else row.seed = 5;
        lines[2] = JSON.stringify(row);
        writeFileSync(journal, lines.join('\n'));
      } else {
        appendFileSync(journal, `${line}\n`);
      }
      const e = errorOf(() => mergeSweepOf(table, journal));
      expect(e.message, name).toMatch(message);
      expect(e.line, name).toBe(name === 'values' || name === 'seed' ? 3 : 6);
      expect(e.field).toBe(`sweep journal ${journal}`);
      // a merge without the table rebuilds it from the journal's header and refuses the same lines
      expect(() => mergeSweep(journal), name).toThrow(message);
      // and resuming refuses it before any case runs (range, duplicates, damage)
      if (name !== 'values' && name !== 'seed') await expect(runSweep({ table, runCase: runner, stateDir: join(root, name) })).rejects.toThrow(message);
    }
    const shard = await fresh('shard', { index: 1, count: 2 });
    appendFileSync(shard, `${JSON.stringify({ case: 2, seed: cases[2].seed, values: { x: 3 }, result: {} })}\n`);
    expect(errorOf(() => mergeSweep(shard)).message).toMatch(/case 2 does not belong to shard 1\/2/);
  });

  it('a header whose fingerprint does not match its definition is refused', async () => {
    const journal = await fresh('forged');
    const lines = readFileSync(journal, 'utf8').split('\n');
    const header = JSON.parse(lines[0]);
    header.definition.seed = 4;
    lines[0] = JSON.stringify(header);
    writeFileSync(journal, lines.join('\n'));
    expect(errorOf(() => mergeSweep(journal)).message).toMatch(/fingerprint does not match/);
  });

  it('streams sweep.json to the bytes JSON.stringify gives for the whole document (missing cases and errors included)', async () => {
    const failing: CaseRunner = (c) => {
      if (c.index === 1) throw new Error('no good');
      return runner(c);
    };
    const journal = (await runSweep({ table, runCase: failing, stateDir: join(root, 'json'), shard: { index: 1, count: 2 } })).journal;
    const merged = mergeSweep(journal);
    const doc = { sweep: { fingerprint: merged.fingerprint, varied: merged.varied, columns: merged.columns, missing: [...merged.missing()], cases: [...merged.rows()].map((r) => sweepJsonEntry(merged, r)) } };
    expect(doc.sweep.missing).toEqual([0, 2]);
    expect(sweepJson(merged)).toBe(`${JSON.stringify(doc, null, 2)}\n`);
  });
});

describe('--workers', () => {
  it('is capped at the cores available (common practice)', () => {
    expect(cappedWorkers(2, 4)).toBe(2);
    expect(cappedWorkers(64, 4)).toBe(4);
  });
});
