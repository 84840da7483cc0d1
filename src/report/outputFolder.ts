/**
 * Which folder a report may be written to, and which one `--force` may replace.
 *
 * A report folder carries OUTPUT_MARKER, a small JSON file saying stanchion wrote it. `--force`
 * replaces only a folder with that marker. Everything else is refused with a reason: the working
 * folder, the scenario's folder or any folder holding either; a plain file, device, socket, pipe
 * or symbolic link (looked at with lstat, so a link is never followed to its target); a folder of
 * someone else's files.
 */
import { lstatSync, readFileSync, realpathSync, type Stats } from 'node:fs';
import { basename, dirname, join, resolve, sep } from 'node:path';
import { InputError } from '../scenario/inputError.js';

export const OUTPUT_MARKER = '.stanchion-output.json';

/** A marker larger than this was not written by stanchion. */
const MARKER_MAX_BYTES = 64 * 1024;

export interface OutputMarkerInfo {
  command: string; // the command line that wrote the folder
  version: string; // stanchion's version
  created: string; // ISO 8601
}

/** The marker's text: who wrote the folder, with what command, when, and why the file is there. */
export function outputMarkerText(info: OutputMarkerInfo): string {
  const doc = {
    tool: 'stanchion',
    purpose: 'marks this folder as a stanchion output; --force replaces only folders that carry this file',
    command: info.command,
    version: info.version,
    created: info.created,
  };
  return `${JSON.stringify(doc, null, 2)}\n`;
}

/** True when `dir` holds a regular-file marker that names stanchion. */
export function hasOutputMarker(dir: string): boolean {
  const file = join(dir, OUTPUT_MARKER);
  try {
    const st = lstatSync(file);
    if (!st.isFile() || st.size > MARKER_MAX_BYTES) return false;
    const doc = JSON.parse(readFileSync(file, 'utf8')) as unknown;
    return typeof doc === 'object' && doc !== null && (doc as { tool?: unknown }).tool === 'stanchion';
  } catch {
    return false;
  }
}

function realOrSelf(path: string): string {
  try {
    return realpathSync(path);
  } catch {
    return path;
  }
}

/** Where `path` really is, resolving links in its parents but not `path` itself. */
function realLocation(path: string): string {
  return join(realOrSelf(dirname(path)), basename(path));
}

function isSameOrInside(outer: string, inner: string): boolean {
  return inner === outer || inner.startsWith(outer.endsWith(sep) ? outer : outer + sep);
}

function kindOf(st: Stats): string {
  if (st.isSymbolicLink()) return 'a symbolic link';
  if (st.isFile()) return 'a file, not a folder';
  if (st.isCharacterDevice() || st.isBlockDevice()) return 'a device';
  if (st.isSocket()) return 'a socket';
  if (st.isFIFO()) return 'a named pipe';
  return 'not a folder';
}

export interface OutFolderRules {
  /** Replace an existing stanchion output folder (never anything else). */
  force: boolean;
  /** The files read (scenario, sweep file; '-' for stdin is skipped): they, their folders and the folders above are kept. */
  inputFiles?: readonly string[];
  /** The option named in messages (default '--out'). */
  field?: string;
}

/** Why writing a report at `dir` would destroy what must be kept, or null when it would not. */
function keptReason(dir: string, inputFiles: readonly string[]): string | null {
  const targets = [resolve(dir), realLocation(resolve(dir))];
  const cwd = process.cwd();
  const kept: Array<{ path: string; is: string; holds: string }> = [cwd, realOrSelf(cwd)].map((path) => ({ path, is: 'is the working folder', holds: 'holds the working folder' }));
  for (const input of inputFiles) {
    if (input === '-') continue;
    for (const path of [resolve(input), realOrSelf(resolve(input))]) kept.push({ path, is: 'is an input file of this run', holds: `holds the input file ${input}` });
  }
  for (const { path, is, holds } of kept) {
    for (const target of targets) {
      if (target === path) return is;
      if (isSameOrInside(target, path)) return holds;
    }
  }
  return null;
}

/**
 * Checks `dir` before anything is computed or written. Returns 'absent' (a new folder will be
 * made) or 'replace' (a stanchion output folder, and `force` is set); throws InputError otherwise.
 */
export function checkOutFolder(dir: string, rules: OutFolderRules): 'absent' | 'replace' {
  const field = rules.field ?? '--out';
  const kept = keptReason(dir, rules.inputFiles ?? []);
  if (kept !== null) throw new InputError(field, `${dir} ${kept}; stanchion never writes a report over it: choose a new folder for the report`);
  let st: Stats;
  try {
    st = lstatSync(dir);
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    if (code === 'ENOENT') return 'absent'; // created with any missing parent folders when written
    if (code === 'ENOTDIR') throw new InputError(field, `${dir}: a part of the path is a file, not a folder`);
    throw new InputError(field, `cannot inspect ${dir}: ${(e as Error).message}`);
  }
  if (!st.isDirectory()) {
    const link = st.isSymbolicLink() ? ', which stanchion never replaces nor follows' : ', which stanchion never replaces';
    throw new InputError(field, `${dir} is ${kindOf(st)}${link}: choose a new folder for the report`);
  }
  const marked = hasOutputMarker(dir);
  if (!marked) {
    throw new InputError(field, `${dir} already exists and is not a stanchion output folder (it has no ${OUTPUT_MARKER}); choose another name or remove it yourself`);
  }
  if (!rules.force) throw new InputError(field, `${dir} already exists; choose a new folder or pass --force to replace it`);
  return 'replace';
}
