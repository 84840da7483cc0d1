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

/** The section by its dimensions (scenario/readSectionShape.ts); I/H only for now. */
const sectionShapeSchema = strict(
  {
    type: choice(['i'] as const, 'a section type'),
    h: quantitySchema('length').meta({ description: 'overall depth' }),
    b: quantitySchema('length').meta({ description: 'flange width' }),
    tw: quantitySchema('length').meta({ description: 'web thickness' }),
    tf: quantitySchema('length').meta({ description: 'flange thickness' }),
    family: choice(['rolled', 'welded'] as const, 'a section family'),
    axis: choice(['y', 'z'] as const, 'the buckling axis (y major, z minor)'),
  },
  'the section by its dimensions (type, h, b, tw, tf, family, axis)',
);

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

const LOAD_KEYS = { ...LOAD_TIME_KEYS, eccentricity: eccentricitySchema.optional() };

/** A fixed load that carries keys besides its value: {value: Q, eccentricity: {...}, kind: ...}. */
const fixedLoadWithKeys = strict({ value: quantitySchema('force'), ...LOAD_KEYS }, 'a fixed load {value: Q, eccentricity: {top: Q, bottom: Q}, kind: ...}');

const loadSchema = z.union([quantitySchema('force'), fixedLoadWithKeys, randomVariableSchema(() => quantitySchema('force'), LOAD_KEYS)], {
  error: (iss) => (iss.input === undefined ? quantityMessage('force', undefined, false) : `${quantityMessage('force', iss.input, false)}, {value: Q, eccentricity: {top: Q, bottom: Q}}, or a random variable {dist: NAME, ..., kind, maximum_over | point_in_time, eccentricity}`),
});

const correlationEntry = z
  .tuple([z.string(), z.string(), z.number()], {
    error: (iss) =>
      `expected [variable, variable, rho], e.g. [column.material.E, column.material.fy, 0.2]; got ${describeInput(iss.input)}`,
  })
  .meta({ description: '[path of a random variable, path of another, Pearson correlation rho with |rho| < 1]' });

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
        section: strict(
          {
            area: quantityScalar('area'),
            inertia: quantityScalar('inertia'),
            section_modulus: quantityScalar('sectionModulus'),
            shape: sectionShapeSchema.optional().meta({ description: 'the section by its dimensions (needed by strength: plastic-zone)' }),
          },
          'the section (area, inertia, section_modulus about the buckling axis; optional shape)',
        ),
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
          { bow: quantityScalar('length', true).optional().meta({ description: 'bow amplitude e0 of the initial shape (affine to the first mode), e.g. L/1000' }) },
          'the imperfection (bow)',
        ).optional(),
      },
      'the column (length, frame, section, material, ends, imperfection)',
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
          .meta({ description: 'direct: the full model at every evaluation (default); table: a tabulated response built once per section and cached on disk (docs/plastic-zone.md)' }),
      },
      'the analysis options (seed, methods, mc_samples, is_samples, subset_samples, workers, plastic_zone)',
    ).optional(),
    display_units: choice(DISPLAY_UNITS, 'a unit system for reports').optional(),
  },
  'a scenario',
);

export type ScenarioShape = z.infer<typeof scenarioShape>;
/** A fixed or random value as written (the widest form: a random load with its extra keys). */
export type RawScalar = Exclude<ScenarioShape['loads'][string], { value: string }>;
export type RawEnd = ScenarioShape['column']['ends']['bottom'];
