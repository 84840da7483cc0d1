/**
 * The φ/c tables of fastColumn.ts, shipped precomputed in `data/fixity-tables.bin` so that a
 * process (and every worker thread) reads 0.4 MB instead of solving 50 000 characteristic
 * equations at start-up (~0.2 s). `npm run tables` writes the file (writeFixityTables.ts);
 * test/mechanics/shippedTables.test.ts fails when it no longer equals a fresh build.
 *
 * Layout (little-endian): the 8 bytes MAGIC, uint32 cells, uint32 table count, then each
 * table's (cells + 1)² float64 values in TABLE_NAMES order, row-major as buildFixityTable.
 *
 * A table is used only when its header matches and SPOT_NODES of its nodes equal the exact
 * solver's value (a few Brent solves); otherwise, or when the file is missing, it is built
 * here as before. A stale or damaged file therefore costs time, never accuracy.
 */
import { readFileSync } from 'node:fs';
import { buildFixityTable, type FixityTable } from './fixityTable.js';

export const TABLE_NAMES = ['bracedPhi', 'swayPhiSquared', 'bracedCurvature'] as const;
export type TableName = (typeof TABLE_NAMES)[number];
export const TABLES_FILE = 'fixity-tables.bin';
const MAGIC = 'STNFIX01';
const HEADER_BYTES = 16;
/** Nodes checked against the exact solver at load: corners, edges and inner points. */
const SPOT_NODES: readonly (readonly [number, number])[] = [[0, 0], [1, 1], [0.5, 0.25], [0.125, 0.875], [0.9375, 0.0625], [0.3359375, 0.6640625]];
const SPOT_TOLERANCE = 1e-12;

let shipped: Map<TableName, Float64Array> | null | undefined;

/** Where the file lies: data/ at the package root, seen from src/mechanics or dist/src/mechanics. */
function candidatePaths(): URL[] {
  return [new URL(`../../data/${TABLES_FILE}`, import.meta.url), new URL(`../../../data/${TABLES_FILE}`, import.meta.url)];
}

/** The file's bytes for these tables (writeFixityTables.ts). */
export function encodeTables(cells: number, tables: Record<TableName, FixityTable>): Uint8Array {
  const per = (cells + 1) ** 2;
  const bytes = new Uint8Array(HEADER_BYTES + TABLE_NAMES.length * per * 8);
  const view = new DataView(bytes.buffer);
  for (let i = 0; i < MAGIC.length; i++) bytes[i] = MAGIC.charCodeAt(i);
  view.setUint32(8, cells, true);
  view.setUint32(12, TABLE_NAMES.length, true);
  TABLE_NAMES.forEach((name, t) => {
    const values = tables[name].values;
    if (tables[name].cells !== cells || values.length !== per) throw new Error(`table ${name} is not ${cells} cells`);
    for (let k = 0; k < per; k++) view.setFloat64(HEADER_BYTES + (t * per + k) * 8, values[k], true);
  });
  return bytes;
}

/** The tables in `bytes`, or null when the header does not match `cells`. */
export function decodeTables(bytes: Uint8Array, cells: number): Map<TableName, Float64Array> | null {
  const per = (cells + 1) ** 2;
  if (bytes.length !== HEADER_BYTES + TABLE_NAMES.length * per * 8) return null;
  for (let i = 0; i < MAGIC.length; i++) if (bytes[i] !== MAGIC.charCodeAt(i)) return null;
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  if (view.getUint32(8, true) !== cells || view.getUint32(12, true) !== TABLE_NAMES.length) return null;
  const out = new Map<TableName, Float64Array>();
  TABLE_NAMES.forEach((name, t) => {
    const values = new Float64Array(per);
    for (let k = 0; k < per; k++) values[k] = view.getFloat64(HEADER_BYTES + (t * per + k) * 8, true);
    out.set(name, values);
  });
  return out;
}

function readShipped(cells: number): Map<TableName, Float64Array> | null {
  for (const path of candidatePaths()) {
    let bytes: Uint8Array;
    try {
      bytes = readFileSync(path);
    } catch {
      continue;
    }
    return decodeTables(bytes, cells);
  }
  return null;
}

/** The shipped table when it passes the spot check against `node` (the exact value at a node), else a fresh build. */
export function shippedOrBuilt(name: TableName, cells: number, node: (fA: number, fB: number) => number): FixityTable {
  if (shipped === undefined) shipped = readShipped(cells);
  const values = shipped?.get(name);
  if (values && spotCheck(values, cells, node)) return { cells, values };
  return buildFixityTable(cells, node);
}

function spotCheck(values: Float64Array, cells: number, node: (fA: number, fB: number) => number): boolean {
  for (const [a, b] of SPOT_NODES) {
    const i = Math.round(a * cells);
    const j = Math.round(b * cells);
    const exact = node(i / cells, j / cells);
    const stored = values[i * (cells + 1) + j];
    if (!(Math.abs(stored - exact) <= SPOT_TOLERANCE * Math.max(1, Math.abs(exact)))) return false;
  }
  return true;
}
