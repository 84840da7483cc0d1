/**
 * Everything the report shows, as one plain data structure.
 *
 * The report only READS this: it computes nothing of its own beyond unit conversion,
 * formatting and simple comparisons. Every number is in SI base units
 * (N, m, m², m⁴, m³, Pa, N·m/rad, N/m) unless its comment says otherwise; the report
 * converts to the display system chosen at write time. Variable names are the scenario
 * paths of docs/scenario-format.md (`column.material.E`, `loads.dead`, `model_factor` ...).
 */

/** What a number measures, so the report can pick a display unit. */
export type QuantityKind =
  | 'length' // m
  | 'area' // m²
  | 'inertia' // m⁴ (second moment of area)
  | 'sectionModulus' // m³
  | 'stress' // Pa (also E, fy)
  | 'force' // N
  | 'rotationalStiffness' // N·m/rad
  | 'translationalStiffness' // N/m
  | 'lineLoad' // N/m (force per length along the height)
  | 'moment' // N·m
  | 'dimensionless';

export type DistributionName = 'normal' | 'lognormal' | 'gumbel' | 'uniform' | 'truncnormal' | 'weibull' | 'beta' | 'studentt' | 'logstudentt';
export type MethodName = 'form' | 'sorm' | 'is' | 'mc' | 'subset';
export type EndName = 'bottom' | 'top';
/** Where the target comes from, as the user wrote it (echoed verbatim, never rewritten). */
export type TargetSource = string;
export type StrengthModelName =
  | 'first-yield'
  | 'aisc360-e3'
  | 'en1993-a0'
  | 'en1993-a'
  | 'en1993-b'
  | 'en1993-c'
  | 'en1993-d'
  | 'first-yield-en1993-a0'
  | 'first-yield-en1993-a'
  | 'first-yield-en1993-b'
  | 'first-yield-en1993-c'
  | 'first-yield-en1993-d'
  | 'first-yield-en1993-a0-plus-bow'
  | 'first-yield-en1993-a-plus-bow'
  | 'first-yield-en1993-b-plus-bow'
  | 'first-yield-en1993-c-plus-bow'
  | 'first-yield-en1993-d-plus-bow'
  | 'plastic-zone';

export interface ReportMeta {
  toolVersion: string; // package version, e.g. '0.1.0'
  seed: number;
  scenarioSha256: string; // hex digest of the scenario file's bytes
  date: string; // ISO 8601, e.g. '2026-12-01T18:40:00Z'
  commandLine: string; // as typed, e.g. 'stanchion assess m4.yaml --out reports/m4'
  scenarioTitle: string;
  scenarioFile: string; // file name as given ('-' for stdin)
}

/** The distribution parameters of one input, SI numbers in the row's kind (cov is a plain ratio). */
export interface InputParameters {
  value?: number; // fixed inputs only
  mean?: number;
  sd?: number;
  cov?: number;
  min?: number;
  max?: number;
}

export interface InputRow {
  path: string; // 'column.material.E'
  description: string; // 'Young's modulus'
  kind: QuantityKind;
  distribution: DistributionName | 'fixed';
  parameters: InputParameters;
  asWritten?: string; // what the user wrote, e.g. 'L/1500' or '2.5 MN m/rad'
  source?: string; // where the statistics come from, as written (test report, survey, code clause)
}

/** A distribution's summary before or after updating (SI in the row's kind; cov a plain ratio). */
export interface EvidenceMoments {
  distribution: DistributionName;
  /** for a log-Student-t: the mean of the lognormal with the same ln-location and ln-scale (it has no finite mean) */
  mean: number;
  /** Infinity when the sd is not finite (a Student-t with 2 degrees of freedom or fewer) */
  cov: number;
  fractile05: number;
  dof?: number;
}

/** A variable updated by test results (docs/evidence.md). */
export interface EvidenceRow {
  path: string;
  description: string;
  kind: QuantityKind;
  tests: number[];
  tested: 'similar' | 'this_one';
  method: string;
  measurementSd?: number;
  measurementCov?: number;
  source?: string;
  prior: EvidenceMoments;
  posterior: EvidenceMoments;
}

/** Prior and posterior density of an updated variable, both scaled by the larger peak (SI x). */
export interface MeasurementDensity {
  path: string;
  description: string;
  kind: QuantityKind;
  points: { x: number; prior: number; posterior: number }[];
  tests: number[];
  /** what updated it: test results (the posterior predictive) or measurements through the model (a fit to the posterior draws) */
  updatedBy?: 'tests' | 'measurements';
  /** the posterior draws binned (measurements through the model), on the curves' scale */
  histogram?: { x0: number; x1: number; density: number }[];
}

export interface BetaVerdictRow {
  beta: number;
  pf: number;
  meets: boolean;
}

/** One step of the evidence: as written, with the tests, and the measurements, given the survived loads. */
export interface EvidenceStepRow extends BetaVerdictRow {
  step: 'as_written' | 'tests' | 'measurements' | 'survival';
  label: string;
}

/** A reading through the model as entered, against the model at the prior and posterior means (SI: rad or Hz). */
export interface ModelReadingRow {
  index: number;
  description: string;
  unit: 'rad' | 'Hz';
  measured: number;
  predictedPrior: number;
  predictedPosterior: number;
  measurementCov: number;
  source?: string;
}

/** The posterior sampler of the measurements through the model and its diagnostics. */
export interface ModelUpdateReport {
  method: string;
  chains: number;
  warmup: number;
  draws: number;
  acceptance: number[];
  maxRhat: number;
  minEss: number;
  rhatLimit: number;
  essMinimum: number;
  converged: boolean;
  readings: ModelReadingRow[];
  variables: {
    path: string;
    description: string;
    kind: QuantityKind;
    prior: { mean: number; sd: number; q05: number; q95: number };
    posterior: { mean: number; sd: number; q05: number; q95: number };
    fittedDist: string;
    rhat: number;
    ess: number;
  }[];
  correlations: { a: string; b: string; rho: number }[];
  approximation: string;
  notes: string[];
}

/** "What the measurements changed": the steps of the evidence, densities, the sampler, the survival study. */
export interface MeasurementsReport {
  target: number;
  /** in order, the first is as written and the last is `after` */
  steps?: EvidenceStepRow[];
  /** the measurements through the model (absent: none) */
  modelUpdate?: ModelUpdateReport;
  before: BetaVerdictRow;
  afterTests?: BetaVerdictRow;
  after: BetaVerdictRow;
  survival?: {
    loads: { path: string; mean: number; random: boolean; date?: string; notes?: string }[];
    beta: number;
    pf: number;
    pSurvival: number;
    rho: number;
    converged: boolean;
    mc?: { pf: number; cov: number; samples: number; survived: number; failures: number; seed: number };
    /** importance sampling of the same ratio; `centre` in words, `hits` samples in the joint domain */
    importance?: { pf: number; beta: number; cov: number; samples: number; hits: number; centre: string; survivalMethod: 'mc' | 'is'; seed: number };
    /** the check's verdict on FORM's conditional β (importance sampling's, else Monte Carlo's) */
    check?: { agrees: boolean; reason: string; method?: 'mc' | 'is' };
    /** the estimate without the survived loads (the main result rests on the conditional one) */
    unconditional?: { beta: number; method: MethodName; basis?: string };
  };
  densities: MeasurementDensity[];
}

/** One ranked test plan (pre-posterior analysis; studies/testPlanning.ts). */
export interface TestPlanRow {
  label: string;
  variable: string;
  description: string;
  tests: number;
  tested: 'similar' | 'this_one';
  measurementCov?: number;
  betaMean: number;
  beta05: number;
  beta50: number;
  beta95: number;
  pMeet: number;
  expectedGain: number;
}

export interface TestPlansReport {
  betaNow: number;
  target: number;
  outcomes: number;
  seed: number;
  defaults: boolean;
  survivalIncluded: boolean;
  plans: TestPlanRow[];
}

export interface CorrelationEntry {
  a: string; // variable path
  b: string;
  rho: number; // Pearson correlation of the physical variables
}

export type EndType = 'pinned' | 'fixed' | 'spring';

export interface EndDescription {
  type: EndType;
  stiffness?: number; // mean rotational stiffness k, N·m/rad (spring ends)
  R?: number; // restraint ratio k L / (E I) at the means
  fixity?: number; // fixity factor R / (R + 3) at the means
  random?: boolean; // true when k is a random variable
}

export interface ColumnDescription {
  length: number; // m
  frame: 'braced' | 'sway';
  ends: { bottom: EndDescription; top: EndDescription };
  lateralStiffness?: number; // N/m, sway frames only (translational spring at the top)
  section: { area: number; inertia: number; sectionModulus: number }; // m², m⁴, m³
  strengthModel: StrengthModelName;
}

/** One buckled mode, ξ = x/L from the bottom (0) to the top (1), w normalised to max |w| = 1. */
export interface ModeShapeData {
  mode: number; // 1, 2, 3
  criticalLoad: number; // N
  points: { xi: number; w: number }[]; // in increasing ξ, e.g. 101 points
  inflectionPoints: number[]; // ξ values where the curvature changes sign (pinned ends included)
  effectiveLength: number | null; // m; distance between inflection points, null if undefined
}

/** The deterministic check with every random variable at its mean (docs/json-output.md `check`). */
export interface CheckResult {
  criticalLoad: number; // Pcr, N
  effectiveLengthFactor: number; // K
  restraintRatio: { bottom: number | null; top: number | null }; // R; null = fixed (infinite)
  fixityFactor: { bottom: number; top: number }; // R/(R+3); 1 for fixed
  capacity: number; // N
  demand: number; // N, sum of mean loads
  utilization: number; // demand / (mean model_factor × capacity)
  modeShapes: ModeShapeData[]; // first 2–3 modes
}

export interface FormResult {
  beta: number;
  pf: number; // Φ(−β)
  converged: boolean;
  iterations: number;
  calls: number; // limit-state evaluations, gradients included
  designPoint: Record<string, number>; // physical units (SI), by variable path
  importance: Record<string, number>; // α² by variable path (sum 1)
  history: { iteration: number; beta: number; g: number }[];
}

export interface SormResult {
  beta: number; // generalised index −Φ⁻¹(pf)
  pf: number; // of the formula named in `formula`
  formula?: string; // 'Tvedt', 'Hohenbichler–Rackwitz' or 'Breitung'
  calls: number; // extra calls beyond FORM
  curvatures?: number[];
}

export interface ImportanceSamplingResult {
  beta: number; // −Φ⁻¹(pf)
  pf: number;
  cov: number; // coefficient of variation of the estimator
  calls: number;
}

export interface MonteCarloResult {
  beta: number; // −Φ⁻¹(pf); Infinity when there were no failures
  pf: number;
  cov: number;
  samples: number;
  failures: number;
  ci95: [number, number]; // on pf
  /** With no failure: the one-sided 95 % upper bound on pf (exact binomial) and the β it implies. */
  zeroFailureBound?: { pf: number; beta: number };
  convergence: { samples: number; pf: number; lo: number; hi: number }[]; // increasing samples
}

export interface SubsetResult {
  beta: number; // −Φ⁻¹(pf)
  pf: number;
  cov: number; // approximate, including correlation of the chains
  calls: number;
  levels?: number;
}

export interface ReliabilityResults {
  form?: FormResult;
  sorm?: SormResult;
  is?: ImportanceSamplingResult;
  mc?: MonteCarloResult;
  subset?: SubsetResult;
  /** The estimate compared with the target (normally SORM or the best sampling estimate). */
  /** `basis` says why it governs when it is not simply that method's own estimate (e.g. FORM's self-check). */
  governing: { method: MethodName; beta: number; pf: number; basis?: string; lowerBound?: boolean };
  /** Whether the methods agree within their uncertainty, in one or two sentences; `consistent` is false only when a difference matters. */
  agreement: { consistent: boolean; text: string };
  target: { beta: number; source: TargetSource; note?: string }; // note e.g. 'RC2, 50-year reference period'
  /** Two or more time-varying loads: FORM β of each load combination (Turkstra) and the series system. */
  combinations?: { leading: string; beta: number; pf: number; governing: boolean }[];
  system?: { beta: number; pf: number; method: MethodName };
}

/** Value with one variable at its 5 % and 95 % quantile, others at their means. */
export interface TornadoRow {
  variable: string;
  low: number; // at the 5 % quantile
  high: number; // at the 95 % quantile
}

export interface SobolRow {
  variable: string;
  first: number;
  firstCi95: [number, number];
  total: number;
  totalCi95: [number, number];
}

export interface SensitivityResults {
  /** Sorted by swing, largest first. `baseline` is the all-means value. */
  utilization: { baseline: number; rows: TornadoRow[] }; // dimensionless
  capacity: { baseline: number; rows: TornadoRow[] }; // N
  /** β with one variable fixed at its 5 % / 95 % quantile and the rest random; baseline = governing β. */
  conditionalBeta: { baseline: number; rows: TornadoRow[] };
  /** FORM α² with the sign of α (negative α: a resistance-type variable). */
  importance: { variable: string; alphaSquared: number; alpha: number }[];
  /** FORM elasticities of β: (∂β/∂μ)·μ/β and (∂β/∂σ)·σ/β. */
  elasticities: { variable: string; mean: number; sd: number }[];
  sobol?: { samples: number; rows: SobolRow[] };
}

export interface RestraintCurvePoint {
  factor: number; // the common multiplier on the mean stiffness of the studied ends
  stiffness: { bottom?: number; top?: number }; // mean k of each studied end, N·m/rad
  beta: number; // FORM
  pf: number;
  ideal?: 'pinned' | 'fixed'; // the limiting cases (k = 0, k = ∞); their stiffness entries are ignored
}

export interface RestraintStudy {
  ends: EndName[]; // the studied ends
  targetBeta: number;
  /** every β of the study is given the survived loads (docs/evidence.md §8); absent or false otherwise */
  givenSurvivedLoads?: boolean;
  curve: RestraintCurvePoint[]; // increasing stiffness; the ideal cases may be included
  /** Mean stiffness of each studied end at which β = target; null when even rigid ends fall short. */
  required: { bottom?: number | null; top?: number | null };
  fixityFactor: { bottom?: number; top?: number }; // R/(R+3) at the required stiffness
  effectiveLengthFactor: number | null; // K at the required stiffness (means)
  /** Reliability-equivalent K: the studied springs known exactly (no scatter) just reach the target β. Not a partial-factor code check; null when withheld. */
  equivalentK: number | null;
  sentence: string; // the justification sentence, ready to quote
  /** Per studied end: required mean, CoV, 5 % and EN 1990 Annex C design stiffness (N·m/rad); absent unless a finite stiffness reaches the target. */
  requirement?: Partial<Record<EndName, { mean: number; cov: number; characteristic: number; design: number; alphaBasis: string }>>;
  /** K with the studied ends at their design stiffness */
  designK?: number | null;
  /** the method that solved for the requirement, and the assessment that confirmed it */
  method?: string;
  confirmation?: { method: string; beta: number; raisedBy: number } | null;
  /** iso-β map over both ends (FORM on a coarse grid, interpolated) */
  contour?: {
    levels: number[];
    segments: { level: number; bottom: [number, number]; top: [number, number] }[];
    assessed: { bottom: number; top: number };
    asymptotes: { bottomWithTopRigid: number | null; topWithBottomRigid: number | null };
    range: { bottom: [number, number]; top: [number, number] };
    formAnalyses: number;
  };
  /**
   * Two-axis columns only: the axis whose ends were varied (β being the whole column's), why that
   * one, the other axis's own β (the same at every stiffness studied) and whether it alone keeps
   * the column below the target; the joint classes of the ends about the studied axis.
   */
  axis?: { axis: 'y' | 'z'; basis: 'asked' | 'governing'; otherAxis: 'y' | 'z'; otherBeta: number; capsTarget: boolean; classes: JointClassRow[] };
  /** required mean stiffness and 5 % fractile against the stiffness's CoV (first studied random end) */
  covCurve?: { end: EndName; assessedCov: number; points: { cov: number; mean: number | null; characteristic: number | null }[]; formAnalyses: number };
}

/**
 * Implied partial factor of one variable at the FORM design point: the factor a
 * semi-probabilistic check would need on this variable to reproduce this β.
 */
export interface PartialFactorRow {
  variable: string;
  kind: QuantityKind;
  role: 'resistance' | 'load' | 'model' | 'imperfection';
  adverse: 'low' | 'high'; // which direction hurts: low for strengths/stiffnesses, high for loads/bow
  basis: 'characteristic' | 'mean'; // what referenceValue is
  referenceValue: number; // the characteristic or mean value (SI)
  designValue: number; // the FORM design-point value (SI)
  /** reference/design when adverse = 'low', design/reference when adverse = 'high' (> 1 means the design value is harsher); null when the variable is favourable at the design point. */
  factor: number | null;
  note?: string; // e.g. 'characteristic = 5 % fractile'
  /** where FORM put the variable: resistance side, load side, an action-effect variable (the bow), or favourable */
  side?: 'resistance' | 'load' | 'action effect' | 'favourable';
  /** design / mean: how far FORM moved it (not a partial factor) */
  designToMean?: number;
  /** the code's factor for comparison, when the strength model names a code */
  code?: CodeFactorRef;
}

export interface CodeFactorRef {
  symbol: string; // 'γ_M1', 'γ_Q', '1/φc'
  value: number;
  source: string; // clause
}

/** β of the same column under each strength model (FORM), each with its model factor. */
export interface StrengthModelRow {
  strength: string;
  beta: number | null; // null: not evaluated (note says why)
  modelFactorMean: number;
  modelFactorCov: number;
  modelFactorSource: 'scenario' | 'default';
  chosen: boolean;
  note?: string;
}

/** The model factor in use and where it comes from. */
export interface ModelFactorNote {
  source: 'scenario' | 'default';
  strength: string;
  dist: string; // 'fixed' or a distribution name
  mean: number;
  cov: number;
  reference: string;
}

/** θ·capacity with every resistance-side variable at its characteristic value, against the design point. */
export interface ResistanceFactorRow {
  characteristic: number; // N
  design: number; // N
  factor: number; // characteristic / design
  code?: CodeFactorRef;
}

/** Samples for the histogram; the report never needs more than about 5000 of each. */
export interface SamplesSummary {
  resistance: number[]; // model_factor × capacity, N
  demand: number[]; // sum of loads, N
  totalSamples: number; // size of the run these were drawn from
  designPoint: { resistance: number; demand: number }; // N, from FORM (equal at g = 0)
}

export interface SweepResults {
  varied: { path: string; kind: QuantityKind }[]; // 1 or 2 paths
  rows: { values: Record<string, number>; beta: number; pf: number; utilization: number }[];
  method: MethodName; // which method produced β
  /** How many finished cases meet the target, of how many. */
  meeting: { count: number; total: number };
  /** One varied path: the values (SI) where β crosses the target, interpolated linearly between neighbouring cases. */
  crossings: number[];
}

/** Second-order moments and rotations of the end connections at one point (magnitudes, SI). */
export interface ConnectionValues {
  load: number; // N, the axial load they were computed under
  bow: number; // m, |e0|
  amplification: number; // 1/(1 − P/Pcr); Infinity when P ≥ Pcr
  stable: boolean; // false when P ≥ Pcr (every moment is then Infinity)
  moment: { bottom: number; top: number }; // N·m, k·θ at each end (0 pinned, fixed-end moment when fixed)
  rotation: { bottom: number; top: number }; // rad
  memberMax: number; // N·m, largest |M| in the member
  memberMaxAt: number | null; // m above the base
  endCouples?: { bottom: number; top: number }; // N·m, P·e plus applied end moments (signed; same sign = single curvature)
  lineLoad?: number; // N/m, uniform line load along the height at this point
  topForce?: number; // N, horizontal force at the top of a sway column, with P·φ of the out-of-plumb
}

/** An end's joint class by stiffness, EN 1993-1-8 §5.2.2.5. */
export interface JointClassRow {
  end: EndName;
  rule: 'given' | 'beam' | 'base' | 'none';
  stiffnessMean: number; // N·m/rad (Infinity when fixed)
  stiffnessLow: number; // at the 5 % fractile
  classAtMean: string | null; // 'rigid' | 'semi-rigid' | 'nominally pinned'; null when no rule applies
  classAtLow: string | null;
  rigidFrom: number | null; // N·m/rad
  pinnedUpTo: number | null; // N·m/rad
  note: string;
}

export interface ConnectionResults {
  atMean: ConnectionValues; // under the mean loads (serviceability level)
  atDesignPoint?: ConnectionValues; // at the FORM design point
  classes: JointClassRow[];
  strengthUsesBow: boolean; // false for the code curves: the bow is then only the geometric bow
}

/** What the report is about: it opens with that subject's result and section. */
export type ReportSubject = 'assessment' | 'restraint' | 'sweep';

export interface ReportInput {
  meta: ReportMeta;
  subject?: ReportSubject; // default 'assessment'
  inputs: InputRow[];
  /** variables updated by test results (absent or empty: none) */
  evidence?: EvidenceRow[];
  /** what the test results and survived loads changed (absent: no evidence) */
  measurements?: MeasurementsReport;
  /** candidate tests ranked (absent: the scenario lists none) */
  testPlans?: TestPlansReport;
  correlation: CorrelationEntry[];
  column: ColumnDescription;
  check: CheckResult;
  reliability: ReliabilityResults;
  sensitivity: SensitivityResults;
  restraint?: RestraintStudy; // absent when no end has a rotational spring
  /** two-axis columns only: FORM about each principal axis alone, and the axis with the lower β */
  axes?: { governing: 'y' | 'z'; governingAtMeans: 'y' | 'z'; y: { beta: number; pf: number }; z: { beta: number; pf: number } };
  partialFactors: PartialFactorRow[];
  resistanceFactor?: ResistanceFactorRow;
  strengthModels?: StrengthModelRow[];
  modelFactor?: ModelFactorNote;
  connections?: ConnectionResults; // moments the end connections carry, and their joint classes
  samples?: SamplesSummary; // absent when no sampling method ran
  sweep?: SweepResults;
  /** Specific cautions for this run (the standing disclaimers are always added by the report). */
  cautions: string[];
}
