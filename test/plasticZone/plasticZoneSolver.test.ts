import { describe, expect, it } from 'vitest';
import { criticalLoad } from '../../src/mechanics/criticalLoad.js';
import { factorBanded, solveBanded } from '../../src/plasticZone/bandedLdl.js';
import { discreteCriticalLoad } from '../../src/plasticZone/discreteCriticalLoad.js';
import { plasticZoneCapacity } from '../../src/plasticZone/plasticZoneCapacity.js';
import { fibreSection } from '../../src/plasticZone/sectionFibres.js';
import type { PlasticZoneInput } from '../../src/plasticZone/types.js';

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);
const E = 210e9;
const fy = 235e6;
// IPE 300, EN 10365 (from memory)
const IPE300 = { shape: 'i', h: 0.3, b: 0.15, tw: 0.0071, tf: 0.0107 } as const;
const EI = E * fibreSection(IPE300, 'rolled', 'y', fy).I;
const L = 5;
const base: PlasticZoneInput = {
  section: IPE300, family: 'rolled', axis: 'y', E, fy, L, frame: 'braced', kBottom: 0, kTop: 0, e0: L / 1000,
};

/** restraint cases: frame, k bottom, k top, lateral k (N·m/rad, N/m) */
const CASES: ReadonlyArray<[string, 'braced' | 'sway', number, number, number]> = [
  ['pinned–pinned', 'braced', 0, 0, 0],
  ['fixed–pinned', 'braced', Infinity, 0, 0],
  ['springs R = 2 and 5', 'braced', (2 * EI) / L, (5 * EI) / L, 0],
  ['flagpole', 'sway', Infinity, 0, 0],
  ['sway, springs R = 3 and 1', 'sway', (3 * EI) / L, EI / L, 0],
  ['sway, springs and a lateral spring T = 2', 'sway', (3 * EI) / L, EI / L, (2 * EI) / L ** 3],
];
const exactPcr = (frame: 'braced' | 'sway', kB: number, kT: number, kL: number): number =>
  criticalLoad(EI, L, frame, { bottom: (kB * L) / EI, top: (kT * L) / EI, lateral: (kL * L ** 3) / EI }).Pcr;

describe('banded LDLᵀ', () => {
  it('solves a symmetric indefinite banded system and counts its negative eigenvalues', () => {
    const n = 12;
    const bw = 2;
    const a = new Float64Array(n * n);
    for (let i = 0; i < n; i++) {
      a[i * n + i] = i === 5 ? -3 : 4 + i;
      if (i + 1 < n) a[i * n + i + 1] = a[(i + 1) * n + i] = 1;
      if (i + 2 < n) a[i * n + i + 2] = a[(i + 2) * n + i] = 0.5;
    }
    const copy = a.slice();
    const x = new Float64Array(n).map((_, i) => 1 + i * i);
    const b = new Float64Array(n);
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) b[i] += copy[i * n + j] * x[j];
    const f = factorBanded(a, n, bw);
    expect(f.negativePivots).toBe(1);
    solveBanded(a, n, bw, b);
    for (let i = 0; i < n; i++) expect(Math.abs(b[i] - x[i])).toBeLessThan(1e-10 * (1 + i * i));
  });
});

describe('plastic-zone column: elastic limits', () => {
  // exact critical loads: mechanics/criticalLoad.ts, itself checked against Timoshenko & Gere 1961 ch. 2 (docs/verification.md §M1)
  it.each(CASES)('discrete critical load of 8 elements within 1e-3 of the exact one: %s', (_, frame, kB, kT, kL) => {
    const P = discreteCriticalLoad({ ...base, frame, kBottom: kB, kTop: kT, kLateral: kL, elements: 8 });
    expect(rel(P, exactPcr(frame, kB, kT, kL))).toBeLessThan(1e-3);
  });

  // cubic Hermite bending with the consistent geometric stiffness converges as h⁴ (Cook et al., Concepts and
  // Applications of Finite Element Analysis, 4th ed. 2002, §18.3, from memory)
  it('converges as h⁴ for the pinned column', () => {
    const err = (n: number): number => rel(discreteCriticalLoad({ ...base, elements: n }), exactPcr('braced', 0, 0, 0));
    const ratio = err(4) / err(8);
    expect(ratio).toBeGreaterThan(14);
    expect(ratio).toBeLessThan(18);
  });

  // with an enormous fy and a tiny bow the load-deflection path tends to Pcr from below: P = Pcr (1 − e0/δ) (common practice)
  it.each(CASES)('huge fy: the traced peak is the critical load within 1e-3: %s', (_, frame, kB, kT, kL) => {
    const r = plasticZoneCapacity({ ...base, fy: 1e15, e0: L / 1e5, frame, kBottom: kB, kTop: kT, kLateral: kL });
    const P = exactPcr(frame, kB, kT, kL);
    expect(rel(r.capacity, P)).toBeLessThan(1e-3);
    expect(r.capacity).toBeLessThan(P * (1 + 1e-4));
  });

  it('gives 0 for a mechanism (sway, both ends pinned, no lateral spring)', () => {
    expect(plasticZoneCapacity({ ...base, frame: 'sway' }).capacity).toBe(0);
  });
});

describe('plastic-zone column: plastic limits', () => {
  const rect = { shape: 'rect', h: 0.2, b: 0.1 } as const;
  const Np = 0.02 * fy;
  const Mp = ((0.1 * 0.2 ** 2) / 4) * fy;
  const stub: PlasticZoneInput = { section: rect, family: 'solid', axis: 'y', E, fy, L: 0.2, frame: 'braced', kBottom: 0, kTop: 0, e0: 0.0002 };

  // squash load A·fy (common practice)
  it('reaches the squash load at λ̄ → 0', () => {
    const r = plasticZoneCapacity(stub);
    expect(r.capacity / Np).toBeGreaterThan(0.99);
    expect(r.capacity / Np).toBeLessThanOrEqual(1 + 1e-9);
    const ipe = plasticZoneCapacity({ ...base, L: 1, e0: 0.001 }); // λ̄ ≈ 0.08
    expect(ipe.capacity / ipe.squashLoad).toBeGreaterThan(0.99);
  });

  // full plastic N–M interaction of a rectangle, M/Mp + (N/Np)² = 1 (Neal, The Plastic Methods of Structural Analysis, 1977, ch. 6, from memory)
  it('reaches the plastic N–M interaction of a stub (L = h) under end eccentricity', () => {
    for (const e of [0.01, 0.05, 0.2]) {
      const r = plasticZoneCapacity({ ...stub, e0: 0, eccentricity: { top: e, bottom: e } });
      const a = 1 / Np ** 2;
      const b = e / Mp;
      const N = (-b + Math.sqrt(b * b + 4 * a)) / (2 * a);
      expect(r.capacity / N).toBeGreaterThan(0.985);
      expect(r.capacity / N).toBeLessThanOrEqual(1 + 1e-9);
    }
  });

  it('single curvature is worse than double curvature; the bow takes the worse side', () => {
    const col: PlasticZoneInput = { ...stub, L: 4, e0: 0.004 };
    const single = plasticZoneCapacity({ ...col, eccentricity: { top: 0.02, bottom: 0.02 } }).capacity;
    const double = plasticZoneCapacity({ ...col, eccentricity: { top: 0.02, bottom: -0.02 } }).capacity;
    const flipped = plasticZoneCapacity({ ...col, e0: -0.004, eccentricity: { top: 0.02, bottom: 0.02 } }).capacity;
    const concentric = plasticZoneCapacity(col).capacity;
    expect(single).toBeLessThan(double);
    expect(double).toBeLessThan(concentric);
    expect(flipped).toBe(single);
  });

  it('more restraint, more capacity; strain hardening adds capacity', () => {
    const pinned = plasticZoneCapacity(base).capacity;
    const springs = plasticZoneCapacity({ ...base, kBottom: (2 * EI) / L, kTop: (2 * EI) / L }).capacity;
    const fixed = plasticZoneCapacity({ ...base, kBottom: Infinity, kTop: Infinity }).capacity;
    expect(pinned).toBeLessThan(springs);
    expect(springs).toBeLessThan(fixed);
    expect(plasticZoneCapacity({ ...base, hardening: E / 100 }).capacity).toBeGreaterThan(pinned);
  });
});

describe('plastic-zone column: mesh convergence', () => {
  // the table of docs/plastic-zone.md §5
  it.each(CASES)('4, 8, 16, 32 elements converge: %s', (_, frame, kB, kT, kL) => {
    const chi = [4, 8, 16, 32].map((n) => {
      const r = plasticZoneCapacity({ ...base, frame, kBottom: kB, kTop: kT, kLateral: kL, elements: n });
      return r.capacity / r.squashLoad;
    });
    const d1 = Math.abs(chi[0] - chi[3]);
    const d3 = Math.abs(chi[2] - chi[3]);
    expect(d3).toBeLessThan(1e-3 * chi[3]);
    expect(d3).toBeLessThanOrEqual(d1);
    expect(Math.abs(chi[0] - chi[3])).toBeLessThan(1e-2 * chi[3]);
  });
});
