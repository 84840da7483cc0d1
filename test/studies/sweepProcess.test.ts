import { spawn } from 'node:child_process';
import { appendFileSync, existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mergeSweep } from '../../src/studies/mergeSweep.js';
import { runSweep } from '../../src/studies/runSweep.js';
import { buildCaseTable } from '../../src/studies/sweepDesign.js';
import { parseSweepFile } from '../../src/studies/sweepFile.js';
import { sweepCsv, sweepJson } from '../../src/studies/sweepOutput.js';
import { ensureBuilt, projectRoot } from './ensureBuilt.js';

// common practice: a crash-safe batch run resumes from its journal and loses nothing
const root = mkdtempSync(join(tmpdir(), 'stanchion-sweep-'));
const sweepFile = join(root, 'sweep.yaml');
const main = join(projectRoot, 'dist/src/studies/syntheticSweepMain.js');
const runnerModule = join(projectRoot, 'src/studies/syntheticCaseRunner.ts'); // mapped to its dist twin
const CASES = 30;

beforeAll(() => {
  ensureBuilt();
  writeFileSync(sweepFile, ['seed: 2026', 'design: grid', 'vary:', '  - "a=0:1:6"', '  - "b=log:1 kN:100 kN:5"', ''].join('\n'));
});
afterAll(() => rmSync(root, { recursive: true, force: true }));

interface Run {
  done: Promise<{ code: number | null; signal: NodeJS.Signals | null; stdout: string; stderr: string }>;
  kill: () => void;
}

function start(name: string, extra: string[] = []): Run {
  const args = [main, '--sweep', sweepFile, '--state', join(root, name, 'state'), '--csv', join(root, name, 'out.csv')];
  args.push('--json', join(root, name, 'out.json'), ...extra);
  const child = spawn(process.execPath, args, { stdio: ['ignore', 'pipe', 'pipe'] });
  let stdout = '';
  let stderr = '';
  child.stdout.on('data', (d: Buffer) => (stdout += d.toString()));
  child.stderr.on('data', (d: Buffer) => (stderr += d.toString()));
  const done = new Promise<{ code: number | null; signal: NodeJS.Signals | null; stdout: string; stderr: string }>((resolve) =>
    child.on('close', (code, signal) => resolve({ code, signal, stdout, stderr })),
  );
  return { done, kill: () => child.kill('SIGKILL') };
}

const journalLines = (file: string): number => (existsSync(file) ? readFileSync(file, 'utf8').split('\n').length - 1 : 0);
const pause = (ms: number): Promise<void> => new Promise((resolve) => setTimeout(resolve, ms));
const outputs = (name: string): [string, string] => [readFileSync(join(root, name, 'out.csv'), 'utf8'), readFileSync(join(root, name, 'out.json'), 'utf8')];

describe('sweep as a real process', () => {
  let reference: [string, string];

  beforeAll(async () => {
    const run = await start('reference', ['--workers', '2']).done;
    expect(run.code, run.stderr).toBe(0);
    reference = outputs('reference');
  });

  it('killed with SIGKILL mid-way and restarted, writes what an uninterrupted run writes', async () => {
    const journal = join(root, 'killed', 'state', 'journal-0-of-1.jsonl');
    const run = start('killed', ['--workers', '2', '--sleep', '80']); // ~1.2 s of work left after 8 cases
    for (let waited = 0; journalLines(journal) < 1 + 8 && waited < 20_000; waited += 10) await pause(10);
    run.kill();
    const killed = await run.done;
    expect(killed.signal).toBe('SIGKILL');
    const recorded = journalLines(journal) - 1;
    expect(recorded).toBeGreaterThanOrEqual(8);
    expect(recorded).toBeLessThan(CASES);
    expect(existsSync(join(root, 'killed', 'out.csv'))).toBe(false);
    appendFileSync(journal, '{"case":29,"seed":1,"val'); // and a torn write on top
    const resumed = await start('killed', ['--workers', '2']).done;
    expect(resumed.code, resumed.stderr).toBe(0);
    const summary = JSON.parse(resumed.stdout);
    expect(summary.skipped).toBe(recorded);
    expect(summary.ran + summary.skipped).toBe(CASES);
    expect(outputs('killed')).toEqual(reference);
    expect(journalLines(journal)).toBe(1 + CASES);
  });

  it('three shards merged equal the single run byte for byte', async () => {
    const journals: string[] = [];
    for (let i = 0; i < 3; i++) {
      const run = await start('sharded', ['--shard', `${i}/3`]).done;
      expect(run.code, run.stderr).toBe(0);
      journals.push(join(root, 'sharded', 'state', `journal-${i}-of-3.jsonl`));
    }
    const merged = mergeSweep(...journals);
    expect([sweepCsv(merged), sweepJson(merged)]).toEqual(reference);
    expect(reference[0].split('\n').length).toBe(CASES + 2);
  });

  it('one worker and two worker threads give identical results in-process too', async () => {
    const table = buildCaseTable(parseSweepFile(readFileSync(sweepFile, 'utf8'), sweepFile));
    const recipe = { module: runnerModule, exportName: 'syntheticCaseRunner', args: { sleepMs: 0 } };
    const one = await runSweep({ table, runCase: recipe, workers: 1, stateDir: join(root, 'w1') });
    const two = await runSweep({ table, runCase: recipe, workers: 2, stateDir: join(root, 'w2'), workerStartRepaidMs: 0 });
    expect(two.ran).toBe(CASES);
    expect(sweepCsv(mergeSweep(two.journal))).toBe(sweepCsv(mergeSweep(one.journal)));
    expect(sweepCsv(mergeSweep(one.journal))).toBe(reference[0]);
  });

  it('a recipe whose export is missing fails loudly in the workers', async () => {
    const table = buildCaseTable(parseSweepFile(readFileSync(sweepFile, 'utf8'), sweepFile));
    const recipe = { module: runnerModule, exportName: 'noSuchRunner', args: {} };
    await expect(runSweep({ table, runCase: recipe, workers: 2, stateDir: join(root, 'bad') })).rejects.toThrow(/noSuchRunner/);
  });

  it('a worker that dies mid-case fails the sweep instead of losing the case; a resume finishes it', async () => {
    const table = buildCaseTable(parseSweepFile(readFileSync(sweepFile, 'utf8'), sweepFile));
    const stateDir = join(root, 'dies');
    const dying = { module: runnerModule, exportName: 'syntheticCaseRunner', args: { sleepMs: 0, exitCases: [CASES - 1] } };
    await expect(runSweep({ table, runCase: dying, workers: 2, stateDir, workerStartRepaidMs: 0 })).rejects.toThrow(/stopped before/);
    const healthy = { module: runnerModule, exportName: 'syntheticCaseRunner', args: { sleepMs: 0 } };
    const resumed = await runSweep({ table, runCase: healthy, workers: 2, stateDir, workerStartRepaidMs: 0 });
    expect(resumed.ran).toBeGreaterThanOrEqual(1);
    expect(sweepCsv(mergeSweep(resumed.journal))).toBe(reference[0]);
  });
});
