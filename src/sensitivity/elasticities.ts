/**
 * Sensitivity of β to the mean and standard deviation of each variable, scaled as
 * elasticities: e_μ = ∂β/∂μ · μ/β and e_σ = ∂β/∂σ · σ/β (a 1 % rise in μ moves β by e_μ %).
 *
 * Two routes:
 * - `betaElasticities`: central finite differences of a caller-supplied β(parameters)
 *   (e.g. FORM re-run with one parameter changed); works for any distribution.
 * - `normalFormElasticities`: closed form from one FORM result when the variables are
 *   independent normals: ∂β/∂μ_i = −α_i/σ_i and ∂β/∂σ_i = −β α_i²/σ_i, with α = u* / β
 *   (resistances α < 0). Hohenbichler & Rackwitz 1986 (from memory); follows from
 *   ∂β/∂θ = (∂g/∂θ)/|∇_u g| at the design point with x = μ + σu.
 */
import { throwIfInterrupted } from '../runtime/interruptFlag.js';

export interface MomentSensitivity {
  variable: string;
  dBetaDMean: number;
  dBetaDSd: number;
  /** ∂β/∂μ · μ/β. */
  meanElasticity: number;
  /** ∂β/∂σ · σ/β. */
  sdElasticity: number;
}

export interface Moments {
  mean: number;
  sd: number;
}

/** Parameter changes keyed by variable name; an absent field keeps its present value. */
export type ParamOverrides = Readonly<Record<string, Partial<Moments>>>;

export interface FiniteDifferenceOptions {
  /** Step as a fraction of σ_i, for both the mean and the sd (default 0.01). */
  relStep?: number;
}

export interface ElasticityResult {
  beta: number;
  entries: MomentSensitivity[];
  /** Number of β evaluations spent (1 + 4 per variable). */
  calls: number;
}

function elasticity(variable: string, dMean: number, dSd: number, m: Moments, beta: number): MomentSensitivity {
  return {
    variable,
    dBetaDMean: dMean,
    dBetaDSd: dSd,
    meanElasticity: (dMean * m.mean) / beta,
    sdElasticity: (dSd * m.sd) / beta,
  };
}

/**
 * dβ/dθ from β at θ + h, θ and θ − h: central when both sides exist, one-sided when only one does
 * (β is NaN on a side whose parameters leave the variable's support, e.g. a uniform fixity on
 * [0, 1] shifted past 1), NaN when neither does or β is not finite (no design point).
 */
function difference(up: number, centre: number, down: number, h: number): number {
  if (!Number.isFinite(centre)) return NaN;
  const hasUp = Number.isFinite(up);
  const hasDown = Number.isFinite(down);
  if (hasUp && hasDown) return (up - down) / (2 * h);
  if (hasUp) return (up - centre) / h;
  if (hasDown) return (centre - down) / h;
  return NaN;
}

/** `betaOf` may return NaN for parameters it cannot take (see `difference`). */
export function betaElasticities(
  names: readonly string[],
  moments: readonly Moments[],
  betaOf: (overrides: ParamOverrides) => number,
  opts?: FiniteDifferenceOptions,
): ElasticityResult {
  if (names.length !== moments.length) throw new Error(`${names.length} names but ${moments.length} moments`);
  const relStep = opts?.relStep ?? 0.01;
  if (!(relStep > 0)) throw new Error(`relStep must be positive, got ${relStep}`);
  const beta = betaOf({});
  const entries = names.map((name, i) => {
    throwIfInterrupted('the β elasticities');
    const m = moments[i];
    if (!(m.sd > 0)) throw new Error(`${name}: sd must be positive for a sensitivity, got ${m.sd}`);
    const h = relStep * m.sd;
    const dMean = difference(betaOf({ [name]: { mean: m.mean + h } }), beta, betaOf({ [name]: { mean: m.mean - h } }), h);
    // keep the lower sd positive whatever relStep is
    const hs = Math.min(h, 0.5 * m.sd);
    const dSd = difference(betaOf({ [name]: { sd: m.sd + hs } }), beta, betaOf({ [name]: { sd: m.sd - hs } }), hs);
    return elasticity(name, dMean, dSd, m, beta);
  });
  return { beta, entries, calls: 1 + 4 * names.length };
}

/** Closed form for independent normal variables from a FORM solution (β, α = u* / β). */
export function normalFormElasticities(
  names: readonly string[],
  moments: readonly Moments[],
  beta: number,
  alpha: readonly number[],
): ElasticityResult {
  if (names.length !== moments.length || names.length !== alpha.length) {
    throw new Error('names, moments and alpha must have the same length');
  }
  const entries = names.map((name, i) => {
    const { sd } = moments[i];
    const dMean = -alpha[i] / sd;
    const dSd = (-beta * alpha[i] * alpha[i]) / sd;
    return elasticity(name, dMean, dSd, moments[i], beta);
  });
  return { beta, entries, calls: 0 };
}
