/**
 * The report's input (report/reportInput.ts) filled from an assessment: the report computes
 * nothing, so every number it shows is put here.
 */
import type { ColumnRestraintResult } from './columnRestraint.js';
import { quantityKindOf, describePath } from '../limitState/quantityKind.js';
import { listScalars } from '../scenario/variables.js';
import { seriesStiffnessAtMeans } from '../scenario/seriesEnd.js';
import type { End, Scenario } from '../scenario/types.js';
import type {
  EndDescription,
  InputRow,
  PartialFactorRow,
  ReportInput,
  TargetSource,
  TornadoRow,
} from '../report/reportInput.js';
import { fixityFactor } from '../mechanics/restraint.js';
import type { Assessment } from './columnAssessment.js';
import { formatBeta } from '../report/displayUnits.js';
import type { ConnectionResponse, EndClassification } from '../limitState/connectionResponse.js';
import type { ConnectionValues, JointClassRow } from '../report/reportInput.js';
import { designPointConnections } from './designPointConnections.js';
import { evidenceRows } from './evidenceSummary.js';
import type { MeasurementEffect } from './measurementEffect.js';
import type { MeasurementsReport, ModelUpdateReport } from '../report/reportInput.js';
import { ESS_MINIMUM, RHAT_LIMIT, type MeasurementUpdateResult } from './measurementUpdate.js';

function modelUpdateReport(r: MeasurementUpdateResult): ModelUpdateReport {
  const u = r.summary;
  const moments = (m: { mean: number; sd: number; q05: number; q95: number }) => ({ mean: m.mean, sd: m.sd, q05: m.q05, q95: m.q95 });
  return {
    method: u.method, chains: u.chains, warmup: u.warmup, draws: u.draws, acceptance: [...u.acceptance],
    maxRhat: u.maxRhat, minEss: u.minEss, rhatLimit: RHAT_LIMIT, essMinimum: ESS_MINIMUM, converged: u.converged,
    readings: u.measurements.map((m) => ({
      index: m.index, description: m.description, unit: m.unit, measured: m.measured, predictedPrior: m.predictedPrior,
      predictedPosterior: m.predictedPosterior, measurementCov: m.measurementCov, ...(m.source !== undefined ? { source: m.source } : {}),
    })),
    variables: u.variables.map((v) => ({
      path: v.path, description: v.description, kind: v.kind, prior: moments(v.prior), posterior: moments(v.posterior),
      fittedDist: v.fitted.dist, rhat: v.rhat, ess: v.ess,
    })),
    correlations: u.correlations.map((c) => ({ a: c.a, b: c.b, rho: c.rho })),
    approximation: u.approximation,
    notes: [...u.notes],
  };
}

function measurementsReport(m: MeasurementEffect, a: Assessment): MeasurementsReport {
  const s = a.scenario;
  const sv = m.survival;
  const u = a.governingUnconditional;
  return {
    target: m.target,
    steps: m.steps.map((st) => ({ step: st.step, label: st.label, beta: st.beta, pf: st.pf, meets: st.meets })),
    ...(a.measurementUpdate ? { modelUpdate: modelUpdateReport(a.measurementUpdate) } : {}),
    before: m.before,
    ...(m.afterTests ? { afterTests: m.afterTests } : {}),
    after: m.after,
    densities: m.densities,
    ...(sv
      ? {
          survival: {
            loads: (s.survivedLoads ?? []).map((l) => ({
              path: l.path, mean: l.load.kind === 'fixed' ? l.load.value : makeDistribution(l.load.spec).mean, random: l.load.kind === 'random',
              ...(l.date ? { date: l.date } : {}), ...(l.notes ? { notes: l.notes } : {}),
            })),
            beta: sv.beta, pf: sv.pf, pSurvival: sv.pSurvival, rho: sv.rho, converged: sv.converged,
            ...(sv.mc ? { mc: { pf: sv.mc.pf, cov: sv.mc.cov, samples: sv.mc.samples, survived: sv.mc.survived, failures: sv.mc.failures, seed: sv.mc.seed } } : {}),
            ...(sv.importance
              ? {
                  importance: {
                    pf: sv.importance.pf, beta: sv.importance.beta, cov: sv.importance.cov, samples: sv.importance.samples, hits: sv.importance.joint.hits,
                    centre: CENTRE_WORDS[sv.importance.centre], survivalMethod: sv.importance.survival.method, seed: sv.importance.seed,
                  },
                }
              : {}),
            ...(sv.check ? { check: { agrees: sv.check.agrees, reason: sv.check.reason, method: sv.check.method } } : {}),
            ...(u ? { unconditional: { beta: u.beta, method: u.method, ...(u.basis ? { basis: u.basis } : {}) } } : {}),
          },
        }
      : {}),
  };
}
import { strengthUsesBow } from '../mechanics/strengthModelKind.js';
import { makeDistribution } from '../probability/makeDistribution.js';
import { zeroFailureBound } from '../reliability/zeroFailureBound.js';
import { CENTRE_WORDS } from '../reliability/conditionalImportance.js';

function connectionValues(m: ConnectionResponse): ConnectionValues {
  const e = m.eccentricity;
  const t = m.transverse;
  return {
    ...(e !== undefined && (e.bottom !== 0 || e.top !== 0) ? { endCouples: { bottom: m.load * e.bottom, top: m.load * e.top } } : {}),
    ...(t !== undefined && t.line !== 0 ? { lineLoad: t.line } : {}),
    ...(t !== undefined && t.top !== 0 ? { topForce: t.top } : {}),
    load: m.load,
    bow: m.bow,
    amplification: m.amplification,
    stable: m.stable,
    moment: { bottom: Math.abs(m.springMoment.bottom), top: Math.abs(m.springMoment.top) },
    rotation: { bottom: Math.abs(m.rotation.bottom), top: Math.abs(m.rotation.top) },
    memberMax: m.memberMax,
    memberMaxAt: Number.isFinite(m.memberMaxAt) ? m.memberMaxAt : null,
  };
}
import type { RunMeta } from './assessmentJson.js';

/** The user's source verbatim; with no target given at all, the default's own source. */
function targetSource(s: Assessment['scenario']): TargetSource {
  if (s.target.source !== undefined) return s.target.source;
  return s.target.beta === 3.8 && s.target.periodYears === 50 ? 'EN 1990 Annex B' : 'stated in the scenario';
}

function targetNote(s: Assessment['scenario']): string | undefined {
  const t = s.target;
  const parts = [`${Number(s.referencePeriodYears.toPrecision(6))}-year reference period`, `annual β ${formatBeta(t.betaAnnual)}`];
  if (t.periodYears !== 1 && t.periodYears !== s.referencePeriodYears) parts.push(`stated as β ${formatBeta(t.beta)} over ${Number(t.periodYears.toPrecision(6))} years`);
  if (t.consequenceClass !== undefined) parts.push(t.consequenceClass);
  return parts.join('; ');
}

function inputRows(s: Scenario): InputRow[] {
  return listScalars(s).map(({ path, scalar }) => {
    const kind = quantityKindOf(path);
    if (scalar.kind === 'fixed') {
      return { path, description: describePath(path), kind, distribution: 'fixed', parameters: { value: scalar.value } };
    }
    const { dist, ...params } = scalar.spec;
    // both spreads, whichever was given: sd from the distribution itself, CoV = sd / |mean|
    const d = makeDistribution(scalar.spec);
    const { loc: _loc, scale: _scale, dof: _dof, ...plain } = params;
    const parameters = { ...plain, mean: plain.mean ?? d.mean, sd: plain.sd ?? d.sd };
    // a Student-t from two or three tests has no finite sd: leave sd and CoV empty
    if (!Number.isFinite(parameters.sd)) delete (parameters as { sd?: number }).sd;
    else if (parameters.cov === undefined && d.mean !== 0) parameters.cov = d.sd / Math.abs(d.mean);
    const source = s.sources?.[path];
    return { path, description: describePath(path), kind, distribution: dist, parameters, ...(source ? { source } : {}) };
  });
}

function endDescription(end: End, R: number | null, mean: (path: string) => number, path: string): EndDescription {
  if (end.type === 'pinned') return { type: 'pinned', R: 0, fixity: 0 };
  if (end.type === 'fixed') return { type: 'fixed', fixity: 1 };
  const Rv = R ?? Infinity;
  const stiffness = end.type === 'rotation' ? mean(`${path}.rotation`) : end.type === 'series' ? seriesStiffnessAtMeans(end) : undefined;
  const random =
    end.type === 'rotation' ? end.k.kind === 'random' : end.type === 'series' ? end.components.some((c) => c.k !== 'rigid' && c.k.kind === 'random') : end.input.kind === 'random';
  return { type: 'spring', stiffness, R: Number.isFinite(Rv) ? Rv : undefined, fixity: fixityFactor(Rv), random };
}

function tornadoRows(rows: { variable: string; low: number; high: number }[]): TornadoRow[] {
  return rows.map((r) => ({ variable: r.variable, low: r.low, high: r.high }));
}

/** Characteristic values (EN 1990 4.1.2) and the partial factors they imply, from characteristicValues.ts. */
function partialFactors(a: Assessment): PartialFactorRow[] {
  return a.characteristic.rows.map((r) => {
    const path = r.variable;
    const role: PartialFactorRow['role'] = path.startsWith('loads.')
      ? 'load'
      : path === 'model_factor'
        ? 'model'
        : path === 'column.imperfection.bow'
          ? 'imperfection'
          : 'resistance';
    const adverse: 'low' | 'high' = r.side === 'resistance' || (r.side === 'favourable' && r.design < r.mean) ? 'low' : 'high';
    return {
      variable: path,
      kind: quantityKindOf(path),
      role,
      adverse,
      basis: r.characteristic === null ? 'mean' : 'characteristic',
      referenceValue: r.characteristic ?? r.mean,
      designValue: r.design,
      factor: r.partialFactor,
      note: r.basis,
      side: r.side,
      ...(r.designToMean !== null ? { designToMean: r.designToMean } : {}),
      code: r.code,
    };
  });
}

/** The governing estimate; Monte Carlo with no failure stands as its one-sided bound (β above it). */
function governingForReport(a: Assessment): ReportInput['reliability']['governing'] {
  const g = a.governing;
  if (g.method === 'mc' && a.mc && a.mc.failures === 0 && a.mc.samples > 0 && !g.basis) {
    const b = zeroFailureBound(a.mc.samples);
    return { method: 'mc', beta: b.beta, pf: b.pf, lowerBound: true, basis: `Monte Carlo with no failure in ${a.mc.samples} samples (one-sided 95 % bound)` };
  }
  return { ...g, ...(g.basis?.includes('upper bound') ? { lowerBound: true } : {}) };
}

export function assessmentReportInput(a: Assessment, meta: RunMeta): ReportInput {
  const s = a.scenario;
  const model = a.model;
  const meanOf = (path: string): number => {
    const i = model.names.indexOf(path);
    if (i >= 0) return model.dists[i].mean;
    const sc = listScalars(s).find((n) => n.path === path)?.scalar;
    return sc && sc.kind === 'fixed' ? sc.value : NaN;
  };
  const st = model.state(model.mean);
  const c = a.check;
  const f = a.form;
  const rel: ReportInput['reliability'] = {
    governing: governingForReport(a),
    agreement: { consistent: a.verdict.agree || !a.verdict.material, text: a.verdict.reason },
    target: {
      beta: s.targetBeta,
      source: targetSource(s),
      note: targetNote(s),
    },
  };
  if (a.combinations) {
    const c = a.combinations;
    rel.combinations = c.combinations.map((k, i) => ({ leading: k.leading, beta: k.form.beta, pf: k.form.pf, governing: i === c.governing }));
    rel.system = a.governing;
  }
  if (a.methods.includes('form')) {
    const byName = (v: number[]) => Object.fromEntries(f.names.map((n, i) => [n, v[i]]));
    rel.form = {
      beta: f.beta,
      pf: f.pf,
      converged: f.converged,
      iterations: f.iterations,
      calls: f.calls,
      designPoint: byName(f.designPointX),
      importance: byName(f.importance),
      history: f.history.map((h) => ({ iteration: h.iteration, beta: h.beta, g: h.g })),
    };
  }
  if (a.sorm) {
    const formula = { tvedt: 'Tvedt', 'hohenbichler-rackwitz': 'Hohenbichler–Rackwitz', breitung: 'Breitung', form: 'FORM, no valid curvature correction' }[a.sorm.used];
    rel.sorm = { beta: a.sorm.beta, pf: a.sorm.pf, calls: a.sorm.calls, curvatures: a.sorm.curvatures, formula };
  }
  if (a.is) rel.is = { beta: a.is.beta, pf: a.is.pf, cov: a.is.cov, calls: a.is.calls };
  if (a.mc) {
    rel.mc = {
      beta: a.mc.beta,
      pf: a.mc.pf,
      cov: a.mc.cov,
      samples: a.mc.samples,
      failures: a.mc.failures,
      ci95: a.mc.ci95,
      convergence: a.mc.trace,
      ...(a.mc.failures === 0 && a.mc.samples > 0 ? { zeroFailureBound: ((b) => ({ pf: b.pf, beta: b.beta }))(zeroFailureBound(a.mc.samples)) } : {}),
    };
  }
  if (a.combinations && rel.form) Object.assign(rel.form, { beta: a.combinations.formSystem.beta, pf: a.combinations.formSystem.pf });
  if (a.combinations?.sormSystem && rel.sorm) Object.assign(rel.sorm, { beta: a.combinations.sormSystem.beta, pf: a.combinations.sormSystem.pf });
  if (a.subset) rel.subset = { beta: a.subset.beta, pf: a.subset.pf, cov: a.subset.cov, calls: a.subset.calls, levels: a.subset.levels.length };

  const sens = a.sensitivity;
  const sensitivity: ReportInput['sensitivity'] = {
    utilization: { baseline: sens?.utilization?.baseline ?? c.utilization, rows: tornadoRows(sens?.utilization?.rows ?? []) },
    capacity: { baseline: sens?.capacity?.baseline ?? c.capacity, rows: tornadoRows(sens?.capacity?.rows ?? []) },
    conditionalBeta: {
      baseline: sens?.conditionalBeta?.baseline ?? f.beta,
      rows: (sens?.conditionalBeta?.rows ?? []).map((r) => ({ variable: r.variable, low: r.betaLow, high: r.betaHigh })),
    },
    importance: f.names.map((n, i) => ({ variable: n, alphaSquared: f.importance[i], alpha: f.alpha[i] })),
    elasticities: (sens?.elasticities?.entries ?? []).map((e) => ({ variable: e.variable, mean: e.meanElasticity, sd: e.sdElasticity })),
  };
  const sobolG = sens?.sobolG;
  if (sobolG) {
    sensitivity.sobol = {
      samples: sobolG.n,
      rows: sobolG.first.map((fi, i) => ({
        variable: fi.name,
        first: fi.value,
        firstCi95: [fi.lo, fi.hi] as [number, number],
        total: sobolG.total[i].value,
        totalCi95: [sobolG.total[i].lo, sobolG.total[i].hi] as [number, number],
      })),
    };
  }

  let restraint: ReportInput['restraint'];
  if (a.restraint) {
    const r = a.restraint;
    const pick = (rec: Record<string, number | null>) => ({ bottom: rec.bottom ?? undefined, top: rec.top ?? undefined });
    const required: { bottom?: number | null; top?: number | null } = {};
    for (const e of r.study.ends) {
      const v = r.study.required[e];
      (required as Record<string, number | null>)[e] = v === null || v === undefined || !Number.isFinite(v) ? null : v;
    }
    restraint = {
      ends: r.study.ends as ('bottom' | 'top')[],
      targetBeta: r.study.target,
      curve: r.study.curve.map((p) => ({
        factor: p.factor,
        stiffness: { bottom: p.stiffness.bottom, top: p.stiffness.top },
        beta: p.beta,
        pf: p.pf,
        ideal: p.ideal,
      })),
      required,
      fixityFactor: pick(r.fixityAtRequired) as { bottom?: number; top?: number },
      effectiveLengthFactor: r.kAtRequired,
      equivalentK: r.kDeterministic,
      sentence: r.sentence,
      givenSurvivedLoads: r.survival !== undefined,
      requirement: r.requirement
        ? Object.fromEntries(Object.entries(r.requirement).map(([e, q]) => [e, { mean: q.mean, cov: q.cov, characteristic: q.characteristic, design: q.design, alphaBasis: q.alphaBasis }]))
        : undefined,
      designK: r.kDesign,
      method: r.method,
      confirmation: r.confirmation ? { method: r.confirmation.method, beta: r.confirmation.beta, raisedBy: r.confirmation.raisedBy } : null,
      contour: r.maps?.contour
        ? {
            levels: r.maps.contour.levels,
            segments: r.maps.contour.segments,
            assessed: r.maps.contour.assessed,
            asymptotes: r.maps.contour.asymptotes,
            range: {
              bottom: [r.maps.contour.bottom[0], r.maps.contour.bottom[r.maps.contour.bottom.length - 1]],
              top: [r.maps.contour.top[0], r.maps.contour.top[r.maps.contour.top.length - 1]],
            },
            formAnalyses: r.maps.contour.calls,
          }
        : undefined,
      covCurve: covCurveInput(r),
      ...(r.axis
        ? { axis: { axis: r.axis.axis, basis: r.axis.basis, otherAxis: r.axis.other.axis, otherBeta: r.axis.other.beta, capsTarget: r.axis.other.capsTarget, classes: r.axis.jointClasses.map(jointClassRow) } }
        : {}),
    };
  }

  const cautions = [...a.warnings, ...(sens?.notes ?? []), ...(a.restraint?.notes ?? [])];
  if (a.interrupted) cautions.unshift('The run was interrupted: the simulation estimates cover only the samples done.');

  return {
    meta: {
      toolVersion: meta.version,
      seed: a.seed,
      scenarioSha256: s.sha256,
      date: meta.date,
      commandLine: meta.command,
      scenarioTitle: s.title,
      scenarioFile: s.fileName,
    },
    inputs: inputRows(s),
    ...(s.evidence ? { evidence: evidenceRows(s) } : {}),
    ...(a.measurements ? { measurements: measurementsReport(a.measurements, a) } : {}),
    ...(a.testPlans ? { testPlans: a.testPlans } : {}),
    ...(a.axes
      ? { axes: { governing: a.axes.governing, governingAtMeans: a.axes.governingAtMeans, y: { beta: a.axes.y.beta, pf: a.axes.y.pf }, z: { beta: a.axes.z.beta, pf: a.axes.z.pf } } }
      : {}),
    correlation: s.correlation.map((r) => ({ a: r.a, b: r.b, rho: r.rho })),
    column: {
      length: s.column.length,
      frame: s.column.frame,
      ends: {
        bottom: endDescription(s.column.ends.bottom, c.restraint_ratio.bottom, meanOf, 'column.ends.bottom'),
        top: endDescription(s.column.ends.top, c.restraint_ratio.top, meanOf, 'column.ends.top'),
      },
      lateralStiffness: s.column.ends.lateral === null ? undefined : meanOf('column.ends.lateral'),
      section: { area: st.A, inertia: st.I, sectionModulus: st.S },
      strengthModel: s.strength,
    },
    check: {
      criticalLoad: c.critical_load,
      effectiveLengthFactor: c.effective_length_factor,
      restraintRatio: c.restraint_ratio,
      fixityFactor: c.fixity_factor,
      capacity: c.capacity,
      demand: c.demand,
      utilization: c.utilization,
      modeShapes: c.modes.map((m) => ({
        mode: m.mode,
        criticalLoad: m.critical_load,
        points: m.shape,
        inflectionPoints: m.inflection_points.map((x) => x / s.column.length),
        effectiveLength: m.effective_length_from_inflections ? m.effective_length : null,
      })),
    },
    reliability: rel,
    sensitivity,
    restraint,
    partialFactors: partialFactors(a),
    resistanceFactor: {
      characteristic: a.characteristic.resistance.characteristic,
      design: a.characteristic.resistance.design,
      factor: a.characteristic.resistance.partialFactor,
      code: a.characteristic.resistance.code,
    },
    strengthModels: a.byStrengthModel?.map((m) => ({
      strength: m.strength,
      beta: m.beta,
      modelFactorMean: m.modelFactor.mean,
      modelFactorCov: m.modelFactor.cov,
      modelFactorSource: m.modelFactor.source,
      chosen: m.chosen,
      note: m.note,
    })),
    modelFactor: { ...a.modelFactor },
    connections: {
      atMean: connectionValues(c.connections),
      atDesignPoint: ((m) => (m ? connectionValues(m) : undefined))(designPointConnections(a)),
      classes: c.jointClasses.map(jointClassRow),
      strengthUsesBow: strengthUsesBow(s.strength),
    },
    samples: {
      resistance: a.samples.resistance,
      demand: a.samples.demand,
      totalSamples: a.samples.resistance.length,
      designPoint: a.samples.designPoint,
    },
    cautions,
  };
}

function jointClassRow(j: EndClassification): JointClassRow {
  return {
    end: j.end,
    rule: j.rule,
    stiffnessMean: j.stiffnessMean,
    stiffnessLow: j.stiffnessLow,
    classAtMean: j.classAtMean,
    classAtLow: j.classAtLow,
    rigidFrom: j.boundaries ? j.boundaries.rigidFrom : null,
    pinnedUpTo: j.boundaries ? j.boundaries.pinnedUpTo : null,
    note: j.note,
  };
}

/** The required-stiffness-against-CoV curve of the first studied end that is random. */
function covCurveInput(r: ColumnRestraintResult): NonNullable<ReportInput['restraint']>['covCurve'] {
  const c = r.maps?.covCurve;
  if (!c) return undefined;
  const end = r.study.ends.find((e) => r.base[e]?.kind === 'random') as 'bottom' | 'top' | undefined;
  if (!end) return undefined;
  return {
    end,
    assessedCov: c.assessedCov,
    formAnalyses: c.calls,
    points: c.points.map((p) => ({ cov: p.cov, mean: p.mean[end] ?? null, characteristic: p.characteristic[end] ?? null })),
  };
}
