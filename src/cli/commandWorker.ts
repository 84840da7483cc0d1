/**
 * The command thread: runs the command line that main.ts received, with the interrupt flag and
 * the temporaries registry main.ts shares, and posts the exit code back.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { useInterruptFlag } from '../runtime/interruptFlag.js';
import { useTemporaryRegistry } from '../runtime/temporaryPaths.js';
import { runProgram } from './program.js';

export interface CommandWorkerData {
  interruptFlag: SharedArrayBuffer;
  temporaries: SharedArrayBuffer;
  /** A worker's stdout/stderr are pipes to the main thread; progress lines need the real answer. */
  stdoutIsTTY: boolean;
  stderrIsTTY: boolean;
}

const port = parentPort;
if (port === null) throw new Error('commandWorker must run in a worker thread');
const data = workerData as CommandWorkerData;
useInterruptFlag(data.interruptFlag);
useTemporaryRegistry(data.temporaries);
Object.defineProperty(process.stdout, 'isTTY', { value: data.stdoutIsTTY, configurable: true });
Object.defineProperty(process.stderr, 'isTTY', { value: data.stderrIsTTY, configurable: true });

const code = await runProgram(process.argv);
port.postMessage({ exitCode: code });
process.exitCode = code;
