import { InvalidArgumentError } from 'commander';
import { STUDY_NAMES, type StudyName } from '../studies/studyNames.js';

const METHODS = ['form', 'sorm', 'is', 'mc', 'subset'] as const;
export type MethodName = (typeof METHODS)[number];

/** A seed: a whole number ≥ 0. */
export function parseNonNegativeInteger(value: string): number {
  if (!/^\d+$/.test(value.trim()) || !Number.isSafeInteger(Number(value))) {
    throw new InvalidArgumentError('expected a whole number ≥ 0 (e.g. 20261201).');
  }
  return Number(value);
}

/** A count ≥ 1, with an example that fits the option (a worker count is not a sample count). */
function positiveInteger(example: string): (value: string) => number {
  return (value) => {
    const v = value.trim();
    // allow 1e6 style counts, but only when they denote a whole number
    const n = Number(v);
    if (!/^[0-9.eE+]+$/.test(v) || !Number.isSafeInteger(n) || n < 1) {
      throw new InvalidArgumentError(`expected a whole number ≥ 1 (e.g. ${example}).`);
    }
    return n;
  };
}

export const parseSampleCount = positiveInteger('100000 or 1e6');
export const parseWorkerCount = positiveInteger('2');
export const parseCaseCount = positiveInteger('200');

export function parseFraction(value: string): number {
  const n = Number(value.trim());
  if (value.trim() === '' || !Number.isFinite(n) || n <= 0 || n >= 1) throw new InvalidArgumentError('expected a number between 0 and 1 (e.g. 0.1).');
  return n;
}

export function parseMethods(value: string): MethodName[] {
  const list = value.split(',').map((m) => m.trim().toLowerCase()).filter(Boolean);
  if (list.length === 0) throw new InvalidArgumentError(`expected a comma-separated list of ${METHODS.join(', ')}.`);
  for (const m of list) {
    if (!(METHODS as readonly string[]).includes(m)) {
      throw new InvalidArgumentError(`unknown method '${m}'; expected some of ${METHODS.join(', ')}.`);
    }
  }
  return [...new Set(list)] as MethodName[];
}

/** `--studies LIST`: names from STUDY_NAMES, `all` or `none`. */
export function parseStudies(value: string): StudyName[] {
  const list = value.split(',').map((m) => m.trim().toLowerCase()).filter(Boolean);
  if (list.length === 1 && list[0] === 'none') return [];
  if (list.length === 1 && list[0] === 'all') return [...STUDY_NAMES];
  if (list.length === 0) throw new InvalidArgumentError(`expected a comma-separated list of ${STUDY_NAMES.join(', ')} (or all, or none).`);
  for (const m of list) {
    if (!(STUDY_NAMES as readonly string[]).includes(m)) {
      throw new InvalidArgumentError(`unknown study '${m}'; expected some of ${STUDY_NAMES.join(', ')} (or all, or none).`);
    }
  }
  return [...new Set(list)] as StudyName[];
}

export function parseUnits(value: string): 'si' | 'us' {
  if (value !== 'si' && value !== 'us') throw new InvalidArgumentError("expected 'si' or 'us'.");
  return value;
}

export function parseEnd(value: string): 'bottom' | 'top' | 'both' {
  if (value !== 'bottom' && value !== 'top' && value !== 'both') throw new InvalidArgumentError("expected 'bottom', 'top' or 'both'.");
  return value;
}

export function parseAxis(value: string): 'y' | 'z' {
  if (value !== 'y' && value !== 'z') throw new InvalidArgumentError("expected 'y' or 'z' (the principal axis whose end restraint is studied).");
  return value;
}

export function parseShard(value: string): { index: number; count: number } {
  const m = /^(\d+)\/(\d+)$/.exec(value.trim());
  if (!m) throw new InvalidArgumentError('expected I/N, e.g. 0/4 (shard I of N, counting from 0).');
  const index = Number(m[1]);
  const count = Number(m[2]);
  if (count < 1 || index >= count) throw new InvalidArgumentError('expected 0 ≤ I < N.');
  return { index, count };
}

export { METHODS };

export function parseRestraintMethod(value: string): 'form' | 'sorm' | 'is' {
  if (value !== 'form' && value !== 'sorm' && value !== 'is') throw new InvalidArgumentError("expected 'form', 'sorm' or 'is'.");
  return value;
}

export function parseDesignAlpha(value: string): 'form' | 'standard' {
  if (value !== 'form' && value !== 'standard') throw new InvalidArgumentError("expected 'form' or 'standard'.");
  return value;
}

/** Simulated outcomes per test plan: 10 … 2000. */
export function parseOutcomeCount(value: string): number {
  const v = value.trim();
  const n = Number(v);
  if (!/^\d+$/.test(v) || !Number.isSafeInteger(n) || n < 10 || n > 2000) throw new InvalidArgumentError('expected a whole number of outcomes from 10 to 2000 (e.g. 40).');
  return n;
}
