/**
 * Write a file so that a crash leaves either the old file or the whole new one: temp, fsync,
 * rename. A failed write removes its temp file; a temp file left by a writer that was killed is
 * removed by the next write of the same file (staleSiblings.ts), which says so on stderr.
 */
import { closeSync, fsyncSync, mkdirSync, openSync, renameSync, rmSync, writeSync } from 'node:fs';
import { dirname } from 'node:path';
import { removeStaleSiblings, siblingFileName, type Notify } from '../report/staleSiblings.js';

export function writeFileAtomic(file: string, content: string, notify?: Notify): void {
  mkdirSync(dirname(file), { recursive: true });
  removeStaleSiblings(file, notify);
  const temp = siblingFileName(file);
  rmSync(temp, { force: true }); // this process's own leftover; 'wx' below never follows a link
  try {
    const fd = openSync(temp, 'wx');
    try {
      writeSync(fd, content);
      fsyncSync(fd);
    } finally {
      closeSync(fd);
    }
    renameSync(temp, file);
  } catch (e) {
    rmSync(temp, { force: true });
    throw e;
  }
}
