import { describe, expect, it } from 'vitest';
import { columnCapacity } from '../../src/mechanics/columnCapacity.js';
import { EN_IMPERFECTION, enReductionFactor, type EnCurve } from '../../src/mechanics/en1993.js';
import { en1993EquivalentBow } from '../../src/mechanics/equivalentBow.js';
import { defaultModelUncertainty } from '../../src/mechanics/modelUncertainty.js';
import { strengthModelKind, strengthUsesBow } from '../../src/mechanics/strengthModelKind.js';
import { STRENGTH_MODELS, type ColumnState, type EndRestraint, type Frame, type StrengthModel } from '../../src/mechanics/types.js';

const CURVES: EnCurve[] = ['a0', 'a', 'b', 'c', 'd'];
const E = 210e9, fy = 355e6, A = 5380e-6, I = 36.9e-6, S = 389e-6;

function state(L: number, frame: Frame, r: EndRestraint, bow = 0): ColumnState {
  return { E, fy, A, I, S, L, bow, frame, r };
}

describe('first yield with the equivalent bow of EN 1993-1-1 5.3.2(11)', () => {
  // source: EN 1993-1-1:2005 §5.3.2(11) Eqs. 5.9/5.10 with γ_M1 = 1 give η = α(λ̄ − 0.2), the Ayrton–Perry form of §6.3.1.2 Eq. 6.49:
  // the equivalent-bow model must reproduce χ·A·fy of its curve for any restraint and slenderness
  it('matches en1993-X to 1e-9 over restraint ratios, frames and slenderness', () => {
    const ratios = [0, 0.1, 0.5, 2, 6, 25, 200, Infinity];
    let worst = 0;
    let compared = 0;
    for (const curve of CURVES) {
      for (const frame of ['braced', 'sway'] as const) {
        for (const RA of ratios) {
          for (const RB of ratios) {
            for (const L of [0.8, 2, 4, 7, 12, 20]) {
              const code = columnCapacity(`en1993-${curve}` as StrengthModel, state(L, frame, { bottom: RA, top: RB }));
              const fyEq = columnCapacity(`first-yield-en1993-${curve}` as StrengthModel, state(L, frame, { bottom: RA, top: RB }, 0.05));
              if (code.capacity === 0) {
                expect(fyEq.capacity).toBe(0);
                continue;
              }
              worst = Math.max(worst, Math.abs(fyEq.capacity / code.capacity - 1));
              compared++;
            }
          }
        }
      }
    }
    expect(compared).toBeGreaterThan(2000);
    expect(worst).toBeLessThan(1e-9);
  });

  // source: docs/verification.md §M5b χ table [V], curve b at λ̄ = 1.0: χ = 0.5970 (pinned column, c = 1)
  it('gives χ = 0.5970 for curve b at λ̄ = 1 on a pinned column', () => {
    const L = Math.PI * Math.sqrt((E * I) / (A * fy)); // λ̄ = 1 when Pcr = A fy
    const r = columnCapacity('first-yield-en1993-b', state(L, 'braced', { bottom: 0, top: 0 }));
    expect(r.capacity / (A * fy)).toBeCloseTo(0.597, 3);
  });

  // source: EN 1993-1-1:2005 Eq. 5.10, e0 = α(λ̄ − 0.2)·M_Rk/N_Rk·(1 − χλ̄²/γ_M1)/(1 − χλ̄²); e0 = 0 for λ̄ ≤ 0.2
  it('follows Eq. 5.10, including γ_M1 and the λ̄ ≤ 0.2 plateau', () => {
    const alpha = EN_IMPERFECTION.c;
    const lambda = 1.3;
    const Pcr = (A * fy) / (lambda * lambda);
    const chi = enReductionFactor(alpha, lambda);
    const x = chi * lambda * lambda;
    expect(en1993EquivalentBow(alpha, A, S, fy, Pcr)).toBeCloseTo(alpha * (lambda - 0.2) * (S / A), 15);
    expect(en1993EquivalentBow(alpha, A, S, fy, Pcr, 1.1)).toBeCloseTo(alpha * (lambda - 0.2) * (S / A) * ((1 - x / 1.1) / (1 - x)), 15);
    expect(en1993EquivalentBow(alpha, A, S, fy, (A * fy) / 0.04)).toBe(0);
    expect(en1993EquivalentBow(alpha, A, S, fy, 0)).toBe(0);
  });

  // common practice: a larger imperfection lowers the first-yield load; with no measured bow the plus-bow form is the plain one
  it('the plus-bow form adds the measured bow on top (sign ignored)', () => {
    const r = { bottom: 2, top: 0.5 };
    const plain = columnCapacity('first-yield-en1993-b', state(5, 'braced', r, 0.01)).capacity;
    expect(columnCapacity('first-yield-en1993-b-plus-bow', state(5, 'braced', r, 0)).capacity).toBeCloseTo(plain, 6);
    const bowed = columnCapacity('first-yield-en1993-b-plus-bow', state(5, 'braced', r, 0.005)).capacity;
    expect(bowed).toBeLessThan(plain * 0.99);
    expect(columnCapacity('first-yield-en1993-b-plus-bow', state(5, 'braced', r, -0.005)).capacity).toBe(bowed);
  });
});

describe('strength model names and their default model uncertainty', () => {
  // common practice: the code curves and the plain equivalent bow ignore the sampled bow; first yield and the plus-bow forms use it
  it('knows which models use the bow', () => {
    expect(STRENGTH_MODELS.filter(strengthUsesBow)).toEqual(['first-yield', ...CURVES.map((c) => `first-yield-en1993-${c}-plus-bow`), 'plastic-zone']);
    expect(strengthModelKind('en1993-e')).toBeUndefined();
    expect(strengthModelKind('first-yield-en1993-c')).toEqual({ family: 'equivalent-bow', curve: 'c', usesBow: false });
  });

  // from memory: JCSS PMC Part 3 (2001) steel resistance model uncertainty lognormal 1.00 / 0.05 (CoV doubled by judgement for first yield);
  // European curves are lower-fractile curves (bias 1.10, CoV 0.07); AISC E3 a mean curve (1.00, 0.07). All values marked from memory in the code.
  it('gives every model a lognormal default with its source named', () => {
    for (const m of STRENGTH_MODELS) {
      const d = defaultModelUncertainty(m);
      expect(d.dist).toBe('lognormal');
      expect(d.mean).toBeGreaterThan(0.9);
      expect(d.cov).toBeGreaterThan(0);
      expect(d.source).toMatch(/from memory/);
    }
    expect(defaultModelUncertainty('first-yield')).toMatchObject({ mean: 1.0, cov: 0.1 });
    expect(defaultModelUncertainty('aisc360-e3')).toMatchObject({ mean: 1.0, cov: 0.07 });
    expect(defaultModelUncertainty('en1993-c')).toMatchObject({ mean: 1.1, cov: 0.07 });
    // the equivalent-bow form reproduces its curve, so it carries the curve's numbers
    expect(defaultModelUncertainty('first-yield-en1993-c')).toMatchObject({ mean: 1.1, cov: 0.07 });
    expect(defaultModelUncertainty('first-yield-en1993-c').source).toMatch(/as en1993-c/);
  });
});
