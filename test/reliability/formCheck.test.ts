import { describe, expect, it } from 'vitest';
import { form } from '../../src/reliability/form.js';
import { checkEstimate, checkForm, FORM_CHECK_BATCH, FORM_CHECK_SAMPLES } from '../../src/reliability/formCheck.js';
import { linearSum, symmetricKink } from '../../src/reliability/testProblems.js';
import { normalPdf, normalSf } from '../../src/probability/normal.js';

/** pf of g = c − u1 − k|u2| by conditioning on u2: ∫ φ(t) Φ(−(c − k|t|)) dt, composite Simpson on [−12, 12]. */
function kinkPf(c: number, k: number): number {
  const n = 24000;
  const h = 24 / n;
  let s = 0;
  for (let i = 0; i <= n; i++) {
    const t = -12 + i * h;
    const w = i === 0 || i === n ? 1 : i % 2 === 1 ? 4 : 2;
    s += w * normalPdf(t) * normalSf(c - k * Math.abs(t));
  }
  return (s * h) / 3;
}

describe('FORM with a gradient of unknown sign (g = c − u1 − k|u2|)', () => {
  const c = 4;
  const k = 2;
  const problem = symmetricKink({ c, k, n: 3 });
  const betaPoint = c / Math.sqrt(1 + k * k);

  it('without the doubtful-direction search FORM converges on the saddle u = (c, 0, 0): confidently wrong', () => {
    const r = form(problem, { restarts: 0, probeDoubtful: false, differences: 'central' });
    // common practice: at u2 = 0 the central difference of |u2| is exactly 0, so HL-RF never leaves u2 = 0
    // (the forward difference, the default, sees one side of the kink and leaves it by chance)
    expect(r.converged).toBe(true);
    expect(r.beta).toBeCloseTo(c, 8);
    const check = checkForm(problem, r, { seed: 4 });
    expect(check.agrees).toBe(false);
    expect(check.reason).toMatch(/disagrees/);
    // a disagreement is never decided early: the check's estimate then replaces FORM's
    expect(check.samples).toBe(FORM_CHECK_SAMPLES);
  });

  it('finds both design points and their series system gives the exact pf', () => {
    const r = form(problem);
    expect(r.doubtfulDirections).toContain('u2');
    // source: the two half-planes u1 ± k·u2 ≥ c, β = c/√(1 + k²) (Ditlevsen & Madsen 1996, ch. 14)
    expect(r.beta).toBeCloseTo(betaPoint, 7);
    expect(r.system.designPoints).toHaveLength(2);
    expect(r.system.designPoints[0].designPointU[1] * r.system.designPoints[1].designPointU[1]).toBeLessThan(0);
    // source: exact pf by conditioning on u2 (kinkPf); the limit state is two planes, so the system is exact
    const exact = kinkPf(c, k);
    expect(Math.abs(r.system.pf / exact - 1)).toBeLessThan(1e-6);
    expect(r.warnings.join(' ')).toMatch(/changes sign along u2/);
    const check = checkForm(problem, r, { seed: 4 });
    expect(check.agrees).toBe(true);
  });

  it('g = β − |u1|: two opposite design points, pf = 2Φ(−β)', () => {
    const r = form(symmetricKink({ c: 3, k: 1, n: 2 }));
    // source: exact for the symmetric limit state (g here is 3 − u1 − |u2|: two planes, ρ = 0, β = 3/√2)
    const b = 3 / Math.SQRT2;
    expect(Math.abs(r.system.pf / (2 * normalSf(b) - normalSf(b) ** 2) - 1)).toBeLessThan(1e-9);
    const pure = form({ ...symmetricKink({ c: 3, k: 0 }), g: (x: Float64Array) => 3 - Math.abs(x[0]) });
    // source: exact, pf = 2Φ(−3) for g = 3 − |u1|
    expect(pure.system.designPoints).toHaveLength(2);
    expect(Math.abs(pure.system.pf / (2 * normalSf(3)) - 1)).toBeLessThan(1e-9);
  });
});

describe('FORM self-check', () => {
  it('agrees with FORM on a linear limit state and estimates pf within 4 standard errors', () => {
    const problem = linearSum({ n: 4, beta: 3.5 });
    const f = form(problem);
    const c = checkForm(problem, f, { seed: 9 });
    // source: docs/verification.md §R1c exact pf = Φ(−β) for the linear sum
    const exact = normalSf(3.5);
    expect(c.method).toBe('importance sampling');
    // a clear agreement stops after a few batches, not at the budget
    expect(c.samples % FORM_CHECK_BATCH).toBe(0);
    expect(c.samples).toBeLessThanOrEqual(2 * FORM_CHECK_BATCH);
    expect(c.calls).toBe(c.samples);
    expect(Math.abs(c.pf - exact)).toBeLessThanOrEqual(4 * c.cov * c.pf);
    expect(c.agrees).toBe(true);
    expect(c.betaBand[0]).toBeLessThan(3.5);
    expect(c.betaBand[1]).toBeGreaterThan(3.5);
  });

  it('is crude Monte Carlo when pf is large, within 4 binomial standard errors', () => {
    const problem = linearSum({ n: 2, beta: 1 });
    const c = checkForm(problem, form(problem), { seed: 2, samples: 4000 });
    // source: docs/verification.md §R1c exact pf; common practice: binomial s.e. √(p(1 − p)/N)
    const p = normalSf(1);
    expect(c.method).toBe('Monte Carlo');
    expect(Math.abs(c.pf - p)).toBeLessThanOrEqual(4 * Math.sqrt((p * (1 - p)) / 4000));
    expect(c.agrees).toBe(true);
  });

  it('refutes a design point where nothing fails, and bounds pf instead', () => {
    // common practice: FORM's answer for g = 4.5 − u1 checked against g = 4.5 + u1 (failure on the other side)
    const f = form(linearSum({ n: 1, beta: 4.5 }));
    const mirrored = { ...linearSum({ n: 1, beta: 4.5 }), g: (x: Float64Array) => 4.5 + x[0] };
    const c = checkForm(mirrored, f, { seed: 1 });
    expect(c.failures).toBe(0);
    expect(c.agrees).toBe(false);
    expect(c.upperBound).toBeCloseTo(3 / 800, 12);
    expect(checkEstimate(c).pf).toBe(c.upperBound);
  });

  it('sequential stopping still refutes a FORM β off by 0.25 (2.5 × the tolerance), at the full budget', () => {
    // FORM's answer for g = 3.5 − Σu/2 checked against the same plane at 3.75: the design point is in the
    // right direction, only β is wrong. source: docs/verification.md §R1c exact pf = Φ(−β) for the linear sum
    const f = form(linearSum({ n: 4, beta: 3.5 }));
    for (const seed of [1, 2, 3, 4, 5]) {
      const c = checkForm(linearSum({ n: 4, beta: 3.75 }), f, { seed });
      expect(c.agrees).toBe(false);
      expect(c.samples).toBe(FORM_CHECK_SAMPLES);
      expect(Math.abs(c.pf - normalSf(3.75))).toBeLessThanOrEqual(4 * c.cov * c.pf);
    }
  });

  it('an early agreement is a sound one: the early estimate is within 4 standard errors and 0.1 in β of the exact', () => {
    const problem = linearSum({ n: 4, beta: 3.5 });
    const f = form(problem);
    for (const seed of [11, 12, 13]) {
      const early = checkForm(problem, f, { seed });
      expect(early.samples).toBeLessThan(FORM_CHECK_SAMPLES);
      expect(early.agrees).toBe(true);
      // source: docs/verification.md §R1c exact pf = Φ(−β); the early estimate is within 4 of its standard errors
      expect(Math.abs(early.pf - normalSf(3.5))).toBeLessThanOrEqual(4 * early.cov * early.pf);
      expect(Math.abs(early.beta - 3.5)).toBeLessThanOrEqual(0.1);
    }
  });

  it('is reproducible: same seed, same numbers', () => {
    const problem = symmetricKink({ c: 4, k: 2 });
    const f = form(problem);
    // common practice: seeded streams
    expect(checkForm(problem, f, { seed: 5 })).toEqual(checkForm(problem, f, { seed: 5 }));
    expect(checkForm(problem, f, { seed: 6 }).pf).not.toBe(checkForm(problem, f, { seed: 5 }).pf);
  });
});
