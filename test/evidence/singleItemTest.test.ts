import { describe, expect, it } from 'vitest';
import { updateLognormalItem, updateNormalItem } from '../../src/evidence/singleItemTest.js';

describe('a test of this one item with its measurement error', () => {
  it('normal prior and reading: precision-weighted mean (normal–normal conjugacy, BDA3 §2.5, eq. 2.12)', () => {
    // prior N(10, 4²), one reading 16 with error sd 3: 1/s₁² = 1/16 + 1/9, m₁ = (10/16 + 16/9)·s₁²
    const post = updateNormalItem(10, 4, [16], 3);
    const precision = 1 / 16 + 1 / 9;
    expect(Math.abs(post.sd - Math.sqrt(1 / precision))).toBeLessThan(1e-12);
    expect(Math.abs(post.mean - (10 / 16 + 16 / 9) / precision)).toBeLessThan(1e-12);
    expect(post.mean).toBe(16 - (16 - 10) * (9 / 25)); // shrinkage 9/(9 + 16) towards the prior (same equation)
  });

  it('repeated readings act as one reading of their mean with error σₘ/√k (common practice)', () => {
    const a = updateNormalItem(10, 4, [15, 17, 16], 3);
    const b = updateNormalItem(10, 4, [16], 3 / Math.sqrt(3));
    expect(Math.abs(a.mean - b.mean)).toBeLessThan(1e-12);
    expect(Math.abs(a.sd - b.sd)).toBeLessThan(1e-12);
  });

  it('lognormal item: the same update on ln X (ζ² = ln(1 + V²), Melchers 1999, App. A)', () => {
    const post = updateLognormalItem(20e6, 10e6, [12e6], 0.15);
    const z0 = Math.sqrt(Math.log1p(0.25));
    const l0 = Math.log(20e6) - z0 * z0 / 2;
    const zm = Math.sqrt(Math.log1p(0.0225));
    const precision = 1 / z0 ** 2 + 1 / zm ** 2;
    expect(Math.abs(post.zeta - Math.sqrt(1 / precision))).toBeLessThan(1e-12);
    expect(Math.abs(post.lambda - (l0 / z0 ** 2 + Math.log(12e6) / zm ** 2) / precision)).toBeLessThan(1e-12);
  });

  it('needs a measurement error and positive readings', () => {
    expect(() => updateNormalItem(10, 4, [16], 0)).toThrow(/measurement error/);
    expect(() => updateLognormalItem(10, 4, [-1], 0.1)).toThrow(/> 0/);
    expect(() => updateNormalItem(10, 4, [], 1)).toThrow(/no test results/);
  });
});
