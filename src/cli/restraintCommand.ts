import { loadScenario } from '../scenario/loadScenario.js';
import { columnRestraint, restraintJson, type ColumnRestraintResult, type EndChoice, type RestraintMethod } from '../studies/columnRestraint.js';
import type { DesignAlphaChoice } from '../studies/restraintRequirement.js';
import { formatBeta, formatQuantity, type UnitSystem } from '../report/displayUnits.js';
import { readScenarioText } from './readScenarioText.js';
import { assessColumn, DEFAULT_SEED, governingAssessor } from '../studies/columnAssessment.js';
import { updateScenarioWithEvidence } from '../studies/measurementUpdate.js';
import { assessmentJson } from '../studies/assessmentJson.js';
import { assessmentReportInput } from '../studies/assessmentReport.js';
import { checkOutFolder } from '../report/outputFolder.js';
import { toolVersion } from './version.js';
import { shownPath } from './shownPath.js';
import { join } from 'node:path';
import { CAUTION, textTable } from './textTable.js';

export interface RestraintOptions {
  json?: boolean;
  out?: string;
  force?: boolean;
  end?: EndChoice;
  axis?: 'y' | 'z';
  units?: UnitSystem;
  method?: RestraintMethod;
  designAlpha?: DesignAlphaChoice;
}

export async function runRestraint(file: string, opts: RestraintOptions): Promise<void> {
  const { text, fileName } = readScenarioText(file);
  const loaded = loadScenario(text, fileName);
  if (opts.out) checkOutFolder(opts.out, { force: opts.force ?? false, inputFiles: [file] }); // before the study; checked again when written
  const seed = loaded.analysis.seed ?? DEFAULT_SEED;
  // measurements on the structure update the variables before the study (docs/evidence.md §7)
  const scenario = updateScenarioWithEvidence(loaded, seed).scenario;
  if (loaded.measurements?.length) process.stderr.write(`stanchion: the scenario's ${loaded.measurements.length} measurement(s) updated its variables before the study (assess shows the update)\n`);
  const system = opts.units ?? scenario.displayUnits;
  const r = await columnRestraint(scenario, { end: opts.end, axis: opts.axis, units: system, method: opts.method, designAlpha: opts.designAlpha, governing: governingAssessor(seed) });
  const writeReport = async (): Promise<void> => {
    if (!opts.out) return;
    process.stderr.write('stanchion: writing the report …\n');
    // the report around the study: the column, FORM/SORM at the assessed stiffness, sensitivity, the curve
    const a = await assessColumn(scenario, { methods: ['form', 'sorm'], end: opts.end, axis: r.axis?.axis, restraint: r });
    const meta = { version: toolVersion(), date: new Date().toISOString(), command: ['stanchion', ...process.argv.slice(2)].join(' ') };
    const json = assessmentJson(a, meta);
    const input = { ...assessmentReportInput(a, meta), subject: 'restraint' as const };
    const { writeOutputs } = await import('../report/writeOutputs.js'); // the report stack, only when a report is written
    const written = await writeOutputs(opts.out, input, json, { force: opts.force, inputFiles: [file], units: system });
    process.stderr.write(`stanchion: report written to ${shownPath(join(written.dir, 'report.html'))} (${written.files.length} files)\n`);
  };
  if (opts.json) {
    process.stdout.write(JSON.stringify({ restraint: restraintJson(r) }, null, 2) + '\n');
    await writeReport();
    return;
  }
  const ends = r.study.ends;
  const betaLabel = r.verification.method === 'form' ? 'FORM β' : 'β (IS check)';
  // survived loads: every β shown is the one given them (docs/evidence.md §8)
  const given = r.survival ? ' given the survived loads' : '';
  const rows: string[][] = [[...ends.map((e) => `${e} mean k`), betaLabel, 'pf', '']];
  // the root solve adds its iterates to the curve: show the grid once, plus the point nearest the root
  const required = r.study.requiredFactor;
  const hasRoot = required !== null && Number.isFinite(required) && required > 0;
  const nearest = hasRoot
    ? r.study.curve.reduce((best, p) => (Math.abs(Math.log(p.factor / (required as number))) < Math.abs(Math.log(best.factor / (required as number))) ? p : best))
    : null;
  const seen = new Set<string>();
  for (const p of r.study.curve) {
    const key = p.ideal ?? p.factor.toPrecision(4);
    if (seen.has(key)) continue;
    const isRequired = p === nearest;
    if (!p.ideal && !isRequired && hasRoot && Math.abs(Math.log(p.factor / (required as number))) < 0.05) continue;
    seen.add(key);
    rows.push([
      ...ends.map((e) => (p.ideal === 'pinned' ? 'pinned' : p.ideal === 'fixed' ? 'fixed' : formatQuantity(p.stiffness[e], 'rotationalStiffness', system))),
      Number.isFinite(p.beta) ? p.beta.toFixed(2) : String(p.beta),
      p.pf.toExponential(2),
      isRequired ? '← least stiffness for the target' : p.beta >= r.study.target ? '≥ target' : '',
    ]);
  }
  const out = [
    `stanchion restraint: ${scenario.title}`,
    `  ${betaLabel}${given} as the mean stiffness of the ${ends.join(' and ')} connection${ends.length > 1 ? 's' : ''}${r.axis ? ` about ${r.axis.axis}` : ''} is scaled (coefficient of variation kept); target β = ${r.study.target}`,
    ...(r.axis ? [`  axis ${r.axis.axis} ${r.axis.basis === 'asked' ? 'as asked (--axis)' : 'governs'}; β is the whole column's (min over both axes); axis ${r.axis.other.axis} alone: β = ${formatBeta(r.axis.other.beta)}, the same at every stiffness studied`] : []),
    '',
    textTable(rows),
    '',
    `  ${r.sentence}`,
    ...r.notes.map((n) => `  note: ${n}`),
    '',
    CAUTION,
    '',
    restraintResultLine(r, system),
  ];
  process.stdout.write(out.join('\n') + '\n');
  await writeReport();
}

/** The last line: the stiffness each studied end needs for the target, or why none will do. */
function restraintResultLine(r: ColumnRestraintResult, system: UnitSystem): string {
  const parts = r.study.ends.map((e) => {
    const k = r.study.required[e];
    return k === null || k === undefined || !Number.isFinite(k) ? `${e}: not reachable, even with a rigid ${e} connection` : `${e} at least ${formatQuantity(k, 'rotationalStiffness', system)}`;
  });
  // with two axes the study varies the ends about one of them (docs/sections.md)
  const about = r.axis ? ` about ${r.axis.axis}` : '';
  const given = r.survival ? ' given the survived loads' : '';
  if (r.axis?.other.capsTarget) {
    return `result: no mean rotational stiffness${about} reaches the target β = ${formatBeta(r.study.target)}${given}: axis ${r.axis.other.axis} alone has β = ${formatBeta(r.axis.other.beta)}`;
  }
  if (r.study.outcome === 'pinned-suffices') {
    return `result: no rotational restraint${about} needs to be relied on: the target β = ${formatBeta(r.study.target)}${given} is met with pinned ${r.study.ends.join(' and ')} connections`;
  }
  return `result: for the target β = ${formatBeta(r.study.target)}${given} the mean rotational stiffness${about} must be ${parts.join('; ')}`;
}
