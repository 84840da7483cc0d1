import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { FAST_TABLE_CELLS, TABLE_NODES } from '../../src/mechanics/fastColumn.js';
import { decodeTables, shippedOrBuilt, TABLE_NAMES } from '../../src/mechanics/shippedTables.js';
import { freshTableBytes } from '../../src/mechanics/writeFixityTables.js';

const shippedBytes = new Uint8Array(readFileSync(new URL('../../data/fixity-tables.bin', import.meta.url)));

describe('the shipped φ/c tables (data/fixity-tables.bin)', () => {
  it('equal a fresh build from the exact solver, value for value (else run `npm run tables`)', () => {
    // common practice: a shipped cache must be byte-identical to what it caches
    const fresh = freshTableBytes();
    expect(shippedBytes.length).toBe(fresh.length);
    let differing = 0;
    for (let k = 0; k < fresh.length; k++) if (shippedBytes[k] !== fresh[k]) differing++;
    expect(differing).toBe(0);
  });

  it('are used as shipped, and refused for a fresh build when a checked node is wrong', () => {
    // common practice: the spot check at load compares nodes with the exact solver
    const decoded = decodeTables(shippedBytes, FAST_TABLE_CELLS);
    expect(decoded).not.toBeNull();
    for (const name of TABLE_NAMES) {
      const table = shippedOrBuilt(name, FAST_TABLE_CELLS, TABLE_NODES[name]());
      expect(Array.from(table.values.subarray(0, 50))).toEqual(Array.from(decoded!.get(name)!.subarray(0, 50)));
    }
    // a node function that disagrees with the file at the corner: the table is built from it instead
    const exact = TABLE_NODES.bracedPhi();
    const shifted = (fA: number, fB: number) => exact(fA, fB) * (1 + 1e-9);
    const rebuilt = shippedOrBuilt('bracedPhi', FAST_TABLE_CELLS, shifted);
    expect(rebuilt.values[0]).toBe(shifted(0, 0));
  });

  it('are refused whole when the header does not match', () => {
    // common practice: a damaged or foreign file is never read as numbers
    expect(decodeTables(shippedBytes, FAST_TABLE_CELLS - 1)).toBeNull();
    const damaged = shippedBytes.slice();
    damaged[0] = 0;
    expect(decodeTables(damaged, FAST_TABLE_CELLS)).toBeNull();
    expect(decodeTables(shippedBytes.subarray(0, 1000), FAST_TABLE_CELLS)).toBeNull();
  });
});
