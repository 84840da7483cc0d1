/**
 * Worker thread for MC and IS: rebuilds the problem from its recipe, then answers chunk jobs
 * with the same kernel the in-process path uses.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { makeChunkKernel, type ChunkJob, type SamplingSpec } from './chunkKernel.js';
import { loadRecipe } from './loadRecipe.js';
import type { ProblemRecipe } from './types.js';
import { describeThrown } from './limitStateError.js';
import { useInterruptFlag } from '../runtime/interruptFlag.js';

interface SamplingWorkerData {
  recipe: ProblemRecipe;
  spec: SamplingSpec;
  n: number;
  /** The Ctrl-C flag of the thread that started this one (runtime/interruptFlag.ts). */
  interruptFlag?: SharedArrayBuffer;
}

const port = parentPort;
if (port === null) throw new Error('samplingWorker must run in a worker thread');
const data = workerData as SamplingWorkerData;
useInterruptFlag(data.interruptFlag);

try {
  const problem = await loadRecipe(data.recipe);
  if (problem.transform.n !== data.n) {
    throw new Error(`recipe builds a problem with ${problem.transform.n} variables, expected ${data.n}`);
  }
  const kernel = makeChunkKernel(problem, data.spec);
  port.on('message', (job: ChunkJob) => port.postMessage({ outcome: kernel(job) }));
  port.postMessage({ ready: true, names: problem.names });
} catch (e) {
  port.postMessage({ loadError: describeThrown(e) });
}
