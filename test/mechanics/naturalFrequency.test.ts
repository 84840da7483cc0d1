import { describe, expect, it } from 'vitest';
import { feFrequencyParameters, feFrequencyParametersExtrapolated } from '../../src/fe/feFrequencies.js';
import { criticalPhi } from '../../src/mechanics/criticalLoad.js';
import { frequencyParameter, naturalFrequency } from '../../src/mechanics/naturalFrequency.js';
import type { EndRestraint, Frame } from '../../src/mechanics/types.js';

const rel = (a: number, b: number): number => Math.abs(a - b) / Math.abs(b);

describe('first natural frequency of the restrained column: ideal ends', () => {
  // source: Blevins, Formulas for Natural Frequency and Mode Shape, 1979, Table 8-1 (λ₁ of the
  // uniform beam: pinned–pinned π, clamped–clamped 4.73004074, clamped–free 1.87510407,
  // clamped–pinned 3.92660231, clamped–guided 2.36502037), from memory; the digits computed two ways [V],
  // docs/verification.md §M4c
  it.each([
    ['braced', { bottom: 0, top: 0 }, Math.PI],
    ['braced', { bottom: Infinity, top: Infinity }, 4.73004074],
    ['sway', { bottom: Infinity, top: 0, lateral: 0 }, 1.87510407],
    ['braced', { bottom: Infinity, top: 0 }, 3.92660231],
    ['sway', { bottom: Infinity, top: Infinity, lateral: 0 }, 2.36502037],
  ] as [Frame, EndRestraint, number][])('%s %j: λ₁ = %f', (frame, r, lambda) => {
    expect(frequencyParameter(frame, r, 0)).toBeCloseTo(lambda, 7);
  });

  it('ω = λ²√(EI/(mL⁴)) in physical units', () => {
    // source: Blevins 1979, Table 8-1, f = λ²/(2πL²) √(EI/m) for the pinned–pinned beam
    const EI = 210e9 * 8.36e-5;
    const L = 6;
    const m = 100;
    const f = naturalFrequency(EI, L, m, 0, 'braced', { bottom: 0, top: 0 });
    expect(rel(f.hertz, (Math.PI ** 2 / (2 * Math.PI * L * L)) * Math.sqrt(EI / m))).toBeLessThan(1e-12);
  });

  it('pinned ends under axial load: ω²(P) = ω₀²(1 − P/Pcr)', () => {
    // source: Timoshenko, Young & Weaver, Vibration Problems in Engineering, 4th ed., 1974, §5.12 (beam with axial force), from memory;
    // docs/verification.md §M4c
    const EI = 1e7;
    const L = 5;
    const m = 80;
    const pcr = (Math.PI ** 2 * EI) / (L * L);
    const w0 = naturalFrequency(EI, L, m, 0, 'braced', { bottom: 0, top: 0 }).omega;
    for (const ratio of [0.1, 0.5, 0.9, 0.999]) {
      const w = naturalFrequency(EI, L, m, ratio * pcr, 'braced', { bottom: 0, top: 0 }).omega;
      expect(rel(w * w, w0 * w0 * (1 - ratio))).toBeLessThan(1e-9);
    }
    // at and above the critical load the column has no lateral stiffness left
    expect(naturalFrequency(EI, L, m, pcr, 'braced', { bottom: 0, top: 0 }).omega).toBe(0);
  });

  it('a column near a sway mechanism: rigid tilt on the springs, λ⁴ = 3(R_A + R_B)', () => {
    // common practice: the rigid rotation y = ξθ about the base, spring energy ½(R_A + R_B)θ² against kinetic ½λ⁴θ²/3
    const R = 1e-6;
    const lambda = frequencyParameter('sway', { bottom: R, top: R, lateral: 0 }, 0);
    expect(rel(lambda ** 4, 6 * R)).toBeLessThan(1e-5);
  });
});

describe('first natural frequency against an independent finite-element model', () => {
  it('Hermite elements with consistent mass converge as h⁴ (the basis of the extrapolation)', () => {
    // common practice: eigenvalue error of cubic Hermite beam elements with consistent mass is O(h⁴)
    const r = { bottom: 3, top: 10 };
    const exact = frequencyParameter('braced', r, 1.5) ** 4;
    const e8 = feFrequencyParameters('braced', r, 1.5, 8)[0] ** 4 - exact;
    const e16 = feFrequencyParameters('braced', r, 1.5, 16)[0] ** 4 - exact;
    expect(e16 / e8).toBeGreaterThan(1 / 16 - 0.005);
    expect(e16 / e8).toBeLessThan(1 / 16 + 0.005);
  });

  // common practice: two independent methods (exact characteristic equation; Hermite FE with consistent
  // mass and geometric stiffness, Richardson-extrapolated) agree within 1e-4 over a grid of springs and loads
  const GRID = [0, 0.3, 2, 10, 100, Infinity];
  it.each([
    ['braced', undefined],
    ['sway', 0],
    ['sway', 15],
  ] as [Frame, number | undefined][])('%s, lateral T = %s: λ₁ over a 6 × 6 grid of R and three axial loads', (frame, T) => {
    let worst = 0;
    for (const RA of GRID) {
      for (const RB of GRID) {
        const r: EndRestraint = T === undefined ? { bottom: RA, top: RB } : { bottom: RA, top: RB, lateral: T };
        const phiCr = criticalPhi(frame, r, 1);
        if (phiCr < 0.05) continue; // near a mechanism the FE eigenproblem is ill-conditioned (checked above in closed form)
        for (const fraction of [0, 0.4, 0.8]) {
          const phi = fraction * phiCr;
          const exact = frequencyParameter(frame, r, phi);
          const fe = feFrequencyParametersExtrapolated(frame, r, phi, 8, 1)[0];
          worst = Math.max(worst, rel(fe, exact));
        }
      }
    }
    expect(worst).toBeLessThan(1e-4);
  });
});

describe('input checks', () => {
  it('refuses non-physical inputs', () => {
    expect(() => naturalFrequency(0, 1, 1, 0, 'braced', { bottom: 0, top: 0 })).toThrow(/EI/);
    expect(() => naturalFrequency(1, 1, 0, 0, 'braced', { bottom: 0, top: 0 })).toThrow(/mass per length/);
    expect(() => naturalFrequency(1, 1, 1, -1, 'braced', { bottom: 0, top: 0 })).toThrow(/axial load/);
  });
});
