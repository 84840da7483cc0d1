/**
 * The low and high probability levels shared by the one-at-a-time studies (tornado and
 * conditional β): 5 % and 95 % unless told otherwise (docs/json-output.md).
 */
export interface QuantileLevels {
  lowQ?: number;
  highQ?: number;
}

export function checkedLevels(opts: QuantileLevels | undefined): { lowQ: number; highQ: number } {
  const lowQ = opts?.lowQ ?? 0.05;
  const highQ = opts?.highQ ?? 0.95;
  if (!(lowQ > 0 && lowQ < highQ && highQ < 1)) {
    throw new Error(`quantile levels must satisfy 0 < lowQ < highQ < 1, got ${lowQ}, ${highQ}`);
  }
  return { lowQ, highQ };
}

export function checkSameLength(names: readonly string[], other: { length: number }, what: string): void {
  if (names.length !== other.length) {
    throw new Error(`${names.length} names but ${other.length} ${what}`);
  }
}

/** Stable sort by swing, largest first (ties keep the input order). */
export function bySwingDescending<T extends { swing: number }>(entries: T[]): T[] {
  return entries
    .map((entry, order) => ({ entry, order }))
    .sort((a, b) => b.entry.swing - a.entry.swing || a.order - b.order)
    .map((item) => item.entry);
}
