/**
 * A validated scenario: every number in SI (N, m, Pa, N·m/rad, N/m), every scalar either
 * fixed or a random variable, named everywhere by its path in the file (docs/scenario-format.md).
 */
import type { DistSpec } from '../probability/distribution.js';
import type { DisplayUnit } from './quantity.js';

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

export interface Load {
  readonly name: string;
  /** `loads.<name>` */
  readonly path: string;
  readonly value: Scalar;
  readonly kind?: LoadKind;
  readonly basis: LoadBasis;
  /** end eccentricities (m), paths `loads.<name>.eccentricity.top|bottom`; absent when the file gives none */
  readonly eccentricity?: { readonly top: Scalar; readonly bottom: Scalar };
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
  /** strength: plastic-zone evaluated by the full model (default) or its cached table */
  readonly plasticZone?: 'direct' | 'table';
}

/** The section by its dimensions (m), for strength: plastic-zone (docs/plastic-zone.md). */
export interface SectionShape {
  readonly type: 'i';
  readonly h: number;
  readonly b: number;
  readonly tw: number;
  readonly tf: number;
  readonly family: 'rolled' | 'welded';
  readonly axis: 'y' | 'z';
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
    readonly section: { readonly area: Scalar; readonly inertia: Scalar; readonly sectionModulus: Scalar; readonly shape?: SectionShape };
    readonly material: { readonly E: Scalar; readonly fy: Scalar };
    readonly ends: {
      readonly bottom: End;
      readonly top: End;
      /** N/m translational spring at the top: sway frames only (fixed 0 when not given); null when braced. */
      readonly lateral: Scalar | null;
    };
    /** m; fixed 0 when not given (allowed only for the code strength curves, which ignore it). */
    readonly bow: Scalar;
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
}

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
}

export interface RandomVariable {
  /** Contract path, e.g. `column.material.E`, `column.ends.bottom.rotation`, `loads.dead`. */
  readonly path: string;
  readonly spec: DistSpec;
}
