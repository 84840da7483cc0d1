import { describe, expect, it } from 'vitest';
import {
  METRE_PER_FOOT,
  METRE_PER_INCH,
  NEWTON_PER_KIP,
  NEWTON_PER_LBF,
  PASCAL_PER_KSI,
  displayUnit,
  displayUnitFor,
  formatBeta,
  formatNumber,
  formatProbability,
  formatQuantity,
  fromDisplay,
  toDisplay,
} from '../../src/report/displayUnits.js';

/** Relative agreement to the number of significant figures a table prints. */
function closeTo7(actual: number, expected: number): void {
  expect(Math.abs(actual - expected) / Math.abs(expected)).toBeLessThan(5e-7);
}

describe('exact conversion factors', () => {
  it('defines the inch, foot and pound-force exactly', () => {
    // source: international yard and pound agreement (1959): 1 yd = 0.9144 m, so 1 in = 0.0254 m, 1 ft = 0.3048 m
    expect(METRE_PER_INCH).toBe(0.0254);
    expect(METRE_PER_FOOT).toBeCloseTo(0.3048, 15);
    // source: 1959 agreement 1 lb = 0.45359237 kg; standard gravity 9.80665 m/s² (3rd CGPM, 1901)
    expect(Math.abs(NEWTON_PER_LBF - 0.45359237 * 9.80665)).toBeLessThan(1e-14);
  });

  it('matches the NIST SP 811 conversion table', () => {
    // from memory: NIST SP 811 (2008) Appendix B.8, pound-force 4.448 222 E+00 N, kip 4.448 222 E+03 N
    closeTo7(NEWTON_PER_LBF, 4.448222);
    closeTo7(NEWTON_PER_KIP, 4.448222e3);
    // from memory: NIST SP 811 (2008) Appendix B.8, psi 6.894 757 E+03 Pa, ksi 6.894 757 E+06 Pa
    closeTo7(PASCAL_PER_KSI, 6.894757e6);
    // from memory: NIST SP 811 (2008) Appendix B.8, in² 6.4516 E-04 m² (exact), in³ 1.638 706 E-05 m³, in⁴ 4.162 314 E-07 m⁴
    expect(displayUnit('area', 'us').siPerUnit).toBeCloseTo(6.4516e-4, 18);
    closeTo7(displayUnit('sectionModulus', 'us').siPerUnit, 1.638706e-5);
    closeTo7(displayUnit('inertia', 'us').siPerUnit, 4.162314e-7);
    // from memory: NIST SP 811 (2008) Appendix B.8, pound-force inch 1.129 848 E-01 N·m, pound-force per inch 1.751 268 E+02 N/m
    closeTo7(displayUnit('rotationalStiffness', 'us').siPerUnit, 1.129848e2);
    closeTo7(displayUnit('translationalStiffness', 'us').siPerUnit, 1.751268e5);
  });
});

describe('display units', () => {
  it('converts SI to engineering SI units', () => {
    // common practice: structural SI units kN, MPa, mm⁴, kN·m/rad
    expect(toDisplay(420e3, displayUnit('force', 'si'))).toBeCloseTo(420, 12);
    expect(toDisplay(310e6, displayUnit('stress', 'si'))).toBeCloseTo(310, 12);
    expect(toDisplay(25.1e-6, displayUnit('inertia', 'si'))).toBeCloseTo(25.1e6, 4);
    expect(toDisplay(2.5e6, displayUnit('rotationalStiffness', 'si'))).toBeCloseTo(2500, 9);
    expect(toDisplay(7640e-6, displayUnit('area', 'si'))).toBeCloseTo(7640, 9);
  });

  it('round-trips every kind in both systems', () => {
    const kinds = ['length', 'area', 'inertia', 'sectionModulus', 'stress', 'force', 'rotationalStiffness', 'translationalStiffness', 'dimensionless'] as const;
    for (const system of ['si', 'us'] as const) {
      for (const kind of kinds) {
        const u = displayUnit(kind, system);
        expect(fromDisplay(toDisplay(1.2345, u), u)).toBeCloseTo(1.2345, 12);
      }
    }
  });

  it('shows small lengths in mm or in', () => {
    // common practice: imperfections in mm / in, member lengths in m / ft
    expect(displayUnitFor(0.004, 'length', 'si').label).toBe('mm');
    expect(displayUnitFor(4.2, 'length', 'si').label).toBe('m');
    expect(displayUnitFor(0.004, 'length', 'us').label).toBe('in');
    expect(displayUnitFor(4.2, 'length', 'us').label).toBe('ft');
  });
});

describe('formatting', () => {
  it('formats quantities with their unit', () => {
    expect(formatQuantity(420e3, 'force', 'si')).toBe('420 kN');
    expect(formatQuantity(4.2, 'length', 'si')).toBe('4.2 m');
    expect(formatQuantity(0.0028, 'length', 'si')).toBe('2.8 mm');
    expect(formatQuantity(25.1e-6, 'inertia', 'si')).toBe('25.1×10⁶ mm⁴');
    expect(formatQuantity(1234.5e3, 'force', 'si')).toBe('1235 kN');
    expect(formatQuantity(1, 'dimensionless', 'si')).toBe('1');
    // 1 kip = 4448.2216152605 N (definition above): 100 kip
    expect(formatQuantity(444822.16152605, 'force', 'us')).toBe('100 kip');
    // 50 ksi = 344.7379 MPa (NIST factor above)
    expect(formatQuantity(344.7379e6, 'stress', 'us')).toBe('50 ksi');
    // 12 ft = 3.6576 m exactly
    expect(formatQuantity(3.6576, 'length', 'us')).toBe('12 ft');
  });

  it('keeps significant figures below one', () => {
    expect(formatNumber(0.499)).toBe('0.499');
    expect(formatNumber(0.00123)).toBe('0.00123');
    expect(formatNumber(0.9996)).toBe('1');
    expect(formatNumber(-2.5)).toBe('−2.5');
  });

  it('uses engineering notation for very large and small numbers', () => {
    expect(formatNumber(2.51e7)).toBe('25.1×10⁶');
    expect(formatNumber(1e6)).toBe('1×10⁶');
    expect(formatNumber(4.5e-5)).toBe('45×10⁻⁶');
    expect(formatNumber(999.9997e6)).toBe('1×10⁹'); // rounding carries into the next power of 1000
    expect(formatNumber(Infinity)).toBe('∞');
    expect(formatNumber(NaN)).toBe('—');
  });

  it('formats probabilities and reliability indices', () => {
    expect(formatProbability(6.64e-4)).toBe('6.64×10⁻⁴');
    expect(formatProbability(0.0999)).toBe('0.0999');
    expect(formatProbability(9.996e-5)).toBe('1×10⁻⁴');
    expect(formatProbability(0)).toBe('0');
    expect(formatBeta(3.8)).toBe('3.80');
    expect(formatBeta(-0.5)).toBe('−0.50');
    expect(formatBeta(Infinity)).toBe('∞');
  });
});
