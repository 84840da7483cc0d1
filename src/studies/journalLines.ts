/**
 * Reading a journal line by line in fixed-size chunks, so a journal of millions of cases is
 * never held in memory. Only complete lines (ending in '\n') are handed on: a torn tail is
 * what a kill in the middle of a write leaves, and the caller decides what to do with it.
 * Reading one line again later (by its offset) goes through a small read-ahead window,
 * so reading lines in file order costs one read per window, not one per line.
 */
import { closeSync, openSync, readSync } from 'node:fs';

const CHUNK = 1 << 20;

/** Calls `onLine` for every complete line; returns the byte length of the complete lines. */
export function forEachLine(file: string, onLine: (text: string, line: number, offset: number, bytes: number) => void): number {
  const fd = openSync(file, 'r');
  try {
    let carry = Buffer.alloc(0);
    let carryOffset = 0; // file offset of carry[0]
    let position = 0;
    let line = 0;
    const chunk = Buffer.allocUnsafe(CHUNK);
    for (;;) {
      const read = readSync(fd, chunk, 0, CHUNK, position);
      if (read === 0) break;
      position += read;
      const data = carry.length > 0 ? Buffer.concat([carry, chunk.subarray(0, read)]) : chunk.subarray(0, read);
      let start = 0;
      for (let nl = data.indexOf(0x0a, start); nl >= 0; nl = data.indexOf(0x0a, start)) {
        line += 1;
        onLine(data.toString('utf8', start, nl), line, carryOffset + start, nl + 1 - start);
        start = nl + 1;
      }
      carry = Buffer.from(data.subarray(start)); // a copy: chunk is reused
      carryOffset += start;
    }
    return carryOffset;
  } finally {
    closeSync(fd);
  }
}

/** Random access to lines of one file by (offset, bytes), with a read-ahead window. */
export class LineReader {
  private fd: number;
  private window = Buffer.alloc(0);
  private windowStart = 0;

  constructor(readonly file: string) {
    this.fd = openSync(file, 'r');
  }

  /** The line at `offset` of `bytes` bytes (its '\n' included), without the newline. */
  read(offset: number, bytes: number): string {
    const end = offset + bytes;
    if (offset < this.windowStart || end > this.windowStart + this.window.length) {
      const size = Math.max(CHUNK, bytes);
      const buffer = Buffer.allocUnsafe(size);
      const read = readSync(this.fd, buffer, 0, size, offset);
      this.window = buffer.subarray(0, read);
      this.windowStart = offset;
      if (read < bytes) throw new Error(`${this.file} changed while it was being read`);
    }
    return this.window.toString('utf8', offset - this.windowStart, end - this.windowStart - 1);
  }

  close(): void {
    if (this.fd >= 0) closeSync(this.fd);
    this.fd = -1;
  }
}
