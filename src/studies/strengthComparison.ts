/**
 * β of the same column under each strength model, each with its own default model uncertainty
 * (or the scenario's model_factor when it gives one), at FORM level: how much the verdict rests on
 * the choice of strength model.
 */
import { strengthModelKind, strengthUsesBow } from '../mechanics/strengthModelKind.js';
import { resolveStrengthModel, type ModelFactorUsed } from '../limitState/strengthChoice.js';
import type { FormResult } from '../reliability/types.js';
import type { Scenario, StrengthModel } from '../scenario/types.js';
import { scenarioForm } from './columnForm.js';

const nonZero = (v: Scenario['modelFactor'] | undefined) => v !== undefined && !(v.kind === 'fixed' && v.value === 0);

/** Some load has an end eccentricity, applied moment, line load or top force that is not a fixed zero, or the column an out-of-plumb. */
function hasEccentricity(s: Scenario): boolean {
  return (
    nonZero(s.column.outOfPlumb) ||
    s.loads.some(
      (l) =>
        (l.eccentricity !== undefined && (nonZero(l.eccentricity.top) || nonZero(l.eccentricity.bottom))) ||
        (l.moments !== undefined && (nonZero(l.moments.top) || nonZero(l.moments.bottom))) ||
        nonZero(l.transverse) ||
        nonZero(l.horizontal),
    )
  );
}

/** Some load has a line load or a top force that is not a fixed zero, or the column an out-of-plumb (what plastic-zone does not take). */
function hasSideActions(s: Scenario): boolean {
  return nonZero(s.column.outOfPlumb) || s.loads.some((l) => nonZero(l.transverse) || nonZero(l.horizontal));
}

/** The models every assessment compares (the equivalent-bow forms repeat their curve's β; they are added only when chosen). */
export const COMPARED_STRENGTH_MODELS: readonly StrengthModel[] = ['first-yield', 'aisc360-e3', 'en1993-a0', 'en1993-a', 'en1993-b', 'en1993-c', 'en1993-d'];

export interface StrengthModelBeta {
  strength: StrengthModel;
  /** FORM β; null when the model cannot be evaluated (see note) */
  beta: number | null;
  pf: number | null;
  converged: boolean;
  modelFactor: ModelFactorUsed;
  /** the scenario's own strength model */
  chosen: boolean;
  note?: string;
}

/**
 * `given` is the scenario as read (before resolveStrengthModel), so that each model receives its
 * own default model factor and the bow where it uses one. `chosenForm` is the assessment's own FORM
 * result, reused for the chosen model so that the table and the verdict show the same β.
 */
export function betaByStrengthModel(given: Scenario, chosenForm: FormResult): StrengthModelBeta[] {
  // plastic-zone joins the comparison when the scenario gives the section by its dimensions
  const compared = given.column.section.geometry ? [...COMPARED_STRENGTH_MODELS, 'plastic-zone' as const] : COMPARED_STRENGTH_MODELS;
  const models = compared.includes(given.strength) ? compared : [...compared, given.strength];
  const noBow = given.column.bow.kind === 'fixed' && given.column.bow.value === 0;
  const eccentric = hasEccentricity(given);
  const h = given.column.section.geometry?.corrosion?.zoneHeight;
  const zoned = h !== undefined && h < given.column.length;
  return models.map((strength) => {
    const resolved = resolveStrengthModel(given, strength);
    const chosen = strength === given.strength;
    if (strengthUsesBow(strength) && noBow) {
      return { strength, beta: null, pf: null, converged: false, modelFactor: resolved.modelFactor, chosen, note: 'needs a bow; the scenario gives none' };
    }
    if (strength === 'plastic-zone' && hasSideActions(given)) {
      return { strength, beta: null, pf: null, converged: false, modelFactor: resolved.modelFactor, chosen, note: 'takes no line load, top force or out-of-plumb' };
    }
    if (strength === 'plastic-zone' && !chosen) {
      // its table takes a minute or more per section and axis to build: only when asked for
      return { strength, beta: null, pf: null, converged: false, modelFactor: resolved.modelFactor, chosen, note: 'not run here: choose strength: plastic-zone for it (its table is built once per section and axis)' };
    }
    const r = chosen ? chosenForm : scenarioForm(resolved.scenario);
    const zoneNote = zoned && eccentric ? zoneTreatment(strength) : undefined;
    return { strength, beta: r.beta, pf: r.pf, converged: r.converged, modelFactor: resolved.modelFactor, chosen, ...(zoneNote ? { note: zoneNote } : {}) };
  });
}

/**
 * A corroded zone about the axis the actions bend: first-yield solves the stepped member, the code
 * checks take the loss over the whole length (docs/sections.md); their β differ for that reason too.
 */
function zoneTreatment(strength: StrengthModel): string | undefined {
  const family = strengthModelKind(strength)?.family;
  if (family === 'first-yield' || family === 'equivalent-bow') return 'corroded zone: the stepped member solved to second order';
  if (family === 'en1993' || family === 'aisc360-e3' || family === 'plastic-zone') return 'corroded zone: the loss taken over the whole length about the bent axis (conservative)';
  return undefined;
}
