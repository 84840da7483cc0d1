/**
 * Which period each load's distribution must describe in each load combination (Turkstra's
 * rule: Turkstra 1970; JCSS Probabilistic Model Code Part 1 (2001); Melchers & Beck,
 * Structural Reliability Analysis and Prediction, 3rd ed. 2018).
 *
 * - A time-varying load is one with a stated basis (`maximum_over` or `point_in_time`) whose kind
 *   is not permanent. Loads without a stated basis are taken as given for the reference period
 *   and are never converted (the version-1 meaning).
 * - With one time-varying load there is one combination: that load at its maximum over the
 *   reference period T.
 * - With two or more, each leads in turn: the leading load at its maximum over T, every other
 *   time-varying load at its companion value: its annual maximum (over min(1 year, T)) when it
 *   was given as a maximum, or its point-in-time distribution when that was given.
 *
 * A conversion is an exponent n on the stated CDF, F_used = F_stated^n: n = T_used/T_stated for
 * a maximum, T_used/renewal for a point-in-time value that renews independently.
 */
import type { Load, Scenario } from '../scenario/types.js';
import { loadActionScalars } from '../scenario/variables.js';

/** The companion period of a load given as a maximum, in years (JCSS Probabilistic Model Code Part 1, 2001). */
export const COMPANION_PERIOD_YEARS = 1;

export interface LoadCombination {
  /** the leading load's name; null when there is no time-varying load or only one */
  readonly leading: string | null;
  /** per load path, the exponent n on its stated CDF (1 = as stated) */
  readonly exponents: ReadonlyMap<string, number>;
}

export function isTimeVarying(load: Load): boolean {
  return load.kind !== 'permanent' && load.basis.type !== 'unstated';
}

/** Exponent that takes the load's stated distribution to its maximum over `years`. */
function exponentTo(load: Load, years: number): number {
  const b = load.basis;
  if (b.type === 'maximum') return years / b.years;
  if (b.type === 'point-in-time') {
    if (b.renewalYears === undefined) throw new Error(`${load.path}: a point-in-time load needs a renewal period to be taken to a maximum`);
    return years / b.renewalYears;
  }
  return 1;
}

function companionExponent(load: Load, referenceYears: number): number {
  if (load.basis.type === 'point-in-time') return 1;
  return exponentTo(load, Math.min(COMPANION_PERIOD_YEARS, referenceYears));
}

/** The combinations of a scenario, in the file order of their leading loads. */
export function loadCombinations(s: Pick<Scenario, 'loads' | 'referencePeriodYears'>): LoadCombination[] {
  const T = s.referencePeriodYears;
  const varying = s.loads.filter(isTimeVarying);
  const single = varying.length <= 1;
  const leaders: (Load | null)[] = single ? [varying[0] ?? null] : varying;
  return leaders.map((leader) => {
    const exponents = new Map<string, number>();
    for (const load of s.loads) {
      const n = !isTimeVarying(load) ? 1 : load === leader ? exponentTo(load, T) : companionExponent(load, T);
      exponents.set(load.path, n);
      // a load's moments, line load and top force describe the same period as the load: converted with it
      for (const { path } of loadActionScalars(load)) exponents.set(path, n);
    }
    return { leading: single ? null : leader!.name, exponents };
  });
}
