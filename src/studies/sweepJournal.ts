/**
 * The sweep journal: one JSON line per finished case, appended with a single write and
 * fsync'd, so a sweep killed at any moment loses nothing it reported finished. The first
 * line is a header naming the sweep (a fingerprint of its case table) and the shard.
 * On reopening, a torn last line (no newline: the kill hit mid-write) is cut off before
 * anything is appended; a malformed complete line means real damage and is an error.
 */
import { closeSync, existsSync, fsyncSync, ftruncateSync, mkdirSync, openSync, readFileSync, writeSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { InputError } from '../scenario/inputError.js';
import type { Shard, SweepRecord } from './sweepTypes.js';

export interface JournalHeader {
  stanchion_sweep_journal: 1;
  fingerprint: string;
  varied: string[];
  /** Number of cases in the whole sweep (all shards). */
  cases: number;
  shard: Shard;
}

export function journalPath(stateDir: string, shard: Shard): string {
  return join(stateDir, `journal-${shard.index}-of-${shard.count}.jsonl`);
}

/** Complete lines only; `kept` is the byte length of the intact prefix. */
function completeLines(bytes: Buffer): { lines: string[]; kept: number } {
  const end = bytes.lastIndexOf(0x0a) + 1;
  const text = bytes.subarray(0, end).toString('utf8');
  return { lines: text.split('\n').slice(0, -1), kept: end };
}

function parseLine(file: string, line: string, lineNo: number): unknown {
  try {
    return JSON.parse(line);
  } catch {
    throw new Error(`sweep journal ${file} is damaged at line ${lineNo}`);
  }
}

export interface JournalContent {
  header: JournalHeader;
  records: SweepRecord[];
}

/** Read a journal (for merging); a torn last line is ignored. */
export function readJournal(file: string): JournalContent {
  const { lines } = completeLines(readFileSync(file));
  if (lines.length === 0) throw new Error(`sweep journal ${file} has no header`);
  const header = parseLine(file, lines[0], 1) as JournalHeader;
  if (header.stanchion_sweep_journal !== 1) throw new Error(`${file} is not a sweep journal`);
  const records = lines.slice(1).map((line, k) => parseLine(file, line, k + 2) as SweepRecord);
  return { header, records };
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

export class SweepJournal {
  private constructor(
    readonly file: string,
    private fd: number,
    readonly done: Map<number, SweepRecord>,
  ) {}

  /** Open or create the journal for this sweep; refuses a journal of another sweep. */
  static open(stateDir: string, header: JournalHeader): SweepJournal {
    mkdirSync(stateDir, { recursive: true });
    const file = journalPath(stateDir, header.shard);
    const done = new Map<number, SweepRecord>();
    const existed = existsSync(file);
    const fd = openSync(file, existed ? 'r+' : 'w');
    try {
      const { lines, kept } = existed ? completeLines(readFileSync(file)) : { lines: [], kept: 0 };
      if (lines.length === 0) {
        ftruncateSync(fd, 0);
        appendDurably(fd, JSON.stringify(header));
        if (!existed) fsyncDirectory(dirname(file));
      } else {
        const found = parseLine(file, lines[0], 1) as JournalHeader;
        if (found.fingerprint !== header.fingerprint) {
          throw new InputError('state directory', `${file} belongs to a different sweep; use a new state directory`);
        }
        lines.slice(1).forEach((line, k) => {
          const record = parseLine(file, line, k + 2) as SweepRecord;
          done.set(record.case, record);
        });
        ftruncateSync(fd, kept); // drop a torn tail before appending
      }
    } catch (error) {
      closeSync(fd);
      throw error;
    }
    const appendFd = openSync(file, 'a');
    closeSync(fd);
    return new SweepJournal(file, appendFd, done);
  }

  record(entry: SweepRecord): void {
    if (this.done.has(entry.case)) throw new Error(`case ${entry.case} is already in the journal`);
    appendDurably(this.fd, JSON.stringify(entry));
    this.done.set(entry.case, entry);
  }

  close(): void {
    if (this.fd >= 0) closeSync(this.fd);
    this.fd = -1;
  }
}
