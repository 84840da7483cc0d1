/**
 * The plain sentences that state the outcome of a restraint study with its numbers, for the
 * report and the terminal. Units come from a callback so this file stays free of them; every
 * number is computed by the caller.
 */
import type { RestraintStudyResult } from './restraintStudy.js';
import type { EndRequirement } from './restraintRequirement.js';

export interface RestraintWording {
  /** A stiffness in N·m/rad shown with its display unit, e.g. `2.41 MN·m/rad`. */
  formatStiffness: (stiffness: number) => string;
  /** What every β is conditioned on, e.g. `given the survived loads` (absent: nothing). */
  condition?: string;
}

/** What the caller computed at the reported requirement (study outcome 'reached'). */
export interface RequirementFacts {
  requirement: Record<string, EndRequirement & { fixityFactor: number }>;
  /** K with every studied end at its required mean */
  k: number;
  /** K with every studied end at its design stiffness */
  kDesign: number;
  /** the reported factor on the assumed stiffness (after any raise) */
  factor: number;
}

/** What the caller computed when the target is out of reach of restraint. */
export interface ShortfallFacts {
  /** loads × this factor meet the target with the studied ends rigid; null when not found */
  loadFactor: number | null;
  /** utilization at the means with the studied ends rigid, loads as given */
  utilizationRigid: number;
}

const two = (x: number): string => x.toFixed(2);
const three = (x: number): string => Number(x.toPrecision(3)).toString();

export function listJoin(parts: string[]): string {
  if (parts.length <= 1) return parts.join('');
  return `${parts.slice(0, -1).join(', ')} and ${parts[parts.length - 1]}`;
}

const OTHER: Record<string, string> = { bottom: 'top', top: 'bottom' };

/** "a rigid bottom connection (the top end as given)" or "rigid bottom and top connections". */
export function idealEndsPhrase(ends: readonly string[], ideal: 'rigid' | 'pinned'): string {
  if (ends.length === 1) return `a ${ideal} ${ends[0]} connection (the ${OTHER[ends[0]] ?? 'other'} end as given)`;
  return `${ideal} ${listJoin([...ends])} connections`;
}

export function restraintSentence(
  result: RestraintStudyResult,
  wording: RestraintWording,
  facts: { reached?: RequirementFacts; shortfall?: ShortfallFacts },
): string {
  const given = wording.condition ? ` ${wording.condition}` : '';
  const goal = `The target β = ${two(result.target)}${given}`;
  switch (result.outcome) {
    case 'pinned-suffices':
      return `${goal} is already met with ${idealEndsPhrase(result.ends, 'pinned')} (β = ${two(result.pinned.beta)}), so no rotational restraint needs to be relied on.`;
    case 'fixed-only':
      return `${goal} is reached only with ${idealEndsPhrase(result.ends, 'rigid')} (β = ${two(result.fixed.beta)} when rigid); no finite stiffness up to 10^9 times the one assumed was enough.`;
    case 'unreachable': {
      const sf = facts.shortfall;
      const change =
        sf && sf.loadFactor !== null
          ? `; the target would be met with the loads at ${three(100 * sf.loadFactor)} % of those given (utilization ${two(sf.utilizationRigid * sf.loadFactor)} at the means instead of ${two(sf.utilizationRigid)})`
          : '; reducing the load or strengthening the column is needed, not restraint';
      return `Even ${idealEndsPhrase(result.ends, 'rigid')} reach${result.ends.length === 1 ? 'es' : ''} only β = ${two(result.fixed.beta)}${given}, short of the target ${two(result.target)}${change}.`;
    }
    case 'reached': {
      const f = facts.reached;
      if (!f) throw new Error(`restraintSentence: a reached requirement needs its facts (factor ${String(result.requiredFactor)}, outcome ${result.outcome})`);
      const needs = result.ends.map((end) => {
        const q = f.requirement[end];
        const spread = q.cov > 0
          ? ` with CoV ${two(q.cov)}, that is a 5 % characteristic stiffness of at least ${wording.formatStiffness(q.characteristic)}`
          : ' (known exactly)';
        return `at the ${end} connection a mean rotational stiffness of at least ${wording.formatStiffness(q.mean)}${spread} (fixity factor ${two(q.fixityFactor)} at the mean)`;
      });
      const designs = result.ends.map((end) => {
        const q = f.requirement[end];
        return q.cov > 0
          ? `${wording.formatStiffness(q.design)} at the ${end} connection (${q.alphaBasis}, fractile Φ(−α·β) = ${q.designFractile.toPrecision(2)})`
          : `${wording.formatStiffness(q.design)} at the ${end} connection (known exactly)`;
      });
      return (
        `${goal} needs ${listJoin(needs)}; K = ${two(f.k)} at ${result.ends.length > 1 ? 'these means' : 'this mean'}, ${three(f.factor)} times the stiffness assumed. ` +
        `Design stiffness by the design-value method of EN 1990 Annex C: ${listJoin(designs)}; K_d = ${two(f.kDesign)} there, the K to use with the other design values of the same method.`
      );
    }
  }
}

/** The reliability-equivalent K, labelled so that nobody reads it as a code check's K. */
export const EQUIVALENT_K_LABEL =
  "K at which β reaches the target if the stiffness were known exactly (this scenario's statistics and strength model); not a partial-factor code check";
