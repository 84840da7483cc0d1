/**
 * `column.section.shape`: the section by its dimensions, which strength: plastic-zone needs. Kept in
 * one file so that a fuller description of sections can replace it in one place.
 */
import { fail, readScalar, type ReadContext } from './readScalar.js';
import type { ScenarioShape } from './scenarioShape.js';
import { makeDistribution } from '../probability/makeDistribution.js';
import type { Scalar, SectionShape } from './types.js';

type RawShape = ScenarioShape['column']['section']['shape'];

const EXAMPLE = 'shape: {type: i, h: 300 mm, b: 150 mm, tw: 7.1 mm, tf: 10.7 mm, family: rolled, axis: y}';

/** How far the plate area and second moment may be from the given area and inertia (fillets, rounding). */
const AGREEMENT = 0.15;

const meanOf = (s: Scalar): number => (s.kind === 'fixed' ? s.value : makeDistribution(s.spec).mean);

/**
 * `given` are the section's area and inertia as the file states them: the dimensions must describe
 * the same section (within AGREEMENT; plates without root fillets), or the models would disagree.
 */
export function readSectionShape(raw: RawShape, strength: string, ctx: ReadContext, given: { area: Scalar; inertia: Scalar }): { shape?: SectionShape } {
  const path = ['column', 'section', 'shape'];
  if (raw === undefined) {
    if (strength === 'plastic-zone') fail(ctx, path, `is missing: plastic-zone needs the section by its dimensions, e.g. ${EXAMPLE}`);
    return {};
  }
  const length = (key: 'h' | 'b' | 'tw' | 'tf'): number => {
    const s = readScalar(raw[key], { kind: 'length', domain: 'positive' }, [...path, key], ctx);
    return s.kind === 'fixed' ? s.value : fail(ctx, [...path, key], 'must be a fixed length, not a random variable');
  };
  const h = length('h');
  const b = length('b');
  const tw = length('tw');
  const tf = length('tf');
  if (!(2 * tf < h)) fail(ctx, [...path, 'tf'], `two flanges of ${tf * 1000} mm do not fit in a depth h of ${h * 1000} mm: expected tf < h/2`);
  if (!(tw < b)) fail(ctx, [...path, 'tw'], `a web of ${tw * 1000} mm is not thinner than the flange width b of ${b * 1000} mm: expected tw < b`);
  const area = 2 * b * tf + (h - 2 * tf) * tw;
  const inertia = raw.axis === 'y' ? (b * h ** 3 - (b - tw) * (h - 2 * tf) ** 3) / 12 : (2 * tf * b ** 3 + (h - 2 * tf) * tw ** 3) / 12;
  const off = (plate: number, stated: number): boolean => Math.abs(plate / stated - 1) > AGREEMENT;
  if (off(area, meanOf(given.area))) {
    fail(ctx, path, `the dimensions give an area of ${(area * 1e6).toFixed(0)} mm², more than ${AGREEMENT * 100} % from column.section.area (${(meanOf(given.area) * 1e6).toFixed(0)} mm²): expected the same section`);
  }
  if (off(inertia, meanOf(given.inertia))) {
    fail(ctx, path, `the dimensions give I${raw.axis} = ${(inertia * 1e12).toExponential(3)} mm⁴, more than ${AGREEMENT * 100} % from column.section.inertia (${(meanOf(given.inertia) * 1e12).toExponential(3)} mm⁴): expected the same section and axis`);
  }
  return { shape: { type: raw.type, h, b, tw, tf, family: raw.family, axis: raw.axis } };
}
