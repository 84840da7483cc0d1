/**
 * The units nearly every scenario uses, with the factor and dimensions mathjs gives them, so that
 * reading a plain scenario never starts mathjs's unit machinery (about 0.5 s the first time).
 * test/scenario/commonUnits.test.ts checks every entry against mathjs, value and dimensions.
 * Dimensions are mathjs's base order: mass, length, time, current, temperature, luminous
 * intensity, amount of substance, angle, bit.
 */
import type { UnitInfo } from './mathjsBundle.js';

const LENGTH = [0, 1, 0, 0, 0, 0, 0, 0, 0];
const FORCE = [1, 1, -2, 0, 0, 0, 0, 0, 0];
const STRESS = [1, -1, -2, 0, 0, 0, 0, 0, 0];
const ANGLE = [0, 0, 0, 0, 0, 0, 0, 1, 0];
const TIME = [0, 0, 1, 0, 0, 0, 0, 0, 0];
/** The Julian year, mathjs's `year` (365.25 days). */
const YEAR = 31557600;

export const COMMON_UNITS: Readonly<Record<string, UnitInfo>> = {
  m: { factor: 1, dimensions: LENGTH },
  mm: { factor: 0.001, dimensions: LENGTH },
  cm: { factor: 0.01, dimensions: LENGTH },
  km: { factor: 1000, dimensions: LENGTH },
  ft: { factor: 0.3048, dimensions: LENGTH },
  inch: { factor: 0.0254, dimensions: LENGTH },
  N: { factor: 1, dimensions: FORCE },
  kN: { factor: 1000, dimensions: FORCE },
  MN: { factor: 1e6, dimensions: FORCE },
  Pa: { factor: 1, dimensions: STRESS },
  kPa: { factor: 1000, dimensions: STRESS },
  MPa: { factor: 1e6, dimensions: STRESS },
  GPa: { factor: 1e9, dimensions: STRESS },
  rad: { factor: 1, dimensions: ANGLE },
  mrad: { factor: 0.001, dimensions: ANGLE },
  s: { factor: 1, dimensions: TIME },
  h: { factor: 3600, dimensions: TIME },
  hour: { factor: 3600, dimensions: TIME },
  hours: { factor: 3600, dimensions: TIME },
  day: { factor: 86400, dimensions: TIME },
  days: { factor: 86400, dimensions: TIME },
  year: { factor: YEAR, dimensions: TIME },
  years: { factor: YEAR, dimensions: TIME },
};
