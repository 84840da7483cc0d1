import { describe, expect, it } from 'vitest';
import jstatModule from 'jstat';
import { gammaFunction, logBeta, logGamma } from '../../src/probability/logGamma.js';
import {
  invRegIncBeta,
  invRegIncBetaLower,
  logRegIncBeta,
  regIncBeta,
  regIncBetaComplement,
} from '../../src/probability/incompleteBeta.js';
import { gaussHermiteNormal } from '../../src/probability/gaussHermite.js';
import { findRootBracketed } from '../../src/probability/rootBracketed.js';

const jStat = jstatModule.jStat ?? jstatModule;
const relErr = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('logGamma', () => {
  it('matches exact values', () => {
    // source: Γ(n) = (n − 1)!, Γ(1/2) = √π, Γ(3/2) = √π/2 (textbook identities)
    expect(relErr(gammaFunction(5), 24)).toBeLessThan(1e-14);
    expect(relErr(gammaFunction(11), 3628800)).toBeLessThan(1e-14);
    expect(relErr(gammaFunction(0.5), Math.sqrt(Math.PI))).toBeLessThan(1e-14);
    expect(relErr(gammaFunction(1.5), Math.sqrt(Math.PI) / 2)).toBeLessThan(1e-14);
    expect(Math.abs(logGamma(1))).toBeLessThan(1e-15);
    expect(Math.abs(logGamma(2))).toBeLessThan(1e-15);
    // sum of ln k for k < 171 against ln Γ(171) = ln 170!
    let lnFact = 0;
    for (let k = 2; k <= 170; k++) lnFact += Math.log(k);
    expect(relErr(logGamma(171), lnFact)).toBeLessThan(1e-14);
  });

  it('satisfies Γ(x + 1) = x Γ(x) and agrees with jstat', () => {
    for (const x of [1e-3, 0.1, 0.37, 0.9, 1.3, 2.5, 7.7, 33.3, 120.5]) {
      expect(Math.abs(logGamma(x + 1) - logGamma(x) - Math.log(x))).toBeLessThan(1e-13 * Math.max(1, Math.abs(logGamma(x))));
      // common practice: cross-check with jstat's gammaln
      expect(Math.abs(logGamma(x) - (jStat.gammaln(x) as number))).toBeLessThan(1e-12 * Math.max(1, Math.abs(logGamma(x))));
    }
    expect(logGamma(0)).toBe(Infinity);
    expect(Number.isNaN(logGamma(-1))).toBe(true);
  });
});

describe('regularized incomplete beta', () => {
  it('matches closed forms', () => {
    // source: I_x(1, b) = 1 − (1 − x)^b, I_x(a, 1) = x^a, I_x(1/2, 1/2) = (2/π) asin √x (A&S 26.5)
    for (const x of [1e-12, 0.01, 0.3, 0.5, 0.8, 0.999]) {
      expect(relErr(regIncBeta(x, 1 - x, 1, 3.5), -Math.expm1(3.5 * Math.log1p(-x)))).toBeLessThan(1e-13);
      expect(relErr(regIncBeta(x, 1 - x, 2.5, 1), Math.pow(x, 2.5))).toBeLessThan(1e-13);
      expect(relErr(regIncBeta(x, 1 - x, 0.5, 0.5), (2 / Math.PI) * Math.asin(Math.sqrt(x)))).toBeLessThan(1e-13);
      expect(relErr(regIncBetaComplement(x, 1 - x, 2.5, 1), -Math.expm1(2.5 * Math.log(x)))).toBeLessThan(1e-13);
    }
  });

  it('matches exact binomial sums for integer parameters', () => {
    // source: I_x(a, b) = P(Binomial(a + b − 1, x) ≥ a) for integer a, b (A&S 26.5.24)
    const binomialUpper = (n: number, k: number, x: number) => {
      let total = 0;
      let logChoose = 0; // ln C(n, 0)
      for (let j = 0; j <= n; j++) {
        if (j > 0) logChoose += Math.log((n - j + 1) / j);
        if (j >= k) total += Math.exp(logChoose + j * Math.log(x) + (n - j) * Math.log1p(-x));
      }
      return total;
    };
    for (const [a, b] of [[2, 3], [6, 14], [30, 12], [1, 9]]) {
      for (let x = 0.01; x < 0.6; x += 0.049) {
        expect(relErr(regIncBeta(x, 1 - x, a, b), binomialUpper(a + b - 1, a, x))).toBeLessThan(1e-13);
      }
    }
  });

  it('matches high-precision values for non-integer parameters, both tails', () => {
    // source: mpmath 1.3.0 betainc(a, b, 0, x, regularized=True) at 30 digits, computed while writing this test
    const cases: [number, number, number, number, number][] = [
      [0.7, 5, 0.304, 0.90041967143003335, 0.099580328569966655],
      [0.3, 0.4, 0.5, 0.57849178904433771, 0.42150821095566229],
      [2.5, 7.5, 1e-6, 5.835149607730016e-14, 0.99999999999994165],
      [0.7, 5, 1e-10, 3.3258374994522183e-7, 0.99999966741625005],
      [12.5, 3.25, 0.99, 0.99983134089997628, 0.00016865910002372443],
    ];
    for (const [a, b, x, lower, upper] of cases) {
      expect(relErr(regIncBeta(x, 1 - x, a, b), lower)).toBeLessThan(1e-13);
      expect(relErr(regIncBetaComplement(x, 1 - x, a, b), upper)).toBeLessThan(1e-12);
    }
  });

  it('agrees with jstat (to its accuracy) and sums with its complement to 1', () => {
    // common practice: cross-check with jstat's ibeta (which is itself good to only ~1e-8)
    for (const [a, b] of [[2, 3], [0.7, 5], [30, 12], [6, 14], [0.3, 0.4]]) {
      for (let x = 0.01; x < 1; x += 0.049) {
        const ours = regIncBeta(x, 1 - x, a, b);
        expect(Math.abs(ours - (jStat.ibeta(x, a, b) as number))).toBeLessThan(1e-7);
        expect(Math.abs(ours + regIncBetaComplement(x, 1 - x, a, b) - 1)).toBeLessThan(1e-14);
        expect(Math.abs(Math.log(ours) - logRegIncBeta(x, 1 - x, a, b))).toBeLessThan(1e-12);
      }
    }
  });

  it('inverts in both tails', () => {
    // the first guess differs for a, b ≥ 1 (A&S 26.5.22) and otherwise (tail power laws): both kinds, and extremes
    for (const [a, b] of [[2, 3], [0.7, 5], [30, 12], [6, 14], [0.3, 0.4], [500, 2], [1, 1], [1, 1000], [1000, 1], [0.05, 0.05], [5.06, 5.06], [1.2, 1.5], [2000, 3000], [0.1, 20]]) {
      for (const p of [1e-300, 1e-100, 1e-20, 1e-8, 1e-3, 0.01, 0.07, 0.2, 0.35, 0.49, 0.5]) {
        const x = invRegIncBetaLower(p, a, b);
        if (x === 0) continue; // quantile below the smallest double
        expect(relErr(regIncBeta(x, 1 - x, a, b), p)).toBeLessThan(1e-12);
        // upper tail through the (b, a) complement: 1 − y solves I_{1−y}(b, a) = p
        const yc = invRegIncBetaLower(p, b, a);
        expect(relErr(regIncBetaComplement(1 - yc, yc, a, b), p)).toBeLessThan(1e-12);
      }
      // 1 − y cannot carry x within 1e-16 of 1 (a or b near 0): the beta distribution takes the complement itself
      if (Math.min(a, b) < 0.1) continue;
      for (const p of [0.6, 0.9, 0.999]) {
        const x = invRegIncBeta(p, a, b);
        expect(Math.abs(regIncBeta(x, 1 - x, a, b) - p)).toBeLessThan(1e-13);
      }
    }
    expect(logBeta(2, 3)).toBeCloseTo(Math.log(1 / 12), 14); // source: B(2,3) = 1!2!/4! = 1/12
  });
});

describe('Gauss–Hermite rule for N(0,1)', () => {
  it('integrates normal moments exactly up to degree 2n − 1', () => {
    const { nodes, weights } = gaussHermiteNormal(64);
    // source: E[U^{2k}] = (2k − 1)!! for U ~ N(0,1)
    const moments = [1, 1, 3, 15, 105, 945, 10395];
    for (let k = 0; k < moments.length; k++) {
      let s = 0;
      for (let i = 0; i < 64; i++) s += weights[i] * nodes[i] ** (2 * k);
      expect(relErr(s, moments[k])).toBeLessThan(1e-13);
    }
    // source: E[exp(tU)] = exp(t²/2)
    let mgf = 0;
    for (let i = 0; i < 64; i++) mgf += weights[i] * Math.exp(0.5 * nodes[i]);
    expect(relErr(mgf, Math.exp(0.125))).toBeLessThan(1e-14);
    const small = gaussHermiteNormal(3);
    // source: 3-point rule nodes 0, ±√3, weights 2/3, 1/6 (probabilists' Hermite He₃ = u³ − 3u)
    expect(Array.from(small.nodes).map((v) => +v.toFixed(12))).toEqual([-+Math.sqrt(3).toFixed(12), 0, +Math.sqrt(3).toFixed(12)]);
    expect(small.weights[1]).toBeCloseTo(2 / 3, 14);
    expect(small.weights[0]).toBeCloseTo(1 / 6, 14);
  });
});

describe('findRootBracketed (Brent)', () => {
  it('finds roots and refuses a bracket without a sign change', () => {
    expect(findRootBracketed((x) => x * x - 2, 0, 2)).toBeCloseTo(Math.SQRT2, 15);
    expect(findRootBracketed((x) => Math.cos(x) - x, 0, 1)).toBeCloseTo(0.7390851332151607, 14); // from memory: Dottie number
    expect(() => findRootBracketed((x) => x * x + 1, -1, 1)).toThrow(/no sign change/);
  });
});
