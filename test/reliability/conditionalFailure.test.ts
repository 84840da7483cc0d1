// Failure given a survived proof load, P(g ≤ 0 | h > 0), by FORM (two linearised margins and the
// bivariate normal) and by crude Monte Carlo, against closed forms.
import { describe, expect, it } from 'vitest';
import { betaOf, conditionalCheck, conditionalForm, conditionalMonteCarlo, type ConditionalMcResult, type ConditionedProblem } from '../../src/reliability/conditionalFailure.js';
import { natafTransform } from '../../src/probability/nataf.js';
import { makeDistribution } from '../../src/probability/makeDistribution.js';
import { normalCdf, normalPdf } from '../../src/probability/normal.js';

/** R ~ N(μR, σR), load S (fixed or normal), proof load p: g = R − S, h = R − p. */
function proofProblem(muR: number, sdR: number, s: number | { mean: number; sd: number }, proof: number): ConditionedProblem {
  const dists = [makeDistribution({ dist: 'normal', mean: muR, sd: sdR })];
  if (typeof s !== 'number') dists.push(makeDistribution({ dist: 'normal', mean: s.mean, sd: s.sd }));
  const names = typeof s === 'number' ? ['R'] : ['R', 'S'];
  return {
    names,
    transform: natafTransform(dists, null, names),
    g: (x) => x[0] - (typeof s === 'number' ? s : x[1]),
    h: (x) => x[0] - proof,
  };
}

/** 4 standard errors of a proportion p estimated from n trials. */
const fourSigma = (p: number, n: number) => 4 * Math.sqrt((p * (1 - p)) / n);

describe('survived proof load: normal resistance, fixed loads', () => {
  // source: Melchers & Beck, Structural Reliability Analysis and Prediction, 3rd ed. (2018), proof
  // loading: given R > p the resistance is a normal truncated below at p, so for s > p
  // P(R < s | R > p) = (Φ((s − μ)/σ) − Φ((p − μ)/σ)) / (1 − Φ((p − μ)/σ)); for s ≤ p it is 0
  const mu = 1000;
  const sd = 150;
  const truncated = (s: number, p: number) => (s <= p ? 0 : (normalCdf((s - mu) / sd) - normalCdf((p - mu) / sd)) / (1 - normalCdf((p - mu) / sd)));

  it('FORM equals the truncated normal (the margins are linear, so FORM is exact)', () => {
    for (const [s, p] of [[600, 550], [600, 500], [700, 450], [550, 700]]) {
      const r = conditionalForm(proofProblem(mu, sd, s, p));
      const exact = truncated(s, p);
      if (exact === 0) expect(r.pf).toBeLessThan(1e-12);
      else expect(Math.abs(r.pf / exact - 1)).toBeLessThan(1e-6);
      expect(Math.abs(r.rho - 1)).toBeLessThan(1e-9); // common practice: one variable, the two margins coincide in direction
      expect(r.pf).toBeLessThanOrEqual(r.pfBefore); // common practice: surviving can only remove failures here
    }
  });

  it('Monte Carlo agrees with the truncated normal within 4 standard errors', () => {
    const s = 700;
    const p = 600;
    const r = conditionalMonteCarlo(proofProblem(mu, sd, s, p), { samples: 200_000, seed: 11 });
    const exact = truncated(s, p);
    expect(Math.abs(r.pf - exact)).toBeLessThan(fourSigma(exact, r.survived));
    const again = conditionalMonteCarlo(proofProblem(mu, sd, s, p), { samples: 200_000, seed: 11 });
    expect(again.pf).toBe(r.pf); // common practice: same seed, same numbers
  });
});

describe('survived proof load: normal resistance and normal load', () => {
  // common practice: P(R − S ≤ 0, R > p) = ∫_p^∞ f_R(r) P(S ≥ r) dr, integrated here by the
  // trapezoidal rule on a fine grid, independently of the bivariate-normal code
  const muR = 1000, sdR = 120, muS = 550, sdS = 90, p = 800;
  function quadrature(): number {
    let joint = 0;
    const steps = 200_000;
    const hi = muR + 12 * sdR;
    const dr = (hi - p) / steps;
    for (let i = 0; i <= steps; i++) {
      const r = p + i * dr;
      const f = (normalPdf((r - muR) / sdR) / sdR) * normalCdf(-(r - muS) / sdS);
      joint += (i === 0 || i === steps ? 0.5 : 1) * f * dr;
    }
    return joint / normalCdf(-(p - muR) / sdR);
  }
  it('FORM equals the direct integral (both margins linear in u)', () => {
    const r = conditionalForm(proofProblem(muR, sdR, { mean: muS, sd: sdS }, p));
    expect(Math.abs(r.pf / quadrature() - 1)).toBeLessThan(1e-6);
    expect(r.pSurvival).toBeCloseTo(normalCdf((muR - p) / sdR), 8); // source: P(R > p) for a normal R
  });
  it('a survival impossible under the model is refused', () => {
    // common practice: a resistance that can never exceed the proof load contradicts the evidence
    const prob = proofProblem(muR, sdR, 500, 1e5); // the proof load is 825 sd above the mean resistance
    expect(() => conditionalForm(prob)).toThrow(/probability zero/);
  });
});

describe('the Monte Carlo check of a conditional β (the rule of formCheck.ts)', () => {
  const mc = (pf: number, failures: number, survived: number): ConditionalMcResult => ({
    pf, cov: failures > 0 ? Math.sqrt((1 - pf) / (pf * survived)) : Infinity, beta: failures > 0 ? betaOf(pf) : Infinity,
    samples: survived, survived, failures, pfBefore: pf, seed: 1,
  });
  it('agrees inside 4 standard errors plus 0.1 in β and disagrees well outside', () => {
    // 100 failures in 1e6: CoV 10 %, 4σ on ln pf ≈ ±0.4 → β band about ±0.1 around 3.72, widened by 0.1
    const m = mc(1e-4, 100, 1e6);
    expect(conditionalCheck(betaOf(1e-4), m).agrees).toBe(true);
    expect(conditionalCheck(betaOf(1e-4) + 0.15, m).agrees).toBe(true);
    expect(conditionalCheck(betaOf(1e-4) + 0.5, m).agrees).toBe(false);
    expect(conditionalCheck(betaOf(1e-4) - 0.5, m).estimate).toEqual({ beta: m.beta, pf: m.pf, upperBound: false });
  });
  it('with no failure uses the one-sided 95 % bound 1 − 0.05^(1/n) (Clopper & Pearson 1934)', () => {
    const m = mc(0, 0, 100_000);
    const bound = -Math.expm1(Math.log(0.05) / 100_000);
    const c = conditionalCheck(5, m);
    expect(c.agrees).toBe(true);
    expect(c.estimate.upperBound).toBe(true);
    expect(c.estimate.pf).toBeCloseTo(bound, 15);
    // FORM claiming pf ≈ 1e-3, far above what 100 000 clean survivors allow (≈ 3e-5)
    expect(conditionalCheck(betaOf(1e-3), m).agrees).toBe(false);
  });
});

describe('a survival margin that no random variable acts on', () => {
  // common practice: P(F | h > 0) = P(F) when h > 0 everywhere, and a survival that cannot have happened is refused
  const transform = natafTransform([makeDistribution({ dist: 'normal', mean: 100, sd: 10 })], null, ['R']);
  const g = (x: Float64Array) => x[0] - 75;
  it('h > 0 everywhere: the survival was certain, pf is the unconditional one', () => {
    const r = conditionalForm({ names: ['R'], transform, g, h: () => 5 });
    expect(r.pSurvival).toBe(1);
    expect(Math.abs(r.pf / normalCdf(-2.5) - 1)).toBeLessThan(1e-6); // exact: β = (100 − 75)/10 = 2.5, to FORM's tolerance
  });
  it('h ≤ 0 everywhere: refused as impossible', () => {
    expect(() => conditionalForm({ names: ['R'], transform, g, h: () => -5 })).toThrow(/probability zero/);
  });
});
