/** Plain-text tables for the terminal: columns padded to the widest cell, first column left-aligned. */
export function textTable(rows: string[][], indent = '  '): string {
  const widths: number[] = [];
  for (const row of rows) row.forEach((cell, i) => (widths[i] = Math.max(widths[i] ?? 0, [...cell].length)));
  return rows
    .map((row) =>
      indent +
      row
        .map((cell, i) => (i === row.length - 1 ? cell : cell + ' '.repeat(widths[i] - [...cell].length)))
        .join('   ')
        .trimEnd(),
    )
    .join('\n');
}

/** The caution every human-readable output ends with. */
export const CAUTION =
  'Caution: stanchion supports, and does not replace, the judgement of a licensed engineer. ' +
  'Local codes and licensed practice govern; results are only as good as the input statistics.';
