/**
 * ∇g in u-space by finite differences. u is dimensionless (standard normal), so one absolute
 * step serves every component: central differences with h = 1e-5 balance truncation (h² g''')
 * against rounding (ε|g|/h); forward differences use h = 1e-7 and cost half the calls.
 */
export type DifferenceScheme = 'central' | 'forward';

export const DEFAULT_STEP: Record<DifferenceScheme, number> = { central: 1e-5, forward: 1e-7 };

/**
 * Writes ∇G(u) into `out`. `gAtU` = G(u), already known (used by forward differences).
 * `work` is a scratch vector of the same length. u is left unchanged.
 */
export function finiteDifferenceGradient(
  G: (u: Float64Array) => number,
  u: Float64Array,
  gAtU: number,
  scheme: DifferenceScheme,
  h: number,
  out: Float64Array,
  work: Float64Array,
): void {
  work.set(u);
  for (let i = 0; i < u.length; i++) {
    const ui = u[i];
    work[i] = ui + h;
    const up = G(work);
    if (scheme === 'central') {
      work[i] = ui - h;
      const down = G(work);
      out[i] = (up - down) / (2 * h);
    } else {
      out[i] = (up - gAtU) / h;
    }
    work[i] = ui;
  }
}
