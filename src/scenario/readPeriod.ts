/**
 * A period of time (`50 years`, `1 year`, `6 months`, `1 week`) → years. Periods are read here
 * rather than through the unit table because a year in structural reliability is a calendar
 * year, and only these few units make sense for a reference or averaging period.
 */
const YEARS_PER_UNIT: Readonly<Record<string, number>> = {
  year: 1,
  years: 1,
  yr: 1,
  yrs: 1,
  a: 1,
  month: 1 / 12,
  months: 1 / 12,
  week: 7 / 365.25,
  weeks: 7 / 365.25,
  day: 1 / 365.25,
  days: 1 / 365.25,
};

const PERIOD = /^\s*([0-9]+(?:\.[0-9]*)?|\.[0-9]+)(?:[eE][-+]?[0-9]+)?\s*([A-Za-z]+)\s*$/;

/** Years, or a message saying what was expected. */
export function parsePeriod(text: unknown): { years: number } | { error: string } {
  const expected = 'a period such as 50 years, 1 year or 6 months';
  if (typeof text !== 'string') return { error: `expected ${expected}, got ${typeof text === 'number' ? `a bare number (${text}): give a unit` : 'something else'}` };
  const m = PERIOD.exec(text);
  const unit = m ? YEARS_PER_UNIT[m[2]!] : undefined;
  if (!m || unit === undefined) return { error: `expected ${expected}, got '${text}'` };
  const years = Number(text.trim().slice(0, text.trim().length - m[2]!.length)) * unit;
  if (!(years > 0) || !Number.isFinite(years)) return { error: `must be a period greater than zero, got '${text}'` };
  return { years };
}
