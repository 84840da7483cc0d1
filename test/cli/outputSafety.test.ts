// common practice: an output option never destroys what the tool did not write; input is read
// within its size limit; messages never echo a huge value back. Every case runs in a temporary
// folder as its working folder: the program in this process, and the compiled CLI as a child
// process where standard input is read.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, lstatSync, mkdirSync, mkdtempSync, readFileSync, readdirSync, rmSync, statSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import YAML from 'yaml';
import { CLI, ROOT, runCli } from './runCli.js';
import { OUTPUT_MARKER } from '../../src/report/outputFolder.js';

interface Run {
  status: number | null;
  stdout: string;
  stderr: string;
}

const base = mkdtempSync(join(tmpdir(), 'stanchion-out-safety-'));
/** The working folder of every run; the scenario sits in `inputs/` inside it. */
const work = join(base, 'work');
const scenarioText = readFileSync(join(ROOT, 'scenarios', 'sway-canopy-post.yaml'), 'utf8').replace(
  /^title: .*$/m,
  'title: "<img src=x onerror=alert(1)> [click](http://example.invalid) **loud** # =1+2"',
);

/** The command in the working folder `work` (a child process when it reads stdin). */
function run(args: string[], input?: string): Promise<Run> {
  return runCli(args, input, work);
}

/** Every path under `dir` with its content (folders end in '/'), to show nothing changed. */
function snapshot(dir: string, prefix = ''): string[] {
  return readdirSync(dir, { withFileTypes: true })
    .sort((a, b) => a.name.localeCompare(b.name))
    .flatMap((e) => {
      const rel = `${prefix}${e.name}`;
      if (e.isSymbolicLink()) return [`${rel} -> link`];
      if (e.isDirectory()) return [`${rel}/`, ...snapshot(join(dir, e.name), `${rel}/`)];
      return [`${rel}: ${readFileSync(join(dir, e.name), 'utf8')}`];
    });
}

/** A process id that no longer exists: a child that has already exited. */
function deadPid(): number {
  const r = spawnSync(process.execPath, ['-e', '']);
  return r.pid as number;
}

function expectRefused(r: Run, pattern: RegExp): void {
  expect(r.status, r.stderr).toBe(2);
  expect(r.stderr).toMatch(pattern);
  expect(r.stderr.trim().split('\n')).toHaveLength(1); // one line, no stack
}

const assessTo = (out: string, ...extra: string[]): string[] => ['assess', 'inputs/s.yaml', '--methods', 'form', '--out', out, ...extra];

beforeAll(() => {
  mkdirSync(join(work, 'inputs'), { recursive: true });
  writeFileSync(join(work, 'inputs', 's.yaml'), scenarioText);
  writeFileSync(join(base, 'beside.txt'), 'a file next to the working folder');
  mkdirSync(join(work, 'mine'));
  writeFileSync(join(work, 'mine', 'thesis.txt'), 'user file');
  writeFileSync(join(work, 'notes.txt'), 'plain file');
  symlinkSync(join(work, 'mine'), join(work, 'linked'));
});
afterAll(() => rmSync(base, { recursive: true, force: true }));

describe('--force replaces only a stanchion output folder', () => {
  it('never touches the working folder, its parent, the root or the scenario folder', async () => {
    const before = snapshot(base);
    expectRefused(await run(assessTo('.', '--force')), /^stanchion: --out: \. is the working folder/);
    expectRefused(await run(assessTo('..', '--force')), /^stanchion: --out: \.\. holds the working folder/);
    expectRefused(await run(assessTo('inputs', '--force')), /inputs holds the input file inputs\/s\.yaml/);
    expectRefused(await run(['restraint', 'inputs/s.yaml', '--out', '.', '--force']), /is the working folder/);
    expectRefused(await run(['assess', '-', '--methods', 'form', '--out', '..', '--force'], scenarioText), /holds the working folder/);
    expect(snapshot(base)).toEqual(before);
  });

  it('refuses a plain file, a device and a symbolic link, and leaves them as they were', async () => {
    const before = snapshot(base);
    expectRefused(await run(assessTo('notes.txt', '--force')), /notes\.txt is a file, not a folder, which stanchion never replaces/);
    expectRefused(await run(assessTo('/dev/null', '--force')), /\/dev\/null is a device/);
    expect(statSync('/dev/null').isCharacterDevice()).toBe(true);
    expectRefused(await run(assessTo('linked', '--force')), /linked is a symbolic link, which stanchion never replaces nor follows/);
    expect(lstatSync(join(work, 'linked')).isSymbolicLink()).toBe(true);
    expect(readFileSync(join(work, 'mine', 'thesis.txt'), 'utf8')).toBe('user file');
    expect(snapshot(base)).toEqual(before);
  });

  it('refuses a folder of someone else’s files, with or without --force', async () => {
    const before = snapshot(base);
    expectRefused(await run(assessTo('mine', '--force')), /mine already exists and is not a stanchion output folder .*choose another name or remove it yourself/);
    expectRefused(await run(assessTo('mine')), /not a stanchion output folder/);
    expect(snapshot(base)).toEqual(before);
  });

  it('marks its own folder, replaces it only with --force, and removes leftovers of a killed writer', async () => {
    const first = await run(assessTo('report'));
    expect(first.status, first.stderr).toBe(0);
    const marker = JSON.parse(readFileSync(join(work, 'report', OUTPUT_MARKER), 'utf8')) as Record<string, string>;
    expect(marker).toMatchObject({ tool: 'stanchion', command: `stanchion ${assessTo('report').join(' ')}` });
    expectRefused(await run(assessTo('report')), /report already exists; choose a new folder or pass --force/);

    // user text in summary.md stays text: no HTML, link, emphasis or heading from the title
    const md = readFileSync(join(work, 'report', 'summary.md'), 'utf8');
    const heading = md.split('\n')[0];
    expect(heading).toBe('# &lt;img src=x onerror=alert(1)&gt; \\[click\\](http://example.invalid) \\*\\*loud\\*\\* # =1+2');
    expect(md).not.toContain('<img');

    // a killed writer's hidden folder is removed (its process is gone); a live one's is kept
    const stale = join(work, `.report.partial-${deadPid()}-1-0`);
    const live = join(work, `.report.partial-${process.pid}-1-0`);
    for (const d of [stale, live]) {
      mkdirSync(d);
      writeFileSync(join(d, 'report.html'), 'half');
    }
    writeFileSync(join(work, 'report', 'extra.txt'), 'added later');
    const second = await run(assessTo('report', '--force'));
    expect(second.status, second.stderr).toBe(0);
    expect(second.stderr).toMatch(/^stanchion: removed 1 unfinished output left in .* by an interrupted run \(\.report\.partial-\d+-1-0\)$/m);
    expect(existsSync(stale)).toBe(false);
    expect(existsSync(live)).toBe(true);
    expect(existsSync(join(work, 'report', 'extra.txt'))).toBe(false);
    expect(existsSync(join(work, 'report', OUTPUT_MARKER))).toBe(true);
    rmSync(live, { recursive: true });
    expect(readdirSync(work).filter((n) => n.startsWith('.'))).toEqual([]);
  });
});

describe('the sweep deletes nothing it did not write', () => {
  const sweepTo = (out: string): string[] => ['sweep', 'inputs/s.yaml', '--vary', 'column.length=4 m:5 m:2', '--out', out];

  it('refuses an OUT/report it did not write before any case runs', async () => {
    mkdirSync(join(work, 'sw1', 'report'), { recursive: true });
    writeFileSync(join(work, 'sw1', 'report', 'plan.txt'), 'user file');
    const before = snapshot(join(work, 'sw1'));
    const r = await run(sweepTo('sw1'));
    expectRefused(r, /sw1\/report already exists and is not a stanchion output folder/);
    expect(snapshot(join(work, 'sw1'))).toEqual(before); // no journal, no results: nothing ran
  });

  it('refuses an OUT/report that is a link, even though the sweep replaces its own', async () => {
    mkdirSync(join(work, 'sw2'));
    symlinkSync(join(work, 'mine'), join(work, 'sw2', 'report'));
    expectRefused(await run(sweepTo('sw2')), /report is a symbolic link/);
    expect(readFileSync(join(work, 'mine', 'thesis.txt'), 'utf8')).toBe('user file');
  });

  it('replaces its own marked report', async () => {
    mkdirSync(join(work, 'sw4', 'report'), { recursive: true });
    writeFileSync(join(work, 'sw4', 'report', OUTPUT_MARKER), JSON.stringify({ tool: 'stanchion' }));
    writeFileSync(join(work, 'sw4', 'report', 'old.html'), 'old');
    const r = await run(sweepTo('sw4'));
    expect(r.status, r.stderr).toBe(0);
    expect(existsSync(join(work, 'sw4', 'report', 'old.html'))).toBe(false);
    expect(existsSync(join(work, 'sw4', 'report', 'report.html'))).toBe(true);
    expect(JSON.parse(readFileSync(join(work, 'sw4', 'report', OUTPUT_MARKER), 'utf8'))).toMatchObject({ tool: 'stanchion' });
  });
});

describe('input edges', () => {
  it('stops reading an endless file at the 4 MB limit and names FILE', async () => {
    symlinkSync('/dev/zero', join(work, 'zero.yaml'));
    const r = await run(['check', 'zero.yaml']);
    expectRefused(r, /^stanchion: FILE: zero\.yaml is larger than the 4 MB limit of a scenario/);
  });

  it('stops reading endless standard input at the limit', async () => {
    const child = spawn(process.execPath, [CLI, 'check', '-'], { cwd: work, stdio: ['pipe', 'pipe', 'pipe'] });
    let stderr = '';
    let written = 0;
    let open = true;
    child.stderr.on('data', (d: Buffer) => (stderr += d.toString()));
    child.stdin.on('error', () => (open = false)); // EPIPE once the reader has stopped
    const chunk = Buffer.alloc(64 * 1024, 0x61);
    const pump = (): void => {
      while (open && written < 64e6 && child.stdin.write(chunk)) written += chunk.length;
      if (open && written < 64e6) child.stdin.once('drain', () => ((written += chunk.length), pump()));
    };
    pump();
    const code = await new Promise<number | null>((resolve) => child.on('close', resolve));
    open = false;
    expect(code, stderr).toBe(2);
    expect(stderr).toMatch(/^stanchion: FILE: standard input is larger than the 4 MB limit/);
    expect(written).toBeLessThan(16e6); // it stopped reading long before the writer gave up
  });

  it('accepts a leading UTF-8 byte order mark in JSON and YAML, from a file and from stdin', async () => {
    const bom = '\uFEFF';
    const json = JSON.stringify(YAML.parse(scenarioText) as unknown);
    writeFileSync(join(work, 'bom.json'), bom + json);
    for (const r of [await run(['check', 'bom.json']), await run(['check', '-'], bom + scenarioText)]) {
      expect(r.status, r.stderr).toBe(0);
      expect(r.stdout).toContain('stanchion check:');
    }
  });

  it('never echoes a huge value back in full', async () => {
    const huge = 'a'.repeat(100_000);
    writeFileSync(join(work, 'huge.yaml'), scenarioText.replace(/^( {2}length: ).*$/m, `$15.6 ${huge}`));
    for (const r of [await run(['check', 'huge.yaml']), await run(['check', 'inputs/s.yaml', '--units', huge])]) {
      expect(r.status).toBe(2);
      expect(r.stderr.length, r.stderr.slice(0, 300)).toBeLessThan(400);
      expect(r.stderr).toMatch(/a… \(\d{6} characters\)/);
    }
  });
});
