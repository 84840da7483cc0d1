import { parse, stringify } from 'yaml';
import { expect } from 'vitest';
import { InputError } from '../../src/scenario/inputError.js';
import { loadScenario } from '../../src/scenario/loadScenario.js';
import type { Scenario } from '../../src/scenario/types.js';
import { FORMAT_EXAMPLE } from './formatExample.js';

export type Json = Record<string, unknown>;

/** The contract example as a plain object, a fresh copy each call. */
export function baseObject(): Json {
  return parse(FORMAT_EXAMPLE) as Json;
}

/** Loads the contract example after `change` edited a copy of it (as YAML). */
export function loadChanged(change: (o: Json) => void, fileName = 'changed.yaml'): Scenario {
  const o = baseObject();
  change(o);
  const text = fileName.endsWith('.json') ? JSON.stringify(o, null, 2) : stringify(o);
  return loadScenario(text, fileName);
}

/** Runs `fn`, expects an InputError, returns it. */
export function inputErrorOf(fn: () => unknown): InputError {
  try {
    fn();
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    return e as InputError;
  }
  throw new Error('expected an InputError, but nothing was thrown');
}

export function column(o: Json): Json {
  return o['column'] as Json;
}
export function sub(o: Json, ...keys: string[]): Json {
  return keys.reduce((acc, k) => acc[k] as Json, o);
}
