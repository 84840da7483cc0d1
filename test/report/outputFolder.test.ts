// common practice: a tool replaces only what it wrote itself, never follows a link to delete,
// and cleans up the temporaries of a writer that was killed.
import { afterAll, describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, readdirSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { InputError } from '../../src/scenario/inputError.js';
import { OUTPUT_MARKER, checkOutFolder, hasOutputMarker, outputMarkerText } from '../../src/report/outputFolder.js';
import { processIsAlive, removeStaleSiblings } from '../../src/report/staleSiblings.js';
import { writeFileAtomic } from '../../src/studies/atomicWrite.js';

const root = mkdtempSync(join(tmpdir(), 'stanchion-outfolder-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));

function refusal(dir: string, rules: Parameters<typeof checkOutFolder>[1]): string {
  try {
    checkOutFolder(dir, rules);
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    expect((e as InputError).field).toBe('--out');
    return e instanceof Error ? e.message : '';
  }
  throw new Error(`${dir} was not refused`);
}

function deadPid(): number {
  return spawnSync(process.execPath, ['-e', '']).pid as number;
}

const marker = outputMarkerText({ command: 'stanchion assess x.yaml --out r', version: '0.0.0', created: '2026-01-01T00:00:00Z' });

describe('checkOutFolder', () => {
  const force = { force: true };

  it('accepts a new folder and a marked stanchion folder (with force)', () => {
    expect(checkOutFolder(join(root, 'new'), force)).toBe('absent');
    const dir = join(root, 'marked');
    mkdirSync(dir);
    writeFileSync(join(dir, OUTPUT_MARKER), marker);
    expect(hasOutputMarker(dir)).toBe(true);
    expect(checkOutFolder(dir, force)).toBe('replace');
    expect(refusal(dir, { force: false })).toMatch(/already exists; choose a new folder or pass --force/);
  });

  it('refuses the working folder, every folder above it, and the input files with their folders', () => {
    const cwd = process.cwd();
    expect(refusal('.', force)).toMatch(/is the working folder/);
    expect(refusal(cwd, force)).toMatch(/is the working folder/);
    expect(refusal(dirname(cwd), force)).toMatch(/holds the working folder/);
    expect(refusal('/', force)).toMatch(/holds the working folder/);
    const inputs = join(root, 'inputs');
    mkdirSync(join(inputs, 'deep'), { recursive: true });
    const scenario = join(inputs, 'deep', 's.yaml');
    writeFileSync(scenario, 'x');
    writeFileSync(join(inputs, 'deep', OUTPUT_MARKER), marker); // even a marked folder holding an input is kept
    expect(refusal(join(inputs, 'deep'), { force: true, inputFiles: [scenario] })).toMatch(/holds the input file/);
    expect(refusal(inputs, { force: true, inputFiles: ['-', scenario] })).toMatch(/holds the input file/);
    expect(refusal(scenario, { force: true, inputFiles: [scenario] })).toMatch(/is an input file of this run/);
    // the same folder reached through a link in its parents
    symlinkSync(inputs, join(root, 'via-link'));
    expect(refusal(join(root, 'via-link', 'deep'), { force: true, inputFiles: [scenario] })).toMatch(/holds the input file/);
    expect(readdirSync(join(inputs, 'deep')).sort()).toEqual([OUTPUT_MARKER, 's.yaml']);
  });

  it('refuses files, devices, links and unmarked folders, and a marker that is not a plain file', () => {
    writeFileSync(join(root, 'plain.txt'), 'x');
    expect(refusal(join(root, 'plain.txt'), force)).toMatch(/is a file, not a folder/);
    expect(refusal('/dev/null', force)).toMatch(/is a device/);
    const target = join(root, 'target');
    mkdirSync(target);
    writeFileSync(join(target, OUTPUT_MARKER), marker);
    symlinkSync(target, join(root, 'link'));
    expect(refusal(join(root, 'link'), force)).toMatch(/is a symbolic link/);
    const user = join(root, 'user');
    mkdirSync(user);
    expect(refusal(user, force)).toMatch(/not a stanchion output folder .*remove it yourself/);
    symlinkSync(join(target, OUTPUT_MARKER), join(user, OUTPUT_MARKER)); // a linked marker does not count
    expect(refusal(user, force)).toMatch(/not a stanchion output folder/);
    const fake = join(root, 'fake');
    mkdirSync(join(fake, OUTPUT_MARKER), { recursive: true }); // nor a folder of that name
    expect(refusal(fake, force)).toMatch(/not a stanchion output folder/);
    const other = join(root, 'other');
    mkdirSync(other);
    writeFileSync(join(other, OUTPUT_MARKER), '{"tool": "something else"}');
    expect(refusal(other, force)).toMatch(/not a stanchion output folder/);
  });

  it('names the option it was given', () => {
    let field = '';
    try {
      checkOutFolder('.', { force: true, field: 'OUT' });
    } catch (e) {
      field = (e as InputError).field;
    }
    expect(field).toBe('OUT');
  });
});

describe('leftovers of interrupted writes', () => {
  it('removes only the hidden siblings of writers that are gone, and says so once', () => {
    const dir = join(root, 'stale');
    mkdirSync(dir);
    const target = join(dir, 'report');
    const gone = deadPid();
    expect(processIsAlive(gone)).toBe(false);
    expect(processIsAlive(process.pid)).toBe(true);
    const names = [`.report.partial-${gone}-1-0`, `.report.replaced-${gone}-1-1`, `.report.${gone}.tmp`, `.report.partial-${process.pid}-1-0`, `.other.partial-${gone}-1-0`, 'report'];
    for (const n of names.slice(0, 2)) mkdirSync(join(dir, n));
    writeFileSync(join(dir, names[2]), 'x');
    for (const n of names.slice(3)) mkdirSync(join(dir, n));
    // a stale name that is a link to user files: the link goes, the files stay
    const userFiles = join(root, 'user-files');
    mkdirSync(userFiles);
    writeFileSync(join(userFiles, 'keep.txt'), 'mine');
    symlinkSync(userFiles, join(dir, `.report.partial-${gone}-2-0`));
    const lines: string[] = [];
    const removed = removeStaleSiblings(target, (l) => lines.push(l));
    expect(removed.sort()).toEqual([names[0], names[1], names[2], `.report.partial-${gone}-2-0`].sort());
    expect(lines).toHaveLength(1);
    expect(lines[0]).toMatch(/^removed 4 unfinished outputs left in .* by an interrupted run/);
    expect(readdirSync(dir).sort()).toEqual(names.slice(3).sort());
    expect(readFileSync(join(userFiles, 'keep.txt'), 'utf8')).toBe('mine');
    expect(removeStaleSiblings(target, (l) => lines.push(l))).toEqual([]);
    expect(lines).toHaveLength(1);
  });

  it('writeFileAtomic removes a killed writer’s temp file and leaves no temp of its own', () => {
    const dir = join(root, 'atomic');
    mkdirSync(dir);
    const stale = join(dir, `.sweep.csv.${deadPid()}.tmp`);
    writeFileSync(stale, 'half');
    const lines: string[] = [];
    writeFileAtomic(join(dir, 'sweep.csv'), 'a,b\n', (l) => lines.push(l));
    expect(readFileSync(join(dir, 'sweep.csv'), 'utf8')).toBe('a,b\n');
    expect(existsSync(stale)).toBe(false);
    expect(lines).toHaveLength(1);
    expect(readdirSync(dir)).toEqual(['sweep.csv']);
  });

  it('writeFileAtomic never writes through a link at the final name', () => {
    const dir = join(root, 'atomic-link');
    mkdirSync(dir);
    writeFileSync(join(root, 'elsewhere.txt'), 'untouched');
    symlinkSync(join(root, 'elsewhere.txt'), join(dir, 'sweep.csv'));
    writeFileAtomic(join(dir, 'sweep.csv'), 'new\n', () => {});
    expect(readFileSync(join(root, 'elsewhere.txt'), 'utf8')).toBe('untouched');
    expect(readFileSync(join(dir, 'sweep.csv'), 'utf8')).toBe('new\n');
  });
});
