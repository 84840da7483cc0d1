import { describe, expect, it } from 'vitest';
import { aiscCriticalStress, AISC_BRANCH_LIMIT } from '../../src/mechanics/aisc360.js';
import { columnCapacity } from '../../src/mechanics/columnCapacity.js';
import { EN_IMPERFECTION, enReductionFactor, type EnCurve } from '../../src/mechanics/en1993.js';
import { firstYieldCapacity } from '../../src/mechanics/firstYield.js';
import { CLOSED_FORM_STRENGTH_MODELS, type ColumnState, type EndRestraint, type Frame } from '../../src/mechanics/types.js';

/** |x − v| within half a unit of the last quoted digit (plus 1 % of it for the rounding of the reference) */
const nearQuoted = (x: number, v: number, unit: number): void => {
  expect(Math.abs(x - v)).toBeLessThanOrEqual(0.505 * unit);
};

// Worked examples: A = 5000 mm², I = 20e6 mm⁴, Z = 200e3 mm³, E = 200 GPa, fy = 275 MPa (SI below).
const base = { E: 200e9, fy: 275e6, A: 5000e-6, I: 20e6 * 1e-12, S: 200e3 * 1e-9 };
const state = (L: number, bow: number, frame: Frame, r: EndRestraint): ColumnState => ({ ...base, L, bow, frame, r });

describe('first yield (Perry–Robertson)', () => {
  // source: Ayrton & Perry, The Engineer 62 (1886) and Robertson, ICE Selected Engineering Paper 28 (1925), from memory;
  // worked examples 1–6 computed two ways in docs/verification.md §M4 [V] (closed form at 30 digits and second-order FE)
  const EXAMPLES: [string, number, number, Frame, EndRestraint, number, number, number, number][] = [
    // name, L, e0, frame, r, K, Pcr kN, P kN, quoted unit of P
    ['1 pinned', 4, 0.004, 'braced', { bottom: 0, top: 0 }, 1, 2467.4, 1157.1066, 1e-4],
    ['2 pinned', 6, 0.012, 'braced', { bottom: 0, top: 0 }, 1, 1096.62, 727.254, 1e-3],
    ['3 fixed–fixed', 4, 0.004, 'braced', { bottom: Infinity, top: Infinity }, 0.5, 9869.6, 1300.1309, 1e-4],
    ['3b fixed–fixed', 8, 0.008, 'braced', { bottom: Infinity, top: Infinity }, 0.5, 2467.4, 1157.11, 1e-2],
    ['4 braced R = 2', 4, 0.004, 'braced', { bottom: 2, top: 2 }, 0.774265, 4115.86, 1250.45, 1e-2],
    ['5 fixed–pinned', 4, 0.004, 'braced', { bottom: Infinity, top: 0 }, 0.699156, 5047.68, 1252.9, 1e-2],
    ['6 sway R = 6', 4, 0.004, 'sway', { bottom: 6, top: 6 }, 1.317275, 1421.96, 1115.84, 1e-2],
  ];
  it.each(EXAMPLES)('example %s', (_n, L, e0, frame, r, K, PcrkN, PkN, unit) => {
    const res = columnCapacity('first-yield', state(L, e0, frame, r));
    nearQuoted(res.K, K, 1e-6);
    nearQuoted(res.Pcr / 1e3, PcrkN, 1e-2);
    nearQuoted(res.capacity / 1e3, PkN, unit);
    // the sign of the bow does not matter (docs/mechanics.md)
    expect(columnCapacity('first-yield', state(L, -e0, frame, r)).capacity).toBe(res.capacity);
  });
  // source: docs/verification.md §M4 [V], example 1 intermediates: σE = 493.480 MPa, η = 0.1, χ = 0.841532
  it('example 1 intermediates', () => {
    const P = firstYieldCapacity(base.A, base.S, base.fy, 2467.401e3, 0.004, 1);
    nearQuoted(P / (base.A * base.fy), 0.841532, 1e-6);
  });
  // common practice: a straight column reaches the squash load or Pcr, whichever is smaller; a mechanism carries nothing
  it('limits', () => {
    expect(firstYieldCapacity(1, 1, 300, 1e9, 0, 1)).toBeCloseTo(300, 9);
    expect(firstYieldCapacity(1, 1, 300, 100, 0, 1)).toBeCloseTo(100, 9);
    expect(firstYieldCapacity(1, 1, 300, 0, 0.01, 1)).toBe(0);
  });
});

describe('EN 1993-1-1 §6.3.1.2 buckling curves', () => {
  // source: EN 1993-1-1:2005 §6.3.1.2, Eq. 6.49 and Table 6.1 (numbers from memory; α values seen in secondary pages);
  // χ values computed in docs/verification.md §M5b [V]
  const CHI: [EnCurve, number, number, number, number, number][] = [
    ['a0', 0.13, 0.9513, 0.7253, 0.3953, 0.2323],
    ['a', 0.21, 0.9243, 0.6656, 0.3724, 0.2229],
    ['b', 0.34, 0.8842, 0.597, 0.3422, 0.2095],
    ['c', 0.49, 0.843, 0.5399, 0.3145, 0.1962],
    ['d', 0.76, 0.7793, 0.4671, 0.2766, 0.1766],
  ];
  it('reproduces the χ table', () => {
    for (const [curve, alpha, ...chi] of CHI) {
      expect(EN_IMPERFECTION[curve]).toBe(alpha);
      [0.5, 1, 1.5, 2].forEach((lb, i) => nearQuoted(enReductionFactor(alpha, lb), chi[i], 1e-4));
    }
  });
  // source: EN 1993-1-1:2005 §6.3.1.2(4) (from memory): χ = 1 for λ̄ ≤ 0.2
  it('plateau and capacity through columnCapacity', () => {
    expect(enReductionFactor(0.49, 0.2)).toBe(1);
    expect(enReductionFactor(0.49, 0.1)).toBe(1);
    // λ̄ = 1: choose L so that Pcr = A fy for a pinned column
    const L = Math.PI * Math.sqrt((base.E * base.I) / (base.A * base.fy));
    const res = columnCapacity('en1993-b', state(L, 0.01, 'braced', { bottom: 0, top: 0 }));
    nearQuoted(res.capacity / (base.A * base.fy), 0.597, 1e-4);
    // the code curves ignore the bow (docs/mechanics.md)
    expect(columnCapacity('en1993-b', state(L, 0, 'braced', { bottom: 0, top: 0 })).capacity).toBe(res.capacity);
  });
});

describe('AISC 360-16 §E3', () => {
  // source: AISC 360-16 §E3, Eqs. E3-2/E3-3 (numbers from memory); Fcr/Fy values computed in docs/verification.md §M5a [V]
  it('Fcr/Fy table', () => {
    const FCR: [number, number][] = [[0.5, 0.900651], [1.0, 0.658], [1.5, 0.389949], [2.0, 0.21925]];
    for (const [lc, v] of FCR) nearQuoted(aiscCriticalStress(1, 1 / (lc * lc)), v, 1e-6);
  });
  // source: docs/verification.md §M5a [V]: at Fy/Fe = 2.25 the branches give 0.389949 and 0.389778 (0.044 % jump); we branch on Fy/Fe ≤ 2.25
  it('branch boundary', () => {
    expect(AISC_BRANCH_LIMIT).toBe(2.25);
    nearQuoted(aiscCriticalStress(1, 1 / 2.25), 0.389949, 1e-6);
    nearQuoted(aiscCriticalStress(1, 1 / 2.2500001), 0.389778, 1e-6);
  });
  // source: AISC Manual table "Available Critical Stress for Compression Members", Fy = 50 ksi (from memory);
  // Fcr values computed in docs/verification.md §M5a [V]
  it('ksi example, Fy = 50 ksi, E = 29 000 ksi', () => {
    const ROWS: [number, number, number][] = [[40, 44.48, 40.0], [80, 31.31, 28.2], [100, 24.07, 21.7], [120, 17.43, 15.7], [150, 11.16, 10.0]];
    for (const [slenderness, fcr, phiFcr] of ROWS) {
      const Fe = (Math.PI * Math.PI * 29000) / (slenderness * slenderness);
      const f = aiscCriticalStress(50, Fe);
      nearQuoted(f, fcr, 0.01);
      nearQuoted(0.9 * f, phiFcr, 0.1);
    }
  });
});

describe('columnCapacity', () => {
  // source: docs/verification.md §M2 Table 2b R = 0 [V]: a sway column with no restraint is a mechanism — every model gives 0
  it('mechanism gives zero capacity for every model', () => {
    for (const model of CLOSED_FORM_STRENGTH_MODELS) {
      const res = columnCapacity(model, state(4, 0.004, 'sway', { bottom: 0, top: 0 }));
      expect(res.capacity).toBe(0);
      expect(res.Pcr).toBe(0);
      expect(res.K).toBe(Infinity);
    }
  });
  // common practice: more restraint never lowers the capacity
  it('is monotone in restraint for every model', () => {
    for (const model of CLOSED_FORM_STRENGTH_MODELS) {
      for (const frame of ['braced', 'sway'] as const) {
        let prev = -1;
        for (const R of [0.01, 0.3, 2, 20, 500, Infinity]) {
          const cap = columnCapacity(model, state(5, 0.005, frame, { bottom: R, top: 1 })).capacity;
          expect(cap).toBeGreaterThanOrEqual(prev);
          prev = cap;
        }
      }
    }
  });
  // common practice: unknown model names are rejected
  it('rejects unknown models', () => {
    expect(() => columnCapacity('en1993-e' as never, state(4, 0.004, 'braced', { bottom: 0, top: 0 }))).toThrow();
  });
});
