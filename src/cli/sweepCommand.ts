/**
 * `stanchion sweep FILE` runs one scenario over a table of cases (a grid or a Latin hypercube
 * of varied inputs) and writes sweep.csv and sweep.json; `stanchion merge STATE_DIR...` joins
 * the journals of shards run apart into the same two files a single run writes.
 *
 * FILE is a scenario (then --vary says what to vary) or a sweep file (src/studies/sweepFile.ts:
 * a top-level `scenario:` key plus `vary:` or `list:`). Each finished case goes to a journal in
 * the state folder at once, so a run that is stopped, killed or crashes resumes where it was
 * when the same command is run again. Everything the user gave is checked before anything is
 * written.
 */
import { createHash } from 'node:crypto';
import { closeSync, existsSync, openSync, readdirSync, readFileSync, readSync, rmSync, statSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { basename, join, relative, resolve } from 'node:path';
import YAML from 'yaml';
import { InputError } from '../scenario/inputError.js';
import type { Method } from '../scenario/types.js';
import { buildColumnModel } from '../limitState/columnModel.js';
import { checkSweepPaths, parseSweepBase, scenarioWithValues, type SweepBase } from '../studies/applySweepValues.js';
import { columnCaseRecipe, columnCaseRunner, SWEEP_DEFAULT_METHODS, type ColumnCaseArgs } from '../studies/columnCaseRunner.js';
import { checkSweepCases } from '../studies/checkSweepCases.js';
import { mergeSweep, mergeSweepOf } from '../studies/mergeSweep.js';
import { pathInputError } from '../studies/pathErrors.js';
import { runSweep, type RunSweepResult } from '../studies/runSweep.js';
import { axisLength, axisValue, buildCaseTable } from '../studies/sweepDesign.js';
import { parseSweepFile } from '../studies/sweepFile.js';
import { sweepFingerprint } from '../studies/sweepFingerprint.js';
import { journalPath, readJournalHeader, type JournalHeader, type StoredDefinition } from '../studies/sweepJournal.js';
import { sweepJsonEntry, writeSweepOutputs } from '../studies/sweepOutput.js';
import { loadScenario } from '../scenario/loadScenario.js';
import { sweepResults, writeSweepReport } from '../studies/sweepReport.js';
import { shownPath } from './shownPath.js';
import { formatBeta, formatQuantity, type UnitSystem as DisplaySystem } from '../report/displayUnits.js';
import { describePath } from '../limitState/quantityKind.js';
import { checkOutFolder } from '../report/outputFolder.js';
import { toolVersion } from './version.js';
import { InterruptedError, isInterruptedError } from '../runtime/interruptFlag.js';
import type { SweepTable } from '../studies/sweepTable.js';
import type { CaseTable, Shard, SweepDefinition, SweepRecord } from '../studies/sweepTypes.js';
import { parseVaryOption } from '../studies/varyOption.js';
import { slurmArrayScript } from '../studies/arrayScript.js';
import { isAutoShard, shardFromScheduler } from '../studies/schedulerShard.js';
import { readScenarioText, readTextFileBounded } from './readScenarioText.js';
import { checkFolderTarget } from '../report/folderTarget.js';
import { CAUTION } from './textTable.js';
import { INLINE_RESULTS_LIMIT, REPORT_CASES_LIMIT } from './sweepDefinition.js';

export interface SweepOptions {
  vary?: string[];
  design?: 'grid' | 'lhs';
  cases?: number;
  methods?: Method[];
  seed?: number;
  samples?: number;
  workers: number;
  /** I/N, or the scheduler spellings `auto` / `auto/N` (studies/schedulerShard.ts). */
  shard?: Shard | string;
  /** Print a Slurm job-array script of this many shards instead of running. */
  emitArrayScript?: number;
  state?: string;
  out?: string;
  force?: boolean;
  json?: boolean;
  units?: 'si' | 'us';
}

export interface MergeOptions {
  out: string;
  force?: boolean;
  json?: boolean;
}

const CSV_NAME = 'sweep.csv';
const JSON_NAME = 'sweep.json';
const METHOD_NAMES: readonly string[] = ['form', 'sorm', 'is', 'mc', 'subset'];

/** Everything a sweep needs, read and checked. */
interface SweepPlan {
  /** For messages: FILE, and the scenario when FILE is a sweep file. */
  file: string;
  scenarioFile: string;
  /** FILE was a sweep file naming the scenario (not the scenario itself). */
  fromSweepFile: boolean;
  scenarioText: string;
  def: SweepDefinition;
  table: CaseTable;
  methods: readonly Method[];
  samples?: number;
  /** Where each varied path was given, for messages. */
  fieldOf: (path: string) => string;
}

function isPlain(x: unknown): x is Record<string, unknown> {
  return typeof x === 'object' && x !== null && !Array.isArray(x);
}

/** A sweep file has a top-level `scenario:` and `vary:` or `list:`; a scenario has neither. */
function looksLikeSweepFile(text: string, fileName: string): boolean {
  let doc: unknown;
  try {
    doc = fileName.endsWith('.json') ? JSON.parse(text) : YAML.parse(text);
  } catch {
    return false; // let the scenario reader report the syntax error with its line
  }
  return isPlain(doc) && 'scenario' in doc && ('vary' in doc || 'list' in doc);
}

function readScenarioOfSweep(path: string): { text: string; fileName: string } {
  const near = relative(process.cwd(), path);
  const shown = near === '' || near.startsWith('..') ? path : near;
  if (!/\.(ya?ml|json)$/i.test(path)) throw new InputError('scenario', `expected a .yaml, .yml or .json scenario, got ${shown}`);
  return { text: readTextFileBounded(path, 'scenario', shown), fileName: shown };
}

function methodsFromFile(list: string[] | undefined): Method[] | undefined {
  if (list === undefined) return undefined;
  for (const m of list) {
    if (!METHOD_NAMES.includes(m)) throw new InputError('methods', `unknown method '${m}'; expected some of ${METHOD_NAMES.join(', ')}`);
  }
  return [...new Set(list)] as Method[];
}

/** Read FILE (and its scenario), apply the command-line choices, build and check the case table. */
export function planSweep(file: string, opts: SweepOptions): SweepPlan {
  const { text, fileName } = readScenarioText(file);
  const varyTexts = opts.vary ?? [];
  const fields = new Map<string, string>();
  let def: SweepDefinition;
  let scenario: { text: string; fileName: string };
  const fromSweepFile = looksLikeSweepFile(text, fileName);
  if (fromSweepFile) {
    def = parseSweepFile(text, fileName);
    scenario = readScenarioOfSweep(def.scenario as string);
    def.vary.forEach((axis, k) => fields.set(axis.path, `vary[${k}] in ${fileName}`));
    for (const p of Object.keys(def.list?.[0] ?? {})) fields.set(p, `list in ${fileName}`);
  } else {
    if (varyTexts.length === 0) {
      throw new InputError('--vary', 'a scenario FILE needs at least one --vary PATH=FROM:TO:STEPS (or give a sweep file)');
    }
    scenario = { text, fileName };
    def = { design: 'grid', seed: NaN, vary: [] };
  }
  const base = parseSweepBase(scenario.text, scenario.fileName);
  if (Number.isNaN(def.seed)) def.seed = opts.seed ?? base.scenario.analysis.seed ?? 1;
  else if (opts.seed !== undefined) def.seed = opts.seed;
  for (const text of varyTexts) {
    const axis = parseVaryOption(text);
    def.vary.push(axis);
    fields.set(axis.path, '--vary');
  }
  if (opts.design !== undefined) def.design = opts.design;
  if (opts.cases !== undefined) def.cases = opts.cases;
  if (def.design === 'lhs' && def.cases === undefined) throw new InputError('--cases', 'a Latin hypercube (--design lhs) needs --cases N');
  if (def.design === 'list' && varyTexts.length > 0) throw new InputError('--vary', "a sweep file with design 'list' takes no --vary");
  const table = buildCaseTable(def);
  const fieldOf = (path: string): string => fields.get(path) ?? path;
  const plan: SweepPlan = {
    file: fileName === '-' ? 'standard input' : fileName,
    scenarioFile: scenario.fileName,
    fromSweepFile,
    scenarioText: scenario.text,
    def,
    table,
    methods: opts.methods ?? methodsFromFile(def.methods) ?? SWEEP_DEFAULT_METHODS,
    samples: opts.samples,
    fieldOf,
  };
  checkCases(base, plan);
  return plan;
}

/** Paths against the scenario, then the cases (all, or what they are made of: checkSweepCases). */
function checkCases(base: SweepBase, plan: SweepPlan): void {
  checkSweepPaths(base, plan.table.varied, plan.fieldOf);
  checkSweepCases(plan.table, plan.def, (values, index) => {
    const where = `${index === null ? 'sweep values' : `sweep case ${index}`}: ${Object.entries(values).map(([p, v]) => `${p} = ${v}`).join(', ')}`;
    try {
      buildColumnModel(scenarioWithValues(base, values, plan.fieldOf));
    } catch (err) {
      if (err instanceof InputError) {
        // a value the sweep set is the sweep's fault, not the scenario line's: name where it was given
        const varied = plan.table.varied.find((p) => err.field === p || err.field.startsWith(`${p}.`));
        if (varied === undefined) throw new InputError(err.field, `${err.message} (${where})`, err.line);
        const givenIn = plan.fieldOf(varied);
        const field = givenIn === '--vary' ? `--vary ${varied}` : `${givenIn} (${err.field})`;
        throw new InputError(field, `${err.message} (${where})`);
      }
      // a distribution the values make impossible (e.g. a negative cov)
      if (err instanceof Error && err.name === 'DistributionError') throw new InputError(index === null ? 'sweep values' : `sweep case ${index}`, `${err.message} (${where})`);
      throw err;
    }
  });
}

/** What the journal keeps of the definition (no file names: they differ between machines). */
function storedDefinition(def: SweepDefinition): StoredDefinition {
  const stored: StoredDefinition = { design: def.design, seed: def.seed, vary: def.vary };
  if (def.cases !== undefined && def.design === 'lhs') stored.cases = def.cases;
  if (def.list !== undefined) stored.list = def.list;
  return stored;
}

/** The fingerprint's extra identity: whatever changes a case's numbers besides the case table. */
function sweepIdentity(plan: SweepPlan): unknown {
  const scenario = createHash('sha256').update(plan.scenarioText, 'utf8').digest('hex');
  return { runner: 'column/1', methods: plan.methods, samples: plan.samples ?? null, scenario };
}

/** The files a sweep reads, which its report folder must never replace. */
function sweepInputFiles(file: string, plan: SweepPlan): string[] {
  return plan.fromSweepFile ? [file, plan.scenarioFile] : [file];
}

function defaultOut(file: string): string {
  const name = file === '-' ? 'stdin' : basename(file).replace(/\.(ya?ml|json)$/i, '');
  return join('sweep-out', name);
}

/** The fingerprint recorded in an existing sweep.json, if any. */
function fingerprintOfOutputs(outDir: string): string | null {
  const file = join(outDir, JSON_NAME);
  if (!existsSync(file)) return null;
  // the fingerprint is near the top: read 4 kB, not a file that may hold millions of cases
  try {
    const fd = openSync(file, 'r');
    try {
      const head = Buffer.alloc(4096);
      const text = head.toString('utf8', 0, readSync(fd, head, 0, head.length, 0));
      return /^\{\s*"sweep":\s*\{\s*"fingerprint":\s*"([0-9a-f]+)"/.exec(text)?.[1] ?? 'unknown';
    } finally {
      closeSync(fd);
    }
  } catch {
    return 'unknown';
  }
}

/** Refuse to mix or overwrite another sweep's results unless --force. */
function guardOutputs(outDir: string, fingerprint: string, force: boolean | undefined): void {
  const found = fingerprintOfOutputs(outDir);
  if (found !== null && found !== fingerprint && !force) {
    throw new InputError('--out', `${join(outDir, JSON_NAME)} holds the results of a different sweep; choose another --out, or --force to replace them`);
  }
}

/** True when the state folder holds this shard's journal of another sweep (which --force discards). */
function staleJournal(stateDir: string, shard: Shard, fingerprint: string, force: boolean | undefined): boolean {
  const file = journalPath(stateDir, shard);
  if (!existsSync(file)) return false;
  let found: string;
  try {
    found = readJournalHeader(file).fingerprint;
  } catch {
    return false; // damaged or empty: SweepJournal.open says what is wrong
  }
  if (found === fingerprint) return false;
  if (!force) {
    throw new InputError('--state', `${stateDir} holds the journal of a different sweep; choose another --out or --state, or --force to discard it`);
  }
  return true;
}

/** Progress on stderr, for people watching a terminal: every 10 % or every 5 s. */
function progressReporter(total: number, alreadyDone: number): (finished: number) => void {
  if (!process.stderr.isTTY) return () => {};
  const start = Date.now();
  let lastTime = start;
  let lastTenth = Math.floor((10 * alreadyDone) / Math.max(1, total));
  return (finished) => {
    const now = Date.now();
    const tenth = Math.floor((10 * finished) / total);
    if (tenth === lastTenth && now - lastTime < 5000 && finished < total) return;
    lastTenth = tenth;
    lastTime = now;
    const ranNow = finished - alreadyDone;
    const seconds = (now - start) / 1000;
    const left = ranNow > 0 ? ((total - finished) * seconds) / ranNow : NaN;
    const eta = Number.isFinite(left) && finished < total ? `, about ${Math.ceil(left)} s left` : '';
    process.stderr.write(`sweep: ${finished}/${total} cases (${Math.floor((100 * finished) / total)} %), ${seconds.toFixed(0)} s${eta}\n`);
  };
}

/** The results for --json: inline up to INLINE_RESULTS_LIMIT cases, else null (read sweep.json). */
function resultsJson(table: SweepTable): unknown[] | null {
  if (table.finished > INLINE_RESULTS_LIMIT) return null;
  return [...table.rows()].map((row) => sweepJsonEntry(table, row));
}

function describeValues(record: SweepRecord, varied: string[]): string {
  return varied.map((p) => `${p} = ${record.values[p]}`).join(', ');
}

/** A journalled result as a number: non-finite numbers were stored as text. */
function resultNumber(v: unknown): number {
  if (typeof v === 'number') return v;
  return v === 'Infinity' ? Infinity : v === '-Infinity' ? -Infinity : NaN;
}

/** The case with the lowest β of the first method that gives one. */
function weakestCase(table: SweepTable): string | null {
  const key = table.columns.find((c) => c.startsWith('beta_'));
  if (!key) return null;
  let worst: SweepRecord | null = null;
  for (const row of table.rows()) {
    const beta = resultNumber(row.result[key]);
    if (!Number.isNaN(beta) && (worst === null || beta < resultNumber(worst.result[key]))) worst = row;
  }
  if (!worst) return null;
  const beta = resultNumber(worst.result[key]);
  const shown = Number.isFinite(beta) ? beta.toFixed(2) : String(beta);
  return `lowest ${key.slice(5).toUpperCase()} β = ${shown} in case ${worst.case} (${describeValues(worst, table.varied)})`;
}

function distinctValues(plan: SweepPlan, path: string): number {
  const { def, table } = plan;
  if (def.design === 'lhs') return table.count;
  const axis = def.vary.find((a) => a.path === path);
  if (def.design === 'grid' && axis) {
    const n = axisLength(axis);
    return n > 100_000 ? n : new Set(Array.from({ length: n }, (_, k) => String(axisValue(axis, k)))).size;
  }
  const seen = new Set<string>();
  for (let k = 0; k < table.count; k++) seen.add(String(table.valuesAt(k)[path]));
  return seen.size;
}

function axesText(plan: SweepPlan): string {
  const counts = plan.table.varied.map((p) => `${p} (${distinctValues(plan, p)} values)`);
  const kind = plan.def.design === 'grid' ? 'grid over' : plan.def.design === 'lhs' ? 'Latin hypercube over' : 'listed cases of';
  return `${kind} ${counts.join(' × ')}`;
}

function humanSummary(plan: SweepPlan, run: RunSweepResult, table: SweepTable, where: { csv: string | null; json: string | null; stateDir: string; out: string }, shard: Shard, seconds: number, workers: number): string {
  const lines: string[] = [];
  const from = plan.fromSweepFile ? `${plan.file} on ${plan.scenarioFile}` : plan.file;
  lines.push(`stanchion sweep: ${from}`);
  lines.push(`  ${plan.table.count} cases, ${axesText(plan)}; methods ${plan.methods.join(', ')}; seed ${plan.def.seed}`);
  const part = shard.count > 1 ? `shard ${shard.index}/${shard.count} (${run.shardCases} case${run.shardCases === 1 ? '' : 's'}): ` : '';
  lines.push(`  ${part}ran ${run.ran}, already finished ${run.skipped}, failed ${run.errors}; ${seconds.toFixed(1)} s with ${workers} worker${workers > 1 ? 's' : ''}`);
  const weakest = weakestCase(table);
  if (weakest && shard.count === 1) lines.push(`  ${weakest}`);
  if (table.hasErrors) lines.push(`  ${table.failed} case(s) failed: see the error column`);
  if (where.csv && where.json) {
    lines.push(`  results  ${where.csv}`);
    lines.push(`           ${where.json}`);
  }
  lines.push(`  journal  ${run.journal} (run the same command again to resume)`);
  if (shard.count > 1) lines.push(`  when every shard has run: stanchion merge ${where.stateDir} --out ${where.out}`);
  lines.push('');
  lines.push(CAUTION);
  return `${lines.join('\n')}\n`;
}

/** --workers above the cores available only adds contention: cap it, and say so. */
export function cappedWorkers(asked: number, cores: number = availableParallelism()): number {
  if (asked <= cores) return asked;
  process.stderr.write(`stanchion: --workers ${asked} capped at ${cores}, the number of cores available\n`);
  return cores;
}

/** The sweep's own arguments for a shard job: what the user gave, minus where and how it runs. */
function shardArguments(file: string, opts: SweepOptions): string[] {
  const args = [resolve(file)];
  for (const v of opts.vary ?? []) args.push('--vary', v);
  if (opts.design !== undefined) args.push('--design', opts.design);
  if (opts.cases !== undefined) args.push('--cases', String(opts.cases));
  if (opts.methods !== undefined) args.push('--methods', opts.methods.join(','));
  if (opts.seed !== undefined) args.push('--seed', String(opts.seed));
  if (opts.samples !== undefined) args.push('--samples', String(opts.samples));
  if (opts.units !== undefined) args.push('--units', opts.units);
  return args;
}

/** --emit-array-script N: everything is checked as for a run, then only the script is printed. */
function emitArrayScript(file: string, opts: SweepOptions, shards: number): void {
  if (file === '-') throw new InputError('--emit-array-script', 'needs a scenario or sweep FILE that the cluster jobs can read, not stdin');
  if (opts.shard !== undefined) throw new InputError('--emit-array-script', 'writes the shard option of each job itself; leave out --shard');
  const plan = planSweep(file, opts);
  if (shards > plan.table.count) {
    throw new InputError('--emit-array-script', `asks for ${shards} shards but the sweep has ${plan.table.count} case${plan.table.count === 1 ? '' : 's'}; give at most ${plan.table.count}`);
  }
  const out = resolve(opts.out ?? defaultOut(file));
  const state = resolve(opts.state ?? join(out, '.state'));
  process.stdout.write(slurmArrayScript({ shards, sweepArgs: shardArguments(file, opts), state, out, version: toolVersion(), caution: CAUTION }));
}

export async function runSweepCommand(file: string, opts: SweepOptions): Promise<void> {
  if (opts.emitArrayScript !== undefined) return emitArrayScript(file, opts, opts.emitArrayScript);
  const shard = typeof opts.shard === 'string' ? shardFromScheduler(opts.shard) : (opts.shard ?? { index: 0, count: 1 });
  const plan = planSweep(file, opts);
  const out = opts.out ?? defaultOut(file);
  const stateDir = opts.state ?? join(out, '.state');
  const writesOutputs = shard.count === 1;
  if (writesOutputs) checkFolderTarget(out, '--out');
  checkFolderTarget(stateDir, opts.state === undefined ? '--out' : '--state');
  const workers = cappedWorkers(opts.workers);
  const identity = sweepIdentity(plan);
  const fingerprint = sweepFingerprint(plan.table, identity);
  if (writesOutputs) guardOutputs(out, fingerprint, opts.force);
  // OUT/report is replaced only when stanchion wrote it: refuse anything else before a case runs
  if (writesOutputs) checkOutFolder(join(out, 'report'), { force: true, inputFiles: sweepInputFiles(file, plan) });
  const discard = staleJournal(stateDir, shard, fingerprint, opts.force);
  // everything is checked: from here on things are written
  if (discard) rmSync(journalPath(stateDir, shard), { force: true });
  const args: ColumnCaseArgs = { scenarioText: plan.scenarioText, fileName: plan.scenarioFile, methods: plan.methods };
  if (plan.samples !== undefined) args.samples = plan.samples;
  const started = performance.now();
  let progress: ((finished: number) => void) | null = null;
  const run = await runSweep({
    table: plan.table,
    runCase: workers > 1 ? columnCaseRecipe(args) : columnCaseRunner(args),
    workers,
    stateDir,
    shard,
    identity,
    fingerprint,
    definition: storedDefinition(plan.def),
    onCaseDone: (_record, finished, total) => {
      progress ??= progressReporter(total, finished - 1);
      progress(finished);
    },
  }).catch((err: unknown) => {
    if (!isInterruptedError(err)) throw err;
    // finished cases are complete journal lines: they are kept, and the same command resumes
    throw new InterruptedError(`interrupted during the sweep; no results were written, finished cases stay in ${journalPath(stateDir, shard)} (run the same command again to resume)`);
  });
  const seconds = (performance.now() - started) / 1000;
  // every journal row is checked against this sweep's cases before any output is written
  const table = mergeSweepOf(plan.table, run.journal);
  const csv = writesOutputs ? join(out, CSV_NAME) : null;
  const json = writesOutputs ? join(out, JSON_NAME) : null;
  if (csv && json) {
    try {
      writeSweepOutputs(table, { csv, json });
    } catch (err) {
      throw pathInputError(err, '--out', out);
    }
  }
  // the readable report of the whole sweep, regenerated from the journal at every complete run
  let report: string | null = null;
  const complete = writesOutputs && table.missingCount === 0 && table.finished > 0;
  const writeReport = async (): Promise<void> => {
    if (!(complete && table.finished <= REPORT_CASES_LIMIT)) return;
    process.stderr.write('stanchion: writing the report …\n');
    const written = await writeSweepReport({
      scenarioText: plan.scenarioText,
      scenarioFile: plan.scenarioFile,
      table,
      methods: plan.methods,
      dir: join(out, 'report'),
      inputFiles: sweepInputFiles(file, plan),
      units: opts.units,
      meta: { version: toolVersion(), date: new Date().toISOString(), command: ['stanchion', ...process.argv.slice(2)].join(' ') },
    });
    report = join(written.dir, 'report.html');
  };
  if (complete && table.finished > REPORT_CASES_LIMIT) {
    process.stderr.write(`stanchion: no report for more than ${REPORT_CASES_LIMIT} cases (it would list every case); the results are in ${csv}\n`);
  }
  if (run.errors > 0) process.stderr.write(`stanchion: ${run.errors} case(s) failed; their messages are in the error column\n`);
  if (opts.json) {
    await writeReport();
    const doc = {
      sweep: {
        cases: plan.table.count,
        ran: run.ran,
        skipped: run.skipped,
        failed: run.errors,
        shard,
        shard_cases: run.shardCases,
        csv,
        json,
        report,
        state: stateDir,
        journal: run.journal,
        fingerprint,
        varied: plan.table.varied,
        design: plan.def.design,
        seed: plan.def.seed,
        methods: plan.methods,
        workers,
        seconds,
        results: resultsJson(table),
      },
    };
    process.stdout.write(`${JSON.stringify(doc, null, 2)}\n`);
    return;
  }
  process.stdout.write(humanSummary(plan, run, table, { csv, json, stateDir, out }, shard, seconds, workers));
  if (shard.count === 1) process.stdout.write(`\n${sweepResultLine(plan, table, opts.units)}\n`);
  await writeReport();
  if (report) process.stderr.write(`stanchion: sweep report written to ${shownPath(report)}\n`);
}

/** The last line of a sweep: how many cases meet the target, and where β crosses it. */
function sweepResultLine(plan: SweepPlan, table: SweepTable, units: DisplaySystem | undefined): string {
  const s = loadScenario(plan.scenarioText, plan.scenarioFile);
  const r = sweepResults(table, plan.methods, s.column.length, s.targetBeta);
  const target = `the target β = ${formatBeta(s.targetBeta)}${s.targetSource ? ` (${s.targetSource})` : ''}`;
  if (!r) return `result: ${table.finished} cases finished; more than two varied values, so no count against ${target} (see the CSV)`;
  const v = r.varied[0];
  const crossing =
    r.varied.length === 1 && r.crossings.length > 0
      ? `; β crosses it at ${describePath(v.path.replace(/\.(mean|sd|cov|min|max)$/, ''))}${/\.(mean|sd|cov|min|max)$/.exec(v.path)?.[0] ?? ''} = ${r.crossings.map((x) => formatQuantity(x, v.kind, units ?? s.displayUnits, 4)).join(', ')}`
      : '';
  return `result: ${r.meeting.count} of ${r.meeting.total} cases meet ${target}${crossing}`;
}

/** Journal files named by the arguments: a state folder (every journal in it) or a journal file. */
function journalFiles(paths: string[]): string[] {
  const files: string[] = [];
  for (const p of paths) {
    if (!existsSync(p)) throw new InputError('STATE_DIR', `${p}: no such folder`);
    try {
      if (statSync(p).isDirectory()) {
        const found = readdirSync(p).filter((n) => /^journal-\d+-of-\d+\.jsonl$/.test(n)).sort();
        if (found.length === 0) throw new InputError('STATE_DIR', `${p} holds no sweep journal`);
        files.push(...found.map((n) => join(p, n)));
      } else {
        readFileHead(p);
        files.push(p);
      }
    } catch (err) {
      if (err instanceof InputError) throw err;
      throw new InputError('STATE_DIR', `${p}: cannot be read`);
    }
  }
  return [...new Set(files)];
}

/** Opens the file for reading (an unreadable journal fails here, before anything is written). */
function readFileHead(file: string): void {
  closeSync(openSync(file, 'r'));
}

function readHeaderChecked(file: string): JournalHeader {
  try {
    return readJournalHeader(file);
  } catch (err) {
    if (err instanceof InputError) throw err;
    throw new InputError('STATE_DIR', `${file}: cannot be read`);
  }
}

export function runMergeCommand(paths: string[], opts: MergeOptions): void {
  const files = journalFiles(paths);
  const headers = files.map(readHeaderChecked);
  const fingerprint = headers[0].fingerprint;
  const stranger = headers.findIndex((h) => h.fingerprint !== fingerprint);
  if (stranger >= 0) throw new InputError('STATE_DIR', `${files[stranger]} belongs to a different sweep than ${files[0]}`);
  checkFolderTarget(opts.out, '--out');
  guardOutputs(opts.out, fingerprint, opts.force);
  // every line of every journal is checked here, before anything is written
  let table: SweepTable;
  try {
    table = mergeSweep(...files);
  } catch (err) {
    throw pathInputError(err, 'STATE_DIR', paths.join(' '));
  }
  const csv = join(opts.out, CSV_NAME);
  const json = join(opts.out, JSON_NAME);
  try {
    writeSweepOutputs(table, { csv, json });
  } catch (err) {
    throw pathInputError(err, '--out', opts.out);
  }
  if (table.missingCount > 0) {
    process.stderr.write(`stanchion: warning: ${table.missingCount} of ${table.cases} cases have no result yet (a shard not run or not finished); sweep.json lists them under "missing"\n`);
  }
  if (opts.json) {
    const missing = table.missingCount > INLINE_RESULTS_LIMIT ? null : [...table.missing()];
    const doc = { merge: { journals: files, cases: table.cases, finished: table.finished, missing, csv, json, fingerprint, varied: table.varied, results: resultsJson(table) } };
    process.stdout.write(`${JSON.stringify(doc, null, 2)}\n`);
    return;
  }
  const lines = [
    `stanchion merge: ${files.length} journal${files.length > 1 ? 's' : ''}, ${table.finished} of ${table.cases} cases finished`,
    `  results  ${csv}`,
    `           ${json}`,
    '',
    CAUTION,
  ];
  process.stdout.write(`${lines.join('\n')}\n`);
}
