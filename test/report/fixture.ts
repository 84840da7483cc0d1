/**
 * A DEMO report input with INVENTED numbers, shaped like a real `assess` run on a 6 m braced
 * column with a base-plate spring at the bottom and a pin at the top. The mode shapes are
 * the exact pinned/spring shapes for the stated R; everything else is made up to look
 * plausible. Nothing here is a check value.
 */
import type { ModeShapeData, ReportInput, SweepResults } from '../../src/report/reportInput.js';
import { targetCrossings } from '../../src/studies/targetCrossing.js';

const L = 6.0;
const EI = 200e9 * 25.1e-6;
const K_BOTTOM = 2.5e6;
const R_BOTTOM = (K_BOTTOM * L) / EI;

/** Roots of φ² sin φ = R (φ cos φ − sin φ): braced column, pinned top, spring bottom (R in ξ units). */
function pinnedSpringRoot(R: number, lo: number, hi: number): number {
  const f = (p: number) => p * p * Math.sin(p) - R * (p * Math.cos(p) - Math.sin(p));
  let a = lo;
  let b = hi;
  const fa = f(a);
  for (let i = 0; i < 200; i++) {
    const m = 0.5 * (a + b);
    if (f(m) > 0 === fa > 0) a = m;
    else b = m;
  }
  return 0.5 * (a + b);
}

/** w(ξ) = sin(φ s) − s sin φ with s = 1 − ξ, normalised to max|w| = 1. */
function pinnedSpringMode(mode: number, phi: number): ModeShapeData {
  const raw = Array.from({ length: 121 }, (_, i) => {
    const xi = i / 120;
    const s = 1 - xi;
    return { xi, w: Math.sin(phi * s) - s * Math.sin(phi) };
  });
  const peak = raw.reduce((m, p) => (Math.abs(p.w) > Math.abs(m) ? p.w : m), 0);
  const points = raw.map((p) => ({ xi: p.xi, w: p.w / peak }));
  const inflectionPoints: number[] = [];
  for (let k = 0; k * Math.PI <= phi; k++) inflectionPoints.push(1 - (k * Math.PI) / phi); // curvature ∝ sin(φ s) = 0
  return {
    mode,
    criticalLoad: (phi * phi * EI) / (L * L),
    points,
    inflectionPoints: inflectionPoints.sort((a, b) => a - b),
    effectiveLength: (Math.PI / phi) * L,
  };
}

/** Low-discrepancy fractions (golden-ratio family): deterministic, no random numbers. */
function fraction(i: number, step: number): number {
  const x = (i + 0.5) * step;
  return x - Math.floor(x);
}

/** A logistic stand-in for a standard normal quantile; good enough for a demo picture. */
function bell(p: number): number {
  return (Math.log(p / (1 - p)) * Math.sqrt(3)) / Math.PI;
}

function demoSamples(n: number) {
  const resistance: number[] = [];
  const demand: number[] = [];
  const gumbelScale = (60e3 * Math.sqrt(6)) / Math.PI;
  const gumbelLoc = 240e3 - 0.5772156649 * gumbelScale;
  for (let i = 0; i < n; i++) {
    resistance.push(1.589e6 * Math.exp(0.11 * bell(fraction(i, 0.6180339887)) - 0.006));
    const dead = 760e3 + 76e3 * bell(fraction(i, 0.7548776662));
    const imposed = gumbelLoc - gumbelScale * Math.log(-Math.log(fraction(i, 0.569840291)));
    demand.push(dead + imposed);
  }
  return { resistance, demand };
}

function demoConvergence() {
  const pf = 7.05e-4;
  const trace: { samples: number; pf: number; lo: number; hi: number }[] = [];
  let k = 0;
  for (let decade = 1e3; decade <= 1e6; decade *= 10) {
    for (const m of [1, 2, 5]) {
      const n = decade * m;
      if (n > 1e6) break;
      const est = Math.max(0, pf * (1 + (0.9 * Math.sin(1.7 * k++)) / Math.sqrt(n * pf)));
      const half = 1.96 * Math.sqrt(Math.max(est, 1 / n) / n);
      trace.push({ samples: n, pf: est, lo: Math.max(0, est - half), hi: est + half });
    }
  }
  return trace;
}

const phi1 = pinnedSpringRoot(R_BOTTOM, Math.PI + 1e-9, 4.4934);
const phi2 = pinnedSpringRoot(R_BOTTOM, 2 * Math.PI + 1e-9, 7.7252);

const DESIGN_POINT = {
  'column.material.E': 197.2e9,
  'column.material.fy': 281.9e6,
  'column.ends.bottom.rotation': 0.963e6,
  'column.imperfection.bow': 0.00593,
  'loads.dead': 840.9e3,
  'loads.imposed': 344.9e3,
  model_factor: 0.96,
};

export function demoSweep1D(): SweepResults {
  const lengths = [4.5, 5.0, 5.5, 6.0, 6.5, 7.0, 7.5];
  const betas = [4.31, 4.02, 3.63, 3.21, 2.78, 2.36, 1.97];
  // Φ(−β) for the betas above, rounded (invented demo rows, values from a normal table)
  const PF_OF_BETA = [8.2e-6, 2.9e-5, 1.42e-4, 6.64e-4, 2.72e-3, 9.15e-3, 2.44e-2];
  return {
    varied: [{ path: 'column.length', kind: 'length' }],
    method: 'form',
    rows: lengths.map((l, i) => ({ values: { 'column.length': l }, beta: betas[i], pf: PF_OF_BETA[i], utilization: 0.45 + 0.03 * i })),
    meeting: { count: betas.filter((b) => b >= 3.8).length, total: betas.length },
    crossings: targetCrossings(lengths, betas, 3.8),
  };
}

export function demoSweep2D(): SweepResults {
  const lengths = [5.0, 5.5, 6.0, 6.5, 7.0];
  const stiffness = [1.25e6, 2.5e6, 5e6, 10e6];
  const rows = lengths.flatMap((l, i) =>
    stiffness.map((k, j) => ({
      values: { 'column.length': l, 'column.ends.bottom.rotation': k },
      beta: 4.02 - 0.42 * i + 0.45 * j - 0.04 * i * j,
      pf: 1e-3, // not shown by the heat map
      utilization: 0.5 + 0.05 * i - 0.03 * j,
    })),
  );
  return {
    varied: [
      { path: 'column.length', kind: 'length' },
      { path: 'column.ends.bottom.rotation', kind: 'rotationalStiffness' },
    ],
    method: 'form',
    rows,
    meeting: { count: rows.filter((r) => r.beta >= 3.8).length, total: rows.length },
    crossings: [],
  };
}

export function demoReportInput(): ReportInput {
  const samples = demoSamples(5000);
  const restraintFactors = [0.125, 0.25, 0.5, 1, 2, 4, 8, 16];
  const restraintBetas = [1.78, 2.1, 2.62, 3.21, 3.68, 3.98, 4.15, 4.24];
  const restraintPfs = [3.75e-2, 1.79e-2, 4.4e-3, 6.64e-4, 1.17e-4, 3.45e-5, 1.66e-5, 1.12e-5]; // ≈ Φ(−β), demo
  return {
    meta: {
      toolVersion: '0.1.0',
      seed: 20261201,
      scenarioSha256: '3f1c0d9a5b7e2c4f6a8d0b1e3c5f7a9d2b4e6c8f0a1d3b5e7c9f2a4d6b8e0c1f',
      date: '2026-12-01T18:40:00Z',
      commandLine: 'stanchion assess scenarios/demo-mezzanine.yaml --out reports/demo --seed 20261201',
      scenarioTitle: 'DEMO: cold-store mezzanine, column M4 (invented numbers)',
      scenarioFile: 'demo-mezzanine.yaml',
    },
    inputs: [
      { path: 'column.length', description: 'Column length', kind: 'length', distribution: 'fixed', parameters: { value: L }, asWritten: '6.0 m' },
      { path: 'column.section.area', description: 'Cross-section area', kind: 'area', distribution: 'fixed', parameters: { value: 7640e-6 } },
      { path: 'column.section.inertia', description: 'Second moment of area, buckling axis', kind: 'inertia', distribution: 'fixed', parameters: { value: 25.1e-6 } },
      { path: 'column.section.section_modulus', description: 'Elastic section modulus, buckling axis', kind: 'sectionModulus', distribution: 'fixed', parameters: { value: 281e-6 } },
      { path: 'column.material.E', description: "Young's modulus", kind: 'stress', distribution: 'lognormal', parameters: { mean: 200e9, cov: 0.03, sd: 6e9 } },
      { path: 'column.material.fy', description: 'Yield strength', kind: 'stress', distribution: 'lognormal', parameters: { mean: 310e6, cov: 0.07, sd: 21.7e6 } },
      { path: 'column.ends.bottom.rotation', description: 'Rotational stiffness of the base plate', kind: 'rotationalStiffness', distribution: 'lognormal', parameters: { mean: 2.5e6, cov: 0.5, sd: 1.25e6 }, asWritten: '2.5 MN m/rad' },
      { path: 'column.imperfection.bow', description: 'Initial bow amplitude', kind: 'length', distribution: 'normal', parameters: { mean: L / 1500, sd: L / 3000, cov: 0.5 }, asWritten: 'L/1500, sd L/3000' },
      { path: 'loads.dead', description: 'Dead load', kind: 'force', distribution: 'normal', parameters: { mean: 760e3, cov: 0.1, sd: 76e3 } },
      { path: 'loads.imposed', description: 'Imposed load, 50-year maximum', kind: 'force', distribution: 'gumbel', parameters: { mean: 240e3, cov: 0.25, sd: 60e3 } },
      { path: 'model_factor', description: 'Model uncertainty on the capacity', kind: 'dimensionless', distribution: 'lognormal', parameters: { mean: 1.0, cov: 0.05, sd: 0.05 } },
    ],
    correlation: [{ a: 'column.material.E', b: 'column.material.fy', rho: 0.2 }],
    column: {
      length: L,
      frame: 'braced',
      ends: {
        bottom: { type: 'spring', stiffness: K_BOTTOM, R: R_BOTTOM, fixity: R_BOTTOM / (R_BOTTOM + 3), random: true },
        top: { type: 'pinned', R: 0, fixity: 0 },
      },
      section: { area: 7640e-6, inertia: 25.1e-6, sectionModulus: 281e-6 },
      strengthModel: 'first-yield',
    },
    check: {
      criticalLoad: (phi1 * phi1 * EI) / (L * L),
      effectiveLengthFactor: Math.PI / phi1,
      restraintRatio: { bottom: R_BOTTOM, top: 0 },
      fixityFactor: { bottom: R_BOTTOM / (R_BOTTOM + 3), top: 0 },
      capacity: 1.589e6,
      demand: 1.0e6,
      utilization: 1.0e6 / 1.589e6,
      modeShapes: [pinnedSpringMode(1, phi1), pinnedSpringMode(2, phi2)],
    },
    reliability: {
      form: {
        beta: 3.21,
        pf: 6.64e-4,
        converged: true,
        iterations: 5,
        calls: 48,
        designPoint: DESIGN_POINT,
        importance: {
          'column.ends.bottom.rotation': 0.31,
          'loads.imposed': 0.24,
          'column.material.fy': 0.17,
          'loads.dead': 0.11,
          'column.imperfection.bow': 0.09,
          model_factor: 0.06,
          'column.material.E': 0.02,
        },
        history: [
          { iteration: 0, beta: 0, g: 589e3 },
          { iteration: 1, beta: 2.71, g: 62e3 },
          { iteration: 2, beta: 3.16, g: 4.1e3 },
          { iteration: 3, beta: 3.205, g: 210 },
          { iteration: 4, beta: 3.2098, g: 3 },
          { iteration: 5, beta: 3.21, g: 0.01 },
        ],
      },
      sorm: { beta: 3.18, pf: 7.36e-4, calls: 56 },
      is: { beta: 3.19, pf: 7.2e-4, cov: 0.031, calls: 12000 },
      mc: {
        beta: 3.194,
        pf: 7.05e-4,
        cov: 0.0377,
        samples: 1_000_000,
        failures: 705,
        ci95: [6.53e-4, 7.57e-4],
        convergence: demoConvergence(),
      },
      subset: { beta: 3.2, pf: 6.9e-4, cov: 0.12, calls: 4000, levels: 4 },
      governing: { method: 'mc', beta: 3.194, pf: 7.05e-4 },
      agreement: {
        consistent: true,
        text: 'SORM, importance sampling, subset simulation and Monte Carlo agree within their 95 % intervals (pf 6.9–7.4 × 10⁻⁴); FORM is 6 % unconservative on pf, as expected for a mildly curved limit state.',
      },
      target: { beta: 3.8, source: 'EN 1990 Annex C', note: 'RC2, 50-year reference period' },
    },
    sensitivity: {
      utilization: {
        baseline: 1.0e6 / 1.589e6,
        rows: [
          { variable: 'loads.dead', low: 0.55, high: 0.71 },
          { variable: 'column.ends.bottom.rotation', low: 0.7, high: 0.58 },
          { variable: 'loads.imposed', low: 0.59, high: 0.7 },
          { variable: 'model_factor', low: 0.68, high: 0.58 },
          { variable: 'column.material.fy', low: 0.68, high: 0.59 },
          { variable: 'column.imperfection.bow', low: 0.58, high: 0.67 },
          { variable: 'column.material.E', low: 0.64, high: 0.62 },
        ],
      },
      capacity: {
        baseline: 1.589e6,
        rows: [
          { variable: 'column.ends.bottom.rotation', low: 1.43e6, high: 1.72e6 },
          { variable: 'column.imperfection.bow', low: 1.72e6, high: 1.49e6 },
          { variable: 'column.material.fy', low: 1.47e6, high: 1.69e6 },
          { variable: 'column.material.E', low: 1.56e6, high: 1.61e6 },
          { variable: 'loads.dead', low: 1.589e6, high: 1.589e6 },
          { variable: 'loads.imposed', low: 1.589e6, high: 1.589e6 },
          { variable: 'model_factor', low: 1.589e6, high: 1.589e6 },
        ],
      },
      conditionalBeta: {
        baseline: 3.194,
        rows: [
          { variable: 'column.ends.bottom.rotation', low: 2.52, high: 3.79 },
          { variable: 'loads.dead', low: 3.71, high: 2.55 },
          { variable: 'loads.imposed', low: 3.52, high: 2.71 },
          { variable: 'column.material.fy', low: 2.78, high: 3.55 },
          { variable: 'column.imperfection.bow', low: 3.49, high: 2.84 },
          { variable: 'model_factor', low: 2.86, high: 3.46 },
          { variable: 'column.material.E', low: 3.13, high: 3.23 },
        ],
      },
      importance: [
        { variable: 'column.ends.bottom.rotation', alphaSquared: 0.31, alpha: -0.557 },
        { variable: 'loads.imposed', alphaSquared: 0.24, alpha: 0.49 },
        { variable: 'column.material.fy', alphaSquared: 0.17, alpha: -0.412 },
        { variable: 'loads.dead', alphaSquared: 0.11, alpha: 0.332 },
        { variable: 'column.imperfection.bow', alphaSquared: 0.09, alpha: 0.3 },
        { variable: 'model_factor', alphaSquared: 0.06, alpha: -0.245 },
        { variable: 'column.material.E', alphaSquared: 0.02, alpha: -0.141 },
      ],
      elasticities: [
        { variable: 'column.ends.bottom.rotation', mean: 0.38, sd: -0.21 },
        { variable: 'loads.imposed', mean: -0.71, sd: -0.33 },
        { variable: 'column.material.fy', mean: 1.62, sd: -0.12 },
        { variable: 'loads.dead', mean: -1.91, sd: -0.08 },
        { variable: 'column.imperfection.bow', mean: -0.12, sd: -0.07 },
        { variable: 'model_factor', mean: 1.71, sd: -0.04 },
        { variable: 'column.material.E', mean: 0.3, sd: -0.01 },
      ],
      sobol: {
        samples: 200_000,
        rows: [
          { variable: 'loads.dead', first: 0.25, firstCi95: [0.23, 0.27], total: 0.28, totalCi95: [0.26, 0.3] },
          { variable: 'column.ends.bottom.rotation', first: 0.22, firstCi95: [0.2, 0.24], total: 0.27, totalCi95: [0.25, 0.29] },
          { variable: 'loads.imposed', first: 0.17, firstCi95: [0.15, 0.19], total: 0.19, totalCi95: [0.17, 0.21] },
          { variable: 'model_factor', first: 0.1, firstCi95: [0.08, 0.12], total: 0.11, totalCi95: [0.09, 0.13] },
          { variable: 'column.material.fy', first: 0.09, firstCi95: [0.07, 0.11], total: 0.1, totalCi95: [0.08, 0.12] },
          { variable: 'column.imperfection.bow', first: 0.08, firstCi95: [0.06, 0.1], total: 0.1, totalCi95: [0.08, 0.12] },
          { variable: 'column.material.E', first: 0.01, firstCi95: [0, 0.03], total: 0.01, totalCi95: [0, 0.03] },
        ],
      },
    },
    restraint: {
      ends: ['bottom'],
      targetBeta: 3.8,
      curve: [
        { factor: 0, stiffness: { bottom: 0 }, beta: 1.42, pf: 7.78e-2, ideal: 'pinned' },
        ...restraintFactors.map((f, i) => ({ factor: f, stiffness: { bottom: K_BOTTOM * f }, beta: restraintBetas[i], pf: restraintPfs[i] })),
        { factor: Infinity, stiffness: { bottom: Infinity }, beta: 4.33, pf: 7.45e-6, ideal: 'fixed' as const },
      ],
      required: { bottom: 6.6e6 },
      fixityFactor: { bottom: 0.724 },
      effectiveLengthFactor: 0.76,
      equivalentK: 0.78,
      sentence:
        'The target β = 3.8 (EN 1990 Annex C) is met when the mean rotational stiffness of the bottom end is at least 6600 kN·m/rad (R = 7.9, fixity factor 0.72), 2.6 times the 2500 kN·m/rad assessed; a deterministic check would need K ≤ 0.78.',
    },
    partialFactors: [
      { variable: 'column.material.fy', kind: 'stress', role: 'resistance', adverse: 'low', basis: 'characteristic', referenceValue: 275.6e6, designValue: 281.9e6, factor: 275.6 / 281.9, note: 'characteristic = 5 % fractile' },
      { variable: 'column.material.E', kind: 'stress', role: 'resistance', adverse: 'low', basis: 'mean', referenceValue: 200e9, designValue: 197.2e9, factor: 200 / 197.2 },
      { variable: 'column.ends.bottom.rotation', kind: 'rotationalStiffness', role: 'resistance', adverse: 'low', basis: 'mean', referenceValue: 2.5e6, designValue: 0.963e6, factor: 2.5 / 0.963 },
      { variable: 'column.imperfection.bow', kind: 'length', role: 'imperfection', adverse: 'high', basis: 'mean', referenceValue: 0.004, designValue: 0.00593, factor: 0.00593 / 0.004 },
      { variable: 'loads.dead', kind: 'force', role: 'load', adverse: 'high', basis: 'characteristic', referenceValue: 760e3, designValue: 840.9e3, factor: 840.9 / 760, note: 'characteristic = mean (EN 1990 4.1.2)' },
      { variable: 'loads.imposed', kind: 'force', role: 'load', adverse: 'high', basis: 'mean', referenceValue: 240e3, designValue: 344.9e3, factor: 344.9 / 240 },
      { variable: 'model_factor', kind: 'dimensionless', role: 'model', adverse: 'low', basis: 'mean', referenceValue: 1.0, designValue: 0.96, factor: 1 / 0.96 },
    ],
    strengthModels: [
      { strength: 'first-yield', beta: 3.91, modelFactorMean: 1, modelFactorCov: 0.1, modelFactorSource: 'default', chosen: true },
      { strength: 'en1993-b', beta: 3.4, modelFactorMean: 1.1, modelFactorCov: 0.07, modelFactorSource: 'default', chosen: false },
    ],
    modelFactor: { source: 'default', strength: 'first-yield', dist: 'lognormal', mean: 1, cov: 0.1, reference: 'an invented reference for the fixture' },
    samples: { ...samples, totalSamples: 1_000_000, designPoint: { resistance: 1.1858e6, demand: 1.1858e6 } },
    sweep: demoSweep1D(),
    cautions: [
      'The bottom-end stiffness (CoV 0.5) carries 31 % of the importance: its statistics drive the answer; test or bound them before relying on β.',
      'β falls short of the target; the restraint study gives the stiffness that would be needed.',
    ],
  };
}

/** The contract JSON (docs/json-output.md) the lead would pass alongside the demo input. */
export function demoResultJson(input: ReportInput): Record<string, unknown> {
  const r = input.reliability;
  return {
    check: {
      critical_load: input.check.criticalLoad,
      effective_length_factor: input.check.effectiveLengthFactor,
      restraint_ratio: input.check.restraintRatio,
      capacity: input.check.capacity,
      demand: input.check.demand,
      utilization: input.check.utilization,
    },
    reliability: {
      form: r.form && { beta: r.form.beta, pf: r.form.pf, converged: r.form.converged, design_point: r.form.designPoint, importance: r.form.importance },
      sorm: r.sorm && { beta: r.sorm.beta, pf: r.sorm.pf },
      is: r.is && { pf: r.is.pf, cov: r.is.cov, calls: r.is.calls },
      mc: r.mc && { pf: r.mc.pf, cov: r.mc.cov, samples: r.mc.samples, failures: r.mc.failures, ci95: r.mc.ci95 },
      subset: r.subset && { pf: r.subset.pf, cov: r.subset.cov, calls: r.subset.calls },
    },
    sensitivity: { tornado: input.sensitivity.utilization.rows },
    meta: { version: input.meta.toolVersion, seed: input.meta.seed, scenario_sha256: input.meta.scenarioSha256 },
  };
}
