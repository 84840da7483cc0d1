/**
 * CSV and JSON renderings of a sweep table, byte-for-byte deterministic: rows by case
 * index, cells by csvCell (numbers as JavaScript's shortest round-trip text, RFC 4180 quoting,
 * formula-like text neutralised), '\n' line ends.
 * CSV header: case, each varied path, each result column (then `error` if any case failed).
 */
import { writeFileAtomic } from './atomicWrite.js';
import { csvCell } from '../report/csvCell.js';
import type { SweepTable } from './sweepTable.js';

export function sweepCsv(table: SweepTable): string {
  const header = ['case', ...table.varied, ...table.columns, ...(table.hasErrors ? ['error'] : [])];
  const lines = [header.map(csvCell).join(',')];
  for (const row of table.rows) {
    const fields = [
      String(row.case),
      ...table.varied.map((p) => csvCell(row.values[p])),
      ...table.columns.map((c) => csvCell(row.result[c])),
      ...(table.hasErrors ? [csvCell(row.error)] : []),
    ];
    lines.push(fields.join(','));
  }
  return `${lines.join('\n')}\n`;
}

export function sweepJson(table: SweepTable): string {
  const cases = table.rows.map((row) => {
    const entry: Record<string, unknown> = {
      case: row.case,
      seed: row.seed,
      values: Object.fromEntries(table.varied.map((p) => [p, row.values[p]])),
      result: Object.fromEntries(table.columns.filter((c) => c in row.result).map((c) => [c, row.result[c]])),
    };
    if (row.error !== undefined) entry.error = row.error;
    return entry;
  });
  const doc = {
    sweep: { fingerprint: table.fingerprint, varied: table.varied, columns: table.columns, missing: table.missing, cases },
  };
  return `${JSON.stringify(doc, null, 2)}\n`;
}

export function writeSweepOutputs(table: SweepTable, files: { csv?: string; json?: string }): void {
  if (files.csv) writeFileAtomic(files.csv, sweepCsv(table));
  if (files.json) writeFileAtomic(files.json, sweepJson(table));
}
