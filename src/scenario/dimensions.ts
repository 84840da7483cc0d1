/**
 * Physical dimensions as exponent vectors over mathjs's base dimensions, and the kinds of
 * quantity a scenario field can expect (each with its SI unit and an example for messages).
 */

/** Exponents of [mass, length, time, current, temperature, luminosity, amount, angle, bit]. */
export type Dimensions = readonly number[];

export const DIMENSIONLESS: Dimensions = [0, 0, 0, 0, 0, 0, 0, 0, 0];

function dims(mass: number, length: number, time: number, angle = 0): Dimensions {
  return [mass, length, time, 0, 0, 0, 0, angle, 0];
}

export type QuantityKind =
  | 'length'
  | 'area'
  | 'inertia'
  | 'sectionModulus'
  | 'stress'
  | 'force'
  | 'rotationalStiffness'
  | 'translationalStiffness'
  | 'lineLoad'
  | 'moment'
  | 'angle'
  | 'frequency'
  | 'massPerLength';

export interface KindInfo {
  /** "a stress": used in "expected a stress (e.g. 200 GPa)". */
  readonly noun: string;
  readonly dimensions: Dimensions;
  readonly siUnit: string;
  readonly example: string;
  /** Unit to show when the user wrote none we can echo (e.g. an expression of L). */
  readonly defaultDisplay: { unit: string; factor: number };
}

export const KINDS: Readonly<Record<QuantityKind, KindInfo>> = {
  length: { noun: 'a length', dimensions: dims(0, 1, 0), siUnit: 'm', example: '4.2 m', defaultDisplay: { unit: 'mm', factor: 1e-3 } },
  area: { noun: 'an area', dimensions: dims(0, 2, 0), siUnit: 'm^2', example: '7640 mm^2', defaultDisplay: { unit: 'mm^2', factor: 1e-6 } },
  inertia: { noun: 'a second moment of area', dimensions: dims(0, 4, 0), siUnit: 'm^4', example: '25.1e6 mm^4', defaultDisplay: { unit: 'mm^4', factor: 1e-12 } },
  sectionModulus: { noun: 'a section modulus', dimensions: dims(0, 3, 0), siUnit: 'm^3', example: '281e3 mm^3', defaultDisplay: { unit: 'mm^3', factor: 1e-9 } },
  stress: { noun: 'a stress', dimensions: dims(1, -1, -2), siUnit: 'Pa', example: '200 GPa', defaultDisplay: { unit: 'MPa', factor: 1e6 } },
  force: { noun: 'a force', dimensions: dims(1, 1, -2), siUnit: 'N', example: '420 kN', defaultDisplay: { unit: 'kN', factor: 1e3 } },
  rotationalStiffness: { noun: 'a rotational stiffness', dimensions: dims(1, 2, -2, -1), siUnit: 'N m/rad', example: '2.5 MN m/rad', defaultDisplay: { unit: 'kN m/rad', factor: 1e3 } },
  translationalStiffness: { noun: 'a translational stiffness', dimensions: dims(1, 0, -2), siUnit: 'N/m', example: '500 kN/m', defaultDisplay: { unit: 'kN/m', factor: 1e3 } },
  // a force per length along the height (wind on a facade column); the same dimension as a translational stiffness
  lineLoad: { noun: 'a line load (force per length)', dimensions: dims(1, 0, -2), siUnit: 'N/m', example: '1.8 kN/m', defaultDisplay: { unit: 'kN/m', factor: 1e3 } },
  // applied end moments (loads.<name>.moments); reports print moments too
  moment: { noun: 'a moment', dimensions: dims(1, 2, -2), siUnit: 'N m', example: '35 kN·m', defaultDisplay: { unit: 'kN·m', factor: 1e3 } },
  // measurements on the structure (scenario-level evidence, docs/evidence.md §7)
  angle: { noun: 'an angle', dimensions: dims(0, 0, 0, 1), siUnit: 'rad', example: '4.5 mrad', defaultDisplay: { unit: 'mrad', factor: 1e-3 } },
  frequency: { noun: 'a frequency', dimensions: dims(0, 0, -1), siUnit: 'Hz', example: '4.1 Hz', defaultDisplay: { unit: 'Hz', factor: 1 } },
  massPerLength: { noun: 'a mass per length', dimensions: dims(1, -1, 0), siUnit: 'kg/m', example: '60 kg/m', defaultDisplay: { unit: 'kg/m', factor: 1 } },
};

export function sameDimensions(a: Dimensions, b: Dimensions): boolean {
  for (let i = 0; i < 9; i++) if (Math.abs((a[i] ?? 0) - (b[i] ?? 0)) > 1e-12) return false;
  return true;
}

const OTHER_NAMES: readonly [Dimensions, string][] = [
  [DIMENSIONLESS, 'a pure number'],
  [dims(0, 3, 0), 'a volume or section modulus'],
  [dims(1, 2, -2), 'a moment (N m, no /rad)'],
  [dims(1, 0, 0), 'a mass'],
  [dims(0, 0, 1), 'a time'],
  [dims(0, 0, 0, 1), 'an angle'],
  [dims(1, 1, -2, -1), 'a force per radian'],
  [dims(1, -1, -2, 0), 'a stress'],
  [dims(1, 2, -3), 'a power'],
  [dims(1, -1, -2, -1), 'a stress per radian'],
];

const BASE_SYMBOLS = ['kg', 'm', 's', 'A', 'K', 'cd', 'mol', 'rad', 'bit'];

/** A phrase for any dimension: "a length", or "a quantity in kg m^-1 s^-2". */
export function describeDimensions(d: Dimensions): string {
  for (const info of Object.values(KINDS)) if (sameDimensions(d, info.dimensions)) return info.noun;
  for (const [od, name] of OTHER_NAMES) if (sameDimensions(d, od)) return name;
  const parts: string[] = [];
  d.forEach((e, i) => {
    if (e !== 0) parts.push(e === 1 ? BASE_SYMBOLS[i]! : `${BASE_SYMBOLS[i]}^${Number(e.toPrecision(6))}`);
  });
  return `a quantity in ${parts.join(' ')}`;
}
