/**
 * Notes of the rows that have a value, each once with the names it concerns: 'note (a, b)'. For the
 * β-by-strength-model table, where one remark (how a corroded zone is treated) applies to several models.
 */
export function groupedNotes(rows: readonly { strength: string; beta: number | null; note?: string }[]): string[] {
  const by = new Map<string, string[]>();
  for (const r of rows) if (r.beta !== null && r.note !== undefined) by.set(r.note, [...(by.get(r.note) ?? []), r.strength]);
  return [...by].map(([note, models]) => `${note} (${models.join(', ')})`);
}
