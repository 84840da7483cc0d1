import { describe, expect, it } from 'vitest';
import { BlockRng } from '../../src/probability/blockRng.js';
import { normalCdf } from '../../src/probability/normal.js';
import { fillNormal, ZIGGURAT_EDGES, ZIGGURAT_R, ZIGGURAT_V } from '../../src/probability/ziggurat.js';

const f = (x: number): number => Math.exp(-0.5 * x * x);

describe('ziggurat normals', () => {
  it('its constants give 256 layers of equal area under exp(−x²/2)', () => {
    // Marsaglia & Tsang 2000: the base layer r·f(r) + ∫_r^∞ f = v, and the recursion from r
    // must end with a top layer x₁(1 − f(x₁)) of area v as well.
    const tail = Math.sqrt(2 * Math.PI) * normalCdf(-ZIGGURAT_R);
    expect(ZIGGURAT_R * f(ZIGGURAT_R) + tail).toBeCloseTo(ZIGGURAT_V, 13);
    const x1 = ZIGGURAT_EDGES[1];
    expect(x1 * (1 - f(x1))).toBeCloseTo(ZIGGURAT_V, 11);
    for (let i = 2; i < 256; i++) {
      // layer i: width x_i, height f(x_{i−1}) − f(x_i)
      expect(ZIGGURAT_EDGES[i] * (f(ZIGGURAT_EDGES[i - 1]) - f(ZIGGURAT_EDGES[i]))).toBeCloseTo(ZIGGURAT_V, 12);
    }
  });

  it('draws N(0, 1): moments, Kolmogorov–Smirnov, tails, sign balance', () => {
    const n = 400_000;
    const z = new Float64Array(n);
    fillNormal(new BlockRng(20261201, 9), z, n);
    let m = 0;
    let m2 = 0;
    let m4 = 0;
    let beyond3 = 0;
    let beyond37 = 0;
    let positive = 0;
    for (const v of z) {
      m += v;
      m2 += v * v;
      m4 += v ** 4;
      if (Math.abs(v) > 3) beyond3++;
      if (Math.abs(v) > 3.7) beyond37++; // the ziggurat's own tail starts at r = 3.654
      if (v > 0) positive++;
    }
    m /= n;
    // 4 standard errors: mean 1/√n, E[z²] √(2/n), E[z⁴] √(96/n) (normal moments, common practice)
    expect(Math.abs(m)).toBeLessThan(4 / Math.sqrt(n));
    expect(Math.abs(m2 / n - 1)).toBeLessThan(4 * Math.sqrt(2 / n));
    expect(Math.abs(m4 / n - 3)).toBeLessThan(4 * Math.sqrt(96 / n));
    const tailCount = (p: number, k: number): void => {
      expect(Math.abs(k - n * p), `${k} vs ${n * p}`).toBeLessThan(4 * Math.sqrt(n * p * (1 - p)));
    };
    tailCount(2 * normalCdf(-3), beyond3);
    tailCount(2 * normalCdf(-3.7), beyond37);
    tailCount(0.5, positive);
    const sorted = Float64Array.from(z).sort();
    let d = 0;
    for (let i = 0; i < n; i++) {
      const F = normalCdf(sorted[i]);
      d = Math.max(d, Math.abs(F - i / n), Math.abs(F - (i + 1) / n));
    }
    // common practice: Kolmogorov critical value 1.95/√n at the 0.1 % level
    expect(d).toBeLessThan(1.95 / Math.sqrt(n));
  });

  it('fills in pieces exactly as in one go', () => {
    const whole = new Float64Array(2000);
    fillNormal(new BlockRng(3, 2), whole, 2000);
    const rng = new BlockRng(3, 2);
    const a = new Float64Array(1234);
    const b = new Float64Array(766);
    fillNormal(rng, a, 1234);
    fillNormal(rng, b, 766);
    expect([...a, ...b]).toEqual(Array.from(whole));
  });
});
