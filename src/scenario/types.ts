/**
 * A validated scenario: every number in SI (N, m, Pa, N·m/rad, N/m), every scalar either
 * fixed or a random variable, named everywhere by its path in the file (docs/scenario-format.md).
 */
import type { DistSpec } from '../probability/distribution.js';
import type { DisplayUnit } from './quantity.js';
import type { SectionDimensions } from '../sections/sectionDimensions.js';

export type { DisplayUnit } from './quantity.js';

/** Same literals as mechanics/ (docs/interfaces.md). */
export type Frame = 'braced' | 'sway';
export type StrengthModel =
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
export type Method = 'form' | 'sorm' | 'is' | 'mc' | 'subset';

export type Scalar = { readonly kind: 'fixed'; readonly value: number } | { readonly kind: 'random'; readonly spec: DistSpec };

/**
 * An end condition. `ratio` ends are given as a fixity factor X (R = 3X/(1−X)) or an
 * alignment-chart factor G (R = 2/G braced, 6/G sway). The variable is `input`; `R` is the
 * restraint ratio k L/(E I) at the input's value (its mean when random): map sampled inputs
 * with restraintRatio() in restraintRatio.ts.
 */
export type End =
  | { readonly type: 'pinned' }
  | { readonly type: 'fixed' }
  | { readonly type: 'rotation'; readonly k: Scalar; readonly beam?: Beam }
  | { readonly type: 'ratio'; readonly from: 'fixity' | 'alignment_g'; readonly input: Scalar; readonly R: number }
  | { readonly type: 'series'; readonly components: readonly SeriesComponent[]; readonly beam?: Beam };

/**
 * One flexibility of a rotational end made of springs in series (1/k = Σ 1/k_i): the connection,
 * the beam end, the foundation's rotation... Its variable is `column.ends.<end>.series.<name>`;
 * `rigid` is an infinitely stiff component (it adds no flexibility).
 */
export interface SeriesComponent {
  readonly name: string;
  readonly k: Scalar | 'rigid';
}

/**
 * The beam a rotational spring connects the column to (optional; used only to classify the joint by
 * stiffness, EN 1993-1-8 §5.2.2.5). SI: E in Pa (absent: the column's mean E), inertia m⁴, length m.
 */
export interface Beam {
  readonly E?: number;
  readonly inertia: number;
  readonly length: number;
}

/** What a load is (docs/scenario-format.md): permanent loads are never converted in time. */
export type LoadKind = 'permanent' | 'imposed' | 'snow' | 'wind' | 'other';
export const LOAD_KINDS: readonly LoadKind[] = ['permanent', 'imposed', 'snow', 'wind', 'other'];

/**
 * Which period the load's distribution describes: `unstated` (taken as given for the reference
 * period, the version-1 meaning), the maximum over `years`, or an arbitrary point in time that
 * takes an independent new value every `renewalYears` (undefined when not stated).
 */
export type LoadBasis =
  | { readonly type: 'unstated' }
  | { readonly type: 'maximum'; readonly years: number }
  | { readonly type: 'point-in-time'; readonly renewalYears?: number };

/** A section by its shape and dimensions (SI), with its corrosion loss (docs/sections.md). */
export interface SectionGeometry {
  readonly dimensions: SectionDimensions;
  /**
   * Loss per exposed face. Uniform (`perPlate` false): `primary` is `column.section.corrosion.loss`
   * and `secondary` the same scalar. Per plate (I/H): `primary` the flanges', `secondary` the web's
   * (`column.section.corrosion.flange` / `.web`).
   */
  readonly corrosion?: {
    readonly primary: Scalar;
    readonly secondary: Scalar;
    readonly perPlate: boolean;
    /** m above the base; absent: the whole length */
    readonly zoneHeight?: number;
  };
}

/** The second principal axis: its own ends, bow and (EN 1993-1-1) strength curve. */
export interface AxisZ {
  readonly ends: { readonly bottom: End; readonly top: End; readonly lateral: Scalar | null };
  readonly bow: Scalar;
  /** the strength model about z (differs from `strength` only by its EN 1993-1-1 curve) */
  readonly strength: StrengthModel;
}

export interface Load {
  readonly name: string;
  /** `loads.<name>` */
  readonly path: string;
  readonly value: Scalar;
  readonly kind?: LoadKind;
  readonly basis: LoadBasis;
  /** end eccentricities (m), paths `loads.<name>.eccentricity.top|bottom`; absent when the file gives none */
  readonly eccentricity?: { readonly top: Scalar; readonly bottom: Scalar };
  /** applied end moments (N·m), paths `loads.<name>.moments.top|bottom`; same sign = single curvature; absent when none */
  readonly moments?: { readonly top: Scalar; readonly bottom: Scalar };
  /** uniform line load along the height (N/m), path `loads.<name>.transverse`; absent when none */
  readonly transverse?: Scalar;
  /** horizontal force at the top of a sway column (N), path `loads.<name>.horizontal`; absent when none */
  readonly horizontal?: Scalar;
}

/** The target reliability as stated, and converted to the reference period. */
export interface Target {
  /** β as stated, for `periodYears` */
  readonly beta: number;
  readonly periodYears: number;
  /** β over one year and over the reference period: Φ(β_n) = Φ(β_1)^n */
  readonly betaAnnual: number;
  readonly betaReferencePeriod: number;
  /** verbatim, as the user wrote it */
  readonly source?: string;
  readonly consequenceClass?: string;
}

export interface Correlation {
  readonly a: string;
  readonly b: string;
  readonly rho: number;
}

export interface AnalysisOptions {
  /** Undefined: the command's default applies. */
  readonly seed?: number;
  readonly methods?: readonly Method[];
  readonly mcSamples?: number;
  readonly isSamples?: number;
  readonly subsetSamples?: number;
  readonly workers?: number;
  /** strength: plastic-zone evaluated through its cached table (default; the full model where the table does not reach) or by the full model at every evaluation */
  readonly plasticZone?: 'direct' | 'table';
}

export interface Scenario {
  readonly version: 1;
  readonly title: string;
  readonly fileName: string;
  readonly format: 'yaml' | 'json';
  /** SHA-256 (hex) of the scenario text exactly as read. */
  readonly sha256: string;
  readonly column: {
    /** m; always fixed (it defines the geometry and the meaning of L in expressions). */
    readonly length: number;
    readonly frame: Frame;
    /**
     * About the axis y (the only one when `axisZ` is absent). `inertiaZ`/`sectionModulusZ` are
     * there with `axisZ`. A section given by its dimensions (`geometry`) has every property fixed
     * at the mean corrosion loss, for people; the limit state recomputes them from `geometry`.
     */
    readonly section: {
      readonly area: Scalar;
      readonly inertia: Scalar;
      readonly sectionModulus: Scalar;
      readonly inertiaZ?: Scalar;
      readonly sectionModulusZ?: Scalar;
      readonly geometry?: SectionGeometry;
    };
    /** Buckling about the second principal axis z (docs/scenario-format.md); absent: one axis. */
    readonly axisZ?: AxisZ;
    readonly material: { readonly E: Scalar; readonly fy: Scalar };
    readonly ends: {
      readonly bottom: End;
      readonly top: End;
      /** N/m translational spring at the top: sway frames only (fixed 0 when not given); null when braced. */
      readonly lateral: Scalar | null;
    };
    /** m; fixed 0 when not given (allowed only for the code strength curves, which ignore it). */
    readonly bow: Scalar;
    /** rad; out-of-plumb angle of a sway column, path `column.imperfection.out_of_plumb`; absent when not given (0) */
    readonly outOfPlumb?: Scalar;
  };
  /** In file order. */
  readonly loads: readonly Load[];
  /** Fixed 1 when the file gives none; then `modelFactorOmitted` is true and limitState/ puts in the strength model's default. */
  readonly modelFactor: Scalar;
  readonly modelFactorOmitted?: boolean;
  /** Set by limitState/ once it has put in a strength model's default model factor (which model, and the source). */
  readonly modelFactorDefault?: { readonly strength: StrengthModel; readonly source: string };
  readonly strength: StrengthModel;
  /** The target over the reference period (= target.betaReferencePeriod). */
  readonly targetBeta: number;
  readonly targetSource?: string;
  /** years; the period the verdict is for (default 50) */
  readonly referencePeriodYears: number;
  readonly target: Target;
  readonly correlation: readonly Correlation[];
  readonly analysis: AnalysisOptions;
  readonly displayUnits: 'si' | 'us';
  /** The unit the user wrote for each field path (`column.material.E` → MPa), for echoing inputs. */
  readonly units: Readonly<Record<string, DisplayUnit>>;
  /** The `source:` note of each random variable that has one, by path, as written. */
  readonly sources?: Readonly<Record<string, string>>;
  /** Variables updated by test results, by path (absent: none). */
  readonly evidence?: Readonly<Record<string, EvidenceRecord>>;
  /** Measurements on this structure through a model (scenario-level `evidence:`, in file order; absent: none). */
  readonly measurements?: readonly Measurement[];
  /** Loads the column is known to have carried without failure (absent: none); scenario/readStructureEvidence.ts. */
  readonly survivedLoads?: readonly SurvivedLoad[];
  /** Candidate tests to rank (absent: none given); scenario/readTestPlans.ts. */
  readonly testPlans?: readonly TestPlan[];
}

/** `evidence: [{type: survived_load, load, date, notes}]` */
export interface SurvivedLoad {
  /** where it was written, e.g. evidence[0].load (also its variable name when random) */
  readonly path: string;
  /** N */
  readonly load: Scalar;
  readonly date?: string;
  readonly notes?: string;
}

/** One candidate test plan (`test_plans:`). */
export interface TestPlan {
  readonly variable: string;
  readonly tests: number;
  readonly tested: 'similar' | 'this_one';
  /** this_one only: CoV of each reading's error */
  readonly measurementCov?: number;
  readonly label?: string;
}

/**
 * A measurement on this structure that informs the column's variables through a model
 * (docs/evidence.md §7). SI; `measurementCov` is the CoV of a lognormal reading error.
 * `index` is the item's position in the file's `evidence:` list (for messages: `evidence[index]`).
 */
export type Measurement =
  | {
      readonly type: 'rotation_test';
      readonly index: number;
      readonly end: 'bottom' | 'top';
      /** N·m */
      readonly moment: number;
      /** rad */
      readonly rotation: number;
      readonly measurementCov: number;
      readonly source?: string;
    }
  | {
      readonly type: 'frequency';
      readonly index: number;
      /** Hz */
      readonly value: number;
      /** N, compression while measured */
      readonly axialLoad: number;
      /** kg/m */
      readonly massPerLength: number;
      readonly measurementCov: number;
      readonly source?: string;
    };

/** Test results that updated a variable (docs/evidence.md); the variable's Scalar holds the updated spec. */
export interface EvidenceRecord {
  /** SI, as entered */
  readonly tests: readonly number[];
  readonly tested: 'similar' | 'this_one';
  readonly scatter: 'unknown' | 'known';
  /** how many tests the written distribution counts as (0: none) */
  readonly priorWeight: number;
  /** SI */
  readonly measurementSd?: number;
  readonly measurementCov?: number;
  readonly source?: string;
  /** the distribution as written, before the update */
  readonly prior: DistSpec;
  /** one line: which update was made */
  readonly method: string;
  /** the distribution these tests gave, when a later update (measurements on the structure) replaced it in the Scalar */
  readonly result?: DistSpec;
}

export interface RandomVariable {
  /** Contract path, e.g. `column.material.E`, `column.ends.bottom.rotation`, `loads.dead`. */
  readonly path: string;
  readonly spec: DistSpec;
}
