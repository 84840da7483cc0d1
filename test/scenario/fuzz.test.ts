/**
 * Property: whatever the file holds, loadScenario returns a Scenario whose every number is
 * finite, or throws InputError, never anything else (common practice: robustness fuzzing).
 */
import fc from 'fast-check';
import { stringify } from 'yaml';
import { describe, expect, test } from 'vitest';
import { InputError } from '../../src/scenario/inputError.js';
import { loadScenario } from '../../src/scenario/loadScenario.js';
import { randomVariables } from '../../src/scenario/variables.js';
import { baseObject, type Json } from './helpers.js';
import { starterScenario } from '../../src/scenario/starterScenario.js';
import { parse } from 'yaml';

type Path = (string | number)[];

function allPaths(value: unknown, path: Path = [], out: Path[] = []): Path[] {
  out.push(path);
  if (Array.isArray(value)) value.forEach((v, i) => allPaths(v, [...path, i], out));
  else if (value !== null && typeof value === 'object') for (const [k, v] of Object.entries(value)) allPaths(v, [...path, k], out);
  return out;
}

const BASES: Json[] = [baseObject(), parse(starterScenario('braced')) as Json, parse(starterScenario('sway')) as Json];
const PATHS = BASES.map((b) => allPaths(b).filter((p) => p.length > 0));

const weirdStrings = fc.constantFrom(
  '4 m', '200 GPa', '2 kN', '2.5 MN m/rad', '2.5 MN m', '0 kN/m', '7640 mm^2', '25.1e6 mm^4', '281e3 mm^3', 'L/1000', 'L/0',
  'L^1e6', '1e308 GPa * 1e308', '-1e308 m', '1e-320 m', '5 furlong', 'NaN', 'Infinity', '-Infinity', 'NaN m', 'Infinity kN',
  'sqrt(2) m', 'import("fs")', 'evaluate("1")', 'a = 2', 'L.x', '"s"', '[1] m', '2 m to mm', '1 L', 'E', 'pi m', '5%', '0.5',
  '', ' ', 'pinned', 'fixed', 'braced', 'sway', 'first-yield', 'en1993-b', 'form', '1 degC', '3 kip', '36 ksi', '1 kN m/deg',
  '1e-300 mm^4', '1e300 mm^4', '(((1))) m', 'L - L', '0 m', '-0 Pa', 'column.material.E', 'loads.dead', 'model_factor',
  '\u0000', '名前', '🏗️ 4 m', '4\u00a0m', '4 m\n5 m',
);
const extremeNumbers = fc.oneof(
  fc.constantFrom(0, -0, 1, -1, 0.5, 1 - 1e-16, 1e-320, 5e-324, 1e308, -1e308, Number.MAX_SAFE_INTEGER, 2 ** 53 + 2, 3.8, 0.999999),
  fc.double({ noNaN: false }),
  fc.integer(),
);
const distName = fc.constantFrom('normal', 'lognormal', 'gumbel', 'uniform', 'truncnormal', 'weibull', 'beta', 'cauchy', '');
const leaf = fc.oneof(weirdStrings, extremeNumbers, fc.boolean(), fc.constant(null), fc.string({ unit: 'grapheme', maxLength: 12 }));
const randomVariable = fc.record(
  { dist: distName, mean: leaf, sd: leaf, cov: leaf, min: leaf, max: leaf, shape: leaf },
  { requiredKeys: ['dist'] },
);
const deep = fc.integer({ min: 20, max: 60 }).map((n) => {
  let v: unknown = '1 m';
  for (let i = 0; i < n; i++) v = i % 2 === 0 ? { a: v } : [v];
  return v;
});
const unicodeKeyed = fc.dictionary(fc.string({ unit: 'grapheme', minLength: 1, maxLength: 8 }), leaf, { maxKeys: 4 });
const replacement = fc.oneof(
  { weight: 5, arbitrary: leaf },
  { weight: 4, arbitrary: randomVariable },
  { weight: 1, arbitrary: fc.jsonValue({ maxDepth: 2 }) },
  { weight: 1, arbitrary: deep },
  { weight: 1, arbitrary: unicodeKeyed },
  { weight: 1, arbitrary: fc.constantFrom({ rotation: '1 MN m/rad' }, { fixity: 0.5 }, { alignment_g: 0 }, { fixity: { dist: 'beta', min: 0, max: 1, mean: 0.5, sd: 0.2 } }) },
);
const manyLoads = fc
  .array(fc.tuple(fc.string({ unit: 'grapheme', minLength: 1, maxLength: 6 }), fc.oneof(leaf, randomVariable)), { minLength: 100, maxLength: 300 })
  .map((entries) => Object.fromEntries(entries));

const magnitude = fc.oneof(
  fc.constantFrom(0, 1e-300, 1e-30, 1e-9, 0.5, 0.999, 1, 2, 1e3, 1e9, 1e30, 1e300, -1, -1e300),
  fc.double({ min: -1e300, max: 1e300, noNaN: true }),
);
/** Replace a value, or only rescale the number in it (keeping the unit): plausible files too. */
/** `arbitrary` once in `every` cases, else null. */
function rarely<T>(arbitrary: fc.Arbitrary<T>, every: number): fc.Arbitrary<T | null> {
  return fc.oneof({ weight: every - 1, arbitrary: fc.constant(null) }, { weight: 1, arbitrary });
}

const edit = fc.oneof(
  fc.record({ path: fc.nat(), value: replacement, remove: fc.boolean(), rescale: fc.constant(false) }),
  fc.record({ path: fc.nat(), value: magnitude, remove: fc.constant(false), rescale: fc.constant(true) }),
);
const scenarioCase = fc.record({
  base: fc.nat({ max: BASES.length - 1 }),
  edits: fc.array(edit, { minLength: 0, maxLength: 3 }),
  loads: rarely(manyLoads, 60),
  extraKey: rarely(fc.tuple(fc.string({ unit: 'grapheme', minLength: 1, maxLength: 10 }), leaf), 8),
  asJson: fc.boolean(),
  textEdit: rarely(fc.tuple(fc.nat(), fc.string({ unit: 'grapheme', maxLength: 3 }), fc.nat({ max: 3 })), 6),
});

function rescaled(current: unknown, x: number): unknown {
  if (typeof current === 'number') return x;
  if (typeof current === 'string') return current.replace(/^\s*[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?/, String(x));
  return current;
}

function setAt(target: unknown, path: Path, value: unknown, remove: boolean, rescale: boolean): void {
  let node = target as Record<string | number, unknown>;
  for (const seg of path.slice(0, -1)) {
    const next = node[seg];
    if (next === null || typeof next !== 'object') return;
    node = next as Record<string | number, unknown>;
  }
  const last = path[path.length - 1]!;
  if (Array.isArray(node) && typeof last !== 'number') return;
  if (remove && !Array.isArray(node)) delete node[last];
  else node[last] = rescale ? rescaled(node[last], value as number) : structuredClone(value);
}

function buildText(c: typeof scenarioCase extends fc.Arbitrary<infer T> ? T : never): { text: string; name: string } {
  const o = structuredClone(BASES[c.base]!);
  const paths = PATHS[c.base]!;
  for (const e of c.edits) setAt(o, paths[e.path % paths.length]!, e.value, e.remove, e.rescale);
  if (c.loads !== null) o['loads'] = structuredClone(c.loads);
  if (c.extraKey !== null) o[c.extraKey[0]] = c.extraKey[1];
  let text = c.asJson ? JSON.stringify(o) : stringify(o);
  if (c.textEdit !== null) {
    const [at, insert, cut] = c.textEdit;
    const i = at % (text.length + 1);
    text = text.slice(0, i) + insert + text.slice(i + cut);
  }
  return { text, name: c.asJson ? 'fuzz.json' : 'fuzz.yaml' };
}

function everyNumberFinite(value: unknown, path = ''): string | undefined {
  if (typeof value === 'number') return Number.isFinite(value) ? undefined : path;
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      const bad = everyNumberFinite(value[i], `${path}[${i}]`);
      if (bad !== undefined) return bad;
    }
  } else if (value !== null && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) {
      const bad = everyNumberFinite(v, `${path}.${k}`);
      if (bad !== undefined) return bad;
    }
  }
  return undefined;
}

describe('loadScenario never fails with anything but InputError', () => {
  test('10 000 mutated scenarios', () => {
    let accepted = 0;
    let rejected = 0;
    fc.assert(
      fc.property(scenarioCase, (c) => {
        const { text, name } = buildText(c);
        try {
          const s = loadScenario(text, name);
          expect(everyNumberFinite(s)).toBeUndefined();
          randomVariables(s);
          accepted++;
        } catch (e) {
          if (!(e instanceof InputError)) throw e;
          expect(e.field.length).toBeGreaterThan(0);
          expect(e.message.length).toBeGreaterThan(0);
          rejected++;
        }
      }),
      { numRuns: 10_000, seed: 20261201 },
    );
    process.stderr.write(`fuzz: ${accepted} accepted, ${rejected} rejected\n`);
    // the generator must exercise both outcomes, or the property is vacuous
    expect(accepted).toBeGreaterThan(100);
    expect(rejected).toBeGreaterThan(5000);
  });

  test('arbitrary JSON values and arbitrary text', () => {
    fc.assert(
      fc.property(fc.oneof(fc.jsonValue({ maxDepth: 6 }).map((v) => JSON.stringify(v) ?? 'null'), fc.string({ unit: 'binary', maxLength: 200 })), fc.constantFrom('x.json', 'x.yaml', '-'), (text, name) => {
        try {
          loadScenario(text, name);
        } catch (e) {
          if (!(e instanceof InputError)) throw e;
        }
      }),
      { numRuns: 2_000, seed: 7 },
    );
  });
});
