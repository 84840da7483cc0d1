import { describe, expect, test } from 'vitest';
import { maximumOver } from '../../src/loads/maximumOverDistribution.js';
import type { Distribution } from '../../src/probability/distribution.js';
import { GumbelDistribution } from '../../src/probability/gumbelDist.js';
import { makeDistribution } from '../../src/probability/makeDistribution.js';
import { normalCdf, normalQuantile } from '../../src/probability/normal.js';
import { betaOverPeriods, powerOfNormalCdf } from '../../src/probability/logProbability.js';


/** The same Gumbel, hidden behind a plain object so maximumOver takes its general path. */
function opaque(d: Distribution): Distribution {
  return {
    name: d.name,
    mean: d.mean,
    sd: d.sd,
    params: d.params,
    pdf: (x) => d.pdf(x),
    cdf: (x) => d.cdf(x),
    sf: (x) => d.sf(x),
    quantile: (p) => d.quantile(p),
    fromStandardNormal: (u) => d.fromStandardNormal(u),
    toStandardNormal: (x) => d.toStandardNormal(x),
  };
}

describe('maximum over n periods', () => {
  test('a Gumbel keeps its scale; its location moves by scale·ln n', () => {
    // source: Gumbel, Statistics of Extremes (1958): the largest of n Gumbel values is Gumbel, u_n = u + ln(n)/α
    const annual = GumbelDistribution.fromMoments(140e3, 0.35 * 140e3);
    const fifty = maximumOver(annual, 50) as GumbelDistribution;
    expect(fifty).toBeInstanceOf(GumbelDistribution);
    expect(fifty.scale).toBe(annual.scale);
    expect(fifty.loc).toBeCloseTo(annual.loc + annual.scale * Math.log(50), 6);
    // common practice: the 50-year mean is μ1 + (√6/π)·ln 50·σ1 ≈ μ1 + 3.05 σ1
    expect((fifty.mean - annual.mean) / annual.sd).toBeCloseTo((Math.sqrt(6) / Math.PI) * Math.log(50), 10);
    expect(fifty.sd).toBeCloseTo(annual.sd, 6);
  });

  test('n = 1 is the stated distribution itself (bit-identical results)', () => {
    // common practice: a conversion by a factor of one changes nothing
    const d = makeDistribution({ dist: 'lognormal', mean: 100, cov: 0.2 });
    expect(maximumOver(d, 1)).toBe(d);
  });

  test('the general path F^n reproduces the Gumbel closed form, both tails included', () => {
    // source: Gumbel (1958) max-stability, as above; the general path is x = F⁻¹(Φ(u)^(1/n))
    const annual = GumbelDistribution.fromMoments(60e3, 0.3 * 60e3);
    for (const n of [50, 1 / 50, 7.5]) {
      const exact = maximumOver(annual, n);
      const general = maximumOver(opaque(annual), n);
      // n < 1 pushes the far lower tail below double precision (Φ(−8)^50 ≈ 1e-764): checked from −4 up
      for (const u of (n < 1 ? [-4] : [-8, -5]).concat([-2, -0.3, 0, 0.4, 2, 5, 8, 9])) {
        expect(general.fromStandardNormal(u)).toBeCloseTo(exact.fromStandardNormal(u), 6);
        const x = exact.fromStandardNormal(u);
        expect(general.toStandardNormal(x)).toBeCloseTo(u, 7);
        expect(general.sf(x) / exact.sf(x)).toBeCloseTo(1, 9);
        expect(general.pdf(x) / exact.pdf(x)).toBeCloseTo(1, 9);
      }
      expect(general.mean / exact.mean).toBeCloseTo(1, 6); // n < 1: the clamped far lower tail costs ~1e-7
      expect(general.sd / exact.sd).toBeCloseTo(1, 6);
      expect(general.quantile(0.3)).toBeCloseTo(exact.quantile(0.3), 6);
      expect(Number.isFinite(general.fromStandardNormal(-12))).toBe(true);
      expect(general.fromStandardNormal(-12)).toBeLessThanOrEqual(general.fromStandardNormal(-4));
    }
  });

  test('normal parent: cdf is Φ(z)^n exactly and the far upper tail keeps its digits', () => {
    // common practice: P(max of n ≤ x) = F(x)^n for independent periods
    const d = maximumOver(makeDistribution({ dist: 'normal', mean: 10, sd: 2 }), 10);
    expect(d.cdf(13)).toBeCloseTo(normalCdf(1.5) ** 10, 14);
    const x = d.fromStandardNormal(8);
    // sf = 1 − Φ(z)^10 ≈ 10·Φ(−z) where Φ(−8) is far below double-precision 1 − ε
    expect(d.sf(x) / normalCdf(-8)).toBeCloseTo(1, 8);
    expect(x).toBeGreaterThan(10 + 2 * 8 - 1);
  });
});

describe('reliability index over a period', () => {
  test('β = 4.7 for one year is about 3.8 for 50 years', () => {
    // source: EN 1990:2002 Table B2, RC2 (4.7 for 1 year, 3.8 for 50 years), related by Annex C eq. C.3
    expect(Math.abs(betaOverPeriods(4.7, 50) - 3.8)).toBeLessThan(0.05);
    // Table B2's RC1/RC3 pairs (4.2/3.3, 5.2/4.3) are rounded and deviate by ~0.1 from C.3: not checked here.
    for (const annual of [4.2, 4.7, 5.2]) expect(betaOverPeriods(betaOverPeriods(annual, 50), 1 / 50)).toBeCloseTo(annual, 10);
  });

  test('large β are converted on log-probabilities, not by powering Φ(β)', () => {
    // common practice: for small pf, pf over n periods ≈ n·pf (union of rare independent events)
    expect(betaOverPeriods(8, 50)).toBeCloseTo(-normalQuantile(50 * normalCdf(-8)), 8);
    expect(powerOfNormalCdf(3, 1)).toBe(3);
  });
});
