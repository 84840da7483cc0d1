import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/scenario/inputError.js';
import { isAutoShard, shardFromScheduler } from '../../src/studies/schedulerShard.js';

// Variable names: Slurm sbatch, Grid Engine qsub -t, PBS Pro qsub -J, Torque qsub -t and LSF
// bsub job arrays, as their manuals list them (from memory).
function refused(value: string, env: Record<string, string>): InputError {
  try {
    shardFromScheduler(value, env);
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    expect((e as InputError).field).toBe('--shard');
    return e as InputError;
  }
  throw new Error('expected a refusal');
}

describe('--shard auto from a job array', () => {
  it('Slurm: I = ID − MIN, N = MAX − MIN + 1, whatever the first index', () => {
    expect(shardFromScheduler('auto', { SLURM_ARRAY_TASK_ID: '2', SLURM_ARRAY_TASK_MIN: '0', SLURM_ARRAY_TASK_MAX: '3', SLURM_ARRAY_TASK_COUNT: '4' })).toEqual({ index: 2, count: 4 });
    expect(shardFromScheduler('auto', { SLURM_ARRAY_TASK_ID: '1', SLURM_ARRAY_TASK_MIN: '1', SLURM_ARRAY_TASK_MAX: '8' })).toEqual({ index: 0, count: 8 });
    expect(shardFromScheduler('auto/8', { SLURM_ARRAY_TASK_ID: '8', SLURM_ARRAY_TASK_MIN: '1', SLURM_ARRAY_TASK_MAX: '8' })).toEqual({ index: 7, count: 8 });
  });

  it('Grid Engine: I = SGE_TASK_ID − SGE_TASK_FIRST', () => {
    expect(shardFromScheduler('auto', { SGE_TASK_ID: '5', SGE_TASK_FIRST: '1', SGE_TASK_LAST: '10', SGE_TASK_STEPSIZE: '1' })).toEqual({ index: 4, count: 10 });
  });

  it('index-only schedulers need auto/N; any N consecutive indices give each shard once', () => {
    for (const variable of ['PBS_ARRAY_INDEX', 'PBS_ARRAYID', 'LSB_JOBINDEX']) {
      const shards = [1, 2, 3, 4].map((id) => shardFromScheduler('auto/4', { [variable]: String(id) }).index);
      expect(shards.slice().sort()).toEqual([0, 1, 2, 3]);
      expect(refused('auto', { [variable]: '3' }).message).toMatch(/auto\/N/);
    }
    expect(shardFromScheduler('auto/3', { PBS_ARRAY_INDEX: '0' })).toEqual({ index: 0, count: 3 });
  });

  it('refuses what cannot give every shard exactly once', () => {
    expect(refused('auto', {}).message).toMatch(/SLURM_ARRAY_TASK_ID.*PBS_ARRAY_INDEX/);
    expect(refused('auto', { SGE_TASK_ID: 'undefined' }).message).toMatch(/no job-array index/); // SGE outside an array
    expect(refused('auto', { LSB_JOBINDEX: '0' }).message).toMatch(/no job-array index/); // LSF outside an array
    expect(refused('auto', { SLURM_ARRAY_TASK_ID: '2', SLURM_ARRAY_TASK_MIN: '0', SLURM_ARRAY_TASK_MAX: '6', SLURM_ARRAY_TASK_STEP: '2' }).message).toMatch(/step 2/);
    expect(refused('auto', { SLURM_ARRAY_TASK_ID: '2', SLURM_ARRAY_TASK_MIN: '0', SLURM_ARRAY_TASK_MAX: '6', SLURM_ARRAY_TASK_COUNT: '4' }).message).toMatch(/contiguous/);
    expect(refused('auto/5', { SLURM_ARRAY_TASK_ID: '2', SLURM_ARRAY_TASK_MIN: '0', SLURM_ARRAY_TASK_MAX: '3' }).message).toMatch(/4 tasks, not 5/);
    expect(refused('auto', { SGE_TASK_ID: '12', SGE_TASK_FIRST: '1', SGE_TASK_LAST: '10' }).message).toMatch(/outside/);
    expect(refused('auto/0', { PBS_ARRAY_INDEX: '1' }).message).toMatch(/N ≥ 1/);
  });

  it('knows its spellings', () => {
    expect(isAutoShard('auto')).toBe(true);
    expect(isAutoShard('auto/16')).toBe(true);
    expect(isAutoShard('0/2')).toBe(false);
    expect(isAutoShard('automatic')).toBe(false);
  });
});
