/**
 * `stanchion assess`: every requested reliability method on one scenario, their agreement, the
 * sensitivity studies and the restraint justification. Pure orchestration: the numbers come from
 * reliability/, sensitivity/ and studies/; this file only decides what runs with which seed.
 */
import { buildColumnModel, type AxisName, type ColumnModel } from '../limitState/columnModel.js';
import { columnRecipe, problemFromModel } from '../limitState/columnRecipe.js';
import { deterministicCheck, type CheckResult } from '../limitState/deterministicCheck.js';
import { withMoments, withScalar } from '../limitState/scenarioEdits.js';
import { normalStream } from '../probability/rng.js';
import { form } from '../reliability/form.js';
import { checkEstimate, checkForm, withinCheckBand, type FormCheckResult } from '../reliability/formCheck.js';
import { importanceSamplingAtDesignPoint } from '../reliability/importanceSampling.js';
import { monteCarlo } from '../reliability/monteCarlo.js';
import { sorm } from '../reliability/sorm.js';
import { subsetToTargetCov } from '../reliability/subsetSimulation.js';
import type { FormResult, IsResult, McResult, ReliabilityProblem, SimulationProgress, SormResult, SubsetResult } from '../reliability/types.js';
import { verdict, type Verdict } from '../reliability/verdict.js';
import { conditionalBeta, type ConditionalBetaEntry } from '../sensitivity/conditionalBeta.js';
import { betaElasticities, type ElasticityResult, type Moments } from '../sensitivity/elasticities.js';
import { sobolIndices, type SobolResult } from '../sensitivity/sobol.js';
import { tornado, type TornadoEntry } from '../sensitivity/tornado.js';
import { InputError } from '../scenario/inputError.js';
import { fieldDomain } from '../scenario/fieldDomain.js';
import { supportInsideDomain } from '../scenario/readScalar.js';
import type { Method, Scenario } from '../scenario/types.js';
import { measurementEffect, type MeasurementEffect } from './measurementEffect.js';
import type { SurvivalStudy } from './survivalStudy.js';
import { planTests, type TestPlanStudy } from './testPlanning.js';
import { scalarAt } from '../scenario/variables.js';
import type { DistSpec } from '../probability/distribution.js';
import { scenarioForm } from './columnForm.js';
import type { UnitSystem } from '../report/displayUnits.js';
import { columnRestraint, restraintAxis, studiedEnds, type ColumnRestraintResult, type EndChoice, type GoverningAssessor } from './columnRestraint.js';
import { BOW_PATH, BOW_Z_PATH, resolveStrengthModel, type ModelFactorUsed } from '../limitState/strengthChoice.js';
import { betaByStrengthModel, type StrengthModelBeta } from './strengthComparison.js';
import { characteristicValues, type CharacteristicSummary } from './characteristicValues.js';
import { combinationModels, combinationSystemProblem } from '../limitState/combinationSystem.js';
import { loadTimeNotes } from '../loads/loadTimeNotes.js';
import { combinationStudy, type CombinationStudy } from './combinationStudy.js';
import { countEvaluations, evaluationsSoFar } from '../limitState/evaluationCount.js';
import { STUDY_NAMES, type StudyName } from './studyNames.js';
import { measurementUpdate, type MeasurementUpdateResult } from './measurementUpdate.js';
import { axesReliability, axesSentence, type AxesReliability } from './axisReliability.js';
import { axisCautions } from '../limitState/axisCautions.js';

export const DEFAULT_METHODS: readonly Method[] = ['form', 'sorm', 'is', 'mc'];
export const DEFAULT_SEED = 1;
export const DEFAULT_MC_SAMPLES = 1_000_000;
const DEFAULT_IS_SAMPLES = 50_000;
const IS_TARGET_COV = 0.02;
const SOBOL_N = 4096;
const HISTOGRAM_SAMPLES = 5000;
/** Streams of the seed that the auxiliary samplers use, far from the methods' own. */
const HISTOGRAM_STREAM = 9_000_001;

export interface AssessOptions {
  methods?: readonly Method[];
  samples?: number;
  /** stop Monte Carlo, importance sampling and subset simulation once their CoV is at or below this */
  targetCov?: number;
  /** FORM's full restart scan (form.ts `thorough`) */
  thorough?: boolean;
  seed?: number;
  workers?: number;
  end?: EndChoice;
  /** the principal axis of the restraint study (default: the one with the lower β alone) */
  axis?: AxisName;
  signal?: AbortSignal;
  onProgress?: (method: string, p: SimulationProgress) => void;
  /** display units of the restraint sentence (default: the scenario's) */
  units?: UnitSystem;
  /** a restraint study already computed for this scenario and `end` (not computed again) */
  restraint?: ColumnRestraintResult;
  /** base samples N of the Sobol estimators (default SOBOL_N) */
  sobolSamples?: number;
  /** skip sensitivity and restraint studies (sweeps, quick looks) */
  reliabilityOnly?: boolean;
  /** the studies to run beside the methods (default all of STUDY_NAMES; reliabilityOnly: none) */
  studies?: readonly StudyName[];
}

/** The sensitivity studies that ran (each can be switched off: studyNames.ts). */
export interface SensitivityStudy {
  utilization?: { baseline: number; rows: TornadoEntry[] };
  capacity?: { baseline: number; rows: TornadoEntry[] };
  conditionalBeta?: { baseline: number; rows: ConditionalBetaEntry[] };
  elasticities?: ElasticityResult;
  sobolCapacity?: SobolResult;
  sobolG?: SobolResult;
  notes: string[];
}

export interface SamplesSummary {
  resistance: number[];
  demand: number[];
  designPoint: { resistance: number; demand: number };
}

export interface Assessment {
  scenario: Scenario;
  model: ColumnModel;
  check: CheckResult;
  methods: Method[];
  seed: number;
  workers: number;
  form: FormResult;
  sorm?: SormResult;
  is?: IsResult;
  mc?: McResult;
  subset?: SubsetResult;
  verdict: Verdict;
  /** The estimate put against the target; `basis` says why when it is not the method's own result. With survived loads: the conditional one (docs/evidence.md §8). */
  governing: { method: Method; beta: number; pf: number; basis?: string };
  /** with survived loads: the estimate without them (what `governing` would be otherwise) */
  governingUnconditional?: { method: Method; beta: number; pf: number; basis?: string };
  /** FORM's self-check, run whenever FORM or SORM would decide the verdict alone. */
  formCheck?: FormCheckResult;
  /** Two or more time-varying loads: each combination and their series system (`form`, `sorm` and `model` are then the lowest-β combination's; IS, MC and subset are of the system). */
  combinations?: CombinationStudy;
  sensitivity?: SensitivityStudy;
  restraint?: ColumnRestraintResult;
  /** two principal axes: FORM about each alone (absent: one axis) */
  axes?: AxesReliability;
  samples: SamplesSummary;
  warnings: string[];
  interrupted: boolean;
  /** the model factor in use and where it comes from */
  modelFactor: ModelFactorUsed;
  /** FORM β under each strength model (absent with reliabilityOnly) */
  byStrengthModel?: StrengthModelBeta[];
  /** characteristic values and implied partial factors at the FORM design point */
  characteristic: CharacteristicSummary;
  /** the studies that ran, in STUDY_NAMES order */
  studies: StudyName[];
  /** every limit-state evaluation of the run, by method and study (`meta.calls`) */
  calls: Record<string, number>;
  /** the scenario's measurements (scenario-level `evidence:`): posterior, diagnostics, β before and after; `scenario` is then the updated one */
  measurementUpdate?: MeasurementUpdateResult;
  /** the steps of the evidence: β as written, with the tests, the measurements, given the survived loads (present when the scenario has any) */
  measurements?: MeasurementEffect;
  /** the scenario's test plans ranked (present when it lists any) */
  testPlans?: TestPlanStudy;
}

function momentsOf(model: ColumnModel): Moments[] {
  return model.names.map((_, i) => {
    const d = model.dists[i];
    // a truncated normal is parametrised by its parent normal: perturb those
    if (d.name === 'truncnormal') return { mean: d.params.mu, sd: d.params.sigma };
    return { mean: d.mean, sd: d.sd };
  });
}

/** The distribution spec of a random variable, read back from the scenario by its path. */
function specOf(s: Scenario, path: string): DistSpec {
  const sc = scalarAt(s, path);
  if (!sc || sc.kind !== 'random') throw new Error(`${path} is not a random variable`);
  return sc.spec;
}

/**
 * β of an edited scenario for a sensitivity study: NaN when that FORM did not converge to a
 * finite β (its last iterate is no reliability index; the tables show '—' and the elasticities fall
 * back to the other side of their difference). An infinite β (no design point) is kept.
 */
function studyBeta(s: Scenario): number {
  const r = scenarioForm(s);
  return r.converged || !Number.isFinite(r.beta) ? r.beta : NaN;
}

function sensitivityStudy(s: Scenario, model: ColumnModel, baseline: number, seed: number, run: ReadonlySet<StudyName>, calls: Record<string, number>, sobolN: number): SensitivityStudy {
  const { names, dists } = model;
  const out: SensitivityStudy = { notes: [] };
  const counted = <T>(study: StudyName, fn: () => T): T => {
    const { result, calls: n } = countEvaluations(fn);
    calls[study] = (calls[study] ?? 0) + n;
    return result;
  };
  if (run.has('tornado')) {
    counted('tornado', () => {
      out.utilization = { baseline: model.utilization(model.mean), rows: tornado(names, dists, model.utilization) };
      out.capacity = { baseline: model.capacity(model.mean), rows: tornado(names, dists, model.capacity) };
    });
  }
  if (run.has('conditional-beta')) {
    out.conditionalBeta = counted('conditional-beta', () => ({
      baseline,
      rows: conditionalBeta(names, dists, (i, value) => studyBeta(withScalar(s, names[i], { kind: 'fixed', value }))),
    }));
  }
  if (run.has('elasticities')) {
    const moments = momentsOf(model);
    out.elasticities = counted('elasticities', () =>
      betaElasticities(names, moments, (overrides) => {
        let t = s;
        for (const [path, o] of Object.entries(overrides)) {
          const i = names.indexOf(path);
          const spec = withMoments(specOf(s, path), o.mean ?? moments[i].mean, o.sd ?? moments[i].sd);
          // e.g. a uniform fixity on [0, 1] shifted past 1: that side of the difference does not exist
          if (!supportInsideDomain(spec, fieldDomain(path))) return NaN;
          t = withScalar(t, path, { kind: 'random', spec });
        }
        return studyBeta(t);
      }),
    );
  }
  if (run.has('sobol')) {
    if (model.correlation) {
      out.notes.push('Sobol indices treat the variables as independent (the stated correlation is left out of that study only).');
    }
    out.sobolCapacity = counted('sobol', () => sobolIndices(names, dists, model.capacity, { seed, n: sobolN }));
    out.sobolG = counted('sobol', () => sobolIndices(names, dists, model.g, { seed: seed + 1, n: sobolN }));
  }
  return out;
}

function samplesSummary(problem: ReliabilityProblem, model: ColumnModel, seed: number, f: FormResult): SamplesSummary {
  const n = model.names.length;
  const u = new Float64Array(n);
  const x = new Float64Array(n);
  const draw = normalStream(seed, HISTOGRAM_STREAM);
  const resistance: number[] = [];
  const demand: number[] = [];
  for (let k = 0; k < HISTOGRAM_SAMPLES; k++) {
    for (let i = 0; i < n; i++) u[i] = draw();
    problem.transform.toPhysical(u, x);
    resistance.push(model.modelFactor(x) * model.capacity(x));
    demand.push(model.demand(x));
  }
  const xs = Float64Array.from(f.designPointX);
  return {
    resistance,
    demand,
    designPoint: { resistance: model.modelFactor(xs) * model.capacity(xs), demand: model.demand(xs) },
  };
}

/** The estimate put against the target: the one the verdict trusts, else the best available. */
function governingEstimate(a: Pick<Assessment, 'form' | 'sorm' | 'is' | 'mc' | 'subset' | 'methods'>, v: Verdict) {
  const pick = (m: Method) => {
    // FORM stands for its series system of design points (its own β when there is one).
    const r = m === 'form' ? a.form.system : a[m];
    return r ? { method: m, beta: r.beta, pf: r.pf } : undefined;
  };
  if (v.trust) {
    const g = pick(v.trust);
    if (g && (v.trust !== 'form' || a.methods.includes('form'))) return g;
  }
  for (const m of ['is', 'subset', 'mc', 'sorm', 'form'] as const) {
    const g = pick(m);
    if (g && a.methods.includes(m)) return g;
  }
  return { method: 'form' as Method, beta: a.form.system.beta, pf: a.form.system.pf };
}

/**
 * When FORM or SORM would decide alone, check it by sampling; if the check disagrees the
 * verdict rests on the check's estimate instead, and says so in one plain line.
 */
export function checkedGoverning(
  problem: ReliabilityProblem,
  f: FormResult,
  v: Verdict,
  governing: Assessment['governing'],
  seed: number,
): { governing: Assessment['governing']; verdict: Verdict; check?: FormCheckResult; warning?: string } {
  if (governing.method !== 'form' && governing.method !== 'sorm') return { governing, verdict: v };
  const check = checkForm(problem, f, { seed });
  const label = governing.method === 'form' ? 'FORM' : 'SORM';
  if (withinCheckBand(check, governing.beta)) {
    return { governing, verdict: { ...v, reason: `${v.reason} ${check.reason}` }, check };
  }
  const estimate = checkEstimate(check);
  const bound = check.upperBound !== null;
  const line = `${label} (β = ${governing.beta.toFixed(2)}) disagrees with its self-check (${check.method}, ${check.samples} samples: ` +
    `${bound ? `no failure, pf below about ${estimate.pf.toPrecision(2)}, β above ${estimate.beta.toFixed(2)}` : `β = ${estimate.beta.toFixed(2)}`}); the verdict rests on the check, not on ${label}.`;
  const method: Method = check.method === 'Monte Carlo' ? 'mc' : 'is';
  return {
    governing: { method, ...estimate, basis: `${label}'s self-check by ${check.method}${bound ? ', upper bound' : ''}` },
    verdict: { ...v, agree: false, material: true, trust: method, reason: `${v.reason} ${line}` },
    check,
    warning: line,
  };
}

/** The methods a restraint requirement is confirmed with (Monte Carlo left out: too slow at β near the target). */
export const CONFIRM_METHODS: readonly Method[] = ['form', 'sorm', 'is'];

/** Assess a scenario as `stanchion assess --methods form,sorm,is` would and return its governing β. */
export function governingAssessor(seed: number): GoverningAssessor {
  return async (t: Scenario) => {
    const a = await assessColumn(t, { methods: CONFIRM_METHODS, seed, reliabilityOnly: true });
    return { method: a.governing.method, beta: a.governing.beta };
  };
}

export async function assessColumn(original: Scenario, opts: AssessOptions = {}): Promise<Assessment> {
  // measurements on the structure update the variables first; everything below assesses the updated scenario
  const update = original.measurements?.length ? measurementUpdate(original, opts.seed ?? original.analysis.seed ?? DEFAULT_SEED) : null;
  const a = await assessUpdated(update ? update.scenario : original, opts, original, update);
  return update ? { ...a, calls: { ...a.calls, 'measurement-update': update.result.formCalls }, measurementUpdate: update.result } : a;
}

/**
 * With survived loads the verdict rests on P(failure | survived) (docs/evidence.md §8): FORM on
 * the two margins, checked by its importance-sampling ratio (by the Monte Carlo ratio when
 * importance sampling saw no failure); when they disagree, on the sampled ratio (or the Monte
 * Carlo one-sided bound). The unconditional estimate is kept beside it.
 */
function survivalGoverning(
  sv: SurvivalStudy,
  plain: Assessment['governing'],
  v: Verdict,
  target: number,
): { governing: Assessment['governing']; verdict: Verdict; unconditional: Assessment['governing']; warning?: string } {
  const check = sv.check;
  const restOnSampling = check !== undefined && !check.agrees;
  const checkName = check?.method === 'is' ? 'importance sampling' : 'Monte Carlo';
  const governing: Assessment['governing'] = restOnSampling
    ? { method: check.method, beta: check.estimate.beta, pf: check.estimate.pf, basis: `${check.method === 'is' ? 'Importance sampling' : 'Monte Carlo'} given the survived loads${check.estimate.upperBound ? ', upper bound' : ''}` }
    : { method: 'form', beta: sv.beta, pf: sv.pf, basis: check ? `FORM given the survived loads, checked by ${checkName}` : 'FORM given the survived loads' };
  const line =
    `Given the survived loads β = ${governing.beta.toFixed(2)} (${governing.basis}); without them β = ${plain.beta.toFixed(2)} (${plain.basis ?? plain.method.toUpperCase()}). ` +
    `The verdict rests on the conditional β, ${governing.beta >= target ? 'which meets' : 'which falls short of'} the target${check ? `; ${check.reason}` : ''}.`;
  return {
    governing,
    verdict: { ...v, trust: governing.method, reason: `${v.reason} ${line}` },
    unconditional: plain,
    ...(restOnSampling ? { warning: `FORM given the survived loads disagrees with its ${checkName} check: ${check.reason}; the verdict rests on the ${checkName} estimate.` } : {}),
  };
}

async function assessUpdated(given: Scenario, opts: AssessOptions, original: Scenario, update: ReturnType<typeof measurementUpdate>): Promise<Assessment> {
  // the scenario as its strength model sees it; `given` is kept for the comparison of models
  const resolved = resolveStrengthModel(given);
  const s = resolved.scenario;
  const model = buildColumnModel(s);
  if (model.names.length === 0) {
    throw new InputError('scenario', 'no value is random: give at least one {dist: ...} so that there is a probability to compute');
  }
  const check = deterministicCheck(model);
  const warnings: string[] = loadTimeNotes(s);
  if (!(check.capacity > 0)) {
    throw new InputError('column', 'at the mean values the column has no capacity (a mechanism): nothing to assess');
  }
  const methods = [...(opts.methods ?? s.analysis.methods ?? DEFAULT_METHODS)];
  const asked = new Set<StudyName>(opts.reliabilityOnly ? [] : opts.studies ?? STUDY_NAMES);
  const calls: Record<string, number> = {};
  const startCount = evaluationsSoFar();
  const seed = opts.seed ?? s.analysis.seed ?? DEFAULT_SEED;
  /** undefined: every core once the Monte Carlo run is long enough to repay starting them. */
  const workers = opts.workers ?? s.analysis.workers;
  let problem = problemFromModel(model);
  let recipe = columnRecipe(s);
  if (resolved.bowDropped) {
    const zDropped = given.column.axisZ?.bow.kind === 'random' && s.column.axisZ?.bow.kind === 'fixed';
    const bowY = given.column.bow.kind === 'random' ? BOW_PATH : null;
    const paths = [bowY, zDropped ? BOW_Z_PATH : null].filter((p) => p !== null).join(' and ');
    warnings.push(`${paths}: strength model ${s.strength} does not use the bow, so it was taken out of the random variables (fixed at its mean; no effect on β)`);
  }
  let interrupted = false;

  const models = combinationModels(s);
  const combosCounted = countEvaluations(() => (models.length > 1 ? combinationStudy(models, { sorm: methods.includes('sorm'), seed }) : undefined));
  const combos = combosCounted.result;
  if (combos) calls.combinations = combosCounted.calls;
  const lead = combos?.combinations[combos.governing];
  // The sampling methods see the series system; FORM/SORM results shown are the lowest-β combination's.
  const simProblem = combos ? combinationSystemProblem(models) : problem;
  if (combos) recipe = columnRecipe(s, true);
  const formResult = lead ? lead.form : form(problem, { thorough: opts.thorough });
  if (!lead) calls.form = formResult.calls;
  if (!methods.includes('form')) {
    const needs = [...asked].filter((n) => n !== 'tornado' && n !== 'sobol');
    const why = [
      'the design point (characteristic values, connection moments)',
      ...(methods.includes('is') ? ['the centre of importance sampling'] : []),
      ...(needs.length ? [`the studies ${needs.join(', ')} (--no-studies to skip them)`] : []),
    ];
    warnings.push(`FORM was run (${formResult.calls} calls) although not among the methods asked for: it gives ${why.join(', ')}`);
  }
  if (lead) problem = lead.problem;
  for (const c of combos?.combinations ?? [{ leading: '', form: formResult }]) {
    const tag = combos ? `FORM (${c.leading} leading)` : 'FORM';
    warnings.push(...c.form.warnings.map((w) => `${tag}: ${w}`));
    if (!c.form.converged) warnings.push(`${tag} did not converge: ${c.form.reason ?? 'see its iteration history'}`);
  }

  const out: Partial<Assessment> = {};
  if (methods.includes('sorm')) {
    out.sorm = lead ? lead.sorm! : sorm(problem, formResult);
    if (!lead) calls.sorm = out.sorm.calls;
    warnings.push(...out.sorm.warnings.map((w) => `SORM: ${w}`));
  }
  // the sampling methods' own evaluations in this thread (a run split over workers does part here)
  const simulationStart = evaluationsSoFar();
  if (methods.includes('is')) {
    out.is = await importanceSamplingAtDesignPoint(simProblem, formResult, {
      samples: s.analysis.isSamples ?? DEFAULT_IS_SAMPLES,
      seed,
      targetCov: opts.targetCov ?? IS_TARGET_COV,
      signal: opts.signal,
      onProgress: opts.onProgress && ((p) => opts.onProgress?.('importance sampling', p)),
    });
    warnings.push(...out.is.warnings.map((w) => `IS: ${w}`));
    if (out.is.stopReason === 'aborted') interrupted = true;
    calls.is = out.is.calls;
  }
  if (methods.includes('mc') && !interrupted) {
    out.mc = await monteCarlo(simProblem, {
      samples: opts.samples ?? s.analysis.mcSamples ?? DEFAULT_MC_SAMPLES,
      seed,
      workers: workers === undefined ? undefined : Math.max(1, workers),
      targetCov: opts.targetCov,
      recipe: workers === 1 ? undefined : recipe,
      signal: opts.signal,
      onProgress: opts.onProgress && ((p) => opts.onProgress?.('Monte Carlo', p)),
    });
    if (out.mc.stopReason === 'aborted') interrupted = true;
    calls.mc = out.mc.calls;
    if (out.mc.failures === 0) warnings.push(`Monte Carlo saw no failure in ${out.mc.samples} samples: its pf is only an upper bound`);
  }
  if (methods.includes('subset') && !interrupted) {
    out.subset = subsetToTargetCov(simProblem, { seed, samplesPerLevel: s.analysis.subsetSamples ?? 1000, targetCov: opts.targetCov });
    warnings.push(...out.subset.warnings.map((w) => `subset: ${w}`));
    calls.subset = out.subset.calls;
  }
  const simulatedHere = evaluationsSoFar() - simulationStart;
  // With combinations every method is compared on the series system.
  const sysForm: FormResult = combos
    ? {
        ...formResult,
        beta: combos.formSystem.beta,
        pf: combos.formSystem.pf,
        system: {
          ...combos.formSystem,
          designPoints: combos.combinations.map((c) => ({ beta: c.form.beta, designPointU: c.form.designPointU, designPointX: c.form.designPointX, alpha: c.form.alpha })),
        },
      }
    : formResult;
  const sysSorm = combos && out.sorm && combos.sormSystem ? { ...out.sorm, beta: combos.sormSystem.beta, pf: combos.sormSystem.pf } : out.sorm;
  const v = verdict({
    form: methods.includes('form') ? sysForm : undefined,
    sorm: sysSorm,
    is: out.is,
    mc: out.mc,
    subset: out.subset,
  }, { target: s.targetBeta });
  const plainGoverning = governingEstimate({ form: sysForm, ...out, sorm: sysSorm, methods }, v);
  const checked: ReturnType<typeof checkedGoverning> = asked.has('form-check')
    ? checkedGoverning(simProblem, sysForm, v, plainGoverning, seed)
    : { governing: plainGoverning, verdict: v };
  if (checked.check) calls['form-check'] = checked.check.calls;
  if (!asked.has('form-check') && (plainGoverning.method === 'form' || plainGoverning.method === 'sorm')) {
    warnings.push(`FORM's self-check was switched off: the verdict rests on ${plainGoverning.method.toUpperCase()} alone, unchecked by sampling`);
  }
  if (checked.warning) warnings.unshift(checked.warning);

  let sensitivity: SensitivityStudy | undefined;
  let restraint: ColumnRestraintResult | undefined;
  if (!opts.reliabilityOnly && !interrupted) {
    const baseline = combos ? combos.combinations.find((c) => c.leading === model.combination.leading)!.form.beta : formResult.beta;
    if (['tornado', 'conditional-beta', 'elasticities', 'sobol'].some((n) => asked.has(n as StudyName))) {
      sensitivity = sensitivityStudy(s, model, baseline, seed, asked, calls, opts.sobolSamples ?? SOBOL_N);
      if (combos) sensitivity.notes.push(`The sensitivity and restraint studies use the combination with ${model.combination.leading} leading (the largest mean demand), not the series system.`);
    }
    if (asked.has('restraint')) {
      const before = evaluationsSoFar();
      // two axes: the study varies the ends about the governing axis (or the one asked for)
      const axisChoice = opts.restraint ? undefined : restraintAxis(s, opts.axis);
      if (opts.restraint || studiedEnds(s, opts.end, axisChoice!.axis).length > 0) {
        restraint = opts.restraint ?? (await columnRestraint(s, { end: opts.end, axis: opts.axis, axisChoice, units: opts.units, governing: governingAssessor(seed) }));
        calls.restraint = evaluationsSoFar() - before;
      }
    }
  }
  let byStrengthModel: StrengthModelBeta[] | undefined;
  if (asked.has('strength-models') && !interrupted) {
    const r = countEvaluations(() => betaByStrengthModel(given, formResult));
    byStrengthModel = r.result;
    calls['strength-models'] = r.calls;
  }
  const samplesCounted = countEvaluations(() => samplesSummary(problem, lead ? lead.model : model, seed, formResult));
  const characteristicCounted = countEvaluations(() => characteristicValues(lead ? lead.model : model, formResult));
  calls.histogram = samplesCounted.calls;
  calls['characteristic-values'] = characteristicCounted.calls;
  // what no entry above names (the mean check, model building): counted in this thread, so the sum is every call made here
  const inThread = evaluationsSoFar() - startCount;
  const named = Object.entries(calls).reduce((a, [k, n]) => a + (k === 'is' || k === 'mc' || k === 'subset' ? 0 : n), 0);
  const other = inThread - named - simulatedHere;
  if (other > 0) calls.other = other;
  let measurements: MeasurementEffect | undefined;
  let governing = checked.governing;
  let finalVerdict = checked.verdict;
  let unconditional: Assessment['governing'] | undefined;
  if (!interrupted && !opts.reliabilityOnly && (s.evidence || s.survivedLoads || update)) {
    const r = countEvaluations(() => measurementEffect(original, seed, update, { targetCov: opts.targetCov }));
    measurements = r.result;
    calls.measurements = r.calls;
    if (measurements.survival) {
      const c = survivalGoverning(measurements.survival, governing, finalVerdict, s.targetBeta);
      governing = c.governing;
      finalVerdict = c.verdict;
      unconditional = c.unconditional;
      if (c.warning) warnings.unshift(c.warning);
    }
  }
  let testPlans: TestPlanStudy | undefined;
  if (!interrupted && !opts.reliabilityOnly && s.testPlans) {
    const r = countEvaluations(() => planTests(given, { seed, updatedByMeasurements: update?.result.summary.variables.map((v) => v.path) ?? [] }));
    testPlans = r.result;
    calls['test-plans'] = r.calls;
  }
  const studies = STUDY_NAMES.filter((n) => asked.has(n));
  // two principal axes: each axis' own β, which governs, and what the check leaves out
  const axesCounted = countEvaluations(() => (check.axes !== null ? axesReliability(lead ? lead.model : model, check.axes.governing) : null));
  const axes = axesCounted.result;
  if (axes !== null) {
    calls.axes = axesCounted.calls;
    warnings.unshift(axesSentence(axes));
  }
  warnings.push(...axisCautions(s));
  return {
    ...(axes !== null ? { axes } : {}),
    ...(measurements ? { measurements } : {}),
    ...(testPlans ? { testPlans } : {}),
    scenario: s,
    model: lead ? lead.model : model,
    modelFactor: model.modelFactorUsed,
    byStrengthModel,
    characteristic: characteristicCounted.result,
    check,
    methods,
    seed,
    workers: out.mc?.workers ?? 1,
    form: formResult,
    ...out,
    verdict: finalVerdict,
    governing,
    ...(unconditional ? { governingUnconditional: unconditional } : {}),
    formCheck: checked.check,
    ...(combos ? { combinations: combos } : {}),
    sensitivity,
    restraint,
    samples: samplesCounted.result,
    warnings,
    interrupted,
    studies,
    calls,
  };
}
