import { describe, expect, it } from 'vitest';
import { findRootBracketed } from '../../src/probability/rootBracketed.js';
import { restraintStudy, type BetaPoint } from '../../src/studies/restraintStudy.js';
import { restraintSentence } from '../../src/studies/restraintSentence.js';
import { confirmRequirement } from '../../src/studies/columnRestraint.js';
import type { Scenario } from '../../src/scenario/types.js';

// A synthetic monotone β(factor) = a + b f/(1 + f): pinned β = a, rigid β = a + b,
// target t reached at f* = (t − a)/(a + b − t) (own construction, exact).
function synthetic(a: number, b: number) {
  const seen: number[] = [];
  const betaAtFactor = (f: number): BetaPoint => {
    seen.push(f);
    const beta = f === Infinity ? a + b : a + (b * f) / (1 + f);
    return { beta, pf: 0.5 * Math.exp(-beta) }; // any decreasing pf will do here
  };
  return { betaAtFactor, seen };
}
const root = (a: number, b: number, t: number): number => (t - a) / (a + b - t);
const base = { bottom: 2e6, top: 1e6 };

describe('the root solve the study uses', () => {
  it('solves cos x = x (Dottie number 0.739085133215161, common practice)', () => {
    const x = findRootBracketed((t) => Math.cos(t) - t, 0, 1, { xTolerance: 1e-14 });
    // common practice: the fixed point of cos, 0.739085133215161
    expect(x).toBeCloseTo(0.739085133215161, 13);
  });
  it('refuses a bracket without a sign change', () => {
    expect(() => findRootBracketed((x) => x * x + 1, -1, 1)).toThrow(/sign change/);
  });
});

describe('restraintStudy', () => {
  it('finds the known root by a solve, not by reading the grid', () => {
    const { betaAtFactor } = synthetic(2, 3);
    const result = restraintStudy({ betaAtFactor, baseStiffness: base, target: 3.8 });
    expect(result.outcome).toBe('reached');
    expect(result.requiredFactor as number).toBeCloseTo(root(2, 3, 3.8), 5); // 1.5
    expect(result.required.bottom as number).toBeCloseTo(3e6, -1);
    expect(result.required.top as number).toBeCloseTo(1.5e6, -1);
    // the default grid (0.01 … 100, 13 points) does not contain 1.5
    expect(result.curve.filter((p) => !p.ideal).length).toBeGreaterThan(13);
    // sorted by stiffness, pinned first and rigid last, marked
    const factors = result.curve.map((p) => p.factor);
    expect(factors).toEqual([...factors].sort((x, y) => x - y));
    expect(result.curve[0]).toMatchObject({ factor: 0, ideal: 'pinned', stiffness: { bottom: 0, top: 0 }, beta: 2 });
    expect(result.curve[result.curve.length - 1]).toMatchObject({ ideal: 'fixed', stiffness: { bottom: Infinity }, beta: 5 });
    expect(result.calls).toBe(result.curve.length);
  });

  it('extends the grid downwards and upwards when the crossing lies outside it', () => {
    const low = restraintStudy({ ...synthetic(3.7, 1.3), baseStiffness: base, target: 3.8, grid: { min: 1, max: 10, points: 3 } });
    expect(low.requiredFactor as number).toBeCloseTo(root(3.7, 1.3, 3.8), 6); // 0.0833
    const high = restraintStudy({ ...synthetic(2, 3), baseStiffness: base, target: 4.99, grid: [0.1, 1, 10] });
    expect(high.requiredFactor as number).toBeCloseTo(root(2, 3, 4.99), 1); // 299
    expect(Math.abs((high.requiredFactor as number) / root(2, 3, 4.99) - 1)).toBeLessThan(1e-5);
  });

  it('reports a target that even rigid ends miss', () => {
    const result = restraintStudy({ ...synthetic(2, 3), baseStiffness: base, target: 5.5 });
    expect(result.outcome).toBe('unreachable');
    expect(result.requiredFactor).toBeNull();
    expect(result.required).toEqual({ bottom: null, top: null });
  });

  it('reports a target met by rigid ends only', () => {
    const result = restraintStudy({ ...synthetic(2, 3), baseStiffness: base, target: 5 });
    expect(result.outcome).toBe('fixed-only');
    expect(result.required.bottom).toBe(Infinity);
  });

  it('says when pinned ends already suffice', () => {
    const result = restraintStudy({ ...synthetic(2, 3), baseStiffness: base, target: 1.5 });
    expect(result.outcome).toBe('pinned-suffices');
    expect(result.required).toEqual({ bottom: 0, top: 0 });
  });
});

describe('restraintSentence', () => {
  const wording = { formatStiffness: (k: number) => `${(k / 1e6).toFixed(2)} MN m/rad` };
  const q = (mean: number) => ({ mean, cov: 0.5, characteristic: mean * 0.4, design: mean * 0.3, alpha: 0.5, alphaBasis: 'FORM α = 0.50 at the requirement', designFractile: 0.029, fixityFactor: 0.5 });
  it('states mean, CoV, 5 % fractile, design stiffness, K and K_d for each studied end', () => {
    const result = restraintStudy({ ...synthetic(2, 3), baseStiffness: base, target: 3.8 });
    const text = restraintSentence(result, wording, { reached: { requirement: { bottom: q(3e6), top: q(1.5e6) }, k: 0.78, kDesign: 0.86, factor: 1.5 } });
    expect(text).toMatch(/^The target β = 3\.80 needs at the bottom connection a mean rotational stiffness of at least 3\.00 MN m\/rad with CoV 0\.50, that is a 5 % characteristic stiffness of at least 1\.20 MN m\/rad/);
    expect(text).toMatch(/and at the top connection a mean rotational stiffness of at least 1\.50 MN m\/rad/);
    expect(text).toMatch(/K = 0\.78 at these means, 1\.5 times the stiffness assumed\./);
    expect(text).toMatch(/0\.90 MN m\/rad at the bottom connection \(FORM α = 0\.50 at the requirement, fractile Φ\(−α·β\) = 0\.029\)/);
    expect(text).toMatch(/K_d = 0\.86 there, the K to use with the other design values of the same method\.$/);
  });
  it('has one sentence for each other outcome, naming the studied ends and printing no dashes', () => {
    const say = (t: number, ends: Record<string, number> = base): string =>
      restraintSentence(restraintStudy({ ...synthetic(2, 3), baseStiffness: ends, target: t }), wording, { shortfall: { loadFactor: 0.8, utilizationRigid: 0.75 } });
    expect(say(1.5)).toMatch(/already met with pinned bottom and top connections \(β = 2\.00\)/);
    expect(say(5.5)).toBe('Even rigid bottom and top connections reach only β = 5.00, short of the target 5.50; the target would be met with the loads at 80 % of those given (utilization 0.60 at the means instead of 0.75).');
    expect(say(5.5, { bottom: 1e6 })).toMatch(/^Even a rigid bottom connection \(the top end as given\) reaches only/);
    expect(say(5)).toMatch(/only with rigid bottom and top connections/);
    for (const t of [1.5, 5, 5.5]) expect(say(t)).not.toMatch(/—/);
  });
});

describe('which crossing of the target is the requirement', () => {
  // own construction, the shape β given a survived load can take: −10 + 15 000 f up to f = 0.001
  // (reaches 3 at f = 13/15 000), 5 up to 0.05, then a dip to 2 + ln(1 + f) (reaches 3 at f = e − 1)
  const dip = (f: number): BetaPoint => {
    const beta = f === Infinity ? 10 : f <= 0.001 ? -10 + 15_000 * f : f <= 0.05 ? 5 : 2 + Math.log1p(f);
    return { beta, pf: 0.5 * Math.exp(-Math.max(beta, -30)) };
  };
  it("'first' takes the least factor that reaches the target; 'last' the one above which β stays reached", () => {
    const first = restraintStudy({ betaAtFactor: dip, baseStiffness: { bottom: 1e6 }, target: 3 });
    const last = restraintStudy({ betaAtFactor: dip, baseStiffness: { bottom: 1e6 }, target: 3, crossing: 'last' });
    expect(first.outcome).toBe('reached');
    expect(first.requiredFactor as number).toBeCloseTo(13 / 15_000, 8);
    expect(last.outcome).toBe('reached');
    // common practice: 2 + ln(1 + f) = 3 at f = e − 1
    expect(last.requiredFactor as number).toBeCloseTo(Math.E - 1, 5);
  });
  it("agree when β rises with the stiffness, and 'last' gives pinned-suffices only when every point reaches the target", () => {
    const { betaAtFactor } = synthetic(1, 4);
    const a = restraintStudy({ betaAtFactor, baseStiffness: base, target: 3 });
    const b = restraintStudy({ betaAtFactor, baseStiffness: base, target: 3, crossing: 'last' });
    expect(b.requiredFactor).toBe(a.requiredFactor);
    expect(b.requiredFactor as number).toBeCloseTo(root(1, 4, 3), 5);
    const high = restraintStudy({ betaAtFactor: (f) => ({ beta: f === 0 ? 4 : 3.5, pf: 1e-4 }), baseStiffness: base, target: 3, crossing: 'last' });
    expect(high.outcome).toBe('pinned-suffices');
  });
});

describe('β = ±∞ on either side of the requirement (a survival impossible below some stiffness)', () => {
  // common practice: given a survived load, a column softer than some stiffness could not have carried it (β = −∞:
  // no such column is the real one), a stiffer one may be certain to be safe (β = +∞); a valid generated scenario
  // (bench/validScenarios.ts seed 19 no. 4) had such a jump
  const jump = 6e-6;
  const beta = (f: number) => (f <= jump ? -Infinity : f < 1e-3 ? Infinity : 9 + Math.log10(f));
  it('the root search brackets the jump and lands on it', () => {
    const s = restraintStudy({ baseStiffness: { bottom: 1e6 }, target: 3.8, betaAtFactor: (f) => ({ beta: beta(f), pf: NaN }), crossing: 'last' });
    expect(s.outcome).toBe('reached');
    expect(s.requiredFactor! / jump).toBeGreaterThan(1 - 1e-5);
    expect(s.requiredFactor! / jump).toBeLessThan(1 + 1e-5);
  });
  it('the confirmation raises past it instead of computing ∞/∞', async () => {
    const s = restraintStudy({ baseStiffness: { bottom: 1e6 }, target: 3.8, betaAtFactor: (f) => ({ beta: beta(f), pf: NaN }), crossing: 'last' });
    // the assessor sees the factor through the edited scenario: here the scenario is the factor itself
    const c = await confirmRequirement(s, (f) => f as unknown as Scenario, async (t) => ({ method: 'form', beta: beta(t as unknown as number) }));
    expect(Number.isFinite(c.raisedBy)).toBe(true);
    expect(c.confirmed).toBe(true);
    expect(c.beta).toBe(Infinity);
  });
});
