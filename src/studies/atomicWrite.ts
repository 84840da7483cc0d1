/** Write a file so that a crash leaves either the old file or the whole new one: temp, fsync, rename. */
import { closeSync, fsyncSync, mkdirSync, openSync, renameSync, writeSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { holdTemporary } from '../runtime/temporaryPaths.js';

export function writeFileAtomic(file: string, content: string): void {
  const dir = dirname(file);
  mkdirSync(dir, { recursive: true });
  const temp = join(dir, `.${basename(file)}.${process.pid}.tmp`);
  const release = holdTemporary(temp); // removed by the main thread if this thread is stopped hard
  try {
    const fd = openSync(temp, 'w');
    try {
      writeSync(fd, content);
      fsyncSync(fd);
    } finally {
      closeSync(fd);
    }
    renameSync(temp, file);
  } finally {
    release();
  }
}
