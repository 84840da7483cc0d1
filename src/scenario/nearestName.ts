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

/**
 * Words of the trade for the same thing, mapped to this tool's name. Spelling distance alone
 * gets these wrong: `unbraced` is one letter pair from `braced`, which means the opposite.
 * Keys are written in the folded form of `foldWord`.
 */
const TRADE_SYNONYMS: Readonly<Record<string, string>> = {
  unbraced: 'sway',
  swayframe: 'sway',
  sidesway: 'sway',
  swaypermitted: 'sway',
  momentframe: 'sway',
  momentresisting: 'sway',
  nonsway: 'braced',
  nosway: 'braced',
  swayprevented: 'braced',
  braceframe: 'braced',
  bracedframe: 'braced',
  clamped: 'fixed',
  encastre: 'fixed',
  builtin: 'fixed',
  rigid: 'fixed',
  fix: 'fixed',
  pin: 'pinned',
  pined: 'pinned',
  hinge: 'pinned',
  hinged: 'pinned',
  simplysupported: 'pinned',
  spring: 'rotation',
  semirigid: 'rotation',
  rotationalspring: 'rotation',
  stiffness: 'rotation',
};

/** Case, spaces, hyphens and underscores do not matter to a synonym. */
function foldWord(word: string): string {
  return word.toLowerCase().replace(/[\s_-]+/g, '');
}

/** The closest candidate when it is close enough to be a likely typo, else undefined. */
export function nearestName(word: string, candidates: readonly string[]): string | undefined {
  const synonym = TRADE_SYNONYMS[foldWord(word)];
  if (synonym !== undefined && Object.prototype.hasOwnProperty.call(TRADE_SYNONYMS, foldWord(word)) && candidates.includes(synonym)) {
    return synonym;
  }
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
