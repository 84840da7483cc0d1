/**
 * "What the measurements changed" and "Which test buys most": built from ReportInput only.
 */
import type { Block, Section } from './reportDocument.js';
import { SECTION_TITLES } from './reportDocument.js';
import type { ChartSpec } from './charts/chartSpec.js';
import type { BetaVerdictRow, ReportInput } from './reportInput.js';
import { formatBeta, formatNumber, formatProbability, formatQuantity, type UnitSystem } from './displayUnits.js';

const verdictText = (b: BetaVerdictRow) => (b.meets ? 'meets the target' : 'falls short of the target');

export function measurementsSection(input: ReportInput, system: UnitSystem, charts: ChartSpec[], methodLabel: (m: ReportInput['reliability']['governing']['method']) => string): Section | null {
  const m = input.measurements;
  if (!m) return null;
  const blocks: Block[] = [];
  const rows: string[][] = m.steps
    ? m.steps.map((st) => [st.label, formatBeta(st.beta), formatProbability(st.pf), verdictText(st)])
    : [['as written (no evidence)', formatBeta(m.before.beta), formatProbability(m.before.pf), verdictText(m.before)],
       ...(m.afterTests ? [['with the test results', formatBeta(m.afterTests.beta), formatProbability(m.afterTests.pf), verdictText(m.afterTests)]] : []),
       ...(m.survival ? [['given the survived loads', formatBeta(m.after.beta), formatProbability(m.after.pf), verdictText(m.after)]] : [])];
  blocks.push({
    kind: 'table',
    caption: `FORM β against the target ${formatNumber(m.target, 3)}, one kind of evidence added at each step (one method throughout, so that each change is the evidence's alone).`,
    head: ['step', 'β', 'pf', 'verdict'],
    rows,
    numeric: [false, true, true, false],
  });
  const change = m.after.beta - m.before.beta;
  blocks.push({
    kind: 'callout',
    tone: m.after.meets ? 'ok' : 'warn',
    text: `The evidence moves β from ${formatBeta(m.before.beta)} to ${formatBeta(m.after.beta)} (${change >= 0 ? '+' : ''}${formatNumber(change, 2)}): the column ${m.before.meets === m.after.meets ? (m.after.meets ? 'met and still meets' : 'fell and still falls short of') : m.after.meets ? 'now meets' : 'now falls short of'} the target.`,
  });
  const u = m.modelUpdate;
  if (u) {
    const reading = (v: number, unit: 'rad' | 'Hz') => (!Number.isFinite(v) ? 'none' : unit === 'rad' ? `${formatNumber(v * 1e3, 3)} mrad` : `${formatNumber(v, 3)} Hz`);
    blocks.push({
      kind: 'table',
      caption: 'Measurements through the model, as entered, against the model at the means before and after the update (the reading error is lognormal with the CoV given).',
      head: ['item', 'measurement', 'reading', 'model before', 'model after', 'error CoV', 'source'],
      rows: u.readings.map((r) => [`evidence[${r.index}]`, r.description, reading(r.measured, r.unit), reading(r.predictedPrior, r.unit), reading(r.predictedPosterior, r.unit), formatNumber(r.measurementCov, 3), r.source ?? '—']),
      numeric: [false, false, true, true, true, true, false],
    });
    const cov = (x: { mean: number; sd: number }) => (x.mean !== 0 ? formatNumber(x.sd / Math.abs(x.mean), 3) : '—');
    blocks.push({
      kind: 'table',
      caption: `The variables the measurements inform (and those correlated with them), before and after; R̂ and ESS of the posterior draws (converged when R̂ < ${u.rhatLimit} and ESS ≥ ${u.essMinimum}).`,
      head: ['variable', 'mean before', 'CoV before', 'mean after', 'CoV after', '5 %–95 % after', 'fitted', 'R̂', 'ESS'],
      rows: u.variables.map((v) => {
        const q = (x: number) => formatQuantity(x, v.kind, system);
        return [v.description, q(v.prior.mean), cov(v.prior), q(v.posterior.mean), cov(v.posterior), `${q(v.posterior.q05)} – ${q(v.posterior.q95)}`, v.fittedDist, v.rhat.toFixed(3), String(Math.round(v.ess))];
      }),
      numeric: [false, true, true, true, true, true, false, true, true],
    });
    blocks.push({
      kind: u.converged ? 'paragraph' : 'callout',
      ...(u.converged ? {} : { tone: 'warn' as const }),
      text:
        `Sampler: ${u.method}; acceptance ${u.acceptance.map((a) => formatNumber(a, 2)).join(', ')}; largest R̂ ${u.maxRhat.toFixed(3)}, smallest ESS ${Math.round(u.minEss)}: ` +
        (u.converged ? 'converged.' : 'NOT converged; treat the updated β with caution.') +
        (u.correlations.length > 0 ? ` Posterior correlations carried into the assessment: ${u.correlations.map((c) => `${c.a} / ${c.b} ${formatNumber(c.rho, 2)}`).join('; ')}.` : '') +
        ` Approximation: ${u.approximation}.` +
        u.notes.map((n) => ` Note: ${n}.`).join(''),
    } as Block);
  }
  if (m.densities.length > 0) {
    blocks.push({ kind: 'paragraph', text: 'Test results as entered and their update are listed under the scenario inputs (appendix). Each chart below puts the distribution before the update against the one after: for test results the posterior predictive, the tests marked on the axis; for the measurements through the model the distribution fitted to the posterior draws, with the draws as a histogram.' });
    m.densities.forEach((_, i) => {
      const c = charts.find((x) => x.name === `measurement-density-${i + 1}`);
      if (c) blocks.push({ kind: 'chart', name: c.name, title: c.title });
    });
  }
  const s = m.survival;
  if (s) {
    const items = s.loads.map((l) => `${l.path}: ${formatQuantity(l.mean, 'force', system)}${l.random ? ' (mean; random)' : ''}${l.date ? `, ${l.date}` : ''}${l.notes ? `. ${l.notes}` : ''}`);
    blocks.push({ kind: 'list', items });
    const mcText = s.mc
      ? ` Crude Monte Carlo check (${s.mc.samples} samples, seed ${s.mc.seed}): ${s.mc.failures} failures among ${s.mc.survived} survivors, pf = ${formatProbability(s.mc.pf)}${Number.isFinite(s.mc.cov) ? ` (CoV ${formatNumber(s.mc.cov, 2)})` : ' (no failure: no estimate)'}.`
      : '';
    const isText = s.importance
      ? ` Importance sampling (${s.importance.samples} samples centred at ${s.importance.centre}, P(h > 0) by ${s.importance.survivalMethod === 'is' ? 'importance sampling at h’s design point' : 'crude Monte Carlo'}, seed ${s.importance.seed}): ` +
        (s.importance.hits > 0 ? `pf = ${formatProbability(s.importance.pf)}, β = ${formatBeta(s.importance.beta)} (CoV ${formatNumber(s.importance.cov, 2)}).` : 'no sample in the joint domain (no estimate).')
      : '';
    blocks.push({
      kind: 'paragraph',
      text:
        `Survived load: P(failure | survived) = P(g ≤ 0 and h > 0) / P(h > 0), with h = θ·capacity − the largest survived load. ` +
        `The column, the model and its model factor θ are the same in g and h; the loads in g are independent of the survived load. ` +
        `FORM on g and on h, with the exact bivariate normal of the two linearised margins (ρ = ${formatNumber(s.rho, 3)}): ` +
        `P(h > 0) = ${formatNumber(s.pSurvival, 4)} beforehand, conditional pf = ${formatProbability(s.pf)}${s.converged ? '' : ' (a FORM search did not converge: treat with care)'}.${isText}${mcText}`,
    });
  }
  if (s) {
    blocks.push({
      kind: 'callout',
      tone: m.after.meets ? 'ok' : 'warn',
      text:
        `The verdict of this report rests on the β given the survived loads (FORM on the two margins, checked by its importance-sampling ratio, or by the Monte Carlo ratio when importance sampling saw no failure; on the sampled ratio when they disagree)` +
        `${s.unconditional ? `; without them β = ${formatBeta(s.unconditional.beta)} (${s.unconditional.basis ?? methodLabel(s.unconditional.method)})` : ''}.` +
        `${s.check ? ` ${s.check.reason.charAt(0).toUpperCase()}${s.check.reason.slice(1)}.` : ''} The sampling methods, sensitivities and studies of this report do not use the survived loads.`,
    });
  }
  const g = input.reliability.governing;
  const formBeforeSurvival = m.steps ? m.steps.filter((st) => st.step !== 'survival').slice(-1)[0] : (m.afterTests ?? m.before);
  const gap = !s && g.method !== 'form' && Number.isFinite(g.beta) && Number.isFinite(formBeforeSurvival.beta) ? g.beta - formBeforeSurvival.beta : 0;
  blocks.push({
    kind: 'paragraph',
    text:
      'The assessment methods of this report use the updated distributions.' +
      (Math.abs(gap) >= 0.1
        ? ` Note: the governing estimate (${methodLabel(g.method)}, β = ${formatBeta(g.beta)}) differs from FORM with the same distributions (β = ${formatBeta(formBeforeSurvival.beta)}); read the changes above as shifts of β and check the final verdict with a sampling method.`
        : ''),
  });
  return { id: 'measurements', title: SECTION_TITLES.measurements, blocks };
}

export function testPlansSection(input: ReportInput, charts: ChartSpec[]): Section | null {
  const p = input.testPlans;
  if (!p) return null;
  const blocks: Block[] = [];
  const c = charts.find((x) => x.name === 'test-plans');
  if (c) blocks.push({ kind: 'chart', name: c.name, title: c.title });
  blocks.push({
    kind: 'table',
    caption: `Pre-posterior analysis: ${p.outcomes} outcomes of each plan drawn from today's distributions (seed ${p.seed}), each giving the FORM β the assessment would then have${p.survivalIncluded ? ' (given the survived load)' : ''}. β now ${formatBeta(p.betaNow)}, target ${formatNumber(p.target, 3)}. Ranked by the probability of meeting the target, then by the expected gain.`,
    head: ['rank', 'plan', 'meas. CoV', 'β after: 5 %', 'median', '95 %', 'P(meets target)', 'expected gain'],
    rows: p.plans.map((r, i) => [
      String(i + 1), r.label, r.measurementCov === undefined ? 'as entered' : formatNumber(r.measurementCov, 2),
      formatBeta(r.beta05), formatBeta(r.beta50), formatBeta(r.beta95), formatNumber(r.pMeet, 2),
      Number.isFinite(r.expectedGain) ? (r.expectedGain >= 0 ? '+' : '') + r.expectedGain.toFixed(2) : '—',
    ]),
    numeric: [true, false, true, true, true, true, true, true],
  });
  return { id: 'testPlans', title: SECTION_TITLES.testPlans, blocks };
}
