/**
 * `stanchion sweep` and `stanchion merge` as real processes of the compiled CLI (npm test
 * builds dist/ first). common practice: a batch run killed at any moment resumes from its
 * journal and ends with the files an uninterrupted run writes; shards merge to the same bytes.
 */
import { spawn } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CLI, ROOT, runCli } from './runCli.js';

const dir = mkdtempSync(join(tmpdir(), 'stanchion-sweep-cli-'));
const scenario = join(dir, 'column.yaml');
// invented column; a soft base so that Monte Carlo sees failures
const SCENARIO = `stanchion: 1
title: sweep CLI test column
column:
  length: 5 m
  frame: braced
  section: {area: 6000 mm^2, inertia: 15e6 mm^4, section_modulus: 150e3 mm^3}
  material:
    E: {dist: lognormal, mean: 200 GPa, cov: 0.03}
    fy: {dist: lognormal, mean: 300 MPa, cov: 0.07}
  ends:
    bottom: {rotation: {dist: lognormal, mean: 1 MN m/rad, cov: 0.5}}
    top: pinned
  imperfection:
    bow: {dist: normal, mean: L/1500, sd: L/3000}
loads:
  dead: {dist: normal, mean: 380 kN, cov: 0.10}
  imposed: {dist: gumbel, mean: 150 kN, cov: 0.25}
model_factor: {dist: lognormal, mean: 1.0, cov: 0.05}
strength: first-yield
target_beta: 3.8
`;
// 4 × 4 = 16 cases; Monte Carlo makes each take a noticeable time, so a kill lands mid-way
const SWEEP = [
  '--vary', 'column.ends.bottom.rotation.mean=log:0.2 MN m/rad:20 MN m/rad:4',
  '--vary', 'column.length=4 m:7 m:4',
  '--methods', 'form,mc', '--samples', '20000', '--seed', '11',
];
const CASES = 16;

interface Finished {
  code: number | null;
  signal: NodeJS.Signals | null;
  stdout: string;
  stderr: string;
}

function start(args: string[]): { done: Promise<Finished>; kill: () => void } {
  const child = spawn(process.execPath, [CLI, ...args], { cwd: ROOT, stdio: ['ignore', 'pipe', 'pipe'] });
  let stdout = '';
  let stderr = '';
  child.stdout.on('data', (d: Buffer) => (stdout += d.toString()));
  child.stderr.on('data', (d: Buffer) => (stderr += d.toString()));
  const done = new Promise<Finished>((resolve) => child.on('close', (code, signal) => resolve({ code, signal, stdout, stderr })));
  return { done, kill: () => child.kill('SIGKILL') };
}

const sweep = (out: string, extra: string[] = []): string[] => ['sweep', scenario, ...SWEEP, '--out', join(dir, out), ...extra];
const files = (out: string): [string, string] => [readFileSync(join(dir, out, 'sweep.csv'), 'utf8'), readFileSync(join(dir, out, 'sweep.json'), 'utf8')];
const recordsIn = (journal: string): number => (existsSync(journal) ? readFileSync(journal, 'utf8').split('\n').length - 2 : 0);
const pause = (ms: number): Promise<void> => new Promise((resolve) => setTimeout(resolve, ms));

let reference: [string, string];

beforeAll(async () => {
  for (const [src, js] of [['src/cli/sweepCommand.ts', 'dist/src/cli/sweepCommand.js'], ['src/studies/columnCaseRunner.ts', 'dist/src/studies/columnCaseRunner.js']]) {
    const twin = join(ROOT, js);
    if (!existsSync(twin) || statSync(twin).mtimeMs < statSync(join(ROOT, src)).mtimeMs) throw new Error(`${js} is missing or stale: build first (npm test does)`);
  }
  writeFileSync(scenario, SCENARIO);
  // the reference run and the resumed runs in this process: only the killed run needs to be a process of its own
  const run = await runCli(sweep('reference', ['--json']));
  expect(run.status, run.stderr).toBe(0);
  reference = files('reference');
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('stanchion sweep', () => {
  it('writes one row per case with finite FORM β, and --json prints one document', async () => {
    const [csv] = reference;
    const lines = csv.trim().split('\n');
    expect(lines).toHaveLength(1 + CASES);
    const header = lines[0].split(',');
    expect(header.slice(0, 3)).toEqual(['case', 'column.ends.bottom.rotation.mean', 'column.length']);
    const beta = header.indexOf('beta_form');
    for (const line of lines.slice(1)) expect(Number.isFinite(Number(line.split(',')[beta]))).toBe(true);
    const json = JSON.parse(reference[1]);
    expect(json.sweep.cases).toHaveLength(CASES);
  });

  it('killed with SIGKILL mid-way and run again, writes what an uninterrupted run writes', async () => {
    const journal = join(dir, 'killed', '.state', 'journal-0-of-1.jsonl');
    const run = start(sweep('killed'));
    for (let waited = 0; recordsIn(journal) < 3 && waited < 60_000; waited += 10) await pause(10);
    run.kill();
    const killed = await run.done;
    expect(killed.signal).toBe('SIGKILL');
    const recorded = recordsIn(journal);
    expect(recorded).toBeGreaterThanOrEqual(3);
    expect(recorded).toBeLessThan(CASES); // the kill really landed mid-way
    expect(existsSync(join(dir, 'killed', 'sweep.csv'))).toBe(false);
    const again = await runCli(sweep('killed', ['--json']));
    expect(again.status, again.stderr).toBe(0);
    const summary = JSON.parse(again.stdout).sweep;
    expect(summary.skipped).toBe(recorded);
    expect(summary.ran).toBe(CASES - recorded);
    expect(files('killed')).toEqual(reference);
    // a third run finds everything finished and recomputes nothing
    const third = JSON.parse((await runCli(sweep('killed', ['--json']))).stdout).sweep;
    expect([third.ran, third.skipped]).toEqual([0, CASES]);
    expect(files('killed')).toEqual(reference);
  });

  it('--shard 0/2 and 1/2 merged equal the single run byte for byte', async () => {
    const state = join(dir, 'shards-state');
    const [a, b] = await Promise.all([
      start(sweep('shard0', ['--shard', '0/2', '--state', state])).done,
      start(sweep('shard1', ['--shard', '1/2', '--state', state])).done,
    ]);
    expect(a.code, a.stderr).toBe(0);
    expect(b.code, b.stderr).toBe(0);
    expect(existsSync(join(dir, 'shard0', 'sweep.csv'))).toBe(false); // a shard keeps only its journal
    expect(a.stdout).toContain(`stanchion merge ${state}`);
    const merged = await runCli(['merge', state, '--out', join(dir, 'merged')]);
    expect(merged.status, merged.stderr).toBe(0);
    expect(files('merged')).toEqual(reference);
  });

  it('the emitted Slurm array script: its shard body run as Slurm runs each task, then its merge body, gives the single run byte for byte', async () => {
    // Slurm sets SLURM_ARRAY_TASK_ID/MIN/MAX/COUNT in each task of `sbatch --array=0-2`
    // (Slurm documentation, sbatch "OUTPUT ENVIRONMENT VARIABLES")
    const out = join(dir, 'slurm-out');
    const emitted = await runCli([...sweep('slurm-out'), '--emit-array-script', '3']);
    expect(emitted.status, emitted.stderr).toBe(0);
    expect(existsSync(out)).toBe(false); // emitting runs nothing and writes nothing
    const script = emitted.stdout;
    expect(script).toMatch(/sbatch --parsable --array=0-2 /);
    expect(script).toMatch(/--dependency=afterok:\$\{array_job\}/);
    const body = (tag: string): string => {
      const m = new RegExp(`<<'${tag}'\\n([\\s\\S]*?)\\n${tag}\\n`).exec(script);
      if (!m) throw new Error(`no ${tag} body in the script`);
      return m[1];
    };
    const wrapper = join(dir, 'stanchion-wrapper.sh');
    writeFileSync(wrapper, `#!/bin/sh\nexec ${JSON.stringify(process.execPath)} ${JSON.stringify(CLI)} "$@"\n`, { mode: 0o755 });
    const bash = (text: string, env: Record<string, string>): Promise<Finished> => {
      const child = spawn('bash', ['-c', text], { cwd: ROOT, env: { ...process.env, STANCHION: wrapper, ...env }, stdio: ['ignore', 'pipe', 'pipe'] });
      let stderr = '';
      child.stderr.on('data', (d: Buffer) => (stderr += d.toString()));
      return new Promise((resolve) => child.on('close', (code, signal) => resolve({ code, signal, stdout: '', stderr })));
    };
    const tasks = await Promise.all(
      [0, 1, 2].map((id) =>
        bash(body('STANCHION_SHARD'), { SLURM_ARRAY_TASK_ID: String(id), SLURM_ARRAY_TASK_MIN: '0', SLURM_ARRAY_TASK_MAX: '2', SLURM_ARRAY_TASK_COUNT: '3' }),
      ),
    );
    for (const t of tasks) expect(t.code, t.stderr).toBe(0);
    const merged = await bash(body('STANCHION_MERGE'), {});
    expect(merged.code, merged.stderr).toBe(0);
    expect(files('slurm-out')).toEqual(reference);
  });

  it('--shard auto outside an array job is refused with exit 2 naming --shard', async () => {
    const r = await runCli([...sweep('no-array'), '--shard', 'auto']);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/--shard/);
    expect(r.stderr).toMatch(/SLURM_ARRAY_TASK_ID/);
    expect(existsSync(join(dir, 'no-array'))).toBe(false);
  });

  it('a bad --vary exits 2 with one line on stderr naming --vary, and writes nothing', async () => {
    for (const bad of ['column.lenght=4 m:7 m:3', 'column.length=4 m:7 mm:3', 'loads.dead.mean=300 kN,abc', 'loads.dead.mean=300 MPa:400 MPa:3']) {
      const r = await runCli(['sweep', scenario, '--vary', bad, '--out', join(dir, 'bad')]);
      expect(r.status).toBe(2);
      expect(r.stdout).toBe('');
      const lines = r.stderr.trim().split('\n');
      expect(lines).toHaveLength(1);
      expect(lines[0]).toContain('--vary');
      // the value came from the command line, not from a line of the scenario file
      expect(lines[0]).not.toMatch(/\(line \d+\)/);
    }
    expect(existsSync(join(dir, 'bad'))).toBe(false);
  });

  it('a scenario without --vary, or another sweep in the same folder, is refused with exit 2', async () => {
    const none = await runCli(['sweep', scenario, '--out', join(dir, 'none')]);
    expect(none.status).toBe(2);
    expect(none.stderr).toContain('--vary');
    const other = await runCli(['sweep', scenario, '--vary', 'column.length=4 m:5 m:2', '--out', join(dir, 'reference')]);
    expect(other.status).toBe(2);
    expect(other.stderr).toMatch(/different sweep/);
    expect(files('reference')).toEqual(reference);
  });

  it('ends with how many cases meet the target and where β crosses it; the report path comes last', async () => {
    const r = await runCli(['sweep', scenario, '--vary', 'column.length=3 m:9 m:4', '--out', join(dir, 'line')]);
    expect(r.status, r.stderr).toBe(0);
    const csv = readFileSync(join(dir, 'line', 'sweep.csv'), 'utf8').trim().split('\n');
    const beta = csv[0].split(',').indexOf('beta_form');
    const betas = csv.slice(1).map((l) => Number(l.split(',')[beta]));
    const meeting = betas.filter((b) => b >= 3.8).length;
    const last = r.stdout.trimEnd().split('\n').pop() ?? '';
    expect(last).toMatch(new RegExp(`^result: ${meeting} of 4 cases meet the target β = 3\\.80`));
    // β falls with the length and the range is chosen so that it crosses 3.8 inside it
    expect(meeting).toBeGreaterThan(0);
    expect(meeting).toBeLessThan(4);
    expect(last).toMatch(/; β crosses it at column length = \d\.\d+ m$/);
    const err = r.stderr.trimEnd().split('\n');
    expect(err[err.length - 1]).toMatch(/^stanchion: sweep report written to .*line\/report\/report\.html$/);
    expect(err[err.length - 2]).toBe('stanchion: writing the report …');
  });

  it('reads a sweep file whose scenario path is relative to it', async () => {
    const file = join(dir, 'study.yaml');
    writeFileSync(file, ['scenario: column.yaml', 'seed: 3', 'vary:', '  - "loads.dead.mean=300 kN:400 kN:3"', ''].join('\n'));
    const r = await runCli(['sweep', file, '--out', join(dir, 'study'), '--json']);
    expect(r.status, r.stderr).toBe(0);
    const doc = JSON.parse(r.stdout).sweep;
    expect(doc.varied).toEqual(['loads.dead.mean']);
    expect(doc.methods).toEqual(['form']);
    const demand = doc.results.map((c: { result: { demand: number } }) => c.result.demand);
    // demand = dead + imposed means (common practice: docs/mechanics.md, S is the sum of the loads)
    expect(demand[0]).toBeCloseTo(300e3 + 150e3, 6);
    expect(demand[2]).toBeCloseTo(400e3 + 150e3, 6);
  });
});
