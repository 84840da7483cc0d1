/**
 * The result table of a sweep, built from journal records only (never from in-memory
 * results), so a single run and a merge of shards produce the same table.
 * Rows are sorted by case index; result columns are the union of the runners' keys in
 * order of first appearance down the sorted rows.
 */
import type { JournalContent } from './sweepJournal.js';
import type { SweepRecord } from './sweepTypes.js';

export interface SweepTable {
  fingerprint: string;
  varied: string[];
  columns: string[];
  rows: SweepRecord[];
  /** Case indices of the sweep with no record (other shards, or not yet run). */
  missing: number[];
  /** Some case failed: outputs get an `error` column. */
  hasErrors: boolean;
}

function sameRecord(a: SweepRecord, b: SweepRecord): boolean {
  return JSON.stringify(a) === JSON.stringify(b);
}

export function tableFromJournals(journals: JournalContent[]): SweepTable {
  if (journals.length === 0) throw new Error('no sweep journal given');
  const { fingerprint, varied, cases } = journals[0].header;
  const byCase = new Map<number, SweepRecord>();
  for (const j of journals) {
    if (j.header.fingerprint !== fingerprint) throw new Error('these journals belong to different sweeps');
    for (const record of j.records) {
      const seen = byCase.get(record.case);
      if (seen && !sameRecord(seen, record)) throw new Error(`case ${record.case} has two different results`);
      byCase.set(record.case, record);
    }
  }
  const rows = [...byCase.values()].sort((a, b) => a.case - b.case);
  const columns: string[] = [];
  const known = new Set<string>();
  for (const row of rows) {
    for (const key of Object.keys(row.result)) {
      if (!known.has(key)) {
        known.add(key);
        columns.push(key);
      }
    }
  }
  const missing: number[] = [];
  for (let k = 0; k < cases; k++) if (!byCase.has(k)) missing.push(k);
  return { fingerprint, varied, columns, rows, missing, hasErrors: rows.some((r) => r.error !== undefined) };
}
