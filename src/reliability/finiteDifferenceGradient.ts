/**
 * ∇g in u-space by finite differences. u is dimensionless (standard normal), so one absolute
 * step serves every component: central differences with h = 1e-5 balance truncation (h² g''')
 * against rounding (ε|g|/h); forward differences use h = 3e-7 (rounding ε|g|/h stays near 1e-10 of the gradient of a
 * column limit state; truncation h·g'' moves α by about 3e-7 and β, stationary there, by its
 * square) and cost half the calls.
 */
export type DifferenceScheme = 'central' | 'forward';

export const DEFAULT_STEP: Record<DifferenceScheme, number> = { central: 1e-5, forward: 3e-7 };

/**
 * Writes ∇G(u) into `out`. `gAtU` = G(u), already known (used by forward differences).
 * `work` is a scratch vector of the same length. u is left unchanged.
 * With `sides`, also writes the one-sided differences: forward into sides[i], backward into
 * sides[n + i] (NaN for the forward scheme, which has no backward point). They cost nothing
 * extra with central differences and tell a kink (|u_i|-like effect) from a smooth slope.
 */
export function finiteDifferenceGradient(
  G: (u: Float64Array) => number,
  u: Float64Array,
  gAtU: number,
  scheme: DifferenceScheme,
  h: number,
  out: Float64Array,
  work: Float64Array,
  sides?: Float64Array,
): void {
  const n = u.length;
  work.set(u);
  for (let i = 0; i < u.length; i++) {
    const ui = u[i];
    work[i] = ui + h;
    // the step actually taken: ui + h is rounded, and dividing by h would add that rounding
    const hUp = work[i] - ui;
    const up = G(work);
    if (scheme === 'central') {
      work[i] = ui - h;
      const hDown = ui - work[i];
      const down = G(work);
      out[i] = (up - down) / (hUp + hDown);
      if (sides) {
        sides[i] = (up - gAtU) / hUp;
        sides[n + i] = (gAtU - down) / hDown;
      }
    } else {
      out[i] = (up - gAtU) / hUp;
      if (sides) {
        sides[i] = out[i];
        sides[n + i] = Number.NaN;
      }
    }
    work[i] = ui;
  }
}

/**
 * Components whose one-sided differences do not agree in sign, a zero among them: the gradient
 * vanishes or has a kink there (an effect symmetric in u_i, such as that of |u_i|), so a search
 * that follows ∇g cannot tell which way along u_i the failure lies.
 */
export function doubtfulComponents(sides: Float64Array): number[] {
  const n = sides.length / 2;
  const out: number[] = [];
  for (let i = 0; i < n; i++) {
    const f = sides[i];
    const b = sides[n + i];
    if (!(f * b > 0)) out.push(i);
  }
  return out;
}
