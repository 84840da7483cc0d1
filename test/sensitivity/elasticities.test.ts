import { describe, expect, it } from 'vitest';
import { betaElasticities, normalFormElasticities, type ParamOverrides } from '../../src/sensitivity/elasticities.js';

// g = R − S, R ~ N(200, 20), S ~ N(100, 25): β = (μR − μS)/√(σR² + σS²) exactly
// (source: Cornell 1969; docs/verification.md §R1a gives β = 3.12348, α = (−0.624695, 0.780869))
const base = { R: { mean: 200, sd: 20 }, S: { mean: 100, sd: 25 } };

function betaOf(overrides: ParamOverrides): number {
  const r = { ...base.R, ...overrides.R };
  const s = { ...base.S, ...overrides.S };
  return (r.mean - s.mean) / Math.hypot(r.sd, s.sd);
}

// exact derivatives of the closed form
const beta = 100 / Math.hypot(20, 25);
const varG = 20 ** 2 + 25 ** 2;
const exact = {
  R: { dMean: 1 / Math.sqrt(varG), dSd: (-beta * 20) / varG },
  S: { dMean: -1 / Math.sqrt(varG), dSd: (-beta * 25) / varG },
};

describe('β elasticities on g = R − S', () => {
  it('reproduces the published β (source: docs/verification.md §R1a, Cornell 1969)', () => {
    expect(beta).toBeCloseTo(3.12348, 5);
  });

  it('finite differences give the exact derivatives and elasticities', () => {
    const out = betaElasticities(['R', 'S'], [base.R, base.S], betaOf);
    expect(out.beta).toBeCloseTo(beta, 12);
    expect(out.calls).toBe(9);
    const [r, s] = out.entries;
    expect(r.dBetaDMean).toBeCloseTo(exact.R.dMean, 9); // linear in μ: central difference exact
    expect(s.dBetaDMean).toBeCloseTo(exact.S.dMean, 9);
    // β is not linear in σ: central differences err by O(h²), h = 0.01 σ → ~1e-5 relative
    const rel = (a: number, b: number): number => Math.abs(a / b - 1);
    expect(rel(r.dBetaDSd, exact.R.dSd)).toBeLessThan(1e-4);
    expect(rel(s.dBetaDSd, exact.S.dSd)).toBeLessThan(1e-4);
    // ... and the error falls ~100-fold with a 10-fold smaller step
    const fine = betaElasticities(['R', 'S'], [base.R, base.S], betaOf, { relStep: 1e-3 });
    expect(rel(fine.entries[0].dBetaDSd, exact.R.dSd)).toBeLessThan(rel(r.dBetaDSd, exact.R.dSd) / 50);
    expect(r.meanElasticity).toBeCloseTo((exact.R.dMean * 200) / beta, 8);
    expect(rel(s.sdElasticity, (exact.S.dSd * 25) / beta)).toBeLessThan(1e-4);
  });

  it('the FORM closed form −α/σ, −β α²/σ agrees (Hohenbichler & Rackwitz 1986, from memory)', () => {
    const alpha = [-0.624695, 0.780869]; // source: docs/verification.md §R1a
    const out = normalFormElasticities(['R', 'S'], [base.R, base.S], beta, alpha);
    expect(out.entries[0].dBetaDMean).toBeCloseTo(exact.R.dMean, 6);
    expect(out.entries[1].dBetaDMean).toBeCloseTo(exact.S.dMean, 6);
    expect(out.entries[0].dBetaDSd).toBeCloseTo(exact.R.dSd, 6);
    expect(out.entries[1].dBetaDSd).toBeCloseTo(exact.S.dSd, 6);
    // a resistance raises β with its mean and lowers it with its scatter
    expect(out.entries[0].meanElasticity).toBeGreaterThan(0);
    expect(out.entries[0].sdElasticity).toBeLessThan(0);
  });
});

describe('β elasticities where a perturbed side does not exist', () => {
  // same closed form as above (source: Cornell 1969; reliability.md §1a); a side returning NaN
  // (parameters outside the variable's support) leaves a one-sided difference
  it('one side NaN: one-sided difference, still close to the exact derivative', () => {
    const noUpperMean = (o: ParamOverrides): number => (o.R?.mean !== undefined && o.R.mean > base.R.mean ? NaN : betaOf(o));
    const out = betaElasticities(['R', 'S'], [base.R, base.S], noUpperMean);
    expect(out.entries[0].dBetaDMean).toBeCloseTo(exact.R.dMean, 9); // β is linear in μ: exact either way
    expect(out.entries[1].dBetaDMean).toBeCloseTo(exact.S.dMean, 9);
  });
  it('both sides NaN, or β infinite: NaN, not an exception', () => {
    const none = (o: ParamOverrides): number => (o.R !== undefined ? NaN : betaOf(o));
    expect(betaElasticities(['R', 'S'], [base.R, base.S], none).entries[0].dBetaDMean).toBeNaN();
    const infinite = betaElasticities(['R'], [base.R], () => Infinity);
    expect(infinite.entries[0].dBetaDMean).toBeNaN();
  });
});
