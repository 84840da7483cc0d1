/**
 * A whitelist evaluator for the quantities and length expressions of a scenario.
 *
 * mathjs only builds the parse tree; this walk computes the value itself and knows nothing
 * but numbers, unit names, the column length `L`, + - * / ^, unary signs and brackets.
 * Any other node (function call, assignment, property access, string, matrix, other symbol)
 * is refused, so a scenario can never call a function or reach any other symbol: mathjs's
 * own evaluate is never called.
 */
import { parseExpression, type MathNode } from './mathjsBundle.js';
import { parsePlainQuantity } from './plainQuantityParser.js';
import { DIMENSIONLESS, describeDimensions, sameDimensions, type Dimensions } from './dimensions.js';
import { COLUMN_LENGTH_SYMBOL, lookupUnit } from './units.js';
import { normaliseUnitSpelling } from './unitSpelling.js';

/** A problem with an expression; the caller adds the field path. */
export class ExpressionError extends Error {
  /** `unknownName`: the name that is not a unit, when that is the problem (for a did-you-mean). */
  constructor(message: string, readonly unknownName?: string) {
    super(message);
    this.name = 'ExpressionError';
  }
}

export interface Evaluated {
  /** SI value. */
  readonly value: number;
  readonly dimensions: Dimensions;
  /** True when a unit name (or L) appears anywhere in the expression. */
  readonly hasUnit: boolean;
}

export interface EvaluateOptions {
  /** Value of the symbol L in metres; when absent, L is refused. */
  readonly columnLength?: number;
}

const MAX_TEXT_LENGTH = 200;
const MAX_DEPTH = 40;
const ALLOWED_OPERATORS = new Set(['add', 'subtract', 'multiply', 'divide', 'pow', 'unaryMinus', 'unaryPlus']);

export function evaluateQuantity(text: string, options: EvaluateOptions = {}): Evaluated {
  if (text.length > MAX_TEXT_LENGTH) throw new ExpressionError(`is too long (${text.length} characters, at most ${MAX_TEXT_LENGTH})`);
  if (text.trim() === '') throw new ExpressionError('is empty');
  let tree: MathNode;
  try {
    // engineering spellings first (kN·m, kip-in); plain quantities then skip mathjs's parser (slow to start)
    const spelled = normaliseUnitSpelling(text);
    tree = parsePlainQuantity(spelled) ?? parseExpression(spelled);
  } catch {
    // the parser's own wording ("Value expected (char 13)") means nothing to an engineer
    throw new ExpressionError('cannot be read as a number with a unit (or, for a length, an expression of L)');
  }
  return walk(tree, options, 0);
}

function walk(node: MathNode, options: EvaluateOptions, depth: number): Evaluated {
  if (depth > MAX_DEPTH) throw new ExpressionError('is nested too deeply');
  switch (node.type) {
    case 'ConstantNode':
      return constant(node.value);
    case 'SymbolNode':
      return symbol(String(node.name), options);
    case 'ParenthesisNode':
      if (node.content === undefined) throw new ExpressionError('has empty brackets');
      return walk(node.content, options, depth + 1);
    case 'OperatorNode':
      return operator(node, options, depth);
    case 'FunctionNode':
      throw new ExpressionError(`calls a function (${functionName(node)}(...)): functions are not allowed, only numbers, units, L and + - * / ^`);
    case 'AssignmentNode':
    case 'FunctionAssignmentNode':
      throw new ExpressionError('contains an assignment: assignments are not allowed');
    case 'AccessorNode':
    case 'IndexNode':
      throw new ExpressionError("contains a '.' or '[' after a name (a property access or index): not allowed");
    default:
      throw new ExpressionError(`contains ${describeNodeType(node.type)}: only numbers, units, L and + - * / ^ are allowed`);
  }
}

function constant(value: unknown): Evaluated {
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) throw new ExpressionError('is not a finite number');
    return { value, dimensions: DIMENSIONLESS, hasUnit: false };
  }
  if (typeof value === 'string') throw new ExpressionError('contains quoted text: not allowed');
  throw new ExpressionError(`contains the constant ${String(value)}: only numbers are allowed`);
}

function symbol(name: string, options: EvaluateOptions): Evaluated {
  if (name === COLUMN_LENGTH_SYMBOL) {
    if (options.columnLength === undefined) {
      throw new ExpressionError('uses L (the column length), which is only allowed where a length is expected');
    }
    return { value: options.columnLength, dimensions: [0, 1, 0, 0, 0, 0, 0, 0, 0], hasUnit: true };
  }
  const unit = lookupUnit(name);
  if (unit === undefined) {
    if (name === 'NaN' || name === 'Infinity') throw new ExpressionError('is not a finite number');
    throw new ExpressionError(`uses '${name}', which is not a known unit (the only symbol allowed is L, the column length)`, name);
  }
  return { value: unit.factor, dimensions: unit.dimensions, hasUnit: true };
}

function operator(node: MathNode, options: EvaluateOptions, depth: number): Evaluated {
  const fn = typeof node.fn === 'string' ? node.fn : '';
  const args = node.args ?? [];
  if (!ALLOWED_OPERATORS.has(fn)) throw new ExpressionError(`uses the operator '${node.op ?? fn}': only + - * / ^ are allowed`);
  const values = args.map((a) => walk(a, options, depth + 1));
  const hasUnit = values.some((v) => v.hasUnit);
  const [a, b] = values;
  if (a === undefined || (values.length !== (fn.startsWith('unary') ? 1 : 2)) || (!fn.startsWith('unary') && b === undefined)) {
    throw new ExpressionError(`has a malformed '${node.op ?? fn}'`);
  }
  let result: { value: number; dimensions: Dimensions };
  switch (fn) {
    case 'unaryMinus':
      result = { value: -a.value, dimensions: a.dimensions };
      break;
    case 'unaryPlus':
      result = a;
      break;
    case 'add':
    case 'subtract':
      requireSameDimensions(a, b!, fn === 'add' ? 'add' : 'subtract');
      result = { value: fn === 'add' ? a.value + b!.value : a.value - b!.value, dimensions: a.dimensions };
      break;
    case 'multiply':
      result = { value: a.value * b!.value, dimensions: a.dimensions.map((d, i) => d + b!.dimensions[i]!) };
      break;
    case 'divide':
      if (b!.value === 0) throw new ExpressionError('divides by zero');
      result = { value: a.value / b!.value, dimensions: a.dimensions.map((d, i) => d - b!.dimensions[i]!) };
      break;
    default: // pow
      if (!sameDimensions(b!.dimensions, DIMENSIONLESS)) throw new ExpressionError('has an exponent with a unit');
      result = { value: Math.pow(a.value, b!.value), dimensions: a.dimensions.map((d) => d * b!.value) };
  }
  if (!Number.isFinite(result.value)) throw new ExpressionError('gives a number that is not finite (too large, or undefined)');
  if (!result.dimensions.every(Number.isFinite)) throw new ExpressionError('has an exponent that is too large');
  return { ...result, hasUnit };
}

function requireSameDimensions(a: Evaluated, b: Evaluated, verb: string): void {
  if (!sameDimensions(a.dimensions, b.dimensions)) {
    throw new ExpressionError(`tries to ${verb} ${describeDimensions(a.dimensions)} and ${describeDimensions(b.dimensions)}`);
  }
}

function functionName(node: MathNode): string {
  const fn = node.fn as { name?: unknown } | undefined;
  return typeof fn?.name === 'string' ? fn.name : 'a function';
}

function describeNodeType(type: string): string {
  const names: Record<string, string> = {
    ArrayNode: 'a matrix or list',
    ObjectNode: 'an object',
    ConditionalNode: 'a conditional (? :)',
    RangeNode: 'a range (:)',
    BlockNode: 'several statements',
    RelationalNode: 'a comparison',
  };
  return names[type] ?? `a '${type}'`;
}
