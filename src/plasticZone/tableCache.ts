import { createHash } from 'node:crypto';
import { mkdirSync, readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { homedir } from 'node:os';
import { join } from 'node:path';
import { buildCapacityTable, DEFAULT_GRID, tableSize, type CapacityTable, type TableGrid, type TableSubject } from './capacityTable.js';

/**
 * Capacity tables on disk, so each section and frame is built once per machine.
 * Folder: $STANCHION_CACHE_DIR, else $XDG_CACHE_HOME/stanchion, else ~/.cache/stanchion; files
 * `plastic-zone-<key>.bin`, the key a SHA-256 of TABLE_VERSION, the subject and the grid, so a change
 * of the model (bump TABLE_VERSION) or of the grid never reads an old table. The file is written to a
 * temporary name in the same folder and renamed (atomic on one file system): a reader sees a whole
 * table or none. A file of the wrong size or key is ignored and rebuilt. A cache folder that cannot
 * be written costs the next run a rebuild, never a wrong number.
 */
export const TABLE_VERSION = 1;
const MAGIC = 'stanchion-plastic-zone-table';

export function cacheFolder(env: NodeJS.ProcessEnv = process.env): string {
  if (env.STANCHION_CACHE_DIR) return env.STANCHION_CACHE_DIR;
  const base = env.XDG_CACHE_HOME || join(homedir(), '.cache');
  return join(base, 'stanchion');
}

export function tableKey(subject: TableSubject, grid: TableGrid): string {
  return createHash('sha256').update(JSON.stringify({ MAGIC, TABLE_VERSION, subject, grid })).digest('hex').slice(0, 32);
}

export function tablePath(subject: TableSubject, grid: TableGrid, folder = cacheFolder()): string {
  return join(folder, `plastic-zone-${tableKey(subject, grid)}.bin`);
}

/** Header: the key as 64 ASCII bytes (32 hex + padding), then the χ values as little-endian float64. */
const HEADER_BYTES = 64;

export function readCachedTable(subject: TableSubject, grid: TableGrid, folder = cacheFolder()): CapacityTable | undefined {
  let bytes: Buffer;
  try {
    bytes = readFileSync(tablePath(subject, grid, folder));
  } catch {
    return undefined;
  }
  const n = tableSize(grid);
  if (bytes.length !== HEADER_BYTES + 8 * n) return undefined;
  if (bytes.subarray(0, 32).toString('latin1') !== tableKey(subject, grid)) return undefined;
  const chi = new Float64Array(n);
  for (let i = 0; i < n; i++) chi[i] = bytes.readDoubleLE(HEADER_BYTES + 8 * i);
  return { subject, grid, chi, buildMs: 0 };
}

export function writeCachedTable(t: CapacityTable, folder = cacheFolder()): boolean {
  const target = tablePath(t.subject, t.grid, folder);
  const temporary = `${target}.${process.pid}.tmp`;
  const bytes = Buffer.alloc(HEADER_BYTES + 8 * t.chi.length, 0x20);
  bytes.write(tableKey(t.subject, t.grid), 0, 'latin1');
  for (let i = 0; i < t.chi.length; i++) bytes.writeDoubleLE(t.chi[i], HEADER_BYTES + 8 * i);
  try {
    mkdirSync(folder, { recursive: true });
    writeFileSync(temporary, bytes);
    renameSync(temporary, target);
    return true;
  } catch {
    rmSync(temporary, { force: true });
    return false;
  }
}

/** The table from the cache, else built (and cached). `onBuild` hears of a build before it starts. */
export function capacityTableFor(
  subject: TableSubject, grid: TableGrid = DEFAULT_GRID, folder = cacheFolder(), onBuild?: (evaluations: number, path: string) => void,
): CapacityTable {
  const cached = readCachedTable(subject, grid, folder);
  if (cached) return cached;
  onBuild?.(tableSize(grid), tablePath(subject, grid, folder));
  const built = buildCapacityTable(subject, grid);
  writeCachedTable(built, folder);
  return built;
}
