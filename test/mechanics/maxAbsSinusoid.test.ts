/**
 * The closed-form largest |a sin φξ + b cos φξ − c| over [0, 1] against a dense scan, and against
 * the general two-frequency search (bracket, then Newton steps) it replaces when the second term is
 * absent. Check: sin/cos phase form, common practice.
 */
import { describe, expect, it } from 'vitest';
import { maxAbsSinusoid, maxAbsTwoSinusoids } from '../../src/mechanics/beamColumn.js';
import { uniformStream } from '../../src/probability/rng.js';

function denseMax(f: (x: number) => number, n = 50_000): { value: number; at: number } {
  let value = -1, at = 0;
  for (let i = 0; i <= n; i++) {
    const v = Math.abs(f(i / n));
    if (v > value) { value = v; at = i / n; }
  }
  return { value, at };
}

describe('largest value of one sinusoid over the height', () => {
  it('matches a dense scan over random amplitudes, frequencies up to 3π and offsets', () => {
    const u = uniformStream(42, 0);
    const at = new Float64Array(1);
    for (let trial = 0; trial < 200; trial++) {
      const a = (u() - 0.5) * 10;
      const b = (u() - 0.5) * 10;
      const phi = u() < 0.05 ? 1e-9 : u() * 3 * Math.PI;
      const c = u() < 0.3 ? 0 : (u() - 0.5) * 8;
      const f = (x: number) => a * Math.sin(phi * x) + b * Math.cos(phi * x) - c;
      const got = maxAbsSinusoid(a, b, phi, c, at);
      const ref = denseMax(f);
      // the scan can only miss the peak, by at most the curvature over half a step
      expect(got).toBeGreaterThanOrEqual(ref.value - 1e-12);
      expect(got - ref.value).toBeLessThan(1e-8 * Math.max(1, Math.abs(a) + Math.abs(b) + Math.abs(c)));
      // the place returned carries the value returned
      expect(Math.abs(f(at[0]))).toBeCloseTo(got, 10);
    }
  });

  it('is what the two-frequency search gives when the second term is zero', () => {
    const u = uniformStream(43, 0);
    const at1 = new Float64Array(1);
    const at2 = new Float64Array(1);
    for (let trial = 0; trial < 200; trial++) {
      const P = 1 + u() * 1e6;
      const A = (u() - 0.5) * 0.02;
      const B = (u() - 0.5) * 0.02;
      const phi = 0.1 + u() * 2.8 * Math.PI;
      const off = u() < 0.5 ? 0 : (u() - 0.5) * 1e4;
      // the second sinusoid at a frequency of its own with a vanishing amplitude: the general search
      const general = maxAbsTwoSinusoids(P, A, B, phi, 1e-300, 1, 1, phi / 2, at2, off);
      const closed = maxAbsTwoSinusoids(P, A, B, phi, 0, 0, 0, 0, at1, off);
      expect(Math.abs(closed - general)).toBeLessThanOrEqual(1e-12 * Math.max(1, general));
      // the place may differ where two peaks tie (±ρ with no offset); it carries the value either way
      const x = at1[0];
      expect(Math.abs(P * (A * Math.sin(phi * x) + B * Math.cos(phi * x)) - off)).toBeCloseTo(closed, 6);
    }
  });

  it("two frequencies: the bracketing grid and Newton steps find the dense scan's peak", () => {
    const u = uniformStream(44, 0);
    const at = new Float64Array(1);
    for (let trial = 0; trial < 150; trial++) {
      const P = 1 + u() * 1e3;
      const Ae = (u() - 0.5) * 0.02, Be = (u() - 0.5) * 0.02;
      const phi = 0.05 + u() * 2.9 * Math.PI;
      const Q = (u() - 0.5) * 20;
      const Am = (u() - 0.5) * 2, Bm = (u() - 0.5) * 2;
      const psi = Math.PI + u() * Math.PI;
      const off = u() < 0.5 ? 0 : (u() - 0.5) * 10;
      const f = (x: number) => P * (Ae * Math.sin(phi * x) + Be * Math.cos(phi * x)) + Q * (Am * Math.sin(psi * x) + Bm * Math.cos(psi * x)) - off;
      const got = maxAbsTwoSinusoids(P, Ae, Be, phi, Q, Am, Bm, psi, at, off);
      const ref = denseMax(f);
      const scale = Math.max(1, P * (Math.abs(Ae) + Math.abs(Be)) + Math.abs(Q) * (Math.abs(Am) + Math.abs(Bm)) + Math.abs(off));
      expect(got).toBeGreaterThanOrEqual(ref.value - 1e-12 * scale);
      expect(got - ref.value).toBeLessThan(1e-8 * scale);
      expect(Math.abs(f(at[0]))).toBeCloseTo(got, 9);
    }
  });
});
