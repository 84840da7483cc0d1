/**
 * Textbook limit states with known answers (see docs/verification.md, part R), built
 * from plain arguments so a worker thread can rebuild them from a ProblemRecipe. Used by the
 * tests and by the benchmark when no column recipe is given.
 */
import { makeDistribution } from '../probability/makeDistribution.js';
import { natafTransform } from '../probability/nataf.js';
import type { DistSpec } from '../probability/distribution.js';
import type { IsoTransform } from '../probability/nataf.js';
import type { ProblemRecipe, ReliabilityProblem } from './types.js';
import { compiledTwin } from '../runtime/compiledTwin.js';

/** A recipe naming the compiled twin of this module (dist/src/reliability/testProblems.js). */
export function testProblemRecipe(exportName: string, args: unknown): ProblemRecipe {
  return { module: compiledTwin(import.meta.url, 'testProblems.js').href, exportName, args };
}

/** x = u: independent standard normals. */
function identity(n: number): IsoTransform {
  return {
    n,
    toPhysical: (u, x) => x.set(u),
    toStandard: (x, u) => u.set(x),
  };
}

/** g = β − (1/√n) Σ u_i with u iid N(0, 1): exact pf = Φ(−β). */
export function linearSum(args: { n: number; beta: number }): ReliabilityProblem {
  const { n, beta } = args;
  const scale = 1 / Math.sqrt(n);
  return {
    names: Array.from({ length: n }, (_, i) => `u${i + 1}`),
    transform: identity(n),
    g: (x) => {
      let s = 0;
      for (let i = 0; i < n; i++) s += x[i];
      return beta - scale * s;
    },
  };
}

/** g = β − u_n + (κ/2) Σ_{i<n} u_i² (a paraboloid with n − 1 equal curvatures κ). */
export function paraboloid(args: { n: number; beta: number; kappa: number }): ReliabilityProblem {
  const { n, beta, kappa } = args;
  return {
    names: Array.from({ length: n }, (_, i) => `u${i + 1}`),
    transform: identity(n),
    g: (x) => {
      let q = 0;
      for (let i = 0; i < n - 1; i++) q += x[i] * x[i];
      return beta - x[n - 1] + (kappa / 2) * q;
    },
  };
}

/**
 * g = c − u1 − k|u2| (+ n − 2 variables without effect): a load u1 made worse by an effect of
 * unknown sign, like a bow of either direction. Two design points, on the half-planes
 * u1 ± k u2 ≥ c: β = c/√(1 + k²) each, α·α' = (1 − k²)/(1 + k²). At every point with u2 = 0 the
 * gradient along u2 has one-sided differences of opposite sign. Exact pf = ∫ φ(t) Φ(−(c − k|t|)) dt.
 */
export function symmetricKink(args: { c: number; k: number; n?: number }): ReliabilityProblem {
  const { c, k } = args;
  const n = args.n ?? 2;
  return {
    names: Array.from({ length: n }, (_, i) => `u${i + 1}`),
    transform: identity(n),
    g: (x) => c - x[0] - k * Math.abs(x[1]),
  };
}

/** g = R − S, optionally correlated (Nataf). */
export function resistanceMinusLoad(args: { r: DistSpec; s: DistSpec; rho?: number }): ReliabilityProblem {
  const rho = args.rho ?? 0;
  const correlation = rho === 0 ? null : [[1, rho], [rho, 1]];
  return {
    names: ['R', 'S'],
    transform: natafTransform([makeDistribution(args.r), makeDistribution(args.s)], correlation),
    g: (x) => x[0] - x[1],
  };
}

/** g = R·θ − S with independent variables (docs/verification.md §R1e). */
export function resistanceModelLoad(args: { r: DistSpec; theta: DistSpec; s: DistSpec }): ReliabilityProblem {
  return {
    names: ['R', 'theta', 'S'],
    transform: natafTransform([makeDistribution(args.r), makeDistribution(args.theta), makeDistribution(args.s)], null),
    g: (x) => x[0] * x[1] - x[2],
  };
}

/** Euler column with uncertain effective-length factor (docs/verification.md §R1g): g = π²EI/(KL)² − P. */
export function eulerColumn(args: { length: number }): ReliabilityProblem {
  const L = args.length;
  return {
    names: ['E', 'I', 'K', 'P'],
    transform: natafTransform(
      [
        makeDistribution({ dist: 'lognormal', mean: 210e9, cov: 0.03 }),
        makeDistribution({ dist: 'lognormal', mean: 2.003e-5, cov: 0.04 }),
        makeDistribution({ dist: 'lognormal', mean: 0.85, cov: 0.15 }),
        makeDistribution({ dist: 'lognormal', mean: 700e3, cov: 0.2 }),
      ],
      null,
    ),
    g: (x) => (Math.PI * Math.PI * x[0] * x[1]) / ((x[2] * L) ** 2) - x[3],
  };
}

/** Steel beam g = Fy·Z − 1140 kip·in (Haldar & Mahadevan 2000, ch. 7), in kip and inch. */
export function steelBeam(args: { fy: DistSpec; z: DistSpec }): ReliabilityProblem {
  return {
    names: ['Fy', 'Z'],
    transform: natafTransform([makeDistribution(args.fy), makeDistribution(args.z)], null),
    g: (x) => x[0] * x[1] - 1140,
  };
}

/**
 * Short column in biaxial bending (Der Kiureghian 2005, ch. 14), SI units:
 * g = 1 − M1/(S1 Y) − M2/(S2 Y) − (P/(A Y))². `order` permutes the variables (a permutation of
 * [0, 1, 2, 3] = M1, M2, P, Y) to check that β and γ do not depend on it.
 */
export function shortColumn(args: { order?: number[] }): ReliabilityProblem {
  const order = args.order ?? [0, 1, 2, 3];
  const names0 = ['M1', 'M2', 'P', 'Y'];
  const specs: DistSpec[] = [
    { dist: 'normal', mean: 250e3, cov: 0.3 },
    { dist: 'normal', mean: 125e3, cov: 0.3 },
    { dist: 'gumbel', mean: 2500e3, cov: 0.2 },
    { dist: 'weibull', mean: 40e6, cov: 0.1 },
  ];
  const rho0 = [
    [1, 0.5, 0.3, 0],
    [0.5, 1, 0.3, 0],
    [0.3, 0.3, 1, 0],
    [0, 0, 0, 1],
  ];
  const S1 = 0.03;
  const S2 = 0.015;
  const A = 0.19;
  // position of each original variable in the permuted vector
  const at = [0, 1, 2, 3].map((k) => order.indexOf(k));
  const [iM1, iM2, iP, iY] = at;
  return {
    names: order.map((k) => names0[k]),
    transform: natafTransform(
      order.map((k) => makeDistribution(specs[k])),
      order.map((a) => order.map((b) => rho0[a][b])),
    ),
    g: (x) => {
      const y = x[iY];
      const p = x[iP] / (A * y);
      return 1 - x[iM1] / (S1 * y) - x[iM2] / (S2 * y) - p * p;
    },
  };
}

/** g = R − S of (a) but misbehaving once S exceeds `above`: returns NaN or throws. */
export function misbehaving(args: { mode: 'nan' | 'throw' | 'infinity'; above: number }): ReliabilityProblem {
  const base = resistanceMinusLoad({ r: { dist: 'normal', mean: 200, sd: 20 }, s: { dist: 'normal', mean: 100, sd: 25 } });
  return {
    ...base,
    g: (x) => {
      if (x[1] > args.above) {
        if (args.mode === 'throw') throw new Error('load beyond the model range');
        return args.mode === 'nan' ? NaN : -Infinity;
      }
      return x[0] - x[1];
    },
  };
}
