/**
 * Write a file so that a crash leaves either the old file or the whole new one: temp, fsync,
 * rename. A failed write removes its temp file; a temp file left by a writer that was killed is
 * removed by the next write of the same file (staleSiblings.ts), which says so on stderr.
 */
import { closeSync, fsyncSync, mkdirSync, openSync, renameSync, rmSync, writeSync } from 'node:fs';
import { dirname } from 'node:path';
import { removeStaleSiblings, siblingFileName, type Notify } from '../report/staleSiblings.js';
import { holdTemporary } from '../runtime/temporaryPaths.js';

export function writeFileAtomic(file: string, content: string, notify?: Notify): void {
  writeFileAtomicStreamed(file, (write) => write(content), notify);
}

const FLUSH_AT = 1 << 20;

/**
 * The same for content produced piece by piece: `produce` calls `write` as often as it likes;
 * pieces are buffered up to 1 MB, so a file of gigabytes never sits in memory. If `produce`
 * throws, the temporary file is removed and the old file is left as it was.
 */
export function writeFileAtomicStreamed(file: string, produce: (write: (piece: string) => void) => void, notify?: Notify): void {
  mkdirSync(dirname(file), { recursive: true });
  removeStaleSiblings(file, notify);
  const temp = siblingFileName(file);
  rmSync(temp, { force: true }); // this process's own leftover; 'wx' below never follows a link
  const release = holdTemporary(temp); // removed by the main thread if this thread is stopped hard
  let renamed = false;
  let fd: number | undefined;
  try {
    fd = openSync(temp, 'wx');
    const out = fd;
    let pending: string[] = [];
    let size = 0;
    const flush = (): void => {
      if (pending.length > 0) writeSync(out, pending.join(''));
      pending = [];
      size = 0;
    };
    produce((piece) => {
      pending.push(piece);
      size += piece.length;
      if (size >= FLUSH_AT) flush();
    });
    flush();
    fsyncSync(out);
    closeSync(out);
    fd = undefined;
    renameSync(temp, file);
    renamed = true;
  } finally {
    if (fd !== undefined) closeSync(fd);
    if (!renamed) rmSync(temp, { force: true });
    release();
  }
}
