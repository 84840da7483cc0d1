import { enReductionFactor, EN_IMPERFECTION, type EnCurve } from '../mechanics/en1993.js';
import { plasticZoneCapacity } from './plasticZoneCapacity.js';
import { fibreSection } from './sectionFibres.js';
import type { BendingAxis, SectionDimensions, SectionFamily } from './types.js';

/**
 * Pinned columns of standard shapes with their family's residual stresses and a half-sine bow of
 * L/1000, against the EN 1993-1-1:2005 curve that Table 6.2 assigns to them (χ of Eq. 6.49 with α of
 * Table 6.1; S235). Dimensions of the rolled shapes from EN 10365, the SHS from EN 10210-2 (from
 * memory); the welded I is a plate girder chosen to fall in Table 6.2's welded row (tf ≤ 40 mm).
 * The same rows feed the verification test, the docs table and the benchmark.
 */
export interface CurveCase {
  readonly name: string;
  readonly section: SectionDimensions;
  readonly family: SectionFamily;
  readonly axis: BendingAxis;
  readonly curve: EnCurve;
}

export const CURVE_CASES: readonly CurveCase[] = [
  { name: 'IPE 300 rolled, y-y', section: { shape: 'i', h: 0.3, b: 0.15, tw: 0.0071, tf: 0.0107 }, family: 'rolled', axis: 'y', curve: 'a' },
  { name: 'IPE 300 rolled, z-z', section: { shape: 'i', h: 0.3, b: 0.15, tw: 0.0071, tf: 0.0107 }, family: 'rolled', axis: 'z', curve: 'b' },
  { name: 'HEB 300 rolled, y-y', section: { shape: 'i', h: 0.3, b: 0.3, tw: 0.011, tf: 0.019 }, family: 'rolled', axis: 'y', curve: 'b' },
  { name: 'HEB 300 rolled, z-z', section: { shape: 'i', h: 0.3, b: 0.3, tw: 0.011, tf: 0.019 }, family: 'rolled', axis: 'z', curve: 'c' },
  { name: 'welded I 400×300×10×20, y-y', section: { shape: 'i', h: 0.4, b: 0.3, tw: 0.01, tf: 0.02 }, family: 'welded', axis: 'y', curve: 'b' },
  { name: 'welded I 400×300×10×20, z-z', section: { shape: 'i', h: 0.4, b: 0.3, tw: 0.01, tf: 0.02 }, family: 'welded', axis: 'z', curve: 'c' },
  { name: 'SHS 200×10 hot-finished', section: { shape: 'rhs', h: 0.2, b: 0.2, t: 0.01 }, family: 'hollow', axis: 'y', curve: 'a' },
];

export const CURVE_E = 210e9;
export const CURVE_FY = 235e6;

export interface CurvePoint {
  readonly lambdaBar: number;
  readonly chiModel: number;
  readonly chiCurve: number;
}

/** χ of the plastic-zone model and of the curve at each λ̄ (λ̄ sets L through the fibre section's A and I). */
export function curveComparison(c: CurveCase, lambdaBars: readonly number[], elements = 16): CurvePoint[] {
  const f = fibreSection(c.section, c.family, c.axis, CURVE_FY);
  const r = Math.sqrt(f.I / f.A);
  return lambdaBars.map((lambdaBar) => {
    const L = lambdaBar * Math.PI * r * Math.sqrt(CURVE_E / CURVE_FY);
    const res = plasticZoneCapacity({
      section: c.section, family: c.family, axis: c.axis, E: CURVE_E, fy: CURVE_FY, L, frame: 'braced',
      kBottom: 0, kTop: 0, e0: L / 1000, bowShape: 'half-sine', elements,
    });
    return { lambdaBar, chiModel: res.capacity / res.squashLoad, chiCurve: enReductionFactor(EN_IMPERFECTION[c.curve], lambdaBar) };
  });
}
