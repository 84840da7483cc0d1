/**
 * The shapes of a parametric sweep. A sweep is a table of cases; each case sets some
 * scenario paths to values and owns a seed. Values with units stay strings
 * (`'2.5 MN m/rad'`): the runner converts them like any scenario quantity.
 */

/** A varied value: a plain number or a string (a quantity with its unit, or any text). */
export type SweepValue = number | string;

/** What a case runner may return per result column (non-finite numbers become strings). */
export type ResultValue = number | string | boolean | null;

/** One axis of variation over a range: `steps` points for a grid (ignored by lhs). */
export interface RangeAxis {
  path: string;
  scale: 'linear' | 'log';
  from: number;
  to: number;
  /** The unit text after the number, '' for a pure number. */
  unit: string;
  steps?: number;
}

/** One axis given by its values (grid only). */
export interface ListAxis {
  path: string;
  values: SweepValue[];
}

export type VaryAxis = RangeAxis | ListAxis;

export type SweepDesign = 'grid' | 'lhs' | 'list';

export interface SweepDefinition {
  /** The base scenario file (resolved against the sweep file's folder), when given. */
  scenario?: string;
  design: SweepDesign;
  /** Sweep seed; each case's seed derives from it and the case index. */
  seed: number;
  /** lhs: number of cases. */
  cases?: number;
  /** Passed to the case runner unchanged (e.g. ['form']). */
  methods?: string[];
  vary: VaryAxis[];
  /** design 'list': the explicit cases, path → value. */
  list?: Record<string, SweepValue>[];
}

export interface SweepCase {
  /** Stable id: the position in the case table. */
  index: number;
  seed: number;
  values: Record<string, SweepValue>;
}

/**
 * A sweep's cases, never held as an array: case i's values are computed from i alone
 * (sweepDesign.ts); seeds come in index order from the sweep seed's stream (caseSeed.ts).
 */
export interface CaseTable {
  /** The varied paths, in column order. */
  varied: string[];
  /** Number of cases (at most MAX_SWEEP_CASES). */
  count: number;
  /** The sweep seed. */
  seed: number;
  /** Values of case `index` (0 <= index < count), computed on demand. */
  valuesAt(index: number): Record<string, SweepValue>;
}

export type CaseResult = Record<string, ResultValue>;

/** One finished case as recorded in a journal. */
export interface SweepRecord {
  case: number;
  seed: number;
  values: Record<string, SweepValue>;
  result: CaseResult;
  /** Present when the case runner threw: its message. */
  error?: string;
}

export interface Shard {
  index: number;
  count: number;
}
