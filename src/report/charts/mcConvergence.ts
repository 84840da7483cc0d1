/** Monte Carlo estimate of pf against the number of samples, with its 95 % confidence band. */
import type { MonteCarloResult, ReportInput } from '../reportInput.js';
import { formatBeta, formatNumber, formatProbability } from '../displayUnits.js';
import { PALETTE } from '../chartStyle.js';
import { chartBase } from './chartBase.js';
import type { ChartSpec } from './chartSpec.js';

export function mcConvergenceChart(_input: ReportInput, mc: MonteCarloResult): ChartSpec {
  const trace = mc.convergence.filter((p) => p.samples > 0);
  const title = 'Monte Carlo convergence';
  const bound = mc.zeroFailureBound;
  const subtitle = bound
    ? [
        `Estimate of the failure probability with its 95 % confidence band: no failure in ${formatNumber(mc.samples, 4)} samples,`,
        `so only pf < ${formatProbability(bound.pf)} (β > ${formatBeta(bound.beta)}, one-sided 95 %, exact binomial).`,
      ]
    : [
        `Estimate of the failure probability with its 95 % confidence band; final pf = ${formatProbability(mc.pf)}`,
        `(${formatNumber(mc.failures, 4)} failures in ${formatNumber(mc.samples, 4)} samples, CoV ${(100 * mc.cov).toFixed(1)} %).`,
      ];
  // the axis ends at the samples drawn, not at the next power of ten
  const first = trace.length > 0 ? trace[0].samples : 1;
  const x = { field: 'samples', type: 'quantitative', scale: { type: 'log', domain: [first, Math.max(first * 1.0001, mc.samples)], nice: false }, title: 'samples drawn', axis: { format: '~s' } };
  return {
    name: 'mc-convergence',
    title,
    spec: {
      ...chartBase(title, subtitle),
      width: 460,
      height: 240,
      data: { values: trace },
      layer: [
        {
          name: 'confidenceBand',
          mark: { type: 'area', color: PALETTE.band, opacity: 0.6 },
          encoding: { x, y: { field: 'lo', type: 'quantitative', title: 'failure probability pf', axis: { format: '~g' } }, y2: { field: 'hi' } },
        },
        {
          name: 'estimateLine',
          mark: { type: 'line', color: PALETTE.resistance },
          encoding: { x, y: { field: 'pf', type: 'quantitative' } },
        },
        {
          name: 'finalEstimate',
          data: { values: [{ y: mc.pf }] },
          mark: { type: 'rule', color: PALETTE.ink, strokeDash: [4, 3] },
          encoding: { y: { field: 'y', type: 'quantitative' } },
        },
      ],
    },
  };
}
