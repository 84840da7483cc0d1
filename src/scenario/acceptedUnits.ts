/**
 * What to tell someone whose unit was refused: the usual units of the quantity the field
 * expects, and the unit they probably meant when only the letter case is wrong
 * (`Mpa`, `gpa` → MPa, GPa). Case matters in units (mPa is a millipascal), so a wrong case
 * is suggested, never silently accepted.
 */
import type { QuantityKind } from './dimensions.js';

/** Shown in messages; every spelling here is accepted as input (tested). */
export const ACCEPTED_UNITS: Readonly<Record<QuantityKind, readonly string[]>> = {
  length: ['m', 'mm', 'cm', 'ft', 'in'],
  area: ['mm²', 'cm²', 'm²', 'in²', 'mm^2'],
  inertia: ['mm⁴', 'cm⁴', 'm⁴', 'in⁴', 'mm^4'],
  sectionModulus: ['mm³', 'cm³', 'm³', 'in³', 'mm^3'],
  stress: ['Pa', 'kPa', 'MPa', 'GPa', 'N/mm²', 'psi', 'ksi'],
  force: ['N', 'kN', 'MN', 'lbf', 'kip'],
  rotationalStiffness: ['kN·m/rad', 'kNm/rad', 'kN-m/rad', 'kN m/rad', 'MN·m/rad', 'N·m/rad', 'kip·in/rad', 'kip-ft/rad', 'kN·m/deg'],
  translationalStiffness: ['N/m', 'kN/m', 'kN/mm', 'MN/m', 'kip/in', 'lbf/in'],
  lineLoad: ['N/m', 'kN/m', 'N/mm', 'kip/ft', 'lbf/ft'],
  moment: ['kN·m', 'kNm', 'kN-m', 'N·m', 'MN·m', 'kip·ft', 'kip-in', 'lbf·in'],
  angle: ['rad', 'mrad', 'deg'],
  frequency: ['Hz'],
  massPerLength: ['kg/m', 'lb/ft'],
};

/** Single unit names a structural scenario uses, in their correct case. */
const USUAL_NAMES = [
  'm', 'mm', 'cm', 'km', 'ft', 'in', 'inch', 'N', 'kN', 'MN', 'GN', 'lbf', 'kip', 'kips',
  'Pa', 'kPa', 'MPa', 'GPa', 'psi', 'ksi', 'rad', 'deg', 'kNm', 'MNm', 'Nm', 'Nmm', 'kNmm',
];

/** Units that exist but are almost surely a slip in a structural scenario. */
export const LIKELY_SLIPS: Readonly<Record<string, string>> = { mPa: 'MPa', mN: 'MN' };

/** The usual unit this unknown (or suspicious) name differs from only by case, if any. */
export function suggestUnit(name: string): string | undefined {
  if (Object.prototype.hasOwnProperty.call(LIKELY_SLIPS, name)) return LIKELY_SLIPS[name];
  const lower = name.toLowerCase();
  return USUAL_NAMES.find((u) => u !== name && u.toLowerCase() === lower);
}

/** "units accepted for a stress: Pa, kPa, ..." */
export function acceptedUnitsPhrase(kind: QuantityKind, noun: string): string {
  const feetAndInches = kind === 'length' ? ', or feet and inches (13 ft 9 in)' : '';
  return `units accepted for ${noun}: ${ACCEPTED_UNITS[kind].join(', ')}${feetAndInches}`;
}
