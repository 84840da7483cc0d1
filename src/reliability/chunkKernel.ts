/**
 * The sampling work of one chunk, shared verbatim by the in-process path and the worker
 * threads so that both give bit-identical sums. Chunk i draws from stream streamBase + i only,
 * with the block generator (probability/blockRng.ts, ziggurat normals), in blocks of
 * BLOCK_SIZE samples; the Ctrl-C flag is looked at once per block.
 *
 * 'mc': x drawn column-wise by blockSampler.ts (same law as x = T(u), u ~ N(0, I)), counts g <= 0;
 *       g of a whole block at once when the problem has a block form (types.ts BlockLimitState).
 * 'is': u = c + z, z ~ N(0, I) (standard normal shifted to the centre c, usually the FORM
 *       design point); weight φ(u)/φ(u − c) = exp(−z·c − c·c/2); sums the weighted indicator
 *       and its square.
 */
import { BlockRng } from '../probability/blockRng.js';
import { fillNormal } from '../probability/ziggurat.js';
import { BLOCK_SIZE, makeBlockSampler } from './blockSampler.js';
import type { BlockLimitState, ReliabilityProblem } from './types.js';
import { describeThrown, isFiniteNumber } from './limitStateError.js';
import { interruptRequested } from '../runtime/interruptFlag.js';


export interface SamplingSpec {
  kind: 'mc' | 'is';
  seed: number;
  streamBase: number;
  /** Sampling centre in u-space ('is' only). */
  centre?: number[];
}

export interface ChunkJob {
  index: number;
  /** Global index of the chunk's first sample (for error reports). */
  firstSample: number;
  count: number;
}

export interface ChunkFault {
  x: number[];
  value: number | null; // null when g threw
  cause?: string;
  sampleIndex: number;
}

export interface ChunkOutcome {
  index: number;
  count: number;
  failures: number;
  /** Σ weight·1[g <= 0] (MC: = failures). */
  sumW: number;
  /** Σ weight²·1[g <= 0] (MC: = failures). */
  sumW2: number;
  fault?: ChunkFault;
  /** Ctrl-C stopped the chunk part-way: its sums are partial and must not be merged. */
  interrupted?: true;
}

export type ChunkKernel = (job: ChunkJob) => ChunkOutcome;

export function makeChunkKernel(problem: ReliabilityProblem, spec: SamplingSpec): ChunkKernel {
  const n = problem.transform.n;
  const x = new Float64Array(n);
  const g = problem.g;
  if (spec.kind === 'mc') {
    const { columns, fill } = makeBlockSampler(problem.transform);
    // the block form only while it belongs to this g (a copy of the problem with another g must not use it)
    const block = problem.gBlock !== undefined && problem.gBlock.of === g ? problem.gBlock : null;
    const gOut = new Float64Array(BLOCK_SIZE);
    return (job) => {
      const rng = new BlockRng(spec.seed, spec.streamBase + job.index);
      let failures = 0;
      let s = 0;
      let v = 0;
      try {
        for (let start = 0; start < job.count; start += BLOCK_SIZE) {
          if (interruptRequested()) return stopped(job, start);
          const count = Math.min(BLOCK_SIZE, job.count - start);
          fill(rng, count);
          if (block !== null && blockOf(block, columns, count, gOut)) {
            for (let b = 0; b < count; b++) {
              v = gOut[b];
              if (!(v > 0 && v < Infinity)) {
                if (!isFiniteNumber(v)) {
                  for (let i = 0; i < n; i++) x[i] = columns[i][b];
                  return faulted(job, x, v, undefined, start + b);
                }
                failures++;
              }
            }
            continue;
          }
          for (let b = 0; b < count; b++) {
            s = start + b;
            for (let i = 0; i < n; i++) x[i] = columns[i][b];
            v = g(x);
            if (!(v > 0 && v < Infinity)) {
              if (!isFiniteNumber(v)) return faulted(job, x, v, undefined, s);
              failures++;
            }
          }
        }
      } catch (e) {
        return faulted(job, x, null, describeThrown(e), s);
      }
      return { index: job.index, count: job.count, failures, sumW: failures, sumW2: failures };
    };
  }
  const transform = problem.transform;
  const u = new Float64Array(n);
  const c = Float64Array.from(spec.centre ?? []);
  if (c.length !== n) throw new Error(`importance sampling centre has ${c.length} components, problem has ${n}`);
  let cc = 0;
  for (let i = 0; i < n; i++) cc += c[i] * c[i];
  const halfCc = cc / 2;
  const zCols = Array.from({ length: n }, () => new Float64Array(BLOCK_SIZE));
  return (job) => {
    const rng = new BlockRng(spec.seed, spec.streamBase + job.index);
    let failures = 0;
    let sumW = 0;
    let sumW2 = 0;
    let s = 0;
    let v = 0;
    try {
      for (let start = 0; start < job.count; start += BLOCK_SIZE) {
        if (interruptRequested()) return stopped(job, start);
        const count = Math.min(BLOCK_SIZE, job.count - start);
        for (let i = 0; i < n; i++) fillNormal(rng, zCols[i], count);
        for (let b = 0; b < count; b++) {
          s = start + b;
          let zc = 0;
          for (let i = 0; i < n; i++) {
            const z = zCols[i][b];
            zc += z * c[i];
            u[i] = c[i] + z;
          }
          transform.toPhysical(u, x);
          v = g(x);
          if (!isFiniteNumber(v)) return faulted(job, x, v, undefined, s);
          if (v <= 0) {
            const w = Math.exp(-zc - halfCc);
            failures++;
            sumW += w;
            sumW2 += w * w;
          }
        }
      }
    } catch (e) {
      return faulted(job, x, null, describeThrown(e), s);
    }
    return { index: job.index, count: job.count, failures, sumW, sumW2 };
  };
}

/** g of the whole block into out; false when the block form threw (that block is then done one sample at a time, which names the sample). */
function blockOf(block: BlockLimitState, columns: readonly Float64Array[], count: number, out: Float64Array): boolean {
  try {
    block.evaluate(columns, count, out);
    return true;
  } catch {
    return false;
  }
}

function stopped(job: ChunkJob, s: number): ChunkOutcome {
  return { index: job.index, count: s, failures: 0, sumW: 0, sumW2: 0, interrupted: true };
}

function faulted(job: ChunkJob, x: Float64Array, value: number | null, cause: string | undefined, s: number): ChunkOutcome {
  const fault: ChunkFault = { x: Array.from(x), value, sampleIndex: job.firstSample + s };
  if (cause !== undefined) fault.cause = cause;
  return { index: job.index, count: s, failures: 0, sumW: 0, sumW2: 0, fault };
}
