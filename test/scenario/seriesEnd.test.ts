import { describe, expect, it } from 'vitest';
import { loadScenario } from '../../src/scenario/loadScenario.js';
import { buildColumnModel } from '../../src/limitState/columnModel.js';
import { deterministicCheck, checkJson } from '../../src/limitState/deterministicCheck.js';
import { scenarioForm } from '../../src/studies/columnForm.js';
import { seriesStiffness } from '../../src/scenario/seriesEnd.js';
import { withEndStiffness } from '../../src/limitState/scenarioEdits.js';

// fixed E and I so R = kL/EI can be checked by hand: EI = 200 GPa × 15.4e6 mm⁴ = 3.08e6 N·m²
function scenario(bottom: string, top: string, randomE = false): string {
  return `stanchion: 1
title: series end test
column:
  length: 5.6 m
  frame: braced
  section: {area: 6640 mm^2, inertia: 15.4e6 mm^4, section_modulus: 152e3 mm^3}
  material:
    E: ${randomE ? '{dist: lognormal, mean: 200 GPa, cov: 0.03}' : '200 GPa'}
    fy: {dist: lognormal, mean: 300 MPa, cov: 0.07}
  ends:
    bottom: ${bottom}
    top: ${top}
  imperfection: {bow: L/1000}
loads:
  dead: {dist: normal, mean: 560 kN, cov: 0.10, kind: permanent}
model_factor: 1.0
strength: first-yield
target_beta: 3.8
`;
}
const load = (text: string) => loadScenario(text, 'series.yaml');

describe('rotational end springs in series', () => {
  it('1/k = Σ 1/k_i (springs in series, common practice)', () => {
    expect(seriesStiffness([2.5e6, 8e6])).toBeCloseTo(1 / (1 / 2.5e6 + 1 / 8e6), 6); // 1.904762 MN·m/rad
    expect(seriesStiffness([2.5e6, 8e6]) / 1e6).toBeCloseTo(1.9047619, 6);
    expect(seriesStiffness([3e6, 3e6, 3e6])).toBeCloseTo(1e6, 6);
    expect(seriesStiffness([2e6, 0])).toBe(0); // a zero component pins the end
    expect(seriesStiffness([])).toBe(Infinity);
  });

  it('the effective stiffness feeds R = kL/EI and the check prints the components (hand values)', () => {
    const s = load(scenario('{series: {connection: 2.5 MN m/rad, foundation: 8 MN m/rad}}', '{series: {connection: 900 kN m/rad, beam: rigid}}'));
    const c = deterministicCheck(buildColumnModel(s));
    // k = 1/(1/2.5 + 1/8) MN·m/rad = 1.9047619 MN·m/rad; R = k·5.6 m / 3.08e6 N·m² = 3.4632035
    expect(c.restraint_ratio.bottom).toBeCloseTo(3.4632035, 6);
    // a rigid component drops out: R = 0.9e6 × 5.6 / 3.08e6 = 1.6363636
    expect(c.restraint_ratio.top).toBeCloseTo(1.6363636, 6);
    expect(c.seriesSprings.bottom?.effective_stiffness).toBeCloseTo(1.9047619e6, 0);
    expect(c.seriesSprings.top?.components).toEqual([
      { name: 'connection', stiffness: 900e3, random: false },
      { name: 'beam', stiffness: null, random: false },
    ]);
    expect(checkJson(c)).toHaveProperty('series_springs.bottom.effective_stiffness');
  });

  it('a rigid component drops out exactly, and an all-rigid series end is a fixed end', () => {
    const withRigid = load(scenario('{series: {connection: 2.5 MN m/rad, foundation: rigid}}', 'pinned'));
    const plain = load(scenario('{rotation: 2.5 MN m/rad}', 'pinned'));
    expect(deterministicCheck(buildColumnModel(withRigid)).critical_load).toBe(deterministicCheck(buildColumnModel(plain)).critical_load);
    expect(load(scenario('{series: {connection: rigid, foundation: rigid}}', 'pinned')).column.ends.bottom).toEqual({ type: 'fixed' });
  });

  it('a series end of one component equals the plain {rotation} end bit for bit (check and FORM β)', () => {
    const spring = '{dist: lognormal, mean: 1.2 MN m/rad, cov: 0.5}';
    const series = load(scenario(`{series: {connection: ${spring}}}`, '{rotation: 250 kN m/rad}', true));
    const plain = load(scenario(`{rotation: ${spring}}`, '{rotation: 250 kN m/rad}', true));
    const a = deterministicCheck(buildColumnModel(series));
    const b = deterministicCheck(buildColumnModel(plain));
    expect(a.capacity).toBe(b.capacity);
    expect(a.effective_length_factor).toBe(b.effective_length_factor);
    expect(a.restraint_ratio).toEqual(b.restraint_ratio);
    expect(buildColumnModel(series).names).toContain('column.ends.bottom.series.connection');
    const betaSeries = scenarioForm(series).beta;
    expect(Number.isFinite(betaSeries)).toBe(true);
    expect(betaSeries).toBe(scenarioForm(plain).beta);
  });

  it('each random component is its own variable; the restraint edit scales only the connection', () => {
    const s = load(
      scenario(
        '{series: {connection: {dist: lognormal, mean: 2.5 MN m/rad, cov: 0.4}, foundation: {dist: lognormal, mean: 8 MN m/rad, cov: 0.5}}}',
        'pinned',
        true,
      ),
    );
    const model = buildColumnModel(s);
    expect(model.names).toEqual(['column.material.E', 'column.material.fy', 'column.ends.bottom.series.connection', 'column.ends.bottom.series.foundation', 'loads.dead']);
    const e = s.column.ends.bottom;
    if (e.type !== 'series' || e.components[0].k === 'rigid') throw new Error('expected a series end');
    const doubled = withEndStiffness(s, 'bottom', e.components[0].k, 2).column.ends.bottom;
    expect(doubled).toMatchObject({
      type: 'series',
      components: [
        { name: 'connection', k: { kind: 'random', spec: { dist: 'lognormal', mean: 5e6, cov: 0.4 } } },
        { name: 'foundation', k: { kind: 'random', spec: { dist: 'lognormal', mean: 8e6, cov: 0.5 } } },
      ],
    });
    // a rigid connection leaves the foundation's flexibility
    const rigid = withEndStiffness(s, 'bottom', e.components[0].k, Infinity).column.ends.bottom;
    expect(rigid).toMatchObject({ type: 'series', components: [{ name: 'connection', k: 'rigid' }, { name: 'foundation' }] });
  });

  it('without a connection component every component is scaled so the effective mean scales by the factor', () => {
    const s = load(scenario('{series: {plate: 2.5 MN m/rad, foundation: 8 MN m/rad}}', 'pinned'));
    const k = 1 / (1 / 2.5e6 + 1 / 8e6);
    const t = withEndStiffness(s, 'bottom', { kind: 'fixed', value: k }, 3);
    const c = deterministicCheck(buildColumnModel(t));
    expect(c.seriesSprings.bottom?.effective_stiffness).toBeCloseTo(3 * k, 3);
  });
});
