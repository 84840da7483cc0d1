/**
 * Merge shard journals into one table; writing it gives exactly the bytes a single
 * unsharded run writes (both go through tableFromJournals and sweepOutput).
 */
import { tableFromJournals, type SweepTable } from './sweepTable.js';
import type { CaseTable } from './sweepTypes.js';

export function mergeSweep(...journalFiles: string[]): SweepTable {
  return tableFromJournals(journalFiles);
}

/** The same, checking every row against the case table the caller built. */
export function mergeSweepOf(table: CaseTable, ...journalFiles: string[]): SweepTable {
  return tableFromJournals(journalFiles, table);
}
