/**
 * The block form of the column's limit state (columnBlock.ts) against the one-sample g, bit for
 * bit, over the end types, frames and strength models that have a block form, with fixed and
 * random values, and the evaluation count it reports.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import YAML from 'yaml';
import { buildColumnModel, type ColumnModel } from '../../src/limitState/columnModel.js';
import { problemFromModel } from '../../src/limitState/columnRecipe.js';
import { evaluationsSoFar } from '../../src/limitState/evaluationCount.js';
import { BlockRng } from '../../src/probability/blockRng.js';
import { BLOCK_SIZE, makeBlockSampler } from '../../src/reliability/blockSampler.js';
import { loadScenario } from '../../src/scenario/loadScenario.js';

const BASE = readFileSync(new URL('../../scenarios/braced-base-plate.yaml', import.meta.url), 'utf8');

/** The braced demo with `edit` applied to its parsed YAML. */
function variant(edit: (doc: Record<string, any>) => void): ColumnModel {
  const doc = YAML.parse(BASE) as Record<string, any>;
  edit(doc);
  return buildColumnModel(loadScenario(YAML.stringify(doc), 'variant.yaml'));
}

const VARIANTS: [string, (doc: Record<string, any>) => void][] = [
  ['demo as given (braced, first yield, rotation springs)', () => {}],
  ['pinned and fixed ends', (d) => { d.column.ends = { bottom: 'fixed', top: 'pinned' }; }],
  ['fixity ends, one random', (d) => { d.column.ends = { bottom: { fixity: { dist: 'uniform', min: 0.1, max: 0.9 } }, top: { fixity: 0.4 } }; }],
  ['alignment G end and a series end', (d) => {
    d.column.ends = { bottom: { alignment_g: 2.5 }, top: { series: { connection: { dist: 'lognormal', mean: '0.4 MN m/rad', cov: 0.3 }, beam: '2 MN m/rad', plate: 'rigid' } } };
  }],
  ['fixed section and material, fixed model factor', (d) => { d.column.material.E = '200 GPa'; d.model_factor = 1.0; d.correlation = []; }],
  ['aisc360-e3', (d) => { d.strength = 'aisc360-e3'; }],
  ['en1993-b', (d) => { d.strength = 'en1993-b'; }],
  ['first-yield-en1993-c-plus-bow', (d) => { d.strength = 'first-yield-en1993-c-plus-bow'; }],
  ['sway frame without a lateral spring', (d) => { d.column.frame = 'sway'; }],
];

/** count draws of x from the model's own distributions (the Monte Carlo block sampler). */
function sampleColumns(model: ColumnModel, count: number, seed: number): Float64Array[] {
  const { columns, fill } = makeBlockSampler(problemFromModel(model).transform);
  fill(new BlockRng(seed, 0), count);
  return columns;
}

describe('the block limit state equals g sample by sample, bit for bit', () => {
  it.each(VARIANTS)('%s', (_name, edit) => {
    const model = variant(edit);
    expect(model.gBlock).not.toBeNull();
    const columns = sampleColumns(model, BLOCK_SIZE, 11);
    const out = new Float64Array(BLOCK_SIZE);
    model.gBlock!(columns, BLOCK_SIZE, out);
    const x = new Float64Array(model.names.length);
    for (let b = 0; b < BLOCK_SIZE; b++) {
      for (let i = 0; i < x.length; i++) x[i] = columns[i][b];
      const one = model.g(x);
      if (!Object.is(out[b], one)) throw new Error(`sample ${b}: block ${out[b]} against g ${one}`);
    }
    // the samples really differ (a constant block would prove little)
    expect(new Set(out).size).toBeGreaterThan(BLOCK_SIZE / 2);
  });
});

describe('the block limit state at the edges', () => {
  it('a zero stiffness, a zero model factor and an overflowing load match g', () => {
    const model = variant(() => {});
    const n = model.names.length;
    const E = model.names.indexOf('column.material.E');
    const theta = model.names.indexOf('model_factor');
    const dead = model.names.indexOf('loads.dead');
    const columns = Array.from({ length: n }, (_, i) => new Float64Array(4).fill(model.mean[i]));
    columns[E][1] = 0; // EI = 0: capacity 0
    columns[theta][2] = 0; // θ = 0: no resistance
    columns[dead][3] = 1e308; // demand beyond the margin clamp
    const out = new Float64Array(4);
    model.gBlock!(columns, 4, out);
    for (let b = 0; b < 4; b++) expect(out[b]).toBe(model.g(Float64Array.from(columns, (c) => c[b])));
    expect(out[1]).toBeLessThan(0);
    expect(out[3]).toBe(-1e300);
  });

  it('counts one evaluation per sample with θ ≠ 0, as g does', () => {
    const model = variant(() => {});
    const columns = sampleColumns(model, 100, 3);
    columns[model.names.indexOf('model_factor')][7] = 0;
    const before = evaluationsSoFar();
    model.gBlock!(columns, 100, new Float64Array(100));
    expect(evaluationsSoFar() - before).toBe(99);
  });

  it('grows its buffers for a block longer than the sampler’s', () => {
    const model = variant((d) => { d.model_factor = 1.0; });
    const long = 3 * BLOCK_SIZE + 5;
    const columns = sampleColumns(model, BLOCK_SIZE, 5).map((c) => {
      const l = new Float64Array(long);
      for (let k = 0; k < long; k++) l[k] = c[k % BLOCK_SIZE];
      return l;
    });
    const out = new Float64Array(long);
    model.gBlock!(columns, long, out);
    expect(out[long - 1]).toBe(out[(long - 1) % BLOCK_SIZE]);
    expect(out[long - 1]).toBe(model.g(Float64Array.from(columns, (c) => c[long - 1])));
  });

  it('has no block form for eccentric loads or a lateral spring', () => {
    expect(variant((d) => { d.loads.dead = { ...d.loads.dead, eccentricity: { top: '20 mm', bottom: '0 mm' } }; }).gBlock).toBeNull();
    expect(variant((d) => { d.column.frame = 'sway'; d.column.ends.lateral = '20 kN/m'; }).gBlock).toBeNull();
  });

  it('the problem carries it tied to its own g', () => {
    const model = variant(() => {});
    const problem = problemFromModel(model);
    expect(problem.gBlock?.of).toBe(problem.g);
  });
});
