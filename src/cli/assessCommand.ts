import { loadScenario } from '../scenario/loadScenario.js';
import { assessColumn } from '../studies/columnAssessment.js';
import { assessmentJson } from '../studies/assessmentJson.js';
import { assessmentReportInput } from '../studies/assessmentReport.js';
import { checkOutFolder } from '../report/outputFolder.js';
import type { UnitSystem } from '../report/displayUnits.js';
import type { Method } from '../scenario/types.js';
import type { StudyName } from '../studies/studyNames.js';
import type { EndChoice } from '../studies/columnRestraint.js';
import { defaultStudies, skippedStudiesLine } from '../studies/defaultStudies.js';
import { readScenarioText } from './readScenarioText.js';
import { formatAssessment } from './assessSummary.js';
import { toolVersion } from './version.js';
import { shownPath } from './shownPath.js';
import { join } from 'node:path';
import { progressPrinter } from './progressPrinter.js';
import { InterruptedError, withInterrupt } from './interrupt.js';

export interface AssessCliOptions {
  json?: boolean;
  out?: string;
  force?: boolean;
  seed?: number;
  methods?: Method[];
  samples?: number;
  targetCov?: number;
  thorough?: boolean;
  /** the studies to run; commander sets `false` for --no-studies */
  studies?: StudyName[] | false;
  workers?: number;
  units?: UnitSystem;
  end?: EndChoice;
  axis?: 'y' | 'z';
}

export async function runAssess(file: string, opts: AssessCliOptions, argv: string[]): Promise<void> {
  const { text, fileName } = readScenarioText(file);
  const scenario = loadScenario(text, fileName);
  // refuse a bad --out before the long run; writeOutputs checks again when it writes
  if (opts.out) checkOutFolder(opts.out, { force: opts.force ?? false, inputFiles: [file] });
  const system = opts.units ?? scenario.displayUnits;
  // an explicit --studies always wins; otherwise the explicitly chosen methods decide (defaultStudies.ts)
  const chosen = opts.studies === undefined ? defaultStudies(opts.methods) : undefined;
  if (chosen && chosen.skipped.length > 0) process.stderr.write(skippedStudiesLine(chosen.skipped) + '\n');
  const studies = opts.studies === false ? [] : (opts.studies ?? chosen?.studies);
  const progress = progressPrinter();
  const a = await withInterrupt((signal) =>
    assessColumn(scenario, {
      methods: opts.methods,
      samples: opts.samples,
      targetCov: opts.targetCov,
      thorough: opts.thorough,
      studies,
      seed: opts.seed,
      workers: opts.workers,
      end: opts.end,
      axis: opts.axis,
      units: system,
      signal,
      onProgress: progress.update,
    }),
  );
  progress.done();
  if (a.interrupted) {
    const done = a.mc ? `${a.mc.samples} Monte Carlo samples` : a.is ? `${a.is.samples} importance samples` : 'part of the run';
    throw new InterruptedError(`interrupted after ${done}; nothing was written`);
  }
  const meta = { version: toolVersion(), date: new Date().toISOString(), command: ['stanchion', ...argv].join(' ') };
  const json = assessmentJson(a, meta);
  // the answer first; the report is written last, so its path is the last line on the screen
  process.stdout.write(opts.json ? JSON.stringify(json, null, 2) + '\n' : formatAssessment(a, system));
  if (opts.out) {
    process.stderr.write('stanchion: writing the report …\n');
    const input = assessmentReportInput(a, meta);
    // the report stack (vega, vega-lite, resvg) loads only when a report is written
    const { writeOutputs } = await import('../report/writeOutputs.js');
    const written = await writeOutputs(opts.out, input, json, { force: opts.force, inputFiles: [file], units: system });
    process.stderr.write(`stanchion: report written to ${shownPath(join(written.dir, 'report.html'))} (${written.files.length} files)\n`);
  }
}
