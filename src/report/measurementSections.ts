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
  const rows: string[][] = [['as written (test results ignored, no survived load)', formatBeta(m.before.beta), formatProbability(m.before.pf), verdictText(m.before)]];
  if (m.afterTests) rows.push(['with the test results', formatBeta(m.afterTests.beta), formatProbability(m.afterTests.pf), verdictText(m.afterTests)]);
  if (m.survival) rows.push([m.afterTests ? 'with the test results and the survived load' : 'given the survived load', formatBeta(m.after.beta), formatProbability(m.after.pf), verdictText(m.after)]);
  blocks.push({
    kind: 'table',
    caption: `FORM β against the target ${formatNumber(m.target, 3)} before and after the evidence (one method throughout, so that the change is the evidence's alone).`,
    head: ['state', 'β', 'pf', 'verdict'],
    rows,
    numeric: [false, true, true, false],
  });
  const change = m.after.beta - m.before.beta;
  blocks.push({
    kind: 'callout',
    tone: m.after.meets ? 'ok' : 'warn',
    text: `The evidence moves β from ${formatBeta(m.before.beta)} to ${formatBeta(m.after.beta)} (${change >= 0 ? '+' : ''}${formatNumber(change, 2)}): the column ${m.before.meets === m.after.meets ? (m.after.meets ? 'met and still meets' : 'fell and still falls short of') : m.after.meets ? 'now meets' : 'now falls short of'} the target.`,
  });
  if (m.densities.length > 0) {
    blocks.push({ kind: 'paragraph', text: 'Data as entered and the update made are listed under the scenario inputs (appendix). Each chart below puts the distribution as written against the updated one; the tests are marked on the axis.' });
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
    blocks.push({
      kind: 'paragraph',
      text:
        `Survived load: P(failure | survived) = P(g ≤ 0 and h > 0) / P(h > 0), with h = θ·capacity − the largest survived load. ` +
        `The column, the model and its model factor θ are the same in g and h; the loads in g are independent of the survived load. ` +
        `FORM on g and on h, with the exact bivariate normal of the two linearised margins (ρ = ${formatNumber(s.rho, 3)}): ` +
        `P(h > 0) = ${formatNumber(s.pSurvival, 4)} beforehand, conditional pf = ${formatProbability(s.pf)}${s.converged ? '' : ' (a FORM search did not converge: treat with care)'}.${mcText}`,
    });
  }
  const g = input.reliability.governing;
  const formAfterTests = m.afterTests ?? m.before;
  const gap = g.method !== 'form' && Number.isFinite(g.beta) && Number.isFinite(formAfterTests.beta) ? g.beta - formAfterTests.beta : 0;
  blocks.push({
    kind: 'paragraph',
    text:
      'The assessment methods of this report use the updated distributions; the survived load enters only here (FORM and its Monte Carlo check).' +
      (Math.abs(gap) >= 0.1
        ? ` Note: the governing estimate (${methodLabel(g.method)}, β = ${formatBeta(g.beta)}) differs from FORM with the same distributions (β = ${formatBeta(formAfterTests.beta)}); read the changes above as shifts of β and check the final verdict with a sampling method.`
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
