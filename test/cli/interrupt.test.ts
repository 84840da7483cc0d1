/**
 * Ctrl-C end to end: spawn the built CLI on scenarios that spend seconds in one phase, send
 * SIGINT while that phase runs, and require exit code 130 within 1.5 s, one line saying what
 * stopped, and nothing half-written. The many-variable scenarios are the braced demo column
 * with extra small random loads (invented demo data). Behaviour checks: common practice
 * (130 = 128 + SIGINT, the shell's convention).
 */
import { spawn } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CLI, ROOT } from './runCli.js';

let dir: string;
const BASE = readFileSync(join(ROOT, 'scenarios', 'braced-base-plate.yaml'), 'utf8');

/** The demo column with `extra` more random loads; without the E–fy correlation when `independent`. */
function manyLoads(extra: number, independent = false): string {
  const loads = Array.from({ length: extra }, (_, k) => `  extra_${k}: {dist: normal, mean: 0.05 kN, cov: 0.2}\n`).join('');
  let text = BASE.replace('loads:\n', `loads:\n${loads}`);
  if (independent) text = text.replace(/correlation:\n(  - .*\n)+/, '');
  return text;
}

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'stanchion-ctrl-c-'));
  writeFileSync(join(dir, 'many400.yaml'), manyLoads(400));
  writeFileSync(join(dir, 'many200.yaml'), manyLoads(200));
  writeFileSync(join(dir, 'many200-independent.yaml'), manyLoads(200, true));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

interface Stopped {
  status: number | null;
  stdout: string;
  stderr: string;
  /** Milliseconds from the first SIGINT to the exit. */
  afterSigint: number;
}

/** Run the CLI, send SIGINT after `delayMs` (and again after `secondMs` if given), wait for the exit. */
function interruptAfter(args: string[], delayMs: number, secondMs?: number): Promise<Stopped> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [CLI, ...args], { cwd: dir, stdio: ['ignore', 'pipe', 'pipe'] });
    let stdout = '';
    let stderr = '';
    child.stdout.on('data', (d: Buffer) => (stdout += d.toString()));
    child.stderr.on('data', (d: Buffer) => (stderr += d.toString()));
    let sentAt = NaN;
    const timer = setTimeout(() => {
      sentAt = performance.now();
      child.kill('SIGINT');
      if (secondMs !== undefined) setTimeout(() => child.kill('SIGINT'), secondMs);
    }, delayMs);
    child.on('error', reject);
    child.on('close', (status) => {
      clearTimeout(timer);
      resolve({ status, stdout, stderr, afterSigint: performance.now() - sentAt });
    });
  });
}

/** Exit 130 soon after the Ctrl-C, nothing on stdout, and a single line on stderr. */
function expectStopped(r: Stopped, message: RegExp): void {
  expect(r.status).toBe(130);
  expect(r.afterSigint).toBeLessThan(1500);
  expect(r.stdout).toBe('');
  const lines = r.stderr.split('\n').filter((l) => l.trim() !== '');
  expect(lines).toHaveLength(1);
  expect(lines[0]).toMatch(message);
}

/** Nothing in `parent` whose name starts with `.name.` (a hidden partial folder or temp file). */
function hiddenLeftovers(parent: string, name: string): string[] {
  return existsSync(parent) ? readdirSync(parent).filter((n) => n.startsWith(`.${name}.`)) : [];
}

describe('Ctrl-C stops every phase within a second, exit 130', () => {
  it('FORM on 400 correlated variables', async () => {
    const r = await interruptAfter(['assess', 'many400.yaml', '--methods', 'form', '--out', 'form-out'], 4000);
    expectStopped(r, /^stanchion: interrupted during [^;]+; nothing was written$/);
    expect(existsSync(join(dir, 'form-out'))).toBe(false);
    expect(hiddenLeftovers(dir, 'form-out')).toEqual([]);
  });

  it('the sensitivity studies (200 variables)', async () => {
    // FORM takes well under a second here; the conditional β and elasticity FORMs take minutes
    const r = await interruptAfter(['assess', 'many200-independent.yaml', '--methods', 'form', '--out', 'sens-out'], 4000);
    expectStopped(r, /^stanchion: interrupted during [^;]+; nothing was written$/);
    expect(existsSync(join(dir, 'sens-out'))).toBe(false);
    expect(hiddenLeftovers(dir, 'sens-out')).toEqual([]);
  });

  it('the restraint study (200 variables)', async () => {
    const r = await interruptAfter(['restraint', 'many200.yaml', '--out', 'restraint-out'], 3500);
    expectStopped(r, /^stanchion: interrupted during [^;]+; nothing was written$/);
    expect(existsSync(join(dir, 'restraint-out'))).toBe(false);
    expect(hiddenLeftovers(dir, 'restraint-out')).toEqual([]);
  });

  it('Monte Carlo keeps its message with the samples done (2 workers)', async () => {
    // how long this machine, at its present load, takes to reach the sampling: a short run to the end
    const started = performance.now();
    await interruptAfter(['assess', join(ROOT, 'scenarios', 'braced-base-plate.yaml'), '--methods', 'form,mc', '--samples', '1000', '--workers', '2'], 600_000);
    const reach = performance.now() - started;
    const r = await interruptAfter(['assess', join(ROOT, 'scenarios', 'braced-base-plate.yaml'), '--methods', 'form,mc', '--samples', '200000000', '--workers', '2', '--out', 'mc-out'], reach + 1500);
    expectStopped(r, /^stanchion: interrupted after \d+ Monte Carlo samples; nothing was written$/);
    expect(existsSync(join(dir, 'mc-out'))).toBe(false);
  });

  for (const workers of ['1', '2']) {
    it(`a sweep with --workers ${workers}: complete journal lines only, no results`, async () => {
      const out = `sweep-${workers}`;
      const args = ['sweep', join(ROOT, 'scenarios', 'braced-base-plate.yaml'), '--vary', 'loads.dead.mean=300 kN:500 kN:40', '--methods', 'form,mc', '--samples', '3000000', '--workers', workers, '--out', out];
      const r = await interruptAfter(args, 3500);
      expectStopped(r, /^stanchion: interrupted during the sweep; no results were written, finished cases stay in .*journal-0-of-1\.jsonl \(run the same command again to resume\)$/);
      const outDir = join(dir, out);
      expect(readdirSync(outDir)).toEqual(['.state']); // no sweep.csv, sweep.json or report/
      const journal = readFileSync(join(outDir, '.state', 'journal-0-of-1.jsonl'), 'utf8');
      expect(journal.endsWith('\n')).toBe(true);
      const rows = journal.trim().split('\n').slice(1).map((l) => JSON.parse(l) as { error?: string });
      expect(rows.every((row) => row.error === undefined)).toBe(true); // an interrupted case is not a failed one
      expect(readdirSync(join(outDir, '.state')).filter((n) => n.startsWith('.'))).toEqual([]);
    });
  }

  it('a second Ctrl-C exits at once and leaves nothing behind', async () => {
    const r = await interruptAfter(['assess', 'many400.yaml', '--methods', 'form', '--out', 'twice-out'], 4000, 100);
    expect(r.status).toBe(130);
    expect(r.afterSigint).toBeLessThan(1500);
    // the interrupt may come while the report is written, after the line that says so
    const lines = r.stderr.trim().split('\n').filter((l) => l !== 'stanchion: writing the report …');
    expect(lines, r.stderr).toHaveLength(1);
    expect(lines[0]).toMatch(/^stanchion: interrupted/);
    expect(existsSync(join(dir, 'twice-out'))).toBe(false);
    expect(hiddenLeftovers(dir, 'twice-out')).toEqual([]);
  });
});
