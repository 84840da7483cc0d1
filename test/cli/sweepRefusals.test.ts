/**
 * `stanchion sweep` and `merge` refuse path mistakes, bad values and foreign journal lines with
 * one line on stderr naming the option (or the journal and its line) and exit 2, writing nothing.
 * common practice: check everything before writing; exit 2 for what the user can fix.
 */
import { appendFileSync, existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runCli } from './runCli.js';

const dir = mkdtempSync(join(tmpdir(), 'stanchion-refusals-'));
const scenario = join(dir, 'column.yaml');
// invented column, deterministic except for its loads, so FORM is quick
const SCENARIO = `stanchion: 1
title: refusal test column
column:
  length: 5 m
  frame: braced
  section: {area: 6000 mm^2, inertia: 15e6 mm^4, section_modulus: 150e3 mm^3}
  material: {E: 200 GPa, fy: 300 MPa}
  ends: {bottom: {rotation: 1 MN m/rad}, top: pinned}
  imperfection: {bow: L/1000}
loads:
  dead: {dist: normal, mean: 300 kN, cov: 0.10}
strength: first-yield
target_beta: 3.8
`;
const small = (out: string, extra: string[] = []): string[] => ['sweep', scenario, '--vary', 'column.length=4 m:5 m:2', '--out', join(dir, out), ...extra];

async function refused(args: string[], field: RegExp): Promise<string> {
  const r = await runCli(args);
  expect(r.status, r.stderr).toBe(2);
  expect(r.stdout).toBe('');
  const lines = r.stderr.trim().split('\n');
  expect(lines, r.stderr).toHaveLength(1);
  expect(lines[0]).toMatch(field);
  return lines[0];
}

beforeAll(() => {
  writeFileSync(scenario, SCENARIO);
  writeFileSync(join(dir, 'a-file'), 'not a folder\n');
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('path mistakes exit 2 with one line', () => {
  it('--state or --out pointing to a file, or below a file', async () => {
    await refused(small('s1', ['--state', join(dir, 'a-file')]), /^stanchion: --state: .*a-file is a file, not a folder/);
    await refused(['sweep', scenario, '--vary', 'column.length=4 m:5 m:2', '--out', join(dir, 'a-file')], /^stanchion: --out: .*is a file, not a folder/);
    await refused(small('x', ['--out', join(dir, 'a-file', 'deeper')]), /^stanchion: --out: /);
    expect(existsSync(join(dir, 's1'))).toBe(false);
  });

  it('merge --out pointing to a file; a state folder that is not there', async () => {
    const ok = await runCli(small('m', ['--shard', '0/2', '--state', join(dir, 'm-state')]));
    expect(ok.status, ok.stderr).toBe(0);
    await refused(['merge', join(dir, 'm-state'), '--out', join(dir, 'a-file')], /^stanchion: --out: .*is a file, not a folder/);
    await refused(['merge', join(dir, 'nowhere'), '--out', join(dir, 'm-out')], /^stanchion: STATE_DIR: /);
    expect(existsSync(join(dir, 'm-out'))).toBe(false);
  });
});

describe('bad values and journals exit 2 before anything runs or is written', () => {
  it('a bad value in the middle of a --vary list', async () => {
    const line = await refused(['sweep', scenario, '--vary', 'column.length=4 m,-2 m,5 m', '--out', join(dir, 'v')], /sweep case 1: column\.length = -2 m/);
    // the value came from --vary, not from a line of the scenario file
    expect(line).toMatch(/^stanchion: --vary column\.length: must be greater than zero/);
    expect(existsSync(join(dir, 'v'))).toBe(false);
  });

  it('a sweep file with an unknown key or seed: true', async () => {
    const file = join(dir, 'study.yaml');
    writeFileSync(file, ['scenario: column.yaml', 'seed: true', 'vary:', '  - "column.length=4 m:5 m:2"', ''].join('\n'));
    await refused(['sweep', file, '--out', join(dir, 'f')], /^stanchion: seed: expected a whole number >= 0, got true/);
    writeFileSync(file, ['scenario: column.yaml', 'methds: [form]', 'vary:', '  - "column.length=4 m:5 m:2"', ''].join('\n'));
    await refused(['sweep', file, '--out', join(dir, 'f')], /^stanchion: methds: unknown key \(did you mean 'methods'\?\)/);
    expect(existsSync(join(dir, 'f'))).toBe(false);
  });

  it('a journal line of a case that does not exist, or a damaged line, is refused with its line; the CSV is untouched', async () => {
    const first = await runCli(small('j'));
    expect(first.status, first.stderr).toBe(0);
    const csv = readFileSync(join(dir, 'j', 'sweep.csv'), 'utf8');
    const journal = join(dir, 'j', '.state', 'journal-0-of-1.jsonl');
    const intact = readFileSync(journal, 'utf8');
    appendFileSync(journal, `${JSON.stringify({ case: 7, seed: 1, values: { 'column.length': '9 m' }, result: { beta_form: 9 } })}\n`);
    await refused(small('j'), /^stanchion: sweep journal .*journal-0-of-1\.jsonl \(line 4\): case 7 does not exist in this sweep/);
    await refused(['merge', join(dir, 'j', '.state'), '--out', join(dir, 'j-merged')], /\(line 4\): case 7 does not exist/);
    writeFileSync(journal, `${intact}{"case": 1 garbage}\n`);
    await refused(small('j'), /\(line 4\): damaged/);
    expect(readFileSync(join(dir, 'j', 'sweep.csv'), 'utf8')).toBe(csv);
    expect(existsSync(join(dir, 'j-merged'))).toBe(false);
  });
});

describe('--workers', () => {
  it('more workers than cores are capped with one line, and the sweep proceeds', async () => {
    const r = await runCli(['sweep', scenario, '--vary', 'column.length=4 m,5 m', '--out', join(dir, 'w'), '--workers', '4096']);
    expect(r.status, r.stderr).toBe(0);
    expect(r.stderr).toMatch(/--workers 4096 capped at \d+, the number of cores available/);
    await refused(small('w0', ['--workers', '0']), /--workers/);
    await refused(small('w0', ['--workers', '1.5']), /--workers/);
  });
});
