import { describe, expect, it } from 'vitest';
import { feFirstMode, feSecondOrder, type FeNodalShape } from '../../src/fe/feSecondOrder.js';
import { beamColumnResponse } from '../../src/mechanics/beamColumn.js';
import { columnCapacity } from '../../src/mechanics/columnCapacity.js';
import { criticalLoad } from '../../src/mechanics/criticalLoad.js';
import { eccentricFirstYieldCapacity, firstYieldMargin } from '../../src/mechanics/eccentricFirstYield.js';
import { endSpringMoments } from '../../src/mechanics/endSpringMoments.js';
import { en1993EquivalentBow } from '../../src/mechanics/equivalentBow.js';
import { modeShape } from '../../src/mechanics/modeShape.js';
import type { ColumnState, EndRestraint, Frame } from '../../src/mechanics/types.js';

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);
const E = 200e9;
const I = 15.4e-6;
const EI = E * I;
const L = 5.6;
const A = 4.5e-3;
const S = 0.27e-3;
const fy = 275e6;

function scaled(mode: FeNodalShape, s: number): FeNodalShape {
  return { w: mode.w.map((v) => v * s), slope: mode.slope.map((v) => v * s) };
}

describe('pinned-pinned beam-column: classic closed forms', () => {
  const P = 0.55 * criticalLoad(EI, L, 'braced', { bottom: 0, top: 0 }).Pcr;
  const kL = L * Math.sqrt(P / EI);
  const pinned = { bottom: 0, top: 0 };

  // Timoshenko & Gere, Theory of Elastic Stability, 2nd ed. 1961, §1.4 (section number from memory; docs/verification.md §M4b): equal end couples, M_max = M0 sec(kL/2) at mid-height
  it('equal eccentricities give the secant amplification sec(kL/2)', () => {
    const e = 0.04;
    const r = beamColumnResponse(EI, L, 'braced', pinned, 0, e, e, P);
    expect(rel(r.memberMax, (P * e) / Math.cos(kL / 2))).toBeLessThan(1e-12);
    expect(Math.abs(r.memberMaxAt - L / 2)).toBeLessThan(1e-9 * L);
    // common practice: a pinned end takes no moment; the member moment there is the applied couple
    expect(r.springMoment.bottom).toBe(0);
    expect(rel(r.moment(0), P * e)).toBeLessThan(1e-12);
    expect(rel(r.moment(L), P * e)).toBeLessThan(1e-12);
  });

  // Timoshenko & Gere 1961, §1.5 (from memory; docs/verification.md §M4b): unequal end couples M_A, M_B (single curvature both positive):
  // M_max = M_B √(1 − 2α cos kL + α²) / sin kL, α = M_A/M_B, when the peak lies inside the span
  it('unequal eccentricities: the interior maximum of the two-couple solution', () => {
    const eB = 0.025;
    const eT = 0.04;
    const r = beamColumnResponse(EI, L, 'braced', pinned, 0, eB, eT, P);
    const alpha = eB / eT;
    const expected = (P * eT * Math.sqrt(1 - 2 * alpha * Math.cos(kL) + alpha * alpha)) / Math.sin(kL);
    expect(r.memberMaxAt).toBeGreaterThan(0.05 * L);
    expect(r.memberMaxAt).toBeLessThan(0.95 * L);
    expect(rel(r.memberMax, expected)).toBeLessThan(1e-12);
  });

  // common practice: opposite couples of equal size (double curvature) on a short column are not amplified beyond the ends
  it('double curvature at low load: the end moment governs', () => {
    const low = 0.1 * P;
    const r = beamColumnResponse(EI, L, 'braced', pinned, 0, 0.03, -0.03, low);
    expect(rel(r.memberMax, low * 0.03)).toBeLessThan(1e-12);
  });
});

// source: linear second-order finite elements (K − P Kg) v = P Kg w0 + f with Hermite cubics and the consistent geometric
// stiffness, Przemieniecki, Theory of Matrix Structural Analysis, 1968 (from memory); shares no formula with the closed form
describe('closed form vs finite elements over a grid of spring stiffnesses', () => {
  const grid = [0, 0.5, 3, 20, Infinity];
  const cases: [Frame, EndRestraint, number, number][] = [];
  for (const bottom of grid) for (const top of grid) cases.push(['braced', { bottom, top }, 0.03, -0.012]);
  for (const bottom of [0.5, 6, Infinity]) for (const top of [0, 0.6, 5]) cases.push(['sway', { bottom, top }, 0.02, 0.05]);
  cases.push(['sway', { bottom: 3, top: 1, lateral: 5 }, -0.01, 0.04]);
  cases.push(['sway', { bottom: 0.5, top: 0, lateral: 2 }, 0.03, 0]);
  it.each(cases)('%s %o, e = %d / %d, with a bow', (frame, r, eB, eT) => {
    const { Pcr } = criticalLoad(EI, L, frame, r);
    const P = 0.6 * Pcr;
    const e0 = L / 1000;
    const exact = beamColumnResponse(EI, L, frame, r, e0, eB, eT, P);
    const w0 = scaled(feFirstMode(frame, r, 128), exact.bowSide * e0);
    const fe = feSecondOrder(EI, L, frame, r, P, w0, { bottom: P * eB, top: -P * eT });
    const scale = exact.memberMax;
    for (const end of ['bottom', 'top'] as const) {
      expect(Math.abs(fe.springMoment[end] - exact.springMoment[end]) / scale).toBeLessThan(1e-4);
      expect(Math.abs(fe.rotation[end] - exact.rotation[end]) / ((scale * L) / EI)).toBeLessThan(1e-4);
    }
    expect(rel(fe.memberMax, exact.memberMax)).toBeLessThan(1e-4);
  });
});

describe('no eccentricity: the bow alone, as before', () => {
  const cases: [Frame, EndRestraint][] = [
    ['braced', { bottom: 2, top: 0.5 }],
    ['braced', { bottom: Infinity, top: 0 }],
    ['sway', { bottom: 6, top: 0.6 }],
    ['sway', { bottom: 3, top: 1, lateral: 5 }],
  ];
  it.each(cases)('%s %o: same moments as the modal amplification and the same first-yield capacity', (frame, r) => {
    const { Pcr, phi } = criticalLoad(EI, L, frame, r);
    const e0 = L / 700;
    const P = 0.5 * Pcr;
    const mine = beamColumnResponse(EI, L, frame, r, e0, 0, 0, P);
    const modal = endSpringMoments(EI, L, frame, r, e0, P);
    expect(rel(mine.memberMax, modal.memberMax)).toBeLessThan(1e-9);
    for (const end of ['bottom', 'top'] as const) {
      expect(Math.abs(Math.abs(mine.springMoment[end]) - Math.abs(modal.springMoment[end])) / modal.memberMax).toBeLessThan(1e-9);
    }
    const state: ColumnState = { E, fy, A, I, S, L, bow: e0, frame, r };
    const concentric = columnCapacity('first-yield', state).capacity;
    const searched = eccentricFirstYieldCapacity({ A, S, fy, EI, L, frame, r, bow: e0, eB: 0, eT: 0, Pcr, mode: modeShape(frame, r, phi) });
    expect(rel(searched, concentric)).toBeLessThan(1e-9);
  });

  it('an explicit zero eccentricity gives the concentric capacity bit for bit', () => {
    const state: ColumnState = { E, fy, A, I, S, L, bow: L / 800, frame: 'braced', r: { bottom: 2, top: 1 } };
    const plain = columnCapacity('first-yield', state);
    const zero = columnCapacity('first-yield', { ...state, eccentricity: { bottom: 0, top: 0 } });
    expect(zero).toEqual(plain);
    expect(columnCapacity('en1993-b', { ...state, eccentricity: { bottom: 0, top: 0 } })).toEqual(columnCapacity('en1993-b', state));
  });
});

describe('first yield under combined actions', () => {
  // Timoshenko & Gere 1961, §1.4 (from memory; docs/verification.md §M4b) with first yield N/A + M_max/S = fy: the secant formula, solved here by bisection
  it('pinned ends, equal eccentricities, no bow: the secant-formula load', () => {
    const e = 0.05;
    const state: ColumnState = { E, fy, A, I, S, L, bow: 0, frame: 'braced', r: { bottom: 0, top: 0 }, eccentricity: { bottom: e, top: e } };
    const got = columnCapacity('first-yield', state).capacity;
    const secant = (P: number) => P / A + (P * e) / (S * Math.cos((L / 2) * Math.sqrt(P / EI))) - fy;
    let lo = 0;
    let hi = (Math.PI * Math.PI * EI) / (L * L) * 0.999999;
    for (let i = 0; i < 200; i++) {
      const mid = 0.5 * (lo + hi);
      if (secant(mid) < 0) lo = mid; else hi = mid;
    }
    expect(rel(got, lo)).toBeLessThan(1e-10);
  });

  it('the capacity is where the margin first reaches zero, and an eccentricity lowers it', () => {
    const frame: Frame = 'braced';
    const r = { bottom: 3, top: 0.8 };
    const { Pcr, phi } = criticalLoad(EI, L, frame, r);
    const col = { A, S, fy, EI, L, frame, r, bow: L / 1000, eB: -0.01, eT: 0.06, Pcr, mode: modeShape(frame, r, phi) };
    const cap = eccentricFirstYieldCapacity(col);
    const scratch = new Float64Array(32);
    expect(Math.abs(firstYieldMargin(col, cap, scratch)) / fy).toBeLessThan(1e-9);
    for (let k = 1; k < 50; k++) expect(firstYieldMargin(col, (cap * k) / 50, scratch)).toBeLessThan(0);
    expect(cap).toBeLessThan(eccentricFirstYieldCapacity({ ...col, eB: 0, eT: 0 }));
  });

  // source: EN 1993-1-1:2005 §5.2.2(3)a (second-order analysis with member imperfections, then the cross-section
  // check) with the equivalent bow of §5.3.2(11); pinned with equal end eccentricities the eccentric part peaks at
  // mid-height at P e sec(u), u = (π/2)√(P/Pcr) (the secant formula, Timoshenko & Gere 1961 ch. 1, from memory),
  // where the bow's P e0/(1 − P/Pcr) peaks too (c = 1 for pinned ends): P/A + P(e sec u + e0/(1 − P/Pcr))/S = fy
  it('the equivalent-bow models under end eccentricities: the secant formula with the §5.3.2(11) bow', () => {
    const pinned = { bottom: 0, top: 0 };
    const { Pcr } = criticalLoad(EI, L, 'braced', pinned);
    for (const [model, alpha, measured] of [['first-yield-en1993-b', 0.34, 0], ['first-yield-en1993-c-plus-bow', 0.49, L / 1000]] as const) {
      for (const e of [0.005, 0.02, 0.08]) {
        const state: ColumnState = { E, fy, A, I, S, L, bow: measured, frame: 'braced', r: pinned, eccentricity: { bottom: e, top: e } };
        const got = columnCapacity(model, state).capacity;
        const e0 = en1993EquivalentBow(alpha, A, S, fy, Pcr) + measured;
        const margin = (P: number) => P / A + (P * (e / Math.cos((Math.PI / 2) * Math.sqrt(P / Pcr)) + e0 / (1 - P / Pcr))) / S - fy;
        let lo = 0, hi = Pcr * (1 - 1e-9);
        for (let k = 0; k < 200; k++) { const mid = 0.5 * (lo + hi); if (margin(mid) < 0) lo = mid; else hi = mid; }
        expect(rel(got, lo)).toBeLessThan(1e-8);
        // below the concentric value of the same model, which it meets as e → 0
        expect(got).toBeLessThan(columnCapacity(model, { ...state, eccentricity: undefined }).capacity);
      }
      const tiny = columnCapacity(model, { E, fy, A, I, S, L, bow: measured, frame: 'braced', r: pinned, eccentricity: { bottom: 1e-12, top: 1e-12 } }).capacity;
      expect(rel(tiny, columnCapacity(model, { E, fy, A, I, S, L, bow: measured, frame: 'braced', r: pinned }).capacity)).toBeLessThan(1e-8);
    }
  });
});
