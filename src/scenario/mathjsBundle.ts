/**
 * The one door to mathjs: the bundled browser build (loads in ~0.1 s, against ~1.5 s for the
 * ESM entry), required lazily on first use. Only the parser and the unit table are exposed:
 * nothing here can evaluate an expression.
 */
import { createRequire } from 'node:module';

/** The parts of a mathjs parse tree the quantity evaluator looks at. */
export interface MathNode {
  readonly type: string;
  readonly value?: unknown;              // ConstantNode
  readonly name?: string;                // SymbolNode
  readonly op?: string;                  // OperatorNode
  readonly fn?: unknown;                 // OperatorNode: the function name (string)
  readonly args?: readonly MathNode[];   // OperatorNode
  readonly content?: MathNode;           // ParenthesisNode
  readonly implicit?: boolean;
}

interface MathUnit {
  value: number | null;
  dimensions: number[];
  units: { unit: { name: string; offset: number }; prefix: { name: string } }[];
}

interface MathBundle {
  parse(text: string): MathNode;
  unit(value: number, name: string): MathUnit;
  Unit: { isValuelessUnit(name: string): boolean };
}

let bundle: MathBundle | undefined;

function mathjs(): MathBundle {
  if (bundle === undefined) {
    const require = createRequire(import.meta.url);
    bundle = require('mathjs/lib/browser/math.js') as MathBundle;
  }
  return bundle;
}

/** mathjs's parser only: builds a tree, evaluates nothing. Throws on a syntax error. */
const CACHE_LIMIT = 2000;
const parsed = new Map<string, MathNode>();
const units = new Map<string, UnitInfo | undefined>();

/** Bounded memo: scenarios repeat the same few texts and unit names. */
function remember<V>(cache: Map<string, V>, key: string, make: () => V): V {
  if (cache.has(key)) return cache.get(key) as V;
  const value = make();
  if (cache.size >= CACHE_LIMIT) cache.clear();
  cache.set(key, value);
  return value;
}

export function parseExpression(text: string): MathNode {
  return remember(parsed, text, () => mathjs().parse(text));
}

/** A unit mathjs knows by this exact name (prefix included), as SI factor and dimensions. */
export interface UnitInfo {
  /** SI value of one of this unit. */
  factor: number;
  /** Exponents of mathjs's base dimensions: mass, length, time, current, temperature,
   *  luminous intensity, amount of substance, angle, bit. */
  dimensions: readonly number[];
}

export function lookupMathjsUnit(name: string): UnitInfo | undefined {
  return remember(units, name, () => findUnit(name));
}

function findUnit(name: string): UnitInfo | undefined {
  const math = mathjs();
  let isUnit = false;
  try {
    isUnit = math.Unit.isValuelessUnit(name);
  } catch {
    return undefined;
  }
  if (!isUnit) return undefined;
  const u = math.unit(1, name);
  // Offset units (degC, degF) are not proportional: they cannot be multiplied meaningfully.
  if (u.units.length !== 1 || u.units[0]!.unit.offset !== 0 || u.value === null) return undefined;
  return { factor: u.value, dimensions: [...u.dimensions] };
}
