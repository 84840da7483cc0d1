import { describe, expect, test } from 'vitest';
import { readQuantity } from '../../src/scenario/quantity.js';
import { evaluateQuantity, ExpressionError } from '../../src/scenario/quantityExpression.js';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('quantities convert to the SI unit of the field', () => {
  test.each([
    // common practice: SI prefixes k = 1e3, M = 1e6, G = 1e9, m = 1e-3 (BIPM SI Brochure, 9th ed.)
    ['4.2 m', 'length', 4.2],
    ['4200 mm', 'length', 4.2],
    ['7640 mm^2', 'area', 7.64e-3],
    ['25.1e6 mm^4', 'inertia', 25.1e-6],
    ['281e3 mm^3', 'sectionModulus', 281e-6],
    ['200 GPa', 'stress', 200e9],
    ['310 MPa', 'stress', 310e6],
    ['310 N/mm^2', 'stress', 310e6],
    ['420 kN', 'force', 420e3],
    ['2.5 MN m/rad', 'rotationalStiffness', 2.5e6],
    ['2.5 kN*m/rad', 'rotationalStiffness', 2.5e3],
    ['2500 kN m / rad', 'rotationalStiffness', 2.5e6],
    ['0 kN/m', 'translationalStiffness', 0],
    ['300 kN/m', 'translationalStiffness', 3e5],
    ['12 in', 'length', 0.3048], // source: NIST SP 811, 1 in = 0.0254 m exactly
    ['1 ft', 'length', 0.3048], // source: NIST SP 811, 1 ft = 0.3048 m exactly
    ['1 lbf', 'force', 4.4482216152605], // source: NIST SP 811, 1 lbf = 4.448 221 615 260 5 N
    ['1 kip', 'force', 4448.2216152605], // source: NIST SP 811, 1 kip = 1000 lbf
    ['1 psi', 'stress', 6894.757293168361], // source: NIST SP 811, 1 psi = 6.894 757 kPa
    ['36 ksi', 'stress', 36e3 * 6894.757293168361], // source: NIST SP 811, 1 ksi = 1000 psi
  ] as const)('%s → %s', (text, kind, si) => {
    const q = readQuantity(text, kind);
    if (si === 0) expect(q.value).toBe(0);
    else expect(rel(q.value, si)).toBeLessThan(1e-12);
  });

  test('degrees are converted to radians', () => {
    // common practice: 1 deg = pi/180 rad
    expect(rel(readQuantity('1 kN m/deg', 'rotationalStiffness').value, 1e3 * (180 / Math.PI))).toBeLessThan(1e-12);
  });

  test('the unit as written is kept for display', () => {
    expect(readQuantity('2.5 MN m/rad', 'rotationalStiffness').display).toEqual({ unit: 'MN m/rad', factor: 1e6 });
    expect(readQuantity('420 kN', 'force').display).toEqual({ unit: 'kN', factor: 1000 });
    // an expression has no single unit: the kind's default (mm for a length)
    expect(readQuantity('L/1000 + 2 mm', 'length', 4).display.unit).toBe('mm');
  });
});

describe('dimension slips are errors, not wrong numbers', () => {
  test('a length where a stress is expected', () => {
    expect(() => readQuantity('4 m', 'stress')).toThrow('expected a stress (e.g. 200 GPa), got a length (4 m)');
  });
  test('a moment without /rad is not a rotational stiffness', () => {
    expect(() => readQuantity('2.5 MN m', 'rotationalStiffness')).toThrow(/got a moment/);
  });
  test('a bare number needs a unit', () => {
    expect(() => readQuantity('200', 'stress')).toThrow(/bare number \(200\): give a unit/);
  });
  test('an unknown unit is named', () => {
    expect(() => readQuantity('5 furlongs', 'length')).toThrow(/'furlongs'.*not a known unit/);
  });
  test('L means the column length, never litres', () => {
    expect(() => readQuantity('3 L', 'area')).toThrow(/L \(the column length\)/);
    expect(readQuantity('L/1500', 'length', 4.2).value).toBeCloseTo(0.0028, 15);
  });
  test('adding a length and a pure number is refused', () => {
    expect(() => readQuantity('L/1000 + 2', 'length', 4)).toThrow(/add a length and a pure number/);
  });
});

describe('length expressions', () => {
  test.each([
    ['L/1500', 4.2, 4.2 / 1500],
    ['L/1000 + 2 mm', 4, 0.004 + 0.002],
    ['(L - 200 mm)/500', 4.2, 4 / 500],
    ['-L/1000', 3, -0.003],
    ['L^2/(1000 m)', 2, 0.004],
  ] as const)('%s', (text, L, expected) => {
    expect(readQuantity(text, 'length', L).value).toBeCloseTo(expected, 14);
  });
});

describe('the expression whitelist', () => {
  const rejected: [string, RegExp][] = [
    ['sqrt(4) m', /function/],
    ['f(x)', /function/],
    ['import("fs")', /function/],
    ['evaluate("1 m")', /function/],
    ['createUnit("x")', /function/],
    ['a = 1', /assignment/],
    ['f(x) = x', /assignment/],
    ['L.value', /property access/],
    ['L["constructor"]', /property access|index/],
    ['"abc"', /quoted text/],
    ['[1, 2] m', /matrix or list/],
    ['{a: 1}', /object/],
    ['x', /'x'.*not a known unit/],
    ['pi * 1 m', /'pi'.*not a known unit/],
    ['E', /'E'.*not a known unit/],
    ['2 m to mm', /operator 'to'/],
    ['3! m', /operator '!'/],
    ['10 % 3', /operator '%'/],
    ['L > 1 m', /comparison|operator/],
    ['L ? 1 m : 2 m', /conditional/],
    ['1:3', /range/],
    ['1 m; 2 m', /several statements|cannot be read/],
    ['true', /constant true/],
    ['NaN', /not a finite number/],
    ['Infinity m', /not a finite number/],
    ['1e400 m', /not a finite number/],
    ['1e200 m * 1e200 m / 1 m', /not finite/],
    [`${'('.repeat(60)}1${')'.repeat(60)} m`, /nested too deeply/],
    ['@', /cannot be read as a number with a unit/],
  ];
  test.each(rejected)('%s is refused', (text, why) => {
    let error: unknown;
    try {
      evaluateQuantity(text, { columnLength: 4 });
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(ExpressionError);
    expect((error as Error).message).toMatch(why);
  });

  test('the evaluator module never calls mathjs evaluate', async () => {
    const { readFileSync } = await import('node:fs');
    for (const file of ['quantityExpression.ts', 'mathjsBundle.ts', 'quantity.ts', 'units.ts']) {
      const source = readFileSync(new URL(`../../src/scenario/${file}`, import.meta.url), 'utf8');
      expect(source).not.toMatch(/\.evaluate\(|\.compile\(|\bevaluate\(|createUnit|import\(\s*['"]mathjs/);
    }
  });
});
