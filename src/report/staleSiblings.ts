/**
 * Hidden siblings that atomic writes make beside their target: `.NAME.partial-PID-…` and
 * `.NAME.replaced-PID-…` folders (writeOutputs.ts), `.NAME.PID.tmp` files (atomicWrite.ts).
 * A writer that is killed cannot remove its own; the next writer of the same target removes
 * those whose process is gone, and says so.
 */
import { lstatSync, readdirSync, rmSync, unlinkSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';

let sequence = 0;

/** A fresh hidden sibling folder name for `target` carrying this process's id. */
export function siblingFolderName(target: string, tag: 'partial' | 'replaced'): string {
  return join(dirname(target), `.${basename(target)}.${tag}-${process.pid}-${Date.now()}-${sequence++}`);
}

/** The hidden temporary file name for `target` carrying this process's id. */
export function siblingFileName(target: string): string {
  return join(dirname(target), `.${basename(target)}.${process.pid}.tmp`);
}

function escapeRegExp(text: string): string {
  return text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
}

/** False only when no process with this id exists (another user's live process counts as alive). */
export function processIsAlive(pid: number): boolean {
  if (pid === process.pid) return true;
  try {
    process.kill(pid, 0);
    return true;
  } catch (e) {
    return (e as NodeJS.ErrnoException).code !== 'ESRCH';
  }
}

/** Stderr line by default; tests pass their own. */
export type Notify = (line: string) => void;
export const notifyOnStderr: Notify = (line) => {
  process.stderr.write(`stanchion: ${line}\n`);
};

/**
 * Remove the siblings of `target` left by writers that are gone (never a live writer's), without
 * following links. Returns their names and reports them in one line.
 */
export function removeStaleSiblings(target: string, notify: Notify = notifyOnStderr): string[] {
  const folder = dirname(target);
  const pattern = new RegExp(`^\\.${escapeRegExp(basename(target))}\\.(?:(?:partial|replaced)-(\\d+)-\\d+-\\d+|(\\d+)\\.tmp)$`);
  let names: string[];
  try {
    names = readdirSync(folder);
  } catch {
    return [];
  }
  const removed: string[] = [];
  for (const name of names) {
    const m = pattern.exec(name);
    if (m === null) continue;
    const pid = Number(m[1] ?? m[2]);
    if (!Number.isSafeInteger(pid) || processIsAlive(pid)) continue;
    const path = join(folder, name);
    try {
      if (lstatSync(path).isDirectory()) rmSync(path, { recursive: true, force: true });
      else unlinkSync(path); // a file or a link: the link itself, never its target
      removed.push(name);
    } catch {
      /* gone meanwhile or not ours to remove: leave it */
    }
  }
  if (removed.length > 0) {
    const shown = removed.length > 3 ? `${removed.slice(0, 3).join(', ')} and ${removed.length - 3} more` : removed.join(', ');
    notify(`removed ${removed.length} unfinished output${removed.length > 1 ? 's' : ''} left in ${folder} by an interrupted run (${shown})`);
  }
  return removed;
}
