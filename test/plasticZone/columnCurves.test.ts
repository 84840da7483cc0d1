import { describe, expect, it } from 'vitest';
import { CURVE_CASES, curveComparison } from '../../src/plasticZone/curveComparison.js';

/**
 * The European column curves (EN 1993-1-1:2005 §6.3.1.2, Eq. 6.49, α of Table 6.1, curve by
 * Table 6.2) were fitted to plastic-zone simulations of pinned columns with a bow of L/1000 and the
 * ECCS residual stresses (ECCS 1976; Beer & Schulz 1970), placed at a lower fractile of them: a
 * single section's simulation may lie a few per cent above its curve, hardly below it.
 * Bands (ratio χ_model / χ_curve), as measured and tabulated in docs/plastic-zone.md §4:
 * rolled and hot-finished hollow 0.97 … 1.09; welded 0.92 … 1.13 (the welded pattern of
 * residualStress.ts is an idealisation; its 0.25 fy compression sits below the curve at
 * λ̄ 0.5–0.8 and above it for slender columns).
 */
const LAMBDA_BARS = [0.2, 0.5, 1.0, 1.5, 2.0];

describe('plastic-zone model against the EN 1993-1-1 column curves', () => {
  it.each(CURVE_CASES.map((c) => [c.name, c] as const))('%s', (_, c) => {
    const [lo, hi] = c.family === 'welded' ? [0.92, 1.13] : [0.97, 1.09];
    for (const p of curveComparison(c, LAMBDA_BARS)) {
      const ratio = p.chiModel / p.chiCurve;
      expect(ratio, `λ̄ = ${p.lambdaBar}`).toBeGreaterThan(lo);
      expect(ratio, `λ̄ = ${p.lambdaBar}`).toBeLessThan(hi);
    }
  });

  it('the residual stresses matter: without them an I section about z-z is clearly stronger at λ̄ = 1', () => {
    const c = CURVE_CASES.find((x) => x.name === 'HEB 300 rolled, z-z')!;
    const withRs = curveComparison(c, [1])[0].chiModel;
    const without = curveComparison({ ...c, family: 'hollow' }, [1])[0].chiModel;
    expect(without / withRs).toBeGreaterThan(1.1);
  });
});
