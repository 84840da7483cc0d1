/**
 * Runs the CLI on a command line. By default in this process: `runProgram` of src/cli/program.ts
 * with stdout and stderr captured and the working folder set (by default to the project root), which
 * is what the child process would see, without paying node's and the command thread's start-up for every
 * case. A run that reads stdin (`input`) or whose point is the executable itself (exit codes from
 * main.ts, the command thread, signals) spawns the compiled CLI (`runCliProcess`; npm test builds
 * it first).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { fileURLToPath } from 'node:url';
import { dirname, join } from 'node:path';
import { runProgram } from '../../src/cli/program.js';

export const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
export const CLI = join(ROOT, 'dist', 'src', 'cli', 'main.js');

export interface CliRun {
  status: number | null;
  stdout: string;
  stderr: string;
}

/** The compiled executable as a real child process, in `cwd` (default the project root). */
export function runCliProcess(args: string[], input?: string, cwd = ROOT): CliRun {
  const r = spawnSync(process.execPath, [CLI, ...args], { cwd, input, encoding: 'utf8', timeout: 120_000 });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

type Write = typeof process.stdout.write;

function capture(into: string[]): Write {
  return ((chunk: string | Uint8Array, ...rest: unknown[]) => {
    into.push(typeof chunk === 'string' ? chunk : Buffer.from(chunk).toString('utf8'));
    const done = rest.find((r) => typeof r === 'function') as (() => void) | undefined;
    done?.();
    return true;
  }) as Write;
}

/** In this process unless stdin is needed (see the file comment), in `cwd` (default the project root). One run at a time. */
export async function runCli(args: string[], input?: string, cwd = ROOT): Promise<CliRun> {
  if (input !== undefined) return runCliProcess(args, input, cwd);
  const out: string[] = [];
  const err: string[] = [];
  const [writeOut, writeErr, previous] = [process.stdout.write, process.stderr.write, process.cwd()];
  process.stdout.write = capture(out);
  process.stderr.write = capture(err);
  process.chdir(cwd);
  try {
    const status = await runProgram([process.execPath, CLI, ...args]);
    return { status, stdout: out.join(''), stderr: err.join('') };
  } finally {
    process.stdout.write = writeOut;
    process.stderr.write = writeErr;
    process.chdir(previous);
  }
}

let textFolder: string | null = null;
let textFiles = 0;

/**
 * The command on a scenario text given as a file of its own in place of `-`, in this process: for
 * runs where the scenario's content is the point, not standard input (which runCli with `input`
 * and runCliProcess exercise). The file is .json when the text is a JSON object, else .yaml.
 */
export function runCliOnText(args: string[], text: string): Promise<CliRun> {
  if (textFolder === null) {
    const folder = mkdtempSync(join(tmpdir(), 'stanchion-cli-text-'));
    textFolder = folder;
    process.once('exit', () => rmSync(folder, { recursive: true, force: true }));
  }
  const file = join(textFolder, `scenario-${textFiles++}.${text.trimStart().startsWith('{') ? 'json' : 'yaml'}`);
  writeFileSync(file, text);
  return runCli(args.map((a) => (a === '-' ? file : a)));
}
