/**
 * Two principal axes: capacity = min over the axes, the governing axis, per-axis reliability,
 * sections by dimensions with corrosion in g, and one-axis scenarios unchanged to the last bit.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import YAML from 'yaml';
import { buildColumnModel } from '../../src/limitState/columnModel.js';
import { checkJson, deterministicCheck } from '../../src/limitState/deterministicCheck.js';
import { columnCapacity } from '../../src/mechanics/columnCapacity.js';
import { loadScenario } from '../../src/scenario/loadScenario.js';
import { axesReliability } from '../../src/studies/axisReliability.js';
import { form } from '../../src/reliability/form.js';
import { problemFromModel } from '../../src/limitState/columnRecipe.js';
import { namedProperties, PROPERTY_COUNT, sectionWriter } from '../../src/sections/index.js';

const base = {
  stanchion: 1,
  column: {
    length: '4.5 m',
    frame: 'braced',
    section: { area: '5380 mm^2', inertia: '36.9e6 mm^4', section_modulus: '389e3 mm^3', inertia_z: '13.4e6 mm^4', section_modulus_z: '134e3 mm^3' },
    material: { E: { dist: 'lognormal', mean: '210 GPa', cov: 0.03 }, fy: { dist: 'lognormal', mean: '300 MPa', cov: 0.07 } },
    ends: { bottom: { rotation: { dist: 'lognormal', mean: '2 MN m/rad', cov: 0.4 } }, top: 'pinned' },
    imperfection: { bow: 'L/1000' },
    axis_z: { ends: { bottom: 'pinned', top: 'pinned' }, imperfection: { bow: 'L/1000' } },
  },
  loads: { dead: { dist: 'normal', mean: '300 kN', cov: 0.1 } },
  strength: 'first-yield',
};

type Doc = typeof base & Record<string, unknown>;
const scenario = (edit: (d: Doc) => void = () => {}) => {
  const d = structuredClone(base) as Doc;
  edit(d);
  return loadScenario(YAML.stringify(d), 'test.yaml');
};

/** The same column about one axis, written as a one-axis scenario (the form that existed before). */
const oneAxis = (axis: 'y' | 'z', edit: (d: Doc) => void = () => {}) =>
  scenario((d) => {
    edit(d);
    const c = d.column as Record<string, any>;
    if (axis === 'z') {
      c.section = { area: c.section.area, inertia: c.section.inertia_z, section_modulus: c.section.section_modulus_z };
      c.ends = c.axis_z.ends;
      c.imperfection = c.axis_z.imperfection;
    } else {
      c.section = { area: c.section.area, inertia: c.section.inertia, section_modulus: c.section.section_modulus };
    }
    delete c.axis_z;
  });

function probes(model: ReturnType<typeof buildColumnModel>): Float64Array[] {
  const out = [Float64Array.from(model.mean)];
  for (const p of [0.01, 0.3, 0.8, 0.999]) out.push(Float64Array.from(model.dists, (d) => d.quantile(p)));
  return out;
}

describe('two principal axes: capacity is the smaller, and the check says which governs', () => {
  it('z governs (pinned about the weak axis): capacity equals the one-axis column about z', () => {
    const two = buildColumnModel(scenario());
    const z = buildColumnModel(oneAxis('z'));
    const y = buildColumnModel(oneAxis('y'));
    expect(two.names).toEqual([...y.names]); // the pinned z ends add no variable
    for (const x of probes(two)) {
      expect(two.capacity(x)).toBe(Math.min(y.capacity(x), z.capacity(x)));
      expect(two.capacity(x)).toBe(z.capacity(x));
    }
    const check = deterministicCheck(two);
    expect(check.axes?.governing).toBe('z');
    expect(check.capacity).toBe(check.axes!.z.capacity);
    expect(check.capacity).toBeLessThan(check.axes!.y.capacity);
    expect(checkJson(check).governing_axis).toBe('z');
  });

  it('y governs when the weak axis is fixed at both ends and held nearly as stiff', () => {
    const s = scenario((d) => {
      d.column.axis_z.ends = { bottom: 'fixed', top: 'fixed' } as never;
      d.column.section.inertia_z = '30e6 mm^4';
      d.column.section.section_modulus_z = '300e3 mm^3';
    });
    const two = buildColumnModel(s);
    const check = deterministicCheck(two);
    expect(check.axes?.governing).toBe('y');
    expect(check.capacity).toBe(check.axes!.y.capacity);
    // the governing value is exactly the mechanics' answer about y
    expect(check.capacity).toBe(columnCapacity('first-yield', two.axes[0]!.state(two.mean)).capacity);
  });

  it('a random spring about z is a variable of its own, named by its path', () => {
    const s = scenario((d) => {
      d.column.axis_z.ends.bottom = { rotation: { dist: 'lognormal', mean: '0.2 MN m/rad', cov: 0.6 } } as never;
    });
    const model = buildColumnModel(s);
    expect(model.names).toContain('column.axis_z.ends.bottom.rotation');
    const z = buildColumnModel(oneAxis('z', (d) => {
      d.column.axis_z.ends.bottom = { rotation: { dist: 'lognormal', mean: '0.2 MN m/rad', cov: 0.6 } } as never;
    }));
    // about z alone, at the same physical point, the capacity is the one-axis column's about z
    const x = Float64Array.from(model.mean);
    const iz = model.names.indexOf('column.axis_z.ends.bottom.rotation');
    const xz = Float64Array.from(z.mean);
    xz[z.names.indexOf('column.ends.bottom.rotation')] = x[iz];
    expect(model.axes[1]!.capacity(x)).toBe(z.capacity(xz));
  });

  it('the β of each axis alone: the governing axis has the lower β, and the column is no safer than it', () => {
    const model = buildColumnModel(scenario());
    const a = axesReliability(model, 'z')!;
    expect(a.governing).toBe('z');
    expect(a.z.beta).toBeLessThan(a.y.beta);
    // the z ends are pinned: about z the column is the one-axis column about z (the y spring then plays no part)
    const zAlone = form(problemFromModel(buildColumnModel(oneAxis('z'))));
    expect(a.z.beta).toBeCloseTo(zAlone.beta, 3);
    // the column fails when either axis does: its β is at most the governing axis'
    expect(form(problemFromModel(model)).beta).toBeLessThanOrEqual(a.z.beta + 1e-3);
    expect(axesReliability(buildColumnModel(oneAxis('z')), 'y')).toBeNull();
  });

  it('an EN 1993-1-1 curve about z (Table 6.2) changes only the z capacity', () => {
    const b = buildColumnModel(scenario((d) => { d.strength = 'en1993-b'; }));
    const bc = buildColumnModel(scenario((d) => { d.strength = 'en1993-b'; (d.column.axis_z as Record<string, unknown>).curve = 'c'; }));
    const x = b.mean;
    expect(bc.axes[0]!.capacity(x)).toBe(b.axes[0]!.capacity(x));
    expect(bc.axes[1]!.capacity(x)).toBeLessThan(b.axes[1]!.capacity(x));
    expect(bc.axes[1]!.strength).toBe('en1993-c');
  });
});

describe('a section by its dimensions, with corrosion in g', () => {
  const hea200 = { shape: 'i', h: '190 mm', b: '200 mm', tw: '6.5 mm', tf: '10 mm', r: '18 mm' };
  const props = (loss: number) => {
    const out = new Float64Array(PROPERTY_COUNT);
    sectionWriter({ shape: 'i', h: 0.19, b: 0.2, tw: 0.0065, tf: 0.01, r: 0.018 })(out, loss, loss);
    return namedProperties(out);
  };

  it('without corrosion it is the same column as its properties typed in', () => {
    const byShape = buildColumnModel(scenario((d) => { d.column.section = hea200 as never; }));
    const p = props(0);
    const byProps = buildColumnModel(scenario((d) => {
      d.column.section = { area: `${p.A} m^2`, inertia: `${p.Iy} m^4`, section_modulus: `${p.Wel_y} m^3`, inertia_z: `${p.Iz} m^4`, section_modulus_z: `${p.Wel_z} m^3` } as never;
    }));
    for (const x of probes(byShape)) expect(byShape.capacity(x) / byProps.capacity(x)).toBeCloseTo(1, 12);
  });

  it('a random loss is sampled: g at loss d equals the column with d fixed', () => {
    const random = buildColumnModel(scenario((d) => {
      d.column.section = { ...hea200, corrosion: { loss: { dist: 'lognormal', mean: '1 mm', cov: 0.5 } } } as never;
    }));
    const at = random.names.indexOf('column.section.corrosion.loss');
    expect(at).toBeGreaterThanOrEqual(0);
    for (const d of [0.2e-3, 1e-3, 2.5e-3]) {
      const fixed = buildColumnModel(scenario((doc) => {
        doc.column.section = { ...hea200, corrosion: { loss: `${d * 1e3} mm` } } as never;
      }));
      const x = Float64Array.from(random.mean);
      x[at] = d;
      expect(random.capacity(x)).toBe(fixed.capacity(fixed.mean.length === x.length - 1 ? Float64Array.from(x.filter((_, i) => i !== at)) : x));
    }
    // more loss, less capacity; a loss through the flange carries nothing
    const x = Float64Array.from(random.mean);
    x[at] = 0.5e-3;
    const c1 = random.capacity(x);
    x[at] = 2e-3;
    expect(random.capacity(x)).toBeLessThan(c1);
    x[at] = 6e-3;
    expect(random.capacity(x)).toBe(0);
  });
});

describe('one-axis scenarios give exactly what they gave before the second axis existed', () => {
  for (const name of ['braced-base-plate', 'sway-canopy-post', 'timber-store-post']) {
    it(`${name}: check --json equals the output recorded before the change`, () => {
      const text = readFileSync(new URL(`../../scenarios/${name}.yaml`, import.meta.url), 'utf8');
      const recorded = readFileSync(new URL(`../reference/one-axis-check/${name}.json`, import.meta.url), 'utf8');
      const now = JSON.stringify({ check: checkJson(deterministicCheck(buildColumnModel(loadScenario(text, `${name}.yaml`)))) }, null, 2) + '\n';
      expect(now).toBe(recorded);
    });
  }
});
