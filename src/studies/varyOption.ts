/**
 * Reading one axis of variation, from the command line or a sweep file.
 *
 * Command-line forms (`--vary`, repeatable):
 *   PATH=FROM:TO:STEPS        linear, STEPS points including both ends
 *   PATH=log:FROM:TO:STEPS    logarithmic (FROM, TO > 0)
 *   PATH=lin:FROM:TO:STEPS    linear, explicit
 *   PATH=FROM:TO              a range without steps (for a Latin hypercube)
 *   PATH=A,B,C                explicit values
 * FROM and TO may carry a unit (`2 MN m/rad`); both ends must carry the same one.
 */
import { InputError } from '../scenario/inputError.js';
import type { RangeAxis, SweepValue, VaryAxis } from './sweepTypes.js';

const QUANTITY = /^\s*([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)\s*(.*?)\s*$/;

/** Split `'2.5 MN m/rad'` into 2.5 and `'MN m/rad'`; a number gives unit ''. */
export function splitQuantity(field: string, value: number | string): { value: number; unit: string } {
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) throw new InputError(field, `expected a finite number, got ${value}`);
    return { value, unit: '' };
  }
  const match = QUANTITY.exec(value);
  if (!match) throw new InputError(field, `expected a number with an optional unit, got '${value}'`);
  return { value: Number(match[1]), unit: match[2].replace(/\s+/g, ' ') };
}

export function makeRangeAxis(
  field: string,
  path: string,
  scale: string,
  fromText: number | string,
  toText: number | string,
  steps: number | undefined,
): RangeAxis {
  if (scale !== 'linear' && scale !== 'log') throw new InputError(field, `scale must be linear or log, got '${scale}'`);
  const from = splitQuantity(`${field}.from`, fromText);
  const to = splitQuantity(`${field}.to`, toText);
  if (from.unit !== to.unit) {
    throw new InputError(field, `FROM and TO must use the same unit ('${from.unit}' and '${to.unit}')`);
  }
  if (scale === 'log' && !(from.value > 0 && to.value > 0)) {
    throw new InputError(field, 'a logarithmic range needs FROM and TO above zero');
  }
  if (steps !== undefined && !(Number.isInteger(steps) && steps >= 1)) {
    throw new InputError(field, `STEPS must be a whole number of at least 1, got ${steps}`);
  }
  const axis: RangeAxis = { path, scale, from: from.value, to: to.value, unit: from.unit };
  if (steps !== undefined) axis.steps = steps;
  return axis;
}

function listValue(text: string): SweepValue {
  const trimmed = text.trim();
  return trimmed !== '' && Number.isFinite(Number(trimmed)) ? Number(trimmed) : trimmed;
}

export function parseVaryOption(text: string): VaryAxis {
  const field = `--vary ${text}`;
  const eq = text.indexOf('=');
  if (eq <= 0) throw new InputError('--vary', `expected PATH=FROM:TO:STEPS, got '${text}'`);
  const path = text.slice(0, eq).trim();
  const spec = text.slice(eq + 1).trim();
  if (path === '' || spec === '') throw new InputError('--vary', `expected PATH=FROM:TO:STEPS, got '${text}'`);
  if (!spec.includes(':')) {
    const values = spec.split(',').map(listValue);
    if (values.some((v) => v === '')) throw new InputError(field, 'empty value in the list');
    return { path, values };
  }
  const parts = spec.split(':').map((p) => p.trim());
  let scale = 'linear';
  if (parts[0] === 'log' || parts[0] === 'lin' || parts[0] === 'linear') {
    scale = parts.shift() === 'log' ? 'log' : 'linear';
  }
  if (parts.length !== 2 && parts.length !== 3) throw new InputError(field, 'expected FROM:TO:STEPS or log:FROM:TO:STEPS');
  const steps = parts.length === 3 ? Number(parts[2]) : undefined;
  return makeRangeAxis(field, path, scale, parts[0], parts[1], steps);
}

/** `--shard I/N`: this process takes the cases with index % N == I. */
export function parseShardOption(text: string): { index: number; count: number } {
  const match = /^\s*(\d+)\s*\/\s*(\d+)\s*$/.exec(text);
  const index = match ? Number(match[1]) : NaN;
  const count = match ? Number(match[2]) : NaN;
  if (!match || !(count >= 1) || !(index < count)) {
    throw new InputError('--shard', `expected I/N with 0 <= I < N, got '${text}'`);
  }
  return { index, count };
}
