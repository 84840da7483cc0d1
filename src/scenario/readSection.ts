/**
 * `column.section` → the section about y (and z), in SI: given by its properties as before, by
 * its properties about both axes, or by its shape and dimensions with a corrosion loss
 * (docs/sections.md). Dimensions are fixed; a loss may be random.
 */
import { defaultCornerRadii } from '../sections/cornerRadii.js';
import { AREA, ELASTIC_MODULUS_Y, ELASTIC_MODULUS_Z, INERTIA_Y, INERTIA_Z, PROPERTY_COUNT } from '../sections/sectionProperties.js';
import { dimensionProblem, lossThrough, sectionWriter, type SectionDimensions } from '../sections/sectionDimensions.js';
import type { PathSegment } from './rawTree.js';
import { fail, meanOf, readScalar, type ReadContext } from './readScalar.js';
import type { ScenarioShape } from './scenarioShape.js';
import type { Scalar, Scenario, SectionGeometry } from './types.js';

type RawSection = ScenarioShape['column']['section'];
type Section = Scenario['column']['section'];
const AT: PathSegment[] = ['column', 'section'];
const ZERO: Scalar = { kind: 'fixed', value: 0 };

function fixedLength(raw: string, key: string, ctx: ReadContext): number {
  const s = readScalar(raw, { kind: 'length', domain: 'positive' }, [...AT, key], ctx);
  return s.kind === 'fixed' ? s.value : fail(ctx, [...AT, key], 'must be a fixed length');
}

function optionalLength(raw: string | undefined, key: string, ctx: ReadContext): number | undefined {
  if (raw === undefined) return undefined;
  const s = readScalar(raw, { kind: 'length', domain: 'nonnegative' }, [...AT, key], ctx);
  return s.kind === 'fixed' ? s.value : fail(ctx, [...AT, key], 'must be a fixed length');
}

function readDimensions(raw: Exclude<RawSection, { area: unknown }>, ctx: ReadContext): SectionDimensions {
  const len = (key: string) => fixedLength((raw as unknown as Record<string, string>)[key]!, key, ctx);
  switch (raw.shape) {
    case 'i':
      return { shape: 'i', h: len('h'), b: len('b'), tw: len('tw'), tf: len('tf'), r: optionalLength(raw.r, 'r', ctx) ?? 0 };
    case 'rhs': {
      const t = len('t');
      const radii = defaultCornerRadii(raw.finish ?? 'hot', t);
      const ro = optionalLength(raw.ro, 'ro', ctx) ?? radii.ro;
      const ri = optionalLength(raw.ri, 'ri', ctx) ?? (raw.ro !== undefined ? Math.max(ro - t, 0) : radii.ri);
      return { shape: 'rhs', h: len('h'), b: len('b'), t, ro, ri };
    }
    case 'chs':
      return { shape: 'chs', D: len('D'), t: len('t') };
    case 'rect':
      return { shape: 'rect', b: len('b'), h: len('h') };
  }
}

type RawCorrosion = NonNullable<Exclude<RawSection, { area: unknown }>['corrosion']>;

function readLoss(raw: RawCorrosion[keyof RawCorrosion], key: string, bound: number, what: string, ctx: ReadContext): Scalar {
  const path = [...AT, 'corrosion', key];
  const s = readScalar(raw as never, { kind: 'length', domain: 'nonnegative' }, path, ctx);
  const mean = meanOf(s);
  if (!(mean < bound)) fail(ctx, path, `a mean loss of ${(mean * 1e3).toPrecision(3)} mm per face leaves nothing of the ${what} (it is lost at ${(bound * 1e3).toPrecision(3)} mm)`);
  // a random loss whose upper tail passes through the plate is allowed: such samples carry no load
  return s;
}

function readCorrosion(raw: RawCorrosion | undefined, d: SectionDimensions, length: number, ctx: ReadContext): SectionGeometry['corrosion'] {
  if (raw === undefined) return undefined;
  const at = [...AT, 'corrosion'];
  const perPlate = raw.flange !== undefined || raw.web !== undefined;
  if (perPlate && raw.loss !== undefined) fail(ctx, [...at, raw.flange !== undefined ? 'flange' : 'web'], 'give either loss (the same on every plate) or flange and web, not both');
  if (perPlate && d.shape !== 'i') fail(ctx, [...at, raw.flange !== undefined ? 'flange' : 'web'], `applies to an I/H section only; a ${d.shape} section takes loss: Q`);
  if (!perPlate && raw.loss === undefined) fail(ctx, at, 'is empty: give loss: Q (per exposed face), or for an I/H section flange: Q and web: Q');
  let zoneHeight: number | undefined;
  if (raw.zone !== undefined) {
    zoneHeight = fixedLength(raw.zone.height, 'corrosion.zone.height', ctx);
    if (!(zoneHeight <= length)) fail(ctx, [...at, 'zone', 'height'], 'must not exceed the column length');
  }
  const zone = zoneHeight !== undefined ? { zoneHeight } : {};
  if (!perPlate) {
    const loss = readLoss(raw.loss, 'loss', Math.min(lossThrough(d, 'primary'), lossThrough(d, 'secondary')), d.shape === 'i' ? 'thinner plate' : 'wall', ctx);
    return { primary: loss, secondary: loss, perPlate: false, ...zone };
  }
  const flange = raw.flange === undefined ? ZERO : readLoss(raw.flange, 'flange', lossThrough(d, 'primary'), 'flange', ctx);
  const web = raw.web === undefined ? ZERO : readLoss(raw.web, 'web', lossThrough(d, 'secondary'), 'web', ctx);
  return { primary: flange, secondary: web, perPlate: true, ...zone };
}

/** `twoAxes`: the scenario has column.axis_z (then the properties about z are required). */
export function readSection(raw: RawSection, length: number, twoAxes: boolean, ctx: ReadContext): Section {
  const positive = (kind: 'area' | 'inertia' | 'sectionModulus') => ({ kind, domain: 'positive' as const });
  if (!('shape' in raw) || raw.shape === undefined || raw.shape === 'properties') {
    const p = raw as Extract<RawSection, { area: unknown }>;
    const section = {
      area: readScalar(p.area, positive('area'), [...AT, 'area'], ctx),
      inertia: readScalar(p.inertia, positive('inertia'), [...AT, 'inertia'], ctx),
      sectionModulus: readScalar(p.section_modulus, positive('sectionModulus'), [...AT, 'section_modulus'], ctx),
    };
    const givenZ = p.inertia_z !== undefined || p.section_modulus_z !== undefined;
    if (!twoAxes) {
      if (givenZ) fail(ctx, [...AT, p.inertia_z !== undefined ? 'inertia_z' : 'section_modulus_z'], 'applies with column.axis_z (the ends and bow about z); add axis_z or remove it');
      return section;
    }
    if (p.inertia_z === undefined) fail(ctx, [...AT, 'inertia_z'], 'is missing: with column.axis_z give the second moment of area about z, e.g. inertia_z: 20.0e6 mm^4');
    if (p.section_modulus_z === undefined) fail(ctx, [...AT, 'section_modulus_z'], 'is missing: with column.axis_z give the elastic section modulus about z, e.g. section_modulus_z: 200e3 mm^3');
    return {
      ...section,
      inertiaZ: readScalar(p.inertia_z, positive('inertia'), [...AT, 'inertia_z'], ctx),
      sectionModulusZ: readScalar(p.section_modulus_z, positive('sectionModulus'), [...AT, 'section_modulus_z'], ctx),
    };
  }
  const shaped = raw as Exclude<RawSection, { area: unknown }>;
  const dimensions = readDimensions(shaped, ctx);
  const problem = dimensionProblem(dimensions);
  if (problem !== null) fail(ctx, [...AT, problem.field], problem.message);
  if (!twoAxes && dimensions.shape !== 'chs') {
    fail(ctx, ['column', 'axis_z'], `is missing: a section given by its dimensions has two principal axes; give axis_z: {ends: {bottom: ..., top: ...}, imperfection: {bow: ...}} for buckling about z (a ${dimensions.shape} section)`);
  }
  const corrosion = readCorrosion(shaped.corrosion, dimensions, length, ctx);
  const geometry: SectionGeometry = corrosion === undefined ? { dimensions } : { dimensions, corrosion };
  // the properties at the mean loss, for people (the limit state recomputes them per sample)
  const p = new Float64Array(PROPERTY_COUNT);
  sectionWriter(dimensions)(p, corrosion ? meanOf(corrosion.primary) : 0, corrosion ? meanOf(corrosion.secondary) : 0);
  const fixed = (value: number): Scalar => ({ kind: 'fixed', value });
  const units: [string, string, number][] = [['area', 'mm^2', 1e-6], ['inertia', 'mm^4', 1e-12], ['section_modulus', 'mm^3', 1e-9]];
  if (twoAxes) units.push(['inertia_z', 'mm^4', 1e-12], ['section_modulus_z', 'mm^3', 1e-9]);
  for (const [key, unit, factor] of units) ctx.units[`column.section.${key}`] = { unit, factor };
  return {
    area: fixed(p[AREA]),
    inertia: fixed(p[INERTIA_Y]),
    sectionModulus: fixed(p[ELASTIC_MODULUS_Y]),
    ...(twoAxes ? { inertiaZ: fixed(p[INERTIA_Z]), sectionModulusZ: fixed(p[ELASTIC_MODULUS_Z]) } : {}),
    geometry,
  };
}
