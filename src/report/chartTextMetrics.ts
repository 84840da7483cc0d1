/**
 * Make vega lay out text with the real DejaVu Sans widths. Without a canvas vega guesses
 * 0.8 em per character, which makes titles and legends far wider than drawn. vega allows
 * replacing `textMetrics.width` (a documented hook, used by other headless renderers).
 */
import { readFileSync } from 'node:fs';
import * as vega from 'vega';
import { chartFontFiles } from './chartFonts.js';
import { readFontMetrics, textWidth, type FontMetrics } from './fontMetrics.js';

interface TextItem {
  text?: unknown;
  fontSize?: number;
  fontWeight?: string | number;
}
interface VegaTextMetrics {
  width: (item: TextItem, text?: unknown) => number;
}

let installed = false;

function isBold(w: TextItem['fontWeight']): boolean {
  return w === 'bold' || w === 'bolder' || (typeof w === 'number' && w >= 600) || (typeof w === 'string' && Number(w) >= 600);
}

function asString(t: unknown): string {
  if (Array.isArray(t)) return t.map(String).join(' ');
  return t === undefined || t === null ? '' : String(t);
}

/** Install once per process; later calls do nothing. */
export function installChartTextMetrics(): void {
  if (installed) return;
  const [regularFile, boldFile] = chartFontFiles();
  const regular: FontMetrics = readFontMetrics(readFileSync(regularFile));
  const bold: FontMetrics = readFontMetrics(readFileSync(boldFile));
  const metrics = (vega as unknown as { textMetrics: VegaTextMetrics }).textMetrics;
  metrics.width = (item: TextItem, text?: unknown) => {
    const s = asString(text === undefined ? item.text : text);
    return textWidth(isBold(item.fontWeight) ? bold : regular, s, item.fontSize ?? 11);
  };
  installed = true;
}
