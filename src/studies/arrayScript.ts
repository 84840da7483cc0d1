/**
 * `stanchion sweep ... --emit-array-script N`: a bash script that submits the sweep to Slurm as
 * a job array of N shard tasks (each runs `stanchion sweep ... --shard auto`, reading its index
 * from SLURM_ARRAY_TASK_ID and the range from SLURM_ARRAY_TASK_MIN/MAX) and a merge job that
 * starts only when every task has succeeded (--dependency=afterok). The bodies of both jobs are
 * quoted here-documents with every path written out, so they run the same from any node of a
 * shared file system.
 */

/** One word for bash, single-quoted unless it is plainly safe. */
export function shellWord(s: string): string {
  return /^[A-Za-z0-9_./:=,@%+-]+$/.test(s) ? s : `'${s.replace(/'/g, `'\\''`)}'`;
}

export interface ArrayScriptInput {
  shards: number;
  /** The sweep's own arguments after `stanchion sweep` (file first), without shard, state, out or workers. */
  sweepArgs: string[];
  /** Absolute state folder shared by the shards (journals), and the absolute output folder of the merge. */
  state: string;
  out: string;
  version: string;
  caution: string;
}

export function slurmArrayScript(i: ArrayScriptInput): string {
  const shardCommand = ['"$STANCHION"', 'sweep', ...i.sweepArgs.map(shellWord), '--shard', 'auto', '--state', shellWord(i.state), '--workers', '1'].join(' ');
  const mergeCommand = ['"$STANCHION"', 'merge', shellWord(i.state), '--out', shellWord(i.out)].join(' ');
  const logs = shellWord(`${i.state}/slurm-%A_%a.log`);
  const mergeLog = shellWord(`${i.state}/slurm-%j-merge.log`);
  const caution = i.caution
    .split('\n')
    .map((l) => `# ${l}`.trimEnd())
    .join('\n');
  return `#!/bin/bash
# A stanchion sweep as a Slurm job array: ${i.shards} shard task(s), then a merge job that runs
# once every task has succeeded. Written by stanchion ${i.version}.
#
#   bash THIS_FILE            submits both jobs (run it where sbatch works)
#
# Add your site's options (partition, account, time limit, memory) to the #SBATCH lines.
# STANCHION names the program (default: stanchion on the PATH); it is passed to the jobs.
# A shard that stops (time limit, node failure) resumes from its journal when resubmitted:
#   sbatch --array=I ... with the same body, or run the shard command by hand with
#   SLURM_ARRAY_TASK_ID=I SLURM_ARRAY_TASK_MIN=0 SLURM_ARRAY_TASK_MAX=${i.shards - 1} set.
#
${caution}
set -euo pipefail
export STANCHION="\${STANCHION:-stanchion}"
mkdir -p ${shellWord(i.state)}

array_job=$(sbatch --parsable --array=0-${i.shards - 1} --job-name=stanchion-sweep <<'STANCHION_SHARD'
#!/bin/bash
#SBATCH --cpus-per-task=1
#SBATCH --output=${logs}
set -euo pipefail
${shardCommand}
STANCHION_SHARD
)
array_job=\${array_job%%;*}

sbatch --parsable --dependency=afterok:\${array_job} --job-name=stanchion-merge <<'STANCHION_MERGE'
#!/bin/bash
#SBATCH --cpus-per-task=1
#SBATCH --output=${mergeLog}
set -euo pipefail
${mergeCommand}
STANCHION_MERGE

printf 'submitted the sweep as job array %s (%s task(s)); the merge writes %s\\n' "\${array_job}" ${i.shards} ${shellWord(i.out)}
`;
}
