import { describe, expect, it } from 'vitest';
import { criticalPhi } from '../../src/mechanics/criticalLoad.js';
import { columnCapacity } from '../../src/mechanics/columnCapacity.js';
import { steppedCriticalPhi, steppedMode } from '../../src/mechanics/steppedColumn.js';
import { feEigenvaluesExtrapolated } from '../../src/fe/feCriticalLoads.js';
import { CLOSED_FORM_STRENGTH_MODELS, type ColumnState, type EndRestraint, type Frame } from '../../src/mechanics/types.js';

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);

const ENDS: [Frame, EndRestraint][] = [
  ['braced', { bottom: 0, top: 0 }],
  ['braced', { bottom: 2, top: 0.3 }],
  ['braced', { bottom: Infinity, top: 5 }],
  ['braced', { bottom: Infinity, top: Infinity }],
  ['sway', { bottom: Infinity, top: 0 }],
  ['sway', { bottom: 3, top: 10 }],
  ['sway', { bottom: 0.5, top: 0, lateral: 4 }],
  ['sway', { bottom: Infinity, top: 2, lateral: 300 }],
];

describe('stepped column: the limits are the prismatic solver', () => {
  it('a zone of no length, of the whole length, or of equal stiffness gives the prismatic root exactly', () => {
    for (const [frame, r] of ENDS) {
      const rho = 1.7;
      const upper: EndRestraint = { bottom: r.bottom / rho, top: r.top / rho, ...(r.lateral !== undefined ? { lateral: r.lateral / rho } : {}) };
      expect(steppedCriticalPhi(frame, r, { ratio: rho, zone: 1 })).toBe(criticalPhi(frame, r));
      expect(steppedCriticalPhi(frame, r, { ratio: rho, zone: 0 })).toBe(Math.sqrt(rho) * criticalPhi(frame, upper));
      expect(steppedCriticalPhi(frame, r, { ratio: 1, zone: 0.3 })).toBe(criticalPhi(frame, r));
    }
  });

  it('tends to the prismatic root as the zone shrinks to nothing or fills the column, and as I₁ → I₂', () => {
    for (const [frame, r] of ENDS) {
      const rho = 2.5;
      const upper: EndRestraint = { bottom: r.bottom / rho, top: r.top / rho, ...(r.lateral !== undefined ? { lateral: r.lateral / rho } : {}) };
      expect(rel(steppedCriticalPhi(frame, r, { ratio: rho, zone: 1 - 1e-9 }), criticalPhi(frame, r))).toBeLessThan(1e-7);
      expect(rel(steppedCriticalPhi(frame, r, { ratio: rho, zone: 1e-9 }), Math.sqrt(rho) * criticalPhi(frame, upper))).toBeLessThan(1e-7);
      for (const zone of [0.05, 0.4, 0.9]) {
        expect(rel(steppedCriticalPhi(frame, r, { ratio: 1 + 1e-9, zone }), criticalPhi(frame, r))).toBeLessThan(1e-8);
      }
    }
  });

  it('a sway column pinned at both ends with no lateral spring stays a mechanism', () => {
    expect(steppedCriticalPhi('sway', { bottom: 0, top: 0 }, { ratio: 2, zone: 0.3 })).toBe(0);
  });
});

describe('stepped column against an independent finite-element model with segment-wise EI', () => {
  // Hermite-cubic elements with the consistent geometric stiffness (fe/), Richardson-extrapolated from
  // 20 and 40 elements; the step falls on an element boundary of both meshes.
  it('agrees within 1e-4 over a grid of stiffness ratios, zone lengths and end springs', () => {
    let worst = 0;
    for (const [frame, r] of ENDS) {
      for (const rho of [1.3, 4]) {
        for (const zone of [0.1, 0.25, 0.5, 0.75]) {
          const phi = steppedCriticalPhi(frame, r, { ratio: rho, zone });
          const fe = feEigenvaluesExtrapolated(frame, r, 20, 1, (xi) => (xi < zone ? 1 : rho))[0]!;
          worst = Math.max(worst, rel(phi * phi, fe));
        }
      }
    }
    expect(worst).toBeLessThan(1e-4);
  });

  it('lies between the two prismatic columns and rises as the weak zone shortens', () => {
    for (const [frame, r] of ENDS) {
      const rho = 1.6;
      let previous = criticalPhi(frame, r);
      for (const zone of [0.9, 0.6, 0.3, 0.1, 0.02]) {
        const phi = steppedCriticalPhi(frame, r, { ratio: rho, zone });
        expect(phi).toBeGreaterThanOrEqual(previous * (1 - 1e-12));
        previous = phi;
      }
      expect(previous).toBeLessThanOrEqual(steppedCriticalPhi(frame, r, { ratio: rho, zone: 0 }) * (1 + 1e-12));
    }
  });
});

describe('stepped cantilever against its closed form', () => {
  // Timoshenko & Gere, Theory of Elastic Stability, 2nd ed. 1961, §2.9 (from memory): a fixed-base,
  // free-top column whose lower part has k₁ = √(P/EI₁) over l₁ and upper part k₂ = √(P/EI₂) over l₂
  // buckles where tan(k₁l₁)·tan(k₂l₂) = k₂/k₁.
  it('satisfies tan(k₁l₁)·tan(k₂l₂) = k₂/k₁ at its root', () => {
    for (const rho of [0.5, 2, 6]) {
      for (const zone of [0.2, 0.5, 0.8]) {
        const phi = steppedCriticalPhi('sway', { bottom: Infinity, top: 0 }, { ratio: rho, zone });
        const k1 = phi;
        const k2 = phi / Math.sqrt(rho);
        expect(Math.abs(Math.tan(k1 * zone) * Math.tan(k2 * (1 - zone)) - k2 / k1)).toBeLessThan(1e-9);
      }
    }
  });
});

describe('the first mode of the stepped column', () => {
  it('pinned at both ends, braced: the moment is −P·w at every height (statics; common practice)', () => {
    const r = { bottom: 0, top: 0 };
    const m = { ratio: 2.2, zone: 0.35 };
    const mode = steppedMode('braced', r, m, steppedCriticalPhi('braced', r, m));
    for (let i = 0; i <= 20; i++) {
      const xi = i / 20;
      expect(Math.abs(mode.moment(xi) + mode.sample(xi))).toBeLessThan(1e-9);
    }
    // the largest |w| is +1 and lies below mid-height: the weaker zone curves more
    let best = 0;
    let at = 0;
    for (let i = 0; i <= 1000; i++) {
      const w = mode.sample(i / 1000);
      if (w > best) { best = w; at = i / 1000; }
    }
    expect(best).toBeLessThanOrEqual(1 + 1e-12);
    expect(best).toBeGreaterThan(1 - 1e-5);
    expect(at).toBeLessThan(0.5);
    expect(mode.upperFactor).toBeCloseTo(1, 9); // |M|max = P·max|w| there
    expect(mode.zoneFactor).toBeLessThan(1);
  });

  it('a stepped cantilever: the base moment is P times the top drift, the largest moment (statics; common practice)', () => {
    const r = { bottom: Infinity, top: 0 };
    for (const m of [{ ratio: 1.8, zone: 0.2 }, { ratio: 3, zone: 0.6 }]) {
      const mode = steppedMode('sway', r, m, steppedCriticalPhi('sway', r, m));
      expect(mode.sample(1)).toBeCloseTo(1, 12); // the free top moves most
      expect(Math.abs(mode.moment(0))).toBeCloseTo(1, 9);
      expect(mode.zoneFactor).toBeCloseTo(1, 9);
      expect(mode.upperFactor).toBeLessThan(1);
    }
  });

  it('with equal stiffness gives the prismatic curvature factor', () => {
    for (const [frame, r] of ENDS.filter(([f, e]) => !(f === 'sway' && e.bottom === 0 && e.top === 0))) {
      const m = { ratio: 1 + 1e-12, zone: 0.4 };
      const mode = steppedMode(frame, r, m, steppedCriticalPhi(frame, r, m));
      const prismatic = columnCapacity('first-yield', state(frame, r)).c;
      expect(rel(Math.max(mode.zoneFactor, mode.upperFactor), prismatic)).toBeLessThan(1e-6);
    }
  });
});

function state(frame: Frame, r: EndRestraint, zone?: { I: number; height: number }): ColumnState {
  // an HE 200 A-like section (from memory: A ≈ 5383 mm², I_z ≈ 13.4e6 mm⁴) with a reduced zone
  const sound = { A: 5.383e-3, I: 13.36e-6, S: 133.6e-6 };
  const reduced = { A: 4.54e-3, I: 11.0e-6, S: 110e-6 };
  const base = { E: 205e9, fy: 290e6, L: 5.2, bow: 5.2 / 1000, frame, r };
  if (zone === undefined) return { ...base, ...sound };
  return { ...base, ...reduced, ...(zone.height > 0 ? { sound: { from: zone.height, ...sound } } : {}) };
}

describe('capacity with a corroded zone', () => {
  // The bow follows the stepped mode, whose shape changes with the zone; with the equivalent bow plus a
  // measured bow the two shapes of imperfection are scaled differently, and the capacity may rise by
  // ~1e-4 as the zone grows (seen at R = 2 at both ends). Every other model falls strictly.
  it('lies between the whole-length loss and no loss, and falls as the zone grows, for every strength model', () => {
    const cases: [Frame, EndRestraint][] = [['braced', { bottom: 0.35, top: 0 }], ['braced', { bottom: 2, top: 2 }], ['sway', { bottom: 20, top: 1 }]];
    for (const model of CLOSED_FORM_STRENGTH_MODELS) {
      for (const [frame, r] of cases) {
        const none = columnCapacity(model, state(frame, r)).capacity;
        const whole = columnCapacity(model, { ...state(frame, r, { I: 0, height: 0 }) }).capacity;
        const slack = model.endsWith('-plus-bow') ? 1e-3 : 1e-12;
        let previous = none;
        for (const height of [0.1, 0.4, 1.5, 3, 5]) {
          const cap = columnCapacity(model, state(frame, r, { I: 0, height })).capacity;
          expect(cap).toBeLessThanOrEqual(previous * (1 + slack));
          expect(cap).toBeGreaterThanOrEqual(whole * (1 - 1e-12));
          previous = cap;
        }
        expect(whole).toBeLessThan(none);
      }
    }
  });

  it('a zone whose section equals the sound one gives the prismatic capacity, for every strength model', () => {
    for (const model of CLOSED_FORM_STRENGTH_MODELS) {
      for (const [frame, r] of ENDS.filter(([f, e]) => !(f === 'sway' && e.bottom === 0 && e.top === 0))) {
        const plain = state(frame, r);
        const stepped: ColumnState = { ...plain, sound: { from: 1.3, A: plain.A, I: plain.I, S: plain.S } };
        expect(rel(columnCapacity(model, stepped).capacity, columnCapacity(model, plain).capacity)).toBeLessThan(1e-9);
      }
    }
  });

  it('a zone raises the critical load above the whole-length reduction', () => {
    const r = { bottom: 0.35, top: 0 };
    const whole = columnCapacity('en1993-c', state('braced', r, { I: 0, height: 0 }));
    const zone = columnCapacity('en1993-c', state('braced', r, { I: 0, height: 0.4 }));
    expect(zone.Pcr).toBeGreaterThan(whole.Pcr);
    expect(zone.capacity).toBeGreaterThan(whole.capacity);
  });

  it('under an eccentric load the interaction checks keep the whole-length reduction (first-yield: steppedBeamColumn.test.ts)', () => {
    const r = { bottom: 2, top: 0.3 };
    const ecc = { eccentricity: { bottom: 0, top: 0.1 } };
    for (const model of ['en1993-c', 'aisc360-e3'] as const) {
      const whole = columnCapacity(model, { ...state('braced', r, { I: 0, height: 0 }), ...ecc });
      const zone = columnCapacity(model, { ...state('braced', r, { I: 0, height: 0.4 }), ...ecc });
      expect(zone.capacity).toBe(whole.capacity);
    }
  });
});
