/**
 * Merge shard journals into one table; writing it gives exactly the bytes a single
 * unsharded run writes (both go through tableFromJournals and sweepOutput).
 */
import { readJournal } from './sweepJournal.js';
import { tableFromJournals, type SweepTable } from './sweepTable.js';

export function mergeSweep(...journalFiles: string[]): SweepTable {
  return tableFromJournals(journalFiles.map(readJournal));
}
