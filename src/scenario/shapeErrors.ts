/**
 * Turns zod's issues into one InputError: the issue on the earliest line, with its field path.
 * For a union that failed, the branch that got furthest (matched the outer shape) explains
 * the problem; when none did, the union's own message does.
 */
import type * as z from 'zod';
import { InputError } from './inputError.js';
import { formatPath, lineOf, type PathSegment } from './rawTree.js';

interface Located {
  path: PathSegment[];
  message: string;
}

type Issue = z.core.$ZodIssue;

function toSegments(path: readonly PropertyKey[]): PathSegment[] {
  return path.map((p) => (typeof p === 'number' ? p : String(p)));
}

function shallowest(issues: readonly Issue[]): number {
  return issues.reduce((m, i) => Math.min(m, i.path.length), Infinity);
}

/** The issue that explains a failure, with the path made absolute. */
function explain(issue: Issue, base: PathSegment[]): Located {
  const path = [...base, ...toSegments(issue.path)];
  if (issue.code === 'invalid_union' && issue.errors.length > 0) {
    const branches = issue.errors;
    const depths = branches.map(shallowest);
    const deepest = Math.max(...depths);
    // Exactly one branch matched the outer shape: it explains. Several: ambiguous, the union's message does.
    if (deepest > 0 && Number.isFinite(deepest) && depths.filter((d) => d === deepest).length === 1) {
      const branch = branches[depths.indexOf(deepest)]!;
      return explain(branch[0]!, path);
    }
    const input = (issue as { input?: unknown }).input;
    if (typeof input === 'string') {
      // A string that matched the type of one branch but not its format: that branch knows why.
      const formatIssue = branches.flat().find((i) => i.path.length === 0 && i.code !== 'invalid_type' && i.code !== 'invalid_value' && i.code !== 'invalid_union');
      if (formatIssue !== undefined) return explain(formatIssue, path);
    }
  }
  if (issue.code === 'unrecognized_keys' && issue.keys.length > 0) {
    return { path: [...path, issue.keys[0]!], message: issue.message };
  }
  return { path, message: issue.message };
}

export function shapeError(issues: readonly Issue[], lines: ReadonlyMap<string, number>, rootName: string): InputError {
  // The earliest line wins; a field that is in the file (an unknown key, a bad value) wins over
  // one that is missing (which only has its parent's line), since a typo explains both.
  let best: (Located & { line: number | undefined; rank: number }) | undefined;
  for (const issue of issues) {
    const located = explain(issue, []);
    const line = lineOf(lines, located.path);
    const rank = (lines.has(formatPath(located.path)) ? 0 : 1e9) + (line ?? 1e8);
    if (best === undefined || rank < best.rank) best = { ...located, line, rank };
  }
  if (best === undefined) return new InputError(rootName, 'is not a valid scenario');
  const field = best.path.length === 0 ? rootName : formatPath(best.path);
  return new InputError(field, best.message, best.line);
}
