/**
 * One plain sentence that states the outcome of a restraint study with its numbers, for the
 * report and the terminal. Units and the mechanics (fixity factor, K) come from callbacks so
 * this file stays free of both.
 */
import type { RestraintStudyResult } from './restraintStudy.js';

export interface RestraintWording {
  /** A stiffness in N·m/rad shown with its display unit, e.g. `2.41 MN·m/rad`. */
  formatStiffness: (stiffness: number) => string;
  /** Fixity factor R/(R+3) of an end at this mean stiffness. */
  fixityFactor: (end: string, stiffness: number) => number;
  /** Effective-length factor K with these mean end stiffnesses. */
  effectiveLengthFactor: (stiffness: Readonly<Record<string, number>>) => number;
  /** Words for an end name (default: `the <end>`). */
  endLabel?: (end: string) => string;
}

const two = (x: number): string => x.toFixed(2);
const three = (x: number): string => Number(x.toPrecision(3)).toString();

function listJoin(parts: string[]): string {
  if (parts.length <= 1) return parts.join('');
  return `${parts.slice(0, -1).join(', ')} and ${parts[parts.length - 1]}`;
}

export function restraintSentence(result: RestraintStudyResult, wording: RestraintWording): string {
  const label = wording.endLabel ?? ((end: string) => `the ${end}`);
  const goal = `The target β = ${two(result.target)}`;
  switch (result.outcome) {
    case 'pinned-suffices':
      return `${goal} is already met with pinned ends (β = ${two(result.pinned.beta)}), so no rotational restraint needs to be relied on.`;
    case 'unreachable':
      return `${goal} cannot be reached by end restraint alone: even rigid ends give only β = ${two(result.fixed.beta)}.`;
    case 'fixed-only':
      return `${goal} is reached only with practically rigid ends (β = ${two(result.fixed.beta)} when fixed); no finite stiffness checked was enough.`;
    case 'reached': {
      const factor = result.requiredFactor as number;
      const required = result.required as Record<string, number>;
      const parts = result.ends.map(
        (end) =>
          `${wording.formatStiffness(required[end])} at ${label(end)} (fixity factor ${two(wording.fixityFactor(end, required[end]))})`,
      );
      const k = wording.effectiveLengthFactor(required);
      return `${goal} needs a mean rotational stiffness of at least ${listJoin(parts)}, giving K = ${two(k)}; that is ${three(factor)} times the stiffness assumed.`;
    }
  }
}
