/**
 * The Monte Carlo kernel against a bare loop floor and against an independent numpy Monte Carlo
 * of the same limit state (bench/numpy_column_mc.py), all in one run.
 *
 * Rates per core are samples per CPU second (process.cpuUsage here, time.process_time in
 * Python): on a shared machine, wall time measures the neighbours as much as the code.
 *
 * 1. floors: a bare loop g = R − S (lognormal R from ziggurat normals, Gumbel S by its inverse
 *    CDF) on the block generator, written out, nothing else; and a loop that only draws the
 *    demo's random numbers (7 normals and 1 uniform per sample, block-wise) and does nothing with them;
 * 2. the kernel on the demo column (1 thread), and its ratio to each floor;
 * 3. numpy, tabulated φ and c: its rate per core, and the kernel's ratio to it. Kernel and numpy
 *    run alternately, ROUNDS times each, and each keeps its best round: on a shared machine the
 *    best round is the one least disturbed by the neighbours, for both alike;
 * 4. whole processes on a 4e6-sample run with default settings: `stanchion assess --methods mc
 *    --samples 4e6 --json` against numpy solving the buckling equation per sample.
 * Lines 3 and 4 are skipped, saying so, where python3 or numpy is missing.
 */
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { BlockRng } from '../src/probability/blockRng.js';
import { fillNormal } from '../src/probability/ziggurat.js';
import { monteCarlo } from '../src/reliability/monteCarlo.js';
import { loadRecipe } from '../src/reliability/loadRecipe.js';
import type { ProblemRecipe } from '../src/reliability/types.js';

const SEED = 20261201;
const WHOLE_RUN_SAMPLES = 4_000_000;

function cpuSeconds(since: NodeJS.CpuUsage): number {
  const c = process.cpuUsage(since);
  return (c.user + c.system) / 1e6;
}

const perSecond = (n: number, s: number): string => `${(n / s / 1e6).toFixed(2)} M/s`;

/** R − S with R lognormal(200, 10 %) from ziggurat normals, S Gumbel(100, 25 %) by its inverse CDF. */
function bareFloor(samples: number): { cpu: number; failures: number } {
  const zeta = Math.sqrt(Math.log1p(0.01));
  const lambda = Math.log(200) - 0.5 * zeta * zeta;
  const scale = (25 * Math.sqrt(6)) / Math.PI;
  const loc = 100 - 0.5772156649015329 * scale;
  const rng = new BlockRng(SEED, 0);
  const z = new Float64Array(512);
  const u = new Float64Array(512);
  const c0 = process.cpuUsage();
  let failures = 0;
  for (let done = 0; done < samples; done += 512) {
    fillNormal(rng, z, 512);
    rng.fillUniform(u, 512);
    for (let k = 0; k < 512; k++) {
      if (Math.exp(lambda + zeta * z[k]) - (loc - scale * Math.log(-Math.log(u[k]))) <= 0) failures++;
    }
  }
  return { cpu: cpuSeconds(c0), failures };
}

/** Draws only: per sample the demo's 7 standard normals and 1 uniform, block-wise, nothing computed from them. */
function drawsOnlyFloor(samples: number): number {
  const rng = new BlockRng(SEED, 0);
  const z = new Float64Array(512);
  const c0 = process.cpuUsage();
  for (let done = 0; done < samples; done += 512) {
    for (let v = 0; v < 7; v++) fillNormal(rng, z, 512);
    rng.fillUniform(z, 512);
  }
  return cpuSeconds(c0);
}

/** Kernel and numpy alternate this many times; each keeps its best round. */
const ROUNDS = 3;

function numpyAvailable(): string | null {
  const r = spawnSync('python3', ['-c', 'import numpy'], { encoding: 'utf8' });
  if (r.error) return 'python3 not found';
  if (r.status !== 0) return 'numpy not installed (Debian: apt-get install -y python3-numpy)';
  return null;
}

interface NumpyRun {
  rate_per_cpu_second: number;
  pf: number;
  samples: number;
}

function runNumpy(script: string, mode: string, samples: number): { out: NumpyRun; wall: number } {
  const t = performance.now();
  const r = spawnSync('python3', [script, mode, String(samples), String(SEED)], { encoding: 'utf8', maxBuffer: 1 << 20 });
  const wall = (performance.now() - t) / 1000;
  if (r.status !== 0) throw new Error(`numpy reference failed: ${r.stderr}`);
  return { out: JSON.parse(r.stdout.trim().split('\n').pop()!) as NumpyRun, wall };
}

export async function runKernelBench(opts: { root: string; recipe: ProblemRecipe; scenario: string }): Promise<string[]> {
  const lines: string[] = [];
  bareFloor(200_000);
  const floorSamples = 4_000_000;
  const floor = bareFloor(floorSamples);
  const floorRate = floorSamples / floor.cpu;
  lines.push(`floor: bare loop g = R − S on block uniforms, 1 core: ${perSecond(floorSamples, floor.cpu)} per CPU second (pf ${(floor.failures / floorSamples).toExponential(3)})`);

  drawsOnlyFloor(200_000);
  const drawsCpu = drawsOnlyFloor(floorSamples);
  const drawsRate = floorSamples / drawsCpu;
  lines.push(`floor: draws only (7 ziggurat normals + 1 uniform per sample, nothing computed), 1 core: ${perSecond(floorSamples, drawsCpu)} per CPU second`);

  const problem = await loadRecipe(opts.recipe);
  await monteCarlo(problem, { samples: 262_144, seed: SEED + 1, workers: 1 });
  const kernelSamples = 2_000_000;
  const kernelRound = async (): Promise<{ rate: number; pf: number }> => {
    const c0 = process.cpuUsage();
    const mc = await monteCarlo(problem, { samples: kernelSamples, seed: SEED, workers: 1 });
    return { rate: kernelSamples / cpuSeconds(c0), pf: mc.pf };
  };
  const missing = numpyAvailable();
  const script = join(opts.root, 'bench', 'numpy_column_mc.py');
  if (missing === null) runNumpy(script, 'tabulated', 100_000); // warm the file cache
  let kernel = { rate: 0, pf: NaN };
  let tab: NumpyRun | null = null;
  for (let round = 0; round < ROUNDS; round++) {
    const k = await kernelRound();
    if (k.rate > kernel.rate) kernel = k;
    if (missing !== null) continue;
    const t = runNumpy(script, 'tabulated', kernelSamples).out;
    if (tab === null || t.rate_per_cpu_second > tab.rate_per_cpu_second) tab = t;
  }
  const kernelRate = kernel.rate;
  lines.push(
    `MC kernel, demo column, 1 core, best of ${ROUNDS}: ${(kernelRate / 1e6).toFixed(2)} M/s per CPU second (pf ${kernel.pf.toExponential(3)}), ` +
      `${(kernelRate / floorRate).toFixed(2)} × the R − S floor, ${(kernelRate / drawsRate).toFixed(2)} × the draws-only floor`,
  );
  if (missing !== null || tab === null) {
    lines.push(`numpy comparison skipped: ${missing ?? 'no run'}`);
    return lines;
  }
  lines.push(`numpy, same limit state with φ and c tabulated, 1 core, best of ${ROUNDS}: ${(tab.rate_per_cpu_second / 1e6).toFixed(2)} M/s per CPU second (pf ${tab.pf.toExponential(3)}); kernel / numpy = ${(kernelRate / tab.rate_per_cpu_second).toFixed(2)}`);

  const cli = join(opts.root, 'dist', 'src', 'cli', 'main.js');
  const t = performance.now();
  const run = spawnSync(process.execPath, [cli, 'assess', opts.scenario, '--methods', 'mc', '--samples', String(WHOLE_RUN_SAMPLES), '--json'], { encoding: 'utf8', maxBuffer: 64 << 20 });
  const toolWall = (performance.now() - t) / 1000;
  if (run.status !== 0) throw new Error(`assess failed: ${run.stderr}`);
  const toolJson = JSON.parse(run.stdout) as { reliability: { mc: { pf: number; workers: number } } };
  const solve = runNumpy(script, 'solve', WHOLE_RUN_SAMPLES);
  lines.push(
    `whole process, ${WHOLE_RUN_SAMPLES} samples, default settings: stanchion assess --methods mc ${perSecond(WHOLE_RUN_SAMPLES, toolWall)} (${toolWall.toFixed(2)} s, ${toolJson.reliability.mc.workers} worker(s), pf ${toolJson.reliability.mc.pf.toExponential(3)}); ` +
      `numpy solving per sample ${perSecond(WHOLE_RUN_SAMPLES, solve.wall)} (${solve.wall.toFixed(2)} s, pf ${solve.out.pf.toExponential(3)}); ratio ${(solve.wall / toolWall).toFixed(2)}`,
  );
  return lines;
}
