// common practice: an output folder is written whole or not at all (write to a temp name, then rename).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, mkdirSync, readFileSync, readdirSync, rmSync, writeFileSync, existsSync } from 'node:fs';
import { promises as fsp } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { renderReportFiles, writeOutputs } from '../../src/report/writeOutputs.js';
import { InputError } from '../../src/scenario/inputError.js';
import { OUTPUT_MARKER, hasOutputMarker } from '../../src/report/outputFolder.js';
import { SECTION_TITLES, sectionOrder } from '../../src/report/reportDocument.js';
import { demoReportInput, demoResultJson } from './fixture.js';

const input = demoReportInput();
const result = demoResultJson(input);
let root = '';
let files: Map<string, string | Uint8Array>;

const EXPECTED = [
  'report.html',
  'result.json',
  'summary.md',
  'samples.csv',
  'samples-summary.csv',
  'tornado.csv',
  'restraint-curve.csv',
  'sweep.csv',
  'partial-factors.csv',
  'strength-models.csv',
  ...['column-sketch', 'mode-shapes', 'samples-histogram', 'mc-convergence', 'tornado-utilization', 'tornado-capacity', 'conditional-beta', 'importance', 'restraint-curve', 'sweep'].flatMap((n) => [
    `charts/${n}.svg`,
    `charts/${n}.png`,
  ]),
].sort();

/** What a written folder holds: the rendered files plus the marker. */
const WRITTEN = [...EXPECTED, OUTPUT_MARKER].sort();

/** A folder as an earlier run left it: the marker and one stale file. */
async function earlierReport(dir: string, stale: string): Promise<void> {
  await writeOutputs(dir, input, result, { png: false });
  writeFileSync(join(dir, stale), 'old');
}

function listTree(dir: string, prefix = ''): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) =>
    e.isDirectory() ? listTree(join(dir, e.name), `${prefix}${e.name}/`) : [`${prefix}${e.name}`],
  );
}

/** Skip the PNGs where a test is about the folder, not the files (rendering PNGs is the slow part). */
const fast = { png: false };

beforeAll(async () => {
  root = mkdtempSync(join(tmpdir(), 'stanchion-report-test-'));
  files = await renderReportFiles(input, result);
});

afterAll(() => {
  rmSync(root, { recursive: true, force: true });
});

describe('renderReportFiles', () => {
  it('renders every file', () => {
    expect([...files.keys()].sort()).toEqual(EXPECTED);
  });

  it('writes the contract JSON unchanged', () => {
    expect(JSON.parse(files.get('result.json') as string)).toEqual(JSON.parse(JSON.stringify(result)));
  });

  it('puts every section heading in the HTML and the Markdown', () => {
    const html = files.get('report.html') as string;
    const md = files.get('summary.md') as string;
    // the fixture has no evidence and no test plans: those two sections are left out
    for (const title of sectionOrder('assessment').filter((id) => id !== 'measurements' && id !== 'testPlans').map((id) => SECTION_TITLES[id])) {
      expect(html).toContain(`<h2>${title}</h2>`);
      expect(md).toContain(`## ${title}\n`);
    }
  });

  it('makes a self-contained HTML file', () => {
    const html = files.get('report.html') as string;
    expect(html).not.toMatch(/<script\b/i);
    expect(html).not.toMatch(/<link\b/i);
    expect(html).not.toMatch(/\b(src|href)\s*=\s*"(https?:)?\/\//i);
    expect(html).not.toMatch(/url\(\s*['"]?(https?:)?\/\//i);
    expect(html).not.toMatch(/@import/i);
    // every chart is inline
    // every chart is inline (the fixture is an assessment: its sweep chart belongs to a sweep report)
    expect((html.match(/<figure class="chart"/g) ?? []).length).toBe(8);
    expect(html).toContain('@media print');
    expect(html).toContain('@page');
  });

  it('keeps inline SVG ids unique across charts', () => {
    const html = files.get('report.html') as string;
    const ids = [...html.matchAll(/\sid="([^"]+)"/g)].map((m) => m[1]);
    expect(new Set(ids).size).toBe(ids.length);
  });

  it('writes PNGs that are PNGs', () => {
    for (const [name, data] of files) {
      if (name.endsWith('.png')) expect(Buffer.from(data as Uint8Array).subarray(1, 4).toString('latin1')).toBe('PNG');
    }
  });
});

describe('writeOutputs', () => {
  it('creates the folder with every file', async () => {
    const dir = join(root, 'fresh');
    const out = await writeOutputs(dir, input, result);
    expect(out.files).toEqual(WRITTEN);
    expect(listTree(dir).sort()).toEqual(WRITTEN);
    expect(hasOutputMarker(dir)).toBe(true);
    const marker = JSON.parse(readFileSync(join(dir, OUTPUT_MARKER), 'utf8')) as Record<string, string>;
    expect(marker.tool).toBe('stanchion');
    expect(marker.command).toBe(input.meta.commandLine);
    expect(marker.version).toBe(input.meta.toolVersion);
    expect(Number.isNaN(Date.parse(marker.created))).toBe(false);
    expect(readFileSync(join(dir, 'report.html'), 'utf8')).toContain('<!DOCTYPE html>');
    expect(readdirSync(root).filter((n) => n.startsWith('.'))).toEqual([]);
  });

  it('refuses an existing folder without force', async () => {
    const dir = join(root, 'existing');
    mkdirSync(dir);
    writeFileSync(join(dir, 'keep.txt'), 'mine');
    const err = await writeOutputs(dir, input, result, fast).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(InputError);
    expect((err as InputError).field).toBe('--out');
    expect(readFileSync(join(dir, 'keep.txt'), 'utf8')).toBe('mine');
    expect(listTree(dir)).toEqual(['keep.txt']);
  });

  it('replaces an existing stanchion folder whole with force', async () => {
    const dir = join(root, 'replaced');
    await earlierReport(dir, 'stale.txt');
    await writeOutputs(dir, input, result, { ...fast, force: true });
    expect(existsSync(join(dir, 'stale.txt'))).toBe(false);
    expect(existsSync(join(dir, 'report.html'))).toBe(true);
    expect(readdirSync(root).filter((n) => n.startsWith('.'))).toEqual([]);
  });

  it('leaves nothing behind when a write fails midway', async () => {
    const dir = join(root, 'failing');
    let calls = 0;
    const writeFile = async (p: string, d: string | Uint8Array) => {
      if (++calls === 5) throw new Error('disk full (injected)');
      await fsp.writeFile(p, d);
    };
    await expect(writeOutputs(dir, input, result, { ...fast, writeFile })).rejects.toThrow('disk full (injected)');
    expect(calls).toBe(5);
    expect(existsSync(dir)).toBe(false);
    expect(readdirSync(root).filter((n) => n.includes('failing'))).toEqual([]);
  });

  it('keeps the old folder intact when a forced replacement fails', async () => {
    const dir = join(root, 'precious');
    await earlierReport(dir, 'old.txt');
    const before = listTree(dir).sort();
    let calls = 0;
    const writeFile = async (p: string, d: string | Uint8Array) => {
      if (++calls === 3) throw new Error('injected');
      await fsp.writeFile(p, d);
    };
    await expect(writeOutputs(dir, input, result, { ...fast, force: true, writeFile })).rejects.toThrow('injected');
    expect(listTree(dir).sort()).toEqual(before);
    expect(readFileSync(join(dir, 'old.txt'), 'utf8')).toBe('old');
    expect(readdirSync(root).filter((n) => n.includes('precious'))).toEqual(['precious']);
  });

  it('creates missing parent folders, and refuses a path that runs through a file', async () => {
    const written = await writeOutputs(join(root, 'no', 'such', 'dir'), input, result, fast);
    expect(readdirSync(written.dir)).toContain('report.html');
    writeFileSync(join(root, 'plain-file'), 'x');
    const err = await writeOutputs(join(root, 'plain-file', 'dir'), input, result, fast).catch((e: unknown) => e);
    expect(err).toBeInstanceOf(InputError);
    expect((err as InputError).field).toBe('--out');
    expect(readFileSync(join(root, 'plain-file'), 'utf8')).toBe('x');
  });
});
