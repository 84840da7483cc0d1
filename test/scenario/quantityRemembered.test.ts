/**
 * readQuantity remembers its results (a sweep reads the same strings for every case): the
 * remembered value must depend on everything the reading does, and errors are never remembered.
 */
import { describe, expect, it } from 'vitest';
import { readQuantity } from '../../src/scenario/quantity.js';
import { ExpressionError } from '../../src/scenario/quantityExpression.js';

describe('readQuantity remembered', () => {
  it('an expression in L follows the column length', () => {
    expect(readQuantity('L/1500', 'length', 6).value).toBeCloseTo(0.004, 15);
    expect(readQuantity('L/1500', 'length', 3).value).toBeCloseTo(0.002, 15);
    expect(readQuantity('L/1500', 'length', 6).value).toBeCloseTo(0.004, 15);
  });

  it('the same text is checked against each kind', () => {
    expect(readQuantity('200 GPa', 'stress').value).toBe(200e9);
    expect(() => readQuantity('200 GPa', 'force')).toThrow(ExpressionError);
  });

  it('an error is raised every time', () => {
    expect(() => readQuantity('12 furlongs', 'length')).toThrow(ExpressionError);
    expect(() => readQuantity('12 furlongs', 'length')).toThrow(ExpressionError);
  });
});
