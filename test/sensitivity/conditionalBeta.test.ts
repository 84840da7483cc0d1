import { describe, expect, it } from 'vitest';
import { makeDistribution } from '../../src/probability/makeDistribution.js';
import { normalQuantile } from '../../src/probability/normal.js';
import { conditionalBeta } from '../../src/sensitivity/conditionalBeta.js';

/**
 * β of a linear limit state g = a0 + Σ a_i X_i in independent normals, with some X fixed:
 * the second-moment index (mean of g)/(sd of g), exact here (source: Cornell 1969).
 */
function linearBetaWithFixed(a0: number, a: number[], mean: number[], sd: number[]) {
  return (index: number, value: number): number => {
    let mu = a0;
    let variance = 0;
    a.forEach((ai, i) => {
      if (i === index) mu += ai * value;
      else {
        mu += ai * mean[i];
        variance += (ai * sd[i]) ** 2;
      }
    });
    return mu / Math.sqrt(variance);
  };
}

describe('conditionalBeta', () => {
  it('matches the closed form for g = R − S (source: Cornell 1969 / second-moment theory)', () => {
    const R = makeDistribution({ dist: 'normal', mean: 200, sd: 20 });
    const S = makeDistribution({ dist: 'normal', mean: 100, sd: 25 });
    const entries = conditionalBeta(['R', 'S'], [R, S], linearBetaWithFixed(0, [1, -1], [200, 100], [20, 25]));
    const z = normalQuantile(0.95);
    const byName = Object.fromEntries(entries.map((e) => [e.variable, e]));
    // fixing R at r: β = (r − μS)/σS; fixing S at s: β = (μR − s)/σR
    expect(byName.R.betaLow).toBeCloseTo((200 - 20 * z - 100) / 25, 10);
    expect(byName.R.betaHigh).toBeCloseTo((200 + 20 * z - 100) / 25, 10);
    expect(byName.S.betaLow).toBeCloseTo((200 - (100 - 25 * z)) / 20, 10);
    expect(byName.S.betaHigh).toBeCloseTo((200 - (100 + 25 * z)) / 20, 10);
    // swings: R 2·20·z/25 = 2.63, S 2·25·z/20 = 4.11 → S first
    expect(entries.map((e) => e.variable)).toEqual(['S', 'R']);
    expect(entries[0].swing).toBeCloseTo((2 * 25 * z) / 20, 10);
  });

  it('passes the variable index and quantile value to the callback', () => {
    const seen: [number, number][] = [];
    const X = makeDistribution({ dist: 'uniform', min: 0, max: 10 });
    conditionalBeta(['a', 'b'], [X, X], (i, v) => {
      seen.push([i, v]);
      return v;
    });
    expect(seen.map(([i]) => i)).toEqual([0, 0, 1, 1]);
    expect(seen[0][1]).toBeCloseTo(0.5, 12);
    expect(seen[1][1]).toBeCloseTo(9.5, 12);
  });
});
