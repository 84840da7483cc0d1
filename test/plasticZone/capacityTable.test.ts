import { existsSync, mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { criticalLoad } from '../../src/mechanics/criticalLoad.js';
import { uniformStream } from '../../src/probability/rng.js';
import { buildCapacityTable, chiAt, fixityOfRatio, type TableGrid, type TableSubject } from '../../src/plasticZone/capacityTable.js';
import { plasticZoneCapacity } from '../../src/plasticZone/plasticZoneCapacity.js';
import { fibreSection } from '../../src/plasticZone/sectionFibres.js';
import { cacheFolder, capacityTableFor, readCachedTable, tableKey, tablePath, writeCachedTable } from '../../src/plasticZone/tableCache.js';

// a small grid so that the test builds in about a second; the full grid's error is measured by `npm run bench` (docs/plastic-zone.md §6)
const GRID: TableGrid = { lambdaBar: [0.6, 1.0, 1.4], fixity: [0, 0.5, 1], eta: [0.04, 0.25] };
const SUBJECT: TableSubject = {
  section: { shape: 'i', h: 0.19, b: 0.19, tw: 0.009, tf: 0.014 }, family: 'rolled', axis: 'z', frame: 'braced', elements: 8,
};
const table = buildCapacityTable(SUBJECT, GRID);
const folder = mkdtempSync(join(tmpdir(), 'stanchion-table-'));
afterAll(() => rmSync(folder, { recursive: true, force: true }));

/** χ of the full model for a column given by λ̄ (restrained), R at each end and η, at E and fy. */
function directChi(lambdaBar: number, RB: number, RT: number, eta: number, E: number, fy: number): number {
  const fib = fibreSection(SUBJECT.section, SUBJECT.family, SUBJECT.axis, fy);
  const EI = E * fib.I;
  const phi = Math.sqrt(criticalLoad(1, 1, 'braced', { bottom: RB, top: RT }).Pcr);
  const L = lambdaBar * phi * Math.sqrt(EI / (fib.A * fy));
  const k = (R: number): number => (R === Infinity ? Infinity : (R * EI) / L);
  const r = plasticZoneCapacity({
    section: SUBJECT.section, family: SUBJECT.family, axis: SUBJECT.axis, E, fy, L, frame: 'braced', kBottom: k(RB), kTop: k(RT),
    e0: (eta * fib.W) / fib.A, elements: SUBJECT.elements,
  });
  return r.capacity / r.squashLoad;
}

describe('plastic-zone capacity table', () => {
  it('returns the node values at the nodes, and χ depends on E and fy only through λ̄', () => {
    // the node (λ̄ 1.0, pinned, R = 3 at the top, η 0.25) at another E and fy (the residual stresses scale with fy)
    const atNode = chiAt(table, 1.0, 0, 0.5, 0.25);
    expect(atNode).toBe(table.chi[1 + 3 * (0 + 3 * (1 + 3 * 1))]);
    const other = directChi(1.0, 0, 3, 0.25, 195e9, 355e6);
    expect(Math.abs(atNode / other - 1)).toBeLessThan(3e-3);
  });

  it('interpolates within 3 % of the full model at seeded random points of this coarse grid', () => {
    const u = uniformStream(7, 0);
    for (let i = 0; i < 6; i++) {
      const lambdaBar = 0.6 + 0.8 * u();
      const RB = 3 * u();
      const RT = 3 * u();
      const eta = 0.04 + 0.21 * u();
      const chi = chiAt(table, lambdaBar, fixityOfRatio(RB), fixityOfRatio(RT), eta);
      expect(Math.abs(chi / directChi(lambdaBar, RB, RT, eta, 210e9, 235e6) - 1), `point ${i}`).toBeLessThan(0.03);
    }
  });

  it('says NaN outside its grid (the caller then runs the full model)', () => {
    expect(chiAt(table, 2.5, 0, 0, 0.1)).toBeNaN();
    expect(chiAt(table, 1.0, 0, 0, 0.5)).toBeNaN();
    expect(chiAt(table, 1.0, 0, 0, 0.01)).toBeNaN();
  });

  it('caches on disk under a versioned key, written whole or not at all', () => {
    expect(writeCachedTable(table, folder)).toBe(true);
    expect(readdirSync(folder).filter((f) => f.endsWith('.tmp'))).toEqual([]);
    const back = readCachedTable(SUBJECT, GRID, folder)!;
    expect(Array.from(back.chi)).toEqual(Array.from(table.chi));
    // another grid or another section is another key
    expect(tableKey(SUBJECT, { ...GRID, eta: [0.04, 0.3] })).not.toBe(tableKey(SUBJECT, GRID));
    expect(tableKey({ ...SUBJECT, axis: 'y' }, GRID)).not.toBe(tableKey(SUBJECT, GRID));
    // a torn or foreign file is ignored (and capacityTableFor would rebuild it)
    writeFileSync(tablePath(SUBJECT, GRID, folder), 'not a table');
    expect(readCachedTable(SUBJECT, GRID, folder)).toBeUndefined();
    expect(writeCachedTable(table, folder)).toBe(true);
    let built = false;
    const t = capacityTableFor(SUBJECT, GRID, folder, () => (built = true));
    expect(built).toBe(false);
    expect(t.buildMs).toBe(0);
  });

  it('puts the cache in $STANCHION_CACHE_DIR, else $XDG_CACHE_HOME/stanchion', () => {
    expect(cacheFolder({ STANCHION_CACHE_DIR: '/x/y' })).toBe('/x/y');
    expect(cacheFolder({ XDG_CACHE_HOME: '/c' })).toBe(join('/c', 'stanchion'));
    expect(existsSync(folder)).toBe(true);
  });
});
