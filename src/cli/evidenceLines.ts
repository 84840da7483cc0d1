/** The terminal lines for variables updated by test results: prior → posterior, per variable. */
import { formatQuantity, type UnitSystem } from '../report/displayUnits.js';
import type { EvidenceMoments, EvidenceRow } from '../report/reportInput.js';
import { textTable } from './textTable.js';

const DIST_LABEL: Record<string, string> = { studentt: 'Student-t', logstudentt: 'log-Student-t' };

function distText(m: EvidenceMoments): string {
  const name = DIST_LABEL[m.distribution] ?? m.distribution;
  return m.dof === undefined ? name : `${name} (ν = ${Number(m.dof.toPrecision(4))})`;
}

function covText(cov: number): string {
  return Number.isFinite(cov) ? cov.toFixed(3) : 'not finite';
}

export const LOG_T_NOTE =
  'a log-Student-t has no finite mean: its mean and CoV are those of the lognormal with the same ln-location and ln-scale; the 5 % fractile is exact';

export function evidenceLines(rows: readonly EvidenceRow[], system: UnitSystem): string[] {
  if (rows.length === 0) return [];
  const q = (v: number, r: EvidenceRow) => formatQuantity(v, r.kind, system);
  const table: string[][] = [['variable', 'tests', '', 'distribution', 'mean', 'CoV', '5 % fractile']];
  for (const r of rows) {
    const tests = `${r.tests.length}${r.tested === 'this_one' ? ' (this item)' : ''}`;
    table.push([r.description, tests, 'before', distText(r.prior), q(r.prior.mean, r), covText(r.prior.cov), q(r.prior.fractile05, r)]);
    table.push(['', '', 'after', distText(r.posterior), q(r.posterior.mean, r), covText(r.posterior.cov), q(r.posterior.fractile05, r)]);
  }
  const lines = ['', '  test results (the updated distribution replaces the one written, in every method; docs/evidence.md):', textTable(table, '    ')];
  for (const r of rows) {
    const error = r.measurementSd !== undefined ? `, measurement sd ${q(r.measurementSd, r)}` : r.measurementCov !== undefined ? `, measurement CoV ${r.measurementCov}` : '';
    lines.push(`    ${r.description}: ${r.tests.map((t) => q(t, r)).join(', ')}${error}; ${r.method}${r.source ? `; source: ${r.source}` : ''}`);
  }
  if (rows.some((r) => r.posterior.distribution === 'logstudentt')) lines.push(`    note: ${LOG_T_NOTE}`);
  return lines;
}
