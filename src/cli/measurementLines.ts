/** The terminal lines of a measurement update: the readings against the model, prior vs posterior, β before and after. */
import { formatBeta, formatQuantity, type UnitSystem } from '../report/displayUnits.js';
import type { MeasurementRow, MeasurementUpdateResult } from '../studies/measurementUpdate.js';
import { textTable } from './textTable.js';

function reading(v: number, unit: MeasurementRow['unit']): string {
  if (!Number.isFinite(v)) return 'none';
  return unit === 'rad' ? `${(v * 1e3).toPrecision(3)} mrad` : `${v.toPrecision(3)} Hz`;
}

function cov(mean: number, sd: number): string {
  return mean !== 0 && Number.isFinite(sd) ? (sd / Math.abs(mean)).toFixed(3) : '—';
}

export function measurementLines(r: MeasurementUpdateResult, system: UnitSystem): string[] {
  const s = r.summary;
  const lines = ['', '  measurements on this structure (the posterior replaces the prior in every method; docs/evidence.md §7):'];
  for (const m of s.measurements) {
    lines.push(`    [${m.index}] ${m.description}, error CoV ${m.measurementCov}: the model gives ${reading(m.predictedPrior, m.unit)} at the prior means, ${reading(m.predictedPosterior, m.unit)} at the posterior means${m.source ? `; source: ${m.source}` : ''}`);
  }
  const table: string[][] = [['variable', '', 'mean', 'CoV', '5 % fractile', '95 % fractile', 'R̂', 'ESS']];
  for (const v of s.variables) {
    const q = (x: number) => formatQuantity(x, v.kind, system);
    table.push([v.description, 'before', q(v.prior.mean), cov(v.prior.mean, v.prior.sd), q(v.prior.q05), q(v.prior.q95), '', '']);
    table.push(['', 'after', q(v.posterior.mean), cov(v.posterior.mean, v.posterior.sd), q(v.posterior.q05), q(v.posterior.q95), v.rhat.toFixed(3), String(Math.round(v.ess))]);
  }
  lines.push(textTable(table, '    '));
  lines.push(`    β before the measurements ${formatBeta(r.betaPrior)}, after ${formatBeta(r.betaPosterior)} (FORM on both; the table below is of the updated scenario)`);
  lines.push(`    posterior: ${s.method}; acceptance ${s.acceptance.map((a) => a.toFixed(2)).join(', ')}; max R̂ ${s.maxRhat.toFixed(3)}, min ESS ${Math.round(s.minEss)}${s.converged ? '' : ' (NOT converged)'}`);
  if (s.correlations.length > 0) lines.push(`    posterior correlations carried: ${s.correlations.map((c) => `${c.a} / ${c.b} ${c.rho.toFixed(2)}`).join('; ')}`);
  lines.push(`    approximation: ${s.approximation}`);
  for (const n of s.notes) lines.push(`    note: ${n}`);
  return lines;
}
