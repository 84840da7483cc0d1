import { describe, expect, test } from 'vitest';
import { readQuantity } from '../../src/scenario/quantity.js';
import { evaluateQuantity } from '../../src/scenario/quantityExpression.js';
import { normaliseUnitSpelling } from '../../src/scenario/unitSpelling.js';
import { ACCEPTED_UNITS } from '../../src/scenario/acceptedUnits.js';
import type { QuantityKind as ScenarioKind } from '../../src/scenario/dimensions.js';
import { displayUnit, formatQuantity, type UnitSystem } from '../../src/report/displayUnits.js';
import type { QuantityKind as ReportKind } from '../../src/report/reportInput.js';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
// source: NIST SP 811 (2008) App. B: 1 in = 0.0254 m, 1 ft = 0.3048 m, 1 lbf = 4.4482216152605 N (exact)
const KIP = 4448.2216152605;
const INCH = 0.0254;
const FOOT = 0.3048;

describe('engineering spellings of units are read', () => {
  test.each([
    ['2.5 kN·m/rad', 'rotationalStiffness', 2.5e3],
    ['2.5 kN⋅m/rad', 'rotationalStiffness', 2.5e3],
    ['2.5 kNm/rad', 'rotationalStiffness', 2.5e3],
    ['2.5 kN-m/rad', 'rotationalStiffness', 2.5e3],
    ['2.5 kN.m/rad', 'rotationalStiffness', 2.5e3],
    ['2.5 MN.m/rad', 'rotationalStiffness', 2.5e6],
    ['2.5 MNm/rad', 'rotationalStiffness', 2.5e6],
    ['2.5 MN·m/rad', 'rotationalStiffness', 2.5e6],
    ['40 N.m/rad', 'rotationalStiffness', 40],
    ['40 Nmm/rad', 'rotationalStiffness', 0.04],
    ['900 kip-in/rad', 'rotationalStiffness', 900 * KIP * INCH],
    ['900 kip in/rad', 'rotationalStiffness', 900 * KIP * INCH],
    ['900 kip·in/rad', 'rotationalStiffness', 900 * KIP * INCH],
    ['900 kip-ft/rad', 'rotationalStiffness', 900 * KIP * FOOT],
    ['35 kN·m', 'moment', 35e3],
    ['35 kNm', 'moment', 35e3],
    ['35 kN-m', 'moment', 35e3],
    ['13 ft 9 in', 'length', 13 * FOOT + 9 * INCH],
    ['13 ft-9 in', 'length', 13 * FOOT + 9 * INCH],
    [`13'-9"`, 'length', 13 * FOOT + 9 * INCH],
    [`13' 9.5"`, 'length', 13 * FOOT + 9.5 * INCH],
    ['7640 mm²', 'area', 7.64e-3],
    ['25.1×10⁶ mm⁴', 'inertia', 25.1e-6],
    ['25.1 × 10^6 mm^4', 'inertia', 25.1e-6],
    ['281×10³ mm³', 'sectionModulus', 281e-6],
    ['310 N/mm²', 'stress', 310e6],
    ['−2.5 mm', 'length', -2.5e-3],
    ['1.2×10⁻³ m', 'length', 1.2e-3],
  ] as const)('%s', (text, kind, si) => {
    expect(rel(readQuantity(text, kind).value, si)).toBeLessThan(1e-12);
  });

  test('the unit is echoed as written', () => {
    expect(readQuantity('2.5 kN·m/rad', 'rotationalStiffness').display).toEqual({ unit: 'kN·m/rad', factor: 1e3 });
    expect(readQuantity('25.1×10⁶ mm⁴', 'inertia').display.unit).toBe('mm⁴');
  });

  test('every unit listed in messages is itself accepted', () => {
    for (const [kind, units] of Object.entries(ACCEPTED_UNITS) as [ScenarioKind, readonly string[]][]) {
      for (const unit of units) expect(readQuantity(`1 ${unit}`, kind).value, `1 ${unit}`).toBeGreaterThan(0);
    }
  });
});

describe('a hyphen is a product only between two unit names', () => {
  test.each([
    // [text, L (m), expected SI value]
    ['L - 10 mm', 4, 3.99],
    ['L-10 mm', 4, 3.99],
    ['L -10 mm', 4, 3.99],
    ['L/1000 - 2 mm', 4, 0.002],
    ['10 mm-L/1000', 4, 0.006],
    ['(L - 200 mm)/500', 4.2, 4 / 500],
    ['13 ft - 9 in', 1, 13 * FOOT - 9 * INCH], // spaced: a subtraction, as written
  ] as const)('%s subtracts', (text, L, expected) => {
    expect(readQuantity(text, 'length', L).value).toBeCloseTo(expected, 12);
  });

  test('kN - m with spaces stays a subtraction, refused as force minus length', () => {
    expect(() => readQuantity('2 kN - m', 'moment')).toThrow(/subtract a force and a length/);
  });

  test('the rewriting leaves arithmetic alone', () => {
    expect(normaliseUnitSpelling('L - 10 mm')).toBe('L - 10 mm');
    expect(normaliseUnitSpelling('L-mm')).toBe('L-mm');
    expect(normaliseUnitSpelling('2.5 kN-m/rad')).toBe('2.5 kN*m/rad');
    expect(normaliseUnitSpelling('L.value')).toBe('L.value');
  });

  test('the whitelist still applies after rewriting', () => {
    expect(() => evaluateQuantity('m.constructor', {})).toThrow(/property access/);
    expect(() => evaluateQuantity('kN·sqrt(4)', {})).toThrow(/function/);
  });
});

describe('messages list the accepted units instead of parser jargon', () => {
  test('a wrong letter case gets a did-you-mean', () => {
    expect(() => readQuantity('320 Mpa', 'stress')).toThrow(/'Mpa'.*did you mean 'MPa'\?/);
    expect(() => readQuantity('200 gpa', 'stress')).toThrow(/did you mean 'GPa'\?/);
    expect(() => readQuantity('420 KN', 'force')).toThrow(/did you mean 'kN'\?/);
  });
  test('a unit a thousandth of the usual one is refused as a slip', () => {
    // mPa is the millipascal: no stress of an existing column is written in it
    expect(() => readQuantity('320 mPa', 'stress')).toThrow(/did you mean 'MPa'\?/);
  });
  test('an unreadable quantity names the units of its kind', () => {
    let message = '';
    try {
      readQuantity('2.5 kN·m/rad/', 'rotationalStiffness');
    } catch (e) {
      message = (e as Error).message;
    }
    expect(message).toMatch(/cannot be read as a number with a unit/);
    expect(message).toMatch(/units accepted for a rotational stiffness: kN·m\/rad, /);
    expect(message).not.toMatch(/char \d|Value expected|Syntax error/);
  });
  test('a dimension slip names the units too', () => {
    expect(() => readQuantity('4 m', 'stress')).toThrow(/got a length \(4 m\) \(units accepted for a stress: Pa, kPa, MPa/);
  });
});

/** Every kind the reports print, with the scenario kind that reads it back. */
const PRINTED_KINDS: ReportKind[] = ['length', 'area', 'inertia', 'sectionModulus', 'stress', 'force', 'rotationalStiffness', 'translationalStiffness', 'moment', 'dimensionless'];
const MAGNITUDES = [1e-9, 3.7e-6, 2.2e-4, 0.0421, 0.95, 1, 7.31, 88.8, 4190, 2.5e5, 6.02e7, 3.3e10, 1.23e13];

describe('everything the tool prints reads back as input (round trip)', () => {
  test.each(['si', 'us'] as UnitSystem[])('--units %s', (system) => {
    let checked = 0;
    for (const kind of PRINTED_KINDS) {
      for (const magnitude of MAGNITUDES) {
        for (const valueSI of [magnitude, -magnitude]) {
          const printed = formatQuantity(valueSI, kind, system);
          const back = kind === 'dimensionless' ? evaluateQuantity(printed).value : readQuantity(printed, kind).value;
          // equal to print precision: printing the value read back gives the same text
          expect(formatQuantity(back, kind, system), `${kind} ${printed}`).toBe(printed);
          // and the same SI value to print precision: 3 significant figures are within 0.5 %
          expect(rel(back, valueSI), `${kind} ${printed}`).toBeLessThanOrEqual(5e-3);
          expect(Math.sign(back)).toBe(Math.sign(valueSI));
          checked++;
        }
      }
      // the axis unit alone (as in table headers) reads back too
      const label = displayUnit(kind, system).label;
      if (label !== '') expect(rel(readQuantity(`1 ${label}`, kind as ScenarioKind).value, displayUnit(kind, system).siPerUnit)).toBeLessThan(1e-12);
    }
    expect(checked).toBe(PRINTED_KINDS.length * MAGNITUDES.length * 2);
  });
});
