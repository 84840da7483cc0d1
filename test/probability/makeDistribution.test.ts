import { describe, expect, it } from 'vitest';
import { DistributionError, type DistSpec } from '../../src/probability/distribution.js';
import { makeDistribution } from '../../src/probability/makeDistribution.js';

// Validation rules follow docs/scenario-format.md (which fields each distribution takes); common practice for the limits.
function rejects(spec: DistSpec, pattern: RegExp): void {
  let caught: unknown;
  try {
    makeDistribution(spec);
  } catch (e) {
    caught = e;
  }
  expect(caught, JSON.stringify(spec)).toBeInstanceOf(DistributionError);
  expect((caught as Error).message).toMatch(pattern);
}

describe('makeDistribution', () => {
  it('builds every distribution named in the contract', () => {
    const specs: DistSpec[] = [
      { dist: 'normal', mean: 1, sd: 0.1 },
      { dist: 'normal', mean: -2, cov: 0.1 },
      { dist: 'lognormal', mean: 1, cov: 0.05 },
      { dist: 'gumbel', mean: 160e3, cov: 0.25 },
      { dist: 'uniform', min: 0, max: 1 },
      { dist: 'truncnormal', mean: 0, sd: 1, min: -1, max: 2 },
      { dist: 'weibull', mean: 40, sd: 4 },
      { dist: 'beta', min: 0, max: 1, mean: 0.4, sd: 0.1 },
    ];
    for (const spec of specs) expect(makeDistribution(spec).name).toBe(spec.dist);
    expect(makeDistribution({ dist: 'normal', mean: -2, cov: 0.1 }).sd).toBeCloseTo(0.2, 15);
  });

  it('requires exactly one of sd and cov, positive', () => {
    rejects({ dist: 'normal', mean: 1 }, /'sd' or 'cov' is required/);
    rejects({ dist: 'normal', mean: 1, sd: 0.1, cov: 0.1 }, /either 'sd' or 'cov', not both/);
    rejects({ dist: 'gumbel', mean: 1, sd: 0 }, /'sd' must be > 0/);
    rejects({ dist: 'lognormal', mean: 1, cov: -0.1 }, /'cov' must be > 0/);
    rejects({ dist: 'normal', mean: 0, cov: 0.1 }, /zero mean/);
    rejects({ dist: 'normal', sd: 1 }, /'mean' is required/);
  });

  it('rejects non-finite numbers and fields a distribution does not take', () => {
    rejects({ dist: 'normal', mean: NaN, sd: 1 }, /'mean' must be a finite number/);
    rejects({ dist: 'normal', mean: 1, sd: Infinity }, /'sd' must be a finite number/);
    rejects({ dist: 'uniform', min: 0, max: 1, mean: 0.5 }, /'mean' is not a parameter/);
    rejects({ dist: 'lognormal', mean: 1, cov: 0.1, min: 0 }, /'min' is not a parameter/);
    rejects({ dist: 'truncnormal', mean: 0, sd: 1, min: 0, cov: 0.1 }, /'cov' is not a parameter/);
    rejects({ dist: 'gamma' as DistSpec['dist'], mean: 1, sd: 1 }, /unknown distribution 'gamma'/);
  });

  it('checks positivity and ordering', () => {
    rejects({ dist: 'lognormal', mean: -1, cov: 0.1 }, /lognormal: 'mean' must be > 0/);
    rejects({ dist: 'weibull', mean: 0, sd: 1 }, /weibull: 'mean' must be > 0/);
    rejects({ dist: 'uniform', min: 1, max: 1 }, /'min' \(1\) must be less than 'max' \(1\)/);
    rejects({ dist: 'uniform', min: 0 }, /'max' is required/);
    rejects({ dist: 'truncnormal', mean: 0, sd: 1, min: 2, max: 1 }, /must be less than 'max'/);
    rejects({ dist: 'truncnormal', mean: 0, sd: 1 }, /give 'min', 'max' or both/);
    rejects({ dist: 'truncnormal', mean: 0, sd: -1, min: 0 }, /parent normal\) must be > 0/);
    rejects({ dist: 'truncnormal', mean: 0, sd: 1, min: 50, max: 51 }, /holds no probability/);
  });

  it('rejects impossible beta moments and out-of-range weibull CoV', () => {
    rejects({ dist: 'beta', min: 0, max: 1, mean: 1, sd: 0.1 }, /'mean' \(1\) must lie strictly between/);
    // source: a beta variable on [0, 1] with mean m has sd < √(m(1 − m)) (Bhatia–Davis bound)
    rejects({ dist: 'beta', min: 0, max: 1, mean: 0.5, sd: 0.5 }, /too large .* below 0\.5/);
    expect(() => makeDistribution({ dist: 'beta', min: 0, max: 1, mean: 0.5, sd: 0.49 })).not.toThrow();
    rejects({ dist: 'weibull', mean: 1, cov: 1e-6 }, /outside the supported range/);
  });
});
