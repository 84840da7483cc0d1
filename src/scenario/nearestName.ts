/** "Did you mean ...?" for a mistyped key or value: the closest name by edit distance. */

export function editDistance(a: string, b: string): number {
  if (a.length > 64 || b.length > 64) return Math.abs(a.length - b.length) + Math.min(a.length, b.length);
  const row = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    let diagonal = row[0]!;
    row[0] = i;
    for (let j = 1; j <= b.length; j++) {
      const above = row[j]!;
      const cost = a[i - 1]!.toLowerCase() === b[j - 1]!.toLowerCase() ? 0 : 1;
      row[j] = Math.min(above + 1, row[j - 1]! + 1, diagonal + cost);
      diagonal = above;
    }
  }
  return row[b.length]!;
}

/** The closest candidate when it is close enough to be a likely typo, else undefined. */
export function nearestName(word: string, candidates: readonly string[]): string | undefined {
  let best: string | undefined;
  let bestDistance = Infinity;
  for (const c of candidates) {
    const d = editDistance(word, c);
    if (d < bestDistance) {
      best = c;
      bestDistance = d;
    }
  }
  const allowed = word.length <= 3 ? 1 : Math.max(2, Math.floor(word.length / 3));
  return bestDistance <= allowed ? best : undefined;
}

/** ` (did you mean 'rotation'?)` or ''. */
export function didYouMean(word: string, candidates: readonly string[]): string {
  const near = nearestName(word, candidates);
  return near === undefined ? '' : ` (did you mean '${near}'?)`;
}
