/**
 * `stanchion assess`: every requested reliability method on one scenario, their agreement, the
 * sensitivity studies and the restraint justification. Pure orchestration: the numbers come from
 * reliability/, sensitivity/ and studies/; this file only decides what runs with which seed.
 */
import { buildColumnModel, type ColumnModel } from '../limitState/columnModel.js';
import { columnRecipe, problemFromModel } from '../limitState/columnRecipe.js';
import { deterministicCheck, type CheckResult } from '../limitState/deterministicCheck.js';
import { withMoments, withScalar } from '../limitState/scenarioEdits.js';
import { normalStream } from '../probability/rng.js';
import { form } from '../reliability/form.js';
import { importanceSamplingAtDesignPoint } from '../reliability/importanceSampling.js';
import { monteCarlo } from '../reliability/monteCarlo.js';
import { sorm } from '../reliability/sorm.js';
import { subsetSimulation } from '../reliability/subsetSimulation.js';
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
import { scalarAt } from '../scenario/variables.js';
import type { DistSpec } from '../probability/distribution.js';
import { scenarioForm } from './columnForm.js';
import type { UnitSystem } from '../report/displayUnits.js';
import { columnRestraint, studiedEnds, type ColumnRestraintResult, type EndChoice } from './columnRestraint.js';

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
  /** stop Monte Carlo once its coefficient of variation is at or below this */
  targetCov?: number;
  seed?: number;
  workers?: number;
  end?: EndChoice;
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
}

export interface SensitivityStudy {
  utilization: { baseline: number; rows: TornadoEntry[] };
  capacity: { baseline: number; rows: TornadoEntry[] };
  conditionalBeta: { baseline: number; rows: ConditionalBetaEntry[] };
  elasticities: ElasticityResult;
  sobolCapacity: SobolResult;
  sobolG: SobolResult;
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
  governing: { method: Method; beta: number; pf: number };
  sensitivity?: SensitivityStudy;
  restraint?: ColumnRestraintResult;
  samples: SamplesSummary;
  warnings: string[];
  interrupted: boolean;
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

function sensitivityStudy(s: Scenario, model: ColumnModel, baseline: number, seed: number, sobolN: number): SensitivityStudy {
  const { names, dists } = model;
  const notes: string[] = [];
  const utilization = { baseline: model.utilization(model.mean), rows: tornado(names, dists, model.utilization) };
  const capacity = { baseline: model.capacity(model.mean), rows: tornado(names, dists, model.capacity) };
  const conditional = {
    baseline,
    rows: conditionalBeta(names, dists, (i, value) => studyBeta(withScalar(s, names[i], { kind: 'fixed', value }))),
  };
  const moments = momentsOf(model);
  const elasticities = betaElasticities(names, moments, (overrides) => {
    let t = s;
    for (const [path, o] of Object.entries(overrides)) {
      const i = names.indexOf(path);
      const spec = withMoments(specOf(s, path), o.mean ?? moments[i].mean, o.sd ?? moments[i].sd);
      // e.g. a uniform fixity on [0, 1] shifted past 1: that side of the difference does not exist
      if (!supportInsideDomain(spec, fieldDomain(path))) return NaN;
      t = withScalar(t, path, { kind: 'random', spec });
    }
    return studyBeta(t);
  });
  if (model.correlation) {
    notes.push('Sobol indices treat the variables as independent (the stated correlation is left out of that study only).');
  }
  const sobolCapacity = sobolIndices(names, dists, model.capacity, { seed, n: sobolN });
  const sobolG = sobolIndices(names, dists, model.g, { seed: seed + 1, n: sobolN });
  return { utilization, capacity, conditionalBeta: conditional, elasticities, sobolCapacity, sobolG, notes };
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
    const r = a[m];
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
  return { method: 'form' as Method, beta: a.form.beta, pf: a.form.pf };
}

export async function assessColumn(s: Scenario, opts: AssessOptions = {}): Promise<Assessment> {
  const model = buildColumnModel(s);
  if (model.names.length === 0) {
    throw new InputError('scenario', 'no value is random: give at least one {dist: ...} so that there is a probability to compute');
  }
  const check = deterministicCheck(model);
  if (!(check.capacity > 0)) {
    throw new InputError('column', 'at the mean values the column has no capacity (a mechanism): nothing to assess');
  }
  const methods = [...(opts.methods ?? s.analysis.methods ?? DEFAULT_METHODS)];
  const seed = opts.seed ?? s.analysis.seed ?? DEFAULT_SEED;
  const workers = Math.max(1, opts.workers ?? s.analysis.workers ?? 1);
  const problem = problemFromModel(model);
  const recipe = columnRecipe(s);
  const warnings: string[] = [];
  let interrupted = false;

  const formResult = form(problem);
  warnings.push(...formResult.warnings.map((w) => `FORM: ${w}`));
  // (an infinite β has said why in its own warning: no design point)
  if (!formResult.converged && Number.isFinite(formResult.beta)) warnings.push(`FORM did not converge: ${formResult.reason ?? 'see its iteration history'}`);

  const out: Partial<Assessment> = {};
  if (methods.includes('sorm')) {
    out.sorm = sorm(problem, formResult);
    warnings.push(...out.sorm.warnings.map((w) => `SORM: ${w}`));
  }
  if (methods.includes('is')) {
    out.is = await importanceSamplingAtDesignPoint(problem, formResult, {
      samples: s.analysis.isSamples ?? DEFAULT_IS_SAMPLES,
      seed,
      targetCov: IS_TARGET_COV,
      signal: opts.signal,
      onProgress: opts.onProgress && ((p) => opts.onProgress?.('importance sampling', p)),
    });
    warnings.push(...out.is.warnings.map((w) => `IS: ${w}`));
    if (out.is.stopReason === 'aborted') interrupted = true;
  }
  if (methods.includes('mc') && !interrupted) {
    out.mc = await monteCarlo(problem, {
      samples: opts.samples ?? s.analysis.mcSamples ?? DEFAULT_MC_SAMPLES,
      seed,
      workers,
      targetCov: opts.targetCov,
      recipe: workers > 1 ? recipe : undefined,
      signal: opts.signal,
      onProgress: opts.onProgress && ((p) => opts.onProgress?.('Monte Carlo', p)),
    });
    if (out.mc.stopReason === 'aborted') interrupted = true;
    if (out.mc.failures === 0) warnings.push(`Monte Carlo saw no failure in ${out.mc.samples} samples: its pf is only an upper bound`);
  }
  if (methods.includes('subset') && !interrupted) {
    out.subset = subsetSimulation(problem, { seed, samplesPerLevel: s.analysis.subsetSamples ?? 1000 });
    warnings.push(...out.subset.warnings.map((w) => `subset: ${w}`));
  }
  const v = verdict({
    form: methods.includes('form') ? formResult : undefined,
    sorm: out.sorm,
    is: out.is,
    mc: out.mc,
    subset: out.subset,
  });
  const base = { form: formResult, ...out, methods };
  const governing = governingEstimate(base, v);

  let sensitivity: SensitivityStudy | undefined;
  let restraint: ColumnRestraintResult | undefined;
  if (!opts.reliabilityOnly && !interrupted) {
    sensitivity = sensitivityStudy(s, model, formResult.beta, seed, opts.sobolSamples ?? SOBOL_N);
    if (studiedEnds(s, opts.end).length > 0) restraint = opts.restraint ?? columnRestraint(s, { end: opts.end, units: opts.units });
  }
  return {
    scenario: s,
    model,
    check,
    methods,
    seed,
    workers,
    form: formResult,
    ...out,
    verdict: v,
    governing,
    sensitivity,
    restraint,
    samples: samplesSummary(problem, model, seed, formResult),
    warnings,
    interrupted,
  };
}
