/**
 * `evidence:` under a normal or lognormal variable → the updated (posterior predictive)
 * distribution that replaces the one written, and a record of what was entered for the report.
 * The updating itself lives in src/evidence/ (docs/evidence.md); this file reads and checks the
 * keys and names the field when something is wrong.
 */
import { EvidenceError } from '../evidence/evidenceError.js';
import { updatedSpec } from '../evidence/updatedSpec.js';
import type { DistSpec } from '../probability/distribution.js';
import { readQuantity } from './quantity.js';
import { ExpressionError } from './quantityExpression.js';
import { formatPath, lineOf, type PathSegment } from './rawTree.js';
import { InputError } from './inputError.js';
import type { QuantityKind } from './dimensions.js';
import type { EvidenceRecord } from './types.js';

export interface RawEvidence {
  tests: (string | number)[];
  tested?: 'similar' | 'this_one';
  scatter?: 'unknown' | 'known';
  prior_weight?: number;
  measurement_sd?: string | number;
  measurement_cov?: number;
  source?: string;
}

type Fail = (path: readonly PathSegment[], message: string) => never;

/** Paths whose distribution may be updated: the column's own properties (not loads, not the model factor). */
function updatablePath(path: readonly PathSegment[]): boolean {
  return path[0] === 'column';
}

function readAmount(raw: string | number, kind: QuantityKind | 'number', path: readonly PathSegment[], fail: Fail): number {
  if (kind === 'number') {
    if (typeof raw !== 'number') fail(path, `expected a plain number, got '${raw}'`);
    return raw as number;
  }
  if (typeof raw !== 'string') fail(path, `expected a quantity with a unit, got a bare number (${raw}): give a unit`);
  try {
    return readQuantity(raw as string, kind).value;
  } catch (e) {
    if (e instanceof ExpressionError) fail(path, e.message);
    throw e;
  }
}

/**
 * The updated spec for `prior` (a normal or lognormal variable at `path`, SI) from `raw`.
 * Throws InputError naming `path.evidence.<key>`.
 */
export function readEvidence(
  prior: DistSpec,
  raw: RawEvidence,
  kind: QuantityKind | 'number',
  path: readonly PathSegment[],
  lines: ReadonlyMap<string, number>,
): { spec: DistSpec; record: EvidenceRecord } {
  const at = [...path, 'evidence'];
  const fail: Fail = (p, message) => {
    throw new InputError(formatPath(p), message, lineOf(lines, p));
  };
  if (!updatablePath(path)) fail(at, 'test results can update the column’s own values (material, section, ends, bow), not loads or the model factor');
  if (prior.dist !== 'normal' && prior.dist !== 'lognormal') fail(at, `test results can update a normal or lognormal variable, not a ${prior.dist} one`);
  const tests = raw.tests.map((t, i) => readAmount(t, kind, [...at, 'tests', i], fail));
  const tested = raw.tested ?? 'similar';
  const scatter = raw.scatter ?? 'unknown';
  if (tested === 'this_one' && raw.scatter !== undefined) fail([...at, 'scatter'], 'applies to tests of similar items only (tested: similar); a test of this one item has no population scatter');
  if (tested === 'this_one' && raw.prior_weight !== undefined) fail([...at, 'prior_weight'], "applies to tests of similar items only; for a test of this one item the weight of the distribution given above is its own sd or cov");
  if (raw.measurement_sd !== undefined && raw.measurement_cov !== undefined) fail([...at, 'measurement_cov'], "give either 'measurement_sd' or 'measurement_cov', not both");
  const measurementSd = raw.measurement_sd === undefined ? undefined : readAmount(raw.measurement_sd, kind, [...at, 'measurement_sd'], fail);
  const measurementCov = raw.measurement_cov;
  if (measurementSd !== undefined && !(measurementSd >= 0)) fail([...at, 'measurement_sd'], `must not be negative, got ${raw.measurement_sd}`);
  if (measurementCov !== undefined && !(measurementCov >= 0 && Number.isFinite(measurementCov))) fail([...at, 'measurement_cov'], `must be a finite number >= 0, got ${measurementCov}`);
  const priorWeight = raw.prior_weight ?? 0;
  if (!(priorWeight >= 0 && Number.isFinite(priorWeight))) fail([...at, 'prior_weight'], `must be a finite number >= 0, got ${raw.prior_weight}`);
  if (tested === 'this_one' && measurementSd === undefined && measurementCov === undefined) {
    fail(at, "a test of this one item needs its measurement error: give 'measurement_sd' or 'measurement_cov'");
  }
  if (prior.dist === 'lognormal' && tests.some((t) => !(t > 0))) {
    const i = tests.findIndex((t) => !(t > 0));
    fail([...at, 'tests', i], `a lognormal variable's test results must all be greater than zero, got ${String(raw.tests[i])}`);
  }

  let spec: DistSpec;
  let method: string;
  try {
    ({ spec, method } = updatedSpec(prior, { tests, tested, scatter, priorWeight, ...(measurementSd !== undefined ? { measurementSd } : {}), ...(measurementCov !== undefined ? { measurementCov } : {}) }));
  } catch (e) {
    if (e instanceof EvidenceError) fail(at, e.message);
    throw e;
  }
  const source = typeof raw.source === 'string' && raw.source.trim() !== '' ? raw.source.trim() : undefined;
  const record: EvidenceRecord = {
    tests,
    tested,
    scatter,
    priorWeight,
    ...(measurementSd !== undefined ? { measurementSd } : {}),
    ...(measurementCov !== undefined ? { measurementCov } : {}),
    ...(source ? { source } : {}),
    prior,
    method,
  };
  return { spec, record };
}
