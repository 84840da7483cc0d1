import { describe, expect, it } from 'vitest';
import { defaultCornerRadii, namedProperties, PROPERTY_COUNT, sectionWriter, type SectionDimensions, type SectionProperties } from '../../src/sections/index.js';
import { spandrelArea, spandrelCentroid, spandrelOwnInertia } from '../../src/sections/spandrel.js';

const mm = 1e-3;
function propertiesOf(d: SectionDimensions, primary = 0, secondary = primary): SectionProperties {
  const out = new Float64Array(PROPERTY_COUNT);
  sectionWriter(d)(out, primary, secondary);
  return namedProperties(out);
}

/** Table values in cm units as printed: A cm², I cm⁴, W cm³, i cm. */
type Row = Partial<Record<keyof SectionProperties, number>>;
const TO_SI: Record<keyof SectionProperties, number> = { A: 1e-4, Iy: 1e-8, Iz: 1e-8, Wel_y: 1e-6, Wel_z: 1e-6, Wpl_y: 1e-6, Wpl_z: 1e-6, iy: 1e-2, iz: 1e-2 };

/** A printed value agrees when the computed one rounds to it: within half a unit of its last digit (plus 0.1 % for the table's own rounding of the fillet). */
function expectTable(p: SectionProperties, row: Row, printed: Record<string, string>): void {
  for (const [key, value] of Object.entries(row) as [keyof SectionProperties, number][]) {
    const text = printed[key] ?? String(value);
    const decimals = text.includes('.') ? text.split('.')[1]!.length : 0;
    const halfUnit = 0.5 * 10 ** -decimals;
    const computed = p[key] / TO_SI[key];
    expect(Math.abs(computed - value), `${key}: computed ${computed}, table ${value}`).toBeLessThanOrEqual(halfUnit + 1e-3 * value);
  }
}
const asPrinted = (row: Row) => Object.fromEntries(Object.entries(row).map(([k, v]) => [k, String(v)]));

describe('section properties from dimensions against published section tables', () => {
  it('HEB 200 (h 200, b 200, tw 9, tf 15, r 18 mm)', () => {
    // from memory: the European rolled-section tables (dimensions to EN 10365; properties as printed by the producers)
    const row: Row = { A: 78.1, Iy: 5696, Iz: 2003, Wel_y: 570, Wel_z: 200, Wpl_y: 643, Wpl_z: 306, iy: 8.54, iz: 5.07 };
    expectTable(propertiesOf({ shape: 'i', h: 200 * mm, b: 200 * mm, tw: 9 * mm, tf: 15 * mm, r: 18 * mm }), row, asPrinted(row));
  });
  it('IPE 300 (h 300, b 150, tw 7.1, tf 10.7, r 15 mm)', () => {
    // from memory: the European rolled-section tables (dimensions to EN 10365)
    const row: Row = { A: 53.8, Iy: 8356, Iz: 604, Wel_y: 557, Wel_z: 80.5, Wpl_y: 628, Wpl_z: 125, iy: 12.46, iz: 3.35 };
    expectTable(propertiesOf({ shape: 'i', h: 300 * mm, b: 150 * mm, tw: 7.1 * mm, tf: 10.7 * mm, r: 15 * mm }), row, asPrinted(row));
  });
  it('HEA 200 (h 190, b 200, tw 6.5, tf 10, r 18 mm)', () => {
    // from memory: the European rolled-section tables (dimensions to EN 10365)
    const row: Row = { A: 53.8, Iy: 3692, Iz: 1336, Wel_y: 389, Wel_z: 134, Wpl_y: 429.5, Wpl_z: 204, iy: 8.28, iz: 4.98 };
    expectTable(propertiesOf({ shape: 'i', h: 190 * mm, b: 200 * mm, tw: 6.5 * mm, tf: 10 * mm, r: 18 * mm }), row, asPrinted(row));
  });
  it('SHS 100 × 100 × 5 hot-finished, corner radii by EN 10210-2 (ro = 1.5 t, ri = t)', () => {
    // from memory: EN 10210-2 hot-finished square hollow section table
    const t = 5 * mm;
    const row: Row = { A: 18.7, Iy: 279, Iz: 279, Wel_y: 55.9, iy: 3.86 };
    expectTable(propertiesOf({ shape: 'rhs', h: 100 * mm, b: 100 * mm, t, ...defaultCornerRadii('hot', t) }), row, asPrinted(row));
  });
  it('CHS 168.3 × 6.3', () => {
    // from memory: EN 10210-2 circular hollow section table
    const row: Row = { A: 32.1, Iy: 1053, Wel_y: 125, Wpl_y: 165, iy: 5.73 };
    expectTable(propertiesOf({ shape: 'chs', D: 168.3 * mm, t: 6.3 * mm }), row, asPrinted(row));
  });
});

describe('exact geometry (common practice: composite areas and the parallel-axis theorem)', () => {
  it('the spandrel (square less quarter circle) against a numerical integration', () => {
    const r = 0.02;
    // midpoint rule over a fine grid, independent of the closed forms
    const n = 2000;
    let area = 0, first = 0, second = 0;
    const h = r / n;
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        const x = (i + 0.5) * h, y = (j + 0.5) * h;
        if ((x - r) ** 2 + (y - r) ** 2 > r * r) {
          area += h * h;
          first += y * h * h;
          second += y * y * h * h;
        }
      }
    }
    const c = first / area;
    expect(spandrelArea(r) / area).toBeCloseTo(1, 4);
    expect(spandrelCentroid(r) / c).toBeCloseTo(1, 3);
    expect(spandrelOwnInertia(r) / (second - area * c * c)).toBeCloseTo(1, 3);
  });

  it('a welded I (r = 0) is two flanges and a web', () => {
    const [h, b, tw, tf] = [0.4, 0.2, 0.01, 0.02];
    const p = propertiesOf({ shape: 'i', h, b, tw, tf, r: 0 });
    const hw = h - 2 * tf;
    expect(p.A).toBeCloseTo(2 * b * tf + hw * tw, 15);
    expect(p.Iy / ((b * h ** 3 - (b - tw) * hw ** 3) / 12)).toBeCloseTo(1, 12);
    expect(p.Iz / ((2 * tf * b ** 3 + hw * tw ** 3) / 12)).toBeCloseTo(1, 12);
    expect(p.Wpl_y / (b * tf * (h - tf) + (tw * hw * hw) / 4)).toBeCloseTo(1, 12);
  });

  it('RHS with square corners is the outer less the inner rectangle', () => {
    const [h, b, t] = [0.2, 0.1, 0.008];
    const p = propertiesOf({ shape: 'rhs', h, b, t, ro: 0, ri: 0 });
    expect(p.Iy / ((b * h ** 3 - (b - 2 * t) * (h - 2 * t) ** 3) / 12)).toBeCloseTo(1, 12);
    expect(p.Wel_z / ((h * b ** 3 - (h - 2 * t) * (b - 2 * t) ** 3) / 12 / (b / 2))).toBeCloseTo(1, 12);
  });

  it('cold-formed corner radii follow the thickness bands of EN 10219-2 (from memory)', () => {
    expect(defaultCornerRadii('cold', 5 * mm).ro).toBeCloseTo(10 * mm, 12);
    expect(defaultCornerRadii('cold', 8 * mm).ro).toBeCloseTo(20 * mm, 12);
    expect(defaultCornerRadii('cold', 12 * mm).ro).toBeCloseTo(36 * mm, 12);
    expect(defaultCornerRadii('cold', 12 * mm).ri).toBeCloseTo(24 * mm, 12);
  });
});

describe('corrosion loss reduces every property from the reduced dimensions', () => {
  it('I section, the same loss d on every face: tf − 2d, tw − 2d, b − 2d, h − 2d, r + d (hand computed)', () => {
    const d = 1 * mm;
    const p = propertiesOf({ shape: 'i', h: 200 * mm, b: 200 * mm, tw: 9 * mm, tf: 15 * mm, r: 18 * mm }, d);
    // by hand: flanges 198 × 13, web 7 × (198 − 26) = 7 × 172, fillets (4 − π) · 19²
    const A = 2 * 198 * 13 + 172 * 7 + (4 - Math.PI) * 19 * 19;
    expect(p.A / (A * 1e-6)).toBeCloseTo(1, 12);
    const sound = propertiesOf({ shape: 'i', h: 200 * mm, b: 200 * mm, tw: 9 * mm, tf: 15 * mm, r: 18 * mm });
    for (const key of ['A', 'Iy', 'Iz', 'Wel_y', 'Wel_z', 'Wpl_y', 'Wpl_z'] as const) expect(p[key]).toBeLessThan(sound[key]);
  });

  it('I section per plate: the flanges and the web lose different depths', () => {
    const p = propertiesOf({ shape: 'i', h: 0.3, b: 0.15, tw: 0.01, tf: 0.02, r: 0 }, 2 * mm, 1 * mm);
    // by hand: flanges 146 × 16, web 8 × (296 − 32), no fillet
    expect(p.A / ((2 * 146 * 16 + 8 * 264) * 1e-6)).toBeCloseTo(1, 12);
  });

  it('RHS loses on its outer face only: t − d, outer sizes − 2d, inside unchanged (hand computed)', () => {
    const d = 1 * mm;
    const p = propertiesOf({ shape: 'rhs', h: 0.2, b: 0.1, t: 0.008, ro: 0.012, ri: 0.008 }, d);
    // by hand (EN 10219-2 Annex B style area): 2 t'(B' + H' − 2 t') − (4 − π)(ro'² − ri²), t' = 7, B' = 98, H' = 198, ro' = 11
    const A = 2 * 7 * (98 + 198 - 14) - (4 - Math.PI) * (11 * 11 - 8 * 8);
    expect(p.A / (A * 1e-6)).toBeCloseTo(1, 12);
  });

  it('CHS: D − 2d and t − d; solid timber: every face', () => {
    const c = propertiesOf({ shape: 'chs', D: 0.1683, t: 0.0063 }, 1 * mm);
    expect(c.A / ((Math.PI / 4) * (0.1663 ** 2 - (0.1663 - 2 * 0.0053) ** 2))).toBeCloseTo(1, 12);
    const r = propertiesOf({ shape: 'rect', b: 0.1, h: 0.2 }, 5 * mm);
    expect(r.A).toBeCloseTo(0.09 * 0.19, 15);
    expect(r.Iy / ((0.09 * 0.19 ** 3) / 12)).toBeCloseTo(1, 12);
    expect(r.Iz / ((0.19 * 0.09 ** 3) / 12)).toBeCloseTo(1, 12);
  });

  it('a loss through a plate leaves no section (every property 0, never NaN)', () => {
    const p = propertiesOf({ shape: 'i', h: 0.2, b: 0.2, tw: 0.009, tf: 0.015, r: 0.018 }, 0.0075);
    expect(Object.values(p).every((v) => v === 0)).toBe(true);
    expect(propertiesOf({ shape: 'chs', D: 0.1, t: 0.004 }, 0.005).A).toBe(0);
  });
});
