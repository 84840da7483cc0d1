/**
 * A sweep's identity: SHA-256 of its case table (index, seed, values) plus anything the
 * caller adds (`identity`, e.g. the methods and the scenario's hash), so a state directory
 * can never mix results of two different sweeps. The hashed text is
 * JSON.stringify({varied, cases: [[index, seed, [values…]], …], identity}), fed to the hash
 * in pieces so that no list of every case is built.
 */
import { createHash } from 'node:crypto';
import { iterateCases } from './sweepDesign.js';
import type { CaseTable } from './sweepTypes.js';

const PIECE = 1 << 16;

export function sweepFingerprint(table: CaseTable, identity?: unknown): string {
  const hash = createHash('sha256');
  let piece = `{"varied":${JSON.stringify(table.varied)},"cases":[`;
  let first = true;
  for (const c of iterateCases(table)) {
    piece += `${first ? '' : ','}${JSON.stringify([c.index, c.seed, table.varied.map((p) => c.values[p])])}`;
    first = false;
    if (piece.length >= PIECE) {
      hash.update(piece);
      piece = '';
    }
  }
  hash.update(`${piece}],"identity":${JSON.stringify(identity ?? null)}}`);
  return hash.digest('hex');
}
