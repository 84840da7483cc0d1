/**
 * Run (or resume) a sweep shard. Cases already in the shard's journal are skipped; each new
 * case is journalled as soon as it finishes. With workers > 1 the cases go to worker
 * threads that rebuild the case runner from its recipe; each case carries its own seed, so
 * results do not depend on the number of workers or on which worker ran a case.
 * Cases are built one at a time as they are handed out (iterateCases) and forgotten once
 * journalled: memory does not grow with the number of cases.
 */
import { Worker } from 'node:worker_threads';
import { loadCaseRunner, runOneCase, type CaseRunner, type CaseRunnerRecipe } from './caseRunner.js';
import { compiledModule } from '../runtime/compiledTwin.js';
import { checkShard, iterateCases, shardSize } from './sweepDesign.js';
import { interruptedDuring, interruptFlagBuffer, interruptRequested, throwIfInterrupted, whenInterrupted } from '../runtime/interruptFlag.js';
import { sweepFingerprint } from './sweepFingerprint.js';
import { SweepJournal, type StoredDefinition } from './sweepJournal.js';
import type { CaseResult, CaseTable, Shard, SweepCase, SweepRecord } from './sweepTypes.js';

export interface RunSweepOptions {
  table: CaseTable;
  /** A function runs in this thread (workers must be 1); a recipe may run in workers. */
  runCase: CaseRunner | CaseRunnerRecipe;
  /** Worker threads (default 1: run in this thread). */
  workers?: number;
  /** Folder of the journal; reuse it to resume. */
  stateDir: string;
  shard?: Shard;
  /** Extra identity folded into the fingerprint (methods, scenario hash, ...). */
  identity?: unknown;
  /** The fingerprint of (table, identity) when the caller has computed it already. */
  fingerprint?: string;
  /** The definition the table was built from, kept in the journal header so that a merge can check every row. */
  definition?: StoredDefinition;
  onCaseDone?: (record: SweepRecord, finished: number, total: number) => void;
  /**
   * With a recipe and workers > 1: the first cases run here, timed, and workers start only when
   * the rest would take longer than this (ms; default SWEEP_WORKER_REPAID_MS; 0 = always).
   */
  workerStartRepaidMs?: number;
}

/**
 * Work left (ms, one thread) from which sweep workers pay: each must load the scenario stack
 * and rebuild its runner before its first case (about half a second on 2 shared cores), while
 * this thread would have gone on with cases; below this, FORM sweeps of short cases run faster
 * in one thread.
 */
export const SWEEP_WORKER_REPAID_MS = 1500;
/** Cases timed here before deciding (the first pays for compilation, so the fastest counts). */
const PROBE_CASES = 3;

export interface RunSweepResult {
  journal: string;
  fingerprint: string;
  /** Cases of this shard, finished now or before. */
  shardCases: number;
  /** Cases run now. */
  ran: number;
  /** Cases found finished in the journal. */
  skipped: number;
  /** Cases run now whose runner threw (recorded with their message). */
  errors: number;
}

type Finish = (c: SweepCase, done: { result: CaseResult; error?: string }) => void;

/** The sweep loop in this thread: one case at a time, in index order. */
async function runInThread(runner: CaseRunner, todo: Iterator<SweepCase>, finish: Finish): Promise<void> {
  for (let next = todo.next(); !next.done; next = todo.next()) {
    const c = next.value;
    throwIfInterrupted('the sweep');
    finish(c, await runOneCase(runner, c));
  }
}

interface WorkerReply {
  ready?: boolean;
  /** Ctrl-C stopped the case: nothing of it is journalled. */
  interrupted?: boolean;
  index: number;
  result: CaseResult;
  error?: string;
}

/** The sweep loop over worker threads: each idle worker takes the next case; only cases in flight are held. */
function runInWorkers(recipe: CaseRunnerRecipe, todo: Iterator<SweepCase>, todoCount: number, workers: number, finish: Finish): Promise<void> {
  // under vitest this file is .ts: the worker must be the compiled twin
  const ext = import.meta.url.endsWith('.ts') ? '.ts' : '.js';
  const workerUrl = compiledModule(new URL(`./sweepWorker${ext}`, import.meta.url).href);
  const byIndex = new Map<number, SweepCase>();
  const count = Math.min(workers, todoCount);
  return new Promise((resolve, reject) => {
    const pool: Worker[] = [];
    let running = count;
    let unfinished = todoCount;
    let failed = false;
    const fail = (error: unknown): void => {
      if (failed) return;
      failed = true;
      stopWatching();
      for (const w of pool) void w.terminate();
      // after Ctrl-C a worker's own failure is part of the stop, not a fault
      const reason = interruptRequested() ? interruptedDuring('the sweep') : error;
      reject(reason instanceof Error ? reason : new Error(String(reason)));
    };
    const stopWatching = whenInterrupted(() => fail(interruptedDuring('the sweep')));
    const feed = (w: Worker): void => {
      const next = todo.next();
      if (next.done) {
        void w.terminate();
        return;
      }
      byIndex.set(next.value.index, next.value);
      w.postMessage({ case: next.value });
    };
    for (let k = 0; k < count; k++) {
      const w = new Worker(workerUrl, { workerData: { recipe, interruptFlag: interruptFlagBuffer() } });
      pool.push(w);
      w.on('message', (reply: WorkerReply) => {
        if (failed) return;
        if (reply.interrupted) return fail(interruptedDuring('the sweep'));
        if (!reply.ready) {
          const c = byIndex.get(reply.index);
          if (!c) return fail(new Error(`worker answered an unknown case ${reply.index}`));
          try {
            byIndex.delete(reply.index);
            unfinished -= 1;
            finish(c, reply);
          } catch (error) {
            return fail(error);
          }
        }
        feed(w);
      });
      w.on('error', fail);
      w.on('exit', () => {
        running -= 1;
        if (running === 0 && !failed) {
          stopWatching();
          // a worker that exits by itself (process.exit in a runner) leaves its case unfinished
          if (unfinished > 0) fail(new Error('workers stopped before the sweep finished'));
          else resolve();
        }
      });
    }
    if (count === 0) {
      stopWatching();
      resolve();
    }
  });
}

export async function runSweep(opts: RunSweepOptions): Promise<RunSweepResult> {
  const shard = opts.shard ?? { index: 0, count: 1 };
  const workers = opts.workers ?? 1;
  if (!(Number.isInteger(workers) && workers >= 1)) throw new Error(`workers must be a whole number >= 1, got ${workers}`);
  checkShard(shard);
  const mine = shardSize(opts.table.count, shard);
  const fingerprint = opts.fingerprint ?? sweepFingerprint(opts.table, opts.identity);
  const journal = SweepJournal.open(opts.stateDir, {
    stanchion_sweep_journal: 1,
    fingerprint,
    varied: opts.table.varied,
    cases: opts.table.count,
    shard,
    ...(opts.definition ? { definition: opts.definition, identity: opts.identity ?? null } : {}),
  });
  try {
    const skipped = journal.doneCount;
    const todoCount = mine - skipped;
    const todo = iterateCases(opts.table, shard, (k) => journal.isDone(k));
    let errors = 0;
    const finish: Finish = (c, done) => {
      const record: SweepRecord = { case: c.index, seed: c.seed, values: c.values, result: done.result };
      if (done.error !== undefined) {
        record.error = done.error;
        errors += 1;
      }
      journal.record(record);
      opts.onCaseDone?.(record, journal.doneCount, mine);
    };
    if (typeof opts.runCase === 'function') {
      if (workers > 1) throw new Error('runSweep: a case-runner function cannot cross threads; pass a recipe for workers > 1');
      await runInThread(opts.runCase, todo, finish);
    } else if (workers === 1) {
      await runInThread(await loadCaseRunner(opts.runCase), todo, finish);
    } else {
      const runner = await loadCaseRunner(opts.runCase);
      let left = todoCount;
      let fastest = Infinity;
      for (let probed = 0; probed < PROBE_CASES && left > 0; probed++) {
        const next = todo.next();
        if (next.done) break;
        throwIfInterrupted('the sweep');
        const t0 = performance.now();
        const done = await runOneCase(runner, next.value);
        fastest = Math.min(fastest, performance.now() - t0);
        finish(next.value, done);
        left -= 1;
      }
      if (left > 0 && fastest * left >= (opts.workerStartRepaidMs ?? SWEEP_WORKER_REPAID_MS)) {
        await runInWorkers(opts.runCase, todo, left, workers, finish);
      } else {
        await runInThread(runner, todo, finish);
      }
    }
    return { journal: journal.file, fingerprint, shardCases: mine, ran: todoCount, skipped, errors };
  } finally {
    journal.close();
  }
}
