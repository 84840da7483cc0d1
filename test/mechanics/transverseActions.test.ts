import { describe, expect, it } from 'vitest';
import { feFirstMode, feSecondOrder, type FeNodalShape } from '../../src/fe/feSecondOrder.js';
import { beamColumnResponse } from '../../src/mechanics/beamColumn.js';
import { criticalLoad } from '../../src/mechanics/criticalLoad.js';
import type { EndRestraint, Frame } from '../../src/mechanics/types.js';

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);
const EI = 200e9 * 15.4e-6;
const L = 5.6;

function scaled(mode: FeNodalShape, s: number): FeNodalShape {
  return { w: mode.w.map((v) => v * s), slope: mode.slope.map((v) => v * s) };
}

describe('uniform transverse load on a pinned-pinned beam-column', () => {
  const pinned = { bottom: 0, top: 0 };
  const w = 3.5e3;
  // Timoshenko & Gere, Theory of Elastic Stability, 2nd ed. 1961, ch. 1, beam-column under a uniform lateral load
  // (section number from memory): M_max = (w EI/P)(sec u − 1) at mid-height, u = (L/2)√(P/EI)
  it.each([0.1, 0.5, 0.9])('P = %d Pcr: M_max = (w EI/P)(sec u − 1)', (ratio) => {
    const P = ratio * criticalLoad(EI, L, 'braced', pinned).Pcr;
    const u = (L / 2) * Math.sqrt(P / EI);
    const expected = ((w * EI) / P) * (1 / Math.cos(u) - 1);
    const got = beamColumnResponse(EI, L, 'braced', pinned, 0, 0, 0, P, { line: w, top: 0 });
    expect(rel(got.memberMax, expected)).toBeLessThan(1e-9);
    expect(got.memberMaxAt / L).toBeCloseTo(0.5, 9);
    expect(got.springMoment).toEqual({ bottom: 0, top: 0 });
  });

  // common practice: the first-order simply supported beam, M_max = w L²/8
  it('P → 0 gives the first-order w L²/8', () => {
    const P = 1e-6 * criticalLoad(EI, L, 'braced', pinned).Pcr;
    const got = beamColumnResponse(EI, L, 'braced', pinned, 0, 0, 0, P, { line: w, top: 0 });
    expect(rel(got.memberMax, (w * L * L) / 8)).toBeLessThan(1e-5);
  });

  // common practice: a fixed-ended beam under uniform load has end moments w L²/12 (first order)
  it('P → 0 with both ends fixed gives end moments w L²/12', () => {
    const P = 1e-6 * criticalLoad(EI, L, 'braced', { bottom: Infinity, top: Infinity }).Pcr;
    const got = beamColumnResponse(EI, L, 'braced', { bottom: Infinity, top: Infinity }, 0, 0, 0, P, { line: w, top: 0 });
    expect(rel(Math.abs(got.springMoment.bottom), (w * L * L) / 12)).toBeLessThan(1e-5);
    expect(rel(Math.abs(got.springMoment.top), (w * L * L) / 12)).toBeLessThan(1e-5);
    expect(rel(got.memberMax, (w * L * L) / 12)).toBeLessThan(1e-5);
  });
});

describe('fixed-base flagpole with a horizontal force at the top', () => {
  const flagpole: EndRestraint = { bottom: Infinity, top: 0, lateral: 0 };
  const H = 12e3;
  // Timoshenko & Gere, Theory of Elastic Stability, 2nd ed. 1961, ch. 1, cantilever under axial and lateral load at the
  // free end (section number from memory): δ = H (tan kL − kL)/(P k), M_base = H L + P δ = H tan(kL)/k, k = √(P/EI)
  it.each([0.2, 0.6, 0.95])('P = %d Pcr: M_base = H tan(kL)/k', (ratio) => {
    const P = ratio * criticalLoad(EI, L, 'sway', flagpole).Pcr;
    const k = Math.sqrt(P / EI);
    const got = beamColumnResponse(EI, L, 'sway', flagpole, 0, 0, 0, P, { line: 0, top: H });
    expect(rel(got.springMoment.bottom, (H * Math.tan(k * L)) / k)).toBeLessThan(1e-9);
    expect(rel(got.memberMax, (H * Math.tan(k * L)) / k)).toBeLessThan(1e-9);
    expect(got.memberMaxAt).toBe(0);
    expect(rel(got.drift, (H * (Math.tan(k * L) - k * L)) / (P * k))).toBeLessThan(1e-8);
  });

  // common practice: the first-order cantilever, M_base = H L
  it('P → 0 gives H·L', () => {
    const P = 1e-6 * criticalLoad(EI, L, 'sway', flagpole).Pcr;
    const got = beamColumnResponse(EI, L, 'sway', flagpole, 0, 0, 0, P, { line: 0, top: H });
    expect(rel(got.springMoment.bottom, H * L)).toBeLessThan(1e-5);
  });

  // EN 1993-1-1 §5.3.2(7): an out-of-plumb φ acts as the horizontal force P·φ at the top; a straight tilt has no
  // curvature, so in the linear elastic member the two are the same (common practice)
  it('the out-of-plumb as a top force P·φ: H = P/200 gives (P/200) tan(kL)/k', () => {
    const P = 0.5 * criticalLoad(EI, L, 'sway', flagpole).Pcr;
    const k = Math.sqrt(P / EI);
    const got = beamColumnResponse(EI, L, 'sway', flagpole, 0, 0, 0, P, { line: 0, top: P / 200 });
    expect(rel(got.springMoment.bottom, ((P / 200) * Math.tan(k * L)) / k)).toBeLessThan(1e-9);
  });
});

describe('no transverse action: the same numbers bit for bit', () => {
  it.each([
    ['braced', { bottom: 2, top: 0.5 }],
    ['sway', { bottom: 6, top: 0.6, lateral: 3 }],
  ] as [Frame, EndRestraint][])('%s %o', (frame, r) => {
    const P = 0.4 * criticalLoad(EI, L, frame, r).Pcr;
    const before = beamColumnResponse(EI, L, frame, r, L / 800, 0.02, -0.01, P);
    const after = beamColumnResponse(EI, L, frame, r, L / 800, 0.02, -0.01, P, { line: 0, top: 0 });
    expect(after.memberMax).toBe(before.memberMax);
    expect(after.springMoment).toEqual(before.springMoment);
    expect(after.rotation).toEqual(before.rotation);
  });
});

// source: linear second-order finite elements (K − P Kg) v = P Kg w0 + f with Hermite cubics, the consistent geometric
// stiffness and consistent nodal loads, Przemieniecki, Theory of Matrix Structural Analysis, 1968 (from memory); shares
// no formula with the closed form
describe('closed form vs finite elements under line load, top force, end couples and a bow', () => {
  const grid = [0, 0.5, 3, 20, Infinity];
  const cases: [Frame, EndRestraint, number, number, number, number][] = [];
  for (const bottom of grid) for (const top of grid) cases.push(['braced', { bottom, top }, 0.01, -0.004, 2.5e3, 0]);
  for (const bottom of [0.5, 6, Infinity]) for (const top of [0, 0.6, 5]) cases.push(['sway', { bottom, top }, 0.01, 0.02, 1.5e3, 4e3]);
  cases.push(['sway', { bottom: 3, top: 1, lateral: 5 }, -0.01, 0.02, -2e3, 6e3]);
  cases.push(['sway', { bottom: 0.5, top: 0, lateral: 2 }, 0, 0, 2e3, -3e3]);
  it.each(cases)('%s %o, e = %d / %d, w = %d N/m, H = %d N', (frame, r, eB, eT, line, top) => {
    const { Pcr } = criticalLoad(EI, L, frame, r);
    const P = 0.6 * Pcr;
    const e0 = L / 1000;
    const exact = beamColumnResponse(EI, L, frame, r, e0, eB, eT, P, { line, top });
    const w0 = scaled(feFirstMode(frame, r, 128), exact.bowSide * e0);
    const fe = feSecondOrder(EI, L, frame, r, P, w0, { bottom: P * eB, top: -P * eT }, { line, top });
    const scale = exact.memberMax;
    for (const end of ['bottom', 'top'] as const) {
      expect(Math.abs(fe.springMoment[end] - exact.springMoment[end]) / scale).toBeLessThan(1e-4);
      expect(Math.abs(fe.rotation[end] - exact.rotation[end]) / ((scale * L) / EI)).toBeLessThan(1e-4);
    }
    expect(rel(fe.memberMax, exact.memberMax)).toBeLessThan(1e-4);
  });
});
