/**
 * Where a swept β crosses the target: linear interpolation between neighbouring cases along
 * one varied value. A case exactly on the target counts once; a flat stretch on it, at its ends.
 */
export function targetCrossings(values: readonly number[], betas: readonly number[], target: number): number[] {
  const order = values.map((_, i) => i).filter((i) => Number.isFinite(values[i]) && Number.isFinite(betas[i])).sort((i, j) => values[i] - values[j]);
  const out: number[] = [];
  const push = (x: number) => {
    if (out.length === 0 || Math.abs(out[out.length - 1] - x) > 1e-12 * Math.max(1, Math.abs(x))) out.push(x);
  };
  for (let k = 0; k + 1 < order.length; k++) {
    const x0 = values[order[k]];
    const x1 = values[order[k + 1]];
    const d0 = betas[order[k]] - target;
    const d1 = betas[order[k + 1]] - target;
    if (d0 === 0) push(x0);
    if (d0 !== 0 && d1 !== 0 && d0 < 0 !== d1 < 0 && x1 !== x0) push(x0 + ((x1 - x0) * d0) / (d0 - d1));
    if (d1 === 0 && k + 2 === order.length) push(x1);
  }
  return out;
}
