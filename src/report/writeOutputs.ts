/**
 * `--out DIR`: render every report file in memory, write them into a hidden sibling
 * folder, then rename it into place. DIR is either complete or untouched: never half.
 * DIR gets the marker OUTPUT_MARKER, so that a later `--force` knows stanchion wrote it.
 */
import { promises as fsp } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { InputError } from '../scenario/inputError.js';
import { checkFolderTarget } from './folderTarget.js';
import { throwIfInterrupted } from '../runtime/interruptFlag.js';
import { holdTemporary } from '../runtime/temporaryPaths.js';
import type { ReportInput } from './reportInput.js';
import type { UnitSystem } from './displayUnits.js';
import { buildCharts } from './charts/allCharts.js';
import { chartToSvg, svgToPng } from './renderChart.js';
import { columnSketchSvg } from './columnSketch.js';
import { buildReportDocument } from './reportSections.js';
import { renderHtml } from './htmlReport.js';
import { renderMarkdown } from './markdownReport.js';
import { csvTables } from './csvTables.js';
import { OUTPUT_MARKER, checkOutFolder, outputMarkerText, type OutFolderRules } from './outputFolder.js';
import { removeStaleSiblings, siblingFolderName, type Notify } from './staleSiblings.js';

export interface WriteOutputsOptions {
  force?: boolean; // replace an existing DIR whole, only when it is a stanchion output folder (outputFolder.ts)
  /** The files the run read (scenario, sweep file; '-' is stdin): never replaced, nor any folder holding them. */
  inputFiles?: readonly string[];
  /** Where the line about removed leftovers goes (default stderr). */
  notify?: Notify;
  units?: UnitSystem; // display units of HTML, Markdown and charts (default 'si'); JSON and CSV stay SI
  png?: boolean; // also write charts/*.png (default true)
  pngScale?: number; // PNG pixel density (default 2)
  /** How one file is written; default fs.promises.writeFile. A seam for tests to inject failures. */
  writeFile?: (path: string, data: string | Uint8Array) => Promise<void>;
}

export interface WrittenOutputs {
  dir: string; // absolute path of DIR
  files: string[]; // paths relative to DIR, sorted (the marker OUTPUT_MARKER included)
}

/** Every output file as relative path → content, rendered in memory (nothing touches disk). */
export async function renderReportFiles(
  input: ReportInput,
  resultJson: unknown,
  options: Pick<WriteOutputsOptions, 'units' | 'png' | 'pngScale'> = {},
): Promise<Map<string, string | Uint8Array>> {
  if (resultJson === null || typeof resultJson !== 'object') throw new Error('writeOutputs: resultJson must be the contract JSON object');
  const system = options.units ?? 'si';
  const files = new Map<string, string | Uint8Array>();
  const charts = buildCharts(input, system);
  const svgs: Record<string, string> = {};
  const stopOnCtrlC = (): void => throwIfInterrupted('the report rendering');
  for (const c of charts) {
    stopOnCtrlC();
    svgs[c.name] = await chartToSvg(c.spec);
  }
  const sketchSvg = columnSketchSvg(input.column, input.check.demand, input.check.modeShapes[0], system);
  const doc = buildReportDocument(input, system, charts);

  files.set('report.html', renderHtml(doc, { charts: svgs, sketchSvg }));
  files.set('result.json', JSON.stringify(resultJson, null, 2) + '\n');
  files.set('summary.md', renderMarkdown(doc));
  for (const [name, text] of Object.entries(csvTables(input))) files.set(name, text);
  const allSvgs: Record<string, string> = { ...svgs, 'column-sketch': sketchSvg };
  for (const [name, svg] of Object.entries(allSvgs)) {
    stopOnCtrlC();
    files.set(`charts/${name}.svg`, svg);
    if (options.png ?? true) files.set(`charts/${name}.png`, svgToPng(svg, { scale: options.pngScale ?? 2 }));
  }
  return files;
}

function isErrno(e: unknown, ...codes: string[]): boolean {
  return e instanceof Error && codes.includes((e as NodeJS.ErrnoException).code ?? '');
}

/**
 * Write the report into `outDir`. Throws InputError (field '--out') when checkOutFolder refuses
 * outDir (outputFolder.ts: only a stanchion output folder is ever replaced, and only with
 * `force`), or when its path runs through a file or cannot be written (missing parent folders
 * are created); on any failure nothing is
 * left behind and an existing outDir is untouched. Hidden leftovers of writers that died are
 * removed first (staleSiblings.ts).
 */
export async function writeOutputs(
  outDir: string,
  input: ReportInput,
  resultJson: unknown,
  options: WriteOutputsOptions = {},
): Promise<WrittenOutputs> {
  const dir = resolve(outDir);
  const rules = { force: options.force ?? false, inputFiles: options.inputFiles };
  checkOutFolder(outDir, rules);
  // before the slow rendering: the parent exists, or the nearest existing folder above it can hold it
  checkFolderTarget(dirname(dir), '--out');
  const files = await renderReportFiles(input, resultJson, options);
  files.set(OUTPUT_MARKER, outputMarkerText({ command: input.meta.commandLine, version: input.meta.toolVersion, created: new Date().toISOString() }));
  const write = options.writeFile ?? ((p: string, d: string | Uint8Array) => fsp.writeFile(p, d));

  removeStaleSiblings(dir, options.notify);
  const temp = siblingFolderName(dir, 'partial');
  const release = holdTemporary(temp); // removed by the main thread if this thread is stopped hard
  try {
    await fsp.mkdir(dirname(dir), { recursive: true });
    await fsp.mkdir(temp);
  } catch (e) {
    release();
    if (isErrno(e, 'ENOENT', 'ENOTDIR')) throw new InputError('--out', `the parent folder of ${dir} does not exist`);
    if (isErrno(e, 'EACCES', 'EPERM', 'EROFS')) throw new InputError('--out', `cannot write next to ${dir}: ${(e as Error).message}`);
    throw e;
  }
  try {
    await fsp.mkdir(join(temp, 'charts'));
    for (const [rel, data] of files) {
      throwIfInterrupted('the report rendering');
      await write(join(temp, rel), data);
    }
    await moveIntoPlace(temp, outDir, rules);
  } catch (e) {
    await fsp.rm(temp, { recursive: true, force: true });
    release();
    throw e;
  }
  release();
  return { dir, files: [...files.keys()].sort() };
}

/**
 * Rename the finished folder to `dir`. The rules are checked again at this moment (the folder
 * may have changed while we rendered); a replaced stanchion folder is swapped out, restored if
 * the rename fails, and removed only once the new one is in place.
 */
async function moveIntoPlace(temp: string, outDir: string, rules: OutFolderRules): Promise<void> {
  const dir = resolve(outDir);
  if (checkOutFolder(outDir, rules) === 'absent') {
    await fsp.rename(temp, dir);
    return;
  }
  const old = siblingFolderName(dir, 'replaced');
  await fsp.rename(dir, old);
  try {
    await fsp.rename(temp, dir);
  } catch (e) {
    await fsp.rename(old, dir);
    throw e;
  }
  await fsp.rm(old, { recursive: true, force: true });
}
