import { describe, expect, it } from 'vitest';
import { zeroFailureBound } from '../../src/reliability/zeroFailureBound.js';

describe('zero-failure Monte Carlo bound', () => {
  it('is the exact binomial bound 1 − 0.05^(1/n), close to the rule of three', () => {
    // source: Clopper & Pearson, Biometrika 26 (1934): (1 − p)^n = 0.05 with no failure
    const b = zeroFailureBound(2e6);
    expect(Math.pow(1 - b.pf, 2e6)).toBeCloseTo(0.05, 10);
    // source: Hanley & Lippman-Hand, JAMA 249 (1983) 1743: the upper 95 % limit is about 3/n
    expect(b.pf * 2e6).toBeCloseTo(2.996, 3);
    // Φ(−4.67) = 1.5×10⁻⁶ (from memory, standard normal tables); the printed example pf < 1.5×10⁻⁶, β > 4.67
    expect(b.pf.toExponential(1)).toBe('1.5e-6');
    expect(b.beta.toFixed(2)).toBe('4.67');
  });

  it('is exact for one sample and refuses nonsense', () => {
    expect(zeroFailureBound(1).pf).toBeCloseTo(0.95, 12);
    expect(() => zeroFailureBound(0)).toThrow(RangeError);
    expect(() => zeroFailureBound(10, 1)).toThrow(RangeError);
  });
});
