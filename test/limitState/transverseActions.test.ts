import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import YAML from 'yaml';
import { buildColumnModel } from '../../src/limitState/columnModel.js';
import { problemFromModel } from '../../src/limitState/columnRecipe.js';
import { connectionJson, connectionResponseAt } from '../../src/limitState/connectionResponse.js';
import { checkJson, deterministicCheck } from '../../src/limitState/deterministicCheck.js';
import { loadCombinations } from '../../src/loads/loadCombinations.js';
import { beamColumnResponse } from '../../src/mechanics/beamColumn.js';
import { columnCapacity } from '../../src/mechanics/columnCapacity.js';
import { form } from '../../src/reliability/form.js';
import { en1993OutOfPlumb } from '../../src/scenario/buildScenario.js';
import { loadScenario } from '../../src/scenario/loadScenario.js';
import { characteristicValues } from '../../src/studies/characteristicValues.js';
import { betaByStrengthModel } from '../../src/studies/strengthComparison.js';
import { runCli } from '../cli/runCli.js';

const DEMOS = ['braced-base-plate', 'sway-canopy-post', 'timber-store-post'];

function demoText(name: string): string {
  return readFileSync(new URL(`../../scenarios/${name}.yaml`, import.meta.url), 'utf8');
}

type Doc = { column: { frame: string; imperfection?: Record<string, unknown> }; loads: Record<string, unknown>; strength: string };

/** The scenario with `keys` added to every load (a plain force becomes {value: ...}), and `column` edits. */
function edited(text: string, keys: (name: string) => Record<string, unknown>, column: (doc: Doc) => void = () => {}): string {
  const doc = YAML.parse(text) as Doc;
  for (const [name, raw] of Object.entries(doc.loads)) {
    doc.loads[name] = typeof raw === 'string' ? { value: raw, ...keys(name) } : { ...(raw as object), ...keys(name) };
  }
  column(doc);
  return YAML.stringify(doc);
}

describe('zero actions change nothing, bit for bit, on every demo scenario', () => {
  it.each(DEMOS)('%s', (name) => {
    const text = demoText(name);
    const sway = (YAML.parse(text) as Doc).column.frame === 'sway';
    const zeroText = edited(
      text,
      () => ({ moments: { top: '0 kN m', bottom: '0 kN*m' }, transverse: '0 kN/m', ...(sway ? { horizontal: '0 kN' } : {}) }),
      (doc) => { if (sway) doc.column.imperfection = { ...(doc.column.imperfection ?? {}), out_of_plumb: 0 }; },
    );
    const plain = buildColumnModel(loadScenario(text, `${name}.yaml`));
    const zero = buildColumnModel(loadScenario(zeroText, `${name}.yaml`));
    expect(zero.names).toEqual(plain.names);
    const points = [Float64Array.from(plain.mean), Float64Array.from(plain.dists, (d) => d.quantile(0.01)), Float64Array.from(plain.dists, (d) => d.quantile(0.97))];
    for (const x of points) {
      expect(Object.is(zero.capacity(x), plain.capacity(x))).toBe(true);
      expect(Object.is(zero.g(x), plain.g(x))).toBe(true);
    }
  });
});

const WINDY = `
stanchion: 1
column:
  length: 4.5 m
  frame: braced
  section: {area: 5380 mm^2, inertia: 36.9e6 mm^4, section_modulus: 389e3 mm^3}
  material: {E: 205 GPa, fy: {dist: lognormal, mean: 300 MPa, cov: 0.07}}
  ends: {bottom: {rotation: 4 MN m/rad}, top: pinned}
  imperfection: {bow: L/1000}
loads:
  dead: {dist: normal, mean: 280 kN, cov: 0.1, kind: permanent, moments: {top: 6 kN m}}
  wind: {value: 0 kN, kind: wind, maximum_over: 1 year, transverse: {dist: gumbel, mean: 2.4 kN/m, cov: 0.3}}
strength: first-yield
`;

describe('a braced column with a line load and an applied end moment', () => {
  const s = loadScenario(WINDY, 'windy.yaml');
  const model = buildColumnModel(s);

  it('names the random actions by their paths and converts them in time with their load', () => {
    expect(model.names).toEqual(['column.material.fy', 'loads.dead', 'loads.wind.transverse', 'model_factor']); // model factor: first-yield's default
    const [only] = loadCombinations(s);
    // the wind entry is the only time-varying load: its line load is taken to the 50-year maximum, n = 50/1
    expect(only!.exponents.get('loads.wind.transverse')).toBe(50);
    expect(only!.exponents.get('loads.dead.moments.top')).toBe(1);
  });

  it('capacity = the total axial load at which first yield is reached with every action scaled together', () => {
    const x = Float64Array.from(model.mean);
    const P = model.demand(x);
    const w = x[2]!;
    const st = model.state(x);
    expect(st.eccentricity!.top).toBeCloseTo(6e3 / P, 15);
    expect(st.transverse!.line).toBeCloseTo(w / P, 15);
    // at the capacity every action is λ = capacity/P times its value, and N/A + max|M|/S reaches fy there
    // (first yield, docs/beam-column.md; the moment from the closed form checked against finite elements)
    const cap = model.capacity(x);
    const lambda = cap / P;
    const at = beamColumnResponse(st.E * st.I, st.L, 'braced', st.r, st.bow, 0, (lambda * 6e3) / cap, cap, { line: lambda * w, top: 0 });
    expect(Math.abs(cap / st.A + at.memberMax / st.S - st.fy) / st.fy).toBeLessThan(1e-9);
    // and the line load costs capacity
    expect(cap).toBeLessThan(columnCapacity('first-yield', { ...st, transverse: { line: 0, top: 0 } }).capacity);
  });

  it('connection moments include the line load and the end moment', () => {
    const x = Float64Array.from(model.mean);
    const m = connectionResponseAt(model, x);
    const st = model.state(x);
    const P = model.demand(x);
    const direct = beamColumnResponse(st.E * st.I, st.L, 'braced', st.r, st.bow, 0, 6e3 / P, P, { line: x[2]!, top: 0 });
    expect(m.springMoment.bottom).toBe(direct.springMoment.bottom);
    expect(m.memberMax).toBe(direct.memberMax);
    const json = connectionJson(m, 'means') as { connection_response: Record<string, unknown> };
    expect(json.connection_response.line_load).toBe(x[2]);
    expect((json.connection_response.end_couples as { top: number }).top).toBeCloseTo(6e3, 6);
    expect(checkJson(deterministicCheck(model))).toBeTruthy();
  });

  it('FORM finds the line load among the important variables', () => {
    const r = form(problemFromModel(model));
    expect(r.converged).toBe(true);
    const alpha2 = r.alpha[2]! ** 2;
    expect(alpha2).toBeGreaterThan(0.05);
  });

  it('the strength comparison runs every code check of a braced column with a line load', () => {
    const rows = betaByStrengthModel(s, form(problemFromModel(model)));
    for (const r of rows) expect(r.beta).not.toBeNull();
  });
});

describe('a sway column with a top force and an out-of-plumb', () => {
  const text = edited(demoText('sway-canopy-post'), (name) => (name === 'dead' ? { horizontal: { dist: 'normal', mean: '3 kN', cov: 0.2 } } : {}), (doc) => {
    doc.column.imperfection = { ...(doc.column.imperfection ?? {}), out_of_plumb: 'en1993' };
    doc.strength = 'aisc360-e3';
  });
  // EN 1993-1-1 §5.3.2(3) (from memory): φ = φ0 αh αm, φ0 = 1/200, αh = 2/√h within [2/3, 1], αm = √(0.5(1 + 1/m)) = 1 for m = 1
  it('en1993 gives φ0 αh αm with h = L: 2/√3.6 > 1, so 1/200', () => {
    const s = loadScenario(text, 'sway.yaml');
    const phi = s.column.outOfPlumb!;
    expect(phi.kind === 'fixed' && phi.value).toBe(1 / 200);
    expect(en1993OutOfPlumb(6.25)).toBeCloseTo((1 / 200) * 0.8, 15);
    expect(en1993OutOfPlumb(16)).toBeCloseTo((1 / 200) * (2 / 3), 15);
  });
  it('the top force and P·φ lower the capacity; every strength model has a β', () => {
    const s = loadScenario(text, 'sway.yaml');
    const model = buildColumnModel(s);
    const plain = buildColumnModel(loadScenario(edited(demoText('sway-canopy-post'), () => ({}), (d) => { d.strength = 'aisc360-e3'; }), 'p.yaml'));
    const x = Float64Array.from(model.mean);
    const xPlain = Float64Array.from(plain.mean);
    expect(model.capacity(x)).toBeLessThan(plain.capacity(xPlain));
    const st = model.state(x);
    expect(st.transverse!.top).toBeCloseTo(x[model.names.indexOf('loads.dead.horizontal')]! / model.demand(x) + 1 / 200, 12);
    const rows = betaByStrengthModel(s, form(problemFromModel(model)));
    for (const r of rows) expect(r.beta).not.toBeNull();
  });
  // EN 1990 4.1.2 (common practice): an adverse variable action is characterised by its 95 % fractile, a permanent one by its mean
  it('the top force is an adverse action of its load in the characteristic-value table', () => {
    const model = buildColumnModel(loadScenario(text, 'sway.yaml'));
    const f = form(problemFromModel(model));
    const row = characteristicValues(model, f).rows.find((r) => r.variable === 'loads.dead.horizontal')!;
    expect(f.designPointX[model.names.indexOf('loads.dead.horizontal')]!).toBeGreaterThan(row.mean);
    expect(row.side).toBe('load');
    expect(row.fractile).toBeNull(); // the dead load is permanent: its actions too
    expect(row.characteristic).toBe(row.mean);
  });
});

describe('bad input: exit 2, one message naming the field', () => {
  const braced = demoText('braced-base-plate');
  const cases: [string, string, RegExp][] = [
    ['a top force on a braced column', edited(braced, (n) => (n === 'dead' ? { horizontal: '2 kN' } : {})), /loads\.dead\.horizontal.*sway frame/],
    ['an out-of-plumb on a braced column', edited(braced, () => ({}), (d) => { d.column.imperfection = { ...(d.column.imperfection ?? {}), out_of_plumb: 0.004 }; }), /column\.imperfection\.out_of_plumb.*sway frame/],
    ['a line load in the wrong unit', edited(braced, (n) => (n === 'dead' ? { transverse: '2 kN' } : {})), /loads\.dead\.transverse/],
    ['an end moment in the wrong unit', edited(braced, (n) => (n === 'dead' ? { moments: { top: '2 kN/m' } } : {})), /loads\.dead\.moments\.top/],
    ['an out-of-plumb that is not small', edited(demoText('sway-canopy-post'), () => ({}), (d) => { d.strength = 'first-yield'; d.column.imperfection = { ...(d.column.imperfection ?? {}), out_of_plumb: 0.5 }; }), /out_of_plumb.*small angle/],
  ];
  // common practice: EN 1993-1-1 §5.2.2(3)a, second-order analysis with the §5.3.2(11) bow, so the equivalent-bow
  // models take these actions; a line load or an out-of-plumb lowers their capacity
  it('an equivalent-bow model takes a line load and an out-of-plumb', async () => {
    const capacity = async (text: string) => {
      const r = await runCli(['check', '-', '--json'], text);
      expect(r.status).toBe(0);
      return (JSON.parse(r.stdout) as { check: { capacity: number } }).check.capacity;
    };
    const eqBow = (d: { strength?: string }) => { d.strength = 'first-yield-en1993-b'; };
    const plain = await capacity(edited(braced, () => ({}), eqBow));
    expect(await capacity(edited(braced, (n) => (n === 'dead' ? { transverse: '1 kN/m' } : {}), eqBow))).toBeLessThan(plain);
    const sway = (phi: number) => edited(demoText('sway-canopy-post'), () => ({}), (d) => { eqBow(d); d.column.imperfection = { ...(d.column.imperfection ?? {}), ...(phi ? { out_of_plumb: phi } : {}) }; });
    expect(await capacity(sway(0.003))).toBeLessThan(await capacity(sway(0)));
  });

  it.each(cases)('%s', async (_label, text, message) => {
    const r = await runCli(['check', '-'], text);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(message);
    expect(r.stderr).not.toMatch(/\n\s+at /);
    expect(r.stdout).toBe('');
  });

  it('a code curve checks a top force on a sway column (exit 0, a lower capacity)', async () => {
    const plain = await runCli(['check', '-', '--json'], demoText('sway-canopy-post'));
    const r = await runCli(['check', '-', '--json'], edited(demoText('sway-canopy-post'), (n) => (n === 'dead' ? { horizontal: '2 kN' } : {})));
    expect(r.status).toBe(0);
    const capacity = (out: string) => (JSON.parse(out) as { check: { capacity: number } }).check.capacity;
    expect(capacity(r.stdout)).toBeLessThan(capacity(plain.stdout));
  });

  it('check --json prints the line load and end couples the connection moments include', async () => {
    const r = await runCli(['check', '-', '--json'], WINDY);
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout) as { check: { connection_response: { line_load: number; end_couples: { top: number } } } };
    // at the means of the 50-year maximum the line load is the Gumbel mean shifted by ln(50)/α
    const model = buildColumnModel(loadScenario(WINDY, 'windy.yaml'));
    expect(out.check.connection_response.line_load).toBeCloseTo(model.mean[2]!, 6);
    expect(model.mean[2]!).toBeGreaterThan(2.4e3);
    expect(out.check.connection_response.end_couples.top).toBeCloseTo(6e3, 6);
  });
});
