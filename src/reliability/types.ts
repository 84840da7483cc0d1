/**
 * The shapes shared by every reliability method. reliability/ knows nothing of columns:
 * a problem is any limit state g on the physical variables plus the map from independent
 * standard normals u to those variables.
 */
import type { IsoTransform } from '../probability/nataf.js';

/** Failure is g(x) <= 0. Must not keep a reference to x (the array is reused). */
export type LimitState = (x: Float64Array) => number;

/**
 * g over a block of samples: out[b] = of(x_b) for b < count, x_b[i] = columns[i][b], bit-identical
 * to the one-sample `of` (Monte Carlo uses it in column-wise passes). It may throw where `of` would
 * not (the kernel then evaluates that block with `of`, sample by sample).
 */
export interface BlockLimitState {
  /** The one-sample limit state this block form equals; used only while it is the problem's g. */
  readonly of: LimitState;
  evaluate(columns: readonly Float64Array[], count: number, out: Float64Array): void;
}

export interface ReliabilityProblem {
  /** One name per physical variable, in the order of x. */
  names: string[];
  transform: IsoTransform;
  g: LimitState;
  /** Optional block form of g (see BlockLimitState). */
  gBlock?: BlockLimitState;
  /**
   * How far g may jump between neighbouring points, in g's own units (0 or absent: smooth to
   * rounding). A g traced by an iterative model (a path to a peak in steps) is piecewise smooth with
   * small jumps; FORM then takes central differences with a step and tolerances above the jumps (form.ts).
   */
  gNoise?: number;
}

/**
 * How a worker thread rebuilds a problem: `module` is an absolute path or file URL of a
 * compiled .js module whose export `exportName` is `(args) => ReliabilityProblem`.
 * `args` must survive structured cloning.
 */
export interface ProblemRecipe {
  module: string;
  exportName: string;
  args: unknown;
}

/** One step of the FORM search, kept for the report's convergence chart. */
export interface FormStep {
  iteration: number;
  beta: number; // ‖u‖ of the current point (negative when the origin fails, see form.ts)
  g: number;
  step: number; // line-search step length lambda accepted at this iteration (0 for the start)
}

export interface DesignPointCandidate {
  beta: number;
  designPointU: number[];
  designPointX: number[];
  /** u* / β. */
  alpha: number[];
}

/** FORM's design points combined as a linearised series system (seriesSystem.ts). */
export interface FormSystem {
  beta: number;
  pf: number;
  method: string;
  /** Ditlevsen's bounds on pf. */
  bounds: { lower: number; upper: number };
  /** The governing design point first, then the others by increasing β. */
  designPoints: DesignPointCandidate[];
}

export interface FormResult {
  names: string[];
  beta: number;
  /** Φ(−β), computed without cancellation. */
  pf: number;
  converged: boolean;
  /** Why it did not converge (absent when converged). */
  reason?: string;
  iterations: number;
  designPointU: number[];
  /** The design point in physical units. */
  designPointX: number[];
  /** u* / β: unit vector towards the design point; resistances < 0, loads > 0. */
  alpha: number[];
  /** α², summing to 1. */
  importance: number[];
  /**
   * Order-free importance vector γ (Der Kiureghian 2005): α J_{u,x} D normalised, D the standard
   * deviations of the linearised x. Equals α for independent variables.
   */
  gamma: number[];
  /** ∇g in u-space at the design point (SORM needs its norm). */
  gradientU: number[];
  history: FormStep[];
  /** Limit-state calls, restarts included. */
  calls: number;
  /** g at the origin of u-space (the median point for symmetric marginals). */
  g0: number;
  /** g(0) <= 0: the origin already fails; β is then negative (pf > 0.5). */
  originFails: boolean;
  /** A distinct design point with a similar β was found from another start. */
  multipleDesignPoints: boolean;
  otherDesignPoints: DesignPointCandidate[];
  /** Variables along which the gradient vanished or changed sign (searched again from offset starts). */
  doubtfulDirections: string[];
  /** All design points that count, as a series system; with one point, β and pf of FORM itself. */
  system: FormSystem;
  warnings: string[];
}

export type SormFormula = 'tvedt' | 'hohenbichler-rackwitz' | 'breitung' | 'form';

export interface SormResult {
  /** Generalised β = −Φ⁻¹(pf) of the formula used. */
  beta: number;
  pf: number;
  /** Which formula `pf` comes from. */
  used: SormFormula;
  /** null where the formula is not valid for these curvatures. */
  breitung: number | null;
  hohenbichlerRackwitz: number | null;
  tvedt: number | null;
  /** Principal curvatures, positive when the surface bends away from the origin. */
  curvatures: number[];
  /** Limit-state calls for the Hessian (FORM's not included). */
  calls: number;
  warnings: string[];
}

export interface SimulationProgress {
  samples: number;
  total: number;
  pf: number;
  cov: number;
}

export interface McTracePoint {
  samples: number;
  pf: number;
  lo: number;
  hi: number;
}

export interface McResult {
  pf: number;
  /** sqrt((1 − pf)/(N pf)); Infinity when there is no failure. */
  cov: number;
  /** −Φ⁻¹(pf); Infinity when pf = 0. */
  beta: number;
  samples: number;
  failures: number;
  /** Wilson score interval, 95 %. */
  ci95: [number, number];
  calls: number;
  /** Stopped before `samples` were done (target CoV reached or aborted). */
  stoppedEarly: boolean;
  /** Why it stopped early: 'target-cov' | 'aborted'. */
  stopReason?: 'target-cov' | 'aborted';
  /** pf and its Wilson interval at log-spaced sample counts (chunk boundaries). */
  trace: McTracePoint[];
  seed: number;
  /** Which sampler drew the numbers (what the seed means): probability/blockRng.ts SAMPLER_VERSION. */
  sampler: string;
  workers: number;
}

export interface IsResult {
  pf: number;
  /** From the sample variance of the weighted indicator; Infinity when no sample failed. */
  cov: number;
  beta: number;
  calls: number;
  samples: number;
  failures: number;
  stoppedEarly: boolean;
  stopReason?: 'target-cov' | 'aborted';
  /** The sampling centre (u-space). */
  centreU: number[];
  seed: number;
  workers: number;
  warnings: string[];
}

export interface SubsetLevel {
  /** Intermediate threshold b_i (the last level's is 0). */
  threshold: number;
  /** Conditional probability P(g <= b_i | g <= b_{i-1}). */
  p: number;
  /** Chain-correlation factor γ_i of this level (0 for the first, independent level). */
  gamma: number;
}

export interface SubsetResult {
  pf: number;
  cov: number;
  beta: number;
  calls: number;
  levels: SubsetLevel[];
  /** False when the cap on levels was hit before reaching g <= 0. */
  converged: boolean;
  seed: number;
  /** Independent runs averaged to reach a target CoV (absent: one run). */
  runs?: number;
  warnings: string[];
}
