import { describe, expect, it } from 'vitest';
import { samplePosterior } from '../../src/evidence/adaptiveMetropolis.js';
import { chainDiagnostics } from '../../src/evidence/chainDiagnostics.js';
import { fitPosteriorMarginal } from '../../src/evidence/posteriorMarginal.js';
import { readingLogLikelihood, readingLogSd } from '../../src/evidence/readingLikelihood.js';
import { normalStream } from '../../src/probability/rng.js';

function column(draws: Float64Array, d: number, j: number): Float64Array {
  const n = draws.length / d;
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = draws[i * d + j];
  return out;
}

function pooled(chains: readonly Float64Array[], d: number, j: number): Float64Array {
  const parts = chains.map((c) => column(c, d, j));
  const out = new Float64Array(parts.reduce((a, p) => a + p.length, 0));
  let o = 0;
  for (const p of parts) {
    out.set(p, o);
    o += p.length;
  }
  return out;
}

const meanOf = (v: Float64Array): number => v.reduce((a, b) => a + b, 0) / v.length;
const sdOf = (v: Float64Array): number => {
  const m = meanOf(v);
  return Math.sqrt(v.reduce((a, b) => a + (b - m) ** 2, 0) / (v.length - 1));
};

describe('adaptive Metropolis posterior against closed forms', () => {
  // source: Gelman et al., Bayesian Data Analysis, 3rd ed., 2013, §2.5 eq. 2.12 (normal mean, known variance):
  // prior μ ~ N(m0, s0²), readings y_k ~ N(μ, σ²): 1/s1² = 1/s0² + n/σ², m1 = s1²(m0/s0² + Σy/σ²)
  it('normal mean with known variance: posterior mean and sd within 4 Monte Carlo standard errors', () => {
    const m0 = 300;
    const s0 = 30;
    const sigma = 12;
    const ys = [322, 331, 318];
    const s1 = 1 / Math.sqrt(1 / s0 ** 2 + ys.length / sigma ** 2);
    const m1 = s1 ** 2 * (m0 / s0 ** 2 + ys.reduce((a, b) => a + b, 0) / sigma ** 2);
    const logL = (u: Float64Array): number => {
      const mu = m0 + s0 * u[0];
      let l = 0;
      for (const y of ys) l -= 0.5 * ((y - mu) / sigma) ** 2;
      return l;
    };
    // a second, uninformed dimension: its posterior must stay the N(0, 1) prior
    const r = samplePosterior(2, logL, { seed: 11, chains: 4, warmup: 1000, draws: 2000 });
    const mu = pooled(r.draws, 2, 0).map((u) => m0 + s0 * u);
    const free = pooled(r.draws, 2, 1);
    const dMu = chainDiagnostics(r.draws.map((c) => column(c, 2, 0)));
    expect(dMu.rhat).toBeLessThan(1.05);
    expect(dMu.ess).toBeGreaterThan(400);
    const se = s1 / Math.sqrt(dMu.ess);
    expect(Math.abs(meanOf(mu) - m1)).toBeLessThan(4 * se);
    // sd of a sample sd ≈ s/√(2 ESS)
    expect(Math.abs(sdOf(mu) - s1)).toBeLessThan(4 * s1 / Math.sqrt(2 * dMu.ess));
    const dFree = chainDiagnostics(r.draws.map((c) => column(c, 2, 1)));
    expect(Math.abs(meanOf(free))).toBeLessThan(4 / Math.sqrt(dFree.ess));
    for (const a of r.acceptance) expect(a).toBeGreaterThan(0.1);
  });

  // source: Gelman et al. 2013, §2.5 on ln X (normal–normal conjugacy), with the lognormal reading
  // error ζ_m² = ln(1 + V²) of Melchers 1999, App. A: prior ln k ~ N(λ0, ζ0²), reading ln y ~ N(ln k, ζ_m²)
  it('a reading of a lognormal stiffness with lognormal error: posterior of ln k and the fitted lognormal', () => {
    const lambda0 = Math.log(2e6);
    const zeta0 = 0.4;
    const y = 3.1e6;
    const zm = readingLogSd(0.1);
    const z1 = 1 / Math.sqrt(1 / zeta0 ** 2 + 1 / zm ** 2);
    const l1 = z1 ** 2 * (lambda0 / zeta0 ** 2 + Math.log(y) / zm ** 2);
    const r = samplePosterior(1, (u) => readingLogLikelihood(y, Math.exp(lambda0 + zeta0 * u[0]), zm), { seed: 3, chains: 4, warmup: 1000, draws: 2000 });
    const d = chainDiagnostics(r.draws);
    expect(d.rhat).toBeLessThan(1.05);
    const lnk = pooled(r.draws, 1, 0).map((u) => lambda0 + zeta0 * u);
    expect(Math.abs(meanOf(lnk) - l1)).toBeLessThan(4 * z1 / Math.sqrt(d.ess));
    const fit = fitPosteriorMarginal(lnk.map(Math.exp), true);
    expect(fit.dist).toBe('lognormal');
    const mean = Math.exp(l1 + z1 * z1 / 2);
    // source: Melchers 1999, App. A: lognormal mean exp(λ + ζ²/2); tolerance from the ESS as above
    expect(Math.abs((fit as { mean: number }).mean / mean - 1)).toBeLessThan(4 * (z1 / Math.sqrt(d.ess) + z1 * z1 / Math.sqrt(2 * d.ess)));
  });

  it('is reproducible by seed and differs between seeds', () => {
    // common practice: seeded streams give identical draws
    const logL = (u: Float64Array): number => -0.5 * ((u[0] - 1) / 0.3) ** 2;
    const a = samplePosterior(1, logL, { seed: 5, warmup: 200, draws: 200 });
    const b = samplePosterior(1, logL, { seed: 5, warmup: 200, draws: 200 });
    const c = samplePosterior(1, logL, { seed: 6, warmup: 200, draws: 200 });
    expect(Array.from(a.draws[2])).toEqual(Array.from(b.draws[2]));
    expect(Array.from(a.draws[2])).not.toEqual(Array.from(c.draws[2]));
  });

  it('refuses measurements that no prior draw can explain', () => {
    // common practice: a likelihood that is zero everywhere has no posterior
    expect(() => samplePosterior(1, () => -Infinity, { seed: 1, warmup: 10, draws: 10 })).toThrow(/can explain the measurements/);
  });
});

describe('chain diagnostics', () => {
  // source: Gelman et al. 2013, §11.4–11.5: independent draws have R̂ ≈ 1 and n_eff ≈ mn;
  // chains stuck in different places have R̂ well above 1.1
  it('independent draws: R̂ near 1 and ESS near the draw count; separated chains: R̂ large', () => {
    const chains = [0, 1, 2, 3].map((c) => {
      const g = normalStream(9, c);
      return Float64Array.from({ length: 1000 }, () => g());
    });
    const d = chainDiagnostics(chains);
    expect(Math.abs(d.rhat - 1)).toBeLessThan(0.01);
    expect(d.ess).toBeGreaterThan(3000);
    expect(d.ess).toBeLessThan(5000);
    const apart = chains.map((c, j) => c.map((v) => v + 3 * j));
    expect(chainDiagnostics(apart).rhat).toBeGreaterThan(1.5);
  });

  it('an AR(1) chain: ESS near mn(1 − ρ)/(1 + ρ)', () => {
    // source: Gelman et al. 2013, §11.5: n_eff = mn/(1 + 2Σρ_t), and Σ_{t≥1} ρ^t = ρ/(1 − ρ) for AR(1)
    const rho = 0.8;
    const chains = [0, 1, 2, 3].map((c) => {
      const g = normalStream(21, c);
      let x = g();
      return Float64Array.from({ length: 5000 }, () => (x = rho * x + Math.sqrt(1 - rho * rho) * g()));
    });
    const d = chainDiagnostics(chains);
    const expected = (20000 * (1 - rho)) / (1 + rho);
    expect(d.ess / expected).toBeGreaterThan(0.8);
    expect(d.ess / expected).toBeLessThan(1.25);
  });
});
