/**
 * A synthetic case runner for exercising the sweep engine (tests, demonstrations): it waits
 * `sleepMs` per case, then returns numbers that depend on the case values and on random
 * draws from the case's own seed — so any mix-up of seeds, values or cases shows.
 */
import { normalStream } from '../probability/rng.js';
import type { CaseRunner } from './caseRunner.js';
import type { CaseResult, SweepCase, SweepValue } from './sweepTypes.js';

export interface SyntheticArgs {
  sleepMs: number;
  /** Draws per case (default 1000). */
  draws?: number;
  /** Case indices whose run throws (to exercise error recording). */
  failCases?: number[];
  /** Case indices whose run ends its thread with process.exit (worker threads only). */
  exitCases?: number[];
}

function leadingNumber(value: SweepValue): number {
  return typeof value === 'number' ? value : Number.parseFloat(value);
}

function pause(ms: number): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, ms));
}

export function syntheticCaseRunner(args: SyntheticArgs): CaseRunner {
  const draws = args.draws ?? 1000;
  const fail = new Set(args.failCases ?? []);
  const exit = new Set(args.exitCases ?? []);
  return async (c: SweepCase): Promise<CaseResult> => {
    if (args.sleepMs > 0) await pause(args.sleepMs);
    if (exit.has(c.index)) process.exit(3);
    if (fail.has(c.index)) throw new Error(`synthetic failure of case ${c.index}`);
    const sumOfValues = Object.values(c.values).reduce((s: number, v) => s + leadingNumber(v), 0);
    const normal = normalStream(c.seed, 0);
    let sum = 0;
    for (let k = 0; k < draws; k++) sum += normal();
    return { response: sumOfValues * 1.5 + sum / draws, meanDraw: sum / draws, label: `case ${c.index}`, flag: c.index % 2 === 0 };
  };
}
