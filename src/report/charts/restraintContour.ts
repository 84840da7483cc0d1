/**
 * Iso-β lines over the mean stiffness of both ends (log axes): the target line bold, the assessed
 * point, and the two ideal-end asymptotes of the target line (one end rigid).
 */
import type { ReportInput, RestraintStudy } from '../reportInput.js';
import { formatBeta, formatNumber, toDisplay, type UnitSystem } from '../displayUnits.js';
import { PALETTE } from '../chartStyle.js';
import { axisTitle, chartBase } from './chartBase.js';
import type { ChartSpec, VegaLiteSpec } from './chartSpec.js';
import { stiffnessAxis, stiffnessUnit } from './stiffnessAxis.js';

export function restraintContourChart(input: ReportInput, study: RestraintStudy, system: UnitSystem): ChartSpec {
  const c = study.contour!;
  const unit = stiffnessUnit([...c.range.bottom, ...c.range.top], system);
  const d = (v: number) => toDisplay(v, unit);
  const target = input.reliability.target.beta;
  const segs = c.segments.map((s) => ({ level: formatBeta(s.level), target: s.level === target, b1: d(s.bottom[0]), b2: d(s.bottom[1]), t1: d(s.top[0]), t2: d(s.top[1]) }));
  const [bLo, bHi] = c.range.bottom.map(d);
  const [tLo, tHi] = c.range.top.map(d);
  const x = { field: 'b1', type: 'quantitative', scale: { type: 'log', domain: [bLo, bHi], nice: false }, title: axisTitle('mean stiffness of the bottom end', unit.label), axis: stiffnessAxis(bLo, bHi) };
  const y = { field: 't1', type: 'quantitative', scale: { type: 'log', domain: [tLo, tHi], nice: false }, title: axisTitle('mean stiffness of the top end', unit.label), axis: stiffnessAxis(tLo, tHi) };
  const layers: VegaLiteSpec[] = [
    {
      name: 'isoBeta',
      data: { values: segs.filter((s) => !s.target) },
      mark: { type: 'rule', strokeWidth: 1 },
      encoding: {
        x, y, x2: { field: 'b2' }, y2: { field: 't2' },
        color: { field: 'level', type: 'ordinal', title: 'β', scale: { scheme: 'blues' }, sort: 'ascending' },
      },
    },
    {
      name: 'targetContour',
      data: { values: segs.filter((s) => s.target) },
      mark: { type: 'rule', strokeWidth: 3, color: PALETTE.target },
      encoding: { x: { field: 'b1', type: 'quantitative' }, y: { field: 't1', type: 'quantitative' }, x2: { field: 'b2' }, y2: { field: 't2' } },
    },
  ];
  const a = c.asymptotes;
  if (a.bottomWithTopRigid !== null && d(a.bottomWithTopRigid) > bLo && d(a.bottomWithTopRigid) < bHi) {
    const v = d(a.bottomWithTopRigid);
    layers.push({
      name: 'asymptoteTopRigid',
      data: { values: [{ b1: v, label: `top rigid: ${formatNumber(v, 3)}` }] },
      layer: [
        { mark: { type: 'rule', strokeDash: [5, 3], color: PALETTE.muted }, encoding: { x: { field: 'b1', type: 'quantitative' } } },
        { mark: { type: 'text', angle: 270, align: 'right', baseline: 'top', dx: 3, dy: 3, color: PALETTE.muted, y: 0 }, encoding: { x: { field: 'b1', type: 'quantitative' }, text: { field: 'label' } } },
      ],
    });
  }
  if (a.topWithBottomRigid !== null && d(a.topWithBottomRigid) > tLo && d(a.topWithBottomRigid) < tHi) {
    const v = d(a.topWithBottomRigid);
    layers.push({
      name: 'asymptoteBottomRigid',
      data: { values: [{ t1: v, label: `bottom rigid: ${formatNumber(v, 3)}` }] },
      layer: [
        { mark: { type: 'rule', strokeDash: [5, 3], color: PALETTE.muted }, encoding: { y: { field: 't1', type: 'quantitative' } } },
        { mark: { type: 'text', align: 'right', baseline: 'bottom', dx: -3, dy: -3, color: PALETTE.muted, x: { expr: 'width' } }, encoding: { y: { field: 't1', type: 'quantitative' }, text: { field: 'label' } } },
      ],
    });
  }
  layers.push({
    name: 'assessedPoint',
    data: { values: [{ b1: d(c.assessed.bottom), t1: d(c.assessed.top), label: 'as assessed' }] },
    layer: [
      { mark: { type: 'point', shape: 'diamond', size: 120, filled: true, color: PALETTE.ink }, encoding: { x: { field: 'b1', type: 'quantitative' }, y: { field: 't1', type: 'quantitative' } } },
      { mark: { type: 'text', align: 'left', baseline: 'top', dx: 8, dy: 6, color: PALETTE.ink }, encoding: { x: { field: 'b1', type: 'quantitative' }, y: { field: 't1', type: 'quantitative' }, text: { field: 'label' } } },
    ],
  });
  const title = 'Reliability over the stiffness of both ends';
  const subtitle = [
    `Lines of equal β; bold red: the target β = ${formatBeta(target)}; dashed: the target's asymptotes with the other end rigid.`,
    `FORM β${study.givenSurvivedLoads ? ' given the survived loads' : ''} on a 7 × 7 grid (${c.formAnalyses} FORM analyses with the asymptotes), interpolated; each end keeps its CoV.`,
  ];
  return { name: 'restraint-contour', title, spec: { ...chartBase(title, subtitle), width: 400, height: 320, layer: layers } };
}
