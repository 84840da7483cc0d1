/** The human summary of `stanchion assess` for the terminal. */
import type { Assessment } from '../studies/columnAssessment.js';
import { formatBeta, formatProbability, formatQuantity, type UnitSystem } from '../report/displayUnits.js';
import { quantityKindOf } from '../limitState/quantityKind.js';
import { CAUTION, textTable } from './textTable.js';

const LABEL = { form: 'FORM', sorm: 'SORM', is: 'importance sampling', mc: 'Monte Carlo', subset: 'subset simulation' } as const;

function pct(cov: number): string {
  return Number.isFinite(cov) ? `CoV ${(cov * 100).toFixed(1)} %` : 'CoV —';
}

export function formatAssessment(a: Assessment, system: UnitSystem): string {
  const s = a.scenario;
  const lines: string[] = [];
  lines.push(`stanchion assess: ${s.title}`);
  lines.push(`  ${s.column.frame} column, strength model ${s.strength}; seed ${a.seed}; ${a.model.names.length} random variables`);
  lines.push(`  at the means: capacity ${formatQuantity(a.check.capacity, 'force', system)}, demand ${formatQuantity(a.check.demand, 'force', system)}, utilization ${a.check.utilization.toFixed(3)}, K = ${a.check.effective_length_factor.toFixed(3)}`);
  lines.push('');
  const rows: string[][] = [['method', 'β', 'pf', 'uncertainty', 'calls']];
  const f = a.form;
  if (a.methods.includes('form')) rows.push(['FORM', formatBeta(f.beta), formatProbability(f.pf), f.converged ? 'converged' : Number.isFinite(f.beta) ? 'NOT converged' : 'no design point', String(f.calls)]);
  if (a.sorm) rows.push([`SORM (${a.sorm.used})`, formatBeta(a.sorm.beta), formatProbability(a.sorm.pf), '', String(a.sorm.calls)]);
  if (a.is) rows.push(['importance sampling', formatBeta(a.is.beta), formatProbability(a.is.pf), pct(a.is.cov), String(a.is.calls)]);
  if (a.mc) {
    rows.push([
      'Monte Carlo',
      formatBeta(a.mc.beta),
      formatProbability(a.mc.pf),
      `${pct(a.mc.cov)}, 95 % [${formatProbability(a.mc.ci95[0])}, ${formatProbability(a.mc.ci95[1])}]`,
      `${a.mc.samples} (${a.mc.failures} failed)`,
    ]);
  }
  if (a.subset) rows.push(['subset simulation', formatBeta(a.subset.beta), formatProbability(a.subset.pf), pct(a.subset.cov), String(a.subset.calls)]);
  lines.push(textTable(rows));
  lines.push('');
  lines.push(`  agreement: ${a.verdict.reason}`);
  const g = a.governing;
  const meets = g.beta >= s.targetBeta;
  lines.push(
    `  verdict: β = ${formatBeta(g.beta)} (${LABEL[g.method]}) against the target ${s.targetBeta}${s.targetSource ? ` (${s.targetSource})` : ''}: ` +
      (meets ? 'MEETS the target.' : 'does NOT meet the target.'),
  );
  lines.push('');
  lines.push('  design point (FORM) and importance α²:');
  const dp: string[][] = [['variable', 'mean', 'design point', 'α²']];
  const order = f.names.map((_, i) => i).sort((i, j) => f.importance[j] - f.importance[i]);
  for (const i of order) {
    const kind = quantityKindOf(f.names[i]);
    dp.push([f.names[i], formatQuantity(a.model.dists[i].mean, kind, system), formatQuantity(f.designPointX[i], kind, system), f.importance[i].toFixed(3)]);
  }
  lines.push(textTable(dp, '    '));
  if (a.sensitivity) {
    lines.push('');
    lines.push('  what drives it (utilization at the 5 % / 95 % quantile of one variable, the rest at their means):');
    lines.push(
      textTable(
        a.sensitivity.utilization.rows.slice(0, 6).map((t) => [t.variable, `${t.low.toFixed(3)} … ${t.high.toFixed(3)}`]),
        '    ',
      ),
    );
  }
  if (a.restraint) {
    lines.push('');
    lines.push(`  restraint: ${a.restraint.sentence}`);
  }
  if (a.warnings.length) {
    lines.push('');
    for (const w of a.warnings) lines.push(`  warning: ${w}`);
  }
  lines.push('');
  lines.push(CAUTION);
  return lines.join('\n') + '\n';
}
