import { describe, expect, it } from 'vitest';
import { DistributionError } from '../../src/probability/distribution.js';
import { makeDistribution } from '../../src/probability/makeDistribution.js';
import { equivalentCorrelation, natafTransform, physicalCorrelation } from '../../src/probability/nataf.js';
import { choleskyLower } from '../../src/probability/cholesky.js';
import { normalStream } from '../../src/probability/rng.js';

const normal = makeDistribution({ dist: 'normal', mean: 250, cov: 0.3 });
const gumbel2 = makeDistribution({ dist: 'gumbel', mean: 2500, cov: 0.2 });
const gumbel3 = makeDistribution({ dist: 'gumbel', mean: 10, cov: 0.3 });
const ln02 = makeDistribution({ dist: 'lognormal', mean: 5, cov: 0.2 });
const ln10 = makeDistribution({ dist: 'lognormal', mean: 200, cov: 0.1 });
const ln25 = makeDistribution({ dist: 'lognormal', mean: 100, cov: 0.25 });
const weibull10 = makeDistribution({ dist: 'weibull', mean: 40, cov: 0.1 });

function rejectsWith(fn: () => unknown, pattern: RegExp): void {
  let caught: unknown;
  try {
    fn();
  } catch (e) {
    caught = e;
  }
  expect(caught).toBeInstanceOf(DistributionError);
  expect((caught as Error).message).toMatch(pattern);
}

describe('equivalentCorrelation (Nataf rho0)', () => {
  it('reproduces the rho0 table of docs/verification.md §R1h', () => {
    // source: docs/verification.md §R1h (64×64 Gauss–Hermite, checked against closed forms)
    expect(equivalentCorrelation(normal, gumbel2, 0.3)).toBeCloseTo(0.309449, 6);
    expect(equivalentCorrelation(normal, gumbel2, 0.8)).toBeCloseTo(0.825198, 6);
    expect(equivalentCorrelation(normal, ln02, 0.5)).toBeCloseTo(0.504943, 6);
    expect(equivalentCorrelation(ln10, ln25, 0.5)).toBeCloseTo(0.505786, 6);
    expect(equivalentCorrelation(gumbel2, gumbel3, 0.5)).toBeCloseTo(0.515428, 6);
    expect(equivalentCorrelation(normal, weibull10, 0.5)).toBeCloseTo(0.506978, 6);
    // source: docs/verification.md §R1f4: LN–LN rho −0.5 → rho0 −0.512148
    expect(equivalentCorrelation(ln10, ln25, -0.5)).toBeCloseTo(-0.512148, 6);
  });

  it('remembers ρ0 per marginal pair without mixing pairs up', () => {
    // common practice (closed form for two lognormals): ρ0 = ln(1 + ρ V1 V2) / (ζ1 ζ2)
    const exact = (v1: number, v2: number, rho: number): number =>
      Math.log1p(rho * v1 * v2) / Math.sqrt(Math.log1p(v1 * v1) * Math.log1p(v2 * v2));
    const a = makeDistribution({ dist: 'lognormal', mean: 3, cov: 0.3 });
    for (const v2 of [0.4, 0.4000001, 0.4, 0.6]) {
      const b = makeDistribution({ dist: 'lognormal', mean: 2, cov: v2 });
      for (const rho of [0.7, -0.3, 0.7]) {
        expect(equivalentCorrelation(a, b, rho)).toBeCloseTo(exact(0.3, v2, rho), 10);
        expect(equivalentCorrelation(b, a, rho)).toBeCloseTo(equivalentCorrelation(a, b, rho), 12);
      }
    }
    const b = makeDistribution({ dist: 'lognormal', mean: 2, cov: 0.4 });
    expect(equivalentCorrelation(a, b, 0.7)).not.toBe(equivalentCorrelation(a, makeDistribution({ dist: 'lognormal', mean: 2, cov: 0.4000001 }), 0.7));
  });

  it('matches the exact lognormal formulas to 1e-10', () => {
    // source: Liu & Der Kiureghian 1986 (from memory): LN–LN rho0 = ln(1 + rho V1 V2)/(zeta1 zeta2);
    // N–LN rho0 = rho V/√ln(1 + V²) (docs/verification.md §R1h "exact F")
    const z1 = Math.sqrt(Math.log1p(0.01));
    const z2 = Math.sqrt(Math.log1p(0.0625));
    for (const rho of [-0.7, -0.3, 0.2, 0.5, 0.9]) {
      expect(Math.abs(equivalentCorrelation(ln10, ln25, rho) - Math.log1p(rho * 0.1 * 0.25) / (z1 * z2))).toBeLessThan(1e-10);
      expect(Math.abs(equivalentCorrelation(normal, ln02, rho) - (rho * 0.2) / Math.sqrt(Math.log1p(0.04)))).toBeLessThan(1e-10);
    }
  });

  it('is close to the Liu & Der Kiureghian (1986) fitted ratios', () => {
    // from memory: LDK86 F = 1.031 (N–Gumbel), 1.064 − 0.069 rho + 0.005 rho² (Gumbel–Gumbel),
    // 1.031 − 0.195 V + 0.328 V² (N–Weibull); the fits are good to about 1 %
    for (const rho of [0.2, 0.5, 0.8]) {
      expect(equivalentCorrelation(normal, gumbel2, rho) / rho).toBeCloseTo(1.031, 2);
      expect(equivalentCorrelation(gumbel2, gumbel3, rho) / rho).toBeCloseTo(1.064 - 0.069 * rho + 0.005 * rho * rho, 2);
    }
    expect(equivalentCorrelation(normal, weibull10, 0.5) / 0.5).toBeCloseTo(1.031 - 0.195 * 0.1 + 0.328 * 0.01, 2);
  });

  it('is the identity for two normals and for rho = 0, symmetric in its arguments, and inverts physicalCorrelation', () => {
    expect(equivalentCorrelation(normal, makeDistribution({ dist: 'normal', mean: 0, sd: 3 }), 0.37)).toBe(0.37);
    expect(equivalentCorrelation(gumbel2, weibull10, 0)).toBe(0);
    const a = equivalentCorrelation(gumbel2, weibull10, 0.4);
    expect(Math.abs(a - equivalentCorrelation(weibull10, gumbel2, 0.4))).toBeLessThan(1e-12);
    expect(Math.abs(physicalCorrelation(gumbel2, weibull10, a) - 0.4)).toBeLessThan(1e-12);
  });

  it('rejects |rho| ≥ 1 and correlations the marginals cannot reach', () => {
    rejectsWith(() => equivalentCorrelation(normal, gumbel2, 1), /strictly between -1 and 1/);
    rejectsWith(() => equivalentCorrelation(normal, gumbel2, -1.2), /strictly between -1 and 1/);
    // LN(V = 2) pair: the most negative reachable rho is (e^{−ln 5} − 1)/4 = −0.2
    const wild = makeDistribution({ dist: 'lognormal', mean: 1, cov: 2 });
    rejectsWith(() => equivalentCorrelation(wild, wild, -0.3), /cannot be reached/);
    expect(() => equivalentCorrelation(wild, wild, -0.15)).not.toThrow();
  });
});

describe('natafTransform', () => {
  // source: docs/verification.md §R2b (Der Kiureghian 2005 short column): M1, M2 ~ N, P ~ Gumbel, Y ~ Weibull
  const m1 = makeDistribution({ dist: 'normal', mean: 250e3, cov: 0.3 });
  const m2 = makeDistribution({ dist: 'normal', mean: 125e3, cov: 0.3 });
  const R = [
    [1, 0.5, 0.3, 0],
    [0.5, 1, 0.3, 0],
    [0.3, 0.3, 1, 0],
    [0, 0, 0, 1],
  ];
  const transform = natafTransform([m1, m2, gumbel2, weibull10], R);

  it('builds the reference equivalent correlation matrix', () => {
    // source: docs/verification.md §R2b: rho0(M1,P) = rho0(M2,P) = 0.309449, rho0(M1,M2) = 0.5
    expect(transform.normalCorrelation[0][2]).toBeCloseTo(0.309449, 6);
    expect(transform.normalCorrelation[1][2]).toBeCloseTo(0.309449, 6);
    expect(transform.normalCorrelation[0][1]).toBe(0.5);
    expect(transform.normalCorrelation[3][0]).toBe(0);
    expect(transform.n).toBe(4);
  });

  it('round-trips u → x → u and x → u → x, in place as well', () => {
    const u = new Float64Array([1.3, -0.7, 2.9, -3.1]);
    const x = new Float64Array(4);
    const back = new Float64Array(4);
    transform.toPhysical(u, x);
    transform.toStandard(x, back);
    for (let i = 0; i < 4; i++) expect(Math.abs(back[i] - u[i])).toBeLessThan(1e-12);
    // the reference design point maps into physical space consistently both ways
    const xs = new Float64Array([340.726e3, 170.363e3, 3222.41, 31.7692]);
    const us = new Float64Array(4);
    transform.toStandard(xs, us);
    const again = new Float64Array(4);
    transform.toPhysical(us, again);
    for (let i = 0; i < 4; i++) expect(Math.abs(again[i] - xs[i]) / xs[i]).toBeLessThan(1e-12);
    // source: docs/verification.md §R2b: FORM beta at that design point = 2.46602 (6 digits given)
    expect(Math.hypot(...us)).toBeCloseTo(2.46602, 4);
    const inPlace = Float64Array.from(u);
    transform.toPhysical(inPlace, inPlace);
    for (let i = 0; i < 4; i++) expect(inPlace[i]).toBe(x[i]);
  });

  it('samples the requested physical correlation (seeded; 4 standard errors)', () => {
    const g1 = makeDistribution({ dist: 'gumbel', mean: 10, cov: 0.2 });
    const rho = 0.5;
    const t = natafTransform([g1, gumbel3], [[1, rho], [rho, 1]]);
    const a = normalStream(2026, 0);
    const b = normalStream(2026, 1);
    const batches = 40;
    const perBatch = 10_000;
    const u = new Float64Array(2);
    const x = new Float64Array(2);
    const batchR: number[] = [];
    let sx = 0, sy = 0, sxx = 0, syy = 0, sxy = 0;
    for (let k = 0; k < batches; k++) {
      let bx = 0, by = 0, bxx = 0, byy = 0, bxy = 0;
      for (let i = 0; i < perBatch; i++) {
        u[0] = a();
        u[1] = b();
        t.toPhysical(u, x);
        bx += x[0]; by += x[1]; bxx += x[0] * x[0]; byy += x[1] * x[1]; bxy += x[0] * x[1];
      }
      const cov = bxy / perBatch - (bx / perBatch) * (by / perBatch);
      const vx = bxx / perBatch - (bx / perBatch) ** 2;
      const vy = byy / perBatch - (by / perBatch) ** 2;
      batchR.push(cov / Math.sqrt(vx * vy));
      sx += bx; sy += by; sxx += bxx; syy += byy; sxy += bxy;
    }
    const n = batches * perBatch;
    const r = (sxy / n - (sx / n) * (sy / n)) / Math.sqrt((sxx / n - (sx / n) ** 2) * (syy / n - (sy / n) ** 2));
    // standard error from the spread of the batch estimates (non-normal marginals: no closed form)
    const meanR = batchR.reduce((s, v) => s + v, 0) / batches;
    const sdR = Math.sqrt(batchR.reduce((s, v) => s + (v - meanR) ** 2, 0) / (batches - 1));
    const se = sdR / Math.sqrt(batches);
    expect(Math.abs(r - rho)).toBeLessThan(4 * se);
    // not vacuous: the uncorrected rho0 = rho would be detected (0.515 − 0.5 is many standard errors)
    expect(Math.abs(t.normalCorrelation[0][1] - rho)).toBeGreaterThan(8 * se);
  });

  it('is the plain marginal map without correlation', () => {
    const t = natafTransform([ln10, gumbel2], null);
    const x = new Float64Array(2);
    t.toPhysical(new Float64Array([-2, 3]), x);
    expect(x[0]).toBe(ln10.fromStandardNormal(-2));
    expect(x[1]).toBe(gumbel2.fromStandardNormal(3));
    expect(t.lower).toBeNull();
  });

  it('rejects bad correlation matrices with a DistributionError naming the problem', () => {
    const three = [normal, normal, normal];
    rejectsWith(() => natafTransform(three, [[1, 0.9, 0.9], [0.9, 1, -0.9], [0.9, -0.9, 1]]), /correlation matrix is not positive definite/);
    rejectsWith(() => natafTransform([normal, gumbel2], [[1, 1], [1, 1]]), /strictly between -1 and 1/);
    rejectsWith(() => natafTransform([normal, gumbel2], [[1, 0.2], [0.3, 1]]), /not symmetric/);
    rejectsWith(() => natafTransform([normal, gumbel2], [[1, 0.2], [0.2, 0.9]]), /with itself must be 1/);
    rejectsWith(() => natafTransform([normal, gumbel2], [[1, 0.2]]), /must be 2 × 2/);
    rejectsWith(() => natafTransform([normal, gumbel2], [[1, 0.2], [0.2, 1]].map((r) => r.map((v) => (v === 0.2 ? NaN : v)))), /not a finite number/);
  });

  it('rejects a physical matrix whose Nataf equivalent is not positive definite', () => {
    // LN(V = 2): rho = −0.15 → rho0 = ln(1 − 0.6)/ln 5 = −0.569; three such pairs are PD physically
    // (−0.15 > −1/2) but not in normal space (−0.569 < −1/2)
    const wild = makeDistribution({ dist: 'lognormal', mean: 1, cov: 2 });
    const R3 = [[1, -0.15, -0.15], [-0.15, 1, -0.15], [-0.15, -0.15, 1]];
    expect(choleskyLower(R3)).not.toBeNull();
    rejectsWith(() => natafTransform([wild, wild, wild], R3), /equivalent normal correlation matrix .* not positive definite/);
    rejectsWith(() => natafTransform([wild, wild], [[1, -0.3], [-0.3, 1]], ['E', 'fy']), /^E and fy: correlation -0.3 cannot be reached/);
  });
});

describe('natafTransform.toPhysicalRows (many points, column-wise)', () => {
  // The FORM self-check relies on it giving, bit for bit, what toPhysical gives point by point.
  const uniform = makeDistribution({ dist: 'uniform', min: 1, max: 3 });
  const truncated = makeDistribution({ dist: 'truncnormal', mean: 2, sd: 1, min: 0 });
  const beta = makeDistribution({ dist: 'beta', min: 0, max: 10, mean: 4, sd: 1.5 });
  const dists = [normal, gumbel2, ln10, weibull10, uniform, truncated, beta, ln25];
  const n = dists.length;
  const rows = 300;
  const uRows = new Float64Array(rows * n);
  const stream = normalStream(11, 0);
  for (let k = 0; k < uRows.length; k++) uRows[k] = 3 * stream();
  // far tails and both signs of zero as well as ordinary points
  uRows.set([0, -0, 9, -9, 38, -38, 1e-300, -1e-300], 0);

  function expectRowsMatch(correlation: number[][] | null): void {
    const t = natafTransform(dists, correlation);
    const columns = Array.from({ length: n }, () => new Float64Array(rows));
    t.toPhysicalRows(uRows, rows, columns);
    const x = new Float64Array(n);
    let mismatches = 0;
    for (let r = 0; r < rows; r++) {
      t.toPhysical(uRows.subarray(r * n, r * n + n), x);
      for (let i = 0; i < n; i++) if (!Object.is(columns[i][r], x[i])) mismatches++;
    }
    expect(mismatches).toBe(0);
  }

  it('equals toPhysical row by row, independent variables', () => expectRowsMatch(null));

  it('equals toPhysical row by row, correlated variables (sparse L0)', () => {
    const R = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? 1 : 0)));
    R[0][1] = R[1][0] = 0.3;
    R[2][7] = R[7][2] = -0.4;
    R[3][7] = R[7][3] = 0.2;
    expectRowsMatch(R);
  });

  it('fills only the first count entries', () => {
    const t = natafTransform(dists, null);
    const columns = Array.from({ length: n }, () => new Float64Array(rows).fill(-7));
    t.toPhysicalRows(uRows, 5, columns);
    expect(columns.every((c) => c[4] !== -7 && c[5] === -7)).toBe(true);
  });
});
