import { appendFileSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { InputError } from '../../src/scenario/inputError.js';
import type { CaseRunner } from '../../src/studies/caseRunner.js';
import { mergeSweep } from '../../src/studies/mergeSweep.js';
import { runSweep } from '../../src/studies/runSweep.js';
import { SweepJournal } from '../../src/studies/sweepJournal.js';
import { buildCaseTable, iterateCases } from '../../src/studies/sweepDesign.js';
import type { CaseTable } from '../../src/studies/sweepTypes.js';

const allCases = (t: CaseTable) => [...iterateCases(t)];
import { sweepCsv, sweepJson } from '../../src/studies/sweepOutput.js';
import { parseVaryOption } from '../../src/studies/varyOption.js';

// common practice: append-only journals with fsync and a tolerated torn tail
const root = mkdtempSync(join(tmpdir(), 'stanchion-journal-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));

const table = buildCaseTable({ design: 'grid', seed: 3, vary: [parseVaryOption('x=1:4:4'), parseVaryOption('L=2 m:3 m:2')] });
const runner: CaseRunner = (c) => ({ y: (c.values.x as number) * 2 + c.seed / 2 ** 31, tag: `a,"b"`, inf: 1 / 0 });

describe('sweep journal and outputs (in-process runner)', () => {
  it('records each case once, resumes after a torn last line and writes deterministic CSV/JSON', async () => {
    const stateDir = join(root, 'a');
    let calls = 0;
    const counting: CaseRunner = (c) => {
      calls++;
      return runner(c);
    };
    const first = await runSweep({ table, runCase: counting, stateDir });
    expect(first).toMatchObject({ ran: 8, skipped: 0, errors: 0, shardCases: 8 });
    const complete = readFileSync(first.journal, 'utf8');
    expect(complete.trim().split('\n').length).toBe(9);

    appendFileSync(first.journal, '{"case": 9, "seed": 12');
    const again = await runSweep({ table, runCase: counting, stateDir });
    expect(again).toMatchObject({ ran: 0, skipped: 8 });
    expect(calls).toBe(8);
    expect(readFileSync(first.journal, 'utf8')).toBe(complete); // torn tail cut off

    const merged = mergeSweep(first.journal);
    const csv = sweepCsv(merged);
    const lines = csv.split('\n');
    expect(lines[0]).toBe('case,x,L,y,tag,inf');
    expect(lines[1]).toBe(`0,1,2 m,${2 + allCases(table)[0].seed / 2 ** 31},"a,""b""",Infinity`);
    expect(merged.missingCount).toBe(0);
    const json = JSON.parse(sweepJson(merged));
    expect(json.sweep.cases[7]).toEqual({ case: 7, seed: allCases(table)[7].seed, values: { x: 4, L: '3 m' }, result: { y: 8 + allCases(table)[7].seed / 2 ** 31, tag: 'a,"b"', inf: 'Infinity' } });
  });

  it('resumes a partly finished journal without repeating or losing cases', async () => {
    const stateDir = join(root, 'b');
    let calls = 0;
    const stopAfterThree: CaseRunner = (c) => {
      if (++calls > 3) throw new Error('simulated crash');
      return runner(c);
    };
    const partial = await runSweep({ table, runCase: stopAfterThree, stateDir });
    expect(partial.errors).toBe(5); // a thrown case is recorded with its message ...
    const withErrors = sweepCsv(mergeSweep(partial.journal));
    expect(withErrors.split('\n')[0]).toBe('case,x,L,y,tag,inf,error');
    expect(withErrors.split('\n')[4]).toMatch(/,simulated crash$/);
    // ... and a fresh sweep in another folder equals an uninterrupted run
    const full = await runSweep({ table, runCase: runner, stateDir: join(root, 'c') });
    const reference = await runSweep({ table, runCase: runner, stateDir: join(root, 'd') });
    expect(sweepCsv(mergeSweep(full.journal))).toBe(sweepCsv(mergeSweep(reference.journal)));
  });

  it('puts each case in the file as it finishes (a killed process loses none) and syncs the batch on close', () => {
    // common practice: write() hands the bytes to the operating system at once; fsync only guards against its crash
    const stateDir = join(root, 'batched');
    const header = { stanchion_sweep_journal: 1 as const, fingerprint: 'f', varied: table.varied, cases: table.count, shard: { index: 0, count: 1 } };
    const journal = SweepJournal.open(stateDir, header);
    const cases = allCases(table).slice(0, 3);
    for (const c of cases) journal.record({ case: c.index, seed: c.seed, values: c.values, result: { y: 1 } });
    const before = readFileSync(journal.file, 'utf8').trim().split('\n');
    expect(before.length).toBe(1 + cases.length); // header + every case, before any close
    journal.close();
    const reopened = SweepJournal.open(stateDir, header);
    expect(cases.every((c) => reopened.isDone(c.index))).toBe(true);
    expect(reopened.doneCount).toBe(3);
    reopened.close();
  });

  it('refuses a state folder that holds another sweep', async () => {
    const stateDir = join(root, 'e');
    await runSweep({ table, runCase: runner, stateDir, identity: { methods: ['form'] } });
    await expect(runSweep({ table, runCase: runner, stateDir, identity: { methods: ['mc'] } })).rejects.toThrow(InputError);
  });

  it('merges shards into the bytes of a single run', async () => {
    const single = await runSweep({ table, runCase: runner, stateDir: join(root, 'f') });
    const shards = [];
    for (let index = 0; index < 3; index++) {
      shards.push((await runSweep({ table, runCase: runner, stateDir: join(root, 'g'), shard: { index, count: 3 } })).journal);
    }
    expect(mergeSweep(shards[0]).missingCount).toBe(5);
    const merged = mergeSweep(...shards.reverse());
    expect(sweepCsv(merged)).toBe(sweepCsv(mergeSweep(single.journal)));
    expect(sweepJson(merged)).toBe(sweepJson(mergeSweep(single.journal)));
  });
});
