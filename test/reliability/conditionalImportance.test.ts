// Failure given a survived proof load, P(g ≤ 0 | h > 0), by importance sampling
// (src/reliability/conditionalImportance.ts): against the direct integral for linear margins,
// against a long crude Monte Carlo for a curved g, and as the check of conditional FORM.
import { describe, expect, it } from 'vitest';
import { conditionalForm, conditionalMonteCarlo, type ConditionedProblem } from '../../src/reliability/conditionalFailure.js';
import { conditionalImportance, CONDITIONAL_IS_TARGET_COV, importanceCheck, jointDesignPoint } from '../../src/reliability/conditionalImportance.js';
import { checkedLimitState } from '../../src/reliability/checkedLimitState.js';
import { natafTransform } from '../../src/probability/nataf.js';
import { makeDistribution } from '../../src/probability/makeDistribution.js';
import { normalCdf, normalPdf } from '../../src/probability/normal.js';

/** A tighter target than the default, so that 4 standard errors make a sharp test. */
const TEST_COV = 0.03;

/** R ~ N(μR, σR) shared by both margins, load S ~ N(μS, σS) in g, fixed proof load p in h. */
function proofProblem(muR: number, sdR: number, muS: number, sdS: number, p: number): ConditionedProblem {
  const names = ['R', 'S'];
  const dists = [makeDistribution({ dist: 'normal', mean: muR, sd: sdR }), makeDistribution({ dist: 'normal', mean: muS, sd: sdS })];
  return { names, transform: natafTransform(dists, null, names), g: (x) => x[0] - x[1], h: (x) => x[0] - p };
}

/**
 * common practice: P(R − S ≤ 0 | R > p) = ∫_p^∞ f_R(r) P(S ≥ r) dr / P(R > p) for independent
 * normal R and S, by the trapezoidal rule on a fine grid (independent of the bivariate-normal code).
 */
function exactConditional(muR: number, sdR: number, muS: number, sdS: number, p: number): number {
  const steps = 200_000;
  const hi = muR + 12 * sdR;
  const dr = (hi - p) / steps;
  let joint = 0;
  for (let i = 0; i <= steps; i++) {
    const r = p + i * dr;
    joint += (i === 0 || i === steps ? 0.5 : 1) * (normalPdf((r - muR) / sdR) / sdR) * normalCdf(-(r - muS) / sdS) * dr;
  }
  return joint / normalCdf((muR - p) / sdR);
}

describe('importance sampling of P(failure | survived), linear margins', () => {
  // R ~ N(1000, 120), S ~ N(450, 80): β_g = 550/√(120² + 80²) = 3.81, g's design point at
  // R* = 1000 − 120·(120/144.2)·3.81 ≈ 620 (common practice: the design point of a linear margin)
  const muR = 1000, sdR = 120, muS = 450, sdS = 80;

  it('(a) a proof below the design-point resistance: centred at g’s design point, within 4 standard errors of the integral', () => {
    const p = 550;
    const prob = proofProblem(muR, sdR, muS, sdS, p);
    const r = conditionalImportance(prob, conditionalForm(prob), { seed: 7 })!;
    const exact = exactConditional(muR, sdR, muS, sdS, p);
    expect(exact).toBeLessThan(1e-4); // the small probabilities crude sampling cannot see
    expect(r.centre).toBe('failure_design_point');
    expect(r.cov).toBeLessThanOrEqual(CONDITIONAL_IS_TARGET_COV);
    expect(r.reachedTarget).toBe(true);
    expect(Math.abs(r.pf - exact)).toBeLessThan(4 * r.cov * r.pf);
    const sharp = conditionalImportance(prob, conditionalForm(prob), { seed: 7, targetCov: TEST_COV })!;
    expect(sharp.cov).toBeLessThanOrEqual(TEST_COV);
    expect(Math.abs(sharp.pf - exact)).toBeLessThan(4 * sharp.cov * sharp.pf);
    expect(r.survival.method).toBe('mc'); // P(R > 550) ≈ 1: crude sampling of the survival suffices
    expect(importanceCheck(conditionalForm(prob).beta, r)!.agrees).toBe(true); // FORM is exact for linear margins
  });

  it('(b) a proof above the design-point resistance cuts into g’s failure domain: centred at the joint design point', () => {
    const p = 750;
    const prob = proofProblem(muR, sdR, muS, sdS, p);
    const f = conditionalForm(prob);
    const r = conditionalImportance(prob, f, { seed: 7, targetCov: TEST_COV })!;
    const exact = exactConditional(muR, sdR, muS, sdS, p);
    expect(exact).toBeLessThan(1e-5);
    expect(r.centre).toBe('joint_design_point');
    expect(r.centreConverged).toBe(true);
    // common practice: for linear margins the nearest point of {R ≤ S, R ≥ p} lies on both lines,
    // R = S = p: u_R = (p − μR)/σR, u_S = (p − μS)/σS (it is nearer than g's own design point, which h excludes)
    expect(r.centreU[0]).toBeCloseTo((p - muR) / sdR, 6);
    expect(r.centreU[1]).toBeCloseTo((p - muS) / sdS, 6);
    expect(r.cov).toBeLessThanOrEqual(TEST_COV);
    expect(Math.abs(r.pf - exact)).toBeLessThan(4 * r.cov * r.pf);
    // FORM with the bivariate normal is exact for linear margins (Ditlevsen & Madsen 1996, ch. 9 / Madsen, Krenk & Lind 1986, ch. 5)
    expect(Math.abs(f.pf / exact - 1)).toBeLessThan(1e-5);
    expect(importanceCheck(f.beta, r)!.agrees).toBe(true);
  });

  it('an unlikely survival (P(h > 0) < 0.05) is itself estimated by importance sampling at h’s design point', () => {
    const S = { mu: 800, sd: 100 };
    const p = 1200; // P(R > 1200) = Φ(−1.67) = 0.048
    const prob = proofProblem(muR, sdR, S.mu, S.sd, p);
    const r = conditionalImportance(prob, conditionalForm(prob), { seed: 7, targetCov: TEST_COV })!;
    const exact = exactConditional(muR, sdR, S.mu, S.sd, p);
    expect(r.survival.method).toBe('is');
    // source: P(R > p) = Φ((μR − p)/σR) for a normal R
    const pS = normalCdf((muR - p) / sdR);
    expect(Math.abs(r.survival.p - pS)).toBeLessThan(4 * r.survival.cov * r.survival.p);
    expect(r.cov).toBeLessThanOrEqual(TEST_COV);
    expect(Math.abs(r.pf - exact)).toBeLessThan(4 * r.cov * r.pf);
  });

  it('the joint design point of two linear limit states in one step, wherever the search starts', () => {
    // common practice: nearest point of the intersection of two half-planes in the standard normal plane
    const names = ['a', 'b'];
    const dists = names.map(() => makeDistribution({ dist: 'normal', mean: 0, sd: 1 }));
    const problem = { names, transform: natafTransform(dists, null, names), g: (x: Float64Array) => 3 - x[0] - x[1], h: (x: Float64Array) => 1 - x[0] };
    const G = checkedLimitState(problem, 'test');
    const H = checkedLimitState({ ...problem, g: problem.h }, 'test');
    // g alone: (1.5, 1.5), which h excludes; both active: x0 = 1, x1 = 2
    const r = jointDesignPoint(G, H, [1.5, 1.5]);
    expect(r.converged).toBe(true);
    expect(r.u[0]).toBeCloseTo(1, 8);
    expect(r.u[1]).toBeCloseTo(2, 8);
  });
});

describe('importance sampling of P(failure | survived), a curved g', () => {
  // g = β − v1 − (κ/2)·v2² with v1 = (u_S − u_R)/√2, v2 = (u_R + u_S)/√2: a parabola curving
  // towards the origin at g's design point, so FORM underestimates pf (Breitung 1984: the factor
  // 1/√(1 − βκ) = 2.8 here); the survival h = u_R + 1.5 cuts into g's design point.
  const beta = 3, kappa = 0.25;
  const names = ['R', 'S'];
  const dists = names.map(() => makeDistribution({ dist: 'normal', mean: 0, sd: 1 }));
  const prob: ConditionedProblem = {
    names,
    transform: natafTransform(dists, null, names),
    g: (x) => {
      const v1 = (x[1] - x[0]) / Math.SQRT2;
      const v2 = (x[0] + x[1]) / Math.SQRT2;
      return beta - v1 - 0.5 * kappa * v2 * v2;
    },
    h: (x) => x[0] + 1.5,
  };

  it('(c) agrees with a long crude Monte Carlo within 4σ of both, and the check reports FORM’s error', () => {
    const f = conditionalForm(prob);
    const r = conditionalImportance(prob, f, { seed: 7, targetCov: TEST_COV })!;
    // reference: crude Monte Carlo, 2 000 000 seeded samples (its own stream range)
    const mc = conditionalMonteCarlo(prob, { samples: 2_000_000, seed: 5 });
    expect(mc.failures).toBeGreaterThan(1000);
    const sigma = Math.hypot(r.cov * r.pf, mc.cov * mc.pf);
    expect(Math.abs(r.pf - mc.pf)).toBeLessThan(4 * sigma);
    expect(r.cov).toBeLessThanOrEqual(TEST_COV);
    // at the default target as well
    const quick = conditionalImportance(prob, f, { seed: 7 })!;
    expect(quick.cov).toBeLessThanOrEqual(CONDITIONAL_IS_TARGET_COV);
    expect(Math.abs(quick.pf - mc.pf)).toBeLessThan(4 * Math.hypot(quick.cov * quick.pf, mc.cov * mc.pf));
    // FORM's β is visibly off (the reference is more than 0.3 lower) and the check says so
    expect(f.beta - mc.beta).toBeGreaterThan(0.3);
    const c = importanceCheck(f.beta, quick)!;
    expect(c.agrees).toBe(false);
    expect(c.method).toBe('is');
    expect(c.estimate.beta).toBe(quick.beta);
    expect(c.reason).toMatch(/disagrees with FORM/);
  });

  it('(d) same seed, same numbers; another seed, other numbers', () => {
    const f = conditionalForm(prob);
    const a = conditionalImportance(prob, f, { seed: 11 })!;
    const b = conditionalImportance(prob, f, { seed: 11 })!;
    const c = conditionalImportance(prob, f, { seed: 12 })!;
    expect(b).toEqual(a);
    expect(c.pf).not.toBe(a.pf);
  });

  it('stops at a tighter target CoV when asked, with more samples', () => {
    const f = conditionalForm(prob);
    const loose = conditionalImportance(prob, f, { seed: 3 })!;
    const tight = conditionalImportance(prob, f, { seed: 3, targetCov: TEST_COV })!;
    expect(tight.cov).toBeLessThanOrEqual(TEST_COV);
    expect(tight.samples).toBeGreaterThan(loose.samples);
  });
});

describe('no sample in the joint domain', () => {
  it('gives no estimate, and no importance-sampling check (the Monte Carlo check then decides)', () => {
    // common practice: R ~ N(1000, 150) that survived 700 cannot fail under a fixed 600: the joint domain is empty
    const names = ['R'];
    const prob: ConditionedProblem = {
      names, transform: natafTransform([makeDistribution({ dist: 'normal', mean: 1000, sd: 150 })], null, names),
      g: (x) => x[0] - 600, h: (x) => x[0] - 700,
    };
    const r = conditionalImportance(prob, conditionalForm(prob), { seed: 1, maxSamples: 5000 })!;
    expect(r.joint.hits).toBe(0);
    expect(r.pf).toBe(0);
    expect(r.cov).toBe(Infinity);
    expect(r.reachedTarget).toBe(false);
    expect(importanceCheck(5, r)).toBeUndefined();
  });
});
