import { describe, expect, it } from 'vitest';
import { fillUniform, normalStream, uniformStream } from '../../src/probability/rng.js';

// Statistical checks use fixed seeds and 4-standard-error tolerances (common practice).
const N = 1_000_000;

describe('uniformStream', () => {
  it('is deterministic in (seed, stream)', () => {
    const a = fillUniform(uniformStream(20261201, 3), new Float64Array(1000));
    const b = fillUniform(uniformStream(20261201, 3), new Float64Array(1000));
    expect(Array.from(a)).toEqual(Array.from(b));
  });

  it('gives different sequences for different streams and seeds', () => {
    const base = fillUniform(uniformStream(7, 0), new Float64Array(100));
    const otherStream = fillUniform(uniformStream(7, 1), new Float64Array(100));
    const otherSeed = fillUniform(uniformStream(8, 0), new Float64Array(100));
    let sameStream = 0;
    let sameSeed = 0;
    for (let i = 0; i < 100; i++) {
      if (base[i] === otherStream[i]) sameStream++;
      if (base[i] === otherSeed[i]) sameSeed++;
    }
    expect(sameStream).toBe(0);
    expect(sameSeed).toBe(0);
  });

  it('stays strictly inside (0, 1), uses 53 bits and is uniform (mean, variance, 100-bin chi-square)', () => {
    const next = uniformStream(12345, 0);
    let sum = 0;
    let sumSq = 0;
    let min = 1;
    let max = 0;
    let beyond32Bits = 0;
    const bins = new Float64Array(100);
    for (let i = 0; i < N; i++) {
      const u = next();
      sum += u;
      sumSq += u * u;
      if (u < min) min = u;
      if (u > max) max = u;
      if (!Number.isInteger(u * 4294967296)) beyond32Bits++;
      bins[Math.floor(u * 100)]++;
    }
    expect(min).toBeGreaterThan(0);
    expect(max).toBeLessThan(1);
    expect(beyond32Bits).toBeGreaterThan(0.99 * N);
    const mean = sum / N;
    expect(Math.abs(mean - 0.5)).toBeLessThan(4 * Math.sqrt(1 / 12 / N));
    const variance = sumSq / N - mean * mean;
    // Var of the sample variance of U(0,1): (1/80 − 1/144)/N
    expect(Math.abs(variance - 1 / 12)).toBeLessThan(4 * Math.sqrt((1 / 80 - 1 / 144) / N));
    let chi2 = 0;
    for (const count of bins) chi2 += (count - N / 100) ** 2 / (N / 100);
    // chi-square with 99 degrees of freedom: mean 99, sd √198
    expect(chi2).toBeLessThan(99 + 4 * Math.sqrt(198));
  });

  it('rejects a non-finite seed or a bad stream index', () => {
    expect(() => uniformStream(NaN, 0)).toThrow();
    expect(() => uniformStream(1, -1)).toThrow();
    expect(() => uniformStream(1, 0.5)).toThrow();
  });
});

describe('normalStream', () => {
  it('has mean 0, variance 1 and independent streams', () => {
    const a = normalStream(99, 0);
    const b = normalStream(99, 1);
    let s = 0;
    let ss = 0;
    let cross = 0;
    let fourth = 0;
    for (let i = 0; i < N; i++) {
      const x = a();
      const y = b();
      s += x;
      ss += x * x;
      fourth += x ** 4;
      cross += x * y;
    }
    expect(Math.abs(s / N)).toBeLessThan(4 / Math.sqrt(N));
    expect(Math.abs(ss / N - 1)).toBeLessThan(4 * Math.sqrt(2 / N));
    // E[X⁴] = 3, Var(X⁴) = 105 − 9 = 96
    expect(Math.abs(fourth / N - 3)).toBeLessThan(4 * Math.sqrt(96 / N));
    expect(Math.abs(cross / N)).toBeLessThan(4 / Math.sqrt(N));
  });

  it('is reproducible', () => {
    const a = normalStream(5, 2);
    const b = normalStream(5, 2);
    for (let i = 0; i < 100; i++) expect(a()).toBe(b());
  });
});
