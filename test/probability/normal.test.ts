import { describe, expect, it } from 'vitest';
import jstatModule from 'jstat';
import { normalCdf, normalPdf, normalQuantile, normalQuantileUpper, normalSf } from '../../src/probability/normal.js';

const jStat = jstatModule.jStat ?? jstatModule;

/** exp(−x²/2) with x split so that the square of the leading part is exact. */
function expHalfSquareExact(x: number): number {
  const hi = Math.round(x * 1048576) / 1048576;
  const lo = x - hi;
  return Math.exp(-0.5 * hi * hi) * Math.exp(-0.5 * lo * (2 * hi + lo));
}

/**
 * Independent Φ for the tests (common practice, textbook formulas):
 * x > −1.2: erf by its all-positive series erf z = (2/√π) e^{−z²} Σ 2ⁿ z^{2n+1}/(1·3···(2n+1))
 *   (Abramowitz & Stegun 7.1.6); x ≤ −1.2: Laplace's continued fraction for the Mills ratio
 *   Φ(−t) = φ(t)/(t + 1/(t + 2/(t + 3/(t + ...)))) (A&S 26.2.14), evaluated backwards.
 */
function referencePhi(x: number): number {
  if (x > -1.2) {
    const z = x / Math.SQRT2;
    let term = z;
    let sum = z;
    for (let n = 1; n < 400 && Math.abs(term) > 1e-18 * Math.abs(sum); n++) {
      term *= (2 * z * z) / (2 * n + 1);
      sum += term;
    }
    const erf = (2 / Math.sqrt(Math.PI)) * expHalfSquareExact(Math.SQRT2 * z) * sum;
    return 0.5 + 0.5 * erf;
  }
  const t = -x;
  let cf = t;
  for (let k = 5000; k >= 1; k--) cf = t + k / cf;
  return expHalfSquareExact(t) / Math.sqrt(2 * Math.PI) / cf;
}

function relErr(a: number, b: number): number {
  return Math.abs(a - b) / Math.abs(b);
}

describe('normalCdf (Cody)', () => {
  it('matches tabulated values of Φ', () => {
    // source: Abramowitz & Stegun (1964) Table 26.1, P(1) = 0.841344746068543 (digits from memory)
    expect(relErr(normalCdf(-1), 0.158655253931457)).toBeLessThan(1e-14);
    expect(relErr(normalCdf(1), 0.841344746068543)).toBeLessThan(1e-14);
    // source: docs/verification.md §R1c2: pf = Φ(−5) = 2.86652e-7 (mpmath); full digits from memory
    expect(relErr(normalCdf(-5), 2.866515718791939e-7)).toBeLessThan(1e-14);
    // from memory: Φ(−10) = 7.619853024160527e-24; confirmed by mpmath 1.3.0 ncdf(−10) = 7.619853024160526066e-24 (30 digits)
    expect(relErr(normalCdf(-10), 7.619853024160526066e-24)).toBeLessThan(1e-14);
    // from memory: Φ(−37) ≈ 5.7255e-300; source: mpmath 1.3.0 ncdf(−37) = 5.7255712225245768227e-300 (30 digits)
    expect(relErr(normalCdf(-37), 5.7255712225245768227e-300)).toBeLessThan(1e-14);
  });

  it('reproduces the pf of the closed-form oracles of docs/verification.md §R1', () => {
    // source: docs/verification.md §R1a (beta 3.12348 → pf 8.93645e-4), §R1c1, §R1c3, §R1f1 (6 digits)
    expect(relErr(normalCdf(-3.12348), 8.93645e-4)).toBeLessThan(3e-5);
    expect(relErr(normalSf(3.5), 2.32629e-4)).toBeLessThan(3e-6);
    expect(relErr(normalSf(4.75342), 1.0e-6)).toBeLessThan(3e-5);
    expect(relErr(normalCdf(-4.36436), 6.37484e-6)).toBeLessThan(3e-5);
  });

  it('keeps the upper tail without cancellation: β₅₀ from β₁ (Φ(β₅₀) = Φ(β₁)^50)', () => {
    // source: docs/verification.md §R5, period conversion check values (4.7 → 3.82631, 5.2 → 4.41794, 2.9 → 1.34600)
    const beta50 = (beta1: number) => normalQuantileUpper(-Math.expm1(50 * Math.log1p(-normalSf(beta1))));
    expect(beta50(4.7)).toBeCloseTo(3.82631, 5);
    expect(beta50(5.2)).toBeCloseTo(4.41794, 5);
    expect(beta50(2.9)).toBeCloseTo(1.346, 5);
  });

  it('agrees with jstat for |x| ≤ 5', () => {
    // common practice: cross-check against an independent implementation (jstat's erf-based cdf)
    let worst = 0;
    for (let x = -5; x <= 5; x += 0.0137) {
      const ours = normalCdf(x);
      const theirs = jStat.normal.cdf(x, 0, 1) as number;
      worst = Math.max(worst, relErr(ours, theirs));
    }
    expect(worst).toBeLessThan(1e-10); // jstat's erf is good to ~5e-11 relative here, ours to ~1e-15 (next test)
  });

  it('agrees to 1e-14 relative with an independent series / continued-fraction evaluation, x from −37.5 to 5', () => {
    let worst = 0;
    for (let x = -37.5; x <= 5; x += 0.01311) {
      worst = Math.max(worst, relErr(normalCdf(x), referencePhi(x)));
    }
    expect(worst).toBeLessThan(1e-14);
  });

  it('is symmetric, sums to one and has the right limits', () => {
    for (let x = -8; x <= 8; x += 0.173) {
      expect(normalSf(x)).toBe(normalCdf(-x));
      expect(Math.abs(normalCdf(x) + normalSf(x) - 1)).toBeLessThan(2e-16);
    }
    expect(normalCdf(0)).toBe(0.5);
    expect(normalCdf(-Infinity)).toBe(0);
    expect(normalCdf(Infinity)).toBe(1);
    expect(normalCdf(-40)).toBe(0);
    expect(Number.isNaN(normalCdf(NaN))).toBe(true);
  });

  it('is monotone across the branch points of the rational approximations', () => {
    for (const b of [0.66291, 5.656854248, -0.66291, -5.656854248]) {
      const xs = [b - 1e-9, b - 1e-13, b, b + 1e-13, b + 1e-9];
      for (let i = 1; i < xs.length; i++) expect(normalCdf(xs[i])).toBeGreaterThanOrEqual(normalCdf(xs[i - 1]));
    }
  });

  it('Φ and its density agree (dΦ/dx = φ by central differences)', () => {
    for (const x of [-30, -10, -4, -1, 0, 0.5, 2]) {
      const h = 1e-5 / Math.max(1, Math.abs(x)); // truncation error ~ h²x²/6
      const deriv = (normalCdf(x + h) - normalCdf(x - h)) / (2 * h);
      expect(relErr(deriv, normalPdf(x))).toBeLessThan(1e-6);
    }
    // source: definition φ(0) = 1/√(2π)
    expect(normalPdf(0)).toBeCloseTo(1 / Math.sqrt(2 * Math.PI), 16);
    expect(normalPdf(Infinity)).toBe(0);
    expect(normalPdf(-Infinity)).toBe(0);
  });
});

describe('normalQuantile (Wichura AS241)', () => {
  it('matches known percentage points', () => {
    // from memory: Φ⁻¹(0.975) = 1.959963984540054, Φ⁻¹(0.05) = −1.6448536269514722
    expect(relErr(normalQuantile(0.975), 1.959963984540054)).toBeLessThan(1e-15);
    expect(relErr(normalQuantile(0.05), -1.6448536269514722)).toBeLessThan(1e-15);
    // source: docs/verification.md §R1c3: Φ⁻¹(1e-6) = −4.75342
    expect(normalQuantile(1e-6)).toBeCloseTo(-4.75342, 5);
    expect(normalQuantileUpper(1e-6)).toBeCloseTo(4.75342, 5);
    expect(normalQuantile(0.5)).toBe(0);
    expect(normalQuantile(0)).toBe(-Infinity);
    expect(normalQuantile(1)).toBe(Infinity);
    expect(Number.isNaN(normalQuantile(1.5))).toBe(true);
  });

  it('round-trips Φ⁻¹(Φ(x)) to 1e-14 relative over |x| ≤ 37 (upper tail through sf)', () => {
    let worst = 0;
    for (let x = -37.5; x <= 37.5; x += 0.00731) {
      if (Math.abs(x) < 0.01) continue; // relative error is meaningless at 0
      const back = x <= 0 ? normalQuantile(normalCdf(x)) : normalQuantileUpper(normalSf(x));
      worst = Math.max(worst, relErr(back, x));
    }
    expect(worst).toBeLessThan(1e-14);
  });

  it('round-trips Φ(Φ⁻¹(p)) to 1e-14 relative for p from 1e-300 to 1/2', () => {
    // Φ amplifies a relative error ε in x into about x²·ε in p, so the bound scales with x².
    let worst = 0;
    for (let e = -300; e <= -0.302; e += 0.0997) {
      const p = Math.pow(10, e);
      const x = normalQuantile(p);
      const scale = Math.max(1, x * x);
      worst = Math.max(worst, relErr(normalCdf(x), p) / scale);
      worst = Math.max(worst, relErr(normalSf(normalQuantileUpper(p)), p) / scale);
    }
    expect(worst).toBeLessThan(1e-15);
  });

  it('agrees with jstat for |x| ≤ 5', () => {
    // common practice: cross-check against an independent implementation (jstat normal.inv)
    let worst = 0;
    for (let x = -5; x <= 5; x += 0.0173) {
      const p = normalCdf(x);
      const theirs = jStat.normal.inv(p, 0, 1) as number;
      worst = Math.max(worst, Math.abs(normalQuantile(p) - theirs) / Math.max(1, Math.abs(theirs)));
    }
    expect(worst).toBeLessThan(1e-9);
  });

  it('normalQuantileUpper(q) = Φ⁻¹(1 − q) and is exact where 1 − q is representable', () => {
    for (const q of [0.5, 0.3, 0.1, 0.025, 1e-3]) {
      expect(Math.abs(normalQuantileUpper(q) - normalQuantile(1 - q))).toBeLessThan(1e-14);
    }
    expect(normalQuantileUpper(0.5)).toBe(0);
    expect(normalQuantileUpper(0)).toBe(Infinity);
    // the point of it: 1 − 1e-20 rounds to 1, the upper quantile does not
    expect(normalQuantileUpper(1e-20)).toBeCloseTo(-normalQuantile(1e-20), 14);
    expect(Number.isFinite(normalQuantileUpper(1e-300))).toBe(true);
  });
});
