/** A path as the terminal shows it: relative to the working folder when it lies inside it. */
import { isAbsolute, relative, resolve } from 'node:path';

export function shownPath(path: string, cwd: string = process.cwd()): string {
  const rel = relative(cwd, resolve(cwd, path));
  if (rel === '') return '.';
  if (rel.startsWith('..') || isAbsolute(rel)) return path;
  return rel;
}
