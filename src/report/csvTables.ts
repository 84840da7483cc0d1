/** The CSV files of the report: SI base units, one header row, cells by csvCell (RFC 4180, formula-safe). */
import type { ReportInput } from './reportInput.js';
import { csvCell, type CsvValue } from './csvCell.js';
import { sampleQuantile } from './charts/histogramBins.js';

type Cell = CsvValue;

export function toCsv(head: string[], rows: Cell[][]): string {
  return [head, ...rows].map((r) => r.map(csvCell).join(',')).join('\n') + '\n';
}

function stats(values: number[]) {
  const n = values.length;
  const mean = values.reduce((a, b) => a + b, 0) / n;
  const sd = Math.sqrt(values.reduce((a, b) => a + (b - mean) * (b - mean), 0) / Math.max(1, n - 1));
  let min = Infinity;
  let max = -Infinity;
  for (const v of values) {
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return { n, mean, sd, p05: sampleQuantile(values, 0.05), p50: sampleQuantile(values, 0.5), p95: sampleQuantile(values, 0.95), min, max };
}

/** File name → CSV text, for every table this input has data for. */
export function csvTables(input: ReportInput): Record<string, string> {
  const out: Record<string, string> = {};
  const s = input.samples;
  if (s && s.resistance.length > 0 && s.demand.length > 0) {
    const n = Math.max(s.resistance.length, s.demand.length);
    out['samples.csv'] = toCsv(
      ['index', 'resistance_N', 'demand_N'],
      Array.from({ length: n }, (_, i) => [i, s.resistance[i], s.demand[i]]),
    );
    const head = ['quantity', 'unit', 'count', 'mean', 'sd', 'p05', 'p50', 'p95', 'min', 'max', 'design_point', 'drawn_from_samples'];
    const row = (name: string, v: number[], dp: number): Cell[] => {
      const t = stats(v);
      return [name, 'N', t.n, t.mean, t.sd, t.p05, t.p50, t.p95, t.min, t.max, dp, s.totalSamples];
    };
    out['samples-summary.csv'] = toCsv(head, [row('resistance', s.resistance, s.designPoint.resistance), row('demand', s.demand, s.designPoint.demand)]);
  }
  const t = input.sensitivity;
  const tornadoRows: Cell[][] = [
    ...t.utilization.rows.map((r) => ['utilization', '1', r.variable, t.utilization.baseline, r.low, r.high, Math.abs(r.high - r.low)]),
    ...t.capacity.rows.map((r) => ['capacity', 'N', r.variable, t.capacity.baseline, r.low, r.high, Math.abs(r.high - r.low)]),
    ...t.conditionalBeta.rows.map((r) => ['conditional_beta', '1', r.variable, t.conditionalBeta.baseline, r.low, r.high, Math.abs(r.high - r.low)]),
  ];
  out['tornado.csv'] = toCsv(['quantity', 'unit', 'variable', 'baseline', 'low_at_q05', 'high_at_q95', 'swing'], tornadoRows);
  if (input.partialFactors.length > 0) {
    const rows: Cell[][] = input.partialFactors.map((p) => [
      p.variable, p.side ?? p.role, p.basis, p.note, p.referenceValue, p.designValue, p.factor, p.code?.symbol, p.code?.value, p.designToMean,
    ]);
    const rf = input.resistanceFactor;
    if (rf) rows.push(['resistance', 'resistance', 'characteristic', 'theta x capacity, resistance-side variables at characteristic values', rf.characteristic, rf.design, rf.factor, rf.code?.symbol, rf.code?.value, '']);
    out['partial-factors.csv'] = toCsv(
      ['variable', 'side', 'basis', 'characteristic_value_is', 'characteristic_SI', 'design_SI', 'implied_partial_factor', 'code_factor', 'code_value', 'design_to_mean_ratio'],
      rows,
    );
  }
  if (input.strengthModels && input.strengthModels.length > 0) {
    out['strength-models.csv'] = toCsv(
      ['strength', 'beta_form', 'model_factor_mean', 'model_factor_cov', 'model_factor_from', 'chosen', 'note'],
      input.strengthModels.map((m) => [m.strength, m.beta, m.modelFactorMean, m.modelFactorCov, m.modelFactorSource, m.chosen ? 'yes' : 'no', m.note]),
    );
  }
  if (input.restraint) {
    const st = input.restraint;
    out['restraint-curve.csv'] = toCsv(
      ['factor', 'bottom_stiffness_N_m_per_rad', 'top_stiffness_N_m_per_rad', 'beta_form', 'pf', 'ideal'],
      st.curve.map((p) => [p.factor, p.stiffness.bottom, p.stiffness.top, p.beta, p.pf, p.ideal ?? '']),
    );
  }
  if (input.sweep) {
    const sw = input.sweep;
    out['sweep.csv'] = toCsv(
      [...sw.varied.map((v) => `${v.path}_SI`), `beta_${sw.method}`, 'pf', 'utilization'],
      sw.rows.map((r) => [...sw.varied.map((v) => r.values[v.path]), r.beta, r.pf, r.utilization]),
    );
  }
  return out;
}
