import { describe, expect, it } from 'vitest';
import { aiscCapacity } from '../../src/mechanics/aisc360.js';
import { aiscEccentricCapacity, aiscInteractionRatio, type AiscInteractionColumn } from '../../src/mechanics/aiscInteraction.js';
import { capacityFromPcr, columnCapacity } from '../../src/mechanics/columnCapacity.js';
import { criticalLoad } from '../../src/mechanics/criticalLoad.js';
import { EN_IMPERFECTION, enCapacity } from '../../src/mechanics/en1993.js';
import {
  enEccentricCapacity, enEquivalentMomentFactor, enInteractionFactor, enInteractionRatio, type EnInteractionColumn,
} from '../../src/mechanics/en1993Interaction.js';
import type { ColumnState, EndRestraint, Frame, StrengthModel } from '../../src/mechanics/types.js';

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);
const E = 200e9;
const I = 15.4e-6;
const EI = E * I;
const A = 4.5e-3;
const S = 0.27e-3;
const fy = 275e6;
const pinned: EndRestraint = { bottom: 0, top: 0 };

function state(L: number, frame: Frame, r: EndRestraint, eB: number, eT: number): ColumnState {
  return { E, I, A, S, fy, L, bow: 0.002, frame, r, eccentricity: { bottom: eB, top: eT } };
}

/** EN 1993-1-1:2005 Eq. (6.49): χ = 1/(Φ + √(Φ² − λ̄²)), Φ = ½[1 + α(λ̄ − 0.2) + λ̄²], written out again here. */
function chiByHand(alpha: number, lambdaBar: number): number {
  const Phi = 0.5 * (1 + alpha * (lambdaBar - 0.2) + lambdaBar * lambdaBar);
  return Math.min(1, 1 / (Phi + Math.sqrt(Phi * Phi - lambdaBar * lambdaBar)));
}

/** Bisection on a function rising through 0 on [lo, hi]. */
function bisect(f: (x: number) => number, lo: number, hi: number): number {
  for (let i = 0; i < 200; i++) {
    const mid = 0.5 * (lo + hi);
    if (f(mid) < 0) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

describe('EN 1993-1-1 §6.3.3 Eq. (6.61) with Annex B (method 2) factors', () => {
  // EN 1993-1-1:2005 Annex B, Table B.3 (from memory): linear end moments C_my = 0.6 + 0.4ψ ≥ 0.4, ψ = M_min/M_max; sway mode 0.9
  it('C_my of Table B.3', () => {
    expect(enEquivalentMomentFactor(0.05, 0.05, 'braced')).toBeCloseTo(1, 15);
    expect(enEquivalentMomentFactor(0.05, 0, 'braced')).toBeCloseTo(0.6, 15);
    expect(enEquivalentMomentFactor(0, -0.05, 'braced')).toBeCloseTo(0.6, 15);
    expect(enEquivalentMomentFactor(0.02, 0.04, 'braced')).toBeCloseTo(0.8, 15);
    expect(enEquivalentMomentFactor(-0.04, 0.01, 'braced')).toBeCloseTo(0.5, 15);
    expect(enEquivalentMomentFactor(0.04, -0.04, 'braced')).toBe(0.4); // 0.6 − 0.4 = 0.2 → the floor 0.4
    expect(enEquivalentMomentFactor(0.04, -0.04, 'sway')).toBe(0.9);
  });

  // EN 1993-1-1:2005 Annex B, Table B.1, class 3 (from memory): k_yy = C_my(1 + 0.6 λ̄ n) ≤ C_my(1 + 0.6 n)
  it('k_yy of Table B.1 (class 3) and its cap', () => {
    expect(enInteractionFactor(0.6, 0.5, 0.4)).toBeCloseTo(0.6 * (1 + 0.6 * 0.5 * 0.4), 15);
    expect(enInteractionFactor(0.6, 1.7, 0.4)).toBeCloseTo(0.6 * (1 + 0.6 * 0.4), 15);
    expect(enInteractionFactor(1, 0.9, 0)).toBe(1);
  });

  // Eq. (6.61) with χ_LT = 1, M_z = 0: n + C_my(1 + 0.6 min(λ̄,1) n)·n·m = 1, n = P/(χ A fy), m = χ A fy e/(fy S):
  // a quadratic in n, solved by hand; pinned ends, Pcr = π²EI/L² (Euler)
  it.each([
    ['slender (λ̄ > 1: the cap of k_yy governs), ψ = 0', 5.6, 'b' as const, 0.03, 0],
    ['stocky (0.2 < λ̄ < 1), ψ = 0.5', 3.0, 'c' as const, 0.02, 0.04],
    ['stocky, double curvature ψ = −0.5', 3.0, 'a' as const, -0.02, 0.04],
  ])('%s: the root of the quadratic', (_label, L, curve, eB, eT) => {
    const Pcr = (Math.PI * Math.PI * EI) / (L * L);
    expect(rel(criticalLoad(EI, L, 'braced', pinned).Pcr, Pcr)).toBeLessThan(1e-12);
    const lambdaBar = Math.sqrt((A * fy) / Pcr);
    const Nb = chiByHand(EN_IMPERFECTION[curve], lambdaBar) * A * fy;
    const e = Math.max(Math.abs(eB), Math.abs(eT));
    const big = Math.abs(eB) >= Math.abs(eT) ? eB : eT;
    const psi = (big === eB ? eT : eB) / big;
    const cmy = Math.max(0.4, 0.6 + 0.4 * psi);
    const m = (Nb * e) / (fy * S);
    const a = 0.6 * cmy * Math.min(lambdaBar, 1) * m;
    const b = 1 + cmy * m;
    const n = (-b + Math.sqrt(b * b + 4 * a)) / (2 * a);
    const got = columnCapacity(`en1993-${curve}`, state(L, 'braced', pinned, eB, eT)).capacity;
    expect(rel(got, n * Nb)).toBeLessThan(1e-10);
    expect(got).toBeLessThan(Nb);
  });

  it('a hand-computed point: L = 3 m, curve b, e = 20 mm at one end', () => {
    // Pcr = π²·200e9·15.4e-6/9 = 3377.6 kN; λ̄ = √(1237.5/3377.6) = 0.6053; Φ = ½[1 + 0.34·0.4053 + 0.3664] = 0.7521;
    // χ = 1/(0.7521 + √(0.5656 − 0.3664)) = 0.8344; Nb = 1032.6 kN; C_my = 0.6; m = 1032.6e3·0.02/74250 = 0.2781;
    // 0.6·0.6·0.6053·0.2781 n² + 1.1669 n − 1 = 0 → n = 0.8219, P = 848.7 kN (Eq. 6.61, Tables B.1/B.3)
    const P = columnCapacity('en1993-b', state(3, 'braced', pinned, 0.02, 0)).capacity;
    expect(P / 1e3).toBeCloseTo(848.7, 1);
  });

  // common practice: a very short column (χ = 1, λ̄ → 0, so k_yy → C_my = 1 under equal end moments) gives N/N_Rk + M/M_Rk = 1;
  // k_yy exceeds C_my by at most 0.6 λ̄ (Table B.1), so the capacity lies within that fraction below the linear one
  it('a very short column reduces to N/(A fy) + P e/(fy S) = 1', () => {
    const e = 0.03;
    const L = 0.05;
    const lambdaBar = Math.sqrt((A * fy) / criticalLoad(EI, L, 'braced', pinned).Pcr);
    expect(lambdaBar).toBeLessThan(0.2);
    const got = columnCapacity('en1993-c', state(L, 'braced', pinned, e, e)).capacity;
    const linear = 1 / (1 / (A * fy) + e / (fy * S));
    expect(rel(got, linear)).toBeGreaterThan(0.1 * lambdaBar);
    expect(rel(got, linear)).toBeLessThan(0.6 * lambdaBar);
    expect(got).toBeLessThanOrEqual(linear);
  });

  it('the ratio equals 1 at the capacity and rises with the load', () => {
    const col: EnInteractionColumn = { alpha: 0.34, A, S, fy, Pcr: 2e6, eB: 0.01, eT: -0.03, frame: 'braced' };
    const P = enEccentricCapacity(col);
    expect(Math.abs(enInteractionRatio(col, P) - 1)).toBeLessThan(1e-12);
    expect(enInteractionRatio(col, 0.5 * P)).toBeLessThan(enInteractionRatio(col, 0.9 * P));
  });
});

describe('AISC 360-16 §H1.1 (H1-1a/b) with the exact second-order moment', () => {
  // AISC 360-16 Eqs. H1-1a/b (from memory)
  it('the two branches of H1-1', () => {
    expect(aiscInteractionRatio(0.5, 1, 0.3, 1)).toBeCloseTo(0.5 + (8 / 9) * 0.3, 15);
    expect(aiscInteractionRatio(0.1, 1, 0.3, 1)).toBeCloseTo(0.05 + 0.3, 15);
    // at P_r/P_c = 0.2 the branches differ except where M_r/M_c = 0.9, where both give 1: the jump never straddles 1
    expect(aiscInteractionRatio(0.2, 1, 0.9, 1)).toBeCloseTo(1, 15);
    expect(aiscInteractionRatio(0.2 * (1 - 1e-12), 1, 0.9, 1)).toBeCloseTo(1, 11);
  });

  // Pinned ends, equal eccentricities: M_r = P e sec(kL/2) (Timoshenko & Gere, Theory of Elastic Stability, 1961, §1.4),
  // P_c = 0.658^(Fy/Fe) Fy A (AISC 360-16 Eq. E3-2, from memory), M_c = Fy S; the load solving H1-1 by bisection
  it.each([
    ['H1-1a governs (moderate e)', 0.01],
    ['H1-1b governs (large e)', 0.8],
  ])('%s: secant formula', (_label, e) => {
    const L = 4;
    const Pcr = (Math.PI * Math.PI * EI) / (L * L);
    const Pc = Math.pow(0.658, (A * fy) / Pcr) * fy * A;
    const Mc = fy * S;
    const h1 = (P: number) => {
      const Mr = (P * e) / Math.cos((L / 2) * Math.sqrt(P / EI));
      return (P / Pc >= 0.2 ? P / Pc + (8 / 9) * (Mr / Mc) : P / (2 * Pc) + Mr / Mc) - 1;
    };
    const expected = bisect(h1, 0, Pc);
    const got = columnCapacity('aisc360-e3', state(L, 'braced', pinned, e, e)).capacity;
    expect(rel(got, expected)).toBeLessThan(1e-9);
    expect(got / Pc >= 0.2).toBe(e < 0.1);
  });

  // common practice: a very short column has no amplification, P/Pc + (8/9) P e/(Fy S) = 1 on the H1-1a branch
  it('a very short column: first-order moments', () => {
    const e = 0.005;
    const col: AiscInteractionColumn = { A, S, fy, EI, L: 0.05, frame: 'braced', r: pinned, eB: e, eT: e, Pcr: criticalLoad(EI, 0.05, 'braced', pinned).Pcr };
    const Pc = aiscCapacity(A, fy, col.Pcr);
    const firstOrder = 1 / (1 / Pc + ((8 / 9) * e) / (fy * S));
    expect(rel(aiscEccentricCapacity(col), firstOrder)).toBeLessThan(1e-5);
  });
});

describe('eccentric code checks in columnCapacity', () => {
  const restraints: [Frame, EndRestraint][] = [
    ['braced', { bottom: 0, top: 0 }],
    ['braced', { bottom: 3, top: 0.5 }],
    ['sway', { bottom: 8, top: 2, lateral: 0 }],
    ['sway', { bottom: Infinity, top: 1, lateral: 4 }],
  ];
  const models: StrengthModel[] = ['en1993-a0', 'en1993-b', 'en1993-d', 'aisc360-e3'];

  it.each(models)('%s: zero eccentricity gives the concentric capacity bit for bit, a tiny one converges to it', (model) => {
    for (const [frame, r] of restraints) {
      const s0 = state(4.2, frame, r, 0, 0);
      const { Pcr, c } = columnCapacity(model, s0);
      const concentric = capacityFromPcr(model, A, S, fy, 0, Pcr, c);
      expect(columnCapacity(model, s0).capacity).toBe(concentric);
      expect(rel(columnCapacity(model, state(4.2, frame, r, 1e-9, 1e-9)).capacity, concentric)).toBeLessThan(1e-5);
    }
  });

  it.each(models)('%s: the capacity falls as the eccentricity grows', (model) => {
    for (const [frame, r] of restraints) {
      let last = columnCapacity(model, state(4.2, frame, r, 0, 0)).capacity;
      for (const e of [0.002, 0.01, 0.03, 0.1, 0.3]) {
        const now = columnCapacity(model, state(4.2, frame, r, 0.5 * e, e)).capacity;
        expect(now).toBeLessThan(last);
        last = now;
      }
    }
  });

  it('EN: matches enCapacity without moment, and a mechanism carries nothing', () => {
    const Pcr = criticalLoad(EI, 4.2, 'braced', pinned).Pcr;
    expect(enCapacity(0.34, A, fy, Pcr)).toBe(capacityFromPcr('en1993-b', A, S, fy, 0, Pcr, 1));
    const mech = state(4.2, 'sway', { bottom: 0, top: 0, lateral: 0 }, 0.01, 0.01);
    expect(columnCapacity('en1993-b', mech).capacity).toBe(0);
    expect(columnCapacity('aisc360-e3', mech).capacity).toBe(0);
  });

  // common practice: the equivalent-bow model's combined-action check (EN 1993-1-1 §5.2.2(3)a, second-order analysis
  // with the §5.3.2(11) bow) lies at or above first yield with a smaller measured bow, and falls as the eccentricity grows
  it('the equivalent-bow models check an eccentricity by second-order analysis with their bow', () => {
    const c1 = columnCapacity('first-yield-en1993-b', state(4.2, 'braced', pinned, 0.01, 0)).capacity;
    const c2 = columnCapacity('first-yield-en1993-b', state(4.2, 'braced', pinned, 0.03, 0)).capacity;
    expect(c1).toBeGreaterThan(0);
    expect(c2).toBeLessThan(c1);
  });
});
