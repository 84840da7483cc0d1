/**
 * The shape of a scenario file as a zod schema: the one description of the format, used both
 * to validate (with messages meant for engineers) and to generate the JSON Schema for
 * editors. Units, dimensions, expressions and cross-field rules are checked afterwards
 * (buildScenario.ts), because a schema cannot express them.
 */
import * as z from 'zod';
import { DIST_NAMES, type DistName } from '../probability/distribution.js';
import { KINDS, type QuantityKind } from './dimensions.js';
import { didYouMean } from './nearestName.js';

export const FRAMES = ['braced', 'sway'] as const;
export const STRENGTH_MODELS = [
  'first-yield',
  'aisc360-e3',
  'en1993-a0',
  'en1993-a',
  'en1993-b',
  'en1993-c',
  'en1993-d',
  'first-yield-en1993-a0',
  'first-yield-en1993-a',
  'first-yield-en1993-b',
  'first-yield-en1993-c',
  'first-yield-en1993-d',
  'first-yield-en1993-a0-plus-bow',
  'first-yield-en1993-a-plus-bow',
  'first-yield-en1993-b-plus-bow',
  'first-yield-en1993-c-plus-bow',
  'first-yield-en1993-d-plus-bow',
  'plastic-zone',
] as const;
export const METHODS = ['form', 'sorm', 'is', 'mc', 'subset'] as const;
export const DISPLAY_UNITS = ['si', 'us'] as const;
export const END_TYPES = ['pinned', 'fixed'] as const;
export const END_KEYS = ['rotation', 'series', 'fixity', 'alignment_g'] as const;
export const LOAD_KIND_NAMES = ['permanent', 'imposed', 'snow', 'wind', 'other'] as const;

/** How a bad value looks in a message. */
export function describeInput(input: unknown): string {
  if (input === undefined) return 'nothing';
  if (input === null) return 'an empty value';
  if (typeof input === 'number') return Number.isFinite(input) ? `a bare number (${input})` : `${input}, which is not a finite number`;
  if (typeof input === 'string') return `'${input.length > 60 ? `${input.slice(0, 57)}...` : input}'`;
  if (typeof input === 'boolean') return `${input}`;
  if (Array.isArray(input)) return 'a list';
  return 'a mapping';
}

// a number (also `25.1×10⁶` and a real minus, as reports print them), then a unit or feet-and-inches mark
const NUMBER_AND_UNIT = /^\s*[-+\u2212]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+|\s*×\s*10(?:[⁻⁺]?[⁰¹²³⁴⁵⁶⁷⁸⁹]+|\^\(?[-+]?\d+\)?))?\s*[A-Za-zµΩ°('"]/;

function quantityMessage(kind: QuantityKind, input: unknown, lengthExpression: boolean): string {
  const info = KINDS[kind];
  if (input === undefined) return `is missing: give ${info.noun} (e.g. ${info.example})`;
  if (typeof input === 'string' && /nan|inf/i.test(input)) return `'${input}' is not a finite ${info.noun.replace(/^an? /, '')}`;
  const what = lengthExpression ? `${info.noun} (e.g. ${info.example}, or an expression of L such as L/1000)` : `${info.noun} (e.g. ${info.example})`;
  const hint = typeof input === 'number' ? ': give a unit' : '';
  return `expected ${what}, got ${describeInput(input)}${hint}`;
}

/** One schema object per argument list, so the JSON Schema can share it as a definition. */
function memo<A extends unknown[], R>(make: (...args: A) => R): (...args: A) => R {
  const cache = new Map<string, R>();
  return (...args: A) => {
    const key = JSON.stringify(args);
    let made = cache.get(key);
    if (made === undefined) {
      made = make(...args);
      cache.set(key, made);
    }
    return made;
  };
}

/** A quantity string of the given kind; lengths may be expressions of L. */
export const quantitySchema = memo(makeQuantitySchema);
function makeQuantitySchema(kind: QuantityKind, lengthExpression = false) {
  const info = KINDS[kind];
  const base = z.string({ error: (iss) => quantityMessage(kind, iss.input, lengthExpression) });
  const description = lengthExpression
    ? `${info.noun}: a number and a unit (e.g. ${info.example}) or an expression of L, the column length (e.g. L/1000 + 2 mm); converted to ${info.siUnit}`
    : `${info.noun}: a number and a unit, e.g. ${info.example}; any unit of this dimension is converted to ${info.siUnit}`;
  const checked = lengthExpression
    ? base.min(1, { error: () => quantityMessage(kind, '', true) })
    : base.regex(NUMBER_AND_UNIT, { error: (iss) => quantityMessage(kind, iss.input, false) });
  return checked.meta({ description, examples: [info.example] });
}

/** A plain number without unit. */
export const pureNumberSchema = memo(makePureNumberSchema);
function makePureNumberSchema(description: string) {
  return z
    .number({
      error: (iss) =>
        iss.input === undefined
          ? `is missing: give ${description}`
          : `expected ${description} (a plain number, no unit), got ${describeInput(iss.input)}`,
    })
    .meta({ description });
}

type ValueSchema = ReturnType<typeof quantitySchema> | ReturnType<typeof pureNumberSchema>;

function strict<T extends z.core.$ZodLooseShape>(shape: T, what: string) {
  const keys = Object.keys(shape);
  return z.strictObject(shape, {
    error: (iss) => {
      if (iss.code === 'unrecognized_keys') {
        const unknown = iss.keys;
        const suggestion = unknown.length === 1 ? didYouMean(unknown[0]!, keys) : '';
        return `unknown key${unknown.length > 1 ? 's' : ''} ${unknown.map((k) => `'${k}'`).join(', ')}${suggestion}; ${what} takes ${keys.join(', ')}`;
      }
      if (iss.input === undefined) return `is missing: give ${what}`;
      return `expected ${what} (a mapping of ${keys.join(', ')}), got ${describeInput(iss.input)}`;
    },
  });
}

const covSchema = pureNumberSchema('a coefficient of variation (sd / mean), e.g. 0.1');
const sourceSchema = z
  .string({ error: (iss) => `expected a text saying where these statistics come from, got ${describeInput(iss.input)}` })
  .optional()
  .meta({ description: 'where the statistics come from (free text, printed in the Inputs table), e.g. mill certificates 2019, site survey, EN 1990 Annex C' });

export const EVIDENCE_TESTED = ['similar', 'this_one'] as const;
export const EVIDENCE_SCATTER = ['unknown', 'known'] as const;

/** Test results that update a normal or lognormal variable (docs/evidence.md, docs/scenario-format.md). */
function evidenceSchema(value: () => ValueSchema) {
  const pick = <const T extends readonly [string, ...string[]]>(values: T, what: string) =>
    z.enum(values, { error: (iss) => `expected ${what}, one of ${values.join(', ')}; got ${describeInput(iss.input)}` });
  return strict(
    {
      tests: z
        .array(value(), { error: (iss) => `expected a list of test results, e.g. [312 MPa, 298 MPa, 305 MPa], got ${describeInput(iss.input)}` })
        .min(1, { error: () => 'is empty: give at least one test result' })
        .meta({ description: 'the test results, in the units of this variable' }),
      tested: pick(EVIDENCE_TESTED, 'what was tested').optional().meta({ description: "similar (default): members of the same population (coupons, sibling connections); this_one: this very item" }),
      scatter: pick(EVIDENCE_SCATTER, "whether the population's scatter is known").optional().meta({ description: "unknown (default): estimated from the tests; known: the sd or cov given above is the population's" }),
      prior_weight: pureNumberSchema('how many tests the distribution given above is worth (0 = none, the default)').optional(),
      measurement_sd: value().optional().meta({ description: 'the sd of the measurement error of each test, in the units of this variable' }),
      measurement_cov: pureNumberSchema('the CoV of the measurement error of each test, e.g. 0.05').optional(),
      source: sourceSchema,
    },
    'test results {tests: [...], tested, scatter, prior_weight, measurement_sd or measurement_cov, source}',
  ).meta({ description: 'test results that update this distribution (normal and lognormal only); the updated distribution replaces it everywhere' });
}

/** `{dist: NAME, ...}` with the parameters docs/scenario-format.md gives each distribution. */
export function randomVariableSchema<X extends z.core.$ZodLooseShape = Record<never, never>>(value: () => ValueSchema, extra: X = {} as X) {
  const meanSdCov = <const D extends DistName>(dist: D) =>
    strict({ dist: z.literal(dist), mean: value(), sd: value().optional(), cov: covSchema.optional(), source: sourceSchema, ...extra }, `a ${dist} variable (mean and one of sd, cov)`);
  const updatable = <const D extends 'normal' | 'lognormal'>(dist: D) =>
    strict(
      { dist: z.literal(dist), mean: value(), sd: value().optional(), cov: covSchema.optional(), source: sourceSchema, evidence: evidenceSchema(value).optional(), ...extra },
      `a ${dist} variable (mean and one of sd, cov; evidence optional)`,
    );
  return z
    .discriminatedUnion(
      'dist',
      [
        updatable('normal'),
        updatable('lognormal'),
        meanSdCov('gumbel'),
        strict({ dist: z.literal('uniform'), min: value(), max: value(), source: sourceSchema, ...extra }, 'a uniform variable (min, max)'),
        strict(
          { dist: z.literal('truncnormal'), mean: value(), sd: value(), min: value().optional(), max: value().optional(), source: sourceSchema, ...extra },
          'a truncnormal variable (mean and sd of the parent normal; min and/or max)',
        ),
        meanSdCov('weibull'),
        strict({ dist: z.literal('beta'), min: value(), max: value(), mean: value(), sd: value(), source: sourceSchema, ...extra }, 'a beta variable (min, max, mean, sd)'),
      ],
      {
        error: (iss) => {
          const dist = (iss.input as { dist?: unknown } | undefined)?.dist;
          if (typeof dist === 'string') return `unknown distribution '${dist}'${didYouMean(dist, DIST_NAMES)}: use one of ${DIST_NAMES.join(', ')}`;
          if (dist === undefined) return `a random variable needs dist: one of ${DIST_NAMES.join(', ')}`;
          return `expected a random variable {dist: NAME, ...}, got ${describeInput(iss.input)}`;
        },
      },
    )
    .meta({ description: `a random variable: {dist: ${DIST_NAMES.join(' | ')}, ...parameters}` });
}

/** A value that may be fixed or random. */
export function scalarSchema(value: () => ValueSchema, describeFixed: (input: unknown) => string) {
  return z.union([value(), randomVariableSchema(value)], {
    error: (iss) => (iss.input === undefined ? describeFixed(undefined) : `${describeFixed(iss.input)}, or a random variable {dist: NAME, ...}`),
  });
}

export const quantityScalar = memo(makeQuantityScalar);
function makeQuantityScalar(kind: QuantityKind, lengthExpression = false) {
  return scalarSchema(
    () => quantitySchema(kind, lengthExpression),
    (input) => quantityMessage(kind, input, lengthExpression),
  );
}

export const numberScalar = memo(makeNumberScalar);
function makeNumberScalar(description: string) {
  return scalarSchema(
    () => pureNumberSchema(description),
    (input) => (input === undefined ? `is missing: give ${description}` : `expected ${description} (a plain number), got ${describeInput(input)}`),
  );
}

function choice<const T extends readonly [string, ...string[]]>(values: T, what: string) {
  return z.enum(values, {
    error: (iss) => {
      if (iss.input === undefined) return `is missing: give ${what} (${values.join(' | ')})`;
      const suggestion = typeof iss.input === 'string' ? didYouMean(iss.input, values) : '';
      return `expected ${what}, one of ${values.join(', ')}; got ${describeInput(iss.input)}${suggestion}`;
    },
  });
}

/** The beam a spring end connects to, for the joint classification (fixed quantities only). */
const beamSchema = strict(
  {
    E: quantitySchema('stress').optional().meta({ description: "the beam's Young's modulus (default: the column's mean E)" }),
    inertia: quantitySchema('inertia').meta({ description: "the beam's second moment of area about its bending axis" }),
    length: quantitySchema('length').meta({ description: "the beam's span" }),
  },
  'the connected beam {inertia: Q, length: Q, E: Q (optional)}',
).meta({ description: 'the beam this connection joins the column to: classifies the joint by stiffness (EN 1993-1-8 §5.2.2.5)' });

/** One flexibility of a series end: a stiffness (fixed or random) or `rigid`. */
const seriesComponentSchema = z
  .union([z.literal('rigid'), quantityScalar('rotationalStiffness')], {
    error: (iss) =>
      iss.input === undefined
        ? `is missing: give ${KINDS.rotationalStiffness.noun} (e.g. ${KINDS.rotationalStiffness.example}), rigid, or a random variable {dist: NAME, ...}`
        : `expected ${KINDS.rotationalStiffness.noun} (e.g. ${KINDS.rotationalStiffness.example}), rigid, or a random variable {dist: NAME, ...}; got ${describeInput(iss.input)}`,
  })
  .meta({ description: 'one component of the series: a rotational stiffness (fixed or random) or rigid' });

const seriesSchema = z
  .record(z.string(), seriesComponentSchema, {
    error: (iss) => `expected the components as a mapping {connection: Q, foundation: Q, ...}, got ${describeInput(iss.input)}`,
  })
  .meta({ description: 'rotational springs in series, each named (connection, beam, foundation, ...): 1/k = Σ 1/k_i' });

const endSchema = z
  .union(
    [
      choice(END_TYPES, 'an end condition'),
      strict({ rotation: quantityScalar('rotationalStiffness'), beam: beamSchema.optional() }, 'a rotational spring {rotation: Q, beam: {...} (optional)}'),
      strict(
        { series: seriesSchema, beam: beamSchema.optional() },
        'rotational springs in series {series: {connection: Q, foundation: Q, ...}, beam: {...} (optional)}',
      ),
      strict({ fixity: numberScalar('a fixity factor X = R/(R+3) in [0, 1)') }, 'a fixity factor {fixity: X}'),
      strict({ alignment_g: numberScalar('an alignment-chart G factor (>= 0)') }, 'an alignment-chart factor {alignment_g: G}'),
    ],
    {
      error: (iss) => {
        const options = 'pinned, fixed, {rotation: Q}, {series: {name: Q, ...}}, {fixity: X} or {alignment_g: G}';
        const input = iss.input;
        if (input === undefined) return `is missing: give ${options}`;
        if (typeof input === 'string') return `unknown end condition '${input}'${didYouMean(input, END_TYPES)}: use ${options}`;
        if (input !== null && typeof input === 'object' && !Array.isArray(input)) {
          const keys = Object.keys(input);
          const known = keys.filter((k) => (END_KEYS as readonly string[]).includes(k));
          if (known.length > 1) return `give only one of ${known.join(', ')}`;
          const unknown = keys.find((k) => !(END_KEYS as readonly string[]).includes(k));
          if (unknown !== undefined) return `unknown key '${unknown}'${didYouMean(unknown, END_KEYS)}: use ${options}`;
          return `is empty: use ${options}`;
        }
        return `expected ${options}, got ${describeInput(input)}`;
      },
    },
  )
  .meta({
    description:
      'end condition: pinned | fixed | {rotation: Q (moment per radian)} | {series: {name: Q | rigid, ...} (springs in series, 1/k = Σ 1/k_i)} | {fixity: X in [0,1)} | {alignment_g: G >= 0}',
  });

const integer = (what: string, minimum: number) =>
  z
    .int({ error: (iss) => `expected ${what} (a whole number >= ${minimum}), got ${describeInput(iss.input)}` })
    .min(minimum, { error: (iss) => `expected ${what} (a whole number >= ${minimum}), got ${describeInput(iss.input)}` })
    .meta({ description: what });

const periodText = (description: string) =>
  z.string({ error: (iss) => `expected a period such as 50 years or 1 year, got ${describeInput(iss.input)}` }).meta({ description, examples: ['50 years', '1 year'] });

/** The keys a random load may carry to say what it is and which period it describes (docs/scenario-format.md). */
const LOAD_TIME_KEYS = {
  kind: choice(LOAD_KIND_NAMES, 'a load kind').optional().meta({ description: 'permanent | imposed | snow | wind | other; permanent loads are never converted in time' }),
  maximum_over: periodText('the distribution is that of the maximum over this period, e.g. 1 year (annual maximum)').optional(),
  point_in_time: z.boolean({ error: (iss) => `expected true or false, got ${describeInput(iss.input)}` }).optional().meta({ description: 'true: the distribution is that of an arbitrary-point-in-time value' }),
  renewal_period: periodText('with point_in_time: how often the load takes an independent new value, e.g. 1 year').optional(),
};

/** End eccentricities of a load in the plane of the buckling axis (docs/beam-column.md); an omitted end is 0. */
const eccentricitySchema = strict(
  {
    top: quantityScalar('length').optional().meta({ description: 'eccentricity of the load at the top (a length, fixed or random; default 0)' }),
    bottom: quantityScalar('length').optional().meta({ description: 'eccentricity at the bottom; the same sign as top is single curvature (default 0)' }),
  },
  'end eccentricities {top: Q, bottom: Q} (lengths; either may be omitted)',
).meta({ description: 'end eccentricities of the load in the plane of the buckling axis; the same sign at both ends is single curvature' });

/** Moments applied at the ends of the column by a load (docs/beam-column.md); an omitted end is 0. */
const momentsSchema = strict(
  {
    top: quantityScalar('moment').optional().meta({ description: 'moment applied at the top (fixed or random; default 0)' }),
    bottom: quantityScalar('moment').optional().meta({ description: 'moment applied at the bottom; the same sign as top is single curvature (default 0)' }),
  },
  'applied end moments {top: Q, bottom: Q} (moments such as 12 kN m; either may be omitted)',
).meta({ description: 'moments the load applies at the column ends in the plane of the buckling axis; the same sign at both ends is single curvature' });

/**
 * The actions a load entry may carry besides its axial force, all in the plane of the buckling axis and
 * scaled together with every load (docs/beam-column.md).
 */
const LOAD_KEYS = {
  ...LOAD_TIME_KEYS,
  eccentricity: eccentricitySchema.optional(),
  moments: momentsSchema.optional(),
  transverse: quantityScalar('lineLoad').optional().meta({ description: 'uniform transverse line load along the height (force per length, e.g. wind on a facade column; fixed or random; positive on the side of a positive eccentricity)' }),
  horizontal: quantityScalar('force').optional().meta({ description: 'sway frames only: horizontal force at the top (fixed or random; positive on the side of a positive eccentricity)' }),
};

/** A fixed load that carries keys besides its value: {value: Q, eccentricity: {...}, kind: ...}. */
const fixedLoadWithKeys = strict({ value: quantitySchema('force'), ...LOAD_KEYS }, 'a fixed load {value: Q, eccentricity: {top: Q, bottom: Q}, kind: ...}');

const loadSchema = z.union([quantitySchema('force'), fixedLoadWithKeys, randomVariableSchema(() => quantitySchema('force'), LOAD_KEYS)], {
  error: (iss) => (iss.input === undefined ? quantityMessage('force', undefined, false) : `${quantityMessage('force', iss.input, false)}, {value: Q, eccentricity: {top: Q, bottom: Q}, moments, transverse, horizontal}, or a random variable {dist: NAME, ..., kind, maximum_over | point_in_time, eccentricity, moments, transverse, horizontal}`),
});

const imperfectionSchema = strict(
  { bow: quantityScalar('length', true).optional().meta({ description: 'bow amplitude e0 of the initial shape (affine to the first mode), e.g. L/1000' }) },
  'the imperfection (bow)',
);

export const SECTION_SHAPE_NAMES = ['properties', 'i', 'rhs', 'chs', 'rect'] as const;
export const HOLLOW_FINISHES = ['hot', 'cold'] as const;
export const EN1993_CURVES = ['a0', 'a', 'b', 'c', 'd'] as const;

const dimension = (what: string) => quantitySchema('length').meta({ description: what });
const lossScalar = (what: string) => quantityScalar('length').optional().meta({ description: what });

/** Thickness lost to corrosion, per exposed face (docs/sections.md). */
const corrosionSchema = strict(
  {
    loss: lossScalar('loss per exposed face, the same on every plate (fixed or random)'),
    flange: lossScalar('I/H only: loss per face of the flanges (with web instead of loss)'),
    web: lossScalar('I/H only: loss per face of the web (with flange instead of loss)'),
    zone: strict({ height: quantitySchema('length').meta({ description: 'height of the corroded zone above the base' }) }, 'the corroded zone {height: Q}')
      .optional()
      .meta({ description: 'the loss is limited to this height above the base (see docs/sections.md for how it is taken)' }),
  },
  'a corrosion loss {loss: Q} or {flange: Q, web: Q}, and zone: {height: Q} (optional)',
).meta({ description: 'thickness lost to corrosion per exposed face; every section property is recomputed from the reduced dimensions' });

const propertySection = strict(
  {
    shape: z.literal('properties').optional().meta({ description: 'optional: the section is given by its properties' }),
    area: quantityScalar('area'),
    inertia: quantityScalar('inertia'),
    section_modulus: quantityScalar('sectionModulus'),
    inertia_z: quantityScalar('inertia').optional().meta({ description: 'second moment of area about the other principal axis z (with column.axis_z)' }),
    section_modulus_z: quantityScalar('sectionModulus').optional().meta({ description: 'elastic section modulus about z (with inertia_z)' }),
  },
  'the section (area, inertia, section_modulus about the buckling axis y; inertia_z, section_modulus_z about z)',
);

const sectionSchema = z
  .discriminatedUnion(
    'shape',
    [
      propertySection,
      strict(
        {
          shape: z.literal('i'),
          h: dimension('overall depth'),
          b: dimension('flange width'),
          tw: dimension('web thickness'),
          tf: dimension('flange thickness'),
          r: dimension('root radius of the fillets (0 or omitted: a welded section)').optional(),
          corrosion: corrosionSchema.optional(),
        },
        'an I or H section {shape: i, h, b, tw, tf, r, corrosion}',
      ),
      strict(
        {
          shape: z.literal('rhs'),
          h: dimension('outer depth (bending about y)'),
          b: dimension('outer width'),
          t: dimension('wall thickness'),
          finish: choice(HOLLOW_FINISHES, 'how the section was made').optional().meta({ description: 'hot (EN 10210, default) or cold (EN 10219): sets the default corner radii' }),
          ro: dimension('outer corner radius (default by finish)').optional(),
          ri: dimension('inner corner radius (default by finish)').optional(),
          corrosion: corrosionSchema.optional(),
        },
        'a rectangular or square hollow section {shape: rhs, h, b, t, finish, ro, ri, corrosion}',
      ),
      strict({ shape: z.literal('chs'), D: dimension('outside diameter'), t: dimension('wall thickness'), corrosion: corrosionSchema.optional() }, 'a circular hollow section {shape: chs, D, t, corrosion}'),
      strict({ shape: z.literal('rect'), b: dimension('width (bending about z)'), h: dimension('depth (bending about y)'), corrosion: corrosionSchema.optional() }, 'a solid rectangle {shape: rect, b, h, corrosion}'),
    ],
    {
      error: (iss) => {
        const shape = (iss.input as { shape?: unknown } | undefined)?.shape;
        if (iss.input === undefined) return 'is missing: give the section by its properties {area, inertia, section_modulus} or by its shape {shape: i | rhs | chs | rect, ...dimensions}';
        if (typeof shape === 'string') return `unknown section shape '${shape}'${didYouMean(shape, SECTION_SHAPE_NAMES)}: use one of ${SECTION_SHAPE_NAMES.join(', ')}`;
        return `expected the section by its properties {area, inertia, section_modulus} or by its shape {shape: i | rhs | chs | rect, ...dimensions}, got ${describeInput(iss.input)}`;
      },
    },
  )
  .meta({ description: 'the section: its properties {area, inertia, section_modulus[, inertia_z, section_modulus_z]} or its shape and dimensions {shape: i | rhs | chs | rect, ...}' });

/** The second principal axis: its own ends and bow (docs/scenario-format.md). */
const axisZSchema = strict(
  {
    ends: strict(
      {
        bottom: endSchema,
        top: endSchema,
        lateral: quantityScalar('translationalStiffness').optional().meta({ description: 'sway frames only: translational spring at the top in the direction of bending about z (default 0)' }),
      },
      'the end conditions about z (bottom, top, and for sway frames lateral)',
    ),
    imperfection: imperfectionSchema.optional(),
    curve: choice(EN1993_CURVES, 'an EN 1993-1-1 buckling curve').optional().meta({ description: 'with strength en1993-X: the buckling curve about z (EN 1993-1-1 Table 6.2); default the same as about y' }),
  },
  'the axis z {ends: {bottom, top}, imperfection: {bow}, curve}',
).meta({ description: 'buckling about the second principal axis z: its own end restraint and bow; the capacity is the smaller of the two axes' });

const correlationEntry = z
  .tuple([z.string(), z.string(), z.number()], {
    error: (iss) =>
      `expected [variable, variable, rho], e.g. [column.material.E, column.material.fy, 0.2]; got ${describeInput(iss.input)}`,
  })
  .meta({ description: '[path of a random variable, path of another, Pearson correlation rho with |rho| < 1]' });

export const MEASUREMENT_TYPES = ['rotation_test', 'frequency'] as const;
export const MEASURED_ENDS = ['bottom', 'top'] as const;

const measurementCov = pureNumberSchema('the CoV of the measurement error, e.g. 0.05').meta({ description: 'CoV of the measurement error (lognormal), e.g. 0.05' });

/**
 * Measurements on this structure that inform the column's variables through a model
 * (docs/evidence.md §7): a static rotation test of an end's spring, the first natural frequency.
 */
const measurementSchemas = [
  strict(
    {
      type: z.literal('rotation_test'),
      end: choice(MEASURED_ENDS, 'the tested end'),
      moment: quantitySchema('moment').meta({ description: 'the moment applied to the connection, e.g. 20 kN m' }),
      rotation: quantitySchema('angle').meta({ description: 'the rotation of the connection measured under that moment, e.g. 4.5 mrad' }),
      measurement_cov: measurementCov,
      source: sourceSchema,
    },
    'a rotation test {type: rotation_test, end, moment, rotation, measurement_cov, source}',
  ),
  strict(
    {
      type: z.literal('frequency'),
      value: quantitySchema('frequency').meta({ description: 'the measured first natural frequency of lateral vibration, e.g. 4.1 Hz' }),
      axial_load: quantitySchema('force').meta({ description: 'the axial compression in the column while it was measured' }),
      mass_per_length: quantitySchema('massPerLength').meta({ description: 'the vibrating mass per length of the column (self-weight and anything attached)' }),
      measurement_cov: measurementCov,
      source: sourceSchema,
    },
    'a frequency measurement {type: frequency, value, axial_load, mass_per_length, measurement_cov, source}',
  ),
] as const;
/**
 * Evidence about the whole structure (a list; each item names its `type`). A survived load is
 * read by scenario/readStructureEvidence.ts; further item types join the union here.
 */
const textNote = (what: string) => z.string({ error: (iss) => `expected a text, got ${describeInput(iss.input)}` }).optional().meta({ description: what });
export const STRUCTURE_EVIDENCE_TYPES = [...MEASUREMENT_TYPES, 'survived_load'] as const;
const survivedLoadSchema = strict(
  {
    type: z.literal('survived_load'),
    load: quantityScalar('force').meta({ description: 'the axial load the column has carried without failure (fixed, or random when it is not known exactly), acting like the loads of the scenario' }),
    date: textNote('when it was carried (free text)'),
    notes: textNote('what it was and how it is known (free text)'),
  },
  'a survived load {type: survived_load, load: Q, date, notes}',
).meta({ description: 'the column has carried this load without failure: its resistance is known to exceed it (docs/evidence.md)' });
const structureEvidenceItem = z
  .discriminatedUnion('type', [...measurementSchemas, survivedLoadSchema], {
    error: (iss) => {
      const type = (iss.input as { type?: unknown } | undefined)?.type;
      if (typeof type === 'string') return `unknown evidence type '${type}'${didYouMean(type, STRUCTURE_EVIDENCE_TYPES)}: use one of ${STRUCTURE_EVIDENCE_TYPES.join(', ')}`;
      return `expected an evidence item {type: ${STRUCTURE_EVIDENCE_TYPES.join(' | ')}, ...}, got ${describeInput(iss.input)}`;
    },
  })
  .meta({ description: `one item of evidence about the structure: {type: ${STRUCTURE_EVIDENCE_TYPES.join(' | ')}, ...}` });

/** A candidate test for `plan-tests` and the report (studies/testPlanning.ts). */
const testPlanSchema = strict(
  {
    variable: z.string({ error: (iss) => `expected the path of a random variable, e.g. column.ends.bottom.rotation; got ${describeInput(iss.input)}` }).meta({ description: 'the path of the random variable the tests measure' }),
    tests: integer('a number of tests', 1),
    tested: z.enum(EVIDENCE_TESTED, { error: (iss) => `expected what would be tested, one of ${EVIDENCE_TESTED.join(', ')}; got ${describeInput(iss.input)}` }).optional()
      .meta({ description: 'this_one: tests of this very item (default unless the variable already has tests of similar items); similar: more tests like those already entered' }),
    measurement_cov: pureNumberSchema('the CoV of the measurement error of each planned test, e.g. 0.1').optional(),
    label: textNote('a name for the plan in tables and charts'),
  },
  'a test plan {variable, tests, tested, measurement_cov, label}',
).meta({ description: 'a candidate test: which variable, how many tests, how precise' });

export const scenarioShape = strict(
  {
    $schema: z.string().optional().meta({ description: 'ignored: lets an editor find this schema' }),
    stanchion: z.literal(1, { error: (iss) => (iss.input === undefined ? 'is missing: start the file with `stanchion: 1` (the format version)' : `must be 1 (the format version), got ${describeInput(iss.input)}`) }).meta({ description: 'format version: 1' }),
    title: z.string({ error: (iss) => `expected a text, got ${describeInput(iss.input)}` }).optional().meta({ description: 'a name for the reports' }),
    column: strict(
      {
        length: z
          .string({
            error: (iss) =>
              iss.input !== null && typeof iss.input === 'object' && !Array.isArray(iss.input)
                ? 'must be a fixed quantity (e.g. 4.2 m), not a random variable: the length defines the model geometry and L in expressions; put the uncertainty in the ends, the bow or the loads'
                : quantityMessage('length', iss.input, false),
          })
          .regex(NUMBER_AND_UNIT, { error: (iss) => quantityMessage('length', iss.input, false) })
          .meta({ description: 'column length L: a fixed quantity, e.g. 4.2 m (it defines the geometry and L in expressions)', examples: ['4.2 m'] }),
        frame: choice(FRAMES, 'a frame type').meta({ description: 'braced: the ends do not move sideways; sway: the top may move, resisted only by `lateral`' }),
        section: sectionSchema,
        material: strict({ E: quantityScalar('stress'), fy: quantityScalar('stress') }, 'the material (E, fy)'),
        ends: strict(
          {
            bottom: endSchema,
            top: endSchema,
            lateral: quantityScalar('translationalStiffness').optional().meta({ description: 'sway frames only: translational spring at the top (default 0)' }),
          },
          'the end conditions (bottom, top, and for sway frames lateral)',
        ),
        imperfection: strict(
          {
            bow: quantityScalar('length', true).optional().meta({ description: 'bow amplitude e0 of the initial shape (affine to the first mode), e.g. L/1000' }),
            out_of_plumb: z
              .union([z.literal('en1993'), numberScalar('an out-of-plumb angle in radians (plain number, e.g. 0.005)')], {
                error: (iss) => `expected an out-of-plumb angle in radians (plain number, e.g. 0.005), a random variable {dist: NAME, ...}, or en1993 (φ0 αh αm of EN 1993-1-1 §5.3.2(3)); got ${describeInput(iss.input)}`,
              })
              .optional()
              .meta({ description: 'sway frames only: out-of-plumb angle φ of the column (rad), positive on the side of a positive eccentricity; en1993 = (1/200) αh αm, EN 1993-1-1 §5.3.2(3)' }),
          },
          'the imperfection (bow, out_of_plumb)',
        ).optional(),
        axis_z: axisZSchema.optional(),
      },
      'the column (length, frame, section, material, ends, imperfection, axis_z)',
    ),
    loads: z
      .record(z.string(), loadSchema, {
        error: (iss) => (iss.input === undefined ? 'is missing: give at least one axial load, e.g. dead: 420 kN' : `expected a mapping of load names to forces, got ${describeInput(iss.input)}`),
      })
      .meta({ description: 'axial compressive loads by name, summed; each a force or a random variable' }),
    reference_period: periodText('the period the verdict is for (default 50 years); time-varying loads and the target are converted to it').optional(),
    model_factor: numberScalar('a model factor (plain number, e.g. 1.0)').optional(),
    strength: choice(STRENGTH_MODELS, 'a strength model'),
    target_beta: pureNumberSchema('a target reliability index, e.g. 3.8').optional(),
    target: strict(
      {
        beta: pureNumberSchema('a target reliability index, e.g. 3.8'),
        period: periodText('the period the target beta is stated for (default: the reference period)').optional(),
        source: z.string({ error: (iss) => `expected a text, got ${describeInput(iss.input)}` }).optional().meta({ description: 'where the target comes from (free text, echoed verbatim), e.g. EN 1990 Annex B, RC2' }),
        consequence_class: z.string({ error: (iss) => `expected a text, got ${describeInput(iss.input)}` }).optional().meta({ description: 'the consequence or reliability class, e.g. CC2 (free text)' }),
      },
      'the target (beta, period, source, consequence_class)',
    ).optional(),
    target_source: z
      .string({ error: (iss) => `expected a text, got ${describeInput(iss.input)}` })
      .optional()
      .meta({ description: "where the target comes from, e.g. 'EN 1990 Annex B', 'EN 1990 Annex C', 'ISO 2394', 'ISO 13822' (free text)", examples: ['EN 1990 Annex C', 'ISO 2394', 'ISO 13822', 'EN 1990 Annex B'] }),
    correlation: z
      .array(correlationEntry, { error: (iss) => `expected a list of [variable, variable, rho], got ${describeInput(iss.input)}` })
      .optional(),
    analysis: strict(
      {
        seed: integer('a random seed', 0).optional(),
        methods: z
          .array(choice(METHODS, 'a method'), { error: (iss) => `expected a list of methods (${METHODS.join(', ')}), got ${describeInput(iss.input)}` })
          .min(1, { error: 'needs at least one method' })
          .optional(),
        mc_samples: integer('a number of Monte Carlo samples', 1).optional(),
        is_samples: integer('a number of importance-sampling samples', 1).optional(),
        subset_samples: integer('a number of samples per subset level', 1).optional(),
        workers: integer('a number of worker threads', 1).optional(),
        plastic_zone: choice(['direct', 'table'] as const, 'how strength: plastic-zone is evaluated')
          .optional()
          .meta({ description: 'table (default): a tabulated response built once per section, axis and frame and cached on disk, the full model where the table does not reach; direct: the full model at every evaluation (docs/plastic-zone.md)' }),
      },
      'the analysis options (seed, methods, mc_samples, is_samples, subset_samples, workers, plastic_zone)',
    ).optional(),
    display_units: choice(DISPLAY_UNITS, 'a unit system for reports').optional(),
    evidence: z
      .array(structureEvidenceItem, { error: (iss) => `expected a list of evidence items [{type: ${STRUCTURE_EVIDENCE_TYPES.join(' | ')}, ...}], got ${describeInput(iss.input)}` })
      .min(1, { error: () => 'is empty: give at least one item or leave the key out' })
      .optional()
      .meta({ description: 'evidence about the structure as a whole: measurements that update the column’s variables through a model (rotation test, natural frequency) and survived loads (docs/evidence.md); test results of one variable go under that variable' }),
    test_plans: z
      .array(testPlanSchema, { error: (iss) => `expected a list of test plans [{variable, tests, measurement_cov}], got ${describeInput(iss.input)}` })
      .min(1, { error: 'is empty: give at least one plan or leave test_plans out' })
      .optional()
      .meta({ description: 'candidate tests to rank by what they would do to the reliability index (plan-tests; shown in the report)' }),
  },
  'a scenario',
);

export type ScenarioShape = z.infer<typeof scenarioShape>;
/** A fixed or random value as written (the widest form: a random load with its extra keys). */
export type RawScalar = Exclude<ScenarioShape['loads'][string], { value: string }>;
export type RawEnd = ScenarioShape['column']['ends']['bottom'];
