/**
 * The result table of a sweep, built from journal records only (never from in-memory
 * results), so a single run and a merge of shards produce the same table.
 * Rows come sorted by case index; result columns are the union of the runners' keys in
 * order of first appearance down the sorted rows.
 *
 * Nothing is held per row: a first pass over the journals checks every line (against the
 * header, and against the case table when one is known: seed and values of each case) and
 * keeps an index of where each case's line is (about 18 bytes per case); rows() then reads
 * the lines again in case order. So a bad line is refused before any output is written.
 */
import { InputError } from '../scenario/inputError.js';
import { forEachLine, LineReader } from './journalLines.js';
import { caseSeedStream } from './caseSeed.js';
import { buildCaseTable, MAX_SWEEP_CASES } from './sweepDesign.js';
import { sweepFingerprint } from './sweepFingerprint.js';
import { checkHeader, checkRecord, type JournalHeader } from './sweepJournal.js';
import type { CaseTable, SweepDefinition, SweepRecord } from './sweepTypes.js';

export interface SweepTable {
  fingerprint: string;
  varied: string[];
  /** Cases in the whole sweep. */
  cases: number;
  columns: string[];
  /** Cases with a record. */
  finished: number;
  /** Cases whose runner failed (recorded with their message). */
  failed: number;
  /** Some case failed: outputs get an `error` column. */
  hasErrors: boolean;
  /** Cases with no record (other shards, or not yet run). */
  missingCount: number;
  /** The records, by case index, read from the journals one at a time. */
  rows(): Generator<SweepRecord>;
  /** Case indices with no record, ascending. */
  missing(): Generator<number>;
}

function lineOfOffset(file: string, offset: number): number {
  let found = 0;
  forEachLine(file, (_text, line, at) => {
    if (at === offset) found = line;
  });
  return found;
}

/** The case table a header describes, checked against the header's fingerprint. */
function tableOfHeader(file: string, header: JournalHeader): CaseTable | null {
  if (!header.definition) return null;
  let table: CaseTable;
  try {
    table = buildCaseTable({ ...header.definition, vary: header.definition.vary ?? [] } as SweepDefinition);
  } catch {
    throw new InputError(`sweep journal ${file}`, 'damaged header: its sweep definition cannot be read', 1);
  }
  if (sweepFingerprint(table, header.identity) !== header.fingerprint) {
    throw new InputError(`sweep journal ${file}`, 'damaged header: the fingerprint does not match the sweep it describes', 1);
  }
  return table;
}

/**
 * Index and check the journals. `expected` is the case table the caller built; without it the
 * first header's definition is used (journals of older versions have none: range checks only).
 */
export function tableFromJournals(files: string[], expected?: CaseTable): SweepTable {
  if (files.length === 0) throw new Error('no sweep journal given');
  let first: JournalHeader | null = null;
  let table: CaseTable | null = expected ?? null;
  let offsets = new Float64Array(0);
  let bytes = new Uint32Array(0);
  let fileOf = new Uint16Array(0);
  let seeds = new Uint32Array(0);
  const keyFirst = new Map<string, { at: number; pos: number }>();
  let finished = 0;
  let failed = 0;
  if (files.length > 65535) throw new InputError('STATE_DIR', 'too many journals (at most 65535)');
  const readers: (LineReader | null)[] = files.map(() => null);
  const lineText = (f: number, k: number): string => {
    readers[f] ??= new LineReader(files[f]);
    return readers[f].read(offsets[k], bytes[k]);
  };
  try {
    files.forEach((file, f) => {
      let header: JournalHeader | null = null;
      forEachLine(file, (text, line, offset, size) => {
        let raw: unknown;
        try {
          raw = JSON.parse(text);
        } catch {
          throw new InputError(`sweep journal ${file}`, 'damaged: the line is not a JSON record', line);
        }
        if (line === 1) {
          header = checkHeader(file, raw);
          if (first === null) {
            first = header;
            if (header.cases > MAX_SWEEP_CASES) throw new InputError(`sweep journal ${file}`, `damaged header: ${header.cases} cases`, 1);
            table ??= tableOfHeader(file, header);
            offsets = new Float64Array(header.cases).fill(-1);
            bytes = new Uint32Array(header.cases);
            fileOf = new Uint16Array(header.cases);
            seeds = new Uint32Array(header.cases);
          } else if (header.fingerprint !== first.fingerprint || header.cases !== first.cases) {
            throw new InputError(`sweep journal ${file}`, `belongs to a different sweep than ${files[0]}`, 1);
          }
          return;
        }
        const h = header as unknown as JournalHeader;
        const record = checkRecord(file, h, raw, line);
        const k = record.case;
        if (table) {
          const want = table.valuesAt(k);
          const wrong = table.varied.find((p) => record.values[p] !== want[p]);
          if (wrong !== undefined) {
            throw new InputError(`sweep journal ${file}`, `case ${k} has ${wrong} = ${JSON.stringify(record.values[wrong])}, but this sweep's case ${k} has ${JSON.stringify(want[wrong])}`, line);
          }
        }
        if (offsets[k] >= 0) {
          if (fileOf[k] === f) throw new InputError(`sweep journal ${file}`, `case ${k} is recorded twice`, line);
          if (lineText(fileOf[k], k) !== text) throw new InputError(`sweep journal ${file}`, `case ${k} has a different result in ${files[fileOf[k]]}`, line);
          return;
        }
        offsets[k] = offset;
        bytes[k] = size;
        fileOf[k] = f;
        seeds[k] = record.seed;
        finished += 1;
        if (record.error !== undefined) failed += 1;
        Object.keys(record.result).forEach((key, pos) => {
          const seen = keyFirst.get(key);
          if (!seen || k < seen.at || (k === seen.at && pos < seen.pos)) keyFirst.set(key, { at: k, pos });
        });
      });
      if (header === null) throw new InputError(`sweep journal ${file}`, 'has no header (an empty or torn journal)', 1);
    });
  } finally {
    for (const r of readers) r?.close();
  }
  const head = first as unknown as JournalHeader;
  if (table) {
    // every recorded seed is the one case k draws from the sweep seed
    const nextSeed = caseSeedStream(table.seed);
    for (let k = 0; k < head.cases; k++) {
      const seed = nextSeed();
      if (offsets[k] >= 0 && seeds[k] !== seed) {
        const file = files[fileOf[k]];
        throw new InputError(`sweep journal ${file}`, `case ${k} has seed ${seeds[k]}, but this sweep's case ${k} has seed ${seed}`, lineOfOffset(file, offsets[k]));
      }
    }
  }
  const columns = [...keyFirst.entries()].sort((a, b) => a[1].at - b[1].at || a[1].pos - b[1].pos).map(([key]) => key);
  const cases = head.cases;
  return {
    fingerprint: head.fingerprint,
    varied: head.varied,
    cases,
    columns,
    finished,
    failed,
    hasErrors: failed > 0,
    missingCount: cases - finished,
    *rows() {
      const open = files.map(() => null as LineReader | null);
      try {
        for (let k = 0; k < cases; k++) {
          if (offsets[k] < 0) continue;
          const f = fileOf[k];
          open[f] ??= new LineReader(files[f]);
          yield JSON.parse(open[f].read(offsets[k], bytes[k])) as SweepRecord;
        }
      } finally {
        for (const r of open) r?.close();
      }
    },
    *missing() {
      for (let k = 0; k < cases; k++) if (offsets[k] < 0) yield k;
    },
  };
}
