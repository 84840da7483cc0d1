/** Percentile of sorted data by linear interpolation between order statistics (Hyndman & Fan type 7). */
export function sortedPercentile(sorted: Float64Array, p: number): number {
  const n = sorted.length;
  if (n === 0) throw new Error('percentile of no data');
  const h = (n - 1) * p;
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, n - 1);
  return sorted[lo] + (h - lo) * (sorted[hi] - sorted[lo]);
}
