/**
 * The sweep journal: one JSON line per finished case, appended with a single write as soon as
 * the case finishes, so a killed process (kill -9, Ctrl-C, a crash of the program) loses
 * nothing: the line is in the operating system's hands. The lines are fsync'd in batches (every
 * SYNC_EVERY_CASES cases or SYNC_EVERY_MS, whichever comes first, and on close): only an
 * operating-system crash or a power cut can lose the unsynced tail, and then those cases —
 * at most one batch — are simply run again on resume, with the same seeds and so the same
 * results. A header is always fsync'd before any case runs. The first
 * line is a header naming the sweep (a fingerprint of its case table, and the definition
 * and identity it was computed from) and the shard.
 * On reopening, a torn last line (no newline: the kill hit mid-write) is cut off before
 * anything is appended. Every complete line must be a record of a case of this shard
 * (index in range, index % N == I, seed and values of the right types, each case once):
 * anything else is damage or a line from elsewhere, refused with its line number, because
 * a row that does not belong must never reach the results and a silently skipped one would
 * hide a lost case.
 * The journal is read in chunks; what stays in memory is one bit per case.
 */
import { closeSync, existsSync, fsyncSync, ftruncateSync, mkdirSync, openSync, readSync, writeSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { InputError } from '../scenario/inputError.js';
import { forEachLine } from './journalLines.js';
import { pathInputError } from './pathErrors.js';
import type { Shard, SweepDefinition, SweepRecord } from './sweepTypes.js';

/** What a journal keeps of the definition: enough to rebuild the case table. */
export type StoredDefinition = Pick<SweepDefinition, 'design' | 'seed' | 'cases' | 'vary' | 'list'>;

export interface JournalHeader {
  stanchion_sweep_journal: 1;
  fingerprint: string;
  varied: string[];
  /** Number of cases in the whole sweep (all shards). */
  cases: number;
  shard: Shard;
  /** The sweep's definition and extra identity (absent in journals of older versions). */
  definition?: StoredDefinition;
  identity?: unknown;
}

export function journalPath(stateDir: string, shard: Shard): string {
  return join(stateDir, `journal-${shard.index}-of-${shard.count}.jsonl`);
}

function isPlain(x: unknown): x is Record<string, unknown> {
  return typeof x === 'object' && x !== null && !Array.isArray(x);
}

function journalError(file: string, line: number, message: string): InputError {
  return new InputError(`sweep journal ${file}`, message, line);
}

function parseLine(file: string, text: string, line: number): unknown {
  try {
    return JSON.parse(text);
  } catch {
    throw journalError(file, line, 'damaged: the line is not a JSON record (remove the journal to start again, or restore it)');
  }
}

/** The header's own shape (line 1). */
export function checkHeader(file: string, raw: unknown): JournalHeader {
  if (!isPlain(raw) || raw.stanchion_sweep_journal !== 1) throw journalError(file, 1, 'not a sweep journal header');
  const shard = raw.shard as Shard | undefined;
  const ok =
    typeof raw.fingerprint === 'string' &&
    Array.isArray(raw.varied) &&
    raw.varied.every((p) => typeof p === 'string') &&
    Number.isSafeInteger(raw.cases) &&
    (raw.cases as number) >= 1 &&
    isPlain(shard) &&
    Number.isSafeInteger(shard.count) &&
    Number.isSafeInteger(shard.index) &&
    shard.count >= 1 &&
    shard.index >= 0 &&
    shard.index < shard.count;
  if (!ok) throw journalError(file, 1, 'damaged header (fingerprint, varied, cases and shard are required)');
  return raw as unknown as JournalHeader;
}

const SEED_LIMIT = 2147483648;

function isSweepValue(v: unknown): boolean {
  return (typeof v === 'number' && Number.isFinite(v)) || typeof v === 'string';
}

function isResultValue(v: unknown): boolean {
  return typeof v === 'number' || typeof v === 'string' || typeof v === 'boolean' || v === null;
}

/** A record line checked against its journal's header: the case must exist and be this shard's. */
export function checkRecord(file: string, header: JournalHeader, raw: unknown, line: number): SweepRecord {
  if (!isPlain(raw)) throw journalError(file, line, 'damaged: expected a case record');
  const index = raw.case;
  if (!Number.isSafeInteger(index)) throw journalError(file, line, `damaged: 'case' is not a case number (${JSON.stringify(index)})`);
  const k = index as number;
  if (k < 0 || k >= header.cases) throw journalError(file, line, `case ${k} does not exist in this sweep (cases 0 to ${header.cases - 1})`);
  const { index: shardIndex, count } = header.shard;
  if (k % count !== shardIndex) throw journalError(file, line, `case ${k} does not belong to shard ${shardIndex}/${count} (index % ${count} is ${k % count})`);
  if (!(Number.isInteger(raw.seed) && (raw.seed as number) >= 0 && (raw.seed as number) < SEED_LIMIT)) {
    throw journalError(file, line, `damaged: case ${k} has no valid seed`);
  }
  const values = raw.values;
  if (!isPlain(values) || Object.keys(values).length !== header.varied.length || !header.varied.every((p) => Object.hasOwn(values, p) && isSweepValue(values[p]))) {
    throw journalError(file, line, `case ${k} does not set the sweep's varied paths (${header.varied.join(', ')})`);
  }
  if (!isPlain(raw.result) || !Object.values(raw.result).every(isResultValue)) throw journalError(file, line, `damaged: case ${k} has no valid result`);
  if (raw.error !== undefined && typeof raw.error !== 'string') throw journalError(file, line, `damaged: case ${k} has an error that is not text`);
  return raw as unknown as SweepRecord;
}

/** The first line of a journal (without reading the rest). */
export function readJournalHeader(file: string): JournalHeader {
  const fd = openSync(file, 'r');
  try {
    const buffer = Buffer.alloc(1 << 16);
    let text = '';
    for (let position = 0; ; ) {
      const read = readSync(fd, buffer, 0, buffer.length, position);
      if (read === 0) break;
      position += read;
      const nl = buffer.subarray(0, read).indexOf(0x0a);
      if (nl >= 0) return checkHeader(file, parseLine(file, text + buffer.toString('utf8', 0, nl), 1));
      text += buffer.toString('utf8', 0, read);
    }
    throw journalError(file, 1, 'has no header (an empty or torn journal)');
  } finally {
    closeSync(fd);
  }
}

function fsyncDirectory(dir: string): void {
  const fd = openSync(dir, 'r');
  try {
    fsyncSync(fd);
  } finally {
    closeSync(fd);
  }
}

function appendDurably(fd: number, line: string): void {
  writeSync(fd, `${line}\n`);
  fsyncSync(fd);
}

/** Cases per fsync of the journal, and the longest time a written case waits for one. */
export const SYNC_EVERY_CASES = 64;
export const SYNC_EVERY_MS = 1000;

/** One bit per case: which cases are finished. */
class CaseBits {
  private readonly bits: Uint8Array;
  count = 0;

  constructor(cases: number) {
    this.bits = new Uint8Array(Math.ceil(cases / 8));
  }

  has(k: number): boolean {
    return (this.bits[k >>> 3] & (1 << (k & 7))) !== 0;
  }

  add(k: number): void {
    this.bits[k >>> 3] |= 1 << (k & 7);
    this.count += 1;
  }
}

export class SweepJournal {
  /** Records written since the last fsync, and when that fsync was. */
  private unsynced = 0;
  private lastSync = performance.now();
  private constructor(
    readonly file: string,
    private fd: number,
    private readonly finished: CaseBits,
  ) {}

  /** Open or create the journal for this sweep; refuses a journal of another sweep or a bad line. */
  static open(stateDir: string, header: JournalHeader): SweepJournal {
    const file = journalPath(stateDir, header.shard);
    const finished = new CaseBits(header.cases);
    let fd: number;
    let existed: boolean;
    try {
      mkdirSync(stateDir, { recursive: true });
      existed = existsSync(file);
      fd = openSync(file, existed ? 'r+' : 'w');
    } catch (err) {
      throw pathInputError(err, '--state', stateDir);
    }
    try {
      let sawHeader = false;
      const kept = existed
        ? forEachLine(file, (text, line) => {
            const raw = parseLine(file, text, line);
            if (line === 1) {
              const found = checkHeader(file, raw);
              if (found.fingerprint !== header.fingerprint) {
                throw new InputError('--state', `${file} belongs to a different sweep; use a new state directory`);
              }
              sawHeader = true;
              return;
            }
            const record = checkRecord(file, header, raw, line);
            if (finished.has(record.case)) throw journalError(file, line, `case ${record.case} is recorded twice`);
            finished.add(record.case);
          })
        : 0;
      if (!sawHeader) {
        ftruncateSync(fd, 0);
        appendDurably(fd, JSON.stringify(header));
        if (!existed) fsyncDirectory(dirname(file));
      } else {
        ftruncateSync(fd, kept); // drop a torn tail before appending
      }
    } catch (error) {
      closeSync(fd);
      throw error;
    }
    const appendFd = openSync(file, 'a');
    closeSync(fd);
    return new SweepJournal(file, appendFd, finished);
  }

  /** Case k is finished (recorded now or before). */
  isDone(k: number): boolean {
    return this.finished.has(k);
  }

  /** Number of finished cases of this shard. */
  get doneCount(): number {
    return this.finished.count;
  }

  record(entry: SweepRecord): void {
    if (this.finished.has(entry.case)) throw new Error(`case ${entry.case} is already in the journal`);
    writeSync(this.fd, `${JSON.stringify(entry)}\n`);
    this.finished.add(entry.case);
    this.unsynced += 1;
    if (this.unsynced >= SYNC_EVERY_CASES || performance.now() - this.lastSync >= SYNC_EVERY_MS) this.sync();
  }

  /** fsync what was written (the end of a batch). */
  sync(): void {
    if (this.fd < 0 || this.unsynced === 0) return;
    fsyncSync(this.fd);
    this.unsynced = 0;
    this.lastSync = performance.now();
  }

  close(): void {
    if (this.fd >= 0) {
      try {
        this.sync();
      } finally {
        closeSync(this.fd);
      }
    }
    this.fd = -1;
  }
}
