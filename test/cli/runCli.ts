/** Runs the compiled CLI (npm test builds it first) as a real child process. */
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { dirname, join } from 'node:path';

export const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
export const CLI = join(ROOT, 'dist', 'src', 'cli', 'main.js');

export interface CliRun {
  status: number | null;
  stdout: string;
  stderr: string;
}

export function runCli(args: string[], input?: string): CliRun {
  const r = spawnSync(process.execPath, [CLI, ...args], { cwd: ROOT, input, encoding: 'utf8', timeout: 120_000 });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}
