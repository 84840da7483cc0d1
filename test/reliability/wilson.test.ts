import { describe, expect, it } from 'vitest';
import { wilsonInterval } from '../../src/reliability/wilson.js';

/** Agreement to the 6 significant digits the reference table prints. */
function expectSixDigits(actual: number, expected: number): void {
  const unit = 10 ** (Math.floor(Math.log10(Math.abs(expected))) - 5);
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(0.5 * unit * 1.0001);
}

describe('Wilson 95 % interval', () => {
  // source: Wilson 1927, JASA 22:209; values from docs/verification.md §R6 (computed with scipy)
  const table: [number, number, number, number][] = [
    [10, 10_000, 5.43286e-4, 1.83994e-3],
    [100, 100_000, 8.22338e-4, 1.216e-3],
    [3, 1_000_000, 1.02027e-6, 8.82115e-6],
  ];
  for (const [k, n, lo, hi] of table) {
    it(`${k} failures in ${n}`, () => {
      const [a, b] = wilsonInterval(k, n);
      expectSixDigits(a, lo);
      expectSixDigits(b, hi);
    });
  }
  it('0 failures in 1e6 gives [0, 3.84144e-6]', () => {
    // source: docs/verification.md §R6, Wilson row for 0 / 1 000 000
    const [a, b] = wilsonInterval(0, 1_000_000);
    expect(a).toBe(0);
    expectSixDigits(b, 3.84144e-6);
  });
  it('all failures gives an upper limit of 1', () => {
    // common practice: the interval stays inside [0, 1]
    const [a, b] = wilsonInterval(20, 20);
    expect(b).toBe(1);
    expect(a).toBeGreaterThan(0.8);
    expect(a).toBeLessThan(1);
  });
});
