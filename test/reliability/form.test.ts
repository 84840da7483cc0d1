import { describe, expect, it } from 'vitest';
import { form } from '../../src/reliability/form.js';
import { LimitStateError } from '../../src/reliability/limitStateError.js';
import {
  eulerColumn, linearSum, misbehaving, resistanceMinusLoad, resistanceModelLoad, shortColumn, steelBeam,
} from '../../src/reliability/testProblems.js';
import { normalSf } from '../../src/probability/normal.js';
import type { ReliabilityProblem } from '../../src/reliability/types.js';
import { makeDistribution } from '../../src/probability/makeDistribution.js';
import { natafTransform } from '../../src/probability/nataf.js';

/** |a − e| within half a unit of the last of `digits` significant digits of e. */
function expectDigits(actual: number, expected: number, digits = 6): void {
  const unit = 10 ** (Math.floor(Math.log10(Math.abs(expected))) - (digits - 1));
  expect(Math.abs(actual - expected), `${actual} vs ${expected}`).toBeLessThanOrEqual(0.5 * unit * 1.0001);
}

const R_A = { dist: 'normal', mean: 200, sd: 20 } as const;
const S_A = { dist: 'normal', mean: 100, sd: 25 } as const;
const R_B = { dist: 'lognormal', mean: 200, cov: 0.1 } as const;
const S_B = { dist: 'lognormal', mean: 100, cov: 0.25 } as const;

describe('FORM on closed-form oracles', () => {
  it('§R1a R − S normal: β, pf, design point, α', () => {
    const r = form(resistanceMinusLoad({ r: R_A, s: S_A }));
    // source: Cornell 1969; Hasofer & Lind 1974 — docs/verification.md §R1a
    expectDigits(r.beta, 3.12348);
    expectDigits(r.pf, 8.93645e-4);
    expectDigits(r.designPointX[0], 160.976);
    expectDigits(r.designPointX[1], 160.976);
    expectDigits(r.alpha[0], -0.624695);
    expectDigits(r.alpha[1], 0.780869);
    expect(r.converged).toBe(true);
    expect(r.importance[0] + r.importance[1]).toBeCloseTo(1, 12);
    expect(r.gamma[0]).toBeCloseTo(r.alpha[0], 6); // common practice: γ = α for independent variables
    expect(r.multipleDesignPoints).toBe(false);
    expect(r.originFails).toBe(false);
    expect(r.g0).toBeCloseTo(100, 9);
    expect(r.history[0]).toEqual({ iteration: 0, beta: 0, g: r.g0, step: 0 });
    expect(r.history.length).toBe(r.iterations + 1);
    expect(r.calls).toBeGreaterThan(0);
  });

  it('§R1b R − S lognormal: β 2.70453, design point and α', () => {
    // source: Melchers 1999 ch. 3 lognormal safety margin (from memory) — docs/verification.md §R1b
    const r = form(resistanceMinusLoad({ r: R_B, s: S_B }));
    expectDigits(r.beta, 2.70453);
    expectDigits(r.pf, 3.42004e-3);
    expectDigits(r.designPointX[0], 179.836);
    expectDigits(r.alpha[0], -0.375486);
    expectDigits(r.alpha[1], 0.926828);
  });

  it('§R1e R·θ − S lognormal: β 2.65330', () => {
    // source: Nowak & Collins 2000 ch. 5 (from memory) — docs/verification.md §R1e
    const r = form(resistanceModelLoad({ r: R_B, theta: { dist: 'lognormal', mean: 1, cov: 0.05 }, s: S_B }));
    expectDigits(r.beta, 2.6533);
    expectDigits(r.designPointX[0], 180.49);
    expectDigits(r.designPointX[1], 0.974572);
    expectDigits(r.designPointX[2], 175.9);
    expectDigits(r.alpha[0], -0.369015);
    expectDigits(r.alpha[1], -0.184852);
    expectDigits(r.alpha[2], 0.910856);
  });

  it('§R1f correlated normal pairs: β 4.36436 (ρ = +0.5) and 2.56074 (ρ = −0.5)', () => {
    // source: Hasofer & Lind 1974 second-moment theory — docs/verification.md §R1f1, §R1f2
    expectDigits(form(resistanceMinusLoad({ r: R_A, s: S_A, rho: 0.5 })).beta, 4.36436);
    expectDigits(form(resistanceMinusLoad({ r: R_A, s: S_A, rho: -0.5 })).beta, 2.56074);
  });

  it('§R1f3/f4 correlated lognormals through Nataf: β 3.35983 and 2.32214', () => {
    // source: Liu & Der Kiureghian 1986 (from memory) — docs/verification.md §R1f3, §R1f4
    expectDigits(form(resistanceMinusLoad({ r: R_B, s: S_B, rho: 0.5 })).beta, 3.35983);
    expectDigits(form(resistanceMinusLoad({ r: R_B, s: S_B, rho: -0.5 })).beta, 2.32214);
  });

  it('§R1g Euler column with uncertain K: β 3.40057, design point and α', () => {
    // source: docs/verification.md §R1g (exact: ln(Pcr/P) linear in the log-variables)
    const r = form(eulerColumn({ length: 5 }));
    expectDigits(r.beta, 3.40057);
    expectDigits(r.pf, 3.36223e-4);
    const alpha = [-0.0829564, -0.110589, 0.82514, 0.547752];
    alpha.forEach((a, i) => expectDigits(r.alpha[i], a));
    expectDigits(r.designPointX[0], 208.137e9);
    expectDigits(r.designPointX[1], 1.97153e-5);
    expectDigits(r.designPointX[2], 1.27751);
    expectDigits(r.designPointX[3], 992.63e3);
  });

  it('§R1c linear in 100 normals: β = 3.5, u*_i = 0.35', () => {
    // source: docs/verification.md §R1c1
    const r = form(linearSum({ n: 100, beta: 3.5 }), { restarts: 0 });
    expect(r.beta).toBeCloseTo(3.5, 7);
    for (const u of r.designPointU) expect(u).toBeCloseTo(0.35, 7);
  });
});

describe('FORM on textbook examples', () => {
  it('§R2a Haldar & Mahadevan steel beam: 4.261 (normals), 5.151 (lognormal Fy)', () => {
    const z = { dist: 'normal', mean: 54, cov: 0.05 } as const;
    const normal = form(steelBeam({ fy: { dist: 'normal', mean: 38, cov: 0.1 }, z }));
    // from memory: Haldar & Mahadevan 2000 ch. 7, published 4.261; computed 4.26135 (docs/verification.md §R2a)
    expectDigits(normal.beta, 4.261, 4);
    expectDigits(normal.beta, 4.26135);
    expectDigits(normal.designPointX[0], 22.5655);
    expectDigits(normal.designPointX[1], 50.5195);
    const logFy = form(steelBeam({ fy: { dist: 'lognormal', mean: 38, cov: 0.1 }, z }));
    // from memory: Haldar & Mahadevan 2000 ch. 7, published 5.151; computed 5.15079 (docs/verification.md §R2a)
    expectDigits(logFy.beta, 5.151, 4);
    expectDigits(logFy.beta, 5.15079);
    expectDigits(logFy.alpha[0], -0.866876);
    expectDigits(logFy.alpha[1], -0.498524);
  });

  it('§R2b Der Kiureghian 2005 short column: β 2.46602, design point, α, γ', () => {
    const r = form(shortColumn({}));
    // from memory: Der Kiureghian 2005 ch. 14 publishes 2.47; computed 2.46602 (docs/verification.md §R2b)
    expectDigits(r.beta, 2.46602);
    expectDigits(r.pf, 6.83116e-3);
    [340.726e3, 170.363e3, 3222.41e3, 31.7692e6].forEach((x, i) => expectDigits(r.designPointX[i], x));
    // α and γ to 5 digits: they move with the Nataf ρ0 quadrature at the 1e-7 level
    [0.490537, 0.283211, 0.381173, -0.730665].forEach((a, i) => expectDigits(r.alpha[i], a, 5));
    [0.268429, 0.268429, 0.45114, -0.807691].forEach((g, i) => expectDigits(r.gamma[i], g, 5));
    expect(r.gamma[0]).toBeCloseTo(r.gamma[1], 7); // M1/S1 and M2/S2 are exchangeable
  });

  it('§R2b permuting the variables leaves β and γ unchanged, but not α', () => {
    // source: Der Kiureghian 2005 ch. 14 (γ is order-free; from memory) — docs/verification.md §R2b
    const base = form(shortColumn({}));
    const order = [3, 2, 1, 0];
    const permuted = form(shortColumn({ order }));
    expect(permuted.beta).toBeCloseTo(base.beta, 7);
    order.forEach((k, i) => {
      expect(permuted.gamma[i]).toBeCloseTo(base.gamma[k], 6);
      expect(permuted.designPointX[i] / base.designPointX[k]).toBeCloseTo(1, 6);
    });
    const alphaMoved = order.some((k, i) => Math.abs(permuted.alpha[i] - base.alpha[k]) > 1e-3);
    expect(alphaMoved).toBe(true);
  });
});

describe('FORM special cases', () => {
  it('reports a failing origin with a negative β and pf > ½', () => {
    // common practice: β = −‖u*‖ when g(0) < 0; here g = R − S with mean R < mean S, exact normal result
    const r = form(resistanceMinusLoad({ r: S_A, s: R_A }));
    expect(r.originFails).toBe(true);
    expect(r.beta).toBeCloseTo(-3.12348, 5);
    expect(r.pf).toBeCloseTo(1 - 8.93645e-4, 8);
    expect(r.warnings.join(' ')).toMatch(/already fails/);
    expect(r.alpha[0] ** 2 + r.alpha[1] ** 2).toBeCloseTo(1, 10);
  });

  it('flags two design points of a series system (g = 3 − |u1|)', () => {
    // common practice: symmetric series system, design points at u1 = ±3, exact pf = 2Φ(−3)
    const problem: ReliabilityProblem = {
      names: ['a', 'b'],
      transform: { n: 2, toPhysical: (u, x) => x.set(u), toStandard: (x, u) => u.set(x) },
      g: (x) => 3 - Math.abs(x[0] + 0.1) + 0.01 * x[1] * x[1],
    };
    // nothing is doubtful at the origin (the kink is at u1 = −0.1): the default makes no blind restart
    const quick = form(problem);
    expect(quick.converged).toBe(true);
    expect(quick.multipleDesignPoints).toBe(false);
    expect(quick.beta).toBeCloseTo(2.9, 6);
    // the full restart scan (`thorough`) finds the mirror point
    const r = form(problem, { thorough: true });
    expect(r.converged).toBe(true);
    expect(r.calls).toBeGreaterThan(quick.calls);
    expect(r.multipleDesignPoints).toBe(true);
    expect(r.otherDesignPoints.length).toBe(1);
    expect(Math.sign(r.otherDesignPoints[0].designPointU[0])).toBe(-Math.sign(r.designPointU[0]));
    // the nearer point (u1 = +2.9) is the one reported
    expect(r.beta).toBeCloseTo(2.9, 6);
    expect(r.otherDesignPoints[0].beta).toBeCloseTo(3.1, 6);
    // forward differences (step h = 3e-7) move the converged point by O(h): pf to 1e-8 relative, not to rounding
    expect(Math.abs(r.pf / normalSf(2.9) - 1)).toBeLessThan(1e-8);
  });

  it('a gradient vanishing at the origin is searched again along that direction (g = 2 − u1²)', () => {
    // common practice: design points at u1 = ±√2, found from starting points off the origin
    const problem: ReliabilityProblem = {
      names: ['a', 'b'],
      transform: { n: 2, toPhysical: (u, x) => x.set(u), toStandard: (x, u) => u.set(x) },
      g: (x) => 2 - x[0] * x[0],
    };
    const r = form(problem);
    expect(r.converged).toBe(true);
    expect(r.beta).toBeCloseTo(Math.SQRT2, 7);
    expect(r.multipleDesignPoints).toBe(true);
    expect(r.doubtfulDirections).toContain('a');
    expect(r.warnings.join(' ')).toMatch(/gradient of g vanishes or changes sign along a/);
    // without curvature and with central differences the search from the origin cannot start: the restarts rescue it
    const plain = form(problem, { differences: 'central', curvature: false });
    expect(plain.beta).toBeCloseTo(Math.SQRT2, 7);
    expect(plain.warnings.join(' ')).toMatch(/gradient of g vanished.*a restart converged/);
  });

  it('says when it did not converge', () => {
    // common practice: a strongly nonlinear g needs more than one iteration
    const r = form(resistanceMinusLoad({ r: R_B, s: S_B }), { maxIterations: 1 });
    expect(r.converged).toBe(false);
    expect(r.reason).toMatch(/no convergence in 1 iterations/);
    expect(r.warnings.join(' ')).toMatch(/did not converge/);
  });

  it('central differences and plain HL-RF reach the same β', () => {
    // source: docs/verification.md §R1b
    const r = form(resistanceMinusLoad({ r: R_B, s: S_B }), { differences: 'central', curvature: false });
    expect(r.beta).toBeCloseTo(2.70453, 4);
    // common practice: the quasi-Newton search with forward differences needs fewer calls for the same point
    const quick = form(resistanceMinusLoad({ r: R_B, s: S_B }));
    expect(quick.beta).toBeCloseTo(r.beta, 7);
    expect(quick.calls).toBeLessThan(r.calls);
  });

  it('throws LimitStateError naming the variables when g returns NaN', () => {
    // common practice: a NaN limit state must never be swallowed
    const p = misbehaving({ mode: 'nan', above: 120 });
    let caught: unknown;
    try {
      form(p);
    } catch (e) {
      caught = e;
    }
    expect(caught).toBeInstanceOf(LimitStateError);
    const e = caught as LimitStateError;
    expect(e.names).toEqual(['R', 'S']);
    expect(e.x[1]).toBeGreaterThan(120);
    expect(e.message).toMatch(/FORM: limit state returned NaN .*S = /);
  });
});

describe('FORM when no design point exists', () => {
  // common practice: X ~ U(0, 1) bounds g = c − X, so with c = 2 g > 0 everywhere (pf = 0) and
  // with c = −1 g < 0 everywhere (pf = 1); neither surface g = 0 exists to find
  const bounded = (c: number): ReliabilityProblem => ({
    names: ['X', 'Y'],
    transform: natafTransform([makeDistribution({ dist: 'uniform', min: 0, max: 1 }), makeDistribution({ dist: 'beta', min: 0, max: 1, mean: 0.5, sd: 0.2 })], null),
    g: (x) => c - x[0] - 0.1 * x[1],
  });
  it('impossible failure: β = +∞, pf = 0, said in a warning', () => {
    const r = form(bounded(2));
    expect(r.beta).toBe(Infinity);
    expect(r.pf).toBe(0);
    expect(r.warnings.join(' ')).toMatch(/no design point/);
    expect(r.gamma.every(Number.isFinite)).toBe(true);
  });
  it('certain failure: a result with pf = 1 (the search stops where the bounded inputs saturate, or β = −∞)', () => {
    const r = form(bounded(-1));
    expect(r.beta).toBeLessThan(-8);
    expect(r.pf).toBe(1);
  });
});

describe('a limit state with no slope where the search stops', () => {
  // common practice: a column that is a mechanism whatever the variables (capacity ~1e-28 N against a fixed
  // load; a valid generated scenario, bench/validScenarios.ts seed 11 no. 24) leaves g flat: importance
  // factors are 0, never 0/0 = NaN in the terminal's α² column
  it('α is finite (0) and FORM says why', () => {
    const transform = natafTransform([makeDistribution({ dist: 'normal', mean: 1, sd: 0.1 }), makeDistribution({ dist: 'normal', mean: 2, sd: 0.1 })], null, ['a', 'b']);
    for (const g of [() => -1, () => 1, (x: Float64Array) => 1e-30 * x[0] - 1]) {
      const r = form({ names: ['a', 'b'], transform, g });
      expect(r.alpha.every(Number.isFinite)).toBe(true);
      expect(r.importance.every(Number.isFinite)).toBe(true);
      expect(Number.isNaN(r.beta)).toBe(false);
      expect(r.warnings.some((w) => /no slope/.test(w))).toBe(true);
    }
  });
});
