/**
 * The repository stands on its own: someone who clones it can follow every citation, and no
 * file names a folder of the machine it was written on. Checks every file git tracks.
 */
import { describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { dirname, join, normalize, relative, sep } from 'node:path';
import { fileURLToPath } from 'node:url';

const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const THIS_FILE = relative(ROOT, fileURLToPath(import.meta.url)).split(sep).join('/');

// The patterns are built from pieces so that this file does not match itself by accident.
const SLASH = '/';
/** An absolute home, work or temporary folder of some machine (work, home, root, Users, tmp at the root) or a Windows user folder. */
const MACHINE_PATH = new RegExp(
  String.raw`(?<![\w.~+/\\-])${SLASH}(?:work|home|root|Users|tmp)${SLASH}(?=[\w.-])|\b[A-Za-z]:\\(?:Users|home)\\`,
);
/** A citation of a folder outside the repository: the team's shared folder or its files. */
const OUTSIDE_CITATION = new RegExp(
  [String.raw`\.\.${SLASH}shared\b`, String.raw`\bshared${SLASH}references\b`, String.raw`\bshared (?:mechanics )?references\b`, String.raw`\bCONTRACT\.md\b`, String.raw`\breferences${SLASH}(?:reliability|mechanics)\.md\b`].join('|'),
  'i',
);

export function findProblems(text: string): string[] {
  const problems: string[] = [];
  text.split('\n').forEach((line, i) => {
    const machine = MACHINE_PATH.exec(line);
    if (machine) problems.push(`line ${i + 1}: machine path near '${line.slice(Math.max(0, machine.index - 20), machine.index + 30)}'`);
    const outside = OUTSIDE_CITATION.exec(line);
    if (outside) problems.push(`line ${i + 1}: cites '${outside[0]}', which is not in the repository`);
  });
  return problems;
}

function trackedFiles(): string[] {
  const r = spawnSync('git', ['ls-files', '-z'], { cwd: ROOT, encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`git ls-files failed: ${r.stderr}`);
  return r.stdout.split('\0').filter((f) => f !== '' && existsSync(join(ROOT, f)));
}

function isText(bytes: Buffer): boolean {
  return !bytes.subarray(0, 8000).includes(0);
}

describe('the repository stands on its own', () => {
  const files = trackedFiles();

  it('no tracked file names a machine folder or cites a folder outside the repository', () => {
    expect(files.length).toBeGreaterThan(100);
    const found: string[] = [];
    for (const file of files) {
      if (file === THIS_FILE) continue;
      const bytes = readFileSync(join(ROOT, file));
      if (!isText(bytes)) continue;
      for (const p of findProblems(bytes.toString('utf8'))) found.push(`${file} ${p}`);
    }
    expect(found).toEqual([]);
  });

  it('every relative link in the Markdown files points to a tracked file inside the repository', () => {
    const tracked = new Set(files);
    const broken: string[] = [];
    for (const file of files.filter((f) => f.endsWith('.md') && !f.startsWith('reports/'))) {
      const text = readFileSync(join(ROOT, file), 'utf8');
      for (const m of text.matchAll(/\]\(([^)\s]+)\)/g)) {
        const target = m[1]!.split('#')[0]!;
        if (target === '' || /^[a-z]+:/i.test(target)) continue; // an anchor or a URL
        const path = normalize(join(dirname(file), target)).split(sep).join('/');
        const inside = !path.startsWith('..') && !path.startsWith('/');
        const exists = tracked.has(path) || files.some((f) => f.startsWith(`${path.replace(/\/$/, '')}/`));
        if (!inside || !exists) broken.push(`${file}: (${m[1]})`);
      }
    }
    expect(broken).toEqual([]);
  });

  it('the interface and the check values are restated in docs/', () => {
    for (const doc of ['docs/scenario-format.md', 'docs/json-output.md', 'docs/mechanics.md', 'docs/verification.md']) {
      expect(files, doc).toContain(doc);
    }
  });

  it('the detector flags what it is meant to flag (common practice: a check that can fail)', () => {
    const home = ['', 'home', 'someone', 'project', 'x.ts'].join('/');
    expect(findProblems(`see ${home}`)).toHaveLength(1);
    expect(findProblems(`const p = '${['', 'work', 'wt', 'a'].join('/')}';`)).toHaveLength(1);
    expect(findProblems(`written to ${['', 'tmp', 'sweepdemo'].join('/')}`)).toHaveLength(1);
    expect(findProblems(`// source: ${['..', 'shared', 'CONTRACT'].join('/')}.md §2`)).not.toHaveLength(0);
    expect(findProblems(`values of the ${'shared'} references §4`)).toHaveLength(1);
    // not machine paths: a repository-relative ignore pattern, a URL, a file name that ends in "root"
    expect(findProblems('/tmp/\n')).toEqual([]);
    expect(findProblems(`https://example.org${['', 'home', 'page'].join('/')}`)).toEqual([]);
    expect(findProblems(`probability${['', 'rootBracketed.ts'].join('/')}`)).toEqual([]);
  });
});
