import { EN_IMPERFECTION, type EnCurve } from './en1993.js';
import { STRENGTH_MODELS, type StrengthModel } from './types.js';

/**
 * What a strength model name means: the family of formula, the EN 1993-1-1 curve where one is
 * involved, and whether the scenario's (sampled) bow enters the capacity.
 */
export interface StrengthModelKind {
  readonly family: 'first-yield' | 'aisc360-e3' | 'en1993' | 'equivalent-bow' | 'plastic-zone';
  readonly curve?: EnCurve;
  /** the bow of the scenario changes the capacity */
  readonly usesBow: boolean;
}

export function strengthModelKind(model: string): StrengthModelKind | undefined {
  if (!(STRENGTH_MODELS as readonly string[]).includes(model)) return undefined;
  if (model === 'first-yield') return { family: 'first-yield', usesBow: true };
  if (model === 'aisc360-e3') return { family: 'aisc360-e3', usesBow: false };
  if (model === 'plastic-zone') return { family: 'plastic-zone', usesBow: true };
  const equivalent = model.startsWith('first-yield-en1993-');
  const rest = model.slice(equivalent ? 'first-yield-en1993-'.length : 'en1993-'.length);
  const plusBow = rest.endsWith('-plus-bow');
  const curve = (plusBow ? rest.slice(0, -'-plus-bow'.length) : rest) as EnCurve;
  if (!(curve in EN_IMPERFECTION)) return undefined;
  return equivalent ? { family: 'equivalent-bow', curve, usesBow: plusBow } : { family: 'en1993', curve, usesBow: false };
}

/** True when the sampled bow changes the capacity (first-yield, plastic-zone, and the equivalent bow plus the measured one). */
export function strengthUsesBow(model: StrengthModel): boolean {
  return strengthModelKind(model)?.usesBow ?? false;
}
