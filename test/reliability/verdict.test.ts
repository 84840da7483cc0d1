import { describe, expect, it } from 'vitest';
import { verdict } from '../../src/reliability/verdict.js';
import { form } from '../../src/reliability/form.js';
import { sorm } from '../../src/reliability/sorm.js';
import { monteCarlo } from '../../src/reliability/monteCarlo.js';
import { importanceSampling, importanceSamplingAtDesignPoint } from '../../src/reliability/importanceSampling.js';
import { subsetSimulation } from '../../src/reliability/subsetSimulation.js';
import { linearSum, paraboloid, resistanceMinusLoad } from '../../src/reliability/testProblems.js';
import type { ReliabilityProblem } from '../../src/reliability/types.js';

describe('verdict', () => {
  it('§R1a: everything agrees and the least uncertain simulation is trusted', async () => {
    // source: docs/verification.md §R1a (linear in normals: FORM is exact)
    const p = resistanceMinusLoad({ r: { dist: 'normal', mean: 200, sd: 20 }, s: { dist: 'normal', mean: 100, sd: 25 } });
    const f = form(p);
    const s = sorm(p, f);
    const is = await importanceSamplingAtDesignPoint(p, f, { samples: 4000, seed: 1 });
    const mc = await monteCarlo(p, { samples: 100_000, seed: 1 });
    const v = verdict({ form: f, sorm: s, is, mc });
    expect(v.agree).toBe(true);
    expect(v.trust).toBe('is');
    expect(v.reference).toBe('is');
    expect(v.reason).toMatch(/^All 4 estimates agree within their uncertainty \(largest Δβ = 0\.\d\d\)/);
    expect(v.material).toBe(false);
    expect(v.comparisons.map((c) => c.method)).toEqual(['form', 'sorm', 'mc', 'is']);
  });

  it('§R1d n = 10: FORM is off but SORM agrees with IS', async () => {
    // source: docs/verification.md §R1d (FORM 1.35e-3, Tvedt 3.48e-4, exact 3.53e-4)
    const p = paraboloid({ n: 10, beta: 3, kappa: 0.1 });
    const f = form(p);
    const is = await importanceSamplingAtDesignPoint(p, f, { samples: 20_000, seed: 2 });
    const v = verdict({ form: f, sorm: sorm(p, f), is });
    expect(v.agree).toBe(false);
    expect(v.trust).toBe('is');
    expect(v.comparisons.find((c) => c.method === 'sorm')?.consistent).toBe(true);
    expect(v.reason).toMatch(/FORM \(β = \d\.\d\d\) differs from IS .* by Δβ = \d\.\d\d but SORM \(β = \d\.\d\d\) agrees: curvature matters/);
    expect(v.material).toBe(true);
  });

  it('§R1d n = 100: FORM and SORM both fail, subset simulation is trusted', () => {
    // source: docs/verification.md §R1d last row (all asymptotic formulas fail; exact 1.07966e-5)
    const p = paraboloid({ n: 100, beta: 2, kappa: 0.05 });
    const f = form(p, { restarts: 0 });
    const sub = subsetSimulation(p, { seed: 3, samplesPerLevel: 4000 });
    expect(sub.cov).toBeLessThan(0.3);
    const v = verdict({ form: f, sorm: sorm(p, f), subset: sub });
    expect(v.agree).toBe(false);
    expect(v.trust).toBe('subset');
    expect(v.reason).toMatch(/FORM and SORM differ from subset simulation/);
  });

  it('MC without failures is only an upper bound', async () => {
    // source: docs/verification.md §R1c2 (pf 2.87e-7, far below what 20 000 samples can see)
    const p = linearSum({ n: 3, beta: 5 });
    const f = form(p);
    const mc = await monteCarlo(p, { samples: 20_000, seed: 1 });
    expect(mc.failures).toBe(0);
    const v = verdict({ form: f, sorm: sorm(p, f), mc });
    expect(v.trust).toBe('sorm');
    expect(v.agree).toBe(true);
    expect(v.reason).toMatch(/MC has 0 failures in 20000 samples: it only bounds pf .*β ≥ 3\.\d\d.*SORM \(β = 5\.\d\d\) lies below it/);
  });

  it('FORM and SORM alone: a large difference means curvature matters', () => {
    // source: docs/verification.md §R1d row n = 10 (FORM 1.35e-3 vs SORM 3.5e-4)
    const p = paraboloid({ n: 10, beta: 3, kappa: 0.1 });
    const f = form(p);
    const v = verdict({ form: f, sorm: sorm(p, f) });
    expect(v.agree).toBe(false);
    expect(v.trust).toBe('sorm');
    expect(v.reason).toMatch(/FORM β = 3\.00, SORM β = 3\.\d\d differ by Δβ = 0\.\d\d: curvature matters, trust SORM/);
  });

  it('IS centred on one of two design points disagrees with MC: trust MC', async () => {
    // common practice: a symmetric series system has pf = 2Φ(−3); IS at one point sees half of it
    const p: ReliabilityProblem = {
      names: ['a', 'b'],
      transform: { n: 2, toPhysical: (u, x) => x.set(u), toStandard: (x, u) => u.set(x) },
      g: (x) => 3 - Math.abs(x[0]),
    };
    const mc = await monteCarlo(p, { samples: 200_000, seed: 5 });
    const is = await importanceSampling(p, [3, 0], { samples: 20_000, seed: 5 });
    const v = verdict({ mc, is });
    expect(v.agree).toBe(false);
    expect(v.trust).toBe('mc');
    expect(v.reason).toMatch(/IS may have missed a failure region/);
  });

  it('a significant but small difference is immaterial; across the target it matters', () => {
    // common practice: a linear limit state in normals, FORM exact; IS with a tiny CoV and a pf 20 % off (beyond the 10 % floor)
    const f = { beta: 3, pf: 1.3499e-3, converged: true, system: { pf: 1.3499e-3, designPoints: [{}] } } as unknown as Parameters<typeof verdict>[0]['form'];
    const is = { pf: 1.3499e-3 * 1.2, cov: 0.005, failures: 40_000, samples: 1e6 } as unknown as Parameters<typeof verdict>[0]['is'];
    const v = verdict({ form: f, is });
    expect(v.agree).toBe(false); // 20 % apart at a 0.5 % CoV: beyond 3 σ and the floor
    expect(v.material).toBe(false); // Δβ ≈ 0.06
    expect(v.reason).toMatch(/by Δβ = 0\.0[56].*too little to change the verdict/);
    const across = verdict({ form: f, is }, { target: 2.99 }); // IS β ≈ 2.95 lies below the target, FORM above
    expect(across.material).toBe(true);
    expect(across.reason).toMatch(/FORM \(β = 3\.00\) differs from IS/);
  });

  it('one method alone never reads as agreement', async () => {
    const p = resistanceMinusLoad({ r: { dist: 'normal', mean: 200, sd: 20 }, s: { dist: 'normal', mean: 100, sd: 25 } });
    const mc = await monteCarlo(p, { samples: 100_000, seed: 1 });
    const v = verdict({ mc });
    expect(v.reason).toMatch(/^Only MC/);
    expect(v.reason).not.toMatch(/agree/);
  });

  it('an estimate at pf = 1 within its uncertainty is named, not read as Δβ = ∞ (or NaN)', () => {
    // common practice: failure nearly certain (a valid generated scenario, bench/validScenarios.ts): IS at the
    // design point saturates at pf = 1 with a wide CoV, MC gives 0.9775 with a narrow one
    const mc = { pf: 0.9775, cov: 0.0034, failures: 1955, samples: 2000 } as unknown as Parameters<typeof verdict>[0]['mc'];
    const is = { pf: 1, cov: 0.29, failures: 400, samples: 400 } as unknown as Parameters<typeof verdict>[0]['is'];
    const v = verdict({ mc, is });
    expect(v.reason).not.toMatch(/NaN|Infinity/);
    expect(v.reason).toMatch(/IS gives pf = 1 within its uncertainty/);
  });
});

