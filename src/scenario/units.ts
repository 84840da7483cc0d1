/**
 * Unit names a scenario may use: every proportional unit mathjs knows, plus a few that
 * structural engineers use and mathjs lacks. `L` is never a unit here (mathjs reads it as
 * litres): in a scenario it is the column length.
 */
import { lookupMathjsUnit, type UnitInfo } from './mathjsBundle.js';
import { COMMON_UNITS } from './commonUnits.js';

// Exact definitions: 1 lbf = 0.45359237 kg × 9.80665 m/s², 1 in = 0.0254 m (NIST SP 811).
const LBF = 0.45359237 * 9.80665;
const PSI = LBF / (0.0254 * 0.0254);
const STRESS = [1, -1, -2, 0, 0, 0, 0, 0, 0];
const FORCE = [1, 1, -2, 0, 0, 0, 0, 0, 0];

/** Units mathjs lacks, or rounds (its kip is 4448.2216 N). */
const EXTRA_UNITS: Readonly<Record<string, UnitInfo>> = {
  psi: { factor: PSI, dimensions: STRESS },
  ksi: { factor: 1000 * PSI, dimensions: STRESS },
  kip: { factor: 1000 * LBF, dimensions: FORCE },
  kips: { factor: 1000 * LBF, dimensions: FORCE },
};

export const COLUMN_LENGTH_SYMBOL = 'L';

export function lookupUnit(name: string): UnitInfo | undefined {
  if (name === COLUMN_LENGTH_SYMBOL) return undefined;
  if (Object.prototype.hasOwnProperty.call(EXTRA_UNITS, name)) return EXTRA_UNITS[name];
  // the usual units without starting mathjs (commonUnits.ts; same values)
  if (Object.prototype.hasOwnProperty.call(COMMON_UNITS, name)) return COMMON_UNITS[name];
  return lookupMathjsUnit(name);
}
