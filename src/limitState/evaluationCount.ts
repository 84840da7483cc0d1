/**
 * Every evaluation of a column's capacity (and so of g and the utilization) in this thread,
 * counted, so that `assess` can report the calls each study made (`meta.calls`). One integer
 * add per call; worker threads keep their own count (their methods report their own calls).
 */
let evaluations = 0;

export function noteEvaluation(): void {
  evaluations++;
}

/** n evaluations at once (the block limit state, columnBlock.ts). */
export function noteEvaluations(n: number): void {
  evaluations += n;
}

/** Evaluations in this thread so far; a study's calls are the difference across it. */
export function evaluationsSoFar(): number {
  return evaluations;
}

/** `run()` and the evaluations it made in this thread. */
export function countEvaluations<T>(run: () => T): { result: T; calls: number } {
  const before = evaluations;
  const result = run();
  return { result, calls: evaluations - before };
}
