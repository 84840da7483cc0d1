/** The human summary of `stanchion assess` for the terminal. */
import { measurementLines } from './measurementLines.js';
import { STUDY_NAMES } from '../studies/studyNames.js';
import type { Assessment } from '../studies/columnAssessment.js';
import { formatBeta, formatProbability, formatQuantity, type UnitSystem } from '../report/displayUnits.js';
import { describePath, quantityKindOf } from '../limitState/quantityKind.js';
import { zeroFailureBound } from '../reliability/zeroFailureBound.js';
import { CAUTION, textTable } from './textTable.js';
import { ratioText } from './ratioText.js';
import { groupedNotes } from '../report/groupedNotes.js';
import { designPointConnections } from '../studies/designPointConnections.js';
import { connectionBasis, connectionLines } from './connectionText.js';
import { evidenceLines } from './evidenceLines.js';
import { evidenceRows } from '../studies/evidenceSummary.js';

const LABEL = { form: 'FORM', sorm: 'SORM', is: 'importance sampling', mc: 'Monte Carlo', subset: 'subset simulation' } as const;

function pct(cov: number): string {
  return Number.isFinite(cov) ? `CoV ${(cov * 100).toFixed(1)} %` : 'CoV —';
}

function modelFactorLine(a: Assessment): string {
  const m = a.modelFactor;
  const what = m.dist === 'fixed' ? `fixed ${m.mean}` : `${m.dist}, mean ${m.mean.toFixed(2)}, CoV ${m.cov.toFixed(2)}`;
  return m.source === 'default'
    ? `model factor: ${what}, the default for ${m.strength} (${m.reference})`
    : `model factor: ${what}, as given in the scenario`;
}

function characteristicLines(a: Assessment, system: UnitSystem): string[] {
  const c = a.characteristic;
  const fmt = (v: number | null, path: string) => (v === null ? '—' : formatQuantity(v, quantityKindOf(path), system));
  const rows: string[][] = [['variable', 'side', 'characteristic', 'design', 'γ implied', c.code ? 'code' : '', 'design/mean']];
  for (const r of c.rows) {
    const basis = r.fractile === null ? (r.side === 'favourable' ? '' : ' (mean)') : ` (${Math.round(r.fractile * 100)} %)`;
    rows.push([
      describePath(r.variable),
      r.side,
      `${fmt(r.characteristic, r.variable)}${basis}`,
      fmt(r.design, r.variable),
      r.partialFactor === null ? '—' : r.partialFactor.toFixed(3),
      r.code ? `${r.code.symbol} = ${r.code.value.toFixed(2)}` : '',
      r.designToMean === null ? '—' : r.designToMean.toFixed(3),
    ]);
  }
  const rf = c.resistance;
  rows.push([
    'resistance θ·capacity',
    'resistance',
    formatQuantity(rf.characteristic, 'force', system),
    formatQuantity(rf.design, 'force', system),
    rf.partialFactor.toFixed(3),
    rf.code ? `${rf.code.symbol} = ${rf.code.value.toFixed(2)}` : '',
    '',
  ]);
  return [
    '',
    '  characteristic values (EN 1990 4.1.2: resistance side 5 %, variable loads 95 %, permanent loads the mean) and implied partial factors',
    '  (γ = design/characteristic for loads, characteristic/design for resistances; design/mean is not a partial factor):',
    textTable(rows, '    '),
    ...(c.code ? [`    code factors for comparison: ${c.code} (${[...new Set(c.rows.flatMap((r) => (r.code ? [r.code.source] : [])).concat(rf.code ? [rf.code.source] : []))].join('; ')})`] : []),
  ];
}

function strengthModelLines(a: Assessment): string[] {
  if (!a.byStrengthModel) return [];
  const rows: string[][] = [['strength model', 'β (FORM)', 'model factor mean / CoV', 'from']];
  for (const m of a.byStrengthModel) {
    rows.push([
      `${m.strength}${m.chosen ? ' (chosen)' : ''}`,
      m.beta === null ? `— (${m.note ?? 'not evaluated'})` : formatBeta(m.beta),
      `${m.modelFactor.mean.toFixed(2)} / ${m.modelFactor.cov.toFixed(2)}`,
      m.modelFactor.source === 'default' ? 'default' : 'scenario',
    ]);
  }
  // notes on rows that have a β (how a corroded zone is treated): under the table, not in the number column
  const notes = groupedNotes(a.byStrengthModel).map((n) => `    ${n}`);
  return ['', '  β by strength model (same column; each with its own model factor):', textTable(rows, '    '), ...notes];
}

function years(y: number): string {
  return `${Number(y.toPrecision(6))} year${y === 1 ? '' : 's'}`;
}

/** The target as stated and over the reference period, with its source verbatim. */
function targetLine(a: Assessment): string {
  const s = a.scenario;
  const t = s.target;
  const source = [t.source, t.consequenceClass].filter((x) => x !== undefined).join('; ');
  return (
    `  target: β = ${formatBeta(t.betaReferencePeriod)} over the ${Number(s.referencePeriodYears.toPrecision(6))}-year reference period (annual ${formatBeta(t.betaAnnual)}` +
    `${t.periodYears !== 1 && t.periodYears !== s.referencePeriodYears ? `; stated ${formatBeta(t.beta)} over ${years(t.periodYears)}` : ''})` +
    `${source ? `, from ${source}` : ''}`
  );
}

function combinationLines(a: Assessment): string[] {
  const c = a.combinations!;
  const T = years(a.scenario.referencePeriodYears);
  const rows: string[][] = [['leading load', 'FORM β', 'pf', ...(c.sormSystem ? ['SORM β'] : [])]];
  c.combinations.forEach((k, i) =>
    rows.push([`${k.leading}${i === c.governing ? ' (lowest β)' : ''}`, formatBeta(k.form.beta), formatProbability(k.form.pf), ...(k.sorm ? [formatBeta(k.sorm.beta)] : [])]),
  );
  return [
    `  load combinations (Turkstra's rule: the leading load at its maximum over ${T}, the others at companion values):`,
    textTable(rows, '    '),
    `  series system of the combinations: β = ${formatBeta(a.governing.beta)}, pf = ${formatProbability(a.governing.pf)} (${LABEL[a.governing.method]})`,
    '',
  ];
}

/** β and pf of the governing estimate; Monte Carlo with no failure reads as its one-sided bound. */
function governingText(a: Assessment): { beta: string; pf: string; meets: boolean; bound: boolean } {
  const g = a.governing;
  if (g.method === 'mc' && a.mc && a.mc.failures === 0 && a.mc.samples > 0 && !g.basis) {
    const b = zeroFailureBound(a.mc.samples);
    return { beta: `> ${formatBeta(b.beta)}`, pf: `< ${formatProbability(b.pf)}`, meets: b.beta >= a.scenario.targetBeta, bound: true };
  }
  const bound = g.basis?.includes('upper bound') ?? false;
  return { beta: `${bound ? '> ' : '= '}${formatBeta(g.beta)}`, pf: `${bound ? '< ' : '= '}${formatProbability(g.pf)}`, meets: g.beta >= a.scenario.targetBeta, bound };
}

/** The one line that says whether the column meets its target. */
export function assessResultLine(a: Assessment): string {
  const s = a.scenario;
  const g = governingText(a);
  const verdict = g.meets ? 'MEETS the target' : g.bound ? 'NOT SHOWN to meet the target (only a bound; draw more samples)' : `FALLS SHORT of the target by Δβ = ${formatBeta(s.targetBeta - a.governing.beta)}`;
  return `result: β ${g.beta} (${a.governing.basis ?? LABEL[a.governing.method]}) against β = ${formatBeta(s.targetBeta)} over ${years(s.referencePeriodYears)}${s.targetSource ? ` (${s.targetSource})` : ''}: ${verdict}`;
}

function measurementEffectLines(a: Assessment, m: NonNullable<Assessment['measurements']>): string[] {
  const out = ['', '  what the evidence changed, step by step (FORM; report section "What the measurements changed"):'];
  const width = Math.max(...m.steps.map((st) => st.label.length));
  for (const st of m.steps) out.push(`    ${st.label.padEnd(width)}  β = ${formatBeta(st.beta)} (${st.meets ? 'meets' : 'short of'} the target)`);
  if (m.survival) {
    out.push(`    P(survival of the largest survived load) beforehand ${m.survival.pSurvival.toFixed(4)}`);
    const sv = m.survival;
    const verdictWord = (c: typeof sv.check) => (c ? `, ${c.agrees ? 'agrees' : 'DISAGREES'}` : '');
    if (sv.importance) {
      const r = sv.importance;
      const estimate = r.joint.hits > 0 ? `β = ${formatBeta(r.beta)} (CoV ${(100 * r.cov).toFixed(0)} %, ${r.samples} samples)` : `no failure in ${r.samples} samples (no estimate)`;
      out.push(`    importance-sampling check of the last step: ${estimate}${verdictWord(sv.importanceCheck)}`);
    }
    if (sv.mc) out.push(`    Monte Carlo check of the last step: β = ${formatBeta(sv.mc.beta)} (${sv.mc.failures} failures among ${sv.mc.survived} survivors)${verdictWord(sv.mcCheck)}${sv.importanceCheck ? ' (importance sampling decides)' : ''}`);
    const u = a.governingUnconditional;
    out.push(`    the verdict rests on the β given the survived loads${u ? ` (without them: β = ${formatBeta(u.beta)}, ${LABEL[u.method]})` : ''}; the methods below do not use the survived loads`);
  }
  return out;
}

export function formatAssessment(a: Assessment, system: UnitSystem): string {
  const s = a.scenario;
  const lines: string[] = [];
  lines.push(`stanchion assess: ${s.title}`);
  lines.push(`  ${assessResultLine(a)}`);
  lines.push(`  ${s.column.frame} column, strength model ${s.strength}; seed ${a.seed}; ${a.model.names.length} random variables`);
  lines.push(`  at the means: capacity ${formatQuantity(a.check.capacity, 'force', system)}, demand ${formatQuantity(a.check.demand, 'force', system)}, mean-value ratio demand / (θ × capacity) ${ratioText(a.check.utilization)}, K = ${ratioText(a.check.effective_length_factor)}`);
  if (a.axes) {
    const ax = a.axes;
    const other = ax.governing === 'y' ? 'z' : 'y';
    const means = ax.governingAtMeans === ax.governing ? 'also the smaller capacity at the means' : `at the means axis ${ax.governingAtMeans} has the smaller capacity`;
    lines.push(`  governing axis: ${ax.governing} (FORM about each axis alone: β ${formatBeta(ax[ax.governing].beta)} about ${ax.governing}, ${formatBeta(ax[other].beta)} about ${other}; ${means}; the column fails when either does)`);
  }
  lines.push(targetLine(a));
  lines.push(`  ${modelFactorLine(a)}`);
  if (a.scenario.evidence) lines.push(...evidenceLines(evidenceRows(a.scenario), system));
  if (a.measurementUpdate) lines.push(...measurementLines(a.measurementUpdate, system));
  if (a.measurements) lines.push(...measurementEffectLines(a, a.measurements));
  lines.push('');
  const combos = a.combinations;
  if (combos) lines.push(...combinationLines(a));
  const rows: string[][] = [['method', 'β', 'pf', 'uncertainty', 'calls']];
  const f = a.form;
  if (combos) {
    const fs = combos.formSystem;
    if (a.methods.includes('form')) rows.push(['FORM, series system', formatBeta(fs.beta), formatProbability(fs.pf), fs.method, String(combos.combinations.reduce((n, c) => n + c.form.calls, 0))]);
    if (combos.sormSystem) rows.push(['SORM, series system', formatBeta(combos.sormSystem.beta), formatProbability(combos.sormSystem.pf), '', String(combos.combinations.reduce((n, c) => n + (c.sorm?.calls ?? 0), 0))]);
  } else {
    if (a.methods.includes('form')) rows.push(['FORM', formatBeta(f.beta), formatProbability(f.pf), f.converged ? 'converged' : Number.isFinite(f.beta) ? 'NOT converged' : 'no design point', String(f.calls)]);
    if (a.methods.includes('form') && f.system.designPoints.length > 1) {
      rows.push([`FORM system (${f.system.designPoints.length} points)`, formatBeta(f.system.beta), formatProbability(f.system.pf), `bounds [${formatProbability(f.system.bounds.lower)}, ${formatProbability(f.system.bounds.upper)}]`, '']);
    }
    if (a.sorm) rows.push([`SORM (${a.sorm.used})`, formatBeta(a.sorm.beta), formatProbability(a.sorm.pf), '', String(a.sorm.calls)]);
  }
  if (a.is) rows.push(['importance sampling', formatBeta(a.is.beta), formatProbability(a.is.pf), pct(a.is.cov), String(a.is.calls)]);
  if (a.mc && a.mc.failures === 0 && a.mc.samples > 0) {
    const b = zeroFailureBound(a.mc.samples);
    rows.push(['Monte Carlo', `> ${formatBeta(b.beta)}`, `< ${formatProbability(b.pf)}`, 'no failure: one-sided 95 % bound', `${a.mc.samples} (0 failed)`]);
  } else if (a.mc) {
    rows.push([
      'Monte Carlo',
      formatBeta(a.mc.beta),
      formatProbability(a.mc.pf),
      `${pct(a.mc.cov)}, 95 % [${formatProbability(a.mc.ci95[0])}, ${formatProbability(a.mc.ci95[1])}]`,
      `${a.mc.samples} (${a.mc.failures} failed)`,
    ]);
  }
  if (a.formCheck) {
    const c = a.formCheck;
    rows.push([`FORM self-check (${c.method === 'Monte Carlo' ? 'MC' : 'IS'})`, formatBeta(c.beta), formatProbability(c.pf), `${pct(c.cov)}, ${c.agrees ? 'agrees' : 'DISAGREES'}`, `${c.calls} (${c.failures} failed)`]);
  }
  if (a.subset) rows.push(['subset simulation', formatBeta(a.subset.beta), formatProbability(a.subset.pf), pct(a.subset.cov), String(a.subset.calls)]);
  lines.push(textTable(rows));
  lines.push('');
  lines.push(`  ${rows.length > 2 ? 'agreement' : 'estimate'}: ${a.verdict.reason}`);
  lines.push('');
  lines.push('  design point (FORM) and importance α²:');
  const dp: string[][] = [['variable', 'mean', 'design point', 'α²']];
  const order = f.names.map((_, i) => i).sort((i, j) => f.importance[j] - f.importance[i]);
  for (const i of order) {
    const kind = quantityKindOf(f.names[i]);
    dp.push([describePath(f.names[i]), formatQuantity(a.model.dists[i].mean, kind, system), formatQuantity(f.designPointX[i], kind, system), f.importance[i].toFixed(3)]);
  }
  lines.push(textTable(dp, '    '));
  lines.push(...characteristicLines(a, system));
  lines.push(...strengthModelLines(a));
  const joints = designPointConnections(a);
  if (joints) {
    lines.push('');
    lines.push('  connection moments at the FORM design point (second order; the values to check each joint\'s moment resistance M_j,Rd against):');
    lines.push(...connectionLines(joints, system, undefined, '    '));
    lines.push(connectionBasis(joints, 'the design point', system));
  }
  const drivers = a.sensitivity?.utilization;
  if (drivers) {
    lines.push('');
    lines.push('  what drives it (mean-value ratio at the 5 % / 95 % quantile of one variable, the rest at their means):');
    lines.push(
      textTable(
        drivers.rows.slice(0, 6).map((t) => [describePath(t.variable), `${ratioText(t.low)} … ${ratioText(t.high)}`]),
        '    ',
      ),
    );
  }
  if (a.restraint) {
    lines.push('');
    lines.push(`  restraint: ${a.restraint.sentence}`);
  }
  lines.push('');
  lines.push(...runLines(a));
  if (a.warnings.length) {
    lines.push('');
    for (const w of a.warnings) lines.push(`  warning: ${w}`);
  }
  lines.push('');
  lines.push(CAUTION);
  lines.push('');
  lines.push(assessResultLine(a));
  return lines.join('\n') + '\n';
}

/** Which studies ran (and which did not), and every limit-state call by method and study. */
function runLines(a: Assessment): string[] {
  const skipped = STUDY_NAMES.filter((n) => !a.studies.includes(n));
  const total = Object.values(a.calls).reduce((x, y) => x + y, 0);
  return [
    `  studies: ${a.studies.length ? a.studies.join(', ') : 'none'}${skipped.length ? `; not run: ${skipped.join(', ')} (--studies LIST)` : ''}`,
    `  limit-state calls: ${Object.entries(a.calls).map(([k, n]) => `${k} ${n}`).join(', ')} (total ${total})`,
  ];
}
