/**
 * The sweep file (YAML or JSON), in full:
 *
 *   scenario: m4.yaml          # base scenario; relative to this file's folder
 *   design: grid               # grid (default) | lhs | list
 *   seed: 20261201             # default 1; case k's seed derives from (seed, k)
 *   cases: 40                  # lhs only: how many cases
 *   methods: [form]            # optional, handed to the case runner unchanged
 *   vary:                      # grid and lhs
 *     - path: column.ends.bottom.rotation.mean
 *       from: 0.5 MN m/rad     # a number, or a number and a unit
 *       to: 20 MN m/rad
 *       steps: 8               # grid: points including both ends (lhs ignores it)
 *       scale: log             # linear (default) | log
 *     - path: loads.dead.mean
 *       values: [400 kN, 420 kN, 450 kN]   # explicit values (grid only)
 *     - "column.length=3 m:6 m:4"           # the --vary text form is accepted too
 *   list:                      # design list: the cases themselves, path -> value
 *     - {column.length: 4.2 m, loads.dead.mean: 400 kN}
 *
 * Values with units stay strings in the case table; the case runner converts them.
 * Any other key is refused (with the nearest valid name), and every number must be a number
 * in the file (`seed: true` or `steps: "8"` are refused), so a typo never silently changes
 * the sweep.
 */
import { dirname, resolve } from 'node:path';
import YAML from 'yaml';
import { InputError } from '../scenario/inputError.js';
import { didYouMean } from '../scenario/nearestName.js';
import { makeRangeAxis, parseVaryOption } from './varyOption.js';
import type { SweepDefinition, SweepDesign, SweepValue, VaryAxis } from './sweepTypes.js';

type Plain = Record<string, unknown>;

function isPlain(x: unknown): x is Plain {
  return typeof x === 'object' && x !== null && !Array.isArray(x);
}

function sweepValue(field: string, x: unknown): SweepValue {
  if (typeof x === 'number' && Number.isFinite(x)) return x;
  if (typeof x === 'string' && x.trim() !== '') return x.trim();
  throw new InputError(field, `expected a number or a quantity, got ${JSON.stringify(x)}`);
}

const SWEEP_KEYS = ['scenario', 'design', 'seed', 'cases', 'methods', 'vary', 'list'];
const AXIS_KEYS = ['path', 'from', 'to', 'steps', 'scale', 'values'];

function refuseUnknownKeys(doc: Plain, known: readonly string[], prefix: string): void {
  for (const key of Object.keys(doc)) {
    if (!known.includes(key)) {
      throw new InputError(`${prefix}${key}`, `unknown key${didYouMean(key, known)}; expected one of ${known.join(', ')}`);
    }
  }
}

/** A whole number in the file itself (not text, not true/false). */
function wholeNumber(field: string, x: unknown, min: number): number {
  if (typeof x !== 'number' || !Number.isSafeInteger(x) || x < min) {
    throw new InputError(field, `expected a whole number >= ${min}, got ${JSON.stringify(x)}`);
  }
  return x;
}

function readAxis(field: string, raw: unknown): VaryAxis {
  if (typeof raw === 'string') {
    try {
      return parseVaryOption(raw);
    } catch (error) {
      if (error instanceof InputError) throw new InputError(field, `${error.field}: ${error.message}`);
      throw error;
    }
  }
  if (!isPlain(raw)) throw new InputError(field, 'expected {path, from, to, steps} or {path, values}');
  refuseUnknownKeys(raw, AXIS_KEYS, `${field}.`);
  const path = raw.path;
  if (typeof path !== 'string' || path.trim() === '') throw new InputError(`${field}.path`, 'expected a scenario path');
  if ('values' in raw) {
    const extra = ['from', 'to', 'steps', 'scale'].find((k) => k in raw);
    if (extra) throw new InputError(`${field}.${extra}`, "an axis gives either 'values' or a range (from, to, steps, scale), not both");
    if (!Array.isArray(raw.values) || raw.values.length === 0) throw new InputError(`${field}.values`, 'expected a non-empty list');
    return { path: path.trim(), values: raw.values.map((v, k) => sweepValue(`${field}.values[${k}]`, v)) };
  }
  const from = sweepValue(`${field}.from`, raw.from);
  const to = sweepValue(`${field}.to`, raw.to);
  const steps = raw.steps === undefined ? undefined : wholeNumber(`${field}.steps`, raw.steps, 1);
  if (raw.scale !== undefined && typeof raw.scale !== 'string') throw new InputError(`${field}.scale`, `expected linear or log, got ${JSON.stringify(raw.scale)}`);
  const scale = raw.scale === undefined ? 'linear' : raw.scale;
  return makeRangeAxis(field, path.trim(), scale, from, to, steps);
}

function parseText(text: string, fileName: string): unknown {
  try {
    return fileName.endsWith('.json') ? JSON.parse(text) : YAML.parse(text);
  } catch (error) {
    throw new InputError(fileName, `cannot read the sweep file: ${(error as Error).message}`);
  }
}

export function parseSweepFile(text: string, fileName: string): SweepDefinition {
  const doc = parseText(text, fileName);
  if (!isPlain(doc)) throw new InputError(fileName, 'a sweep file is a mapping of keys');
  refuseUnknownKeys(doc, SWEEP_KEYS, '');
  const design = (doc.design ?? 'grid') as SweepDesign;
  if (typeof design !== 'string' || !['grid', 'lhs', 'list'].includes(design)) throw new InputError('design', `expected grid, lhs or list, got ${JSON.stringify(design)}`);
  const seed = doc.seed === undefined ? 1 : wholeNumber('seed', doc.seed, 0);
  const def: SweepDefinition = { design, seed, vary: [] };
  if (doc.scenario !== undefined) {
    if (typeof doc.scenario !== 'string') throw new InputError('scenario', 'expected a file name');
    def.scenario = fileName === '-' ? resolve(doc.scenario) : resolve(dirname(fileName), doc.scenario);
  }
  if (doc.cases !== undefined) {
    if (design !== 'lhs') throw new InputError('cases', `only a Latin hypercube (design: lhs) takes cases; a ${design} has its cases from vary or list`);
    def.cases = wholeNumber('cases', doc.cases, 1);
  }
  if (doc.methods !== undefined) {
    if (!Array.isArray(doc.methods) || !doc.methods.every((m) => typeof m === 'string')) {
      throw new InputError('methods', 'expected a list of method names');
    }
    def.methods = doc.methods as string[];
  }
  if (doc.vary !== undefined) {
    if (design === 'list') throw new InputError('vary', "design 'list' takes its cases from list, not vary");
    if (!Array.isArray(doc.vary)) throw new InputError('vary', 'expected a list of axes');
    def.vary = doc.vary.map((raw, k) => readAxis(`vary[${k}]`, raw));
  }
  if (doc.list !== undefined) {
    if (design !== 'list') throw new InputError('list', "a list of cases needs design: list");
    if (!Array.isArray(doc.list)) throw new InputError('list', 'expected a list of cases');
    def.list = doc.list.map((row, k) => {
      if (!isPlain(row)) throw new InputError(`list[${k}]`, 'expected a mapping of path to value');
      return Object.fromEntries(Object.entries(row).map(([p, v]) => [p, sweepValue(`list[${k}].${p}`, v)]));
    });
  }
  if (design === 'lhs' && def.cases === undefined) throw new InputError('cases', "design 'lhs' needs cases");
  return def;
}
