/** The part every chart spec shares: schema, title block, style. */
import { CHART_CONFIG, VEGA_LITE_SCHEMA } from '../chartStyle.js';
import type { VegaLiteSpec } from './chartSpec.js';

/** `subtitle` may be several lines (vega does not wrap titles). */
export function chartBase(title: string, subtitle?: string | string[]): VegaLiteSpec {
  return {
    $schema: VEGA_LITE_SCHEMA,
    title: subtitle ? { text: title, subtitle } : { text: title },
    config: CHART_CONFIG,
  };
}

/** An axis title with its unit in brackets, or bare when dimensionless. */
export function axisTitle(name: string, unitLabel: string): string {
  return unitLabel === '' ? name : `${name} [${unitLabel}]`;
}
