/**
 * Do the estimates that ran agree, and which one should the engineer trust?
 *
 * Simulation estimates carry a CoV δ, i.e. a log-scale standard deviation s = sqrt(ln(1 + δ²)).
 * Two simulations agree when |ln p1 − ln p2| <= k·sqrt(s1² + s2²) (k = 3 by default).
 * FORM and SORM carry no uncertainty of their own: they agree with the reference simulation
 * (the one with the smallest CoV) when |ln p − ln p_ref| <= max(k·s_ref, ln 1.1), i.e. within
 * the simulation's noise or within 10 %, whichever is wider. Monte Carlo with no failure gives
 * only an upper bound (its Wilson limit): the others agree with it when they lie below it.
 * FORM enters with the pf of its series system of design points (equal to Φ(−β) when there is
 * one); SORM corrects only the nearest design point, so with several FORM's system is preferred.
 *
 * Differences are stated in β (β = −Φ⁻¹(pf)), and a statistically significant difference is
 * raised as a disagreement only when it matters: when the estimates lie on opposite sides of
 * the target β, or differ by at least `materialDeltaBeta` (0.1 by default, about a 25–40 % change
 * of pf in the usual range, enough to move a restraint requirement noticeably). Smaller ones are
 * reported as immaterial.
 */
import type { FormResult, IsResult, McResult, SormResult, SubsetResult } from './types.js';
import { normalQuantileUpper } from '../probability/normal.js';

export type MethodName = 'form' | 'sorm' | 'is' | 'mc' | 'subset';

export interface VerdictInput {
  form?: FormResult;
  sorm?: SormResult;
  is?: IsResult;
  mc?: McResult;
  subset?: SubsetResult;
}

export interface MethodComparison {
  method: MethodName;
  pf: number;
  /** Simulation CoV; null for FORM/SORM. */
  cov: number | null;
  /** Agrees with the reference (null when there is nothing to compare with). */
  consistent: boolean | null;
  /** pf / reference pf − 1 (null without a reference). */
  difference: number | null;
  /** β of this estimate − β of the reference (null without a reference). */
  deltaBeta: number | null;
}

export interface Verdict {
  /** Every estimate lies within the statistical error of the reference. */
  agree: boolean;
  /** A disagreement large enough to matter (see the header); false when they agree. */
  material: boolean;
  trust: MethodName | null;
  reason: string;
  /** The simulation the others were compared with. */
  reference: MethodName | null;
  comparisons: MethodComparison[];
}

export interface VerdictOptions {
  /** Standard deviations allowed (default 3). */
  sigmas?: number;
  /** A simulation with a larger CoV is too noisy to settle anything (default 0.3). */
  maxUsefulCov?: number;
  /** The target β: estimates on opposite sides of it always disagree materially. */
  target?: number;
  /** The least |Δβ| that matters when both lie on the same side of the target (default 0.1). */
  materialDeltaBeta?: number;
}

const RELATIVE_FLOOR = Math.log(1.1);
const LABEL: Record<MethodName, string> = { form: 'FORM', sorm: 'SORM', is: 'IS', mc: 'MC', subset: 'subset simulation' };

interface Sim { method: MethodName; pf: number; cov: number; s: number }

function logSd(cov: number): number {
  return Math.sqrt(Math.log1p(cov * cov));
}

function pct(ratio: number): string {
  const v = Math.abs(ratio) * 100;
  return `${v >= 10 ? v.toFixed(0) : v.toPrecision(2)} %`;
}

function betaOf(pf: number): number {
  return normalQuantileUpper(pf);
}

function b2(beta: number): string {
  return Number.isFinite(beta) ? beta.toFixed(2).replace('-', '−') : beta > 0 ? '∞' : '−∞';
}

/** 'Δβ = 0.12' between two probabilities, from the first to the second. */
function dBeta(pfA: number, pfB: number): string {
  return `Δβ = ${Math.abs(betaOf(pfA) - betaOf(pfB)).toFixed(2)}`;
}

export function verdict(input: VerdictInput, opts: VerdictOptions = {}): Verdict {
  const k = opts.sigmas ?? 3;
  const maxUsefulCov = opts.maxUsefulCov ?? 0.3;
  const materialDb = opts.materialDeltaBeta ?? 0.1;
  /** Whether two estimates differ enough to change a decision. */
  const matters = (pfA: number, pfB: number): boolean => {
    const a = betaOf(pfA);
    const b = betaOf(pfB);
    if (opts.target !== undefined && (a >= opts.target) !== (b >= opts.target)) return true;
    return Math.abs(a - b) >= materialDb;
  };
  const sims: Sim[] = [];
  const { form, sorm, is, mc, subset } = input;
  if (mc && mc.failures > 0) sims.push({ method: 'mc', pf: mc.pf, cov: mc.cov, s: logSd(mc.cov) });
  if (is && is.failures > 0 && Number.isFinite(is.cov)) sims.push({ method: 'is', pf: is.pf, cov: is.cov, s: logSd(is.cov) });
  if (subset && subset.pf > 0 && subset.converged && Number.isFinite(subset.cov)) {
    sims.push({ method: 'subset', pf: subset.pf, cov: subset.cov, s: logSd(subset.cov) });
  }
  const ref = sims.length > 0 ? sims.reduce((a, b) => (b.cov < a.cov ? b : a)) : null;
  const mcBound = mc && mc.failures === 0 ? mc.ci95[1] : null;

  const comparisons: MethodComparison[] = [];
  const compare = (method: MethodName, pf: number, cov: number | null): MethodComparison => {
    let consistent: boolean | null = null;
    let difference: number | null = null;
    let deltaBeta: number | null = null;
    if (ref && ref.method !== method) {
      difference = pf / ref.pf - 1;
      const b = betaOf(pf);
      const bRef = betaOf(ref.pf);
      // both certain (pf = 1 or 0: β = ∓∞ alike) differ by nothing, not by ∞ − ∞
      deltaBeta = b === bRef ? 0 : b - bRef;
      const gap = Math.abs(Math.log(pf / ref.pf));
      const allowed = cov === null ? Math.max(k * ref.s, RELATIVE_FLOOR) : k * Math.hypot(ref.s, logSd(cov));
      consistent = gap <= allowed;
    } else if (ref && ref.method === method) {
      consistent = true;
    }
    if (mcBound !== null && method !== 'mc') consistent = (consistent ?? true) && pf <= mcBound;
    const c: MethodComparison = { method, pf, cov, consistent, difference, deltaBeta };
    comparisons.push(c);
    return c;
  };
  const formPf = form ? form.system.pf : NaN;
  const cForm = form ? compare('form', formPf, null) : null;
  const cSorm = sorm ? compare('sorm', sorm.pf, null) : null;
  for (const s of sims) compare(s.method, s.pf, s.cov);
  if (mc && mc.failures === 0) {
    comparisons.push({ method: 'mc', pf: 0, cov: null, consistent: null, difference: null, deltaBeta: null });
  }
  if (is && !sims.some((s) => s.method === 'is')) comparisons.push({ method: 'is', pf: is.pf, cov: null, consistent: null, difference: null, deltaBeta: null });
  if (subset && !sims.some((s) => s.method === 'subset')) comparisons.push({ method: 'subset', pf: subset.pf, cov: null, consistent: null, difference: null, deltaBeta: null });

  const agree = comparisons.every((c) => c.consistent !== false);
  // material: some disagreeing estimate differs from the reference (or the MC bound) enough to matter
  const material = comparisons.some((c) => c.consistent === false && (ref && c.method !== ref.method ? matters(c.pf, ref.pf) : mcBound !== null ? matters(c.pf, mcBound) : true));
  const base = { agree, material, reference: ref ? ref.method : null, comparisons };
  const formOk = form !== undefined && form.converged;
  const severalPoints = form !== undefined && form.system.designPoints.length > 1;
  const approx: MethodName | null = sorm && sorm.used !== 'form' && !severalPoints ? 'sorm' : formOk ? 'form' : null;

  // No usable simulation.
  if (!ref || ref.cov > maxUsefulCov) {
    const noisy = ref ? `${LABEL[ref.method]} is too noisy (CoV ${pct(ref.cov)}) to settle it` : '';
    if (mcBound !== null && mc) {
      const head = `MC has 0 failures in ${mc.samples} samples: it only bounds pf (≤ ${mcBound.toExponential(2)}, β ≥ ${b2(betaOf(mcBound))})`;
      if (approx) {
        const p = approx === 'sorm' ? sorm!.pf : formPf;
        return { ...base, trust: approx, reason: `${head}; ${LABEL[approx]} (β = ${b2(betaOf(p))}) ${p <= mcBound ? 'lies below it' : 'exceeds it, so one of them is wrong'}.` };
      }
      return { ...base, trust: 'mc', reason: `${head}.` };
    }
    if (form && sorm && approx && !severalPoints) {
      const extra = noisy ? `; ${noisy}` : '';
      const both = `FORM β = ${b2(betaOf(formPf))}, SORM β = ${b2(betaOf(sorm.pf))}`;
      if (Math.abs(Math.log(sorm.pf / formPf)) > RELATIVE_FLOOR && matters(formPf, sorm.pf)) {
        return { ...base, agree: false, material: true, trust: approx, reason: `${both} differ by ${dBeta(formPf, sorm.pf)}: curvature matters, trust SORM (better, confirm with IS)${extra}.` };
      }
      return { ...base, trust: approx, reason: `${both} agree within ${dBeta(formPf, sorm.pf)}: the limit state is nearly flat at the design point${extra}.` };
    }
    if (approx === 'form' && severalPoints) {
      return { ...base, trust: 'form', reason: `FORM found ${form!.system.designPoints.length} design points and combines them as a series system${sorm ? ' (SORM corrects only the nearest)' : ''}; its error is unknown without a simulation${noisy ? ` (${noisy})` : ''}.` };
    }
    if (approx) return { ...base, trust: approx, reason: `Only ${LABEL[approx]} gave a usable estimate; its error is unknown without a simulation${noisy ? ` (${noisy})` : ''}.` };
    if (ref) return { ...base, trust: ref.method, reason: `${LABEL[ref.method]} is the only estimate, and a noisy one (CoV ${pct(ref.cov)}).` };
    return { ...base, trust: null, reason: 'No method produced a usable estimate.' };
  }

  // Simulations among themselves.
  const disagreeingSims = sims.filter((s) => s !== ref && comparisons.find((c) => c.method === s.method)?.consistent === false);
  if (disagreeingSims.length > 0) {
    const other = disagreeingSims[0];
    const mcSim = sims.find((s) => s.method === 'mc');
    const trust = mcSim ?? ref;
    const suspect = trust === ref ? other : ref;
    const why = suspect.method === 'is' ? 'IS may have missed a failure region away from the design point'
      : suspect.method === 'subset' ? 'subset simulation may be stuck in one failure region'
        : 'the simulations sample different regions';
    const differ = `${LABEL[ref.method]} (β = ${b2(betaOf(ref.pf))}) and ${LABEL[other.method]} (β = ${b2(betaOf(other.pf))}) differ by ${dBeta(ref.pf, other.pf)}`;
    if (!material) return { ...base, trust: trust.method, reason: `${differ}, beyond their statistical error but too little to change the verdict; ${LABEL[trust.method]} is used.` };
    return { ...base, trust: trust.method, reason: `${differ}, beyond their uncertainty: ${why}; trust ${LABEL[trust.method]}.` };
  }
  const refText = `${LABEL[ref.method]} (β = ${b2(betaOf(ref.pf))}, CoV ${pct(ref.cov)})`;
  const vs = (c: MethodComparison | null) => (c ? `${LABEL[c.method]} (β = ${b2(betaOf(c.pf))})` : '');
  const by = (c: MethodComparison | null) => `Δβ = ${Math.abs(c?.deltaBeta ?? 0).toFixed(2)}`;
  const disagreeing = [cForm, cSorm].filter((c): c is MethodComparison => c !== null && c.consistent === false);
  if (disagreeing.length > 0 && !material) {
    return {
      ...base,
      trust: ref.method,
      reason: `${disagreeing.map((c) => `${vs(c)} differs from ${refText} by ${by(c)}`).join('; ')}: beyond the statistical error, but too little to change the verdict; ${LABEL[ref.method]} is used.`,
    };
  }
  if (cForm && cForm.consistent === false && cSorm && cSorm.consistent !== false) {
    return { ...base, trust: ref.method, reason: `${vs(cForm)} differs from ${refText} by ${by(cForm)} but SORM (β = ${b2(betaOf(cSorm.pf))}) agrees: curvature matters, trust SORM or ${LABEL[ref.method]}.` };
  }
  if (cForm && cForm.consistent === false && cSorm && cSorm.consistent === false) {
    return { ...base, trust: ref.method, reason: `FORM and SORM differ from ${refText} by ${by(cForm)} and ${by(cSorm)}: the limit state is too nonlinear (or has several design points) for them; trust ${LABEL[ref.method]}.` };
  }
  if (cForm && cForm.consistent === false) {
    return { ...base, trust: ref.method, reason: `${vs(cForm)} differs from ${refText} by ${by(cForm)}: trust ${LABEL[ref.method]}.` };
  }
  if (cSorm && cSorm.consistent === false) {
    return { ...base, trust: ref.method, reason: `${vs(cSorm)} differs from ${refText} by ${by(cSorm)} while FORM does not: the curvature estimate is unreliable; trust ${LABEL[ref.method]}.` };
  }
  if (mcBound !== null && mc && comparisons.some((c) => c.consistent === false)) {
    return { ...base, trust: ref.method, reason: `An estimate exceeds the upper bound ${mcBound.toExponential(2)} from MC with 0 failures in ${mc.samples} samples; trust ${LABEL[ref.method]}.` };
  }
  const compared = comparisons.filter((c) => c.method !== ref.method && c.pf > 0);
  if (compared.length === 0) return { ...base, trust: ref.method, reason: `Only ${refText} gave an estimate: there is nothing to compare it with.` };
  // an estimate at pf = 1 (or 0) has β = ∓∞: within its own uncertainty it can still agree, but Δβ says nothing
  const finite = compared.filter((c) => Number.isFinite(c.deltaBeta ?? 0));
  const extremes = compared.filter((c) => !Number.isFinite(c.deltaBeta ?? 0)).map((c) => `${LABEL[c.method]} gives pf = ${c.pf >= 0.5 ? 1 : 0} within its uncertainty`);
  const spread = finite.length > 0 ? Math.max(...finite.map((c) => Math.abs(c.deltaBeta ?? 0))) : 0;
  const spreadText = extremes.length === 0 ? `largest Δβ = ${spread.toFixed(2)}` : `${finite.length > 0 ? `largest finite Δβ = ${spread.toFixed(2)}; ` : ''}${extremes.join(', ')}`;
  return { ...base, trust: ref.method, reason: `All ${compared.length + 1} estimates agree within their uncertainty (${spreadText}); ${refText} has the smallest uncertainty.` };
}
