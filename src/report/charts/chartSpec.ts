/**
 * What every chart builder returns: a file name stem, the title people see, and the
 * vega-lite specification (a plain object, JSON-serialisable).
 */
export type VegaLiteSpec = Record<string, unknown>;

export interface ChartSpec {
  name: string; // file stem: charts/<name>.svg
  title: string;
  spec: VegaLiteSpec;
}
