/**
 * `stanchion new` as a real process of the compiled CLI (npm test builds dist/ first).
 * common practice: a starter file goes straight into the next command, and an existing file
 * is never overwritten by accident.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { starterScenario } from '../../src/scenario/starterScenario.js';
import { CLI, ROOT, runCli } from './runCli.js';

const dir = mkdtempSync(join(tmpdir(), 'stanchion-new-cli-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('stanchion new', () => {
  it('prints the starter scenario, and `stanchion new | stanchion check -` succeeds', async () => {
    const alone = await runCli(['new']);
    expect(alone.status, alone.stderr).toBe(0);
    expect(alone.stdout).toBe(starterScenario('braced'));
    const node = JSON.stringify(process.execPath);
    const cli = JSON.stringify(CLI);
    const pipeline = spawnSync('bash', ['-o', 'pipefail', '-c', `${node} ${cli} new | ${node} ${cli} check -`], { cwd: ROOT, encoding: 'utf8' });
    expect(pipeline.status, pipeline.stderr).toBe(0);
    expect(pipeline.stdout).toMatch(/mean-value ratio/);
  });

  it('writes FILE, which `check --json` reads', async () => {
    const file = join(dir, 'post.yaml');
    const made = await runCli(['new', '--frame', 'sway', file]);
    expect(made.status, made.stderr).toBe(0);
    expect(readFileSync(file, 'utf8')).toBe(starterScenario('sway'));
    const check = await runCli(['check', file, '--json']);
    expect(check.status, check.stderr).toBe(0);
    const c = JSON.parse(check.stdout).check;
    expect(c.utilization).toBeGreaterThan(0);
    expect(Number.isFinite(c.utilization)).toBe(true);
    // a sway column has K >= 1 (common practice)
    expect(c.effective_length_factor).toBeGreaterThanOrEqual(1);
  });

  it('keeps an existing FILE unless --force, leaving no temporary file behind', async () => {
    const file = join(dir, 'mine.yaml');
    writeFileSync(file, 'my own notes\n');
    const refused = await runCli(['new', file]);
    expect(refused.status).toBe(2);
    expect(refused.stderr.trim().split('\n')).toHaveLength(1);
    expect(refused.stderr).toMatch(/already exists.*--force/);
    expect(readFileSync(file, 'utf8')).toBe('my own notes\n');
    const forced = await runCli(['new', file, '--force']);
    expect(forced.status, forced.stderr).toBe(0);
    expect(readFileSync(file, 'utf8')).toBe(starterScenario('braced'));
    expect(readdirSync(dir).filter((n) => n.endsWith('.tmp'))).toEqual([]);
  });

  it('refuses a bad --frame or a file name that is not YAML, writing nothing', async () => {
    expect((await runCli(['new', '--frame', 'portal'])).status).toBe(2);
    const json = join(dir, 'x.json');
    const r = await runCli(['new', json]);
    expect(r.status).toBe(2);
    expect(existsSync(json)).toBe(false);
  });
});
