/**
 * The report of a sweep: the base scenario assessed with FORM (inputs, column, sensitivity,
 * restraint) plus the swept results as a table and a chart. The sweep's own CSV and JSON stay
 * beside it; this only reads them.
 */
import { loadScenario } from '../scenario/loadScenario.js';
import { readQuantity } from '../scenario/quantity.js';
import type { Method } from '../scenario/types.js';
import { quantityKindOf } from '../limitState/quantityKind.js';
import type { QuantityKind, ReportInput, SweepResults } from '../report/reportInput.js';
import { writeOutputs, type WrittenOutputs } from '../report/writeOutputs.js';
import type { UnitSystem } from '../report/displayUnits.js';
import { assessColumn } from './columnAssessment.js';
import { assessmentJson, jsonSafe, type RunMeta } from './assessmentJson.js';
import { assessmentReportInput } from './assessmentReport.js';
import type { SweepTable } from './sweepTable.js';
import type { SweepValue } from './sweepTypes.js';
import { targetCrossings } from './targetCrossing.js';

const DISTRIBUTION_LEAF = /\.(mean|sd|cov|min|max)$/;

/** What a swept path measures: a distribution parameter measures what its variable does (cov: nothing). */
function kindOfSweptPath(path: string): QuantityKind {
  if (path.endsWith('.cov')) return 'dimensionless';
  return quantityKindOf(path.replace(DISTRIBUTION_LEAF, ''));
}

/** A swept value in SI: numbers stay, quantities are converted; NaN when it cannot be read. */
function siValue(v: SweepValue, kind: QuantityKind, columnLength: number): number {
  if (typeof v === 'number') return v;
  if (kind === 'dimensionless') return Number(v);
  if (kind === 'moment') return NaN; // a report-only kind: no scenario value is a moment
  try {
    return readQuantity(v, kind, columnLength).value;
  } catch {
    return NaN;
  }
}

function numberOr(v: unknown, fallback: number): number {
  return typeof v === 'number' ? v : fallback;
}

export function sweepResults(table: SweepTable, methods: readonly Method[], columnLength: number, targetBeta: number): SweepResults | undefined {
  if (table.varied.length < 1 || table.varied.length > 2) return undefined;
  const method = (['form', 'sorm', 'is', 'subset', 'mc'] as const).find((m) => methods.includes(m)) ?? 'form';
  const varied = table.varied.map((path) => ({ path, kind: kindOfSweptPath(path) }));
  const rows = [...table.rows()]
    .filter((r) => !r.error && typeof r.result[`beta_${method}`] === 'number')
    .map((r) => {
      const values: Record<string, number> = {};
      for (const v of varied) values[v.path] = siValue(r.values[v.path], v.kind, columnLength);
      return {
        values,
        beta: numberOr(r.result[`beta_${method}`], NaN),
        pf: numberOr(r.result[`pf_${method}`], NaN),
        utilization: numberOr(r.result.utilization, NaN),
      };
    })
    .filter((r) => Object.values(r.values).every(Number.isFinite) && Number.isFinite(r.beta));
  const meeting = { count: rows.filter((r) => r.beta >= targetBeta).length, total: rows.length };
  const crossings = varied.length === 1 ? targetCrossings(rows.map((r) => r.values[varied[0].path]), rows.map((r) => r.beta), targetBeta) : [];
  return { varied, rows, method, meeting, crossings };
}

export async function writeSweepReport(opts: {
  scenarioText: string;
  scenarioFile: string;
  table: SweepTable;
  methods: readonly Method[];
  dir: string;
  units?: UnitSystem;
  meta: RunMeta;
  /** The files the sweep read: never replaced, nor any folder holding them ('-' is stdin). */
  inputFiles?: readonly string[];
}): Promise<WrittenOutputs> {
  const s = loadScenario(opts.scenarioText, opts.scenarioFile);
  const a = await assessColumn(s, { methods: ['form', 'sorm'], units: opts.units ?? s.displayUnits });
  const json = assessmentJson(a, opts.meta) as Record<string, unknown>;
  const input: ReportInput = assessmentReportInput(a, opts.meta);
  input.subject = 'sweep';
  const sweep = sweepResults(opts.table, opts.methods, s.column.length, s.targetBeta);
  if (sweep) input.sweep = sweep;
  else input.cautions.push('The sweep varied more than two quantities: its results are in sweep.csv, not charted.');
  input.cautions.unshift('The sections after the sweep describe the base scenario (FORM and SORM); every case is in sweep.csv.');
  json.sweep = jsonSafe({ varied: opts.table.varied, rows: opts.table.finished, method: sweep?.method ?? null });
  // force: the sweep regenerates its own report at every complete run, and writeOutputs replaces only a marked folder
  return writeOutputs(opts.dir, input, json, { force: true, inputFiles: opts.inputFiles, units: opts.units ?? s.displayUnits });
}
