import { describe, expect, it } from 'vitest';
import { endSpringMoments } from '../../src/mechanics/endSpringMoments.js';
import { criticalLoad } from '../../src/mechanics/criticalLoad.js';
import { firstYieldCapacity } from '../../src/mechanics/firstYield.js';
import { modeCurvatureFactor } from '../../src/mechanics/modeShape.js';
import type { EndRestraint, Frame } from '../../src/mechanics/types.js';

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);
// the worked-example section of docs/verification.md §M4: E = 200 000 MPa, I = 20e6 mm⁴, L = 4 m
const EI = 200e9 * 20e-6;
const L = 4;
const e0 = L / 1000;

describe('second-order moments of the bowed, spring-restrained column', () => {
  // source: Timoshenko & Gere, Theory of Elastic Stability, 2nd ed., §1.11–1.12: an initially curved bar
  // e0 sin(πx/L) under P deflects to e0 sin(πx/L)/(1 − P/Pcr), so M_max = P e0/(1 − P/Pcr) at mid-span
  it('pinned–pinned: no end moment, mid-span P e0/(1 − P/Pcr), end rotation π a/L', () => {
    const Pcr = (Math.PI ** 2 * EI) / (L * L);
    for (const ratio of [0.1, 0.5, 0.9]) {
      const P = ratio * Pcr;
      const m = endSpringMoments(EI, L, 'braced', { bottom: 0, top: 0 }, e0, P);
      expect(m.springMoment.bottom).toBe(0);
      expect(m.springMoment.top).toBe(0);
      expect(rel(m.memberMax, (P * e0) / (1 - ratio))).toBeLessThan(1e-12);
      expect(Math.abs(m.memberMaxAt - L / 2)).toBeLessThan(1e-9);
      const a = (e0 * ratio) / (1 - ratio);
      expect(rel(m.rotation.bottom, (Math.PI * a) / L)).toBeLessThan(1e-12);
      expect(rel(m.rotation.top, (-Math.PI * a) / L)).toBeLessThan(1e-12);
      expect(rel(m.amplification, 1 / (1 - ratio))).toBeLessThan(1e-12);
    }
  });

  // source: Timoshenko & Gere 2nd ed. §1.11–1.12 amplification applied to the fixed–fixed mode w0 = e0(1 − cos 2πx/L)/2
  // (Pcr = 4π²EI/L², docs/verification.md §M4 [V] "c = 1/2, |M| peaks equally at the ends and at mid-span"):
  // v = a(1 − cos 2πξ)/2, M = EI v'' ⇒ |M| = a·2π²EI/L² = P e0 /(2(1 − P/Pcr)) at both ends and mid-span
  it('fixed–fixed: the fixed-end moments equal the mid-span moment, P e0/(2(1 − P/Pcr))', () => {
    const Pcr = (4 * Math.PI ** 2 * EI) / (L * L);
    const P = 0.6 * Pcr;
    const m = endSpringMoments(EI, L, 'braced', { bottom: Infinity, top: Infinity }, e0, P);
    const expected = (P * e0) / (2 * (1 - 0.6));
    expect(rel(m.springMoment.bottom, expected)).toBeLessThan(1e-10);
    expect(rel(-m.springMoment.top, expected)).toBeLessThan(1e-10);
    expect(rel(m.memberMax, expected)).toBeLessThan(1e-10);
    expect(Math.abs(m.rotation.bottom)).toBeLessThan(1e-15);
    expect(Math.abs(m.rotation.top)).toBeLessThan(1e-15);
  });

  // common practice (statics of a free-standing cantilever): the base moment equals P times the total top drift,
  // M = P (e0 + a) = P e0 /(1 − P/Pcr), Pcr = π²EI/(4L²) (Timoshenko & Gere 2nd ed. §2.1, from memory)
  it('sway cantilever: base moment = P × total drift', () => {
    const Pcr = (Math.PI ** 2 * EI) / (4 * L * L);
    const P = 0.7 * Pcr;
    const m = endSpringMoments(EI, L, 'sway', { bottom: Infinity, top: 0 }, e0, P);
    expect(rel(m.springMoment.bottom, (P * e0) / (1 - 0.7))).toBeLessThan(1e-10);
    expect(m.springMoment.top).toBe(0);
    expect(rel(m.drift, (e0 * 0.7) / 0.3)).toBeLessThan(1e-10);
  });

  // common practice (overall moment equilibrium about the base): top pinned, base spring, lateral spring kT:
  // M_base = P·w(L) − kT·v(L)·L, with w = w0 + v the total deflection and v(L) the added drift (the spring force)
  it('sway with a lateral spring and a pinned top: moment equilibrium about the base', () => {
    for (const [Rb, T] of [[2, 3], [10, 0.5], [Infinity, 8]]) {
      const r: EndRestraint = { bottom: Rb, top: 0, lateral: T };
      const { Pcr } = criticalLoad(EI, L, 'sway', r);
      const P = 0.5 * Pcr;
      const m = endSpringMoments(EI, L, 'sway', r, e0, P);
      const kT = (T * EI) / L ** 3;
      // the sway mode of a pinned-top column peaks at the top, so w0(L) = e0
      const total = e0 + m.drift;
      expect(rel(m.springMoment.bottom, P * total - kT * m.drift * L)).toBeLessThan(1e-9);
    }
  });

  // common practice: a finite spring's moment k·θ equals the bending moment at the end (end conditions of the ODE)
  it('spring moment = k θ at finite springs', () => {
    const cases: [Frame, EndRestraint][] = [['braced', { bottom: 2, top: 0.5 }], ['sway', { bottom: 6, top: 0.6 }], ['sway', { bottom: 3, top: 1, lateral: 5 }]];
    for (const [frame, r] of cases) {
      const P = 0.4 * criticalLoad(EI, L, frame, r).Pcr;
      const m = endSpringMoments(EI, L, frame, r, e0, P);
      expect(rel(m.springMoment.bottom, ((r.bottom * EI) / L) * m.rotation.bottom)).toBeLessThan(1e-9);
      expect(rel(m.springMoment.top, ((r.top * EI) / L) * m.rotation.top)).toBeLessThan(1e-9);
    }
  });

  // source: docs/mechanics.md / docs/verification.md §M4 [V]: max|M| = P e0 c/(1 − P/Pcr); at the first-yield capacity P/A + M/S = fy
  it('member maximum is the first-yield moment P e0 c/(1 − P/Pcr)', () => {
    const A = 5000e-6, S = 200e3 * 1e-9, fy = 275e6;
    for (const r of [{ bottom: 2, top: 2 }, { bottom: Infinity, top: 0 }, { bottom: 0.5, top: 7 }]) {
      const { Pcr } = criticalLoad(EI, L, 'braced', r);
      const c = modeCurvatureFactor('braced', r);
      const P = firstYieldCapacity(A, S, fy, Pcr, e0, c);
      const m = endSpringMoments(EI, L, 'braced', r, -e0, P); // the sign of the bow does not matter
      expect(rel(P / A + m.memberMax / S, fy)).toBeLessThan(1e-9);
    }
  });

  // source: docs/verification.md §M4 [V]: fixed–pinned, max|M| in the span at x/L = 0.650422, fixed-end moment 0.976 of it
  it('fixed–pinned: span maximum and fixed-end ratio', () => {
    const m = endSpringMoments(EI, L, 'braced', { bottom: Infinity, top: 0 }, e0, 1e5);
    expect(Math.abs(m.memberMaxAt / L - 0.650422)).toBeLessThan(1e-6);
    const u = 4.4934095;
    expect(rel(m.springMoment.bottom / m.memberMax, u / Math.sqrt(1 + u * u))).toBeLessThan(1e-6);
  });

  // common practice: no equilibrium at or above Pcr, nothing at zero load
  it('unstable at P ≥ Pcr; zero at P = 0; a net tension straightens the bow (amplification below 1)', () => {
    const r = { bottom: 1, top: 1 };
    const { Pcr } = criticalLoad(EI, L, 'braced', r);
    const m = endSpringMoments(EI, L, 'braced', r, e0, Pcr);
    expect(m.stable).toBe(false);
    expect(m.memberMax).toBe(Infinity);
    expect(endSpringMoments(EI, L, 'sway', { bottom: 0, top: 0 }, e0, 1).stable).toBe(false); // mechanism
    const z = endSpringMoments(EI, L, 'braced', r, e0, 0);
    expect(z.memberMax).toBe(0);
    expect(z.springMoment.bottom).toBe(0);
    // same modal solution with P < 0: added deflection e0·(P/Pcr)/(1 − P/Pcr), opposite to the bow
    const t = endSpringMoments(EI, L, 'braced', r, e0, -0.5 * Pcr);
    const c = endSpringMoments(EI, L, 'braced', r, e0, 0.5 * Pcr);
    expect(t.stable).toBe(true);
    expect(t.memberMax).toBeGreaterThan(0);
    expect(t.memberMax / c.memberMax).toBeCloseTo((0.5 / 1.5) / (0.5 / 0.5), 12);
    expect(() => endSpringMoments(EI, L, 'braced', r, e0, Number.NaN)).toThrow(RangeError);
  });
});
