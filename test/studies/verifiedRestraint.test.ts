import { describe, expect, it } from 'vitest';
import { normalSf } from '../../src/probability/normal.js';
import type { FormCheckResult } from '../../src/reliability/formCheck.js';
import type { CheckedBetaPoint } from '../../src/studies/columnForm.js';
import { verifiedRestraintStudy } from '../../src/studies/columnRestraint.js';

/** A check whose β is `truth(f)`; it agrees with FORM when they are within 0.2. */
function evaluators(formBeta: (f: number) => number, truth: (f: number) => number) {
  const calls: number[] = [];
  const checked = (f: number): CheckedBetaPoint => {
    calls.push(f);
    const b = formBeta(f);
    const t = truth(f);
    const check: FormCheckResult = {
      method: 'importance sampling', pf: normalSf(t), cov: 0.05, beta: t, samples: 4000, failures: 1000, calls: 4000, seed: 1,
      betaBand: [t - 0.2, t + 0.2], upperBound: null, agrees: Math.abs(b - t) <= 0.2, reason: '',
    };
    return { beta: b, pf: normalSf(b), converged: true, check, checkBeta: t, checkPf: normalSf(t) };
  };
  return { evaluate: { form: (f: number) => ({ beta: formBeta(f), pf: normalSf(formBeta(f)), converged: true }), checked }, calls };
}

const truth = (f: number): number => (f === Infinity ? 10 : 2 + Math.log1p(f));

describe('restraint study checked where FORM decides', () => {
  it('a FORM that agrees is checked at the requirement and at the assessed stiffness', () => {
    const { evaluate, calls } = evaluators(truth, truth);
    const r = verifiedRestraintStudy(evaluate, { baseStiffness: { bottom: 1e6 }, target: 3 });
    // common practice: β = 2 + ln(1 + f) reaches 3 at f = e − 1
    expect(r.study.requiredFactor).toBeCloseTo(Math.E - 1, 5);
    expect(r.verification.method).toBe('form');
    expect(r.verification.checks.map((c) => c.role)).toEqual(['required', 'assessed']);
    expect(calls[1]).toBe(1);
    expect(r.verification.verifiedBeta).toBeCloseTo(3, 5);
  });

  it('a FORM that wrongly says pinned ends suffice is refuted; the requirement comes from the check', () => {
    const { evaluate } = evaluators(() => 4, truth);
    const r = verifiedRestraintStudy(evaluate, { baseStiffness: { bottom: 1e6 }, target: 3 });
    expect(r.verification.checks[0]).toMatchObject({ role: 'pinned', agrees: false, formBeta: 4, checkBeta: 2 });
    expect(r.verification.method).toBe('is');
    expect(r.study.outcome).toBe('reached');
    // common practice: the root of the check's own curve, 2 + ln(1 + f) = 3
    expect(r.study.requiredFactor).toBeCloseTo(Math.E - 1, 5);
    expect(r.study.curve.every((p) => p.ideal !== 'pinned' || p.beta === 2)).toBe(true);
  });
});
