// PNGs must contain drawn text: resvg silently draws none when it has no font (DESIGN.md, toolchain facts).
// common practice: compare pixel counts of the same image with and without text / font.
import { beforeAll, describe, expect, it } from 'vitest';
import { Resvg } from '@resvg/resvg-js';
import { readFileSync } from 'node:fs';
import { chartToSvg, svgToPng } from '../../src/report/renderChart.js';
import { buildCharts } from '../../src/report/charts/allCharts.js';
import { chartFontFiles } from '../../src/report/chartFonts.js';
import { readFontMetrics, textWidth } from '../../src/report/fontMetrics.js';
import { CHART_FONT } from '../../src/report/chartStyle.js';
import { columnSketchSvg } from '../../src/report/columnSketch.js';
import { decodePng, darkPixels } from './decodePng.js';
import { demoReportInput } from './fixture.js';

const input = demoReportInput();
let svg = '';

/** The same SVG with every text element removed. */
function withoutText(s: string): string {
  return s.replace(/<text\b[\s\S]*?<\/text>/g, '');
}

/** Pixels that differ (any channel by more than 8) between two same-size images. */
function differingPixels(a: ReturnType<typeof decodePng>, b: ReturnType<typeof decodePng>): number {
  expect([a.width, a.height]).toEqual([b.width, b.height]);
  let n = 0;
  for (let i = 0; i < a.rgba.length; i += 4) {
    if (Math.abs(a.rgba[i] - b.rgba[i]) > 8 || Math.abs(a.rgba[i + 1] - b.rgba[i + 1]) > 8 || Math.abs(a.rgba[i + 2] - b.rgba[i + 2]) > 8) n++;
  }
  return n;
}

beforeAll(async () => {
  const tornado = buildCharts(input, 'si').find((c) => c.name === 'tornado-utilization');
  if (!tornado) throw new Error('tornado chart missing');
  svg = await chartToSvg(tornado.spec);
});

describe('PNG text', () => {
  it('draws the title: dark pixels in the title band, none without a font', () => {
    const scale = 2;
    const withFont = decodePng(svgToPng(svg, { scale }));
    const noFont = decodePng(svgToPng(svg, { scale, fontFiles: [] }));
    // the title sits in the top 24 px of the chart (padding 8 + 14 px bold title), left 250 px
    const band = [0, 0, 250 * scale, 24 * scale] as const;
    const inked = darkPixels(withFont, ...band);
    expect(inked).toBeGreaterThan(400);
    expect(darkPixels(noFont, ...band)).toBe(0);
  });

  it('text accounts for many pixels: with text vs the same SVG with text removed', () => {
    const full = decodePng(svgToPng(svg));
    const bare = decodePng(svgToPng(withoutText(svg)));
    const noFont = decodePng(svgToPng(svg, { fontFiles: [] }));
    expect(differingPixels(full, bare)).toBeGreaterThan(5000);
    // without a font the text draws nothing: identical to the text-free image
    expect(differingPixels(noFont, bare)).toBe(0);
  });

  it('draws the column sketch labels', () => {
    const s = columnSketchSvg(input.column, input.check.demand, input.check.modeShapes[0], 'si');
    const full = decodePng(svgToPng(s));
    const bare = decodePng(svgToPng(withoutText(s)));
    expect(differingPixels(full, bare)).toBeGreaterThan(3000);
  });
});

describe('font metrics for layout', () => {
  const [regularFile] = chartFontFiles();
  const metrics = readFontMetrics(readFileSync(regularFile));

  it('reads DejaVu Sans', () => {
    // from memory: DejaVu Sans has 2048 units per em and tabular (equal-width) digits
    expect(metrics.unitsPerEm).toBe(2048);
    const digits = [...'0123456789'].map((d) => metrics.advance(d.codePointAt(0) as number));
    expect(new Set(digits).size).toBe(1);
    expect(metrics.advance('M'.codePointAt(0) as number)).toBeGreaterThan(metrics.advance('i'.codePointAt(0) as number));
  });

  it('agrees with the width resvg draws', () => {
    // common practice: an independent renderer's bounding box of the same string
    const text = 'Tornado: conditional reliability index β 1234';
    const size = 20;
    const doc = `<svg xmlns="http://www.w3.org/2000/svg" width="800" height="60"><text x="10" y="40" font-family="${CHART_FONT}" font-size="${size}">${text}</text></svg>`;
    const r = new Resvg(doc, { font: { fontFiles: chartFontFiles(), loadSystemFonts: false, defaultFontFamily: CHART_FONT } });
    const box = r.getBBox();
    expect(box).toBeDefined();
    const ours = textWidth(metrics, text, size);
    // the ink box omits the side bearings of the first and last glyph: allow 3 %
    expect(Math.abs(ours - (box?.width ?? 0)) / ours).toBeLessThan(0.03);
  });
});
