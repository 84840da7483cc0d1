/** The ranked test plans: β after each plan (5–95 % range and median) against the target and β now. */
import type { ReportInput, TestPlansReport } from '../reportInput.js';
import { formatNumber } from '../displayUnits.js';
import { PALETTE } from '../chartStyle.js';
import { chartBase } from './chartBase.js';
import type { ChartSpec } from './chartSpec.js';

export function testPlansChart(_input: ReportInput, p: TestPlansReport): ChartSpec {
  const rows = p.plans
    .filter((r) => Number.isFinite(r.beta05) && Number.isFinite(r.beta95))
    .map((r, i) => ({ plan: `${i + 1}. ${r.label}`, lo: r.beta05, mid: r.beta50, hi: r.beta95, meet: `P(meets) ${formatNumber(r.pMeet, 2)}` }));
  const order = rows.map((r) => r.plan);
  const y = { field: 'plan', type: 'nominal', title: null, sort: order, axis: { labelLimit: 320 } };
  const layer = [
    { name: 'betaRange', data: { values: rows }, mark: { type: 'rule', strokeWidth: 3, color: PALETTE.accent }, encoding: { y, x: { field: 'lo', type: 'quantitative', title: 'β after the tests', scale: { zero: false } }, x2: { field: 'hi' } } },
    { name: 'betaMedian', data: { values: rows }, mark: { type: 'point', filled: true, size: 60, color: PALETTE.accent }, encoding: { y, x: { field: 'mid', type: 'quantitative' } } },
    { name: 'meetLabels', data: { values: rows }, mark: { type: 'text', align: 'left', dx: 6, color: PALETTE.ink }, encoding: { y, x: { field: 'hi', type: 'quantitative' }, text: { field: 'meet' } } },
    { name: 'targetLine', data: { values: [{ beta: p.target }] }, mark: { type: 'rule', color: PALETTE.ink, strokeDash: [4, 3] }, encoding: { x: { field: 'beta', type: 'quantitative' } } },
    ...(Number.isFinite(p.betaNow) ? [{ name: 'betaNowLine', data: { values: [{ beta: p.betaNow }] }, mark: { type: 'rule', color: PALETTE.resistance }, encoding: { x: { field: 'beta', type: 'quantitative' } } }] : []),
  ];
  const title = 'Which test buys most';
  const subtitle = [`β after each plan: 5–95 % range and median over ${p.outcomes} simulated outcomes.`, `Dashed: the target ${formatNumber(p.target, 3)}; solid: β now ${formatNumber(p.betaNow, 3)}.`];
  return { name: 'test-plans', title, spec: { ...chartBase(title, subtitle), width: 300, height: Math.max(60, 28 * rows.length), layer } };
}
