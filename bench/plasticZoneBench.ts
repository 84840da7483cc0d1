/**
 * Cost of the plastic-zone strength model: one full evaluation (ms) over a few slendernesses and
 * restraints, the table's build time for one section, a table read (µs), and the table's error
 * against the full model at seeded random points inside its grid.
 * `node dist/bench/run.js plastic-zone` (after `npx tsc -p tsconfig.json`).
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { criticalLoad } from '../src/mechanics/criticalLoad.js';
import { uniformStream } from '../src/probability/rng.js';
import { buildCapacityTable, chiAt, DEFAULT_GRID, fixityOfRatio, type CapacityTable, type TableSubject } from '../src/plasticZone/capacityTable.js';
import { plasticZoneCapacity } from '../src/plasticZone/plasticZoneCapacity.js';
import { fibreSection } from '../src/plasticZone/sectionFibres.js';
import { readCachedTable, writeCachedTable } from '../src/plasticZone/tableCache.js';

const SUBJECT: TableSubject = {
  section: { shape: 'i', h: 0.19, b: 0.19, tw: 0.009, tf: 0.014 }, family: 'rolled', axis: 'z', frame: 'braced', elements: 16,
};

export function runPlasticZoneBench(options: { points?: number; grid?: boolean } = {}): void {
  const E = 200e9;
  const fy = 300e6;
  const fib = fibreSection(SUBJECT.section, SUBJECT.family, SUBJECT.axis, fy);
  const EI = E * fib.I;
  const rng = uniformStream(20261202, 0);
  // random columns inside the table's grid: λ̄ 0.3–2.8 by L, springs R 0–30 each end, η 0.02–0.9
  const points = Array.from({ length: options.points ?? 40 }, () => {
    const RB = 30 * rng() ** 2;
    const RT = 30 * rng() ** 2;
    const phi = Math.sqrt(criticalLoad(1, 1, 'braced', { bottom: RB, top: RT }).Pcr);
    const lambdaBar = 0.3 + 2.5 * rng();
    const L = lambdaBar * phi * Math.sqrt(EI / (fib.A * fy));
    return { L, RB, RT, lambdaBar, eta: 0.02 + 0.88 * rng() };
  });
  const direct = points.map((p) => {
    const t0 = performance.now();
    const r = plasticZoneCapacity({
      section: SUBJECT.section, family: SUBJECT.family, axis: SUBJECT.axis, E, fy, L: p.L, frame: 'braced',
      kBottom: (p.RB * EI) / p.L, kTop: (p.RT * EI) / p.L, e0: (p.eta * fib.W) / fib.A,
    });
    return { chi: r.capacity / r.squashLoad, ms: performance.now() - t0 };
  });
  const ms = direct.map((d) => d.ms).sort((a, b) => a - b);
  console.log(`plastic-zone, full model (16 elements, ${fib.area.length} fibres): median ${ms[ms.length >> 1].toFixed(1)} ms, `
    + `max ${ms[ms.length - 1].toFixed(1)} ms per evaluation over ${ms.length} random columns (λ̄ 0.3–2.8)`);
  let table: CapacityTable;
  if (options.grid === false) {
    // the quick run: through the table only when an earlier `plastic-zone` run left it in the user's cache
    const cached = readCachedTable(SUBJECT, DEFAULT_GRID);
    if (!cached) {
      console.log('plastic-zone table: not in the cache; `node dist/bench/run.js plastic-zone` builds it (and caches it) and measures it');
      return;
    }
    table = cached;
  } else {
    table = buildCapacityTable(SUBJECT, DEFAULT_GRID);
    console.log(`plastic-zone table: ${table.chi.length} nodes built in ${(table.buildMs / 1000).toFixed(1)} s (one section, one frame)`);
    const folder = mkdtempSync(join(tmpdir(), 'stanchion-bench-'));
    writeCachedTable(table, folder);
    const t0 = performance.now();
    const again = readCachedTable(SUBJECT, DEFAULT_GRID, folder);
    console.log(`plastic-zone table read from disk: ${(performance.now() - t0).toFixed(1)} ms (${again ? 'ok' : 'MISSING'})`);
    rmSync(folder, { recursive: true, force: true });
    writeCachedTable(table); // for the quick run's line through the table
  }
  let worst = 0;
  let sum = 0;
  const reads = 200000;
  const t1 = performance.now();
  let sink = 0;
  for (let i = 0; i < reads; i++) {
    const p = points[i % points.length];
    sink += chiAt(table, p.lambdaBar, fixityOfRatio(p.RB), fixityOfRatio(p.RT), p.eta);
  }
  const perRead = ((performance.now() - t1) * 1000) / reads;
  // what the limit state does per sample besides the read: Pcr of the restrained column for λ̄
  const solves = 20000;
  const t2 = performance.now();
  for (let i = 0; i < solves; i++) {
    const p = points[i % points.length];
    sink += criticalLoad(EI * (1 + i * 1e-9), p.L, 'braced', { bottom: p.RB, top: p.RT }).Pcr * 1e-12;
  }
  const perSolve = ((performance.now() - t2) * 1000) / solves;
  points.forEach((p, i) => {
    const chi = chiAt(table, p.lambdaBar, fixityOfRatio(p.RB), fixityOfRatio(p.RT), p.eta);
    const err = Math.abs(chi / direct[i].chi - 1);
    worst = Math.max(worst, err);
    sum += err;
  });
  console.log(`plastic-zone through the table: ${(perRead + perSolve).toFixed(2)} µs per evaluation (interpolation ${perRead.toFixed(2)} µs + critical-load solve ${perSolve.toFixed(2)} µs; ${sink > 0 ? 'ok' : '?'})`);
  console.log(`plastic-zone table error against the full model at ${points.length} random points: mean ${(100 * sum / points.length).toFixed(2)} %, max ${(100 * worst).toFixed(2)} %`);
}
