/**
 * Measurements on the structure (scenario-level `evidence:`) → the posterior of the scenario's
 * random variables → an updated scenario that every method then assesses (docs/evidence.md §7).
 *
 * 1. Likelihood: each reading (rotation test, natural frequency) against the column model's
 *    prediction at x (limitState/measurementModel.ts), lognormal reading error.
 * 2. Posterior: adaptive Metropolis in the standard-normal space of the Nataf transform, several
 *    seeded chains (evidence/adaptiveMetropolis.ts), split R̂ and ESS per updated variable.
 *    Only the variables the readings depend on, and those correlated with them, are sampled: the
 *    others keep their prior exactly.
 * 3. Into the assessment: each updated variable gets a distribution fitted to its posterior draws
 *    (lognormal for positive quantities, beta on [0, 1] for a fixity factor, normal otherwise;
 *    evidence/posteriorMarginal.ts) and the draws' correlations among them become correlations of
 *    the scenario (Nataf). This keeps the posterior's first two moments and its linear dependence,
 *    not its full shape: the approximation is stated in the summary.
 */
import { samplePosterior, type PosteriorDraws } from '../evidence/adaptiveMetropolis.js';
import { chainDiagnostics } from '../evidence/chainDiagnostics.js';
import { EvidenceError } from '../evidence/evidenceError.js';
import { drawMoments, fitPosteriorMarginal } from '../evidence/posteriorMarginal.js';
import { readingLogLikelihood, readingLogSd } from '../evidence/readingLikelihood.js';
import { buildColumnModel, type ColumnModel } from '../limitState/columnModel.js';
import { measuredReading, predictedReading } from '../limitState/measurementModel.js';
import { describePath, quantityKindOf } from '../limitState/quantityKind.js';
import { withScalar } from '../limitState/scenarioEdits.js';
import { countEvaluations } from '../limitState/evaluationCount.js';
import { scenarioForm } from './columnForm.js';
import { DistributionError, type DistSpec, type Distribution } from '../probability/distribution.js';
import { natafTransform } from '../probability/nataf.js';
import type { QuantityKind } from '../report/reportInput.js';
import { fieldDomain } from '../scenario/fieldDomain.js';
import { InputError } from '../scenario/inputError.js';
import type { Correlation, Measurement, Scenario } from '../scenario/types.js';
import { randomVariables } from '../scenario/variables.js';

export interface MeasurementUpdateOptions {
  chains?: number;
  warmup?: number;
  draws?: number;
}

export const MEASUREMENT_UPDATE_DEFAULTS = { chains: 4, warmup: 2000, draws: 2500 } as const;
/** Gelman et al. 2013 §11.4–11.5: R̂ below 1.1 and enough effective draws for means and sds. */
export const RHAT_LIMIT = 1.1;
export const ESS_MINIMUM = 400;

export interface Moments {
  distribution: string;
  mean: number;
  sd: number;
  q05: number;
  q95: number;
}

export interface UpdatedVariable {
  path: string;
  description: string;
  kind: QuantityKind;
  /** the distribution the assessment had before */
  prior: Moments;
  /** moments and fractiles of the posterior draws themselves */
  posterior: Moments;
  /** the distribution fitted to the draws, which the updated scenario uses */
  fitted: DistSpec;
  /** the distribution the sampler started from (the scenario's, after any test results) */
  priorSpec: DistSpec;
  /** the pooled draws binned over their central 99.5 % (for the report's density chart) */
  histogram: DrawHistogram;
  rhat: number;
  ess: number;
}

/** Equal bins from `lo` of width `width`; `density` = count / (all draws × width), so it integrates to ≤ 1. */
export interface DrawHistogram {
  lo: number;
  width: number;
  density: number[];
}

const HISTOGRAM_BINS = 30;

/** The pooled draws binned over [0.25 %, 99.75 %] fractiles (draws outside are counted in no bin). */
export function drawHistogram(values: Float64Array, bins = HISTOGRAM_BINS): DrawHistogram {
  const sorted = Float64Array.from(values).sort();
  const n = sorted.length;
  const lo = sorted[Math.floor(0.0025 * (n - 1))];
  const hi = sorted[Math.ceil(0.9975 * (n - 1))];
  const width = hi > lo ? (hi - lo) / bins : 1;
  const counts = new Array<number>(bins).fill(0);
  for (let i = 0; i < n; i++) {
    const k = Math.floor((sorted[i] - lo) / width);
    if (k >= 0 && k < bins) counts[k]++;
    else if (sorted[i] === hi) counts[bins - 1]++;
  }
  return { lo, width, density: counts.map((c) => c / (n * width)) };
}

export interface MeasurementRow {
  /** position in the file's `evidence:` list */
  index: number;
  type: Measurement['type'];
  /** one line: what was measured */
  description: string;
  /** SI: rad or Hz */
  unit: 'rad' | 'Hz';
  measured: number;
  /** the model's value at the prior means and at the posterior means */
  predictedPrior: number;
  predictedPosterior: number;
  measurementCov: number;
  source?: string;
}

export interface MeasurementUpdateSummary {
  method: string;
  seed: number;
  chains: number;
  warmup: number;
  draws: number;
  /** likelihood calls */
  calls: number;
  acceptance: number[];
  maxRhat: number;
  minEss: number;
  /** max R̂ < RHAT_LIMIT and min ESS ≥ ESS_MINIMUM */
  converged: boolean;
  measurements: MeasurementRow[];
  variables: UpdatedVariable[];
  /** correlations written into the updated scenario (Pearson, physical space) */
  correlations: Correlation[];
  approximation: string;
  notes: string[];
}

export interface MeasurementUpdate {
  /** the scenario with the updated variables (and without its measurements: they are used) */
  scenario: Scenario;
  summary: MeasurementUpdateSummary;
}

/** A reading farther than this many measurement sds (ln scale) from the model at the posterior means is refused. */
const CONFLICT_SIGMAS = 4;
/** Posterior correlations smaller than this are not carried. */
const CORRELATION_FLOOR = 0.05;
/** A correlation the prior did not have is carried only beyond this many sds of sampling noise. */
const NOISE_SIGMAS = 3;

function fieldOf(m: Measurement): string {
  return `evidence[${m.index}]`;
}

function describeMeasurement(m: Measurement): string {
  return m.type === 'rotation_test'
    ? `rotation test of the ${m.end} connection: ${(m.rotation * 1e3).toPrecision(4)} mrad under ${(m.moment / 1e3).toPrecision(4)} kN·m`
    : `first natural frequency ${m.value.toPrecision(4)} Hz at an axial load of ${(m.axialLoad / 1e3).toPrecision(4)} kN (mass ${m.massPerLength.toPrecision(4)} kg/m)`;
}

function priorMoments(d: Distribution, spec: DistSpec): Moments {
  return { distribution: spec.dist, mean: d.mean, sd: d.sd, q05: d.quantile(0.05), q95: d.quantile(0.95) };
}

/** Indices of the variables whose value changes some predicted reading (one sd either side of the median). */
function informedVariables(model: ColumnModel, measurements: readonly Measurement[]): number[] {
  const base = Float64Array.from(model.dists, (d) => d.fromStandardNormal(0));
  const predict = (x: Float64Array): number[] => measurements.map((m) => predictedReading(model, m, x));
  const at0 = predict(base);
  const out: number[] = [];
  for (let i = 0; i < model.dists.length; i++) {
    for (const u of [-1, 1]) {
      const x = Float64Array.from(base);
      x[i] = model.dists[i].fromStandardNormal(u);
      const p = predict(x);
      if (p.some((v, j) => Math.abs(v - at0[j]) > 1e-12 * Math.max(Math.abs(v), Math.abs(at0[j])))) {
        out.push(i);
        break;
      }
    }
  }
  return out;
}

/** The variables connected to `seed` through non-zero prior correlations. */
function correlatedClosure(model: ColumnModel, seed: readonly number[]): number[] {
  const R = model.correlation;
  const inSet = new Set(seed);
  if (R === null) return [...inSet].sort((a, b) => a - b);
  const stack = [...seed];
  while (stack.length > 0) {
    const i = stack.pop()!;
    for (let j = 0; j < R.length; j++) {
      if (!inSet.has(j) && R[i][j] !== 0) {
        inSet.add(j);
        stack.push(j);
      }
    }
  }
  return [...inSet].sort((a, b) => a - b);
}

function fitFor(path: string, values: Float64Array): DistSpec {
  const domain = fieldDomain(path);
  if (domain === 'fixity') {
    const m = drawMoments(values);
    return { dist: 'beta', min: 0, max: 1, mean: m.mean, sd: m.sd };
  }
  return fitPosteriorMarginal(values, domain !== 'any');
}

function pearson(a: Float64Array, b: Float64Array): number {
  const n = a.length;
  let ma = 0;
  let mb = 0;
  for (let i = 0; i < n; i++) {
    ma += a[i];
    mb += b[i];
  }
  ma /= n;
  mb /= n;
  let sab = 0;
  let saa = 0;
  let sbb = 0;
  for (let i = 0; i < n; i++) {
    sab += (a[i] - ma) * (b[i] - mb);
    saa += (a[i] - ma) ** 2;
    sbb += (b[i] - mb) ** 2;
  }
  return saa > 0 && sbb > 0 ? sab / Math.sqrt(saa * sbb) : 0;
}

/**
 * The scenario updated by its measurements, and what changed. A scenario without measurements is
 * returned as it is (summary null). Throws InputError naming `evidence[i]` when a measurement
 * informs no random variable or none of the prior can explain the readings.
 */
export function updateScenarioWithEvidence(
  scenario: Scenario,
  seed: number,
  options: MeasurementUpdateOptions = {},
): { scenario: Scenario; summary: MeasurementUpdateSummary | null } {
  const measurements = scenario.measurements ?? [];
  if (measurements.length === 0) return { scenario, summary: null };
  const chains = options.chains ?? MEASUREMENT_UPDATE_DEFAULTS.chains;
  const warmup = options.warmup ?? MEASUREMENT_UPDATE_DEFAULTS.warmup;
  const draws = options.draws ?? MEASUREMENT_UPDATE_DEFAULTS.draws;
  const model = buildColumnModel(scenario);
  const names = model.names;

  for (const m of measurements) {
    if (informedVariables(model, [m]).length === 0) {
      throw new InputError(fieldOf(m), m.type === 'rotation_test'
        ? `this rotation test informs no random variable: the ${m.end} end's stiffness (and E, I when the end is a fixity or alignment factor) is fixed; make it a random variable for the test to update it`
        : 'this frequency informs no random variable: the springs, E and I are all fixed; make the uncertain ones random variables for the measurement to update them');
    }
  }
  const informed = informedVariables(model, measurements);
  const updated = correlatedClosure(model, informed);
  // The prior is independent between the updated set (the informed variables and everything
  // correlated with them) and the rest, and the Nataf factor keeps that block structure, so the
  // rest keeps its prior exactly: only the updated set is sampled.
  const active = updated;
  const transform = natafTransform(model.dists, model.correlation, names);
  const n = names.length;
  const logSd = measurements.map((m) => readingLogSd(m.measurementCov));
  const u = new Float64Array(n);
  const x = new Float64Array(n);
  const logLikelihoodAt = (xAt: Float64Array): number => {
    let l = 0;
    for (let i = 0; i < measurements.length && l > -Infinity; i++) {
      l += readingLogLikelihood(measuredReading(measurements[i]), predictedReading(model, measurements[i], xAt), logSd[i]);
    }
    return l;
  };
  const logLikelihood = (ua: Float64Array): number => {
    u.fill(0);
    for (let k = 0; k < active.length; k++) u[active[k]] = ua[k];
    transform.toPhysical(u, x);
    return logLikelihoodAt(x);
  };
  let posterior: PosteriorDraws;
  try {
    posterior = samplePosterior(active.length, logLikelihood, { seed, chains, warmup, draws });
  } catch (e) {
    if (e instanceof EvidenceError) throw new InputError('evidence', e.message);
    throw e;
  }

  // physical draws of the updated variables (and of every active one, for correlations), per chain
  const perChain: Float64Array[][] = active.map(() => []);
  for (const chain of posterior.draws) {
    const cols = active.map(() => new Float64Array(draws));
    for (let t = 0; t < draws; t++) {
      u.fill(0);
      for (let k = 0; k < active.length; k++) u[active[k]] = chain[t * active.length + k];
      transform.toPhysical(u, x);
      for (let k = 0; k < active.length; k++) cols[k][t] = x[active[k]];
    }
    cols.forEach((c, k) => perChain[k].push(c));
  }
  const pooled = perChain.map((cs) => {
    const out = new Float64Array(cs.length * draws);
    cs.forEach((c, j) => out.set(c, j * draws));
    return out;
  });
  const slot = new Map(active.map((i, k) => [i, k] as const));

  const notes: string[] = [];
  const variables: UpdatedVariable[] = [];
  let next = scenario;
  for (const i of updated) {
    const path = names[i];
    const k = slot.get(i)!;
    const diag = chainDiagnostics(perChain[k]);
    const spec = randomSpec(scenario, path);
    if (!path.startsWith('column.')) {
      notes.push(`${path} is correlated with an updated variable; its own distribution is kept (only the column's variables are refitted)`);
      continue;
    }
    const fitted = fitFor(path, pooled[k]);
    const post = drawMoments(pooled[k]);
    variables.push({
      path,
      description: describePath(path),
      kind: quantityKindOf(path),
      prior: priorMoments(model.dists[i], spec),
      posterior: { distribution: 'posterior draws', ...post },
      fitted,
      priorSpec: spec,
      histogram: drawHistogram(pooled[k]),
      rhat: diag.rhat,
      ess: diag.ess,
    });
    next = withScalar(next, path, { kind: 'random', spec: fitted });
    // the source note follows the variable: it is now the posterior, not what was written
    const written = scenario.sources?.[path];
    const items = measurements.map(fieldOf).join(', ');
    next = { ...next, sources: { ...next.sources, [path]: `updated by the measurements ${items} (posterior fit)${written ? `; before: ${written}` : ''}` } };
    const tests = next.evidence?.[path];
    // the test results' own update stays on record (the report shows it) while the Scalar moves on
    if (tests) next = { ...next, evidence: { ...next.evidence, [path]: { ...tests, result: spec } } };
  }

  // correlations: prior entries outside the updated set stay; inside it they come from the draws
  const essOf = new Map(variables.map((v) => [v.path, v.ess] as const));
  const updatedPaths = new Set(variables.map((v) => v.path));
  const kept = scenario.correlation.filter((c) => !updatedPaths.has(c.a) && !updatedPaths.has(c.b));
  const added: Correlation[] = [];
  for (let p = 0; p < active.length; p++) {
    for (let q = p + 1; q < active.length; q++) {
      const a = names[active[p]];
      const b = names[active[q]];
      if (!updatedPaths.has(a) && !updatedPaths.has(b)) continue;
      const rho = pearson(pooled[p], pooled[q]);
      // a pair that was correlated before keeps its (updated) correlation; a new one must stand out
      // of the sampling noise, sd ≈ 1/√ESS of a sample correlation
      const before = model.correlation !== null && model.correlation[active[p]][active[q]] !== 0;
      const noise = 1 / Math.sqrt(Math.min(essOf.get(a) ?? 1, essOf.get(b) ?? 1));
      if (before || Math.abs(rho) >= Math.max(CORRELATION_FLOOR, NOISE_SIGMAS * noise)) added.push({ a, b, rho });
    }
  }
  let correlations = added;
  next = { ...next, correlation: [...kept, ...added] };
  try {
    buildAndTransform(next);
  } catch (e) {
    if (!(e instanceof DistributionError)) throw e;
    correlations = [];
    next = { ...next, correlation: kept };
    notes.push(`the posterior correlations could not be carried into the assessment (${e.message}); the updated variables are taken as independent of each other`);
  }
  const { measurements: _used, ...rest } = next;
  next = rest;

  // predictions at the prior and posterior means
  const priorMean = Float64Array.from(model.mean);
  const postModel = buildColumnModel(next);
  const rows: MeasurementRow[] = measurements.map((m) => ({
    index: m.index,
    type: m.type,
    description: describeMeasurement(m),
    unit: m.type === 'rotation_test' ? 'rad' : 'Hz',
    measured: measuredReading(m),
    predictedPrior: predictedReading(model, m, priorMean),
    predictedPosterior: predictedReading(postModel, m, postModel.mean),
    measurementCov: m.measurementCov,
    ...(m.source !== undefined ? { source: m.source } : {}),
  }));
  // a reading the posterior still cannot come near is a conflict with the scenario, not evidence;
  // the worst one is named (the others may only have been dragged along by it)
  const misfit = rows.map((r, i) => Math.abs(Math.log(r.measured / r.predictedPosterior) / logSd[i]));
  const worst = misfit.reduce((w, z, i) => (!(z <= misfit[w]) ? i : w), 0);
  if (!(misfit[worst] <= CONFLICT_SIGMAS)) {
    const m = measurements[worst];
    const r = rows[worst];
    const show = (v: number) => (m.type === 'rotation_test' ? `${(v * 1e3).toPrecision(4)} mrad` : `${v.toPrecision(4)} Hz`);
    throw new InputError(
      `${fieldOf(m)}.${m.type === 'rotation_test' ? 'rotation' : 'value'}`,
      `the reading ${show(r.measured)} is in conflict with the scenario: even after updating, the model gives ${show(r.predictedPosterior)} (${misfit[worst].toFixed(0)} measurement sds away); check the reading, its units${m.type === 'frequency' ? ', the axial load and the mass per length' : ' and the moment'}, and the distributions of the column's values`,
    );
  }
  const maxRhat = Math.max(...variables.map((v) => v.rhat));
  const minEss = Math.min(...variables.map((v) => v.ess));
  const converged = maxRhat < RHAT_LIMIT && minEss >= ESS_MINIMUM;
  if (!converged) notes.push(`the chains may not have converged (max R̂ ${maxRhat.toFixed(3)}, min ESS ${Math.round(minEss)}; wanted R̂ < ${RHAT_LIMIT} and ESS ≥ ${ESS_MINIMUM}): treat the updated β with caution`);
  return {
    scenario: next,
    summary: {
      method: `adaptive Metropolis in standard-normal space, ${chains} chains × ${draws} draws after ${warmup} warm-up (seed ${seed})`,
      seed,
      chains,
      warmup,
      draws,
      calls: posterior.calls,
      acceptance: [...posterior.acceptance],
      maxRhat,
      minEss,
      converged,
      measurements: rows,
      variables,
      correlations,
      approximation:
        'each updated variable enters the assessment as a distribution fitted to its posterior draws (lognormal by the mean and sd of ln x for positive quantities) with the draws’ correlations; the posterior’s shape beyond these moments is not carried',
      notes,
    },
  };
}

function randomSpec(s: Scenario, path: string): DistSpec {
  const v = randomVariables(s).find((r) => r.path === path);
  if (v === undefined) throw new Error(`${path} is not a random variable`);
  return v.spec;
}

/** Throws DistributionError when the scenario's correlations cannot be realised (Nataf). */
function buildAndTransform(s: Scenario): void {
  const m = buildColumnModel(s);
  natafTransform(m.dists, m.correlation, m.names);
}

/** The update and FORM β (series system of design points) of the scenario before and after it. */
export interface MeasurementUpdateResult {
  summary: MeasurementUpdateSummary;
  /** FORM on the scenario without its measurements (its test results applied) */
  betaPrior: number;
  pfPrior: number;
  /** FORM on the updated scenario */
  betaPosterior: number;
  pfPosterior: number;
  /** limit-state calls of the two FORM runs */
  formCalls: number;
}

/**
 * updateScenarioWithEvidence plus β before and after by FORM on both scenarios (like for like;
 * the assessment of the updated scenario then runs every method asked for). Null without measurements.
 */
export function measurementUpdate(scenario: Scenario, seed: number, options: MeasurementUpdateOptions = {}): { scenario: Scenario; result: MeasurementUpdateResult } | null {
  const { scenario: updated, summary } = updateScenarioWithEvidence(scenario, seed, options);
  if (summary === null) return null;
  const { measurements: _unused, ...prior } = scenario;
  const before = countEvaluations(() => scenarioForm(prior));
  const after = countEvaluations(() => scenarioForm(updated));
  return {
    scenario: updated,
    result: {
      summary, betaPrior: before.result.beta, pfPrior: before.result.pf, betaPosterior: after.result.beta, pfPosterior: after.result.pf,
      formCalls: before.calls + after.calls,
    },
  };
}

/** `evidence_update` of result.json (docs/json-output.md); SI. */
export function measurementUpdateJson(r: MeasurementUpdateResult): unknown {
  const s = r.summary;
  const moments = (m: Moments) => ({ mean: m.mean, sd: m.sd, fractile_05: m.q05, fractile_95: m.q95 });
  return {
    method: s.method,
    seed: s.seed,
    beta_prior: r.betaPrior,
    beta_posterior: r.betaPosterior,
    beta_method: 'FORM (series system of design points) on the scenario before and after the update',
    measurements: s.measurements.map((m) => ({
      item: m.index,
      type: m.type,
      unit: m.unit,
      measured: m.measured,
      predicted_prior_means: m.predictedPrior,
      predicted_posterior_means: m.predictedPosterior,
      measurement_cov: m.measurementCov,
      source: m.source ?? null,
    })),
    variables: s.variables.map((v) => ({
      variable: v.path,
      prior: { dist: v.prior.distribution, ...moments(v.prior) },
      posterior: moments(v.posterior),
      fitted: v.fitted,
      rhat: v.rhat,
      ess: v.ess,
    })),
    correlations: s.correlations.map((c) => ({ a: c.a, b: c.b, rho: c.rho })),
    diagnostics: {
      chains: s.chains,
      warmup: s.warmup,
      draws_per_chain: s.draws,
      likelihood_calls: s.calls,
      acceptance: s.acceptance,
      max_rhat: s.maxRhat,
      min_ess: s.minEss,
      converged: s.converged,
    },
    approximation: s.approximation,
    notes: s.notes,
  };
}
