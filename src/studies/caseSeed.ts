/**
 * Per-case seeds: the k-th draw of stream 0 of the sweep seed, as a 31-bit integer. The seed
 * of case k depends only on (sweep seed, k), so it is the same whichever shard or worker
 * runs the case, and adding cases at the end leaves earlier seeds unchanged.
 */
import { uniformStream } from '../probability/rng.js';

export const CASE_SEED_STREAM = 0;

export function caseSeeds(sweepSeed: number, count: number): number[] {
  const uniform = uniformStream(sweepSeed, CASE_SEED_STREAM);
  const seeds: number[] = [];
  for (let k = 0; k < count; k++) seeds.push(Math.floor(uniform() * 2147483648));
  return seeds;
}
