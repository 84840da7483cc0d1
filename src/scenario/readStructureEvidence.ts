/**
 * The scenario-level `evidence:` list: items about the structure as a whole, each with a `type`.
 * Today: `survived_load` (the column has carried a load without failure; the conditioning
 * itself is in studies/survivalStudy.ts, docs/evidence.md §5).
 */
import { makeDistribution } from '../probability/makeDistribution.js';
import { fail, readScalar, type ReadContext } from './readScalar.js';
import type { ScenarioShape } from './scenarioShape.js';
import type { SurvivedLoad } from './types.js';

type RawItem = NonNullable<ScenarioShape['evidence']>[number];

export function readStructureEvidence(items: readonly RawItem[] | undefined, ctx: ReadContext): { survivedLoads: SurvivedLoad[] } {
  const survivedLoads: SurvivedLoad[] = [];
  (items ?? []).forEach((item, i) => {
    if (item.type === 'survived_load') {
      const at = ['evidence', i, 'load'] as const;
      const load = readScalar(item.load, { kind: 'force', domain: 'load' }, at, ctx);
      const mean = load.kind === 'fixed' ? load.value : makeDistribution(load.spec).mean;
      if (!(mean > 0)) fail(ctx, at, `must be a compressive load greater than zero, got ${String(item.load)}`);
      const clean = (t: string | undefined) => (t !== undefined && t.trim() !== '' ? t.trim() : undefined);
      const date = clean(item.date);
      const notes = clean(item.notes);
      survivedLoads.push({ path: `evidence[${i}].load`, load, ...(date ? { date } : {}), ...(notes ? { notes } : {}) });
    }
  });
  return { survivedLoads };
}
