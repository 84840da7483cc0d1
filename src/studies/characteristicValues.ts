/**
 * Characteristic values beside the FORM design point, and the partial factors they imply.
 *
 * Characteristic values follow EN 1990:2002 4.1.2 (resistance-side properties: 5 % fractile;
 * variable actions: 95 % fractile, i.e. an upper value; permanent actions: the mean). The side of a
 * variable is read from where FORM put it: its design value in its own standard normal space,
 * z = Φ⁻¹(F(x_d)), which has the sign of α for independent variables. z < 0 is resistance side
 * (a low value hurts), z > 0 is load side; a load whose design value is below its mean helps and
 * gets no partial factor. The bow is not a load: it is an action-effect variable (its size hurts,
 * whatever its sign), with the fractile on the side its design value went.
 * Implied partial factors: γ = x_d / x_k for loads and action effects, γ = x_k / x_d for resistances.
 */
import type { ColumnModel } from '../limitState/columnModel.js';
import { strengthModelKind } from '../mechanics/strengthModelKind.js';
import type { FormResult } from '../reliability/types.js';
import type { Load } from '../scenario/types.js';

export type VariableSide = 'resistance' | 'load' | 'action effect' | 'favourable';

export interface CodeFactor {
  symbol: string;
  value: number;
  source: string;
}

export interface CharacteristicRow {
  variable: string;
  side: VariableSide;
  /** 0.05 or 0.95; null for the mean (permanent loads) and for favourable variables */
  fractile: number | null;
  /** what the characteristic value is, in words */
  basis: string;
  /** null for favourable variables (no partial factor is implied) */
  characteristic: number | null;
  design: number;
  mean: number;
  /** null for favourable variables */
  partialFactor: number | null;
  /** x_d / mean: how far FORM moved the variable; not a partial factor */
  designToMean: number | null;
  /** the code's own factor for comparison, where the strength model names a code */
  code?: CodeFactor;
}

export interface ResistanceFactor {
  /** θ·capacity with every resistance-side and action-effect variable at its characteristic value, the rest at their means */
  characteristic: number;
  /** θ·capacity at the design point */
  design: number;
  partialFactor: number;
  code?: CodeFactor;
}

export interface CharacteristicSummary {
  rows: CharacteristicRow[];
  resistance: ResistanceFactor;
  /** the code the comparison factors come from, if any */
  code: 'EN 1990 / EN 1993-1-1' | 'ASCE 7 / AISC 360' | null;
}

const PERMANENT_NAMES = /^(dead|permanent|self[_-]?weight)$/i;

/** A load's `kind` when the scenario gives one (docs/scenario-format.md), else a permanent-sounding name. */
export function isPermanentLoad(load: Load): { permanent: boolean; by: string } {
  const kind = (load as Load & { readonly kind?: string }).kind;
  if (kind !== undefined) return { permanent: kind === 'permanent', by: `kind: ${kind}` };
  const permanent = PERMANENT_NAMES.test(load.name);
  return { permanent, by: permanent ? `named '${load.name}'` : 'no kind given: taken as variable' };
}

interface CodeFactors {
  name: CharacteristicSummary['code'];
  permanent: CodeFactor;
  variable: CodeFactor;
  resistance: CodeFactor;
}

const EN_FACTORS: CodeFactors = {
  name: 'EN 1990 / EN 1993-1-1',
  permanent: { symbol: 'γ_G', value: 1.35, source: 'EN 1990 Table A1.2(B)' },
  variable: { symbol: 'γ_Q', value: 1.5, source: 'EN 1990 Table A1.2(B)' },
  resistance: { symbol: 'γ_M1', value: 1.0, source: 'EN 1993-1-1 6.1(1) NOTE 2B, recommended value' },
};

const AISC_FACTORS: CodeFactors = {
  name: 'ASCE 7 / AISC 360',
  permanent: { symbol: '1.2 (D)', value: 1.2, source: 'ASCE 7 §2.3, 1.2D + 1.6L' },
  variable: { symbol: '1.6 (L)', value: 1.6, source: 'ASCE 7 §2.3, 1.2D + 1.6L' },
  resistance: { symbol: '1/φc', value: 1 / 0.9, source: 'AISC 360 E1, φc = 0.90' },
};

function codeFactorsFor(model: ColumnModel): CodeFactors | null {
  const family = strengthModelKind(model.scenario.strength)?.family;
  if (family === 'en1993' || family === 'equivalent-bow') return EN_FACTORS;
  if (family === 'aisc360-e3') return AISC_FACTORS;
  return null;
}

export function characteristicValues(model: ColumnModel, f: FormResult): CharacteristicSummary {
  const codes = codeFactorsFor(model);
  const rows: CharacteristicRow[] = [];
  const xk = Float64Array.from(model.mean);
  f.names.forEach((path, i) => {
    const d = model.dists[i];
    const design = f.designPointX[i];
    const mean = d.mean;
    const z = d.toStandardNormal(design);
    const base = { variable: path, design, mean, designToMean: Number.isFinite(design / mean) ? design / mean : null };
    const favourable = (why: string): CharacteristicRow => ({ ...base, side: 'favourable', fractile: null, basis: why, characteristic: null, partialFactor: null });
    // a load's moments, line load and top force: actions of that load, which may act on either side
    const action = /^(loads\.[^.]+)\.(moments\.(?:top|bottom)|transverse|horizontal)$/.exec(path);
    if (action) {
      const load = model.scenario.loads.find((l) => l.path === action[1]);
      if (!(Math.abs(design) > Math.abs(mean)) || !load) {
        rows.push(favourable('design value no larger than the mean in size'));
        return;
      }
      const { permanent, by } = isPermanentLoad(load);
      const p = design >= mean ? 0.95 : 0.05;
      const characteristic = permanent ? mean : d.quantile(p);
      rows.push({
        ...base,
        side: 'load',
        fractile: permanent ? null : p,
        basis: permanent ? `mean, permanent action (${by}; EN 1990 4.1.2)` : `${p === 0.95 ? '95' : '5'} % fractile, variable action (${by}; EN 1990 4.1.2)`,
        characteristic,
        partialFactor: design / characteristic,
        code: codes ? (permanent ? codes.permanent : codes.variable) : undefined,
      });
      return;
    }
    if (path.startsWith('loads.') && !path.includes('.eccentricity.')) {
      const load = model.scenario.loads.find((l) => l.path === path);
      if (!(z > 0) || !load) {
        rows.push(favourable('design value at or below the mean: the load helps here'));
        return;
      }
      const { permanent, by } = isPermanentLoad(load);
      const characteristic = permanent ? mean : d.quantile(0.95);
      rows.push({
        ...base,
        side: 'load',
        fractile: permanent ? null : 0.95,
        basis: permanent ? `mean, permanent load (${by}; EN 1990 4.1.2)` : `95 % fractile, variable load (${by}; EN 1990 4.1.2)`,
        characteristic,
        partialFactor: design / characteristic,
        code: codes ? (permanent ? codes.permanent : codes.variable) : undefined,
      });
      return;
    }
    // geometric imperfections and eccentricities: their size hurts, whichever side
    if (path === 'column.imperfection.bow' || path === 'column.imperfection.out_of_plumb' || path.includes('.eccentricity.')) {
      if (!(Math.abs(design) > Math.abs(mean))) {
        rows.push(favourable(path === 'column.imperfection.bow' ? 'design bow no larger than the mean bow' : 'design value no larger than the mean in size'));
        return;
      }
      const p = design >= mean ? 0.95 : 0.05;
      const characteristic = d.quantile(p);
      xk[i] = characteristic;
      rows.push({ ...base, side: 'action effect', fractile: p, basis: `${p === 0.95 ? '95' : '5'} % fractile, action-effect variable (its size hurts)`, characteristic, partialFactor: design / characteristic });
      return;
    }
    if (!(z < 0)) {
      rows.push(favourable('design value at or above the mean: a high value hurts nothing here'));
      return;
    }
    const characteristic = d.quantile(0.05);
    xk[i] = characteristic;
    rows.push({ ...base, side: 'resistance', fractile: 0.05, basis: '5 % fractile, resistance side (EN 1990 4.1.2)', characteristic, partialFactor: characteristic / design });
  });
  const xd = Float64Array.from(f.designPointX);
  const rk = model.modelFactor(xk) * model.capacity(xk);
  const rd = model.modelFactor(xd) * model.capacity(xd);
  return {
    rows,
    resistance: { characteristic: rk, design: rd, partialFactor: rk / rd, code: codes?.resistance },
    code: codes?.name ?? null,
  };
}
