/**
 * β against the mean rotational stiffness of the studied ends (log axis), with the target,
 * the stiffness that meets it, today's stiffness, and the ideal pinned / fixed cases.
 */
import type { EndName, ReportInput, RestraintStudy } from '../reportInput.js';
import { formatBeta, formatNumber, toDisplay, type UnitSystem } from '../displayUnits.js';
import { stiffnessAxis, stiffnessUnit } from './stiffnessAxis.js';
import { PALETTE } from '../chartStyle.js';
import { axisTitle, chartBase } from './chartBase.js';
import type { ChartSpec, VegaLiteSpec } from './chartSpec.js';

/** A horizontal reference line with its label at the left end, above or below the line. */
function horizontalRule(name: string, y: number, label: string, color: string, dash: number[], xLeft: number, below = false, right = false): VegaLiteSpec[] {
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
      mark: { type: 'text', align: right ? 'right' : 'left', baseline: below ? 'top' : 'bottom', dx: right ? -2 : 2, dy: below ? 3 : -3, color },
      encoding: {
        x: { field: 'x', type: 'quantitative' },
        y: { field: 'y', type: 'quantitative' },
        text: { field: 'label' },
      },
    },
  ];
}

export function restraintCurveChart(input: ReportInput, study: RestraintStudy, system: UnitSystem): ChartSpec {
  const ends: EndName[] = study.ends;
  const finite = study.curve.filter((p) => p.ideal === undefined);
  const rawK = finite.flatMap((p) => ends.map((e) => p.stiffness[e] ?? 0));
  const unit = stiffnessUnit(rawK, system);
  const points = finite.flatMap((p) =>
    ends
      .filter((e) => p.stiffness[e] !== undefined && (p.stiffness[e] as number) > 0)
      .map((e) => ({ end: `${e} end`, k: toDisplay(p.stiffness[e] as number, unit), beta: p.beta, factor: p.factor })),
  );
  const ks = points.map((p) => p.k);
  const kLo = Math.min(...ks);
  const kHi = Math.max(...ks);
  const xLeft = kLo / 1.5;
  const target = input.reliability.target;
  const pinned = study.curve.find((p) => p.ideal === 'pinned');
  const fixed = study.curve.find((p) => p.ideal === 'fixed');
  // one diamond per end, one label for all of them
  const current = points.filter((p) => Math.abs(p.factor - 1) < 1e-9).map((c, i) => ({ ...c, label: i === 0 ? 'as assessed' : '' }));
  const required = ends
    .filter((e) => typeof study.required[e] === 'number' && Number.isFinite(study.required[e] as number))
    .map((e) => ({ end: `${e} end`, k: toDisplay(study.required[e] as number, unit), label: `${e}: ${formatNumber(toDisplay(study.required[e] as number, unit), 3)} ${unit.label}` }));
  const betas = [...points.map((p) => p.beta), target.beta, ...(pinned ? [pinned.beta] : []), ...(fixed ? [fixed.beta] : [])].filter(Number.isFinite);
  // room above and below the lines so their labels keep off the ticks
  const yDomain = [Math.floor(Math.min(...betas) - 0.8), Math.ceil(Math.max(...betas) + 0.8)];

  // a fixed-end line close to the target (the other axis capping β, say): the lower label goes below its line
  const fixedNear = fixed !== undefined && Number.isFinite(fixed.beta) && Math.abs(fixed.beta - target.beta) < 0.3;
  const layers: VegaLiteSpec[] = [
    ...horizontalRule('targetLine', target.beta, `target β = ${formatBeta(target.beta)} (${target.source})`, PALETTE.target, [6, 4], xLeft, fixedNear && fixed.beta >= target.beta),
  ];
  // the ideal cases are labelled at the right end, away from the target's label
  if (pinned && Number.isFinite(pinned.beta)) layers.push(...horizontalRule('pinnedIdeal', pinned.beta, `ideal pinned: β = ${formatBeta(pinned.beta)}`, PALETTE.muted, [2, 3], xLeft, true));
  if (fixed && Number.isFinite(fixed.beta)) layers.push(...horizontalRule('fixedIdeal', fixed.beta, `ideal fixed: β = ${formatBeta(fixed.beta)}`, PALETTE.muted, [2, 3], xLeft, fixedNear && fixed.beta < target.beta));
  layers.push({
    name: 'restraintLine',
    data: { values: points },
    mark: { type: 'line', point: { filled: true, size: 28 } },
    encoding: {
      x: { field: 'k', type: 'quantitative', scale: { type: 'log', domain: [kLo / 1.5, kHi * 1.5], nice: false }, title: axisTitle('mean rotational stiffness k', unit.label), axis: stiffnessAxis(kLo / 1.5, kHi * 1.5) },
      y: { field: 'beta', type: 'quantitative', scale: { domain: yDomain }, title: 'reliability index β' },
      color: { field: 'end', type: 'nominal', title: null },
    },
  });
  // two axes: the joint classes about the studied axis (the check's are about y)
  const classes = (study.axis?.classes ?? input.connections?.classes ?? []).filter((c) => ends.includes(c.end));
  const limits = classes.flatMap((c) => [
    ...(c.rigidFrom !== null && c.rigidFrom > 0 && Number.isFinite(c.rigidFrom) ? [{ k: toDisplay(c.rigidFrom, unit), label: `${c.end} rigid from here` }] : []),
    ...(c.pinnedUpTo !== null && c.pinnedUpTo > 0 ? [{ k: toDisplay(c.pinnedUpTo, unit), label: `${c.end} nominally pinned below` }] : []),
  ]).filter((l) => l.k > kLo && l.k < kHi);
  if (limits.length > 0) {
    layers.push({
      name: 'jointClassLimits',
      data: { values: limits },
      layer: [
        { mark: { type: 'rule', color: PALETTE.muted, strokeDash: [1, 3], strokeWidth: 1.2 }, encoding: { x: { field: 'k', type: 'quantitative' } } },
        { mark: { type: 'text', angle: 270, align: 'left', baseline: 'bottom', dx: 4, dy: -2, fontSize: 9, color: PALETTE.muted, y: { expr: 'height' } }, encoding: { x: { field: 'k', type: 'quantitative' }, text: { field: 'label' } } },
      ],
    });
  }
  // the requirement's value runs down its line: put "as assessed" on the side away from it
  const labelLeft = current.length > 0 && required.some((r) => r.k >= current[0].k);
  if (current.length > 0) {
    layers.push({
      name: 'currentPoint',
      data: { values: current },
      layer: [
        { mark: { type: 'point', shape: 'diamond', size: 120, filled: true, color: PALETTE.ink }, encoding: { x: { field: 'k', type: 'quantitative' }, y: { field: 'beta', type: 'quantitative' } } },
        { mark: { type: 'text', align: labelLeft ? 'right' : 'left', baseline: 'top', dx: labelLeft ? -8 : 8, dy: 6, color: PALETTE.ink }, encoding: { x: { field: 'k', type: 'quantitative' }, y: { field: 'beta', type: 'quantitative' }, text: { field: 'label' } } },
      ],
    });
  }
  if (required.length > 0) {
    layers.push({
      name: 'requiredRule',
      data: { values: required },
      layer: [
        { mark: { type: 'rule', color: PALETTE.accent, strokeWidth: 1.5 }, encoding: { x: { field: 'k', type: 'quantitative' } } },
        { mark: { type: 'text', angle: 270, align: 'right', baseline: 'bottom', dx: -4, dy: -3, color: PALETTE.accent, y: 0 }, encoding: { x: { field: 'k', type: 'quantitative' }, text: { field: 'label' } } },
      ],
    });
  }
  const title = 'Reliability against end restraint';
  const about = study.axis ? ` about ${study.axis.axis}` : '';
  const subtitle = [
    ends.length > 1
      ? `Mean stiffness of the ${ends.join(' and ')} ends${about} scaled by one common factor, CoV kept.`
      : `Mean stiffness of the ${ends[0]} end${about} scaled, CoV kept; the ${ends[0] === 'bottom' ? 'top' : 'bottom'} end as given.`,
    ...(study.axis ? [`β of the whole column; axis ${study.axis.otherAxis} alone: β = ${formatBeta(study.axis.otherBeta)} at every stiffness.`] : []),
    `Diamond: the stiffness assessed${required.length > 0 ? '; green line: the required mean stiffness, its value beside it' : ''}${limits.length > 0 ? '; dotted: joint class limits of EN 1993-1-8 §5.2.2.5' : ''}.`,
  ];
  return {
    name: 'restraint-curve',
    title,
    spec: { ...chartBase(title, subtitle), width: 460, height: 280, layer: layers },
  };
}
