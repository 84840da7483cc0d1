/**
 * Copies of a scenario with one value changed, by its contract path. The studies use these to ask
 * "what if": a variable known exactly (conditional β), a shifted mean (elasticities), a stiffer
 * connection (restraint study), a swept quantity.
 */
import type { DistSpec } from '../probability/distribution.js';
import { makeDistribution } from '../probability/makeDistribution.js';
import type { End, Scalar, Scenario, SeriesComponent } from '../scenario/types.js';
import { meanOf } from '../scenario/readScalar.js';
import { scaledComponents, seriesComponentPath, seriesStiffnessAtMeans } from '../scenario/seriesEnd.js';
import { restraintRatio } from '../scenario/restraintRatio.js';

type Mutable<T> = { -readonly [K in keyof T]: Mutable<T[K]> };

function clone(s: Scenario): Mutable<Scenario> {
  return structuredClone(s) as Mutable<Scenario>;
}

function setEndScalar(end: Mutable<End>, leaf: string, scalar: Scalar, s: Scenario, path: string): void {
  if (leaf === 'rotation' && end.type === 'rotation') {
    end.k = scalar;
    return;
  }
  if (end.type === 'series' && leaf.startsWith('series.')) {
    const component = end.components.find((c) => c.name === leaf.slice('series.'.length));
    if (component && component.k !== 'rigid') {
      component.k = scalar;
      return;
    }
  }
  if (end.type === 'ratio' && leaf === end.from) {
    end.input = scalar;
    // a uniform spec has no `mean` field: take the distribution's own mean
    const v = scalar.kind === 'fixed' ? scalar.value : makeDistribution(scalar.spec).mean;
    end.R = restraintRatio(end.from, s.column.frame, v);
    return;
  }
  throw new Error(`${path} is not a value of this scenario`);
}

/** The scenario with the scalar at `path` replaced. Correlations of a variable made fixed are dropped. */
export function withScalar(s: Scenario, path: string, scalar: Scalar): Scenario {
  const out = clone(s);
  const c = out.column;
  const endMatch = /^column\.(ends|axis_z\.ends)\.(bottom|top)\.(rotation|fixity|alignment_g|series\.[A-Za-z][A-Za-z0-9_]*)$/.exec(path);
  if (endMatch) {
    const ends = endMatch[1] === 'ends' ? c.ends : c.axisZ?.ends;
    if (ends === undefined) throw new Error(`${path} is not a value of this scenario`);
    setEndScalar(ends[endMatch[2] as 'bottom' | 'top'], endMatch[3], scalar, s, path);
  } else if (path.startsWith('loads.')) {
    // a load's own actions: loads.<name>.eccentricity.top|bottom, .moments.top|bottom, .transverse, .horizontal
    const action = /^(loads\.[^.]+)\.(eccentricity|moments)\.(top|bottom)$|^(loads\.[^.]+)\.(transverse|horizontal)$/.exec(path);
    const load = out.loads.find((l) => l.path === (action ? (action[1] ?? action[4]) : path));
    if (!load) throw new Error(`${path} is not a load of this scenario`);
    if (!action) load.value = scalar;
    else if (action[2] !== undefined) {
      const pair = load[action[2] as 'eccentricity' | 'moments'];
      if (!pair) throw new Error(`${path} is not a value of this scenario`);
      pair[action[3] as 'top' | 'bottom'] = scalar;
    } else {
      if (load[action[5] as 'transverse' | 'horizontal'] === undefined) throw new Error(`${path} is not a value of this scenario`);
      load[action[5] as 'transverse' | 'horizontal'] = scalar;
    }
  } else {
    switch (path) {
      case 'column.section.area': c.section.area = scalar; break;
      case 'column.section.inertia': c.section.inertia = scalar; break;
      case 'column.section.section_modulus': c.section.sectionModulus = scalar; break;
      case 'column.material.E': c.material.E = scalar; break;
      case 'column.material.fy': c.material.fy = scalar; break;
      case 'column.ends.lateral':
        if (c.ends.lateral === null) throw new Error(`${path}: a braced column has no lateral spring`);
        c.ends.lateral = scalar;
        break;
      case 'column.imperfection.bow': c.bow = scalar; break;
      case 'column.section.inertia_z':
      case 'column.section.section_modulus_z':
        if (c.section.inertiaZ === undefined) throw new Error(`${path} is not a value of this scenario`);
        if (path.endsWith('inertia_z')) c.section.inertiaZ = scalar;
        else c.section.sectionModulusZ = scalar;
        break;
      case 'column.section.corrosion.loss':
      case 'column.section.corrosion.flange':
      case 'column.section.corrosion.web': {
        const k = c.section.geometry?.corrosion;
        if (k === undefined) throw new Error(`${path} is not a value of this scenario`);
        if (!path.endsWith('.web')) k.primary = scalar;
        if (!path.endsWith('.flange')) k.secondary = scalar;
        break;
      }
      case 'column.axis_z.ends.lateral':
        if (!c.axisZ || c.axisZ.ends.lateral === null) throw new Error(`${path}: no lateral spring about z`);
        c.axisZ.ends.lateral = scalar;
        break;
      case 'column.axis_z.imperfection.bow':
        if (!c.axisZ) throw new Error(`${path} is not a value of this scenario`);
        c.axisZ.bow = scalar;
        break;
      case 'column.imperfection.out_of_plumb':
        if (c.outOfPlumb === undefined) throw new Error(`${path} is not a value of this scenario`);
        c.outOfPlumb = scalar;
        break;
      case 'model_factor': out.modelFactor = scalar; break;
      default:
        throw new Error(`${path} is not a value of this scenario`);
    }
  }
  if (scalar.kind === 'fixed') out.correlation = out.correlation.filter((r) => r.a !== path && r.b !== path);
  return out as Scenario;
}

/** A distribution with its mean and standard deviation moved (coefficient of variation recomputed). */
export function withMoments(spec: DistSpec, mean: number, sd: number): DistSpec {
  if (spec.dist === 'studentt') {
    // a t with ν <= 2 has no finite sd: its scale moves in proportion to the shift in sd asked for
    const d = makeDistribution(spec);
    const scale = Number.isFinite(d.sd) ? sd * Math.sqrt((spec.dof! - 2) / spec.dof!) : spec.scale!;
    return { ...spec, loc: mean, scale };
  }
  if (spec.dist === 'logstudentt') {
    // mean and sd of a log-Student-t are its lognormal stand-ins (docs/evidence.md): invert them
    const scale2 = Math.log1p((sd / mean) ** 2);
    return { ...spec, loc: Math.log(mean) - 0.5 * scale2, scale: Math.sqrt(scale2) };
  }
  const out: DistSpec = { ...spec, mean };
  if (spec.dist === 'uniform') {
    const half = Math.sqrt(3) * sd;
    return { dist: 'uniform', min: mean - half, max: mean + half };
  }
  delete out.cov;
  out.sd = sd;
  return out;
}

/** Every length-like parameter of a distribution multiplied by `factor` (its coefficient of variation kept). */
export function scaleSpec(spec: DistSpec, factor: number): DistSpec {
  if (spec.dist === 'studentt') return { ...spec, loc: spec.loc! * factor, scale: spec.scale! * Math.abs(factor) };
  if (spec.dist === 'logstudentt') return { ...spec, loc: spec.loc! + Math.log(factor) };
  const out: DistSpec = { ...spec };
  for (const key of ['mean', 'sd', 'min', 'max'] as const) if (out[key] !== undefined) out[key] = (out[key] as number) * factor;
  return out;
}

/** A scalar multiplied by `factor`: a fixed value, or a random one with its CoV kept. */
export function scaleScalar(v: Scalar, factor: number): Scalar {
  return v.kind === 'fixed' ? { kind: 'fixed', value: v.value * factor } : { kind: 'random', spec: scaleSpec(v.spec, factor) };
}

/**
 * The scenario with the rotational spring of `end` set from its base stiffness times `factor`:
 * 0 → pinned, Infinity → fixed. A series end (springs in series) keeps its other components:
 * `base` then stands for the component named `connection` (Infinity makes that component rigid),
 * or, without one, for the end's effective stiffness at the means, every component being scaled
 * by the same factor so that the effective mean becomes factor × mean(base) (seriesEnd.ts,
 * `scaledComponents`). `axis` 'z' edits the ends about z (`column.axis_z.ends`) instead.
 */
export function withEndStiffness(s: Scenario, end: 'bottom' | 'top', base: Scalar, factor: number, axis: 'y' | 'z' = 'y'): Scenario {
  const given = endsAbout(s, axis)[end];
  if (given.type === 'series' && factor > 0) return withSeriesStiffness(s, end, given, base, factor, axis);
  const out = clone(s);
  const replaced: End =
    factor === 0 ? { type: 'pinned' } : factor === Infinity ? { type: 'fixed' } : { type: 'rotation', k: scaleScalar(base, factor) };
  setEnd(out, axis, end, replaced);
  // a correlation survives only while its variable does (a random spring keeps the path `.rotation`)
  const prefix = `${endsPath(axis)}.${end}.`;
  const kept = replaced.type === 'rotation' && replaced.k.kind === 'random' ? `${prefix}rotation` : null;
  const gone = (p: string) => p.startsWith(prefix) && p !== kept;
  out.correlation = out.correlation.filter((r) => !gone(r.a) && !gone(r.b));
  return out as Scenario;
}

type SeriesEnd = Extract<End, { type: 'series' }>;

/** The contract path of the ends about an axis. */
export function endsPath(axis: 'y' | 'z'): string {
  return axis === 'y' ? 'column.ends' : 'column.axis_z.ends';
}

/** The ends about an axis (about z only when the scenario has `column.axis_z`). */
export function endsAbout(s: Scenario, axis: 'y' | 'z'): Scenario['column']['ends'] {
  if (axis === 'y') return s.column.ends;
  if (s.column.axisZ === undefined) throw new Error('the scenario has no axis z');
  return s.column.axisZ.ends;
}

function setEnd(out: Mutable<Scenario>, axis: 'y' | 'z', end: 'bottom' | 'top', replaced: End): void {
  if (axis === 'y') out.column.ends[end] = replaced as Mutable<End>;
  else out.column.axisZ!.ends[end] = replaced as Mutable<End>;
}

function withSeriesStiffness(s: Scenario, end: 'bottom' | 'top', given: SeriesEnd, base: Scalar, factor: number, axis: 'y' | 'z'): Scenario {
  const scaled = scaledComponents(given);
  const byConnection = scaled.length === 1 && scaled[0] === 'connection';
  // without a `connection`, every component × one ratio: the effective stiffness scales by that ratio
  const ratio = byConnection ? factor : (factor * meanOf(base)) / seriesStiffnessAtMeans(given);
  const components: SeriesComponent[] = given.components.map((c) => {
    if (c.k === 'rigid' || !scaled.includes(c.name)) return c;
    if (!Number.isFinite(ratio)) return { name: c.name, k: 'rigid' };
    return { name: c.name, k: byConnection ? scaleScalar(base, factor) : scaleScalar(c.k, ratio) };
  });
  const replaced: End = components.every((c) => c.k === 'rigid') ? { type: 'fixed' } : { ...given, components };
  const out = clone(s);
  setEnd(out, axis, end, replaced);
  const prefix = `${endsPath(axis)}.${end}.`;
  const kept = new Set(
    replaced.type === 'series' ? replaced.components.filter((c) => c.k !== 'rigid' && c.k.kind === 'random').map((c) => seriesComponentPath(`${endsPath(axis)}.${end}`, c.name)) : [],
  );
  const gone = (p: string) => p.startsWith(prefix) && !kept.has(p);
  out.correlation = out.correlation.filter((r) => !gone(r.a) && !gone(r.b));
  return out as Scenario;
}
