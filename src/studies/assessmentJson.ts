/**
 * The contract JSON of `stanchion assess` (docs/json-output.md): contract keys first, extensions after.
 * JSON has no Infinity: a non-finite number is written as null.
 */
import { evidenceRows } from './evidenceSummary.js';
import { measurementUpdateJson } from './measurementUpdate.js';
import type { MeasurementEffect } from './measurementEffect.js';
import { testPlansBlock } from './testPlanJson.js';
import type { EvidenceMoments } from '../report/reportInput.js';
import { SAMPLER_VERSION } from '../probability/blockRng.js';
import type { SobolResult } from '../sensitivity/sobol.js';
import { checkJson } from '../limitState/deterministicCheck.js';
import type { Assessment } from './columnAssessment.js';
import { restraintJson } from './columnRestraint.js';
import { connectionJson } from '../limitState/connectionResponse.js';
import { designPointConnections } from './designPointConnections.js';
import type { ConditionalImportanceResult } from '../reliability/conditionalImportance.js';

export interface RunMeta {
  version: string;
  date: string;
  command: string;
}

/** Replace every non-finite number by null, deeply. */
export function jsonSafe(v: unknown): unknown {
  if (typeof v === 'number') return Number.isFinite(v) ? v : null;
  if (Array.isArray(v)) return v.map(jsonSafe);
  if (v && typeof v === 'object') {
    const out: Record<string, unknown> = {};
    for (const [k, x] of Object.entries(v)) if (x !== undefined) out[k] = jsonSafe(x);
    return out;
  }
  return v;
}

function byName(names: readonly string[], values: readonly number[]): Record<string, number> {
  const out: Record<string, number> = {};
  names.forEach((n, i) => (out[n] = values[i]));
  return out;
}

function modelFactorJson(m: Assessment['modelFactor']): Record<string, unknown> {
  return { mean: m.mean, cov: m.cov, dist: m.dist, source: m.source, strength: m.strength, reference: m.reference };
}

/** Characteristic values and implied partial factors beside the design point (keys of reliability.form). */
function characteristicJson(a: Assessment): Record<string, unknown> {
  const c = a.characteristic;
  const characteristic: Record<string, unknown> = {};
  const partial: Record<string, unknown> = {};
  const designToMean: Record<string, number | null> = {};
  for (const r of c.rows) {
    characteristic[r.variable] = { value: r.characteristic, side: r.side, fractile: r.fractile, basis: r.basis };
    partial[r.variable] = { gamma: r.partialFactor, side: r.side, code: r.code };
    designToMean[r.variable] = r.designToMean;
  }
  return {
    characteristic,
    partial_factors: partial,
    resistance_factor: {
      characteristic: c.resistance.characteristic,
      design: c.resistance.design,
      gamma: c.resistance.partialFactor,
      code: c.resistance.code,
    },
    code_factors_from: c.code,
    design_to_mean_ratio: designToMean,
  };
}

export function reliabilityJson(a: Assessment): Record<string, unknown> {
  const r: Record<string, unknown> = {};
  const f = a.form;
  if (a.methods.includes('form')) {
    r.form = {
      beta: f.beta,
      pf: f.pf,
      converged: f.converged,
      design_point: byName(f.names, f.designPointX),
      importance: byName(f.names, f.importance),
      alpha: byName(f.names, f.alpha),
      gamma: byName(f.names, f.gamma),
      iterations: f.iterations,
      calls: f.calls,
      multiple_design_points: f.multipleDesignPoints,
      origin_fails: f.originFails,
      reason: f.reason,
      ...characteristicJson(a),
      doubtful_directions: f.doubtfulDirections,
      system: {
        beta: f.system.beta,
        pf: f.system.pf,
        method: f.system.method,
        bounds: f.system.bounds,
        design_points: f.system.designPoints.map((p) => ({ beta: p.beta, design_point: byName(f.names, p.designPointX), alpha: byName(f.names, p.alpha) })),
      },
    };
    const joints = designPointConnections(a);
    if (joints) Object.assign(r.form as Record<string, unknown>, connectionJson(joints, 'form design point'));
    if (a.formCheck) {
      const c = a.formCheck;
      (r.form as Record<string, unknown>).check = {
        method: c.method, pf: c.pf, cov: c.cov, beta: c.beta, samples: c.samples, failures: c.failures, seed: c.seed,
        beta_band: c.betaBand, upper_bound: c.upperBound, agrees: c.agrees, reason: c.reason,
      };
    }
  }
  if (a.sorm) {
    r.sorm = {
      beta: a.sorm.beta,
      pf: a.sorm.pf,
      formula: a.sorm.used,
      breitung: a.sorm.breitung,
      hohenbichler_rackwitz: a.sorm.hohenbichlerRackwitz,
      tvedt: a.sorm.tvedt,
      curvatures: a.sorm.curvatures,
      calls: a.sorm.calls,
    };
  }
  if (a.is) r.is = { pf: a.is.pf, cov: a.is.cov, calls: a.is.calls, beta: a.is.beta, samples: a.is.samples, failures: a.is.failures };
  if (a.mc) {
    r.mc = {
      pf: a.mc.pf,
      cov: a.mc.cov,
      samples: a.mc.samples,
      failures: a.mc.failures,
      ci95: a.mc.ci95,
      beta: a.mc.beta,
      calls: a.mc.calls,
      workers: a.mc.workers,
      stopped_early: a.mc.stoppedEarly,
    };
  }
  if (a.subset) {
    r.subset = {
      pf: a.subset.pf,
      cov: a.subset.cov,
      calls: a.subset.calls,
      beta: a.subset.beta,
      levels: a.subset.levels.length,
      converged: a.subset.converged,
      ...(a.subset.runs !== undefined ? { runs: a.subset.runs } : {}),
    };
  }
  r.model_factor = modelFactorJson(a.modelFactor);
  if (a.byStrengthModel) {
    r.by_strength_model = a.byStrengthModel.map((m) => ({
      strength: m.strength,
      beta: m.beta,
      model_factor: modelFactorJson(m.modelFactor),
      pf: m.pf,
      converged: m.converged,
      chosen: m.chosen,
      note: m.note,
    }));
  }
  r.verdict = { agree: a.verdict.agree, material: a.verdict.material, trust: a.verdict.trust, reason: a.verdict.reason };
  r.governing = a.governing;
  // with survived loads `governing` is the conditional estimate (docs/evidence.md §8); this is the one without them
  if (a.governingUnconditional) r.governing_unconditional = a.governingUnconditional;
  const c = a.combinations;
  const system = a.governingUnconditional ?? a.governing;
  if (c) {
    r.combinations = c.combinations.map((k, i) => ({
      leading: k.leading,
      beta: k.form.beta,
      pf: k.form.pf,
      converged: k.form.converged,
      sorm_beta: k.sorm?.beta,
      design_point: byName(k.form.names, k.form.designPointX),
      governing: i === c.governing,
    }));
    const sys = c.sormSystem ?? c.formSystem;
    r.system = {
      beta: system.beta,
      pf: system.pf,
      method: system.method,
      linearised: { beta: sys.beta, pf: sys.pf, method: sys.method, from: c.sormSystem ? 'sorm' : 'form', bounds: [sys.bounds.lower, sys.bounds.upper] },
    };
  }
  r.target_beta = a.scenario.targetBeta;
  r.meets_target = a.governing.beta >= a.scenario.targetBeta;
  return r;
}

function sensitivityJson(a: Assessment): Record<string, unknown> {
  const f = a.form;
  const out: Record<string, unknown> = {};
  const s = a.sensitivity;
  if (s?.utilization) out.tornado = s.utilization.rows.map((t) => ({ variable: t.variable, low: t.low, high: t.high }));
  if (s?.capacity) out.capacity_tornado = s.capacity.rows.map((t) => ({ variable: t.variable, low: t.low, high: t.high }));
  if (s?.conditionalBeta) {
    out.conditional_beta = s.conditionalBeta.rows.map((c) => ({
      variable: c.variable,
      low_value: c.lowValue,
      high_value: c.highValue,
      beta_low: c.betaLow,
      beta_high: c.betaHigh,
    }));
  }
  if (s?.elasticities) {
    out.elasticities = s.elasticities.entries.map((e) => ({
      variable: e.variable,
      d_beta_d_mean: e.dBetaDMean,
      d_beta_d_sd: e.dBetaDSd,
      mean_elasticity: e.meanElasticity,
      sd_elasticity: e.sdElasticity,
    }));
  }
  if (s?.sobolG && s.sobolCapacity) {
    const sobol = (r: SobolResult) =>
      r.first.map((fi, i) => ({ variable: fi.name, first: fi.value, first_ci95: [fi.lo, fi.hi], total: r.total[i].value, total_ci95: [r.total[i].lo, r.total[i].hi] }));
    out.sobol = { samples: s.sobolG.n, capacity: sobol(s.sobolCapacity), limit_state: sobol(s.sobolG) };
  }
  out.importance = byName(f.names, f.importance);
  return out;
}

/** Variables updated by test results: the data as entered and the distribution before and after (SI). */
function evidenceJson(s: Assessment['scenario']): unknown {
  const moments = (m: EvidenceMoments) => ({ dist: m.distribution, mean: m.mean, cov: m.cov, fractile_05: m.fractile05, ...(m.dof !== undefined ? { dof: m.dof } : {}) });
  return evidenceRows(s).map((r) => ({
    variable: r.path,
    tests: r.tests,
    tested: r.tested,
    measurement_sd: r.measurementSd ?? null,
    measurement_cov: r.measurementCov ?? null,
    method: r.method,
    source: r.source ?? null,
    prior: moments(r.prior),
    posterior: moments(r.posterior),
  }));
}

/** The steps of the evidence (FORM), each with β and the verdict, and the survival study (SI). */
/** The importance-sampling estimate of P(failure | survived) (docs/evidence.md §5). */
function importanceJson(r: ConditionalImportanceResult): unknown {
  const part = (p: ConditionalImportanceResult['joint']) => ({ p: p.p, cov: p.cov, samples: p.samples, hits: p.hits, method: p.method });
  return {
    pf: r.pf, beta: r.beta, cov: r.cov, samples: r.samples, calls: r.calls,
    centre: r.centre, centre_u: r.centreU, centre_converged: r.centreConverged,
    joint: part(r.joint), survival: part(r.survival),
    target_cov: r.targetCov, reached_target: r.reachedTarget, seed: r.seed,
  };
}

function measurementsJson(m: MeasurementEffect, s: Assessment['scenario']): unknown {
  const state = (b: { beta: number; pf: number; meets: boolean }) => ({ beta: b.beta, pf: b.pf, meets_target: b.meets });
  return {
    method: 'form',
    target_beta: m.target,
    steps: m.steps.map((st) => ({ step: st.step, label: st.label, ...state(st) })),
    before: state(m.before),
    ...(m.afterTests ? { after_tests: state(m.afterTests) } : {}),
    ...(m.afterMeasurements ? { after_measurements: state(m.afterMeasurements) } : {}),
    after: state(m.after),
    ...(m.survival
      ? {
          survived_loads: (s.survivedLoads ?? []).map((l) => ({ path: l.path, load: l.load.kind === 'fixed' ? l.load.value : l.load.spec, date: l.date ?? null, notes: l.notes ?? null })),
          survival: {
            beta: m.survival.beta, pf: m.survival.pf, probability_of_survival: m.survival.pSurvival, rho: m.survival.rho, converged: m.survival.converged,
            model_factor_shared: true,
            ...(m.survival.mc ? { mc: { pf: m.survival.mc.pf, cov: m.survival.mc.cov, samples: m.survival.mc.samples, survived: m.survival.mc.survived, failures: m.survival.mc.failures, seed: m.survival.mc.seed } } : {}),
            ...(m.survival.importance ? { importance: importanceJson(m.survival.importance) } : {}),
            ...(m.survival.mcCheck ? { mc_agrees: m.survival.mcCheck.agrees } : {}),
            ...(m.survival.importanceCheck ? { importance_agrees: m.survival.importanceCheck.agrees } : {}),
            ...(m.survival.check ? { check: m.survival.check.reason, check_method: m.survival.check.method } : {}),
          },
        }
      : {}),
  };
}

export function assessmentJson(a: Assessment, meta: RunMeta): unknown {
  const t = a.scenario.target;
  const doc: Record<string, unknown> = {
    check: checkJson(a.check),
    target: {
      beta: t.beta,
      period_years: t.periodYears,
      beta_reference_period: t.betaReferencePeriod,
      beta_annual: t.betaAnnual,
      reference_period_years: a.scenario.referencePeriodYears,
      source: t.source ?? null,
      consequence_class: t.consequenceClass ?? null,
    },
    reliability: reliabilityJson(a),
    sensitivity: sensitivityJson(a),
    meta: {
      version: meta.version,
      seed: a.seed,
      sampler: SAMPLER_VERSION,
      scenario_sha256: a.scenario.sha256,
      date: meta.date,
      command: meta.command,
      methods: a.methods,
      studies: a.studies,
      calls: a.calls,
      interrupted: a.interrupted,
    },
  };
  if (a.axes) {
    const axis = (r: NonNullable<typeof a.axes>['y']) => ({ beta: r.beta, pf: r.pf, method: r.method, converged: r.converged });
    doc.axes = { y: axis(a.axes.y), z: axis(a.axes.z), governing: a.axes.governing, governing_at_means: a.axes.governingAtMeans };
  }
  if (a.restraint) doc.restraint = restraintJson(a.restraint);
  if (a.scenario.evidence) doc.evidence = evidenceJson(a.scenario);
  if (a.measurementUpdate) doc.evidence_update = measurementUpdateJson(a.measurementUpdate);
  if (a.measurements) doc.measurements = measurementsJson(a.measurements, a.scenario);
  if (a.testPlans) doc.test_plans = testPlansBlock(a.testPlans);
  doc.warnings = a.warnings;
  return jsonSafe(doc);
}
