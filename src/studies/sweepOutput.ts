/**
 * CSV and JSON renderings of a sweep table, byte-for-byte deterministic: rows by case
 * index, numbers as JavaScript's shortest round-trip text, RFC 4180 quoting, '\n' line ends.
 * CSV header: case, each varied path, each result column (then `error` if any case failed).
 */
import { writeFileAtomic } from './atomicWrite.js';
import type { SweepTable } from './sweepTable.js';
import type { ResultValue, SweepValue } from './sweepTypes.js';

function csvField(value: ResultValue | SweepValue | undefined): string {
  if (value === undefined || value === null) return '';
  const text = String(value);
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export function sweepCsv(table: SweepTable): string {
  const header = ['case', ...table.varied, ...table.columns, ...(table.hasErrors ? ['error'] : [])];
  const lines = [header.map(csvField).join(',')];
  for (const row of table.rows) {
    const fields = [
      String(row.case),
      ...table.varied.map((p) => csvField(row.values[p])),
      ...table.columns.map((c) => csvField(row.result[c])),
      ...(table.hasErrors ? [csvField(row.error)] : []),
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
