/**
 * Worker-thread entry of runSweep: rebuild the case runner from the recipe in workerData,
 * then answer each {case} message with {index, result, error?}. A failure to load the
 * runner is thrown, which ends the worker with an 'error' event in the parent.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { loadCaseRunner, runOneCase, type CaseRunnerRecipe } from './caseRunner.js';
import type { SweepCase } from './sweepTypes.js';

const port = parentPort;
if (!port) throw new Error('sweepWorker must run in a worker thread');
const runner = await loadCaseRunner(workerData as CaseRunnerRecipe);
port.on('message', (message: { case: SweepCase }) => {
  void runOneCase(runner, message.case).then((done) => port.postMessage({ index: message.case.index, ...done }));
});
port.postMessage({ ready: true });
