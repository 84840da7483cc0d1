import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import YAML from 'yaml';
import { buildColumnModel } from '../../src/limitState/columnModel.js';
import { connectionResponseAt } from '../../src/limitState/connectionResponse.js';
import { checkJson, deterministicCheck } from '../../src/limitState/deterministicCheck.js';
import { beamColumnResponse } from '../../src/mechanics/beamColumn.js';
import { columnCapacity } from '../../src/mechanics/columnCapacity.js';
import { loadScenario } from '../../src/scenario/loadScenario.js';
import { form } from '../../src/reliability/form.js';
import { problemFromModel } from '../../src/limitState/columnRecipe.js';
import { betaByStrengthModel } from '../../src/studies/strengthComparison.js';
import type { Scenario } from '../../src/scenario/types.js';
import { runCliOnText } from '../cli/runCli.js';

const scenarioFormFull = (s: Scenario) => form(problemFromModel(buildColumnModel(s)));

const DEMOS = ['braced-base-plate', 'sway-canopy-post', 'timber-store-post'];

function demoText(name: string): string {
  return readFileSync(new URL(`../../scenarios/${name}.yaml`, import.meta.url), 'utf8');
}

/** The scenario with `eccentricity` added to every load (a plain force becomes {value: ...}). */
function withEccentricity(text: string, ecc: (name: string) => Record<string, unknown>): string {
  const doc = YAML.parse(text) as { loads: Record<string, unknown> };
  for (const [name, raw] of Object.entries(doc.loads)) {
    doc.loads[name] = typeof raw === 'string' ? { value: raw, eccentricity: ecc(name) } : { ...(raw as object), eccentricity: ecc(name) };
  }
  return YAML.stringify(doc);
}

/** Points of x: the means, and each variable moved to a few quantiles in turn and all together. */
function probePoints(model: ReturnType<typeof buildColumnModel>): Float64Array[] {
  const points = [Float64Array.from(model.mean)];
  for (const p of [0.001, 0.1, 0.7, 0.999]) {
    points.push(Float64Array.from(model.dists, (d) => d.quantile(p)));
    for (let i = 0; i < model.dists.length; i++) {
      const x = Float64Array.from(model.mean);
      x[i] = model.dists[i].quantile(p);
      points.push(x);
    }
  }
  return points;
}

describe('zero eccentricity changes nothing, bit for bit, on every demo scenario', () => {
  it.each(DEMOS)('%s', (name) => {
    const text = demoText(name);
    const plain = buildColumnModel(loadScenario(text, `${name}.yaml`));
    const zero = buildColumnModel(loadScenario(withEccentricity(text, () => ({ top: '0 mm', bottom: '0 m' })), `${name}.yaml`));
    expect(zero.names).toEqual(plain.names);
    for (const x of probePoints(plain)) {
      expect(Object.is(zero.capacity(x), plain.capacity(x))).toBe(true);
      expect(Object.is(zero.g(x), plain.g(x))).toBe(true);
    }
    // a fixed zero everywhere is the concentric column: the same `check` JSON, no eccentricity key
    expect(checkJson(deterministicCheck(zero))).toEqual(checkJson(deterministicCheck(plain)));
  });
});

describe('eccentric loads in the limit state', () => {
  const base = demoText('braced-base-plate');

  it('a random eccentricity is a new variable; the capacity uses the load-weighted eccentricity', () => {
    const text = withEccentricity(base, (load) => (load === 'dead' ? { top: { dist: 'normal', mean: '60 mm', sd: '15 mm' }, bottom: '-10 mm' } : { top: '20 mm' }));
    const model = buildColumnModel(loadScenario(text, 'ecc.yaml'));
    expect(model.names).toContain('loads.dead.eccentricity.top');
    expect(model.names).not.toContain('loads.dead.eccentricity.bottom');
    const x = Float64Array.from(model.mean);
    const at = (path: string) => x[model.names.indexOf(path)];
    const dead = at('loads.dead');
    const imposed = at('loads.imposed');
    const eTop = (dead * at('loads.dead.eccentricity.top') + imposed * 0.02) / (dead + imposed);
    const eBottom = (dead * -0.01) / (dead + imposed);
    const st = model.state(x);
    expect(st.eccentricity!.top).toBeCloseTo(eTop, 15);
    expect(st.eccentricity!.bottom).toBeCloseTo(eBottom, 15);
    expect(model.capacity(x)).toBe(columnCapacity('first-yield', st).capacity);
    expect(model.capacity(x)).toBeLessThan(buildColumnModel(loadScenario(base, 'plain.yaml')).capacity(x));
    // every load scaled together leaves the eccentricities, and so the capacity, unchanged
    const scaled = Float64Array.from(x);
    scaled[model.names.indexOf('loads.dead')] *= 1.7;
    scaled[model.names.indexOf('loads.imposed')] *= 1.7;
    expect(Math.abs(model.capacity(scaled) / model.capacity(x) - 1)).toBeLessThan(1e-12);
  });

  it('the connection moments include the end couples P·e', () => {
    const text = withEccentricity(base, (load) => (load === 'dead' ? { top: '80 mm' } : {}));
    const model = buildColumnModel(loadScenario(text, 'ecc.yaml'));
    const x = Float64Array.from(model.mean);
    const st = model.state(x);
    const r = connectionResponseAt(model, x);
    const exact = beamColumnResponse(st.E * st.I, st.L, st.frame, st.r, st.bow, st.eccentricity!.bottom, st.eccentricity!.top, model.demand(x));
    expect(r.springMoment).toEqual(exact.springMoment);
    expect(r.memberMax).toBe(exact.memberMax);
    const plain = connectionResponseAt(buildColumnModel(loadScenario(base, 'plain.yaml')), x);
    expect(r.memberMax).toBeGreaterThan(plain.memberMax + 0.5 * model.demand(x) * st.eccentricity!.top);
  });
});

describe('the code interaction checks in the limit state (docs/beam-column.md)', () => {
  const base = demoText('sway-canopy-post');
  it.each(['en1993-b', 'en1993-d', 'aisc360-e3'])('%s: the exact eccentric capacity, below the concentric one', (strength) => {
    const text = base.replace('strength: en1993-b', `strength: ${strength}`);
    const plain = buildColumnModel(loadScenario(text, 'plain.yaml'));
    const model = buildColumnModel(loadScenario(withEccentricity(text, () => ({ top: { dist: 'normal', mean: '40 mm', sd: '10 mm' } })), 'e.yaml'));
    expect(model.scenario.strength).toBe(strength);
    const x = Float64Array.from(model.mean);
    const st = model.state(x);
    expect(st.eccentricity!.top).toBeGreaterThan(0.03);
    expect(model.capacity(x)).toBe(columnCapacity(strength as 'en1993-b', st).capacity);
    expect(model.capacity(x)).toBeLessThan(plain.capacity(Float64Array.from(plain.mean)));
  });

  // common practice: the comparison table evaluates every model that has a combined-action check
  it('by strength model: every compared model has a β under an eccentric load', () => {
    const s = loadScenario(withEccentricity(base, () => ({ top: '30 mm' })), 'e.yaml');
    const rows = betaByStrengthModel(s, scenarioFormFull(s));
    for (const r of rows) {
      expect(r.note).toBeUndefined();
      expect(Number.isFinite(r.beta)).toBe(true);
    }
  });
});

describe('eccentricity input errors: exit 2, the field named', () => {
  const base = demoText('braced-base-plate');
  const cases: [string, string, RegExp][] = [
    ['a force for a length', withEccentricity(base, () => ({ top: '80 kN' })), /loads\.dead\.eccentricity\.top.*length/],
    ['an unknown end', withEccentricity(base, () => ({ left: '8 mm' })), /loads\.dead\.eccentricity\.left.*unknown key/],
    [
      'a period on a fixed load',
      base.replace(/ {2}imposed: .*\n/, '  imposed: {value: 190 kN, maximum_over: 50 years, eccentricity: {top: 5 mm}}\n'),
      /loads\.imposed\.maximum_over/,
    ],
  ];
  it.each(cases)('%s', async (_label, text, message) => {
    const r = await runCliOnText(['check', '-'], text);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(message);
    expect(r.stderr).not.toMatch(/\n\s+at /); // no stack trace
    expect(r.stdout).toBe('');
  });

  it('a code curve now checks a non-zero eccentricity (exit 0, a lower capacity)', async () => {
    const plain = await runCliOnText(['check', '-', '--json'], demoText('sway-canopy-post'));
    const r = await runCliOnText(['check', '-', '--json'], withEccentricity(demoText('sway-canopy-post'), () => ({ top: '40 mm' })));
    expect(r.status).toBe(0);
    const capacity = (out: string) => (JSON.parse(out) as { check: { capacity: number } }).check.capacity;
    expect(capacity(r.stdout)).toBeLessThan(capacity(plain.stdout));
  });

  it('a code curve accepts an eccentricity of exactly zero', async () => {
    const text = withEccentricity(demoText('sway-canopy-post'), () => ({ top: '0 mm' }));
    const r = await runCliOnText(['check', '-', '--json'], text);
    expect(r.status).toBe(0);
  });
});

describe('connection moments of a column with a corroded zone', () => {
  // common practice: the stepped member is solved as such (mechanics/steppedBeamColumn.ts, checked against finite
  // elements with segment-wise E·I in test/mechanics/steppedBeamColumn.test.ts), not with the zone's section over the
  // whole length: the stiffer sound part above the zone turns less, so the springs carry less than with the whole-length loss
  it('the facade demo: the stepped response at the means, below the whole-length loss at both ends', () => {
    const text = readFileSync(new URL('../../scenarios/facade-h-column.yaml', import.meta.url), 'utf8');
    const zoned = loadScenario(text, 'f.yaml');
    const whole = loadScenario(text.replace(/\n\s*zone: \{height: 400 mm\}/, ''), 'f.yaml');
    expect(whole.column.section.geometry?.corrosion?.zoneHeight).toBeUndefined();
    const mZ = buildColumnModel(zoned);
    const mW = buildColumnModel(whole);
    const rZ = connectionResponseAt(mZ, Float64Array.from(mZ.mean));
    const rW = connectionResponseAt(mW, Float64Array.from(mW.mean));
    expect(rZ.stable && rW.stable).toBe(true);
    for (const end of ['bottom', 'top'] as const) {
      expect(Math.abs(rZ.springMoment[end])).toBeLessThan(Math.abs(rW.springMoment[end]));
      expect(Math.abs(rZ.rotation[end])).toBeLessThan(Math.abs(rW.rotation[end]));
    }
    expect(rZ.Pcr).toBeGreaterThan(rW.Pcr);
    expect(rZ.eccentricity).toEqual(rW.eccentricity);
  });
});

describe('the β-by-model table says how each model treats a corroded zone under bending', () => {
  // common practice: first-yield solves the stepped member, the code checks take the loss over the whole length
  // (docs/sections.md); without that remark a reader would compare β values computed on different members
  it('facade demo: a note on the first-yield row and on the code-check rows', () => {
    const facade = loadScenario(readFileSync(new URL('../../scenarios/facade-h-column.yaml', import.meta.url), 'utf8'), 'f.yaml');
    const rows = betaByStrengthModel(facade, form(problemFromModel(buildColumnModel(facade))));
    expect(rows.find((r) => r.strength === 'first-yield')?.note).toMatch(/stepped member/);
    expect(rows.find((r) => r.strength === 'en1993-b')?.note).toMatch(/whole length/);
    expect(rows.find((r) => r.strength === 'aisc360-e3')?.note).toMatch(/whole length/);
  });
});
