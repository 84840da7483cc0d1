import { describe, expect, it } from 'vitest';
import { firstInteriorRoot } from '../../src/mechanics/bracket.js';
import { brentRoot } from '../../src/mechanics/brent.js';
import {
  WEIGHT_LENGTH, bracedChar, bracedCharAtMultipleOfPi, e1, e2, swayChar, swayCharAtMultipleOfPi, weightsInto,
} from '../../src/mechanics/characteristicEquation.js';

const none = new Float64Array(0);

describe('Brent root finding', () => {
  // from memory: the fixed point of cos, x = cos x, is 0.7390851332151607 (the Dottie number)
  it('converges to machine precision on a bracket', () => {
    const x = brentRoot((t) => Math.cos(t) - t, none, 0, 1);
    expect(Math.abs(x - 0.7390851332151607)).toBeLessThan(4e-16);
  });
  // common practice: tiny roots are found to relative, not absolute, precision
  it('relative precision for tiny roots', () => {
    const x = brentRoot((t) => t - 1e-200, none, 0, 1);
    expect(Math.abs(x - 1e-200) / 1e-200).toBeLessThan(1e-14);
  });
  // common practice (DESIGN.md): never an unbracketed step, never an unconverged root returned silently
  it('throws without a bracket or on non-finite values', () => {
    expect(() => brentRoot((t) => t * t + 1, none, -1, 1)).toThrow(/bracket/);
    expect(() => brentRoot((t) => (t > 0.5 ? NaN : -1), none, 0, 1, -1, 1)).toThrow();
  });
  // common practice: the interior scan skips roots at the endpoints and finds the first interior one
  it('interior scan', () => {
    const f = (t: number): number => Math.sin(t);
    expect(Math.abs(firstInteriorRoot(f, none, 0, 2 * Math.PI) - Math.PI)).toBeLessThan(1e-15);
    expect(firstInteriorRoot(f, none, 0.1, 3)).toBeNaN();
    // a root 1e-10 inside the interval, next to an endpoint root
    const g = (t: number): number => t * (t - 1e-10);
    expect(Math.abs(firstInteriorRoot(g, none, 0, 1) - 1e-10)).toBeLessThan(1e-24);
  });
});

describe('characteristic functions', () => {
  // common practice: the series used near φ = 0 join the direct formulas smoothly
  it('series and direct forms agree at the switch', () => {
    const direct1 = (p: number): number => (2 * (1 - Math.cos(p)) - p * Math.sin(p)) / p ** 4;
    const direct2 = (p: number): number => (Math.sin(p) - p * Math.cos(p)) / p ** 3;
    for (const p of [0.2499999, 0.25, 0.2500001]) {
      expect(Math.abs(e1(p) - direct1(p)) / direct1(p)).toBeLessThan(1e-11);
      expect(Math.abs(e2(p) - direct2(p)) / direct2(p)).toBeLessThan(1e-12);
    }
    // source: docs/verification.md §M2 [V]: Δb ≈ φ⁴(R_A R_B/12 + (R_A+R_B)/3 + 1) as φ → 0 (Taylor expansion)
    expect(e1(0)).toBe(1 / 12);
    expect(e2(0)).toBe(1 / 3);
  });
  // source: Δb and Δs of docs/verification.md §M2 [V] (Chen & Lui 1987 §2.3, from memory): the normalised forms equal Δb/φ⁴ and Δs/φ (scaled by (1+R_A)(1+R_B))
  it('normalised forms equal the published determinants', () => {
    const w = new Float64Array(WEIGHT_LENGTH);
    for (const [RA, RB] of [[0.5, 3], [10, 0], [2, 2]]) {
      weightsInto(w, RA, RB, 0);
      const scale = (1 + RA) * (1 + RB);
      for (const p of [0.7, 2.2, 4.1, 9.3]) {
        const s = Math.sin(p), c = Math.cos(p);
        const db = RA * RB * (2 * (1 - c) - p * s) + (RA + RB) * p * (s - p * c) + p ** 3 * s;
        const ds = (RA * RB - p * p) * s + (RA + RB) * p * c;
        expect(Math.abs(bracedChar(p, w) * scale - db / p ** 4)).toBeLessThan(1e-12 * (1 + RA * RB));
        expect(Math.abs(swayChar(p, w) * scale - ds / p)).toBeLessThan(1e-12 * (1 + RA * RB));
      }
      for (let m = 1; m <= 4; m++) {
        expect(Math.abs(bracedCharAtMultipleOfPi(m, w) - bracedChar(m * Math.PI, w))).toBeLessThan(1e-14);
        expect(Math.abs(swayCharAtMultipleOfPi(m, w) - swayChar(m * Math.PI, w))).toBeLessThan(1e-14);
      }
    }
  });
});
