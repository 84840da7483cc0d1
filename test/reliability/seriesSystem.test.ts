import { describe, expect, it } from 'vitest';
import { bothOutside, seriesSystemFailure } from '../../src/reliability/seriesSystem.js';
import { normalQuantileUpper, normalSf } from '../../src/probability/normal.js';

/** Unit vector in the plane at angle θ from the first axis, padded to n components. */
function planar(theta: number, n = 2): number[] {
  const a = new Array<number>(n).fill(0);
  a[0] = Math.cos(theta);
  a[1] = Math.sin(theta);
  return a;
}

/** Two unit vectors with α₁·α₂ = ρ. */
function pairWithCorrelation(rho: number): number[][] {
  return [[1, 0], [rho, Math.sqrt(1 - rho * rho)]];
}

/** Equicorrelated unit vectors (ρ_ij = r) in m + 1 dimensions: a common part and an own part. */
function equicorrelated(m: number, r: number): number[][] {
  return Array.from({ length: m }, (_, i) => {
    const a = new Array<number>(m + 1).fill(0);
    a[0] = Math.sqrt(r);
    a[i + 1] = Math.sqrt(1 - r);
    return a;
  });
}

/** Independent reference: Φ₂(−a, −b; ρ) = Φ(−a)Φ(−b) + ∫₀^ρ φ₂(a, b; r) dr, by composite Simpson. */
function plackettBothOutside(a: number, b: number, rho: number): number {
  const density = (r: number): number => {
    const s = 1 - r * r;
    return Math.exp(-(a * a - 2 * r * a * b + b * b) / (2 * s)) / (2 * Math.PI * Math.sqrt(s));
  };
  const n = 20000;
  const h = rho / n;
  let sum = density(0) + density(rho);
  for (let i = 1; i < n; i++) sum += (i % 2 === 1 ? 4 : 2) * density(i * h);
  return normalSf(a) * normalSf(b) + (h / 3) * sum;
}

describe('series system of linearised limit states', () => {
  it('one design point reduces exactly to Φ(−β)', () => {
    for (const beta of [-1.2, 0, 2.5, 5.06, 9]) {
      const r = seriesSystemFailure([beta], [[0.6, -0.8]]);
      // source: Ditlevsen & Madsen, Structural Reliability Methods (1996) ch. 14 (m = 1 is FORM's Φ(−β))
      expect(r.pf).toBe(normalSf(beta));
      expect(r.beta).toBe(beta);
      expect(r.bounds).toEqual({ lower: r.pf, upper: r.pf });
    }
  });

  it('two independent limit states: pf = P1 + P2 − P1·P2', () => {
    const r = seriesSystemFailure([3, 3.5], [planar(0), planar(Math.PI / 2)]);
    const p1 = normalSf(3);
    const p2 = normalSf(3.5);
    // common practice: independent events, P(A ∪ B) = P(A) + P(B) − P(A)P(B)
    expect(Math.abs(r.pf / (p1 + p2 - p1 * p2) - 1)).toBeLessThan(1e-12);
    expect(r.beta).toBeCloseTo(normalQuantileUpper(p1 + p2 - p1 * p2), 12);
  });

  it('g = β − |u1|: two opposite design points, pf = 2Φ(−β) exactly', () => {
    for (const beta of [1, 3.3, 6]) {
      const r = seriesSystemFailure([beta, beta], [[1, 0, 0], [-1, 0, 0]]);
      // source: exact for the symmetric limit state β − |u1| (Ditlevsen & Madsen 1996, ch. 14)
      expect(Math.abs(r.pf / (2 * normalSf(beta)) - 1)).toBeLessThan(1e-12);
    }
  });

  it('β = 0: Sheppard’s orthant formula, pf = 3/4 − asin(ρ)/(2π)', () => {
    for (const rho of [-0.9, -0.3, 0.2, 0.7, 0.99]) {
      const r = seriesSystemFailure([0, 0], pairWithCorrelation(rho));
      // source: Sheppard 1899, P(Z1 ≤ 0, Z2 ≤ 0) = 1/4 + asin(ρ)/(2π) (from memory)
      expect(r.pf).toBeCloseTo(0.75 - Math.asin(rho) / (2 * Math.PI), 12);
    }
  });

  it('rare events: 1 − Φ₂(β1, β2; ρ) to 1e-9 relative against the Plackett integral', () => {
    for (const [b1, b2, rho] of [[4, 4.5, 0.6], [4.2, 4.2, 0.95], [3.7, 5, -0.4], [5, 5.2, 0.999]] as const) {
      const r = seriesSystemFailure([b1, b2], pairWithCorrelation(rho));
      const both = plackettBothOutside(b1, b2, rho);
      // source: Ditlevsen & Madsen 1996 ch. 14, pf = 1 − Φ₂(β1, β2; ρ); Plackett 1954 ∂Φ₂/∂ρ = φ₂ (from memory)
      const exact = normalSf(b1) + normalSf(b2) - both;
      expect(Math.abs(r.pf / exact - 1), `${b1} ${b2} ${rho}`).toBeLessThan(1e-9);
      // For ρ < 0 the reference subtracts nearly equal numbers; compare the joint tail only for ρ > 0.
      if (rho > 0) expect(Math.abs(bothOutside(b1, b2, rho) / both - 1)).toBeLessThan(1e-7);
    }
  });

  it('identical and opposite α are handled as the degenerate cases', () => {
    // common practice: the same half-space twice fails with the smaller β
    expect(seriesSystemFailure([3, 4], [[1, 0], [1, 0]]).pf).toBeCloseTo(normalSf(3), 15);
    const three = seriesSystemFailure([3, 4, 3.2], [[1, 0], [1, 0], [0, 1]]);
    const p = normalSf(3);
    const q = normalSf(3.2);
    // common practice: independence of the remaining pair
    expect(Math.abs(three.pf / (p + q - p * q) - 1)).toBeLessThan(2e-3);
  });

  it('two design points: Ditlevsen bounds are exact and equal the integral', () => {
    const r = seriesSystemFailure([3, 3.2], pairWithCorrelation(0.5));
    // source: Ditlevsen 1979 (J. Struct. Mech. 7) bounds; for m = 2 both equal P1 + P2 − P12 (common practice)
    expect(r.bounds.lower).toBeCloseTo(r.pf, 15);
    expect(r.bounds.upper).toBeCloseTo(r.pf, 15);
  });

  it('three points at β = 0: trivariate orthant formula', () => {
    const alphas = [planar(0, 3), [0.3, 0.8, Math.sqrt(1 - 0.73)], [-0.5, 0.1, Math.sqrt(1 - 0.26)]];
    const dotp = (a: number[], b: number[]): number => a.reduce((s, v, i) => s + v * b[i], 0);
    const r12 = dotp(alphas[0], alphas[1]);
    const r13 = dotp(alphas[0], alphas[2]);
    const r23 = dotp(alphas[1], alphas[2]);
    const r = seriesSystemFailure([0, 0, 0], alphas, { seed: 7 });
    // source: P(Z ≤ 0) = 1/8 + (asin ρ12 + asin ρ13 + asin ρ23)/(4π) (Tong 1990, The Multivariate Normal Distribution; from memory)
    const exact = 1 - (1 / 8 + (Math.asin(r12) + Math.asin(r13) + Math.asin(r23)) / (4 * Math.PI));
    // 3 standard errors of the lattice ≤ 0.1 % per term; 4/3 of it leaves 4 standard errors
    expect(Math.abs(r.pf / exact - 1)).toBeLessThan(1.34e-3);
    expect(r.pf).toBeGreaterThanOrEqual(r.bounds.lower);
    expect(r.pf).toBeLessThanOrEqual(r.bounds.upper);
    expect(r.method).toMatch(/lattice/);
  });

  it('five equicorrelated points (ρ = ½) at β = 0: pf = 1 − 1/(m + 1)', () => {
    const r = seriesSystemFailure([0, 0, 0, 0, 0], equicorrelated(5, 0.5), { seed: 3 });
    // source: orthant probability of equicorrelated normals with ρ = 1/2 is 1/(m + 1) (Tong 1990; from memory)
    expect(Math.abs(r.pf / (1 - 1 / 6) - 1)).toBeLessThan(1.34e-3);
  });

  it('three rare points, a correlated pair and an independent third: relative accuracy kept', () => {
    const alphas = [[1, 0, 0], [0.8, 0.6, 0], [0, 0, 1]];
    const r = seriesSystemFailure([4, 4.2, 4.4], alphas, { seed: 11 });
    const pair = seriesSystemFailure([4, 4.2], [[1, 0], [0.8, 0.6]]).pf;
    const third = normalSf(4.4);
    // common practice: a union with an independent event, 1 − (1 − P12)(1 − P3)
    const exact = pair + third - pair * third;
    expect(Math.abs(r.pf / exact - 1)).toBeLessThan(1.34e-3);
    expect(r.bounds.lower).toBeLessThanOrEqual(exact * (1 + 1e-12));
    expect(r.bounds.upper).toBeGreaterThanOrEqual(exact * (1 - 1e-12));
  });

  it('the same seed gives the same numbers; input order does not matter', () => {
    const alphas = equicorrelated(4, 0.3);
    const a = seriesSystemFailure([3, 3.1, 3.3, 3.6], alphas, { seed: 5 });
    const b = seriesSystemFailure([3, 3.1, 3.3, 3.6], alphas, { seed: 5 });
    // common practice: seeded, deterministic
    expect(b).toEqual(a);
    const reversed = seriesSystemFailure([3.6, 3.3, 3.1, 3], alphas.slice().reverse(), { seed: 5 });
    expect(reversed.pf).toBe(a.pf);
  });

  it('rejects malformed input', () => {
    expect(() => seriesSystemFailure([], [])).toThrow(/at least one/);
    expect(() => seriesSystemFailure([1, 2], [[1, 0]])).toThrow(/2 β but 1 α/);
    expect(() => seriesSystemFailure([1], [[0, 0]])).toThrow(/zero length/);
    expect(() => seriesSystemFailure([Number.NaN], [[1]])).toThrow(/NaN/);
  });
});
