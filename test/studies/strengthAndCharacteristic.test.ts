import { describe, expect, it } from 'vitest';
import { buildColumnModel } from '../../src/limitState/columnModel.js';
import { problemFromModel } from '../../src/limitState/columnRecipe.js';
import { resolveStrengthModel } from '../../src/limitState/strengthChoice.js';
import { form } from '../../src/reliability/form.js';
import { loadScenario } from '../../src/scenario/loadScenario.js';
import { characteristicValues } from '../../src/studies/characteristicValues.js';
import { betaByStrengthModel, COMPARED_STRENGTH_MODELS } from '../../src/studies/strengthComparison.js';

// The scenario is invented for the test.
function scenario(strength: string, extra = '', bow = 'bow: {dist: normal, mean: L/1500, sd: L/3000}'): string {
  return `stanchion: 1
title: test column
column:
  length: 4.5 m
  frame: braced
  section: {area: 7640 mm^2, inertia: 25.1e6 mm^4, section_modulus: 281e3 mm^3}
  material:
    E: {dist: lognormal, mean: 200 GPa, cov: 0.03}
    fy: {dist: lognormal, mean: 300 MPa, cov: 0.07}
  ends:
    bottom: {rotation: {dist: lognormal, mean: 1.2 MN m/rad, cov: 0.4}}
    top: pinned
  imperfection:
    ${bow}
loads:
  dead: {dist: normal, mean: 400 kN, cov: 0.10}
  imposed: {dist: gumbel, mean: 160 kN, cov: 0.30}
strength: ${strength}
${extra}`;
}

const Z95 = 1.6448536269514722; // Φ⁻¹(0.95), common practice

describe('model uncertainty that follows the strength model', () => {
  // source: mechanics/modelUncertainty.ts defaults (from memory): European curves lognormal 1.10 / 0.07, first yield 1.00 / 0.10
  it('puts in the strength model default when the scenario gives no model_factor, and says so', () => {
    const m = buildColumnModel(loadScenario(scenario('en1993-b'), 't.yaml'));
    expect(m.names).toContain('model_factor');
    expect(m.modelFactorUsed).toMatchObject({ source: 'default', strength: 'en1993-b', dist: 'lognormal' });
    expect(m.modelFactorUsed.mean).toBeCloseTo(1.1, 12);
    expect(m.modelFactorUsed.cov).toBeCloseTo(0.07, 12);
    const given = buildColumnModel(loadScenario(scenario('en1993-b', 'model_factor: {dist: lognormal, mean: 1.0, cov: 0.05}'), 't.yaml'));
    expect(given.modelFactorUsed).toMatchObject({ source: 'scenario', mean: 1 });
  });

  // common practice: a variable that cannot change the capacity has α = 0 and only clutters the lists
  it('takes the bow out of the random variables (and its correlations) when the model ignores it', () => {
    const text = scenario('en1993-c', 'correlation:\n  - [column.imperfection.bow, column.material.fy, 0.3]\n  - [column.material.E, column.material.fy, 0.2]');
    const r = resolveStrengthModel(loadScenario(text, 't.yaml'));
    expect(r.bowDropped).toBe(true);
    expect(r.scenario.column.bow).toEqual({ kind: 'fixed', value: 4.5 / 1500 });
    expect(r.scenario.correlation).toEqual([{ a: 'column.material.E', b: 'column.material.fy', rho: 0.2 }]);
    expect(buildColumnModel(r.scenario).names).not.toContain('column.imperfection.bow');
    // resolving again changes nothing
    expect(resolveStrengthModel(r.scenario).scenario).toEqual(r.scenario);
    expect(resolveStrengthModel(loadScenario(scenario('first-yield-en1993-c-plus-bow'), 't.yaml')).bowDropped).toBe(false);
  });

  // common practice: the table repeats the assessment's own β for the chosen model; every other row uses its own default θ
  it('tables β by strength model, each with its own model factor', () => {
    const s = loadScenario(scenario('en1993-b'), 't.yaml');
    const model = buildColumnModel(s);
    const f = form(problemFromModel(model));
    const rows = betaByStrengthModel(s, f);
    expect(rows.map((r) => r.strength)).toEqual(COMPARED_STRENGTH_MODELS);
    const chosen = rows.find((r) => r.chosen)!;
    expect(chosen.strength).toBe('en1993-b');
    expect(chosen.beta).toBe(f.beta);
    expect(rows.find((r) => r.strength === 'first-yield')!.modelFactor).toMatchObject({ source: 'default', mean: 1, cov: 0.1 });
    // a lower curve (larger α) gives a lower β under the same model factor
    const b = (m: string) => rows.find((r) => r.strength === m)!.beta!;
    expect(b('en1993-a0')).toBeGreaterThan(b('en1993-a'));
    expect(b('en1993-c')).toBeGreaterThan(b('en1993-d'));
    // an equivalent-bow model chosen joins the table; a scenario without a bow cannot evaluate first yield
    const noBow = loadScenario(scenario('first-yield-en1993-b', '', 'bow: 0 mm'), 't.yaml');
    const rows2 = betaByStrengthModel(noBow, form(problemFromModel(buildColumnModel(noBow))));
    expect(rows2.at(-1)).toMatchObject({ strength: 'first-yield-en1993-b', chosen: true });
    expect(rows2[0]).toMatchObject({ strength: 'first-yield', beta: null });
    // source: EN 1993-1-1 Eqs. 5.9/5.10 reproduce curve b, and both carry the same default θ: same β
    expect(rows2.at(-1)!.beta!).toBeCloseTo(rows2.find((r) => r.strength === 'en1993-b')!.beta!, 6);
  });
});

describe('characteristic values and implied partial factors', () => {
  const s = loadScenario(scenario('en1993-b'), 't.yaml');
  const model = buildColumnModel(s);
  const f = form(problemFromModel(model));
  const c = characteristicValues(model, f);
  const row = (v: string) => c.rows.find((r) => r.variable === v)!;
  const at = (v: string) => f.designPointX[f.names.indexOf(v)];

  // source: EN 1990:2002 4.1.2: resistance properties at the 5 % fractile; lognormal fractile exp(λ − 1.645 ζ) (common practice)
  it('takes the 5 % fractile on the resistance side and γ = x_k / x_d', () => {
    const zeta = Math.sqrt(Math.log(1 + 0.07 * 0.07));
    const lambda = Math.log(300e6) - zeta * zeta / 2;
    const fy = row('column.material.fy');
    expect(fy.side).toBe('resistance');
    expect(fy.fractile).toBe(0.05);
    expect(fy.characteristic!).toBeCloseTo(Math.exp(lambda - Z95 * zeta), -1);
    expect(fy.partialFactor!).toBeCloseTo(fy.characteristic! / at('column.material.fy'), 12);
    expect(fy.designToMean).toBeCloseTo(at('column.material.fy') / 300e6, 12);
    expect(row('model_factor').side).toBe('resistance');
  });

  // source: EN 1990:2002 4.1.2: permanent action at its mean, variable action at the 95 % fractile; Gumbel fractile u − ln(−ln p)/a (common practice)
  it('takes the mean of a permanent load and the 95 % fractile of a variable one, γ = x_d / x_k', () => {
    const dead = row('loads.dead');
    expect(dead).toMatchObject({ side: 'load', fractile: null, characteristic: 400e3 });
    expect(dead.partialFactor!).toBeCloseTo(at('loads.dead') / 400e3, 12);
    // source: EN 1990 Table A1.2(B): γ_G = 1.35, γ_Q = 1.5 shown for comparison with an EN strength model
    expect(dead.code).toMatchObject({ symbol: 'γ_G', value: 1.35 });
    const sd = 0.3 * 160e3;
    const a = Math.PI / (sd * Math.sqrt(6));
    const u = 160e3 - 0.5772156649015329 / a;
    const imposed = row('loads.imposed');
    expect(imposed).toMatchObject({ side: 'load', fractile: 0.95 });
    expect(imposed.characteristic!).toBeCloseTo(u - Math.log(-Math.log(0.95)) / a, 3);
    expect(imposed.partialFactor!).toBeCloseTo(at('loads.imposed') / imposed.characteristic!, 12);
    expect(imposed.code).toMatchObject({ symbol: 'γ_Q', value: 1.5 });
    // source: EN 1993-1-1 6.1(1) NOTE 2B, γ_M1 = 1.0 recommended
    expect(c.resistance.code).toMatchObject({ symbol: 'γ_M1', value: 1 });
    expect(c.code).toBe('EN 1990 / EN 1993-1-1');
    expect(c.resistance.partialFactor).toBeCloseTo(c.resistance.characteristic / c.resistance.design, 12);
  });

  // common practice: a load pushed below its mean by FORM helps the column; no partial factor is implied
  it('gives no partial factor to a favourable variable, and AISC factors for aisc360-e3', () => {
    const fav = characteristicValues(model, { ...f, designPointX: f.designPointX.map((x, i) => (f.names[i] === 'loads.dead' ? 350e3 : x)) });
    expect(fav.rows.find((r) => r.variable === 'loads.dead')).toMatchObject({ side: 'favourable', partialFactor: null, characteristic: null });
    const aisc = buildColumnModel(loadScenario(scenario('aisc360-e3'), 't.yaml'));
    const ca = characteristicValues(aisc, form(problemFromModel(aisc)));
    // source: AISC 360 E1 φc = 0.90; ASCE 7 §2.3 1.2D + 1.6L
    expect(ca.resistance.code!.value).toBeCloseTo(1 / 0.9, 12);
    expect(ca.rows.find((r) => r.variable === 'loads.imposed')!.code!.value).toBe(1.6);
    const fyOnly = buildColumnModel(loadScenario(scenario('first-yield'), 't.yaml'));
    expect(characteristicValues(fyOnly, form(problemFromModel(fyOnly))).code).toBeNull();
  });
});
