/**
 * Per-case seeds: the k-th draw of stream 0 of the sweep seed, as a 31-bit integer. The seed
 * of case k depends only on (sweep seed, k), so it is the same whichever shard or worker
 * runs the case, and adding cases at the end leaves earlier seeds unchanged. The stream is
 * sequential, so seeds are handed out in index order (one draw per case, nothing stored).
 */
import { uniformStream } from '../probability/rng.js';

export const CASE_SEED_STREAM = 0;

/** A function returning the seed of case 0, then case 1, ... */
export function caseSeedStream(sweepSeed: number): () => number {
  const uniform = uniformStream(sweepSeed, CASE_SEED_STREAM);
  return () => Math.floor(uniform() * 2147483648);
}
