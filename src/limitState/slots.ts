/**
 * Where a value of the limit state comes from: x[index] when random, else the fixed value
 * (shared by the one-sample limit state and its block form).
 */
import type { Scalar } from '../scenario/types.js';

export interface Slot {
  readonly index: number;
  readonly value: number;
}

export function slotOf(scalar: Scalar, path: string, names: readonly string[]): Slot {
  if (scalar.kind === 'fixed') return { index: -1, value: scalar.value };
  const index = names.indexOf(path);
  if (index < 0) throw new Error(`random variable ${path} is missing from the variable list`);
  return { index, value: NaN };
}

export function read(slot: Slot, x: Float64Array): number {
  return slot.index < 0 ? slot.value : x[slot.index];
}
