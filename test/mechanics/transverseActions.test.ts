import { describe, expect, it } from 'vitest';
import { feFirstMode, feSecondOrder, type FeNodalShape } from '../../src/fe/feSecondOrder.js';
import { beamColumnResponse } from '../../src/mechanics/beamColumn.js';
import { columnCapacity } from '../../src/mechanics/columnCapacity.js';
import { criticalLoad } from '../../src/mechanics/criticalLoad.js';
import { firstOrderSwayMoment } from '../../src/mechanics/firstOrderSway.js';
import { enEquivalentMomentFactor, enEquivalentMomentFactorUniformLoad, enFirstOrderDiagram } from '../../src/mechanics/en1993Interaction.js';
import type { ColumnState, EndRestraint, Frame } from '../../src/mechanics/types.js';

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

// source: the finite-element model with the tilted initial shape w0 = φ x itself (no force at the top), Przemieniecki,
// Theory of Matrix Structural Analysis, 1968 (from memory): confirms that the out-of-plumb is exactly the top force P·φ
// of EN 1993-1-1 §5.3.2(7) in the linear elastic member
describe('out-of-plumb: the tilted geometry in finite elements equals the top force P·φ', () => {
  it.each([
    [{ bottom: Infinity, top: 0, lateral: 0 }],
    [{ bottom: 4, top: 1.5, lateral: 0 }],
    [{ bottom: 2, top: 0, lateral: 3 }],
  ] as [EndRestraint][])('sway %o', (r) => {
    const phi = 1 / 300;
    const P = 0.5 * criticalLoad(EI, L, 'sway', r).Pcr;
    const n = 128;
    const tilt: FeNodalShape = { w: Float64Array.from({ length: n + 1 }, (_, i) => (phi * L * i) / n), slope: new Float64Array(n + 1).fill(phi * L) };
    const fe = feSecondOrder(EI, L, 'sway', r, P, tilt);
    const exact = beamColumnResponse(EI, L, 'sway', r, 0, 0, 0, P, { line: 0, top: P * phi });
    for (const end of ['bottom', 'top'] as const) {
      expect(Math.abs(fe.springMoment[end] - exact.springMoment[end]) / exact.memberMax).toBeLessThan(1e-4);
    }
    expect(rel(fe.memberMax, exact.memberMax)).toBeLessThan(1e-4);
  });
});

// common practice (first-order statics of a cantilever and of a sway member fixed at both ends), and the P → 0 limit
// of the second-order closed form over a grid of springs
describe('first-order moments of the spring-restrained sway member', () => {
  it('flagpole: H·L and w L²/2 at the base; both ends fixed: H·L/2 at each end', () => {
    const flag = firstOrderSwayMoment({ bottom: Infinity, top: 0, lateral: 0 }, 0, 1);
    expect(flag.c0).toBeCloseTo(-1, 14);
    expect(flag.c0 + flag.c1 + flag.c2).toBeCloseTo(0, 14);
    const wind = firstOrderSwayMoment({ bottom: Infinity, top: 0, lateral: 0 }, 1, 0);
    expect(Math.abs(wind.c0)).toBeCloseTo(0.5, 14);
    const fixed = firstOrderSwayMoment({ bottom: Infinity, top: Infinity, lateral: 0 }, 0, 1);
    expect(Math.abs(fixed.c0)).toBeCloseTo(0.5, 14);
    expect(Math.abs(fixed.c0 + fixed.c1 + fixed.c2)).toBeCloseTo(0.5, 14);
  });
  it.each([
    [{ bottom: 0.5, top: 3, lateral: 0 }],
    [{ bottom: 6, top: 0, lateral: 2 }],
    [{ bottom: Infinity, top: 1, lateral: 5 }],
    [{ bottom: 0, top: 2, lateral: 4 }],
  ] as [EndRestraint][])('%o: the closed form at P → 0', (r) => {
    const P = 1e-5 * criticalLoad(EI, L, 'sway', r).Pcr;
    const w = 2e3, H = 5e3;
    const closed = beamColumnResponse(EI, L, 'sway', r, 0, 0, 0, P, { line: w, top: H });
    const m = firstOrderSwayMoment(r, (w / P) * L * L, (H / P) * L);
    for (const xi of [0, 0.3, 0.7, 1]) {
      expect(Math.abs(P * (m.c0 + m.c1 * xi + m.c2 * xi * xi) - closed.moment(xi * L)) / closed.memberMax).toBeLessThan(1e-3);
    }
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

/** Bisection on a function rising through 0 on [lo, hi]. */
function bisect(f: (x: number) => number, lo: number, hi: number): number {
  for (let i = 0; i < 200; i++) {
    const mid = 0.5 * (lo + hi);
    if (f(mid) < 0) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

const A = 4.5e-3;
const S = 0.27e-3;
const fy = 275e6;
const E = 200e9;
const I = EI / E;
function state(frame: Frame, r: EndRestraint, transverse: { line: number; top: number }, bow = 0): ColumnState {
  return { E, fy, A, I, S, L, bow, frame, r, transverse };
}

describe('strength under transverse actions growing with the axial load', () => {
  const pinned = { bottom: 0, top: 0 };
  const flagpole: EndRestraint = { bottom: Infinity, top: 0, lateral: 0 };
  const rho = 0.02; // w/P (1/m)
  const tau = 0.01; // H/P

  // first yield: P/A + M_max/S = fy with M_max = (w EI/P)(sec u − 1), w = ρP (Timoshenko & Gere 1961, ch. 1,
  // beam-column under a uniform lateral load; section number from memory), solved by bisection
  it('first-yield, pinned ends, uniform load: the secant-type closed form', () => {
    const Pcr = criticalLoad(EI, L, 'braced', pinned).Pcr;
    const f = (P: number) => P / A + (rho * EI * (1 / Math.cos((L / 2) * Math.sqrt(P / EI)) - 1)) / S - fy;
    const expected = bisect(f, 0, Pcr * (1 - 1e-12));
    const got = columnCapacity('first-yield', state('braced', pinned, { line: rho, top: 0 })).capacity;
    expect(rel(got, expected)).toBeLessThan(1e-9);
  });

  // first yield of a flagpole: P/A + τ P tan(kL)/(k S) = fy (Timoshenko & Gere 1961, ch. 1, cantilever with a lateral
  // end load; section number from memory), solved by bisection; an out-of-plumb φ adds φ to τ (EN 1993-1-1 §5.3.2(7))
  it('first-yield, flagpole with a top force: H tan(kL)/k', () => {
    const Pcr = criticalLoad(EI, L, 'sway', flagpole).Pcr;
    const f = (P: number) => P / A + (tau * P * Math.tan(L * Math.sqrt(P / EI))) / (Math.sqrt(P / EI) * S) - fy;
    const expected = bisect(f, 0, Pcr * (1 - 1e-12));
    const got = columnCapacity('first-yield', state('sway', flagpole, { line: 0, top: tau })).capacity;
    expect(rel(got, expected)).toBeLessThan(1e-9);
    // a braced column ignores the top force: the bracing takes it
    const braced = columnCapacity('first-yield', state('braced', pinned, { line: 0, top: tau }, L / 1000)).capacity;
    expect(braced).toBe(columnCapacity('first-yield', { ...state('braced', pinned, { line: 0, top: 0 }, L / 1000) }).capacity);
  });

  // AISC 360-16 §H1.1 Eqs. H1-1a/b and Eq. E3-2 (from memory), M_r the exact second-order moment (w EI/P)(sec u − 1)
  // (Timoshenko & Gere 1961, ch. 1), M_c = Fy S; the load solving H1-1 by bisection
  it('aisc360-e3, pinned ends, uniform load', () => {
    const Pcr = criticalLoad(EI, L, 'braced', pinned).Pcr;
    const Pc = Math.pow(0.658, (A * fy) / Pcr) * fy * A;
    const h1 = (P: number) => {
      const Mr = rho * EI * (1 / Math.cos((L / 2) * Math.sqrt(P / EI)) - 1);
      return (P / Pc >= 0.2 ? P / Pc + (8 / 9) * (Mr / (fy * S)) : P / (2 * Pc) + Mr / (fy * S)) - 1;
    };
    const got = columnCapacity('aisc360-e3', state('braced', pinned, { line: rho, top: 0 })).capacity;
    expect(rel(got, bisect(h1, 0, Pc))).toBeLessThan(1e-9);
  });

  // EN 1993-1-1:2005 Eq. (6.61), χ of Eq. (6.49), k_yy of Table B.1 class 3, C_my of Table B.3 (tables from memory):
  // pinned ends under a uniform load have M_y = w L²/8 and C_my = 0.95 (α_h = 0); the load solving Eq. (6.61) by bisection
  it('en1993-b, pinned ends, uniform load: Eq. (6.61) with C_my = 0.95', () => {
    const Pcr = criticalLoad(EI, L, 'braced', pinned).Pcr;
    const lb = Math.sqrt((A * fy) / Pcr);
    const Phi = 0.5 * (1 + 0.34 * (lb - 0.2) + lb * lb);
    const chi = Math.min(1, 1 / (Phi + Math.sqrt(Phi * Phi - lb * lb)));
    const eq661 = (P: number) => {
      const n = P / (chi * A * fy);
      return n + 0.95 * (1 + 0.6 * Math.min(lb, 1) * n) * ((rho * P * L * L) / 8 / (fy * S)) - 1;
    };
    const got = columnCapacity('en1993-b', state('braced', pinned, { line: rho, top: 0 })).capacity;
    expect(rel(got, bisect(eq661, 0, chi * A * fy))).toBeLessThan(1e-9);
  });

  // EN 1993-1-1:2005 §5.2.2(8) and Eq. (6.61) (from memory): first-order sway moments with χ from the sway critical
  // load, C_my = 0.9 for a sway mode (note to Table B.3); the flagpole's first-order base moment H·L (common practice)
  it('en1993-c, flagpole with a top force: M_y = H·L, C_my = 0.9', () => {
    const Pcr = criticalLoad(EI, L, 'sway', flagpole).Pcr;
    const lb = Math.sqrt((A * fy) / Pcr);
    const Phi = 0.5 * (1 + 0.49 * (lb - 0.2) + lb * lb);
    const chi = Math.min(1, 1 / (Phi + Math.sqrt(Phi * Phi - lb * lb)));
    const eq661 = (P: number) => {
      const n = P / (chi * A * fy);
      return n + 0.9 * (1 + 0.6 * Math.min(lb, 1) * n) * ((tau * P * L) / (fy * S)) - 1;
    };
    const got = columnCapacity('en1993-c', state('sway', flagpole, { line: 0, top: tau })).capacity;
    expect(rel(got, bisect(eq661, 0, chi * A * fy))).toBeLessThan(1e-9);
  });

  // EN 1993-1-1:2005 Annex B, Table B.3 (from memory): h = end moment, s = span moment
  it('C_my of Table B.3 for a moment diagram with a uniform load', () => {
    expect(enEquivalentMomentFactorUniformLoad(0, 0, 1, 'braced')).toBeCloseTo(0.95, 15); // simply supported
    // fixed-ended beam, first order: M_h = −wL²/12, M_s = +wL²/24 → α_s = −0.5, ψ = 1: 0.1 + 0.4 = 0.5
    expect(enEquivalentMomentFactorUniformLoad(-2, -2, 1, 'braced')).toBeCloseTo(0.5, 15);
    // α_s = 0.5, any ψ: 0.2 + 0.4 = 0.6
    expect(enEquivalentMomentFactorUniformLoad(2, -1, 1, 'braced')).toBeCloseTo(0.6, 15);
    // α_s = −0.5, ψ = −0.5: 0.1·1.5 + 0.4 = 0.55
    expect(enEquivalentMomentFactorUniformLoad(2, -1, -1, 'braced')).toBeCloseTo(0.55, 15);
    // α_h = 0.5: 0.975; α_h = −0.5 with ψ = −0.5: 0.95 + 0.05·(−0.5)·0 = 0.95
    expect(enEquivalentMomentFactorUniformLoad(1, 0, 2, 'braced')).toBeCloseTo(0.975, 15);
    expect(enEquivalentMomentFactorUniformLoad(-1, 0.5, 2, 'braced')).toBeCloseTo(0.95, 15);
    expect(enEquivalentMomentFactorUniformLoad(1, 1, 3, 'sway')).toBe(0.9);
    // no transverse load: the linear row 0.6 + 0.4ψ
    for (const [eB, eT] of [[0.05, 0.02], [0.03, -0.01], [-0.04, 0.04]]) {
      const d = enFirstOrderDiagram(eB, eT, 0, 'braced');
      expect(d.cmy).toBeCloseTo(enEquivalentMomentFactor(eB, eT, 'braced'), 14);
    }
    // common practice: the simply supported diagram, max = q/8 at mid-span
    expect(enFirstOrderDiagram(0, 0, 0.8, 'braced').maxMoment).toBeCloseTo(0.1, 15);
  });

  it('zero transverse actions give the eccentric capacity bit for bit', () => {
    for (const model of ['first-yield', 'aisc360-e3', 'en1993-c'] as const) {
      const withZero = { ...state('braced', { bottom: 2, top: 0.4 }, { line: 0, top: 0 }, L / 900), eccentricity: { bottom: 0.01, top: 0.03 } };
      const { transverse: _t, ...without } = withZero;
      expect(columnCapacity(model, withZero).capacity).toBe(columnCapacity(model, without).capacity);
    }
  });

  it('capacity falls as the line load grows (braced) and as the top force grows (sway)', () => {
    for (const model of ['first-yield', 'aisc360-e3', 'en1993-a'] as const) {
      const caps = [0, 0.005, 0.02, 0.08].map((line) => columnCapacity(model, state('braced', { bottom: 1, top: 3 }, { line, top: 0 }, L / 1000)).capacity);
      for (let i = 1; i < caps.length; i++) expect(caps[i]).toBeLessThan(caps[i - 1]!);
    }
    for (const model of ['first-yield', 'aisc360-e3'] as const) {
      const caps = [0, 0.002, 0.01, 0.04].map((top) => columnCapacity(model, state('sway', { bottom: 8, top: 2 }, { line: 0, top }, L / 1000)).capacity);
      for (let i = 1; i < caps.length; i++) expect(caps[i]).toBeLessThan(caps[i - 1]!);
    }
  });
});
