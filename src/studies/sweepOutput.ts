/**
 * CSV and JSON renderings of a sweep table, byte-for-byte deterministic: rows by case
 * index, cells by csvCell (numbers as JavaScript's shortest round-trip text, RFC 4180 quoting,
 * formula-like text neutralised), '\n' line ends.
 * CSV header: case, each varied path, each result column (then `error` if any case failed).
 * Both are written row by row from the journals (SweepTable.rows), never held whole.
 */
import { writeFileAtomicStreamed } from './atomicWrite.js';
import { csvCell } from '../report/csvCell.js';
import type { SweepTable } from './sweepTable.js';
import type { SweepRecord } from './sweepTypes.js';

function csvHeader(table: SweepTable): string {
  const header = ['case', ...table.varied, ...table.columns, ...(table.hasErrors ? ['error'] : [])];
  return `${header.map(csvCell).join(',')}\n`;
}

function csvRow(table: SweepTable, row: SweepRecord): string {
  const fields = [
    String(row.case),
    ...table.varied.map((p) => csvCell(row.values[p])),
    ...table.columns.map((c) => csvCell(row.result[c])),
    ...(table.hasErrors ? [csvCell(row.error)] : []),
  ];
  return `${fields.join(',')}\n`;
}

/** The CSV, piece by piece (one row at a time). */
export function writeSweepCsv(table: SweepTable, write: (piece: string) => void): void {
  write(csvHeader(table));
  for (const row of table.rows()) write(csvRow(table, row));
}

/** One entry of `cases` in sweep.json. */
export function sweepJsonEntry(table: SweepTable, row: SweepRecord): Record<string, unknown> {
  const entry: Record<string, unknown> = {
    case: row.case,
    seed: row.seed,
    values: Object.fromEntries(table.varied.map((p) => [p, row.values[p]])),
    result: Object.fromEntries(table.columns.filter((c) => c in row.result).map((c) => [c, row.result[c]])),
  };
  if (row.error !== undefined) entry.error = row.error;
  return entry;
}

/** `JSON.stringify(x, null, 2)` placed at `depth` levels of a two-space indented document. */
function nested(x: unknown, depth: number): string {
  return JSON.stringify(x, null, 2).replace(/\n/g, `\n${'  '.repeat(depth)}`);
}

/** A JSON array at `depth`, its items streamed: the bytes JSON.stringify(..., null, 2) gives. */
function writeArray<T>(items: Iterable<T>, depth: number, write: (piece: string) => void, show: (item: T) => string): void {
  const pad = '  '.repeat(depth + 1);
  let empty = true;
  for (const item of items) {
    write(`${empty ? '[\n' : ',\n'}${pad}${show(item)}`);
    empty = false;
  }
  write(empty ? '[]' : `\n${'  '.repeat(depth)}]`);
}

/**
 * sweep.json, piece by piece: byte for byte JSON.stringify({sweep: {fingerprint, varied,
 * columns, missing, cases}}, null, 2) plus a newline, without building that document.
 */
export function writeSweepJson(table: SweepTable, write: (piece: string) => void): void {
  write(`{\n  "sweep": {\n    "fingerprint": ${JSON.stringify(table.fingerprint)},\n`);
  write(`    "varied": ${nested(table.varied, 2)},\n    "columns": ${nested(table.columns, 2)},\n    "missing": `);
  writeArray(table.missing(), 2, write, String);
  write(',\n    "cases": ');
  writeArray(table.rows(), 2, write, (row) => nested(sweepJsonEntry(table, row), 3));
  write('\n  }\n}\n');
}

function collect(writer: (table: SweepTable, write: (piece: string) => void) => void, table: SweepTable): string {
  const pieces: string[] = [];
  writer(table, (piece) => pieces.push(piece));
  return pieces.join('');
}

/** The whole CSV as one string (small sweeps and tests). */
export function sweepCsv(table: SweepTable): string {
  return collect(writeSweepCsv, table);
}

/** The whole sweep.json as one string (small sweeps and tests). */
export function sweepJson(table: SweepTable): string {
  return collect(writeSweepJson, table);
}

/** Both files, each streamed to a temporary file and renamed into place. */
export function writeSweepOutputs(table: SweepTable, files: { csv?: string; json?: string }): void {
  if (files.csv) writeFileAtomicStreamed(files.csv, (write) => writeSweepCsv(table, write));
  if (files.json) writeFileAtomicStreamed(files.json, (write) => writeSweepJson(table, write));
}
