/**
 * Start-up and FORM cost, as a user feels them.
 *
 * 1. start-up: wall time of `node -e 0`, `stanchion --version`, `stanchion --help` and
 *    `stanchion check` on the demo, each the median of REPEATS runs taken in turn (so load
 *    drifts hit all alike), and each as a ratio to `node -e 0` of the same run.
 * 2. FORM on the demo: limit-state calls and β of the default search, against the search of
 *    before (central differences, plain improved HL-RF, one mirror restart) and the full scan.
 */
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { form } from '../src/reliability/form.js';
import type { ReliabilityProblem } from '../src/reliability/types.js';

const REPEATS = 7;

function median(v: number[]): number {
  const s = [...v].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

export function runStartupBench(root: string, demoFile: string): string[] {
  const cli = join(root, 'dist', 'src', 'cli', 'main.js');
  const commands: [string, string[]][] = [
    ['node -e 0', ['-e', '0']],
    ['stanchion --version', [cli, '--version']],
    ['stanchion --help', [cli, '--help']],
    ['stanchion check (demo)', [cli, 'check', demoFile]],
  ];
  const times = commands.map(() => [] as number[]);
  for (let r = 0; r < REPEATS; r++) {
    commands.forEach(([, args], i) => {
      const t = performance.now();
      const run = spawnSync(process.execPath, args, { cwd: root, encoding: 'utf8' });
      if (run.status !== 0) throw new Error(`${args.join(' ')} exited ${run.status}: ${run.stderr}`);
      times[i].push(performance.now() - t);
    });
  }
  const floor = median(times[0]);
  return commands.map(([label], i) => {
    const m = median(times[i]);
    return `${label.padEnd(24)} ${(m / 1000).toFixed(3)} s  (${(m / floor).toFixed(2)} × node -e 0; median of ${REPEATS})`;
  });
}

export function runFormCallsBench(problem: ReliabilityProblem, label: string): string[] {
  const before = form(problem, { differences: 'central', curvature: false, restarts: 1 });
  const now = form(problem);
  const thorough = form(problem, { thorough: true });
  return [
    `FORM on ${label}: ${now.calls} calls, β ${now.beta.toFixed(6)} (default: forward differences, BFGS curvature, restarts only when in doubt)`,
    `  before (central differences, plain HL-RF, mirror restart): ${before.calls} calls, β ${before.beta.toFixed(6)}; |Δβ| = ${Math.abs(now.beta - before.beta).toExponential(1)}`,
    `  --thorough (mirror and ±b on every axis): ${thorough.calls} calls, β ${thorough.beta.toFixed(6)}`,
  ];
}
