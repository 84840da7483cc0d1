/**
 * A quantity string (`200 GPa`, `2.5 MN m/rad`, or for lengths an expression such as
 * `L/1000 + 2 mm`) turned into an SI number of the kind the field expects. Converting to the
 * field's own SI unit is what turns a slip (`E: 4 m`) into an error instead of a wrong number.
 */
import { KINDS, describeDimensions, sameDimensions, type QuantityKind } from './dimensions.js';
import { evaluateQuantity, ExpressionError } from './quantityExpression.js';
import { acceptedUnitsPhrase, LIKELY_SLIPS, suggestUnit } from './acceptedUnits.js';

/** The unit the user wrote, kept so reports can echo inputs as given. */
export interface DisplayUnit {
  /** As written, e.g. `kN`, `MN m/rad`; '' for a pure number. */
  readonly unit: string;
  /** SI value of one `unit` (divide an SI value by it to display). */
  readonly factor: number;
}

export const PURE_NUMBER_UNIT: DisplayUnit = { unit: '', factor: 1 };

export interface Quantity {
  readonly value: number;
  readonly display: DisplayUnit;
}

// also `25.1×10⁶` and a real minus sign, as the reports print them
const LEADING_NUMBER = /^\s*[-+\u2212]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+|\s*×\s*10(?:[⁻⁺]?[⁰¹²³⁴⁵⁶⁷⁸⁹]+|\^\(?[-+]?\d+\)?))?\s*/;
const NAME = /[A-Za-zµΩ°_][A-Za-z0-9µΩ°_]*/g;

/**
 * Reads `text` as a quantity of `kind`; `columnLength` (m) enables the symbol L.
 * Throws ExpressionError with a message meant for the user (the caller adds the path).
 */
export function readQuantity(text: string, kind: QuantityKind, columnLength?: number): Quantity {
  // a sweep reads the same strings for every case: a pure function of its arguments, so remember results
  const key = `${kind}\u0000${columnLength ?? ''}\u0000${text}`;
  const known = remembered.get(key);
  if (known !== undefined) return known;
  const q = readQuantityOnce(text, kind, columnLength);
  if (remembered.size >= REMEMBERED_MAX) remembered.clear();
  remembered.set(key, q);
  return q;
}

const REMEMBERED_MAX = 4096;
const remembered = new Map<string, Quantity>();

function readQuantityOnce(text: string, kind: QuantityKind, columnLength?: number): Quantity {
  const info = KINDS[kind];
  const expected = `expected ${info.noun} (e.g. ${info.example})`;
  const accepted = acceptedUnitsPhrase(kind, info.noun);
  for (const name of text.match(NAME) ?? []) {
    const meant = Object.prototype.hasOwnProperty.call(LIKELY_SLIPS, name) ? LIKELY_SLIPS[name] : undefined;
    if (meant !== undefined) throw new ExpressionError(`${expected}: '${text}' uses '${name}' (a unit a thousandth of '${meant}'): did you mean '${meant}'? (${accepted})`);
  }
  let evaluated;
  try {
    evaluated = evaluateQuantity(text, columnLength === undefined ? {} : { columnLength });
  } catch (e) {
    if (!(e instanceof ExpressionError)) throw e;
    const meant = e.unknownName === undefined ? undefined : suggestUnit(e.unknownName);
    const why = meant === undefined ? e.message : `uses '${e.unknownName}', which is not a known unit: did you mean '${meant}'?`;
    throw new ExpressionError(`${expected}: '${text}' ${why} (${accepted})`);
  }
  if (!evaluated.hasUnit) {
    throw new ExpressionError(`${expected}, got a bare number (${text.trim()}): give a unit (${accepted})`);
  }
  if (!sameDimensions(evaluated.dimensions, info.dimensions)) {
    throw new ExpressionError(`${expected}, got ${describeDimensions(evaluated.dimensions)} (${text.trim()}) (${accepted})`);
  }
  return { value: evaluated.value, display: displayUnitOf(text, kind) };
}

/** `420 kN` → kN; an expression such as `L/1500` → the kind's default display unit. */
function displayUnitOf(text: string, kind: QuantityKind): DisplayUnit {
  const info = KINDS[kind];
  const match = LEADING_NUMBER.exec(text);
  if (match !== null) {
    const rest = text.slice(match[0].length).trim();
    if (rest !== '') {
      try {
        const unit = evaluateQuantity(rest);
        if (unit.hasUnit && unit.value > 0 && sameDimensions(unit.dimensions, info.dimensions)) {
          return { unit: rest, factor: unit.value };
        }
      } catch {
        // not a plain unit (e.g. `2 mm + L/1000`): fall through to the default
      }
    }
  }
  return info.defaultDisplay;
}
