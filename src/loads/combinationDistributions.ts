/**
 * The marginal distribution of every random variable in one load combination: each load's
 * stated distribution raised to the combination's exponent (maximumOver), everything else as
 * stated. The variables and their order are those of the scenario, so every combination shares
 * the same standard-normal space (one u per load; only its marginal changes).
 */
import type { Distribution } from '../probability/distribution.js';
import { makeDistribution } from '../probability/makeDistribution.js';
import type { RandomVariable, Scenario } from '../scenario/types.js';
import { randomVariables } from '../scenario/variables.js';
import { loadCombinations, type LoadCombination } from './loadCombinations.js';
import { maximumOver } from './maximumOverDistribution.js';

export function combinationDistributions(vars: readonly RandomVariable[], combination: LoadCombination): Distribution[] {
  return vars.map((v) => maximumOver(makeDistribution(v.spec), combination.exponents.get(v.path) ?? 1));
}

/** The sum of the loads' means in a combination (fixed loads at their value). */
function meanDemand(s: Scenario, combination: LoadCombination): number {
  const vars = randomVariables(s);
  const dists = combinationDistributions(vars, combination);
  let sum = 0;
  for (const load of s.loads) {
    const i = vars.findIndex((v) => v.path === load.path);
    sum += i >= 0 ? dists[i]!.mean : load.value.kind === 'fixed' ? load.value.value : 0;
  }
  return sum;
}

/**
 * The combination a single deterministic view uses (check, restraint study, sensitivity,
 * sweeps): the only one, or with several the one with the largest mean demand.
 */
export function defaultCombination(s: Scenario): LoadCombination {
  const all = loadCombinations(s);
  if (all.length === 1) return all[0]!;
  let best = all[0]!;
  let bestDemand = meanDemand(s, best);
  for (const c of all.slice(1)) {
    const d = meanDemand(s, c);
    if (d > bestDemand) {
      best = c;
      bestDemand = d;
    }
  }
  return best;
}
