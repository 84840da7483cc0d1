/**
 * Readable names for variables: the description of the Inputs table in place of the dotted
 * path, which only the Inputs table shows (beside its description).
 */
import type { ReportInput, TornadoRow } from './reportInput.js';

/** path → description; a path the inputs do not list is shown as it is. */
export function variableNamer(input: Pick<ReportInput, 'inputs'>): (path: string) => string {
  const byPath = new Map(input.inputs.map((r) => [r.path, r.description]));
  return (path) => byPath.get(path) ?? path;
}

/** Tornado rows under readable names, with rows that move nothing dropped (and counted). */
export function namedTornadoRows(input: Pick<ReportInput, 'inputs'>, rows: readonly TornadoRow[], baseline: number): { rows: TornadoRow[]; dropped: string[] } {
  const name = variableNamer(input);
  const tol = 1e-9 * Math.max(1, Math.abs(baseline));
  const moves = (r: TornadoRow) => Math.abs(r.low - baseline) > tol || Math.abs(r.high - baseline) > tol;
  return {
    rows: rows.filter(moves).map((r) => ({ ...r, variable: name(r.variable) })),
    dropped: rows.filter((r) => !moves(r)).map((r) => name(r.variable)),
  };
}

/** One sentence about the variables a tornado leaves out, or nothing. */
export function droppedNote(dropped: readonly string[], what: string): string[] {
  if (dropped.length === 0) return [];
  return [`Not shown (no effect on the ${what}): ${dropped.join(', ')}.`];
}
