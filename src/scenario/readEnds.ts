/** The `column.ends` block → End values, with the sway-mechanism and braced-lateral rules. */
import type { PathSegment } from './rawTree.js';
import { fail, readScalar, type ReadContext, type RawScalar } from './readScalar.js';
import { restraintRatio } from './restraintRatio.js';
import { meanOf } from './readScalar.js';
import type { Beam, End, Frame, Scalar, SeriesComponent } from './types.js';

export interface RawBeam {
  E?: string | undefined;
  inertia: string;
  length: string;
}
export type RawEndValue =
  | 'pinned'
  | 'fixed'
  | { rotation: RawScalar; beam?: RawBeam | undefined }
  | { series: Record<string, RawScalar>; beam?: RawBeam | undefined }
  | { fixity: RawScalar }
  | { alignment_g: RawScalar };

function readBeam(raw: RawBeam, path: PathSegment[], ctx: ReadContext): Beam {
  const value = (v: string, kind: 'stress' | 'inertia' | 'length', key: string): number => {
    const s = readScalar(v, { kind, domain: 'positive' }, [...path, key], ctx);
    return s.kind === 'fixed' ? s.value : fail(ctx, [...path, key], 'must be a fixed quantity, not a random variable');
  };
  return {
    ...(raw.E !== undefined ? { E: value(raw.E, 'stress', 'E') } : {}),
    inertia: value(raw.inertia, 'inertia', 'inertia'),
    length: value(raw.length, 'length', 'length'),
  };
}

export function readEnd(raw: RawEndValue, frame: Frame, path: PathSegment[], ctx: ReadContext): End {
  if (raw === 'pinned') return { type: 'pinned' };
  if (raw === 'fixed') return { type: 'fixed' };
  if ('rotation' in raw) {
    const k = readScalar(raw.rotation, { kind: 'rotationalStiffness', domain: 'nonnegative' }, [...path, 'rotation'], ctx);
    return raw.beam === undefined ? { type: 'rotation', k } : { type: 'rotation', k, beam: readBeam(raw.beam, [...path, 'beam'], ctx) };
  }
  if ('series' in raw) return readSeriesEnd(raw, path, ctx);
  const from = 'fixity' in raw ? 'fixity' : 'alignment_g';
  const given = 'fixity' in raw ? raw.fixity : raw.alignment_g;
  const input = readScalar(given, { kind: 'number', domain: from === 'fixity' ? 'fixity' : 'alignment' }, [...path, from], ctx);
  if (input.kind === 'fixed' && from === 'alignment_g' && input.value === 0) return { type: 'fixed' }; // G = 0: rigid
  return { type: 'ratio', from, input, R: restraintRatio(from, frame, meanOf(input)) };
}

const COMPONENT_NAME = /^[A-Za-z][A-Za-z0-9_]*$/;

/** `{series: {name: Q | {dist…} | rigid, …}}`: each component validated like `rotation`. */
function readSeriesEnd(raw: { series: Record<string, RawScalar>; beam?: RawBeam | undefined }, path: PathSegment[], ctx: ReadContext): End {
  const at = [...path, 'series'];
  const names = Object.keys(raw.series);
  if (names.length === 0) fail(ctx, at, 'is empty: give at least one component, e.g. series: {connection: 2.5 MN m/rad, foundation: 8 MN m/rad}');
  const components: SeriesComponent[] = names.map((name) => {
    if (!COMPONENT_NAME.test(name)) fail(ctx, [...at, name], 'a component name must start with a letter and hold only letters, digits and _ (it names a variable)');
    const value = raw.series[name];
    if (value === 'rigid') return { name, k: 'rigid' };
    return { name, k: readScalar(value, { kind: 'rotationalStiffness', domain: 'nonnegative' }, [...at, name], ctx) };
  });
  // every component rigid: the end is rigid
  if (components.every((c) => c.k === 'rigid')) return { type: 'fixed' };
  const beam = raw.beam === undefined ? undefined : readBeam(raw.beam, [...path, 'beam'], ctx);
  return beam === undefined ? { type: 'series', components } : { type: 'series', components, beam };
}

/** True when the end certainly gives no rotational restraint. */
function isFree(end: End): boolean {
  if (end.type === 'pinned') return true;
  if (end.type === 'rotation') return end.k.kind === 'fixed' && end.k.value === 0;
  if (end.type === 'ratio') return end.input.kind === 'fixed' && end.R === 0;
  if (end.type === 'series') return end.components.some((c) => c.k !== 'rigid' && c.k.kind === 'fixed' && c.k.value === 0);
  return false;
}

function isZero(s: Scalar | null): boolean {
  return s === null || (s.kind === 'fixed' && s.value === 0);
}

export interface RawEnds {
  bottom: RawEndValue;
  top: RawEndValue;
  lateral?: RawScalar | undefined;
}

export function readEnds(raw: RawEnds, frame: Frame, ctx: ReadContext, base: PathSegment[] = ['column', 'ends']): { bottom: End; top: End; lateral: Scalar | null } {
  const bottom = readEnd(raw.bottom, frame, [...base, 'bottom'], ctx);
  const top = readEnd(raw.top, frame, [...base, 'top'], ctx);
  if (frame === 'braced') {
    // A zero spring is harmless (docs/scenario-format.md's own example writes `lateral: 0 kN/m` on a
    // braced column); any other value would silently mean nothing, so it is refused.
    if (raw.lateral !== undefined) {
      const lateral = readScalar(raw.lateral, { kind: 'translationalStiffness', domain: 'nonnegative' }, [...base, 'lateral'], ctx);
      if (!isZero(lateral)) {
        fail(ctx, [...base, 'lateral'], 'a lateral spring only applies to a sway frame (a braced column does not move sideways); remove it or set frame: sway');
      }
    }
    return { bottom, top, lateral: null };
  }
  const lateral =
    raw.lateral === undefined
      ? ({ kind: 'fixed', value: 0 } as const)
      : readScalar(raw.lateral, { kind: 'translationalStiffness', domain: 'nonnegative' }, [...base, 'lateral'], ctx);
  if (isFree(bottom) && isFree(top) && isZero(lateral)) {
    fail(ctx, base, 'a sway column with pinned ends and no lateral spring is a mechanism (it has no stiffness against sway); give a rotational or lateral restraint');
  }
  return { bottom, top, lateral };
}
