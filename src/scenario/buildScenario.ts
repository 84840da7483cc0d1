/**
 * The shape-checked file → Scenario: units to SI, random variables checked, cross-field rules
 * (lateral only when sway, no mechanism, bow for first-yield, correlation names).
 */
import { readCorrelation } from './readCorrelation.js';
import { readEnds, type RawEnds } from './readEnds.js';
import { fail, readScalar, type ReadContext } from './readScalar.js';
import { PURE_NUMBER_UNIT, readQuantity, type DisplayUnit } from './quantity.js';
import { ExpressionError } from './quantityExpression.js';
import type { ScenarioShape } from './scenarioShape.js';
import type { Load, Method, Scalar, Scenario } from './types.js';
import { listScalars } from './variables.js';

const LOAD_NAME = /^[\p{L}_][\p{L}\p{N}_-]{0,63}$/u;
const DEFAULT_TARGET_BETA = 3.8;

export interface Provenance {
  readonly fileName: string;
  readonly format: 'yaml' | 'json';
  readonly sha256: string;
}

export function buildScenario(shape: ScenarioShape, lines: ReadonlyMap<string, number>, provenance: Provenance): Scenario {
  const units: Record<string, DisplayUnit> = {};
  const ctx: ReadContext = { lines, units };
  const c = shape.column;
  const frame = c.frame;

  if (typeof c.length !== 'string') {
    fail(ctx, ['column', 'length'], 'must be a fixed quantity (e.g. 4.2 m), not a random variable: the length defines the model geometry and L in expressions; put the uncertainty in the ends, the bow or the loads');
  }
  let length: number;
  try {
    const q = readQuantity(c.length, 'length');
    length = q.value;
    units['column.length'] = q.display;
  } catch (e) {
    if (e instanceof ExpressionError) fail(ctx, ['column', 'length'], e.message);
    throw e;
  }
  if (!(length > 0)) fail(ctx, ['column', 'length'], `must be greater than zero, got ${c.length}`);

  const positive = (kind: Parameters<typeof readScalar>[1]['kind']) => ({ kind, domain: 'positive' as const });
  const section = {
    area: readScalar(c.section.area, positive('area'), ['column', 'section', 'area'], ctx),
    inertia: readScalar(c.section.inertia, positive('inertia'), ['column', 'section', 'inertia'], ctx),
    sectionModulus: readScalar(c.section.section_modulus, positive('sectionModulus'), ['column', 'section', 'section_modulus'], ctx),
  };
  const material = {
    E: readScalar(c.material.E, positive('stress'), ['column', 'material', 'E'], ctx),
    fy: readScalar(c.material.fy, positive('stress'), ['column', 'material', 'fy'], ctx),
  };
  const ends = readEnds(c.ends as RawEnds, frame, ctx);

  const rawBow = c.imperfection?.bow;
  let bow: Scalar;
  if (rawBow === undefined) {
    if (shape.strength === 'first-yield') {
      fail(ctx, ['column', 'imperfection', 'bow'], 'is required for strength first-yield: give the bow amplitude of the initial shape, e.g. bow: L/1000');
    }
    bow = { kind: 'fixed', value: 0 };
  } else {
    bow = readScalar(rawBow, { kind: 'length', domain: 'any', columnLength: length }, ['column', 'imperfection', 'bow'], ctx);
  }

  const loadNames = Object.keys(shape.loads);
  if (loadNames.length === 0) fail(ctx, ['loads'], 'needs at least one axial load, e.g. dead: 420 kN');
  const loads: Load[] = loadNames.map((name) => {
    if (!LOAD_NAME.test(name)) {
      fail(ctx, ['loads', name], `'${name}' is not a usable load name: use letters, digits, _ and - (starting with a letter or _, at most 64 characters)`);
    }
    return { name, path: `loads.${name}`, value: readScalar(shape.loads[name]!, { kind: 'force', domain: 'load' }, ['loads', name], ctx) };
  });

  const modelFactor: Scalar =
    shape.model_factor === undefined ? { kind: 'fixed', value: 1 } : readScalar(shape.model_factor, { kind: 'number', domain: 'positive' }, ['model_factor'], ctx);
  if (shape.model_factor === undefined) units['model_factor'] = PURE_NUMBER_UNIT;

  const targetBeta = shape.target_beta ?? DEFAULT_TARGET_BETA;
  if (!(targetBeta > 0)) fail(ctx, ['target_beta'], `must be greater than zero, got ${targetBeta}`);

  const a = shape.analysis ?? {};
  if (a.methods !== undefined) {
    const dup = a.methods.find((m, i) => a.methods!.indexOf(m) !== i);
    if (dup !== undefined) fail(ctx, ['analysis', 'methods'], `lists '${dup}' twice`);
  }

  const partial = {
    version: 1 as const,
    title: shape.title ?? '',
    fileName: provenance.fileName,
    format: provenance.format,
    sha256: provenance.sha256,
    column: { length, frame, section, material, ends, bow },
    loads,
    modelFactor,
    strength: shape.strength,
    targetBeta,
    ...(shape.target_source !== undefined ? { targetSource: shape.target_source } : {}),
    analysis: {
      ...(a.seed !== undefined ? { seed: a.seed } : {}),
      ...(a.methods !== undefined ? { methods: a.methods as Method[] } : {}),
      ...(a.mc_samples !== undefined ? { mcSamples: a.mc_samples } : {}),
      ...(a.is_samples !== undefined ? { isSamples: a.is_samples } : {}),
      ...(a.subset_samples !== undefined ? { subsetSamples: a.subset_samples } : {}),
      ...(a.workers !== undefined ? { workers: a.workers } : {}),
    },
    displayUnits: shape.display_units ?? 'si',
    units,
  };
  const correlation = readCorrelation(shape.correlation as [string, string, number][] | undefined, listScalars(partial), ctx);
  return { ...partial, correlation };
}
