/**
 * The scenario-level `evidence:` list → Measurement records in SI (docs/evidence.md §7,
 * docs/scenario-format.md). The shape is checked by zod; this file converts the quantities and
 * checks what a schema cannot: signs, a tested end that has a spring, a load the column can carry.
 */
import { readQuantity } from './quantity.js';
import { ExpressionError } from './quantityExpression.js';
import { fail, type ReadContext } from './readScalar.js';
import type { QuantityKind } from './dimensions.js';
import type { PathSegment } from './rawTree.js';
import type { ScenarioShape } from './scenarioShape.js';
import type { End, Measurement } from './types.js';

type RawItem = NonNullable<ScenarioShape['evidence']>[number];
type RawMeasurement = Extract<RawItem, { type: 'rotation_test' | 'frequency' }>;

function amount(ctx: ReadContext, path: readonly PathSegment[], text: string, kind: QuantityKind): number {
  try {
    return readQuantity(text, kind).value;
  } catch (e) {
    if (e instanceof ExpressionError) fail(ctx, path, e.message);
    throw e;
  }
}

function positive(ctx: ReadContext, path: readonly PathSegment[], text: string, kind: QuantityKind, what: string): number {
  const v = amount(ctx, path, text, kind);
  if (!(v > 0 && Number.isFinite(v))) fail(ctx, path, `${what} must be greater than zero, got ${text}`);
  return v;
}

function covAt(ctx: ReadContext, path: readonly PathSegment[], v: number): number {
  // a reading with no error at all would pin the variable to one value: nothing left to sample
  if (!(v > 0 && v <= 1 && Number.isFinite(v))) fail(ctx, path, `expected a measurement CoV greater than 0 and at most 1 (e.g. 0.05), got ${v}`);
  return v;
}

function sourceOf(raw: { source?: string }): { source?: string } {
  const s = typeof raw.source === 'string' ? raw.source.trim() : '';
  return s === '' ? {} : { source: s };
}

export function readMeasurements(
  raw: readonly RawItem[] | undefined,
  ends: { readonly bottom: End; readonly top: End },
  ctx: ReadContext,
): Measurement[] | undefined {
  // the list also holds survived loads (scenario/readStructureEvidence.ts): only measurements here,
  // each keeping its place in the list for messages
  const items = (raw ?? []).flatMap((m, index) => (m.type === 'rotation_test' || m.type === 'frequency' ? [{ m, index }] : []));
  if (items.length === 0) return undefined;
  return items.map(({ m, index }: { m: RawMeasurement; index: number }): Measurement => {
    const at = ['evidence', index] as PathSegment[];
    if (m.type === 'rotation_test') {
      const end = ends[m.end];
      if (end.type === 'pinned' || end.type === 'fixed') {
        fail(ctx, [...at, 'end'], `the ${m.end} end is ${end.type}: a rotation test measures a rotational spring; give that end as {rotation: ...}, {series: ...}, {fixity: ...} or {alignment_g: ...}`);
      }
      return {
        type: 'rotation_test',
        index,
        end: m.end,
        moment: positive(ctx, [...at, 'moment'], m.moment, 'moment', 'the applied moment'),
        rotation: positive(ctx, [...at, 'rotation'], m.rotation, 'angle', 'the measured rotation'),
        measurementCov: covAt(ctx, [...at, 'measurement_cov'], m.measurement_cov),
        ...sourceOf(m),
      };
    }
    const axialLoad = amount(ctx, [...at, 'axial_load'], m.axial_load, 'force');
    if (!(axialLoad >= 0 && Number.isFinite(axialLoad))) fail(ctx, [...at, 'axial_load'], `must be a compression of zero or more, got ${m.axial_load}`);
    return {
      type: 'frequency',
      index,
      value: positive(ctx, [...at, 'value'], m.value, 'frequency', 'the measured frequency'),
      axialLoad,
      massPerLength: positive(ctx, [...at, 'mass_per_length'], m.mass_per_length, 'massPerLength', 'the mass per length'),
      measurementCov: covAt(ctx, [...at, 'measurement_cov'], m.measurement_cov),
      ...sourceOf(m),
    };
  });
}
