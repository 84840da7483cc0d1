/**
 * β against the mean rotational stiffness of the studied ends (log axis), with the target,
 * the stiffness that meets it, today's stiffness, and the ideal pinned / fixed cases.
 */
import type { EndName, ReportInput, RestraintStudy } from '../reportInput.js';
import { displayUnit, formatBeta, toDisplay, type UnitSystem } from '../displayUnits.js';
import { PALETTE } from '../chartStyle.js';
import { axisTitle, chartBase } from './chartBase.js';
import type { ChartSpec, VegaLiteSpec } from './chartSpec.js';

/** A horizontal reference line with its label at the left end, above or below the line. */
function horizontalRule(name: string, y: number, label: string, color: string, dash: number[], xLeft: number, below = false): VegaLiteSpec[] {
  return [
    {
      name,
      data: { values: [{ y }] },
      mark: { type: 'rule', color, strokeDash: dash, strokeWidth: 1.5 },
      encoding: { y: { field: 'y', type: 'quantitative' } },
    },
    {
      name: `${name}Label`,
      data: { values: [{ y, x: xLeft, label }] },
      mark: { type: 'text', align: 'left', baseline: below ? 'top' : 'bottom', dx: 2, dy: below ? 3 : -3, color },
      encoding: {
        x: { field: 'x', type: 'quantitative' },
        y: { field: 'y', type: 'quantitative' },
        text: { field: 'label' },
      },
    },
  ];
}

export function restraintCurveChart(input: ReportInput, study: RestraintStudy, system: UnitSystem): ChartSpec {
  const unit = displayUnit('rotationalStiffness', system);
  const ends: EndName[] = study.ends;
  const finite = study.curve.filter((p) => p.ideal === undefined);
  const points = finite.flatMap((p) =>
    ends
      .filter((e) => p.stiffness[e] !== undefined && (p.stiffness[e] as number) > 0)
      .map((e) => ({ end: `${e} end`, k: toDisplay(p.stiffness[e] as number, unit), beta: p.beta, factor: p.factor })),
  );
  const ks = points.map((p) => p.k);
  // the left edge of the log axis: one decade-step below the smallest stiffness computed
  const xLeft = 10 ** Math.floor(Math.log10(Math.min(...ks)));
  const target = input.reliability.target;
  const pinned = study.curve.find((p) => p.ideal === 'pinned');
  const fixed = study.curve.find((p) => p.ideal === 'fixed');
  const current = points.filter((p) => Math.abs(p.factor - 1) < 1e-9);
  const required = ends
    .filter((e) => typeof study.required[e] === 'number')
    .map((e) => ({ end: `${e} end`, k: toDisplay(study.required[e] as number, unit) }));

  const layers: VegaLiteSpec[] = [
    ...horizontalRule('targetLine', target.beta, `target β = ${formatBeta(target.beta)} (${target.source})`, PALETTE.target, [6, 4], xLeft),
  ];
  if (pinned) layers.push(...horizontalRule('pinnedIdeal', pinned.beta, `ideal pinned: β = ${formatBeta(pinned.beta)}`, PALETTE.muted, [2, 3], xLeft, true));
  if (fixed) layers.push(...horizontalRule('fixedIdeal', fixed.beta, `ideal fixed: β = ${formatBeta(fixed.beta)}`, PALETTE.muted, [2, 3], xLeft));
  layers.push({
    name: 'restraintLine',
    data: { values: points },
    mark: { type: 'line', point: { filled: true, size: 28 } },
    encoding: {
      x: { field: 'k', type: 'quantitative', scale: { type: 'log' }, title: axisTitle('mean rotational stiffness k', unit.label), axis: { format: '~s' } },
      y: { field: 'beta', type: 'quantitative', title: 'reliability index β (FORM)' },
      color: { field: 'end', type: 'nominal', title: null },
    },
  });
  if (current.length > 0) {
    layers.push({
      name: 'currentPoint',
      data: { values: current.map((c) => ({ ...c, label: 'as assessed' })) },
      layer: [
        { mark: { type: 'point', shape: 'diamond', size: 120, filled: true, color: PALETTE.ink }, encoding: { x: { field: 'k', type: 'quantitative' }, y: { field: 'beta', type: 'quantitative' } } },
        { mark: { type: 'text', align: 'right', baseline: 'top', dx: -6, dy: 6, color: PALETTE.ink }, encoding: { x: { field: 'k', type: 'quantitative' }, y: { field: 'beta', type: 'quantitative' }, text: { field: 'label' } } },
      ],
    });
  }
  if (required.length > 0) {
    layers.push({
      name: 'requiredRule',
      data: { values: required.map((r) => ({ ...r, label: `required (${r.end})` })) },
      layer: [
        { mark: { type: 'rule', color: PALETTE.accent, strokeWidth: 1.5 }, encoding: { x: { field: 'k', type: 'quantitative' } } },
        { mark: { type: 'text', angle: 270, align: 'left', baseline: 'bottom', dx: 6, dy: -3, color: PALETTE.accent, y: { expr: 'height' } }, encoding: { x: { field: 'k', type: 'quantitative' }, text: { field: 'label' } } },
      ],
    });
  }
  const title = 'Reliability against end restraint';
  const subtitle = [
    `Mean stiffness of the studied end${ends.length > 1 ? 's' : ''} (${ends.join(' and ')}) scaled by one common factor, CoV kept.`,
    'Diamond: the stiffness assessed; green line: the stiffness at which β meets the target.',
  ];
  return {
    name: 'restraint-curve',
    title,
    spec: { ...chartBase(title, subtitle), width: 460, height: 280, layer: layers },
  };
}
