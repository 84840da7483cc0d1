import { describe, expect, it } from 'vitest';
import {
  beamJointBoundaries, classifyJoint, columnBaseBoundaries, pinnedRelativeSlenderness, rigidBaseFactor, rigidBeamFactor,
} from '../../src/mechanics/jointClassification.js';

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);
const EIb = 210e9 * 83.56e-6; // beam E·I_b (N·m²), any value serves: the limits are multiples of E I_b / L_b
const Lb = 6;
const EIc = 210e9 * 15.4e-6;
const Lc = 5.6;

describe('joint classification by stiffness, EN 1993-1-8:2005 §5.2.2.5', () => {
  // source: EN 1993-1-8:2005 §5.2.2.5(1): rigid if S_j,ini ≥ k_b E I_b / L_b, k_b = 8 (bracing reduces the
  // horizontal displacement by ≥ 80 %), 25 otherwise provided K_b/K_c ≥ 0.1 (from memory)
  it('beam-to-column joint, rigid limit', () => {
    expect(rigidBeamFactor('braced')).toBe(8);
    expect(rigidBeamFactor('sway')).toBe(25);
    expect(rel(beamJointBoundaries('braced', EIb, Lb, EIc, Lc).rigidFrom, (8 * EIb) / Lb)).toBeLessThan(1e-15);
    expect(rel(beamJointBoundaries('sway', EIb, Lb, EIc, Lc).rigidFrom, (25 * EIb) / Lb)).toBeLessThan(1e-15);
    // a beam with K_b/K_c < 0.1 in a sway frame cannot make the joint rigid (the clause then says semi-rigid)
    const soft = beamJointBoundaries('sway', 0.05 * (EIc / Lc) * Lb, Lb, EIc, Lc);
    expect(soft.rigidFrom).toBe(Infinity);
    expect(classifyJoint(1e12, soft)).toBe('semi-rigid');
    expect(beamJointBoundaries('braced', 0.05 * (EIc / Lc) * Lb, Lb, EIc, Lc).rigidFrom).toBeLessThan(Infinity);
  });

  // source: EN 1993-1-8:2005 §5.2.2.5(2): nominally pinned if S_j,ini ≤ 0.5 E I_b / L_b (from memory)
  it('beam-to-column joint, nominally pinned limit and the three zones', () => {
    const b = beamJointBoundaries('braced', EIb, Lb, EIc, Lc);
    const unit = EIb / Lb;
    expect(rel(b.pinnedUpTo, 0.5 * unit)).toBeLessThan(1e-15);
    expect(classifyJoint(0.5 * unit, b)).toBe('nominally pinned');
    expect(classifyJoint(0.51 * unit, b)).toBe('semi-rigid');
    expect(classifyJoint(7.99 * unit, b)).toBe('semi-rigid');
    expect(classifyJoint(8 * unit, b)).toBe('rigid');
    expect(classifyJoint(Infinity, b)).toBe('rigid');
    expect(classifyJoint(0, b)).toBe('nominally pinned');
  });

  // source: EN 1993-1-8:2005 §5.2.2.5(4) (from memory): braced: λ̄0 ≤ 0.5 rigid; 0.5 < λ̄0 < 3.93 needs
  // S_j,ini ≥ 7(2λ̄0 − 1) E I_c/L_c; λ̄0 ≥ 3.93 needs 48 E I_c/L_c; otherwise (sway) 30 E I_c/L_c
  it('column bases', () => {
    expect(rigidBaseFactor('braced', 0.5)).toBe(0);
    expect(rigidBaseFactor('braced', 1)).toBeCloseTo(7, 14);
    expect(rigidBaseFactor('braced', 2)).toBeCloseTo(21, 14);
    expect(rigidBaseFactor('braced', 3.93)).toBe(48);
    expect(rigidBaseFactor('braced', 6)).toBe(48);
    expect(rigidBaseFactor('sway', 0.2)).toBe(30);
    expect(rigidBaseFactor('sway', 5)).toBe(30);
    const b = columnBaseBoundaries('braced', 1.434, EIc, Lc);
    expect(rel(b.rigidFrom, (7 * (2 * 1.434 - 1) * EIc) / Lc)).toBeLessThan(1e-14);
    expect(b.pinnedUpTo).toBe(0); // the clause gives no pinned limit for bases
    expect(classifyJoint(0.99 * b.rigidFrom, b)).toBe('semi-rigid');
    expect(classifyJoint(b.rigidFrom, b)).toBe('rigid');
    expect(classifyJoint(0, columnBaseBoundaries('braced', 0.4, EIc, Lc))).toBe('rigid');
  });

  // common practice: the two braced base rules meet at λ̄0 = 3.93, where 7(2·3.93 − 1) = 48.02 ≈ 48 (the clause's rounding)
  it('the braced base rule is continuous to the clause rounding at λ̄0 = 3.93', () => {
    expect(Math.abs(7 * (2 * 3.93 - 1) - rigidBaseFactor('braced', 3.93))).toBeLessThan(0.05);
    expect(Math.abs(rigidBaseFactor('braced', 3.9299999) - rigidBaseFactor('braced', 3.93))).toBeLessThan(0.05);
  });

  // source: EN 1993-1-1:2005 §6.3.1.2 λ̄ = √(A fy / Ncr), with Ncr = π² E I / L² of the pinned-pinned column
  it('relative slenderness of the pinned column', () => {
    const A = 6640e-6, fy = 300e6, EI = 200e9 * 15.4e-6, L = 5.6;
    const Ncr = (Math.PI ** 2 * EI) / (L * L);
    expect(rel(pinnedRelativeSlenderness(A, fy, EI, L), Math.sqrt((A * fy) / Ncr))).toBeLessThan(1e-14);
    expect(() => rigidBaseFactor('braced', NaN)).toThrow(RangeError);
    expect(() => classifyJoint(-1, columnBaseBoundaries('sway', 1, EI, L))).toThrow(RangeError);
  });
});
