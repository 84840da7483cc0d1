import { describe, expect, it } from 'vitest';
import { makeDistribution } from '../../src/probability/makeDistribution.js';
import { normalQuantile } from '../../src/probability/normal.js';
import { tornado } from '../../src/sensitivity/tornado.js';

// g = R − S normals of docs/verification.md §R1a (source: Cornell 1969, second-moment theory)
const R = makeDistribution({ dist: 'normal', mean: 200, sd: 20 });
const S = makeDistribution({ dist: 'normal', mean: 100, sd: 25 });
const z95 = normalQuantile(0.95);

describe('tornado', () => {
  it('puts each variable at its quantile and the others at their means', () => {
    const utilization = (x: Float64Array): number => x[1] / x[0];
    const entries = tornado(['R', 'S'], [R, S], utilization);
    // S has the larger swing: 100 ± 25·1.645 over 200 versus 100 / (200 ± 20·1.645)
    expect(entries.map((e) => e.variable)).toEqual(['S', 'R']);
    const s = entries[0];
    expect(s.lowValue).toBeCloseTo(100 - 25 * z95, 10);
    expect(s.highValue).toBeCloseTo(100 + 25 * z95, 10);
    expect(s.low).toBeCloseTo((100 - 25 * z95) / 200, 12);
    expect(s.high).toBeCloseTo((100 + 25 * z95) / 200, 12);
    const r = entries[1];
    expect(r.low).toBeCloseTo(100 / (200 - 20 * z95), 12);
    expect(r.high).toBeCloseTo(100 / (200 + 20 * z95), 12);
    expect(r.swing).toBeCloseTo(Math.abs(r.high - r.low), 15);
  });

  it('orders the log-column oracle K > P > I > E (docs/verification.md §R3c, own construction)', () => {
    const names = ['E', 'I', 'K', 'P'];
    const dists = [
      makeDistribution({ dist: 'lognormal', mean: 210e9, cov: 0.03 }),
      makeDistribution({ dist: 'lognormal', mean: 2.003e-5, cov: 0.04 }),
      makeDistribution({ dist: 'lognormal', mean: 0.85, cov: 0.15 }),
      makeDistribution({ dist: 'lognormal', mean: 700e3, cov: 0.2 }),
    ];
    const lnMargin = (x: Float64Array): number => Math.log((Math.PI ** 2 * x[0] * x[1]) / (x[2] * 5) ** 2 / x[3]);
    // source: docs/verification.md §R3c ordering check (own construction)
    expect(tornado(names, dists, lnMargin).map((e) => e.variable)).toEqual(['K', 'P', 'I', 'E']);
  });

  it('honours other quantile levels and rejects bad ones', () => {
    const [e] = tornado(['S'], [S], (x) => x[0], { lowQ: 0.1, highQ: 0.9 });
    expect(e.low).toBeCloseTo(100 + 25 * normalQuantile(0.1), 10);
    expect(() => tornado(['S'], [S], (x) => x[0], { lowQ: 0.9, highQ: 0.1 })).toThrow();
    expect(() => tornado(['S', 'R'], [S], (x) => x[0])).toThrow();
  });
});
