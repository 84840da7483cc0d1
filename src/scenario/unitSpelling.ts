/**
 * The spellings engineers (and this tool's own reports) use for units, rewritten into the
 * plain form the expression parser reads, before parsing:
 *
 *   kN·m/rad, kN-m/rad, kN.m/rad, kNm/rad → kN*m/rad      kip in/rad → kip*inch/rad
 *   mm², in⁴, m⁻¹ → mm^(2), in^(4), m^(-1)                 25.1×10⁶ mm⁴ → 25.1e6 mm^(4)
 *   13 ft 9 in, 13 ft-9 in, 13'-9" → (13 ft + 9 inch)      −2 mm (real minus) → -2 mm
 *
 * Only text is rewritten: the result still goes through the whitelist walk of
 * quantityExpression.ts, so nothing here can widen what an expression may do.
 *
 * A hyphen or a dot joins two names into a product only when both are unit names and it
 * touches both (`kN-m`, `N.m`). Anything else keeps its meaning: `L - 10 mm` and
 * `L-10 mm` subtract (L is the column length, never a unit), and `kN - m` with spaces
 * stays a subtraction (and is refused as force minus length).
 */
import { COLUMN_LENGTH_SYMBOL, lookupUnit } from './units.js';

const SUPERSCRIPT_DIGITS: Readonly<Record<string, string>> = {
  '⁰': '0', '¹': '1', '²': '2', '³': '3', '⁴': '4', '⁵': '5', '⁶': '6', '⁷': '7', '⁸': '8', '⁹': '9', '⁻': '-', '⁺': '+',
};
const SUPERSCRIPT_RUN = /[⁻⁺]?[⁰¹²³⁴⁵⁶⁷⁸⁹]+/g;
const POWER_OF_TEN = /(\d)\s*×\s*10(?:([⁻⁺]?[⁰¹²³⁴⁵⁶⁷⁸⁹]+)|\^\(?([-+]?\d+)\)?)/g;

const NUMBER = String.raw`(\d+(?:\.\d*)?|\.\d+)`;
/** `13 ft 9 in`, `13 ft-9 in`, `13'-9"`, `13' 9"`: feet and inches added, not multiplied. */
const FEET_AND_INCHES = new RegExp(
  String.raw`${NUMBER}\s*(?:(?:ft|feet|foot)(?![A-Za-z0-9_])|')(?:-|\s+)?${NUMBER}\s*(?:(?:in|inch|inches)(?![A-Za-z0-9_])|")`,
  'g',
);

/** Names glued from a force and a length, which the unit table lacks: kNm = kN·m. */
const GLUED_MOMENT = /^([kMG]?)N(m|mm)$/;

const TOKEN = /\s+|[A-Za-zµΩ°_][A-Za-z0-9µΩ°_]*|(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?|[\s\S]/gy;
const WORD = /^[A-Za-zµΩ°_]/;
const PRODUCT_SIGNS = new Set(['·', '⋅', '•', '∙']);

function fromSuperscript(run: string): string {
  return run.split('').map((ch) => SUPERSCRIPT_DIGITS[ch] ?? ch).join('');
}

/** A name the unit table knows, or a glued moment such as kNm (never L). */
export function isUnitName(name: string): boolean {
  if (name === COLUMN_LENGTH_SYMBOL) return false;
  return name === 'in' || GLUED_MOMENT.test(name) || lookupUnit(name) !== undefined;
}

function rewriteName(name: string): string {
  if (name === 'in') return 'inch'; // `in` is a conversion keyword of the parser, not a unit
  if (lookupUnit(name) === undefined) {
    const glued = GLUED_MOMENT.exec(name);
    if (glued !== null) return `(${glued[1]}N*${glued[2]})`;
  }
  return name;
}

const CACHE_LIMIT = 2000;
const rewritten = new Map<string, string>();

/** The text with every unit spelling above rewritten; other text unchanged. */
export function normaliseUnitSpelling(text: string): string {
  // scenarios and sweeps repeat the same few texts: remember them (bounded)
  const known = rewritten.get(text);
  if (known !== undefined) return known;
  const result = rewrite(text);
  if (rewritten.size >= CACHE_LIMIT) rewritten.clear();
  rewritten.set(text, result);
  return result;
}

function rewrite(text: string): string {
  let s = text.replace(/\u2212/g, '-');
  s = s.replace(POWER_OF_TEN, (_m, digit: string, sup?: string, plain?: string) => `${digit}e${sup !== undefined ? fromSuperscript(sup) : plain}`);
  s = s.replace(SUPERSCRIPT_RUN, (run) => `^(${fromSuperscript(run)})`);
  s = s.replace(FEET_AND_INCHES, (_m, feet: string, inches: string) => `(${feet} ft + ${inches} inch)`);

  const tokens: string[] = [];
  TOKEN.lastIndex = 0;
  for (let m = TOKEN.exec(s); m !== null && m[0] !== ''; m = TOKEN.exec(s)) tokens.push(m[0]);
  const out: string[] = [];
  for (let i = 0; i < tokens.length; i++) {
    const t = tokens[i]!;
    if (PRODUCT_SIGNS.has(t)) {
      out.push('*');
    } else if ((t === '-' || t === '.') && joinsTwoUnits(tokens[i - 1], tokens[i + 1])) {
      out.push('*');
    } else if (WORD.test(t)) {
      out.push(rewriteName(t));
    } else {
      out.push(t);
    }
  }
  return out.join('');
}

function joinsTwoUnits(before: string | undefined, after: string | undefined): boolean {
  return before !== undefined && after !== undefined && WORD.test(before) && WORD.test(after) && isUnitName(before) && isUnitName(after);
}
