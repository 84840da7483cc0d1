/**
 * One visual style for every chart: quiet greys, one accent per meaning, white ground,
 * sizes that survive printing at 100 % on A4 or Letter.
 */

/** The only font the charts use; the PNG renderer loads exactly this family. */
export const CHART_FONT = 'DejaVu Sans';

/** Colours with a meaning, reused across charts so a reader learns them once. */
export const PALETTE = {
  ink: '#1d2330',
  muted: '#6b7280',
  grid: '#e5e7eb',
  resistance: '#2f5d8a', // capacity-side quantities and the 5 % bars
  load: '#c0612b', // demand-side quantities and the 95 % bars
  target: '#b3261e', // the target β line
  accent: '#2e7d4f', // required stiffness, design point
  band: '#9db8d3', // confidence bands
  series: ['#2f5d8a', '#c0612b', '#2e7d4f', '#7a4f9a'],
} as const;

/** The vega-lite `config` object shared by every chart. */
export const CHART_CONFIG = {
  font: CHART_FONT,
  background: 'white',
  padding: 8,
  view: { stroke: null, continuousWidth: 420, continuousHeight: 240 },
  title: {
    anchor: 'start',
    font: CHART_FONT,
    fontSize: 14,
    fontWeight: 'bold',
    color: PALETTE.ink,
    subtitleFont: CHART_FONT,
    subtitleFontSize: 11,
    subtitleColor: PALETTE.muted,
    offset: 10,
  },
  axis: {
    labelFont: CHART_FONT,
    titleFont: CHART_FONT,
    labelFontSize: 11,
    titleFontSize: 11,
    titleFontWeight: 'normal',
    labelColor: PALETTE.ink,
    titleColor: PALETTE.ink,
    domainColor: PALETTE.muted,
    tickColor: PALETTE.muted,
    gridColor: PALETTE.grid,
    labelLimit: 240,
  },
  legend: {
    labelFont: CHART_FONT,
    titleFont: CHART_FONT,
    labelFontSize: 11,
    titleFontSize: 11,
    titleFontWeight: 'normal',
    orient: 'bottom',
    direction: 'horizontal',
    labelLimit: 0, // legends name things in full
  },
  text: { font: CHART_FONT, fontSize: 11, color: PALETTE.ink },
  range: { category: [...PALETTE.series] },
  bar: { discreteBandSize: 14 },
  line: { strokeWidth: 2 },
  rule: { color: PALETTE.muted },
} as const;

export const VEGA_LITE_SCHEMA = 'https://vega.github.io/schema/vega-lite/v6.json';
