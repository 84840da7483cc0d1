import { describe, expect, it } from 'vitest';
import { form } from '../../src/reliability/form.js';
import { sorm } from '../../src/reliability/sorm.js';
import { resistanceMinusLoad } from '../../src/reliability/testProblems.js';
import type { ReliabilityProblem } from '../../src/reliability/types.js';

const R = { dist: 'normal', mean: 200, sd: 20 } as const;
const S = { dist: 'normal', mean: 100, sd: 25 } as const;
// R − S with normal R and S: β = (μR − μS)/√(σR² + σS²) = 100/√1025 = 3.12348 (Cornell 1969; Hasofer & Lind 1974)
const EXACT = 100 / Math.sqrt(1025);

/** The same g on a staircase of height `jump` (a traced model that changes its steps): piecewise flat, jumps everywhere. */
function staircase(p: ReliabilityProblem, jump: number, declare: boolean): ReliabilityProblem {
  const g = p.g;
  return { ...p, g: (x) => Math.round(g(x) / jump) * jump, ...(declare ? { gNoise: jump } : {}) };
}

describe('FORM and SORM on a g with small jumps (ReliabilityProblem.gNoise)', () => {
  it('without gNoise the search sees a flat g and fails; with it, β within the stated tolerance of the exact one', () => {
    const base = resistanceMinusLoad({ r: R, s: S });
    const jump = 1e-4 * 100; // 1e-4 of g at the means
    const blind = form(staircase(base, jump, false), { restarts: 0, probeDoubtful: false });
    expect(blind.converged && Math.abs(blind.beta - EXACT) < 1e-3).toBe(false);
    const r = form(staircase(base, jump, true), { restarts: 0, probeDoubtful: false });
    expect(r.converged).toBe(true);
    // |g|/|g(0)| < 3ε with ε = 1e-4 moves β of this linear g by at most 3ε·β (form.ts noisySettings), plus the staircase's ε/2
    expect(Math.abs(r.beta - EXACT)).toBeLessThan(3.5e-4 * EXACT);
  });

  it('a smooth problem keeps its settings bit for bit (gNoise absent or 0)', () => {
    const base = resistanceMinusLoad({ r: R, s: S });
    const a = form(base);
    const b = form({ ...base, gNoise: 0 });
    expect(b.beta).toBe(a.beta);
    expect(b.designPointU).toEqual(a.designPointU);
  });

  it('SORM takes a Hessian step above the jumps: the curvatures of a plane stay near 0', () => {
    const base = resistanceMinusLoad({ r: R, s: S });
    const p = staircase(base, 1e-2, true);
    const f = form(p, { restarts: 0, probeDoubtful: false });
    const q = sorm(p, f);
    for (const k of q.curvatures) expect(Math.abs(k)).toBeLessThan(0.02);
  });
});
