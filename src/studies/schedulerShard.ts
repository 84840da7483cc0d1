/**
 * `--shard auto` and `--shard auto/N`: which shard this process is, read from the job-array
 * variables a batch scheduler sets for each task of an array job, so that a cluster runs the
 * shards through its own scheduler.
 *
 * `auto` needs the array's range from the environment:
 *   Slurm          SLURM_ARRAY_TASK_ID, SLURM_ARRAY_TASK_MIN, SLURM_ARRAY_TASK_MAX
 *                  (SLURM_ARRAY_TASK_COUNT and SLURM_ARRAY_TASK_STEP checked when set)
 *   Grid Engine    SGE_TASK_ID, SGE_TASK_FIRST, SGE_TASK_LAST (SGE_TASK_STEPSIZE checked)
 *   I = ID − first, N = last − first + 1; the array must be contiguous (step 1).
 * `auto/N` needs only the task's index, for schedulers that do not export the range:
 *   PBS Pro PBS_ARRAY_INDEX, Torque PBS_ARRAYID, LSF LSB_JOBINDEX (and the two above);
 *   I = ID mod N, so any N consecutive array indices (0…N−1, 1…N, …) give each shard once.
 */
import { InputError } from '../scenario/inputError.js';
import type { Shard } from './sweepTypes.js';

const FIELD = '--shard';

type Env = Readonly<Record<string, string | undefined>>;

/** A whole number from the environment, or undefined (unset, or SGE's "undefined" outside arrays). */
function wholeNumber(env: Env, name: string): number | undefined {
  const raw = env[name];
  if (raw === undefined || !/^\s*\d+\s*$/.test(raw)) return undefined;
  const v = Number(raw);
  return Number.isSafeInteger(v) ? v : undefined;
}

interface ArrayTask {
  scheduler: string;
  variable: string;
  id: number;
  /** First and last index of the array, when the scheduler says. */
  first?: number;
  last?: number;
}

function slurmTask(env: Env): ArrayTask | undefined {
  const id = wholeNumber(env, 'SLURM_ARRAY_TASK_ID');
  if (id === undefined) return undefined;
  const first = wholeNumber(env, 'SLURM_ARRAY_TASK_MIN');
  const last = wholeNumber(env, 'SLURM_ARRAY_TASK_MAX');
  const step = wholeNumber(env, 'SLURM_ARRAY_TASK_STEP');
  const count = wholeNumber(env, 'SLURM_ARRAY_TASK_COUNT');
  if (step !== undefined && step !== 1) {
    throw new InputError(FIELD, `auto: the Slurm array has step ${step}; submit a contiguous array (--array=0-N) so that every shard runs`);
  }
  if (first !== undefined && last !== undefined && count !== undefined && count !== last - first + 1) {
    throw new InputError(FIELD, `auto: the Slurm array ${first}-${last} has ${count} tasks, not ${last - first + 1}; submit a contiguous array (--array=0-N)`);
  }
  return { scheduler: 'Slurm', variable: 'SLURM_ARRAY_TASK_ID', id, first, last };
}

function gridEngineTask(env: Env): ArrayTask | undefined {
  const id = wholeNumber(env, 'SGE_TASK_ID');
  if (id === undefined) return undefined;
  const step = wholeNumber(env, 'SGE_TASK_STEPSIZE');
  if (step !== undefined && step !== 1) {
    throw new InputError(FIELD, `auto: the Grid Engine array has step ${step}; submit a contiguous array (-t 1-N) so that every shard runs`);
  }
  return { scheduler: 'Grid Engine', variable: 'SGE_TASK_ID', id, first: wholeNumber(env, 'SGE_TASK_FIRST'), last: wholeNumber(env, 'SGE_TASK_LAST') };
}

function indexOnlyTask(env: Env): ArrayTask | undefined {
  for (const [scheduler, variable] of [['PBS Pro', 'PBS_ARRAY_INDEX'], ['Torque', 'PBS_ARRAYID'], ['LSF', 'LSB_JOBINDEX']] as const) {
    const id = wholeNumber(env, variable);
    // LSF sets LSB_JOBINDEX=0 for a job that is not an array
    if (id !== undefined && !(variable === 'LSB_JOBINDEX' && id === 0)) return { scheduler, variable, id };
  }
  return undefined;
}

const LOOKED_FOR = 'SLURM_ARRAY_TASK_ID, SGE_TASK_ID, PBS_ARRAY_INDEX, PBS_ARRAYID, LSB_JOBINDEX';

/** True for the spellings `auto` and `auto/N` (the CLI parser keeps them for later). */
export function isAutoShard(value: string): boolean {
  return /^auto(\/\d+)?$/.test(value.trim());
}

/** The shard of `auto` or `auto/N` in this environment; an InputError naming --shard otherwise. */
export function shardFromScheduler(value: string, env: Env = process.env): Shard {
  const m = /^auto(?:\/(\d+))?$/.exec(value.trim());
  if (!m) throw new InputError(FIELD, `expected I/N, auto or auto/N, got '${value}'`);
  const given = m[1] === undefined ? undefined : Number(m[1]);
  if (given !== undefined && !(Number.isSafeInteger(given) && given >= 1)) throw new InputError(FIELD, `auto/N needs N ≥ 1, got '${value}'`);
  const task = slurmTask(env) ?? gridEngineTask(env) ?? indexOnlyTask(env);
  if (task === undefined) {
    throw new InputError(FIELD, `${value}: no job-array index in the environment (looked for ${LOOKED_FOR}); run it as a task of an array job, or give --shard I/N`);
  }
  const ranged = task.first !== undefined && task.last !== undefined;
  if (ranged) {
    const first = task.first!;
    const count = task.last! - first + 1;
    if (!(count >= 1) || task.id < first || task.id > task.last!) {
      throw new InputError(FIELD, `auto: ${task.variable}=${task.id} is outside the ${task.scheduler} array ${first}-${task.last}`);
    }
    if (given !== undefined && given !== count) {
      throw new InputError(FIELD, `${value}: the ${task.scheduler} array has ${count} tasks, not ${given}`);
    }
    return { index: task.id - first, count };
  }
  if (given === undefined) {
    throw new InputError(FIELD, `auto: ${task.scheduler} gives the task's index (${task.variable}=${task.id}) but not the array's size; give it as --shard auto/N`);
  }
  return { index: task.id % given, count: given };
}
