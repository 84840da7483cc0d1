/**
 * Per variable updated by test results: what was entered, and the distribution before and after
 * (mean, CoV, 5 % fractile), for the terminal, the report and result.json. Numbers only; the
 * updating itself happened when the scenario was read (src/evidence/, docs/evidence.md).
 */
import { quantityKindOf, describePath } from '../limitState/quantityKind.js';
import type { DistSpec } from '../probability/distribution.js';
import { makeDistribution } from '../probability/makeDistribution.js';
import type { EvidenceRow, EvidenceMoments } from '../report/reportInput.js';
import type { Scenario } from '../scenario/types.js';
import { scalarAt } from '../scenario/variables.js';

function momentsOf(spec: DistSpec): EvidenceMoments {
  const d = makeDistribution(spec);
  return {
    distribution: spec.dist,
    mean: d.mean,
    cov: Number.isFinite(d.sd) ? d.sd / Math.abs(d.mean) : Infinity,
    fractile05: d.quantile(0.05),
    ...(spec.dof !== undefined ? { dof: spec.dof } : {}),
  };
}

export function evidenceRows(s: Scenario): EvidenceRow[] {
  return Object.entries(s.evidence ?? {}).map(([path, e]) => {
    const scalar = scalarAt(s, path);
    if (scalar === undefined || scalar.kind !== 'random') throw new Error(`evidenceRows: ${path} is not random`);
    return {
      path,
      description: describePath(path),
      kind: quantityKindOf(path),
      tests: [...e.tests],
      tested: e.tested,
      method: e.method,
      ...(e.measurementSd !== undefined ? { measurementSd: e.measurementSd } : {}),
      ...(e.measurementCov !== undefined ? { measurementCov: e.measurementCov } : {}),
      ...(e.source !== undefined ? { source: e.source } : {}),
      prior: momentsOf(e.prior),
      posterior: momentsOf(e.result ?? scalar.spec),
    };
  });
}
