import { describe, expect, it } from 'vitest';
import { feCriticalLoads, feEigenvalues, feEigenvaluesExtrapolated } from '../../src/fe/feCriticalLoads.js';
import { criticalPhi } from '../../src/mechanics/criticalLoad.js';
import type { EndRestraint, Frame } from '../../src/mechanics/types.js';

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);
const GRID = [0, 0.1, 0.5, 1, 2, 5, 10, 50, 1e3, Infinity];

describe('finite-element column vs exact characteristic equation', () => {
  // source: Hermite-cubic elements with consistent geometric stiffness, Przemieniecki 1968 (from memory); the exact roots are checked
  // against Timoshenko & Gere 1961 ch. 2 / docs/verification.md §M2 [V] in test/mechanics. Here: two independent methods agree ≤ 1e-5.
  it.each(['braced', 'sway'] as Frame[])('%s: lowest two modes over a 10 × 10 grid of R', (frame) => {
    let worst = 0;
    for (const RA of GRID) {
      for (const RB of GRID) {
        const r = { bottom: RA, top: RB };
        const fe = feEigenvaluesExtrapolated(frame, r, 12, 2);
        for (let n = 1; n <= 2; n++) {
          const ex = criticalPhi(frame, r, n) ** 2;
          if (ex === 0) {
            expect(fe[n - 1]).toBeLessThan(1e-8); // mechanism: zero eigenvalue
            continue;
          }
          worst = Math.max(worst, rel(fe[n - 1], ex));
        }
      }
    }
    expect(worst).toBeLessThan(1e-5);
  });

  // common practice (independent check of the derived lateral-spring equation T Δb + φ³ Δs = 0)
  it('sway with a translational spring at the top', () => {
    const cases: EndRestraint[] = [];
    for (const T of [0.05, 1, 4, 9, 30, 200, 1e4]) {
      for (const [a, b] of [[0, 0], [0.5, 0], [2, 2], [Infinity, 0.3], [5, Infinity], [Infinity, Infinity], [0.1, 50]]) cases.push({ bottom: a, top: b, lateral: T });
    }
    for (const r of cases) {
      const fe = feEigenvaluesExtrapolated('sway', r, 12, 3);
      for (let n = 1; n <= 3; n++) expect(rel(fe[n - 1], criticalPhi('sway', r, n) ** 2)).toBeLessThan(1e-5);
    }
  });

  // common practice: cubic Hermite buckling eigenvalues converge as h⁴ (basis of the Richardson step)
  it('converges at fourth order', () => {
    const r = { bottom: 2, top: 0.5 };
    const ex = criticalPhi('braced', r) ** 2;
    const e1 = rel(feEigenvalues('braced', r, 8, 1)[0], ex);
    const e2 = rel(feEigenvalues('braced', r, 16, 1)[0], ex);
    expect(Math.log2(e1 / e2)).toBeGreaterThan(3.8);
    expect(Math.log2(e1 / e2)).toBeLessThan(4.2);
  });

  // source: Timoshenko & Gere 1961 ch. 2 (from memory): fixed–fixed 4π²EI/L², higher modes 8.182994, 16 × π²EI/L² (docs/verification.md §M1 [V])
  it('SI critical loads and higher modes', () => {
    const EI = 5e6, L = 3;
    const P = feCriticalLoads(EI, L, 'braced', { bottom: Infinity, top: Infinity }, { elements: 24, count: 3 });
    [4, 8.182994, 16].forEach((v, i) => expect(rel(P[i] / ((Math.PI ** 2 * EI) / (L * L)), v)).toBeLessThan(1e-6));
  });
});
