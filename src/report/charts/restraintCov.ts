/** How precisely must this connection be known: the required mean stiffness and its 5 % fractile against the stiffness's CoV. */
import type { ReportInput, RestraintStudy } from '../reportInput.js';
import { formatNumber, toDisplay, type UnitSystem } from '../displayUnits.js';
import { PALETTE } from '../chartStyle.js';
import { axisTitle, chartBase } from './chartBase.js';
import type { ChartSpec, VegaLiteSpec } from './chartSpec.js';
import { stiffnessAxis, stiffnessUnit } from './stiffnessAxis.js';

export function restraintCovChart(input: ReportInput, study: RestraintStudy, system: UnitSystem): ChartSpec {
  const c = study.covCurve!;
  const raw = c.points.flatMap((p) => [p.mean, p.characteristic]).filter((v): v is number => v !== null && v > 0 && Number.isFinite(v));
  const unit = stiffnessUnit(raw, system);
  const values = c.points.flatMap((p) => [
    ...(p.mean !== null && p.mean > 0 ? [{ cov: p.cov, k: toDisplay(p.mean, unit), what: 'required mean' }] : []),
    ...(p.characteristic !== null && p.characteristic > 0 ? [{ cov: p.cov, k: toDisplay(p.characteristic, unit), what: 'its 5 % fractile' }] : []),
  ]);
  const ks = values.map((v) => v.k);
  const lo = Math.min(...ks) / 1.3;
  const hi = Math.max(...ks) * 1.3;
  const layers: VegaLiteSpec[] = [
    {
      name: 'requiredAgainstCov',
      data: { values },
      mark: { type: 'line', point: { filled: true, size: 28 } },
      encoding: {
        x: { field: 'cov', type: 'quantitative', title: `coefficient of variation of the ${c.end} stiffness`, scale: { domain: [0, Math.max(0.65, c.assessedCov + 0.05)] }, axis: { values: [0, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6], format: '.1f' } },
        y: { field: 'k', type: 'quantitative', scale: { type: 'log', domain: [lo, hi], nice: false }, title: axisTitle(`${c.end} stiffness needed`, unit.label), axis: stiffnessAxis(lo, hi) },
        color: { field: 'what', type: 'nominal', title: null, scale: { range: [PALETTE.accent, PALETTE.resistance] } },
      },
    },
    {
      name: 'assessedCov',
      data: { values: [{ cov: c.assessedCov, label: `as assessed: CoV ${formatNumber(c.assessedCov, 2)}` }] },
      layer: [
        { mark: { type: 'rule', color: PALETTE.ink, strokeDash: [4, 3] }, encoding: { x: { field: 'cov', type: 'quantitative' } } },
        { mark: { type: 'text', angle: 270, align: 'right', baseline: 'bottom', dx: -3, dy: -3, color: PALETTE.ink, y: 0 }, encoding: { x: { field: 'cov', type: 'quantitative' }, text: { field: 'label' } } },
      ],
    },
  ];
  const title = 'How precisely must the connection be known';
  const subtitle = [
    `Mean ${c.end} stiffness at which FORM β${input.restraint?.givenSurvivedLoads ? ' given the survived loads' : ''} meets the target ${formatNumber(input.reliability.target.beta, 3)}, and its 5 % fractile, for each CoV.`,
    `One FORM root solve per CoV (${c.formAnalyses} FORM analyses in all).`,
  ];
  return { name: 'restraint-cov', title, spec: { ...chartBase(title, subtitle), width: 420, height: 260, layer: layers } };
}
