import { describe, expect, it } from 'vitest';
import { breitung, hohenbichlerRackwitz, tvedt } from '../../src/reliability/sormFormulas.js';
import { sorm, principalCurvatures } from '../../src/reliability/sorm.js';
import { form } from '../../src/reliability/form.js';
import { paraboloid, resistanceMinusLoad, shortColumn, steelBeam } from '../../src/reliability/testProblems.js';
import { normalSf } from '../../src/probability/normal.js';
import type { FormResult } from '../../src/reliability/types.js';

/** |a − e| within half a unit of the last of `digits` significant digits of e. */
function expectDigits(actual: number | null, expected: number, digits = 6): void {
  expect(actual).not.toBeNull();
  const unit = 10 ** (Math.floor(Math.log10(Math.abs(expected))) - (digits - 1));
  expect(Math.abs(actual! - expected), `${actual} vs ${expected}`).toBeLessThanOrEqual(0.5 * unit * 1.0001);
}

// source: docs/verification.md §R1d (paraboloid; Breitung 1984, Hohenbichler & Rackwitz 1988,
// Tvedt 1990 formulas from memory, values computed there): n, beta, kappa, Breitung, HR, Tvedt
const PARABOLOID: [number, number, number, number, number, number][] = [
  [2, 3, 0.1, 1.18394e-3, 1.17125e-3, 1.16878e-3],
  [2, 3, 0.2, 1.06719e-3, 1.04879e-3, 1.04291e-3],
  [2, 3, -0.1, 1.61344e-3, 1.64709e-3, 1.63626e-3],
  [2, 4, 0.1, 2.67671e-5, 2.6554e-5, 2.65048e-5],
  [10, 3, 0.1, 4.1453e-4, 3.7623e-4, 3.47692e-4],
  [10, 3, -0.05, 2.80489e-3, 3.02507e-3, 2.91984e-3],
];

describe('SORM formulas on the paraboloid table (exact curvatures)', () => {
  for (const [n, beta, kappa, b, hr, tv] of PARABOLOID) {
    it(`n = ${n}, β = ${beta}, κ = ${kappa}`, () => {
      const k = new Array<number>(n - 1).fill(kappa);
      expectDigits(breitung(beta, k), b);
      expectDigits(hohenbichlerRackwitz(beta, k), hr);
      expectDigits(tvedt(beta, k), tv);
    });
  }

  it('n = 100, β = 2, κ = 0.05: Breitung and HR as tabulated, Tvedt breaks down (negative)', () => {
    // source: docs/verification.md §R1d, last row (Tvedt gives −2.27e-4 there)
    const k = new Array<number>(99).fill(0.05);
    expectDigits(breitung(2, k), 2.03257e-4);
    expectDigits(hohenbichlerRackwitz(2, k), 8.83919e-5);
    expect(tvedt(2, k)).toBeNull();
  });

  it('zero curvature gives back FORM; β·κ <= −1 makes Breitung and Tvedt undefined', () => {
    // common practice: a flat surface has pf = Φ(−β)
    expect(breitung(3, [0, 0])).toBe(normalSf(3));
    expect(tvedt(3, [0, 0])).toBeCloseTo(normalSf(3), 18);
    expect(hohenbichlerRackwitz(3, [0])).toBe(normalSf(3));
    expect(breitung(3, [-0.4])).toBeNull();
    expect(tvedt(3, [-0.4])).toBeNull();
  });
});

describe('SORM at the FORM design point', () => {
  it('recovers the paraboloid curvatures and formulas (n = 10, κ = 0.1)', () => {
    const p = paraboloid({ n: 10, beta: 3, kappa: 0.1 });
    const f = form(p);
    expect(f.beta).toBeCloseTo(3, 8);
    const s = sorm(p, f);
    expect(s.curvatures).toHaveLength(9);
    for (const k of s.curvatures) expect(k).toBeCloseTo(0.1, 6);
    // source: docs/verification.md §R1d row n = 10, β = 3, κ = 0.1
    expectDigits(s.breitung, 4.1453e-4, 5);
    expectDigits(s.hohenbichlerRackwitz, 3.7623e-4, 5);
    expectDigits(s.tvedt, 3.47692e-4, 5);
    expect(s.used).toBe('tvedt');
    expect(s.pf).toBe(s.tvedt);
    expect(normalSf(s.beta) / s.pf).toBeCloseTo(1, 10); // generalised β = −Φ⁻¹(pf)
    expect(s.calls).toBe(2 * 10 * 10 + 1);
    expect(s.warnings.join(' ')).toMatch(/differ by/); // 19 % spread between Breitung and Tvedt
  });

  it('negative curvature: n = 2, β = 3, κ = −0.1', () => {
    const p = paraboloid({ n: 2, beta: 3, kappa: -0.1 });
    const s = sorm(p, form(p));
    expect(s.curvatures[0]).toBeCloseTo(-0.1, 6);
    // source: docs/verification.md §R1d row n = 2, β = 3, κ = −0.1
    expectDigits(s.tvedt, 1.63626e-3, 5);
  });

  it('a linear limit state has zero curvature, SORM = FORM', () => {
    // source: docs/verification.md §R1a (linear in normals)
    const p = resistanceMinusLoad({ r: { dist: 'normal', mean: 200, sd: 20 }, s: { dist: 'normal', mean: 100, sd: 25 } });
    const f = form(p);
    const s = sorm(p, f);
    expect(Math.abs(s.curvatures[0])).toBeLessThan(1e-5);
    expect(s.pf / f.pf).toBeCloseTo(1, 4);
  });

  it('§R2a Haldar & Mahadevan beam, both normal: Breitung 1.08623e-5, κ = −0.0294', () => {
    const p = steelBeam({ fy: { dist: 'normal', mean: 38, cov: 0.1 }, z: { dist: 'normal', mean: 54, cov: 0.05 } });
    const s = sorm(p, form(p));
    // from memory: data of Haldar & Mahadevan 2000 ch. 7; Breitung value computed in docs/verification.md §R2a
    expect(s.curvatures[0]).toBeCloseTo(-0.0294, 4);
    expectDigits(s.breitung, 1.08623e-5, 4);
  });

  it('§R2b short column: curvatures and the three SORM estimates', () => {
    const p = shortColumn({});
    const s = sorm(p, form(p));
    // from memory: Der Kiureghian 2005 data; curvatures and SORM values computed in docs/verification.md §R2b
    expect(s.curvatures[0]).toBeCloseTo(-0.15474, 4);
    expect(s.curvatures[1]).toBeCloseTo(-0.0398998, 4);
    expect(Math.abs(s.curvatures[2])).toBeLessThan(1e-4);
    expectDigits(s.breitung, 9.14847e-3, 4);
    expectDigits(s.hohenbichlerRackwitz, 9.6154e-3, 4);
    expectDigits(s.tvedt, 9.42193e-3, 4);
  });

  it('warns when β·κ <= −1 at a saddle design point', () => {
    // common practice: Breitung needs 1 + βκ > 0
    const p = paraboloid({ n: 2, beta: 3, kappa: -0.4 });
    const saddle: FormResult = { ...form(resistanceMinusLoad({ r: { dist: 'normal', mean: 3, sd: 1 }, s: { dist: 'normal', mean: 0, sd: 1e-9 } })) };
    const at: FormResult = { ...saddle, beta: 3, pf: normalSf(3), designPointU: [0, 3], alpha: [0, 1], gradientU: [0, -1], converged: true };
    const s = sorm(p, at);
    expect(s.curvatures[0]).toBeCloseTo(-0.4, 6);
    expect(s.breitung).toBeNull();
    expect(s.tvedt).toBeNull();
    expect(s.warnings.join(' ')).toMatch(/β·κ <= −1/);
  });

  it('principal curvatures of a rotated quadratic form', () => {
    // common practice: rotation invariance of eigenvalues; α = (1, 1)/√2, Hessian diag(0.2, 0.2) → κ = 0.2/|∇G|
    const k = principalCurvatures([[0.2, 0], [0, 0.2]], [Math.SQRT1_2, Math.SQRT1_2], 2);
    expect(k[0]).toBeCloseTo(0.1, 12);
    const k3 = principalCurvatures([[1, 2, 0], [2, 1, 0], [0, 0, 5]], [0, 0, 1], 1);
    expect(k3[0]).toBeCloseTo(-1, 10);
    expect(k3[1]).toBeCloseTo(3, 10);
  });
});
