/**
 * What an engineer should be told about the time basis of the loads and the target: loads whose
 * period was not stated (taken as given for the reference period) and targets outside the usual
 * range. Notes only: a version-1 file without the keys still means what it meant.
 */
import type { Scenario } from '../scenario/types.js';
import { isTimeVarying } from './loadCombinations.js';

/** Targets outside this range are unusual for structural members (warned, not refused). */
export const USUAL_TARGET_BETA = [1.5, 5.5] as const;

/** "50-year", "1-year": the period as an adjective. */
function years(y: number): string {
  return `${Number(y.toPrecision(6))}-year`;
}

export function loadTimeNotes(s: Scenario): string[] {
  const notes: string[] = [];
  const T = s.referencePeriodYears;
  const unstated = s.loads.filter((l) => l.value.kind === 'random' && l.kind !== 'permanent' && l.basis.type === 'unstated');
  for (const l of unstated) {
    if (l.kind !== undefined) {
      notes.push(`${l.path} (${l.kind}) states no maximum_over or point_in_time: its distribution is taken as the maximum over the ${years(T)} reference period.`);
    }
  }
  const unnamed = unstated.filter((l) => l.kind === undefined);
  if (unnamed.length >= 2 || (unnamed.length === 1 && s.loads.some(isTimeVarying))) {
    notes.push(
      `${unnamed.map((l) => l.path).join(', ')}: no kind or time basis given, so ${unnamed.length > 1 ? 'each is' : 'it is'} taken as given for the ${years(T)} reference period ` +
        'and summed as if the maxima of all loads coincided. State kind and maximum_over (or point_in_time) to combine time-varying loads by Turkstra\'s rule.',
    );
  }
  const [lo, hi] = USUAL_TARGET_BETA;
  const b = s.target.betaReferencePeriod;
  if (b < lo || b > hi) notes.push(`The target β = ${b.toFixed(2)} over the ${years(T)} reference period is outside the usual range ${lo} to ${hi}: check the target and its period.`);
  return notes;
}
