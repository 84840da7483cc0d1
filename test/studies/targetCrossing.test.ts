import { describe, expect, it } from 'vitest';
import { targetCrossings } from '../../src/studies/targetCrossing.js';

describe('where a swept β crosses the target', () => {
  it('interpolates linearly between the two cases around it, in any input order', () => {
    // common practice: linear interpolation; β 3.5 at 100 and 4.1 at 200 reach 3.8 half-way
    expect(targetCrossings([200, 100, 300], [4.1, 3.5, 4.4], 3.8)).toEqual([150]);
  });
  it('finds every crossing, counts a case on the target once, and none when β stays on one side', () => {
    const c = targetCrossings([1, 2, 3, 4], [3, 4, 3.8, 3], 3.8);
    expect(c[0]).toBeCloseTo(1.8, 12);
    expect(c.slice(1)).toEqual([3]);
    expect(targetCrossings([1, 2, 3], [4, 5, 6], 3.8)).toEqual([]);
    expect(targetCrossings([1, 2], [NaN, 4], 3.8)).toEqual([]);
  });
});
