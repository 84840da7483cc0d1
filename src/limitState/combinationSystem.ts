/**
 * Several load combinations as one series system on the shared standard-normal space:
 * g_sys(u) = min_j g_j(T_j(u)), T_j the Nataf map with combination j's marginals. The problem's
 * "physical" variables are u itself (identity transform), so sampling methods draw u exactly as
 * for a single combination. No allocation per call.
 */
import { loadCombinations } from '../loads/loadCombinations.js';
import { natafTransform, type IsoTransform } from '../probability/nataf.js';
import type { ReliabilityProblem } from '../reliability/types.js';
import type { Scenario } from '../scenario/types.js';
import { buildColumnModel, type ColumnModel } from './columnModel.js';

function identity(n: number): IsoTransform {
  return {
    n,
    toPhysical: (u, x) => x.set(u),
    toStandard: (x, u) => u.set(x),
  };
}

/** One column model per load combination, in the order of loadCombinations. */
export function combinationModels(s: Scenario): ColumnModel[] {
  return loadCombinations(s).map((c) => buildColumnModel(s, c));
}

export function combinationSystemProblem(models: readonly ColumnModel[]): ReliabilityProblem {
  const first = models[0];
  if (!first) throw new Error('combinationSystemProblem: no combination');
  const n = first.names.length;
  const parts = models.map((m) => ({ g: m.g, transform: natafTransform(m.dists, m.correlation, m.names), x: new Float64Array(n) }));
  return {
    names: first.names.map((name) => `u(${name})`),
    transform: identity(n),
    g: (u) => {
      let min = Infinity;
      for (const p of parts) {
        p.transform.toPhysical(u, p.x);
        const g = p.g(p.x);
        if (g < min || Number.isNaN(g)) min = g;
      }
      return min;
    },
  };
}
