/**
 * A limit state that returned NaN/±Infinity or threw. Never swallowed: the estimate would be
 * silently wrong. Carries the offending sample in physical units with the variable names.
 */
export class LimitStateError extends Error {
  readonly names: string[];
  readonly x: number[];
  /** What g returned (undefined when it threw). */
  readonly value: number | undefined;
  /** Global sample index for simulation methods, undefined for FORM/SORM trial points. */
  readonly sampleIndex: number | undefined;

  constructor(names: string[], x: ArrayLike<number>, value: number | undefined, detail: {
    sampleIndex?: number;
    cause?: string;
    method?: string;
  } = {}) {
    const xs = Array.from(x);
    const where = xs.map((v, i) => `${names[i] ?? `x${i}`} = ${v}`).join(', ');
    const what = detail.cause !== undefined ? `threw: ${detail.cause}` : `returned ${value}`;
    const which = detail.sampleIndex !== undefined ? ` at sample ${detail.sampleIndex}` : '';
    const method = detail.method !== undefined ? `${detail.method}: ` : '';
    super(`${method}limit state ${what}${which} (${where})`);
    this.name = 'LimitStateError';
    this.names = names.slice();
    this.x = xs;
    this.value = value;
    this.sampleIndex = detail.sampleIndex;
  }
}

/** NaN and ±Infinity fail this test; a finite number passes. */
export function isFiniteNumber(v: number): boolean {
  return v > -Infinity && v < Infinity;
}

export function describeThrown(e: unknown): string {
  return e instanceof Error ? e.message : String(e);
}
