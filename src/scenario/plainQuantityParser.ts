/**
 * A parser for the plain quantities that make up nearly every scenario ("210 GPa", "6640 mm^2",
 * "1.2 MN m/rad", "L/1500", "0.05"), building the same kind of tree as mathjs's parser, so that
 * quantityExpression.ts walks it unchanged. mathjs's parser costs about 0.4 s the first time it
 * runs; with this, `check` on a plain scenario never starts it.
 *
 * Grammar (anything else returns undefined and goes to mathjs):
 *   text   := term ( '/' factor )?
 *   term   := factor ( ( spaces | '*' ) factor )*
 *   factor := ( number | name ) ( '^' '-'? number )?
 * with an optional leading '-' or '+' on the first number. A product divided by one factor has
 * the same value and dimensions however mathjs groups it, so the trees agree where it matters.
 * Names that mathjs reads as operators or keywords are left to mathjs.
 */
import type { MathNode } from './mathjsBundle.js';

const NUMBER = /^(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?/;
const NAME = /^[A-Za-z][A-Za-z0-9]*/;
/** Words mathjs's parser gives a meaning of its own (conversion, logic, modulo, matrices). */
const KEYWORDS = new Set(['in', 'to', 'mod', 'not', 'and', 'or', 'xor', 'end', 'true', 'false', 'null', 'undefined']);

const constant = (value: number): MathNode => ({ type: 'ConstantNode', value });
const symbol = (name: string): MathNode => ({ type: 'SymbolNode', name });
const op = (o: string, fn: string, args: MathNode[], implicit = false): MathNode => ({ type: 'OperatorNode', op: o, fn, args, implicit });

export function parsePlainQuantity(text: string): MathNode | undefined {
  let rest = text.trim();
  let sign: '-' | '+' | '' = '';
  if (rest.startsWith('-') || rest.startsWith('+')) {
    sign = rest[0] as '-' | '+';
    rest = rest.slice(1);
    if (!NUMBER.test(rest)) return undefined;
  }

  /** One factor at the start of `rest`, or undefined. */
  const factor = (): MathNode | undefined => {
    let base: MathNode;
    const num = NUMBER.exec(rest);
    if (num) {
      const value = Number(num[0]);
      if (!Number.isFinite(value)) return undefined;
      base = constant(value);
      rest = rest.slice(num[0].length);
    } else {
      const name = NAME.exec(rest);
      if (!name || KEYWORDS.has(name[0])) return undefined;
      base = symbol(name[0]);
      rest = rest.slice(name[0].length);
    }
    if (/^[_.(\[{'"]/.test(rest)) return undefined;
    const powMatch = /^\s*\^\s*(-?)/.exec(rest);
    if (powMatch) {
      rest = rest.slice(powMatch[0].length);
      const exp = NUMBER.exec(rest);
      if (!exp) return undefined;
      rest = rest.slice(exp[0].length);
      if (/^\s*\^/.test(rest) || /^[A-Za-z_.(]/.test(rest)) return undefined;
      const e = constant(Number(exp[0]));
      base = op('^', 'pow', [base, powMatch[1] === '-' ? op('-', 'unaryMinus', [e]) : e]);
    }
    return base;
  };

  const first = factor();
  if (!first) return undefined;
  let tree = sign === '-' ? op('-', 'unaryMinus', [first]) : sign === '+' ? op('+', 'unaryPlus', [first]) : first;
  for (;;) {
    const sep = /^\s*(\*|\/)?\s*/.exec(rest)!;
    if (rest.length === sep[0].length) return tree; // end of text
    rest = rest.slice(sep[0].length);
    if (sep[1] === '/') {
      const denominator = factor();
      if (!denominator || rest.trim() !== '') return undefined; // only one factor after '/'
      return op('/', 'divide', [tree, denominator]);
    }
    if (sep[1] === undefined && sep[0].length === 0 && !/^[A-Za-z]/.test(rest)) return undefined;
    const next = factor();
    if (!next) return undefined;
    tree = op(sep[1] === '*' ? '*' : ' ', 'multiply', [tree, next], sep[1] !== '*');
  }
}
