import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { evaluationsSoFar } from '../../src/limitState/evaluationCount.js';
import { loadScenario } from '../../src/scenario/loadScenario.js';
import { assessColumn } from '../../src/studies/columnAssessment.js';

const file = 'braced-base-plate.yaml';
const scenario = loadScenario(readFileSync(new URL(`../../scenarios/${file}`, import.meta.url), 'utf8'), file);
const total = (calls: Record<string, number>) => Object.values(calls).reduce((a, b) => a + b, 0);

describe('assess does only what was asked, and reports every limit-state call', () => {
  it('--methods mc with no studies: Monte Carlo, the FORM it needs for the design point (said so), nothing else', async () => {
    const before = evaluationsSoFar();
    const a = await assessColumn(scenario, { methods: ['mc'], samples: 20_000, studies: [], workers: 1 });
    const made = evaluationsSoFar() - before;
    expect(a.studies).toEqual([]);
    expect(a.sensitivity).toBeUndefined();
    expect(a.restraint).toBeUndefined();
    expect(a.byStrengthModel).toBeUndefined();
    expect(a.formCheck).toBeUndefined();
    expect(Object.keys(a.calls).sort()).toEqual(['characteristic-values', 'form', 'histogram', 'mc']);
    expect(a.calls.mc).toBe(20_000);
    // common practice: the summary accounts for every evaluation made in this thread, no more, no less
    expect(total(a.calls)).toBe(made);
    expect(a.warnings.join(' ')).toMatch(/FORM was run \(\d+ calls\) although not among the methods asked for/);
  });

  it('one study: the tornado alone, at 2n + 1 evaluations for each of utilization and capacity', async () => {
    const before = evaluationsSoFar();
    const a = await assessColumn(scenario, { methods: ['form'], studies: ['tornado'], workers: 1 });
    const made = evaluationsSoFar() - before;
    const n = a.model.names.length;
    expect(a.studies).toEqual(['tornado']);
    expect(a.sensitivity?.utilization?.rows.length).toBe(n);
    expect(a.sensitivity?.conditionalBeta).toBeUndefined();
    expect(a.sensitivity?.sobolG).toBeUndefined();
    // common practice: a tornado evaluates each variable at its two quantiles plus the baseline at the means
    expect(a.calls.tornado).toBe(2 * (2 * n + 1));
    expect(total(a.calls)).toBe(made);
    // FORM alone decides here and its self-check was switched off: said so
    expect(a.warnings.join(' ')).toMatch(/self-check was switched off/);
  });
});
