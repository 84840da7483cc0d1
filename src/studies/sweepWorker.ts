/**
 * Worker-thread entry of runSweep: rebuild the case runner from the recipe in workerData,
 * then answer each {case} message with {index, result, error?}, or {index, interrupted} when
 * Ctrl-C stopped the case. A failure to load the runner is thrown, which ends the worker with
 * an 'error' event in the parent.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { loadCaseRunner, runOneCase, type CaseRunnerRecipe } from './caseRunner.js';
import { isInterruptedError, useInterruptFlag } from '../runtime/interruptFlag.js';
import type { SweepCase } from './sweepTypes.js';

const port = parentPort;
if (!port) throw new Error('sweepWorker must run in a worker thread');
const data = workerData as { recipe: CaseRunnerRecipe; interruptFlag?: SharedArrayBuffer };
useInterruptFlag(data.interruptFlag);
const runner = await loadCaseRunner(data.recipe);
port.on('message', (message: { case: SweepCase }) => {
  runOneCase(runner, message.case).then(
    (done) => port.postMessage({ index: message.case.index, ...done }),
    (error: unknown) => {
      if (isInterruptedError(error)) port.postMessage({ index: message.case.index, interrupted: true });
      else throw error;
    },
  );
});
port.postMessage({ ready: true });
