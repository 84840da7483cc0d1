/**
 * Speed of the column mechanics: critical-load solves per second for quasi-random restraint
 * (R log-uniform on [1e-2, 1e3] at each end, both frames), for the exact characteristic-equation
 * solver, the finite-element check, the fast table path, and a floor loop whose "solve" is one
 * Math.sin call. Run alone: `node dist/bench/mechanicsBench.js`.
 */
import { feEigenvalues } from '../src/fe/feCriticalLoads.js';
import { WEIGHT_LENGTH, weightsInto } from '../src/mechanics/characteristicEquation.js';
import { columnCapacity } from '../src/mechanics/columnCapacity.js';
import { criticalLoad, criticalPhiFromWeights } from '../src/mechanics/criticalLoad.js';
import { fastPhi, fastTable, makeFastCapacityFromRatio } from '../src/mechanics/fastColumn.js';
import type { Frame } from '../src/mechanics/types.js';

const POINTS = 4096;

/** Log-uniform restraint ratios from the R2 low-discrepancy sequence (deterministic, no RNG needed). */
function restraintSamples(): { RA: Float64Array; RB: Float64Array } {
  const g = 1.32471795724474602596;
  const RA = new Float64Array(POINTS);
  const RB = new Float64Array(POINTS);
  for (let i = 0; i < POINTS; i++) {
    RA[i] = Math.pow(10, -2 + 5 * ((0.5 + i / g) % 1));
    RB[i] = Math.pow(10, -2 + 5 * ((0.5 + i / (g * g)) % 1));
  }
  return { RA, RB };
}

/** Calls body(i) for i = 0, 1, … in batches until `seconds` have passed; returns calls per second. */
function rate(seconds: number, batch: number, body: (i: number) => number): { perSecond: number; sink: number } {
  let sink = 0;
  let calls = 0;
  const t0 = performance.now();
  let t = t0;
  while (t - t0 < seconds * 1000) {
    for (let k = 0; k < batch; k++) sink += body((calls + k) & (POINTS - 1));
    calls += batch;
    t = performance.now();
  }
  return { perSecond: (calls * 1000) / (t - t0), sink };
}

const fmt = (x: number): string => (x >= 1e6 ? `${(x / 1e6).toFixed(2)} M/s` : x >= 1e3 ? `${(x / 1e3).toFixed(1)} k/s` : `${x.toFixed(1)} /s`);

export async function runMechanicsBench(seconds = 0.5): Promise<string[]> {
  const { RA, RB } = restraintSamples();
  const lines: string[] = ['mechanics: critical-load solves per second, one core, R log-uniform on [1e-2, 1e3] at both ends'];
  const t0 = performance.now();
  fastTable('braced');
  fastTable('sway');
  lines.push(`  fast tables built in ${(performance.now() - t0).toFixed(1)} ms (both frames)`);
  const w = new Float64Array(WEIGHT_LENGTH);
  const E = 200e9, fy = 355e6, A = 7640e-6, I = 25.1e-6, S = 281e-6, L = 4.2, bow = L / 1500;
  for (const frame of ['braced', 'sway'] as Frame[]) {
    const floor = rate(seconds, 4096, (i) => Math.sin(RA[i] + RB[i]));
    const exactCore = rate(seconds, 1024, (i) => criticalPhiFromWeights(frame, weightsInto(w, RA[i], RB[i], 0), 1));
    const exactPublic = rate(seconds, 1024, (i) => criticalLoad(E * I, L, frame, { bottom: RA[i], top: RB[i] }).Pcr);
    const fe = rate(seconds, 4, (i) => feEigenvalues(frame, { bottom: RA[i], top: RB[i] }, 32, 1)[0]);
    const fast = rate(seconds, 4096, (i) => fastPhi(frame, RA[i], RB[i]));
    const capExact = rate(seconds, 256, (i) => columnCapacity('first-yield', { E, fy, A, I, S, L, bow, frame, r: { bottom: RA[i], top: RB[i] } }).capacity);
    // the beam-column path (docs/beam-column.md): an eccentric load, then with a line load and a top force as well
    const capEccentric = rate(seconds, 64, (i) => columnCapacity('first-yield', { E, fy, A, I, S, L, bow, frame, r: { bottom: RA[i], top: RB[i] }, eccentricity: { bottom: 0, top: 0.02 } }).capacity);
    const transverse = { line: 0.01, top: frame === 'sway' ? 0.005 : 0 };
    const capActions = rate(seconds, 64, (i) => columnCapacity('first-yield', { E, fy, A, I, S, L, bow, frame, r: { bottom: RA[i], top: RB[i] }, eccentricity: { bottom: 0, top: 0.02 }, transverse }).capacity);
    const fastCap = makeFastCapacityFromRatio(frame, 'first-yield');
    const capFast = rate(seconds, 4096, (i) => fastCap(E, fy, A, I, S, L, bow, RA[i], RB[i]));
    const f = floor.perSecond;
    const row = (name: string, r: { perSecond: number }): string =>
      `  ${frame.padEnd(6)} ${name.padEnd(44)} ${fmt(r.perSecond).padStart(11)}   floor/this = ${(f / r.perSecond).toFixed(1)}`;
    lines.push(`  ${frame.padEnd(6)} ${'floor: one Math.sin per sample'.padEnd(44)} ${fmt(f).padStart(11)}`);
    lines.push(row('exact φ (Brent, non-allocating core)', exactCore));
    lines.push(row('exact criticalLoad() (public, allocating)', exactPublic));
    lines.push(row('finite elements, 32 elements, lowest mode', fe));
    lines.push(row('fast φ (bicubic fixity table)', fast));
    lines.push(row('exact first-yield capacity (columnCapacity)', capExact));
    lines.push(row('fast first-yield capacity (Pcr and c)', capFast));
    lines.push(row('exact first-yield capacity, eccentric load', capEccentric));
    lines.push(row('... with line load (and top force in sway)', capActions));
    // keep the sinks alive so nothing is optimised away
    if (Number.isNaN(floor.sink + exactCore.sink + exactPublic.sink + fe.sink + fast.sink + capExact.sink + capFast.sink + capEccentric.sink + capActions.sink)) lines.push('  (NaN seen)');
  }
  return lines;
}

if (import.meta.url === `file://${process.argv[1]}`) {
  runMechanicsBench().then((lines) => {
    for (const line of lines) console.log(line);
  });
}
