/**
 * The first buckled modes, column drawn upright (height x/L up the page, lateral
 * deflection across), with the inflection points and the effective length of mode 1.
 */
import type { ModeShapeData, ReportInput } from '../reportInput.js';
import { formatNumber, formatQuantity, type UnitSystem } from '../displayUnits.js';
import { PALETTE } from '../chartStyle.js';
import { chartBase } from './chartBase.js';
import type { ChartSpec, VegaLiteSpec } from './chartSpec.js';

/** Linear interpolation of w at ξ on the sampled shape. */
export function shapeAt(shape: ModeShapeData, xi: number): number {
  const p = shape.points;
  for (let i = 1; i < p.length; i++) {
    if (xi <= p[i].xi) {
      const t = (xi - p[i - 1].xi) / (p[i].xi - p[i - 1].xi || 1);
      return p[i - 1].w + t * (p[i].w - p[i - 1].w);
    }
  }
  return p[p.length - 1]?.w ?? 0;
}

/** The adjacent pair of inflection points whose spacing best matches Le (null if none). */
function effectiveLengthSpan(shape: ModeShapeData, L: number): [number, number] | null {
  if (shape.effectiveLength === null) return null;
  const ips = [...shape.inflectionPoints].sort((a, b) => a - b);
  let best: [number, number] | null = null;
  for (let i = 1; i < ips.length; i++) {
    const gap = Math.abs(ips[i] - ips[i - 1] - shape.effectiveLength / L);
    if (gap < 0.02 && (best === null || gap < Math.abs(best[1] - best[0] - shape.effectiveLength / L))) best = [ips[i - 1], ips[i]];
  }
  return best;
}

function modeLabel(m: ModeShapeData, L: number, system: UnitSystem): string {
  const le = m.effectiveLength === null ? '' : `, Le = ${formatQuantity(m.effectiveLength, 'length', system)} (${formatNumber(m.effectiveLength / L, 3)} L)`;
  return `mode ${m.mode}: Pcr = ${formatQuantity(m.criticalLoad, 'force', system, 4)}${le}`;
}

export function modeShapesChart(input: ReportInput, system: UnitSystem): ChartSpec {
  const L = input.column.length;
  const modes = input.check.modeShapes;
  const labels = modes.map((m) => modeLabel(m, L, system));
  const lines = modes.flatMap((m, k) => m.points.map((p) => ({ mode: labels[k], xi: p.xi, w: p.w })));
  const inflections = modes.flatMap((m, k) => m.inflectionPoints.map((xi) => ({ mode: labels[k], xi, w: shapeAt(m, xi) })));
  const x = { field: 'w', type: 'quantitative', title: 'lateral deflection w / max|w|', scale: { domain: [-1.5, 1.5], nice: false } };
  const y = { field: 'xi', type: 'quantitative', title: 'height x / L  (0 = bottom, 1 = top)', scale: { domain: [0, 1] } };
  const layers: VegaLiteSpec[] = [
    {
      name: 'columnAxis',
      data: { values: [{ w: 0, xi: 0, xi2: 1 }] },
      mark: { type: 'rule', color: PALETTE.muted, strokeWidth: 4, opacity: 0.35 },
      encoding: { x: { field: 'w', type: 'quantitative' }, y: { field: 'xi', type: 'quantitative' }, y2: { field: 'xi2' } },
    },
    {
      name: 'modeLines',
      data: { values: lines },
      mark: { type: 'line' },
      encoding: {
        x,
        y,
        order: { field: 'xi', type: 'quantitative' },
        color: { field: 'mode', type: 'nominal', title: null, scale: { domain: labels }, legend: { direction: 'vertical' } },
      },
    },
    {
      name: 'inflectionPoints',
      data: { values: inflections },
      mark: { type: 'point', shape: 'circle', size: 60, filled: false, strokeWidth: 2 },
      encoding: { x: { field: 'w', type: 'quantitative' }, y: { field: 'xi', type: 'quantitative' }, color: { field: 'mode', type: 'nominal' } },
    },
  ];
  const first = modes[0];
  const span = first ? effectiveLengthSpan(first, L) : null;
  if (first && span) {
    const le = `Le = ${formatNumber((span[1] - span[0]), 3)} L`;
    layers.push({
      name: 'effectiveLength',
      data: { values: [{ w: 1.3, a: span[0], b: span[1], mid: (span[0] + span[1]) / 2, label: le }] },
      layer: [
        { mark: { type: 'rule', color: PALETTE.ink, strokeWidth: 1.5 }, encoding: { x: { field: 'w', type: 'quantitative' }, y: { field: 'a', type: 'quantitative' }, y2: { field: 'b' } } },
        { mark: { type: 'tick', orient: 'horizontal', color: PALETTE.ink, size: 10, thickness: 1.5 }, encoding: { x: { field: 'w', type: 'quantitative' }, y: { field: 'a', type: 'quantitative' } } },
        { mark: { type: 'tick', orient: 'horizontal', color: PALETTE.ink, size: 10, thickness: 1.5 }, encoding: { x: { field: 'w', type: 'quantitative' }, y: { field: 'b', type: 'quantitative' } } },
        { mark: { type: 'text', angle: 270, baseline: 'bottom', dy: -5, color: PALETTE.ink }, encoding: { x: { field: 'w', type: 'quantitative' }, y: { field: 'mid', type: 'quantitative' }, text: { field: 'label' } } },
      ],
    });
  }
  const title = 'Buckled mode shapes';
  return {
    name: 'mode-shapes',
    title,
    spec: {
      ...chartBase(title, ['Column upright; circles: inflection points (zero curvature).', 'Bracket: effective length of mode 1 between inflection points.']),
      width: 300,
      height: 380,
      layer: layers,
    },
  };
}
