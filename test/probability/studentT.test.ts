import { describe, expect, it } from 'vitest';
import jstatModule from 'jstat';
import { makeDistribution } from '../../src/probability/makeDistribution.js';
import { normalCdf } from '../../src/probability/normal.js';
import { studentTCdf, studentTPdf, studentTQuantile, studentTQuantileUpper, studentTSf } from '../../src/probability/studentTDist.js';

const jStat = jstatModule.jStat ?? jstatModule;
const relErr = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('Student-t CDF and quantile', () => {
  it('agree with jstat in both tails (independent implementation; common practice)', () => {
    for (const nu of [1, 2, 3.5, 7, 29, 200]) {
      for (const t of [-30, -8, -3, -1.2, -0.1, 0, 0.4, 2, 6, 25]) {
        expect(relErr(studentTCdf(t, nu), jStat.studentt.cdf(t, nu))).toBeLessThan(1e-7);
        // jstat's log-gamma is good to ~1e-8 only; the exact densities for ν = 1, 2 are checked below
        expect(relErr(studentTPdf(t, nu), jStat.studentt.pdf(t, nu))).toBeLessThan(2e-7);
      }
      for (const p of [1e-6, 1e-3, 0.05, 0.3, 0.5, 0.8, 0.95, 0.999]) {
        const ours = studentTQuantile(p, nu);
        const theirs = jStat.studentt.inv(p, nu);
        expect(Math.abs(ours - theirs)).toBeLessThan(1e-6 * Math.max(1, Math.abs(theirs)));
      }
    }
  });

  it('match the closed forms for ν = 1 and ν = 2 far out in both tails (Abramowitz & Stegun 26.7.3-26.7.4)', () => {
    // ν = 1: F(t) = ½ + arctan(t)/π, so P(T ≤ −t) = arctan(1/t)/π for t > 0
    // ν = 2: F(t) = ½ + t / (2√(2 + t²)), so P(T ≤ −t) = (√(2+t²) − t)/(2√(2+t²)) = 1/(√(2+t²)(√(2+t²) + t))
    for (const t of [1, 10, 1e3, 1e6, 1e12]) {
      expect(relErr(studentTPdf(t, 1), 1 / (Math.PI * (1 + t * t)))).toBeLessThan(1e-13);
      expect(relErr(studentTPdf(-t, 2), (2 + t * t) ** -1.5)).toBeLessThan(1e-13);
      expect(relErr(studentTCdf(-t, 1), Math.atan(1 / t) / Math.PI)).toBeLessThan(1e-12);
      expect(relErr(studentTSf(t, 1), Math.atan(1 / t) / Math.PI)).toBeLessThan(1e-12);
      const r = Math.sqrt(2 + t * t);
      expect(relErr(studentTCdf(-t, 2), 1 / (r * (r + t)))).toBeLessThan(1e-12);
      // quantile back from a tail probability
      expect(relErr(studentTQuantileUpper(Math.atan(1 / t) / Math.PI, 1), t)).toBeLessThan(1e-9);
    }
  });

  it('tends to the standard normal as ν grows (common practice)', () => {
    for (const t of [-4, -1, 0.5, 3]) expect(Math.abs(studentTCdf(t, 1e7) - normalCdf(t))).toBeLessThan(1e-7);
  });

  it('inverts itself: F(F⁻¹(p)) = p from 1e-200 to 1 − 1e-12', () => {
    for (const nu of [2, 5, 40]) {
      for (const p of [1e-200, 1e-40, 1e-9, 0.01, 0.25, 0.49, 0.5, 0.51, 0.9, 1 - 1e-12]) {
        const t = studentTQuantile(p, nu);
        const back = p <= 0.5 ? studentTCdf(t, nu) : 1 - studentTSf(t, nu);
        expect(relErr(back, p)).toBeLessThan(1e-9);
      }
    }
  });
});

describe('studentt and logstudentt distributions', () => {
  const t = makeDistribution({ dist: 'studentt', loc: 300e6, scale: 20e6, dof: 4 });
  const lt = makeDistribution({ dist: 'logstudentt', loc: Math.log(300e6), scale: 0.07, dof: 4 });

  it('map u to x and back in both tails, finite for every finite u', () => {
    // ln X with ν = 4 reaches exp(10⁷⁵) near u = 37, beyond the doubles: the round trip is checked to |u| = 8
    for (const [d, us] of [[t, [-37, -8, -1.5, 0, 0.7, 5, 37]], [lt, [-8, -1.5, 0, 0.7, 5, 8]]] as const) {
      for (const u of us) {
        const x = d.fromStandardNormal(u);
        expect(Number.isFinite(x)).toBe(true);
        expect(Math.abs(d.toStandardNormal(x) - u)).toBeLessThan(1e-7 * Math.max(1, Math.abs(u)));
      }
      for (const u of [-1e4, -37, 37, 1e4]) expect(Number.isFinite(d.fromStandardNormal(u))).toBe(true);
    }
  });

  it('logstudentt is the exponential of a shifted, scaled t (definition)', () => {
    for (const p of [0.001, 0.05, 0.5, 0.97]) {
      expect(relErr(lt.quantile(p), Math.exp(Math.log(300e6) + 0.07 * jStat.studentt.inv(p, 4)))).toBeLessThan(1e-8);
    }
    expect(lt.cdf(-1)).toBe(0);
    expect(lt.sf(0)).toBe(1);
  });

  it('sd is scale·√(ν/(ν − 2)) and infinite for ν <= 2 (common practice)', () => {
    expect(relErr(t.sd, 20e6 * Math.sqrt(2))).toBeLessThan(1e-15);
    expect(makeDistribution({ dist: 'studentt', loc: 0, scale: 1, dof: 2 }).sd).toBe(Infinity);
  });

  it('refuses bad parameters by name', () => {
    expect(() => makeDistribution({ dist: 'studentt', loc: 0, scale: 0, dof: 3 })).toThrow(/'scale'/);
    expect(() => makeDistribution({ dist: 'logstudentt', loc: 0, scale: 1, dof: -1 })).toThrow(/'dof'/);
    expect(() => makeDistribution({ dist: 'studentt', scale: 1, dof: 3 })).toThrow(/'loc'/);
  });
});
