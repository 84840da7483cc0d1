/**
 * vega-lite spec → vega View (no DOM, renderer 'none') → SVG string → PNG via resvg.
 */
import { compile, type TopLevelSpec } from 'vega-lite';
import { parse, View } from 'vega';
import { Resvg } from '@resvg/resvg-js';
import { CHART_FONT } from './chartStyle.js';
import { chartFontFiles } from './chartFonts.js';
import { installChartTextMetrics } from './chartTextMetrics.js';
import type { VegaLiteSpec } from './charts/chartSpec.js';

/** The vega specification a vega-lite spec compiles to (throws on an invalid spec). */
export function compileChart(spec: VegaLiteSpec): ReturnType<typeof compile>['spec'] {
  return compile(spec as unknown as TopLevelSpec).spec;
}

/** Render a vega-lite spec to a standalone SVG document. */
export async function chartToSvg(spec: VegaLiteSpec): Promise<string> {
  installChartTextMetrics();
  const view = new View(parse(compileChart(spec)), { renderer: 'none' });
  try {
    return await view.toSVG();
  } finally {
    view.finalize();
  }
}

export interface PngOptions {
  scale?: number; // pixel density, default 2 (sharp when printed)
  fontFiles?: string[]; // default: DejaVu Sans; [] renders without any font (tests only)
}

/** Rasterise an SVG with the shipped font only, so text looks the same on every machine. */
export function svgToPng(svg: string, options: PngOptions = {}): Buffer {
  const resvg = new Resvg(svg, {
    fitTo: { mode: 'zoom', value: options.scale ?? 2 },
    background: 'white',
    font: {
      fontFiles: options.fontFiles ?? chartFontFiles(),
      loadSystemFonts: false,
      defaultFontFamily: CHART_FONT,
      sansSerifFamily: CHART_FONT,
    },
  });
  return resvg.render().asPng();
}
