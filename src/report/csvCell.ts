/**
 * One CSV cell, the same in every CSV stanchion writes (report tables, sweep.csv).
 *
 * - Numbers are written as numbers: JavaScript's shortest round-trip text; NaN as an empty
 *   cell, ±Infinity as inf / -inf.
 * - Text that a spreadsheet would run as a formula (starting with =, +, -, @, tab or carriage
 *   return) gets a leading apostrophe, unless it is plainly a number ('-2.5', '1e-3', '-inf'),
 *   which stays as it is (common practice against CSV injection, OWASP "CSV Injection").
 * - RFC 4180 quoting: a cell holding a quote, comma or line break is quoted, quotes doubled.
 */
export type CsvValue = string | number | boolean | null | undefined;

const FORMULA_START = /^[=+\-@\t\r]/;
const NUMBER_TEXT = /^[+-]?(?:(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?|inf|infinity|nan)$/i;

export function csvCell(value: CsvValue): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') {
    if (Number.isNaN(value)) return '';
    if (!Number.isFinite(value)) return value > 0 ? 'inf' : '-inf';
    return String(value);
  }
  let text = String(value);
  if (FORMULA_START.test(text) && !NUMBER_TEXT.test(text)) text = `'${text}`;
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}
