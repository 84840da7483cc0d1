/**
 * Actions so large per unit of axial load that the capacity is a minute share of Pcr: the
 * second-order closed form loses its digits as φ → 0 (its q/φ² terms cancel), so far below Pcr the
 * moment is taken linearly from SMALL_LOAD·Pcr. The capacities must then be the first-order ones.
 * A section without modulus takes no bending at all.
 */
import { describe, expect, it } from 'vitest';
import { aiscCapacity } from '../../src/mechanics/aisc360.js';
import { columnCapacity } from '../../src/mechanics/columnCapacity.js';
import { criticalLoad } from '../../src/mechanics/criticalLoad.js';
import type { ColumnState } from '../../src/mechanics/types.js';

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);
const E = 200e9;
const I = 15.4e-6;
const A = 6640e-6;
const S = 152e-6;
const fy = 300e6;
const L = 4;
// the line load per unit of axial load (1/m): 1 N of axial load comes with 1e8 N/m along the height
const LINE_PER_LOAD = 1e8;

function state(strength: { S?: number } = {}): ColumnState {
  return {
    E, fy, A, I, S: strength.S ?? S, L, bow: 0, frame: 'braced', r: { bottom: 0, top: 0 },
    eccentricity: { bottom: 0, top: 0 }, transverse: { line: LINE_PER_LOAD, top: 0 },
  };
}

describe('a line load enormous per unit of axial load (capacity far below Pcr)', () => {
  const Pcr = criticalLoad(E * I, L, 'braced', { bottom: 0, top: 0 }).Pcr;
  // first order, pinned ends: M = w L²/8 with w = LINE_PER_LOAD·P (common practice)
  const momentPerLoad = (LINE_PER_LOAD * L * L) / 8;

  it('first yield: P/A + P·(w/P)L²/8 / S = fy, the first-order answer (N/A + M/S = fy, common practice)', () => {
    const expected = fy / (1 / A + momentPerLoad / S);
    const got = columnCapacity('first-yield', state()).capacity;
    expect(expected / Pcr).toBeLessThan(1e-8); // the regime where the closed form alone gave NaN or noise
    expect(rel(got, expected)).toBeLessThan(1e-5);
  });

  it('AISC 360: H1-1b, P/(2Pc) + M/Mc = 1 with Mc = fy S (AISC 360-16 Eq. H1-1b)', () => {
    const Pc = aiscCapacity(A, fy, Pcr);
    const expected = 1 / (1 / (2 * Pc) + momentPerLoad / (fy * S));
    const got = columnCapacity('aisc360-e3', state()).capacity;
    expect(rel(got, expected)).toBeLessThan(1e-5);
  });

  it('no section modulus (a sampled modulus of 0) takes no bending: capacity 0, not NaN', () => {
    for (const model of ['first-yield', 'aisc360-e3', 'en1993-b'] as const) {
      const got = columnCapacity(model, state({ S: 0 })).capacity;
      expect(got, model).toBe(0);
    }
  });
});
