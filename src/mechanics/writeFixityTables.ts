/**
 * `npm run tables`: build the φ/c tables from the exact solver and write data/fixity-tables.bin
 * (shippedTables.ts). Run it after any change to the characteristic equations, the mode shapes
 * or FAST_TABLE_CELLS; test/mechanics/shippedTables.test.ts says when it is needed.
 */
import { mkdirSync, renameSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { buildFixityTable, type FixityTable } from './fixityTable.js';
import { FAST_TABLE_CELLS, TABLE_NODES } from './fastColumn.js';
import { encodeTables, TABLE_NAMES, TABLES_FILE, type TableName } from './shippedTables.js';

/** The file's bytes, built fresh from the exact solver. */
export function freshTableBytes(): Uint8Array {
  const tables = {} as Record<TableName, FixityTable>;
  for (const name of TABLE_NAMES) tables[name] = buildFixityTable(FAST_TABLE_CELLS, TABLE_NODES[name]());
  return encodeTables(FAST_TABLE_CELLS, tables);
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  // dist/src/mechanics/ → package root
  const dataDir = new URL('../../../data/', import.meta.url);
  mkdirSync(dataDir, { recursive: true });
  const target = new URL(TABLES_FILE, dataDir);
  const temp = new URL(`.${TABLES_FILE}.${process.pid}`, dataDir);
  writeFileSync(temp, freshTableBytes());
  renameSync(temp, target);
  process.stdout.write(`wrote ${fileURLToPath(target)}\n`);
}
