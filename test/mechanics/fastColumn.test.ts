import { describe, expect, it } from 'vitest';
import { columnCapacity } from '../../src/mechanics/columnCapacity.js';
import { criticalPhi } from '../../src/mechanics/criticalLoad.js';
import {
  FAST_TABLE_CELLS, SWAY_EXACT_CORNER, fastCurvatureFactor, fastPhi, makeFastCapacity, makeFastCapacityFromRatio,
} from '../../src/mechanics/fastColumn.js';
import { modeShape } from '../../src/mechanics/modeShape.js';
import { ratioFromFixity } from '../../src/mechanics/restraint.js';
import { CLOSED_FORM_STRENGTH_MODELS, type Frame } from '../../src/mechanics/types.js';

// The oracle is the exact characteristic-equation solver, itself checked against
// source: Timoshenko & Gere 1961 ch. 2 and docs/verification.md §M2 Tables 2a/2b [V] (criticalLoad.test.ts).

const rel = (a: number, b: number): number => (a === b ? 0 : Math.abs(a - b) / Math.abs(b));

/** Deterministic space-filling points in [0,1]² (R2 sequence, Roberts 2018): no random numbers needed. */
function r2(i: number): [number, number] {
  const g = 1.32471795724474602596;
  return [(0.5 + i / g) % 1, (0.5 + i / (g * g)) % 1];
}

/** Fixity points: 70 % uniform, 10 % crowded at each edge (0 and 1), 10 % exact edges. */
function fixityPoint(i: number): [number, number] {
  const [a, b] = r2(i);
  const k = i % 10;
  if (k === 7) return [a * 1e-3, b];
  if (k === 8) return [1 - a * 1e-3, 1 - b * 1e-3];
  if (k === 9) return [i % 20 === 9 ? 0 : 1, b];
  return [a, b];
}

const N_POINTS = 10000;

describe.each(['braced', 'sway'] as Frame[])('fast path, %s', (frame) => {
  it(`agrees with the exact solver at ${N_POINTS} points (Pcr and c within 1e-6)`, () => {
    let worstP = 0;
    let worstC = 0;
    for (let i = 0; i < N_POINTS; i++) {
      const [fA, fB] = fixityPoint(i);
      const RA = ratioFromFixity(fA);
      const RB = ratioFromFixity(fB);
      const exact = criticalPhi(frame, { bottom: RA, top: RB });
      const fast = fastPhi(frame, RA, RB);
      if (exact === 0) {
        expect(fast).toBe(0);
        continue;
      }
      worstP = Math.max(worstP, rel(fast * fast, exact * exact));
      const cExact = modeShape(frame, { bottom: RA, top: RB }, exact).curvatureFactor;
      worstC = Math.max(worstC, rel(fastCurvatureFactor(frame, RA, RB, fast), cExact));
    }
    expect(worstP).toBeLessThan(1e-6);
    expect(worstC).toBeLessThan(1e-6);
  });

  it('capacity agrees with columnCapacity for every model within 1e-6', () => {
    const E = 200e9, fy = 355e6, A = 7640e-6, I = 25.1e-6, S = 281e-6;
    for (const model of CLOSED_FORM_STRENGTH_MODELS) {
      const fast = makeFastCapacityFromRatio(frame, model);
      let worst = 0;
      for (let i = 0; i < 2000; i++) {
        const [fA, fB] = fixityPoint(i * 7 + 3);
        const RA = ratioFromFixity(fA), RB = ratioFromFixity(fB);
        const L = 2 + 10 * r2(i + 50000)[0];
        const bow = (i % 2 === 0 ? 1 : -1) * L / 1000;
        const exact = columnCapacity(model, { E, fy, A, I, S, L, bow, frame, r: { bottom: RA, top: RB } });
        // AISC E3 jumps by 0.044 % at Fy/Fe = 2.25: skip points within 1e-6 of that branch boundary
        if (model === 'aisc360-e3' && exact.Pcr > 0 && Math.abs((fy * A) / exact.Pcr - 2.25) < 1e-6) continue;
        const got = fast(E, fy, A, I, S, L, bow, RA, RB);
        if (exact.capacity === 0) expect(got).toBe(0);
        else worst = Math.max(worst, rel(got, exact.capacity));
      }
      expect(worst).toBeLessThan(1e-6);
    }
  });
});

describe('fast path details', () => {
  // source: docs/verification.md §M2 Table 2b [V]: sway (0,0) is a mechanism; near it φ² ≈ R_A + R_B is reached by the exact fallback
  it('sway corner: mechanism and exact fallback', () => {
    expect(fastPhi('sway', 0, 0)).toBe(0);
    for (const R of [1e-12, 1e-6, 1e-4, 1.4e-3]) {
      expect((2 * R) / (R + 3)).toBeLessThan(SWAY_EXACT_CORNER);
      expect(rel(fastPhi('sway', R, R), criticalPhi('sway', { bottom: R, top: R }))).toBeLessThan(1e-12);
    }
  });
  // common practice: stiffness inputs in N·m/rad convert with R = kL/EI; Infinity = fixed, 0 = pinned
  it('takes rotational stiffnesses', () => {
    const E = 200e9, fy = 355e6, A = 7640e-6, I = 25.1e-6, S = 281e-6, L = 4.2, bow = L / 1500;
    const EI = E * I;
    const fast = makeFastCapacity('braced', 'first-yield');
    for (const [kA, kB] of [[2.5e6, 0], [Infinity, 1e7], [0, 0], [Infinity, Infinity], [3e5, 4e8]]) {
      const exact = columnCapacity('first-yield', {
        E, fy, A, I, S, L, bow, frame: 'braced',
        r: { bottom: kA === Infinity ? Infinity : (kA * L) / EI, top: kB === Infinity ? Infinity : (kB * L) / EI },
      });
      expect(rel(fast(E, fy, A, I, S, L, bow, kA, kB), exact.capacity)).toBeLessThan(1e-6);
    }
    expect(makeFastCapacity('sway', 'first-yield')(E, fy, A, I, S, L, bow, 0, 0)).toBe(0);
    expect(makeFastCapacity('sway', 'aisc360-e3')(E, fy, A, I, S, L, bow, 0, 0)).toBe(0);
  });
  // common practice: the table resolution is what the accuracy test above was run with
  it('table size', () => {
    expect(FAST_TABLE_CELLS).toBeGreaterThanOrEqual(64);
    expect(() => fastPhi('braced', -1, 0)).toThrow();
  });
});
