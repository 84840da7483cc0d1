/**
 * Checking a folder the command will write to, before anything is written: it may exist (then
 * it must be a folder we can write in) or not (then the nearest existing parent must be such a
 * folder, so it can be created). A mistake is one InputError naming the option (exit 2).
 */
import { accessSync, constants, statSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { InputError } from '../scenario/inputError.js';

function writableFolder(path: string): boolean {
  try {
    accessSync(path, constants.W_OK | constants.X_OK | constants.R_OK);
    return true;
  } catch {
    return false;
  }
}

export function checkFolderTarget(path: string, field: string): void {
  let here = resolve(path);
  for (;;) {
    let isFolder: boolean;
    try {
      isFolder = statSync(here).isDirectory();
    } catch (err) {
      const code = (err as NodeJS.ErrnoException).code;
      if (code === 'ENOENT') {
        const parent = dirname(here);
        if (parent === here) throw new InputError(field, `${path}: cannot be created`);
        here = parent;
        continue;
      }
      if (code === 'ENOTDIR') throw new InputError(field, `${path}: a part of the path is a file, not a folder`);
      throw new InputError(field, `${path}: cannot be read (${code ?? 'unknown error'})`);
    }
    const shown = here === resolve(path) ? path : `${path} (its existing parent ${here})`;
    if (!isFolder) throw new InputError(field, `${shown} is a file, not a folder`);
    if (!writableFolder(here)) throw new InputError(field, `${shown} is not a folder this user can write in (read-only or no permission)`);
    return;
  }
}
