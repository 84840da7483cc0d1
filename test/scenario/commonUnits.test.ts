import { describe, expect, it } from 'vitest';
import { COMMON_UNITS } from '../../src/scenario/commonUnits.js';
import { lookupMathjsUnit } from '../../src/scenario/mathjsBundle.js';
import { parseExpression } from '../../src/scenario/mathjsBundle.js';
import { parsePlainQuantity } from '../../src/scenario/plainQuantityParser.js';
import { evaluateQuantity } from '../../src/scenario/quantityExpression.js';

describe('units and quantities read without mathjs', () => {
  it('every common unit has exactly the factor and dimensions mathjs gives it', () => {
    // common practice: a shortcut table must equal what it stands in for
    for (const [name, info] of Object.entries(COMMON_UNITS)) {
      const m = lookupMathjsUnit(name);
      expect(m, name).toBeDefined();
      expect(info.factor, name).toBe(m!.factor);
      expect([...info.dimensions], name).toEqual([...m!.dimensions]);
    }
  });

  const plain = [
    '210 GPa', '6640 mm^2', '15.4e6 mm^4', '152e3 mm^3', '1.2 MN m/rad', '0.25 MN*m/rad', 'L/1500', 'L / 300', '0 mm',
    '50 years', '-5 mm', '+3 kN', '1e-3', '.5 m', '3.', '5mm', '2 m^-1', '10^3 N', '1 kN m^2 / m', '7 ft', '3 inch', 'L',
  ];
  it('plain quantities parse to trees with mathjs\'s value and dimensions', () => {
    // common practice: the plain parser and mathjs's must agree on every text the plain one accepts
    for (const text of plain) {
      expect(parsePlainQuantity(text), text).toBeDefined();
      const viaPlain = evaluateQuantity(text, { columnLength: 5.6 });
      const walk = evaluateQuantity(`(${text})`, { columnLength: 5.6 }); // brackets: not plain, goes to mathjs
      expect(parsePlainQuantity(`(${text})`)).toBeUndefined();
      expect(viaPlain.value, text).toBeCloseTo(walk.value, 12);
      expect(Math.abs(viaPlain.value / walk.value - 1) || 0, text).toBeLessThan(1e-15);
      expect([...viaPlain.dimensions], text).toEqual([...walk.dimensions]);
      expect(viaPlain.hasUnit, text).toBe(walk.hasUnit);
    }
  });

  it('anything else is left to mathjs (and to its whitelist walk)', () => {
    // common practice: unusual texts keep their one reader
    for (const text of ['5 in', 'kN/m m', 'sqrt(4) m', '2^3^2', 'a.b', '5 m to ft', '1_000 m', 'x = 3', '"5 m"', '5 m / 2 s', '2 (3 m)']) {
      expect(parsePlainQuantity(text), text).toBeUndefined();
    }
    expect(() => parseExpression('5 m')).not.toThrow();
    expect(() => evaluateQuantity('sqrt(4) m')).toThrow(/functions are not allowed/);
  });
});
