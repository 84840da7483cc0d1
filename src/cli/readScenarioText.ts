import { closeSync, fstatSync, openSync, readSync } from 'node:fs';
import { InputError } from '../scenario/inputError.js';
import { MAX_TEXT_LENGTH, stripByteOrderMark } from '../scenario/parseText.js';

/** Read size: big enough to be quick, small enough that the limit is noticed promptly. */
const CHUNK_BYTES = 64 * 1024;
const LIMIT_TEXT = `${MAX_TEXT_LENGTH / 1e6} MB`;

/** Sleep without spinning, for a non-blocking stdin that has nothing yet (EAGAIN). */
function pause(ms: number): void {
  Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, ms);
}

/**
 * Read a descriptor in chunks and stop as soon as it holds more than the limit, so that
 * /dev/zero or an endless pipe costs at most one chunk beyond it, never gigabytes.
 */
function readBounded(fd: number, field: string, shown: string): string {
  const chunks: Buffer[] = [];
  let total = 0;
  for (;;) {
    const chunk = Buffer.allocUnsafe(CHUNK_BYTES);
    let n: number;
    try {
      n = readSync(fd, chunk, 0, CHUNK_BYTES, null);
    } catch (err) {
      const code = (err as NodeJS.ErrnoException).code;
      if (code === 'EAGAIN') {
        pause(10);
        continue;
      }
      if (code === 'EOF') break; // Windows: end of a pipe
      throw err;
    }
    if (n === 0) break;
    total += n;
    if (total > MAX_TEXT_LENGTH) {
      throw new InputError(field, `${shown} is larger than the ${LIMIT_TEXT} limit of a scenario (stopped reading after ${total} bytes)`);
    }
    chunks.push(n === CHUNK_BYTES ? chunk : chunk.subarray(0, n));
  }
  return stripByteOrderMark(Buffer.concat(chunks, total).toString('utf8'));
}

/** A scenario (or sweep) file by path, read within the size limit; `field` names it in messages. */
export function readTextFileBounded(path: string, field: string, shown = path): string {
  let fd: number;
  try {
    fd = openSync(path, 'r');
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code;
    const why = code === 'ENOENT' ? 'no such file' : code === 'EISDIR' ? 'is a folder, not a file' : 'cannot be read';
    throw new InputError(field, `${shown}: ${why}`);
  }
  try {
    if (fstatSync(fd).isDirectory()) throw new InputError(field, `${shown}: is a folder, not a file`);
    return readBounded(fd, field, shown);
  } catch (err) {
    if (err instanceof InputError) throw err;
    const code = (err as NodeJS.ErrnoException).code;
    throw new InputError(field, `${shown}: ${code === 'EISDIR' ? 'is a folder, not a file' : 'cannot be read'}`);
  } finally {
    closeSync(fd);
  }
}

/** Reads FILE, or standard input when FILE is `-`. Returns the text and the name used in messages. */
export function readScenarioText(file: string): { text: string; fileName: string } {
  if (file === '-') {
    try {
      return { text: readBounded(0, 'FILE', 'standard input'), fileName: '-' };
    } catch (err) {
      if (err instanceof InputError) throw err;
      throw new InputError('FILE', 'could not read the scenario from standard input');
    }
  }
  if (!/\.(ya?ml|json)$/i.test(file)) {
    throw new InputError('FILE', `expected a .yaml, .yml or .json scenario file (or - for stdin), got ${file}`);
  }
  return { text: readTextFileBounded(file, 'FILE'), fileName: file };
}
