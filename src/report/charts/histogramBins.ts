/** Equal-width bins over a common range, as probability density, for overlaid histograms. */

export interface Bin {
  x0: number;
  x1: number;
  density: number; // fraction of the samples per unit of x
}

/** Bins of `values` on [lo, hi) in `count` equal steps; values outside are dropped. */
export function histogramBins(values: ArrayLike<number>, lo: number, hi: number, count: number): Bin[] {
  if (!(hi > lo) || count < 1) throw new Error(`histogramBins: bad range [${lo}, ${hi}) or count ${count}`);
  const width = (hi - lo) / count;
  const counts = new Float64Array(count);
  for (let i = 0; i < values.length; i++) {
    const k = Math.floor((values[i] - lo) / width);
    if (k >= 0 && k < count) counts[k] += 1;
    else if (values[i] === hi) counts[count - 1] += 1;
  }
  const n = Math.max(1, values.length);
  return Array.from(counts, (c, k) => ({ x0: lo + k * width, x1: lo + (k + 1) * width, density: c / (n * width) }));
}

/** The p-quantile of a sample (nearest rank on a sorted copy). */
export function sampleQuantile(values: ArrayLike<number>, p: number): number {
  const sorted = Float64Array.from(values).sort();
  const k = Math.min(sorted.length - 1, Math.max(0, Math.round(p * (sorted.length - 1))));
  return sorted[k];
}
