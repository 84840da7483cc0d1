import { describe, expect, it } from 'vitest';
import { criticalPhi } from '../../src/mechanics/criticalLoad.js';
import { modeCurvatureFactor, modeShape } from '../../src/mechanics/modeShape.js';
import type { EndRestraint, Frame, ModeShape } from '../../src/mechanics/types.js';

const rel = (a: number, b: number): number => (a === b ? 0 : Math.abs(a - b) / Math.abs(b));
const shape = (frame: Frame, r: EndRestraint, mode = 1): ModeShape => modeShape(frame, r, criticalPhi(frame, r, mode));

/** derivative of the normalised shape from its coefficients */
const slope = (m: ModeShape, xi: number): number => m.phi * (m.A * Math.cos(m.phi * xi) - m.B * Math.sin(m.phi * xi)) + m.C;

/** brute-force zeros of w'' by sign changes on a fine grid (independent of the closed form) */
function scanZeros(m: ModeShape): number[] {
  const out: number[] = [];
  const n = 20000;
  let prev = m.curvature(0);
  for (let i = 1; i <= n; i++) {
    const x = i / n;
    const v = m.curvature(x);
    if ((prev < 0 && v > 0) || (prev > 0 && v < 0)) out.push(x - 0.5 / n);
    prev = v;
  }
  return out;
}

describe('boundary conditions and normalisation', () => {
  // common practice: the mode satisfies its own boundary conditions, and max|w| = 1 with the peak positive
  const cases: [Frame, EndRestraint][] = [
    ['braced', { bottom: 2, top: 0.5 }], ['braced', { bottom: Infinity, top: 7 }], ['sway', { bottom: 3, top: 0.2 }],
    ['sway', { bottom: Infinity, top: 0 }], ['sway', { bottom: 1.5, top: 4, lateral: 6 }], ['braced', { bottom: 0, top: 0 }],
    ['sway', { bottom: 2, top: 2, lateral: 50 }], ['sway', { bottom: 0, top: 0, lateral: 3 }], ['sway', { bottom: 0.01, top: 0 }],
  ];
  it.each(cases)('%s %j', (frame, r) => {
    const m = shape(frame, r);
    expect(Math.abs(m.sample(0))).toBeLessThan(1e-12);
    if (frame === 'braced') expect(Math.abs(m.sample(1))).toBeLessThan(1e-12);
    const cur0 = m.curvature(0), cur1 = m.curvature(1);
    if (r.bottom === Infinity) expect(Math.abs(slope(m, 0))).toBeLessThan(1e-12);
    else expect(Math.abs(cur0 - r.bottom * slope(m, 0))).toBeLessThan(1e-9 * (1 + Math.abs(cur0)));
    if (r.top === Infinity) expect(Math.abs(slope(m, 1))).toBeLessThan(1e-12);
    else expect(Math.abs(cur1 + r.top * slope(m, 1))).toBeLessThan(1e-9 * (1 + Math.abs(cur1)));
    if (frame === 'sway') expect(Math.abs(m.phi * m.phi * m.C - (r.lateral ?? 0) * m.sample(1))).toBeLessThan(1e-9);
    let maxAbs = 0, maxCurv = 0;
    for (let i = 0; i <= 10000; i++) {
      maxAbs = Math.max(maxAbs, Math.abs(m.sample(i / 10000)));
      maxCurv = Math.max(maxCurv, Math.abs(m.curvature(i / 10000)));
    }
    expect(maxAbs).toBeLessThanOrEqual(1 + 1e-12);
    expect(maxAbs).toBeGreaterThan(1 - 1e-6);
    expect(rel(m.sample(m.maxDeflectionAt), 1)).toBeLessThan(1e-12);
    expect(maxCurv).toBeLessThanOrEqual(m.maxCurvature * (1 + 1e-12));
    expect(rel(maxCurv, m.maxCurvature)).toBeLessThan(1e-6);
    expect(rel(m.curvatureFactor, m.maxCurvature / (m.phi * m.phi))).toBeLessThan(1e-12);
    expect(scanZeros(m).length).toBe(m.inflectionPoints.length);
    scanZeros(m).forEach((z, i) => expect(Math.abs(z - m.inflectionPoints[i])).toBeLessThan(1e-4));
  });
});

describe('curvature factor c', () => {
  // source: Timoshenko & Gere 1961 ch. 1, beam-columns with initial curvature (from memory) and Chen & Lui 1987 §2.6 for the
  // amplification; c = EI max|φ''|/(Pcr max|φ|) table verified in docs/verification.md §M4 [V]
  const TABLE: [number, number, number, number, number | null, number | null, number][] = [
    [0, 1.0, 1.0, 0.732644, null, null, 1.0],
    [0.5, 0.873968, 0.934795, 0.686928, 0.5, 1, 0.791965],
    [1, 0.791965, 0.890233, 0.652879, 0.5, 1, 0.693423],
    [2, 0.693423, 0.835202, 0.606676, 0.5, 1, 0.603144],
    [5, 0.579985, 0.772383, 0.545715, 0.5, 1, 0.530981],
    [10, 0.530981, 0.747102, 0.517382, 0.5, 1, 0.509845],
    [20, 0.509845, 0.737035, 0.505316, 0.5, 1, 0.502769],
    [50, 0.501812, 0.73343, 0.50094, 0.5, 1, 0.500473],
    [Infinity, 0.5, 0.732644, 0.5, 0.5, 1, 0.5],
  ];
  it('matches the c table (all rows, 1e-6 absolute)', () => {
    for (const [R, bs, bp, bf, ss, sp, sf] of TABLE) {
      expect(Math.abs(modeCurvatureFactor('braced', { bottom: R, top: R }) - bs)).toBeLessThan(1e-6);
      expect(Math.abs(modeCurvatureFactor('braced', { bottom: R, top: 0 }) - bp)).toBeLessThan(1e-6);
      expect(Math.abs(modeCurvatureFactor('braced', { bottom: Infinity, top: R }) - bf)).toBeLessThan(1e-6);
      if (ss !== null) expect(Math.abs(modeCurvatureFactor('sway', { bottom: R, top: R }) - ss)).toBeLessThan(1e-9);
      if (sp !== null) expect(Math.abs(modeCurvatureFactor('sway', { bottom: R, top: 0 }) - sp)).toBeLessThan(1e-9);
      expect(Math.abs(modeCurvatureFactor('sway', { bottom: Infinity, top: R }) - sf)).toBeLessThan(1e-6);
    }
  });
  // source: docs/verification.md §M4 [V]: braced symmetric springs c = 1/(1 − cos(φ/2)); fixed–pinned c = √(1+u²)/(2π)
  it('closed forms', () => {
    for (const R of [0.2, 3, 80]) {
      const p = criticalPhi('braced', { bottom: R, top: R });
      expect(rel(modeCurvatureFactor('braced', { bottom: R, top: R }), 1 / (1 - Math.cos(p / 2)))).toBeLessThan(1e-10);
    }
    const u = 4.4934094579;
    expect(rel(modeCurvatureFactor('braced', { bottom: Infinity, top: 0 }), Math.sqrt(1 + u * u) / (2 * Math.PI))).toBeLessThan(1e-9);
  });
  // common practice: c is 0 for the rigid tilt of a mechanism (no curvature)
  it('mechanism', () => {
    const m = modeShape('sway', { bottom: 0, top: 0 }, criticalPhi('sway', { bottom: 0, top: 0 }));
    expect(m.curvatureFactor).toBe(0);
    expect(m.sample(1)).toBe(1);
    expect(m.effectiveLength).toBe(Infinity);
  });
});

describe('inflection points and effective length', () => {
  // source: Timoshenko & Gere 1961 ch. 2 (from memory): fixed–fixed inflections at L/4 and 3L/4, effective length L/2
  it('fixed–fixed', () => {
    const m = shape('braced', { bottom: Infinity, top: Infinity });
    expect(m.inflectionPoints.length).toBe(2);
    expect(Math.abs(m.inflectionPoints[0] - 0.25)).toBeLessThan(1e-12);
    expect(Math.abs(m.inflectionPoints[1] - 0.75)).toBeLessThan(1e-12);
    expect(Math.abs(m.effectiveLength - 0.5)).toBeLessThan(1e-12);
    expect(m.effectiveLengthFromInflections).toBe(true);
  });
  // source: Timoshenko & Gere 1961 ch. 2 (from memory): fixed–pinned effective length 0.699 L between the inflection and the pin;
  // max deflection at 2 atan(u)/u = 0.601689 and max moment at (π − atan(1/u))/u = 0.650422 (docs/verification.md §M4 [V])
  it('fixed–pinned', () => {
    const m = shape('braced', { bottom: Infinity, top: 0 });
    expect(m.inflectionPoints.length).toBe(1);
    expect(Math.abs(m.inflectionPoints[0] - (1 - 0.69915566))).toBeLessThan(1e-8);
    expect(m.curvatureZeros.length).toBe(2);
    expect(m.curvatureZeros[1]).toBe(1);
    expect(Math.abs(m.effectiveLength - 0.69915566)).toBeLessThan(1e-8);
    expect(Math.abs(m.maxDeflectionAt - 0.601689)).toBeLessThan(1e-6);
    expect(Math.abs(m.maxCurvatureAt - 0.650422)).toBeLessThan(1e-6);
  });
  // source: Timoshenko & Gere 1961 ch. 2 (from memory): pinned–pinned K = 1 (zeros of curvature at both pins)
  it('pinned–pinned', () => {
    const m = shape('braced', { bottom: 0, top: 0 });
    expect(m.inflectionPoints).toEqual([]);
    expect(m.curvatureZeros).toEqual([0, 1]);
    expect(Math.abs(m.effectiveLength - 1)).toBeLessThan(1e-12);
    expect(Math.abs(m.maxDeflectionAt - 0.5)).toBeLessThan(1e-12);
  });
  // source: Timoshenko & Gere 1961 ch. 2 (from memory): flagpole K = 2 (one curvature zero at the free top; the ideal meaning is the mirrored column)
  it('flagpole and fixed–guided', () => {
    const f = shape('sway', { bottom: Infinity, top: 0 });
    expect(f.inflectionPoints).toEqual([]);
    expect(f.effectiveLengthFromInflections).toBe(false);
    expect(Math.abs(f.effectiveLength - 2)).toBeLessThan(1e-12);
    expect(Math.abs(f.maxDeflectionAt - 1)).toBeLessThan(1e-12);
    const g = shape('sway', { bottom: Infinity, top: Infinity });
    expect(g.inflectionPoints.length).toBe(1);
    expect(Math.abs(g.inflectionPoints[0] - 0.5)).toBeLessThan(1e-12);
    expect(Math.abs(g.effectiveLength - 1)).toBeLessThan(1e-12);
  });
  // common practice: zeros of a sinusoidal w'' are spaced π/φ, so the effective length equals K wherever two zeros exist
  it('effective length equals K for restrained cases', () => {
    for (const r of [{ bottom: 4, top: 4 }, { bottom: 40, top: 1 }]) {
      const m = shape('braced', r);
      expect(m.effectiveLengthFromInflections).toBe(true);
      expect(rel(m.effectiveLength, Math.PI / m.phi)).toBeLessThan(1e-12);
    }
    // sway, equal springs: antisymmetric mode with a single inflection at mid-height; K from the continued sinusoid
    const s = shape('sway', { bottom: 30, top: 30 });
    expect(s.inflectionPoints.length).toBe(1);
    expect(Math.abs(s.inflectionPoints[0] - 0.5)).toBeLessThan(1e-12);
    expect(s.effectiveLengthFromInflections).toBe(false);
    expect(rel(s.effectiveLength, Math.PI / s.phi)).toBeLessThan(1e-12);
  });
  // source: docs/verification.md §M1 [V]: fixed–fixed mode 2 is antisymmetric, mode 3 symmetric
  it('higher-mode symmetry', () => {
    const m2 = shape('braced', { bottom: Infinity, top: Infinity }, 2);
    const m3 = shape('braced', { bottom: Infinity, top: Infinity }, 3);
    for (const x of [0.1, 0.3, 0.45]) {
      expect(Math.abs(m2.sample(x) + m2.sample(1 - x))).toBeLessThan(1e-10);
      expect(Math.abs(m3.sample(x) - m3.sample(1 - x))).toBeLessThan(1e-10);
    }
  });
});
