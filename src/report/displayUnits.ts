/**
 * Display units: SI values in, numbers in the engineer's units out. JSON stays SI.
 *
 * Exact factors (NIST SP 811 (2008) Appendix B; international yard and pound agreement, 1959):
 *   1 in = 0.0254 m exactly, 1 ft = 12 in;
 *   1 lbf = 0.45359237 kg × 9.80665 m/s² = 4.4482216152605 N exactly.
 */
import type { QuantityKind } from './reportInput.js';

export type UnitSystem = 'si' | 'us';

export const METRE_PER_INCH = 0.0254;
export const METRE_PER_FOOT = 12 * METRE_PER_INCH;
export const NEWTON_PER_LBF = 4.4482216152605;
export const NEWTON_PER_KIP = 1000 * NEWTON_PER_LBF;
export const PASCAL_PER_KSI = NEWTON_PER_KIP / (METRE_PER_INCH * METRE_PER_INCH);

/** A display unit: its label and how many SI units one of it is. */
export interface DisplayUnit {
  label: string;
  siPerUnit: number;
}

const MM = 1e-3;
const SI_UNITS: Record<QuantityKind, DisplayUnit> = {
  length: { label: 'm', siPerUnit: 1 },
  area: { label: 'mm²', siPerUnit: MM ** 2 },
  inertia: { label: 'mm⁴', siPerUnit: MM ** 4 },
  sectionModulus: { label: 'mm³', siPerUnit: MM ** 3 },
  stress: { label: 'MPa', siPerUnit: 1e6 },
  force: { label: 'kN', siPerUnit: 1e3 },
  rotationalStiffness: { label: 'kN·m/rad', siPerUnit: 1e3 },
  translationalStiffness: { label: 'kN/m', siPerUnit: 1e3 },
  lineLoad: { label: 'kN/m', siPerUnit: 1e3 },
  moment: { label: 'kN·m', siPerUnit: 1e3 },
  dimensionless: { label: '', siPerUnit: 1 },
};

const IN = METRE_PER_INCH;
const US_UNITS: Record<QuantityKind, DisplayUnit> = {
  length: { label: 'ft', siPerUnit: METRE_PER_FOOT },
  area: { label: 'in²', siPerUnit: IN ** 2 },
  inertia: { label: 'in⁴', siPerUnit: IN ** 4 },
  sectionModulus: { label: 'in³', siPerUnit: IN ** 3 },
  stress: { label: 'ksi', siPerUnit: PASCAL_PER_KSI },
  force: { label: 'kip', siPerUnit: NEWTON_PER_KIP },
  rotationalStiffness: { label: 'kip·in/rad', siPerUnit: NEWTON_PER_KIP * IN },
  translationalStiffness: { label: 'kip/in', siPerUnit: NEWTON_PER_KIP / IN },
  lineLoad: { label: 'kip/ft', siPerUnit: NEWTON_PER_KIP / METRE_PER_FOOT },
  moment: { label: 'kip·ft', siPerUnit: NEWTON_PER_KIP * METRE_PER_FOOT },
  dimensionless: { label: '', siPerUnit: 1 },
};

const SMALL_LENGTH_SI: DisplayUnit = { label: 'mm', siPerUnit: MM };
const SMALL_LENGTH_US: DisplayUnit = { label: 'in', siPerUnit: IN };

/** The unit a whole axis or table column uses for this kind (lengths in m or ft). */
export function displayUnit(kind: QuantityKind, system: UnitSystem): DisplayUnit {
  return system === 'si' ? SI_UNITS[kind] : US_UNITS[kind];
}

/**
 * The unit for one value: like displayUnit, but a length under 0.1 m (SI) or 1 ft (US)
 * shows in mm or in, so a bow of 4 mm does not read as 0.004 m.
 */
export function displayUnitFor(valueSI: number, kind: QuantityKind, system: UnitSystem): DisplayUnit {
  if (kind === 'length' && Number.isFinite(valueSI) && valueSI !== 0) {
    const small = system === 'si' ? Math.abs(valueSI) < 0.1 : Math.abs(valueSI) < METRE_PER_FOOT;
    if (small) return system === 'si' ? SMALL_LENGTH_SI : SMALL_LENGTH_US;
  }
  return displayUnit(kind, system);
}

export function toDisplay(valueSI: number, unit: DisplayUnit): number {
  return valueSI / unit.siPerUnit;
}

export function fromDisplay(value: number, unit: DisplayUnit): number {
  return value * unit.siPerUnit;
}

const SUPERSCRIPT: Record<string, string> = {
  '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹',
};

function superscript(n: number): string {
  return String(n).split('').map((ch) => SUPERSCRIPT[ch] ?? ch).join('');
}

/** toPrecision without exponent and without trailing zeros: 4.20 → '4.2', 1250 → '1250'. */
function plainDigits(x: number, sig: number): string {
  const magnitude = Math.floor(Math.log10(Math.abs(x))) + 1; // digits before the point; ≤ 0 below 1
  // never round away integer digits: 1234 kN stays 1234, not 1230
  const precision = Math.min(15, Math.max(sig, magnitude));
  const fixed = Number(x.toPrecision(precision));
  const decimals = Math.min(20, Math.max(0, precision - magnitude));
  let text = fixed.toFixed(decimals);
  if (text.includes('.')) text = text.replace(/0+$/, '').replace(/\.$/, '');
  return text;
}

/**
 * A number for people: `sig` significant figures, engineering notation (×10³ⁿ) outside
 * [1e-3, 1e6), a real minus sign. Infinity → '∞', NaN → '—'.
 */
export function formatNumber(x: number, sig = 3): string {
  if (Number.isNaN(x)) return '—';
  if (!Number.isFinite(x)) return x > 0 ? '∞' : '−∞';
  if (x === 0) return '0';
  const sign = x < 0 ? '−' : '';
  const a = Math.abs(x);
  if (a >= 1e-3 && a < 1e6) return sign + plainDigits(a, sig);
  let exp3 = Math.floor(Math.log10(a) / 3) * 3;
  let mantissa = Number((a / 10 ** exp3).toPrecision(sig));
  if (mantissa >= 1000) {
    exp3 += 3;
    mantissa /= 1000;
  }
  return `${sign}${plainDigits(mantissa, sig)}×10${superscript(exp3)}`;
}

/** A probability always in scientific form ('7.1×10⁻²'), for a column that must not mix forms. */
export function formatProbabilityScientific(p: number, sig = 3): string {
  if (Number.isNaN(p)) return '—';
  if (p <= 0 || !Number.isFinite(p)) return formatNumber(p);
  let e = Math.floor(Math.log10(p));
  let mantissa = Number((p / 10 ** e).toPrecision(sig));
  if (mantissa >= 10) {
    mantissa /= 10;
    e += 1;
  }
  return `${plainDigits(mantissa, sig)}×10${superscript(e)}`;
}

/** Probabilities of one table column in one form: all plain when every one is ≥ 0.01, else all scientific. */
export function formatProbabilityColumn(ps: readonly number[]): string[] {
  const plain = ps.every((p) => !(p > 0 && p < 0.01));
  return ps.map((p) => (plain ? formatProbability(p) : formatProbabilityScientific(p)));
}

/** Numbers of one table column with the same count of decimals ('0.071', '0.001'), real minus signs. */
export function formatFixedColumn(xs: readonly number[], decimals: number): string[] {
  return xs.map((x) => (Number.isFinite(x) ? x.toFixed(decimals).replace(/^-(?=.*[1-9])/, '−').replace(/^-/, '') : formatNumber(x)));
}

/** A probability: 3 significant figures, scientific below 0.01 ('6.21×10⁻⁴'). */
export function formatProbability(p: number): string {
  if (Number.isNaN(p)) return '—';
  if (p === 0) return '0';
  if (p >= 0.01) return plainDigits(p, 3);
  const exp = Math.floor(Math.log10(p));
  let mantissa = Number((p / 10 ** exp).toPrecision(3));
  let e = exp;
  if (mantissa >= 10) {
    mantissa /= 10;
    e += 1;
  }
  return `${plainDigits(mantissa, 3)}×10${superscript(e)}`;
}

/** A reliability index to two decimals ('3.21'); ∞ when no failure was seen. */
export function formatBeta(beta: number): string {
  if (Number.isNaN(beta)) return '—';
  if (!Number.isFinite(beta)) return beta > 0 ? '∞' : '−∞';
  return beta.toFixed(2).replace('-', '−');
}

/** A value with its unit: formatQuantity(4200, 'force', 'us') → '0.944 kip'. */
export function formatQuantity(valueSI: number, kind: QuantityKind, system: UnitSystem, sig = 3): string {
  const unit = displayUnitFor(valueSI, kind, system);
  const text = formatNumber(toDisplay(valueSI, unit), sig);
  return unit.label === '' ? text : `${text} ${unit.label}`;
}
