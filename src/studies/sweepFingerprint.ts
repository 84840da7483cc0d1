/**
 * A sweep's identity: SHA-256 of its case table (index, seed, values) plus anything the
 * caller adds (`identity`, e.g. the methods and the scenario's hash), so a state directory
 * can never mix results of two different sweeps.
 */
import { createHash } from 'node:crypto';
import type { CaseTable } from './sweepTypes.js';

export function sweepFingerprint(table: CaseTable, identity?: unknown): string {
  const canonical = JSON.stringify({
    varied: table.varied,
    cases: table.cases.map((c) => [c.index, c.seed, table.varied.map((p) => c.values[p])]),
    identity: identity ?? null,
  });
  return createHash('sha256').update(canonical).digest('hex');
}
