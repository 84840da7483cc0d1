/**
 * Far out in u-space (a FORM step, a design point) the sampled values can overflow or vanish:
 * the limit state and the connection moments must stay numbers or report "unknown", never throw.
 * Regression for valid scenarios found by the generator (bench/validScenarios.ts, seed 11).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { buildColumnModel } from '../../src/limitState/columnModel.js';
import { connectionResponseAt } from '../../src/limitState/connectionResponse.js';
import { endSpringMoments } from '../../src/mechanics/endSpringMoments.js';
import { loadScenario } from '../../src/scenario/loadScenario.js';

const demo = loadScenario(readFileSync(join('scenarios', 'braced-base-plate.yaml'), 'utf8'), 'braced-base-plate.yaml');

describe('far-tail values', () => {
  it('E and a spring stiffness both infinite (R = ∞/∞): g is finite, the spring counts as rigid', () => {
    const m = buildColumnModel(demo);
    const x = Float64Array.from(m.mean);
    x[m.names.indexOf('column.material.E')] = Infinity;
    x[m.names.indexOf('column.ends.bottom.rotation')] = Infinity;
    expect(() => m.capacity(x)).not.toThrow();
    expect(Number.isFinite(m.g(x))).toBe(true);
    expect(m.state(x).r.bottom).toBe(Infinity);
  });

  it('a spring of zero stiffness against EI = 0 (0/0): no restraint, capacity 0, g finite', () => {
    const m = buildColumnModel(demo);
    const x = Float64Array.from(m.mean);
    x[m.names.indexOf('column.material.E')] = 0;
    x[m.names.indexOf('column.ends.bottom.rotation')] = 0;
    expect(m.capacity(x)).toBe(0);
    expect(Number.isFinite(m.g(x))).toBe(true);
  });

  it('connection moments of a section that is gone are unknown (not stable), not an error', () => {
    const r = endSpringMoments(0, 4, 'braced', { bottom: 1, top: 1 }, 0.004, 1e5);
    expect(r.stable).toBe(false);
    const m = buildColumnModel(demo);
    const x = Float64Array.from(m.mean);
    x[m.names.indexOf('column.material.E')] = 0;
    expect(connectionResponseAt(m, x).stable).toBe(false);
  });
});
