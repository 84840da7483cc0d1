import { describe, expect, it } from 'vitest';
import { criticalLoad } from '../../src/mechanics/criticalLoad.js';
import {
  fixityFactor, ratioFromAlignmentG, ratioFromFixity, restraintRatio, stiffnessFromRatio,
} from '../../src/mechanics/restraint.js';

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);

describe('restraint measures', () => {
  // source: docs/scenario-format.md: R = kL/(EI); fixity X = R/(R+3) (Monforton and Wu, 1963)
  it('converts k, R and fixity', () => {
    expect(restraintRatio(2.5e6, 4.2, 200e9 * 25.1e-6)).toBeCloseTo((2.5e6 * 4.2) / (200e9 * 25.1e-6), 12);
    expect(restraintRatio(Infinity, 4, 1e6)).toBe(Infinity);
    expect(stiffnessFromRatio(restraintRatio(3e6, 4, 5e6), 4, 5e6)).toBeCloseTo(3e6, 6);
    expect(fixityFactor(0)).toBe(0);
    expect(fixityFactor(Infinity)).toBe(1);
    expect(fixityFactor(3)).toBe(0.5);
    for (const R of [0, 1e-9, 0.4, 7, 1e5]) expect(rel(ratioFromFixity(fixityFactor(R)) + 1e-300, R + 1e-300)).toBeLessThan(1e-12);
    expect(ratioFromFixity(1)).toBe(Infinity);
    expect(() => ratioFromFixity(1.2)).toThrow();
    expect(() => fixityFactor(-1)).toThrow();
  });
});

describe('alignment-chart equivalence R = 2/G (braced), 6/G (sway)', () => {
  // source: AISC 360-16 Commentary App. 7, Eqs. C-A-7-1/C-A-7-2 and Figs. C-A-7.1/7.2 (from memory; Julian & Lawrence 1959);
  // sample solutions of the chart equations verified in docs/verification.md §M3 [V] (4 decimals)
  const SAMPLES: [number, number, number, number | null][] = [
    [0, 0, 0.5, 1.0],
    [0.5, 0.5, 0.6863, 1.1639],
    [1, 1, 0.7743, 1.3173],
    [2, 2, 0.8553, 1.5895],
    [10, 10, 0.9625, 3.0104],
    [1, 10, 0.8599, 1.903],
    [0.5, 2, 0.7647, 1.3668],
    [1, 2, 0.8133, null],
    [3, 1, 0.8305, 1.5517],
  ];
  it('reproduces the chart sample solutions', () => {
    for (const [GA, GB, kb, ks] of SAMPLES) {
      const braced = criticalLoad(1, 1, 'braced', { bottom: ratioFromAlignmentG(GA, 'braced'), top: ratioFromAlignmentG(GB, 'braced') }).K;
      expect(Math.abs(braced - kb)).toBeLessThanOrEqual(0.5e-4 + 1e-12);
      if (ks !== null) {
        const sway = criticalLoad(1, 1, 'sway', { bottom: ratioFromAlignmentG(GA, 'sway'), top: ratioFromAlignmentG(GB, 'sway') }).K;
        expect(Math.abs(sway - ks)).toBeLessThanOrEqual(0.5e-4 + 1e-12);
      }
    }
  });
  // source: docs/verification.md §M3 cross-links [V]: G = 1 sway ⇔ R = 6, K = 1.317275; G = (1, 10) sway ⇔ K = 1.902969; G = 1 braced ⇔ 0.774265
  it('matches the 6-figure cross-links', () => {
    expect(rel(criticalLoad(1, 1, 'sway', { bottom: ratioFromAlignmentG(1, 'sway'), top: 6 }).K, 1.317275)).toBeLessThan(1e-6);
    expect(rel(criticalLoad(1, 1, 'sway', { bottom: 6, top: ratioFromAlignmentG(10, 'sway') }).K, 1.902969)).toBeLessThan(1e-6);
    expect(rel(criticalLoad(1, 1, 'braced', { bottom: ratioFromAlignmentG(1, 'braced'), top: 2 }).K, 0.774265)).toBeLessThan(1e-6);
  });
  // source: docs/verification.md §M3 [V]: G = ∞ both ends is K = 1 braced and a mechanism (K = ∞) in sway; G = 0 ⇔ fixed
  it('maps G = 0 and G = ∞ to fixed and pinned', () => {
    expect(ratioFromAlignmentG(0, 'sway')).toBe(Infinity);
    expect(ratioFromAlignmentG(Infinity, 'braced')).toBe(0);
    expect(criticalLoad(1, 1, 'sway', { bottom: ratioFromAlignmentG(Infinity, 'sway'), top: ratioFromAlignmentG(Infinity, 'sway') }).K).toBe(Infinity);
    expect(criticalLoad(1, 1, 'braced', { bottom: ratioFromAlignmentG(Infinity, 'braced'), top: 0 }).K).toBe(1);
  });
});
