/**
 * Valid scenarios, generated from a seed, and one run of everything `check` and `assess` do on
 * each. Shared by the property test (test/scenario/validScenarios.test.ts, a short run) and
 * `npm run bench -- valid` (a long one). Every outcome must be a result or an InputError; anything
 * else is an internal error and is returned with the scenario text so that it can be replayed.
 *
 * The scenarios are invented: each draw picks every input form the reader accepts (all seven
 * distributions where the field allows them, pinned/fixed/rotation/fixity/alignment_g ends, lateral
 * springs, braced and sway frames, every strength model, correlations), over wide ranges, up to
 * certain failure and impossible failure.
 */
import { stringify } from 'yaml';
import { uniformStream } from '../src/probability/rng.js';
import { loadScenario } from '../src/scenario/loadScenario.js';
import { InputError } from '../src/scenario/inputError.js';
import { DistributionError } from '../src/probability/distribution.js';
import { buildColumnModel } from '../src/limitState/columnModel.js';
import { checkJson, deterministicCheck } from '../src/limitState/deterministicCheck.js';
import { assessColumn } from '../src/studies/columnAssessment.js';
import { assessmentJson } from '../src/studies/assessmentJson.js';
import { assessmentReportInput } from '../src/studies/assessmentReport.js';
import { buildReportDocument } from '../src/report/reportSections.js';
import { renderReportFiles } from '../src/report/writeOutputs.js';
import { renderMarkdown } from '../src/report/markdownReport.js';
import { formatAssessment } from '../src/cli/assessSummary.js';
import { formatCheck } from '../src/cli/checkCommand.js';
import { predictedReading } from '../src/limitState/measurementModel.js';
import { randomVariables } from '../src/scenario/variables.js';
import type { Measurement } from '../src/scenario/types.js';
import { updateScenarioWithEvidence } from '../src/studies/measurementUpdate.js';
import { planTests } from '../src/studies/testPlanning.js';
import { planTestsJson } from '../src/studies/testPlanJson.js';
import { formatPlanTests } from '../src/cli/planTestsCommand.js';
import { columnRestraint, restraintJson } from '../src/studies/columnRestraint.js';
import { governingAssessor } from '../src/studies/columnAssessment.js';

type Draw = () => number;

const STRENGTHS = ['first-yield', 'aisc360-e3', 'en1993-a0', 'en1993-a', 'en1993-b', 'en1993-c', 'en1993-d'] as const;

function pick<T>(u: Draw, items: readonly T[]): T {
  return items[Math.min(items.length - 1, Math.floor(u() * items.length))]!;
}

/** 10^(a + (b − a)·U): a log-uniform magnitude. */
function logUniform(u: Draw, a: number, b: number): number {
  return 10 ** (a + (b - a) * u());
}

function num(x: number): string {
  return Number(x.toPrecision(4)).toString();
}

/**
 * A random value that can never go below zero (section, material, springs): lognormal, weibull,
 * truncnormal with min >= 0, uniform or beta with min >= 0; or a fixed value.
 */
function positiveValue(u: Draw, mean: number, unit: string, fixedShare = 0.4): unknown {
  if (u() < fixedShare) return `${num(mean)} ${unit}`;
  const cov = pick(u, [0.02, 0.1, 0.3, 0.6, 1.2]);
  const m = `${num(mean)} ${unit}`;
  switch (pick(u, ['lognormal', 'weibull', 'truncnormal', 'uniform', 'beta'] as const)) {
    case 'lognormal':
      return { dist: 'lognormal', mean: m, cov };
    case 'weibull':
      return { dist: 'weibull', mean: m, cov: Math.min(cov, 1) };
    case 'truncnormal':
      return { dist: 'truncnormal', mean: m, sd: `${num(mean * cov)} ${unit}`, min: `${num(u() < 0.5 ? 0 : mean * 0.5)} ${unit}` };
    case 'uniform':
      return { dist: 'uniform', min: `${num(u() < 0.3 ? 0 : mean * (1 - Math.min(cov, 0.9)))} ${unit}`, max: `${num(mean * (1 + Math.min(cov, 0.9)))} ${unit}` };
    case 'beta':
      return { dist: 'beta', min: `0 ${unit}`, max: `${num(2 * mean)} ${unit}`, mean: m, sd: `${num(mean * Math.min(cov, 0.5))} ${unit}` };
  }
}

/** A load: any of the seven distributions (a sampled negative load is a tension). */
function loadValue(u: Draw, mean: number): unknown {
  const m = `${num(mean)} kN`;
  const cov = pick(u, [0.05, 0.1, 0.25, 0.5, 1]);
  switch (pick(u, ['fixed', 'normal', 'gumbel', 'lognormal', 'weibull', 'uniform', 'truncnormal', 'beta'] as const)) {
    case 'fixed':
      return m;
    case 'normal':
      return { dist: 'normal', mean: m, cov };
    case 'gumbel':
      return { dist: 'gumbel', mean: m, cov };
    case 'lognormal':
      return { dist: 'lognormal', mean: m, cov };
    case 'weibull':
      return { dist: 'weibull', mean: m, cov };
    case 'uniform':
      return { dist: 'uniform', min: `${num(mean * (1 - cov))} kN`, max: `${num(mean * (1 + cov))} kN` };
    case 'truncnormal':
      return { dist: 'truncnormal', mean: m, sd: `${num(mean * cov)} kN`, ...(u() < 0.5 ? { min: '0 kN' } : { max: `${num(mean * 3)} kN` }) };
    case 'beta':
      return { dist: 'beta', min: '0 kN', max: `${num(mean * 3)} kN`, mean: m, sd: `${num(mean * Math.min(cov, 0.5))} kN` };
  }
}

/** A fixity factor: fixed in [0, 1), or uniform / beta / truncnormal inside [0, 1] (bounds included). */
function fixityValue(u: Draw): unknown {
  const lo = pick(u, [0, 0, 0.1, 0.45, 0.9]);
  const hi = Math.max(lo + 0.05, pick(u, [0.5, 0.75, 0.95, 1, 1]));
  const mid = (lo + hi) / 2;
  switch (pick(u, ['fixed', 'edge', 'uniform', 'beta', 'truncnormal'] as const)) {
    case 'fixed':
      return Number(u().toFixed(3)) % 1;
    case 'edge':
      return pick(u, [0, 0.999999]);
    case 'uniform':
      return { dist: 'uniform', min: lo, max: hi };
    case 'beta':
      return { dist: 'beta', min: lo, max: hi, mean: mid, sd: (hi - lo) * pick(u, [0.05, 0.2, 0.45]) };
    case 'truncnormal':
      return { dist: 'truncnormal', min: lo, max: hi, mean: mid, sd: pick(u, [0.01, 0.2, 1]) };
  }
}

/** An alignment-chart G: fixed (0 to 1e300) or a distribution that stays >= 0. */
function alignmentValue(u: Draw): unknown {
  switch (pick(u, ['fixed', 'extreme', 'lognormal', 'weibull', 'uniform'] as const)) {
    case 'fixed':
      return Number(logUniform(u, -3, 3).toPrecision(3));
    case 'extreme':
      return pick(u, [0, 1e-300, 1e300, 1e30]);
    case 'lognormal':
      return { dist: 'lognormal', mean: Number(logUniform(u, -2, 2).toPrecision(3)), cov: pick(u, [0.1, 0.5, 2]) };
    case 'weibull':
      return { dist: 'weibull', mean: Number(logUniform(u, -2, 2).toPrecision(3)), cov: pick(u, [0.1, 0.5, 1]) };
    case 'uniform':
      return { dist: 'uniform', min: 0, max: Number(logUniform(u, -2, 2).toPrecision(3)) };
  }
}

function endValue(u: Draw, EI: number, L: number): unknown {
  switch (pick(u, ['pinned', 'fixed', 'rotation', 'rotation', 'fixity', 'alignment_g'] as const)) {
    case 'pinned':
      return 'pinned';
    case 'fixed':
      return 'fixed';
    case 'rotation': {
      // R = kL/EI from next to nothing (a near-mechanism) to next to rigid
      const k = (logUniform(u, -6, 4) * EI) / L;
      return { rotation: u() < 0.1 ? '0 kN m/rad' : positiveValue(u, k / 1e3, 'kN m/rad') };
    }
    case 'fixity':
      return { fixity: fixityValue(u) };
    case 'alignment_g':
      return { alignment_g: alignmentValue(u) };
  }
}

/** A sway column needs some stiffness against sway: two pinned ends and no lateral spring get a fixed base. */
function swayStable(ends: Record<string, unknown>, frame: 'braced' | 'sway'): Record<string, unknown> {
  const noLateral = ends['lateral'] === undefined || ends['lateral'] === '0 kN/m';
  const free = (e: unknown) => e === 'pinned' || JSON.stringify(e) === '{"fixity":0}' || JSON.stringify(e) === '{"rotation":"0 kN m/rad"}';
  return frame === 'sway' && noLateral && free(ends['bottom']) && free(ends['top']) ? { ...ends, bottom: 'fixed' } : ends;
}

/** A value of either sign (actions, eccentricities, out-of-plumb): fixed, normal, gumbel or uniform. */
function signedValue(u: Draw, mean: number, unit: string): unknown {
  const m = `${num(mean)}${unit ? ` ${unit}` : ''}`;
  const q = (x: number) => (unit ? `${num(x)} ${unit}` : Number(num(x)));
  const sd = Math.abs(mean) * pick(u, [0.1, 0.3, 1]);
  switch (pick(u, ['fixed', 'fixed', 'normal', 'gumbel', 'uniform'] as const)) {
    case 'fixed':
      return unit ? m : Number(num(mean));
    case 'normal':
      return { dist: 'normal', mean: unit ? m : Number(num(mean)), sd: q(sd) };
    case 'gumbel':
      return { dist: 'gumbel', mean: unit ? m : Number(num(mean)), sd: q(sd) };
    case 'uniform':
      return { dist: 'uniform', min: q(mean - sd), max: q(mean + sd) };
  }
}

/** A section by its dimensions (docs/sections.md), with its approximate A, I_y and I_z (SI) for the loads and springs. */
interface DrawnSection {
  yaml: Record<string, unknown>;
  A: number;
  Iy: number;
  Iz: number;
  /** half the thinnest plate, m: a mean corrosion loss stays below it */
  halfPlate: number;
  shape: 'i' | 'rhs' | 'chs' | 'rect';
}

function mm(x: number): string {
  return `${num(x * 1e3)} mm`;
}

function drawnSection(u: Draw, steel: boolean): DrawnSection {
  const shape = steel ? pick(u, ['i', 'i', 'rhs', 'chs'] as const) : 'rect';
  switch (shape) {
    case 'i': {
      const h = logUniform(u, -1, -0.1); // 100 mm to 800 mm
      const b = h * pick(u, [0.5, 0.75, 1]);
      const tf = h * pick(u, [0.04, 0.06, 0.08]);
      const tw = tf * pick(u, [0.5, 0.6, 0.8]);
      const r = u() < 0.3 ? 0 : tw * pick(u, [1, 1.5, 2]);
      const hw = h - 2 * tf;
      return {
        yaml: { shape: 'i', h: mm(h), b: mm(b), tw: mm(tw), tf: mm(tf), ...(r > 0 ? { r: mm(r) } : {}) },
        A: 2 * b * tf + hw * tw,
        Iy: (b * h ** 3 - (b - tw) * hw ** 3) / 12,
        Iz: (2 * tf * b ** 3) / 12,
        halfPlate: Math.min(tf, tw) / 2,
        shape,
      };
    }
    case 'rhs': {
      const h = logUniform(u, -1.3, -0.4); // 50 mm to 400 mm
      const b = h * pick(u, [0.5, 1]);
      const t = Math.min(b, h) * pick(u, [0.03, 0.06, 0.1]);
      const finish = pick(u, ['hot', 'cold', undefined] as const);
      return {
        yaml: { shape: 'rhs', h: mm(h), b: mm(b), t: mm(t), ...(finish ? { finish } : {}) },
        A: 2 * t * (b + h - 2 * t),
        Iy: (b * h ** 3 - (b - 2 * t) * (h - 2 * t) ** 3) / 12,
        Iz: (h * b ** 3 - (h - 2 * t) * (b - 2 * t) ** 3) / 12,
        halfPlate: t / 2,
        shape,
      };
    }
    case 'chs': {
      const D = logUniform(u, -1.4, -0.3); // 40 mm to 500 mm
      const t = D * pick(u, [0.02, 0.05, 0.1]);
      const I = (Math.PI * (D ** 4 - (D - 2 * t) ** 4)) / 64;
      return { yaml: { shape: 'chs', D: mm(D), t: mm(t) }, A: Math.PI * (D - t) * t, Iy: I, Iz: I, halfPlate: t / 2, shape };
    }
    case 'rect': {
      const b = logUniform(u, -1.3, -0.5); // 50 mm to 320 mm
      const h = b * pick(u, [1, 1.5, 2, 3]);
      return { yaml: { shape: 'rect', b: mm(b), h: mm(h) }, A: b * h, Iy: (b * h ** 3) / 12, Iz: (h * b ** 3) / 12, halfPlate: b / 2, shape };
    }
  }
}

/** A corrosion loss below half the thinnest plate (every plate stands at the mean), maybe in a zone near the base. */
function corrosionValue(u: Draw, sec: DrawnSection, L: number): Record<string, unknown> {
  const loss = () => positiveValue(u, sec.halfPlate * pick(u, [0.05, 0.2, 0.5, 0.8]) * 1e3, 'mm', 0.4);
  const out: Record<string, unknown> = sec.shape === 'i' && u() < 0.4 ? { flange: loss(), web: loss() } : { loss: loss() };
  if (u() < 0.5) out['zone'] = { height: `${num(L * pick(u, [0.05, 0.2, 0.5, 1]))} m` };
  return out;
}

/** Actions on a load of mean `P` (N): eccentricities, end moments, a line load, a top force (sway). */
function loadActions(u: Draw, P: number, L: number, frame: 'braced' | 'sway'): Record<string, unknown> {
  const out: Record<string, unknown> = {};
  const e = L / pick(u, [1000, 200, 50]);
  const sign = () => (u() < 0.5 ? -1 : 1);
  if (u() < 0.4) out['eccentricity'] = { top: signedValue(u, sign() * e * 1e3, 'mm'), ...(u() < 0.5 ? { bottom: signedValue(u, sign() * e * 1e3, 'mm') } : {}) };
  if (u() < 0.4) {
    const M = (P * e) / 1e3;
    out['moments'] = { ...(u() < 0.8 ? { top: signedValue(u, sign() * M, 'kN m') } : {}), bottom: signedValue(u, pick(u, [-1, 0.5, 1]) * M, 'kN m') };
  }
  if (u() < 0.4) out['transverse'] = signedValue(u, (sign() * 8 * P * e) / L ** 2 / 1e3, 'kN/m');
  if (frame === 'sway' && u() < 0.4) out['horizontal'] = signedValue(u, (sign() * P * pick(u, [0.002, 0.01, 0.05])) / 1e3, 'kN');
  return out;
}

/** A load value with actions attached: a fixed one becomes `{value, ...}`. */
function withActions(load: unknown, actions: Record<string, unknown>): unknown {
  if (Object.keys(actions).length === 0) return load;
  return typeof load === 'string' ? { value: load, ...actions } : { ...(load as Record<string, unknown>), ...actions };
}

/** The base scenario (no evidence about the structure, no test plans). */
function generateBaseScenario(u: Draw, index: number): Record<string, unknown> {
  const frame = pick(u, ['braced', 'sway'] as const);
  const L = Number(logUniform(u, -0.3, 1.3).toPrecision(3)); // 0.5 m to 20 m
  const steel = u() < 0.7;
  const E = steel ? 200e9 : Number(logUniform(u, 9.5, 10.2).toPrecision(3));
  const fy = steel ? pick(u, [235e6, 275e6, 355e6, 460e6]) : Number(logUniform(u, 7, 7.6).toPrecision(3));
  // a share of the sections by their dimensions (then two axes unless round), the rest by their properties
  const byShape = u() < 0.35;
  const drawn = byShape ? drawnSection(u, steel) : null;
  const A = drawn ? drawn.A : logUniform(u, -3.5, -1.5);
  const radius = logUniform(u, -2.2, -0.8);
  const I = drawn ? drawn.Iy : A * radius * radius;
  const S = I / (radius * pick(u, [1.2, 1.6, 2.2]));
  const EI = E * I;
  const strength = pick(u, STRENGTHS);
  const correlate = u() < 0.3;
  const squash = A * fy;
  // demand from 1e−4 to 3 times the squash load: impossible failure up to certain failure
  const load = squash * logUniform(u, -4, 0.5);
  const nLoads = 1 + Math.floor(u() * 3);
  const withLoadActions = u() < 0.3;
  const loads: Record<string, unknown> = {};
  for (let k = 0; k < nLoads; k++) {
    const value = loadValue(u, load / nLoads / 1e3);
    loads[`load_${k}`] = withLoadActions && u() < 0.7 ? withActions(value, loadActions(u, load / nLoads, L, frame)) : value;
  }
  if (withLoadActions && u() < 0.3) {
    // actions with no axial part, converted in time with their load (docs/loads.md)
    const q = (8 * load * (L / 300)) / L ** 2 / 1e3;
    loads['wind'] = {
      value: '0 kN', kind: 'wind', maximum_over: '1 year',
      transverse: { dist: 'gumbel', mean: `${num(q)} kN/m`, cov: 0.3 },
      ...(frame === 'sway' && u() < 0.5 ? { horizontal: { dist: 'gumbel', mean: `${num((load * 0.01) / 1e3)} kN`, cov: 0.3 } } : {}),
    };
  }

  const ends: Record<string, unknown> = { bottom: endValue(u, EI, L), top: endValue(u, EI, L) };
  if (frame === 'sway') {
    const r = u();
    if (r < 0.3) ends['lateral'] = positiveValue(u, (logUniform(u, -3, 3) * EI) / L ** 3 / 1e3, 'kN/m');
    else if (r < 0.4) ends['lateral'] = '0 kN/m';
  }
  const bowChoice = pick(u, ['fixed', 'normal', 'gumbel', 'lognormal', 'uniform', 'none'] as const);
  const bowMean = `L/${pick(u, [200, 500, 1000, 5000])}`;
  const bow =
    bowChoice === 'fixed' ? bowMean
    : bowChoice === 'normal' ? { dist: 'normal', mean: bowMean, sd: 'L/2000' }
    : bowChoice === 'gumbel' ? { dist: 'gumbel', mean: bowMean, cov: 0.5 }
    : bowChoice === 'lognormal' ? { dist: 'lognormal', mean: bowMean, cov: 0.5 }
    : bowChoice === 'uniform' ? { dist: 'uniform', min: '0 m', max: bowMean }
    : undefined;
  const imperfection: Record<string, unknown> = bow !== undefined || strength === 'first-yield' ? { bow: bow ?? bowMean } : {};
  if (frame === 'sway' && u() < 0.3) {
    imperfection['out_of_plumb'] = pick(u, ['en1993', 0.003, -0.002, { dist: 'normal', mean: 0.003, sd: 0.0015 }, { dist: 'uniform', min: -0.005, max: 0.005 }]);
  }

  // the second principal axis: needed by every shape but chs, sometimes given with properties
  const twoAxes = drawn ? drawn.shape !== 'chs' || u() < 0.3 : u() < 0.15;
  const Iz = drawn ? drawn.Iz : I * pick(u, [0.1, 0.3, 1]);
  let section: Record<string, unknown>;
  if (drawn) {
    section = { ...drawn.yaml, ...(u() < 0.5 ? { corrosion: corrosionValue(u, drawn, L) } : {}) };
  } else {
    section = {
      area: positiveValue(u, A * 1e6, 'mm^2', 0.7),
      inertia: positiveValue(u, I * 1e12, 'mm^4', 0.7),
      section_modulus: positiveValue(u, S * 1e9, 'mm^3', 0.8),
      ...(twoAxes ? { inertia_z: positiveValue(u, Iz * 1e12, 'mm^4', 0.7), section_modulus_z: positiveValue(u, (Iz / radius / 1.5) * 1e9, 'mm^3', 0.8) } : {}),
    };
  }
  let axisZ: Record<string, unknown> | undefined;
  if (twoAxes) {
    const zEnds: Record<string, unknown> = { bottom: endValue(u, E * Iz, L), top: endValue(u, E * Iz, L) };
    if (frame === 'sway' && u() < 0.4) zEnds['lateral'] = positiveValue(u, (logUniform(u, -3, 3) * E * Iz) / L ** 3 / 1e3, 'kN/m');
    axisZ = {
      ends: swayStable(zEnds, frame),
      imperfection: { bow: u() < 0.5 ? `L/${pick(u, [300, 1000])}` : { dist: 'lognormal', mean: `L/${pick(u, [300, 1000])}`, cov: 0.5 } },
      ...(strength.startsWith('en1993') && u() < 0.5 ? { curve: pick(u, ['a0', 'a', 'b', 'c', 'd']) } : {}),
    };
  }

  const doc: Record<string, unknown> = {
    stanchion: 1,
    title: `generated scenario ${index} (invented)`,
    column: {
      length: `${L} m`,
      frame,
      section,
      material: { E: positiveValue(u, E / 1e6, 'MPa', correlate ? 0 : 0.4), fy: positiveValue(u, fy / 1e6, 'MPa', correlate ? 0 : 0.4) },
      ends: swayStable(ends, frame),
      ...(Object.keys(imperfection).length > 0 ? { imperfection } : {}),
      ...(axisZ ? { axis_z: axisZ } : {}),
    },
    loads,
    strength,
  };
  const theta = u();
  if (theta < 0.4) doc['model_factor'] = { dist: 'lognormal', mean: 1, cov: pick(u, [0.05, 0.2]) };
  else if (theta < 0.5) doc['model_factor'] = pick(u, [0.8, 1.1]);
  if (correlate) doc['correlation'] = [['column.material.E', 'column.material.fy', Number((u() * 1.2 - 0.4).toFixed(2))]];
  return doc;
}

/** ln-error reading near the model value: within 1.5 measurement sds (docs/evidence.md §7). */
function nearReading(u: Draw, model: number, cov: number): number {
  const zeta = Math.sqrt(Math.log(1 + cov * cov));
  return model * Math.exp(zeta * (3 * u() - 1.5));
}

/**
 * Evidence about the structure and test plans, consistent with the scenario at its means: a
 * survived load below the mean capacity, readings near the model's values, plans on testable
 * variables. Returns nothing when the base scenario does not read (it is then run as it is).
 */
function structureEvidence(u: Draw, doc: Record<string, unknown>): { evidence: unknown[]; plans: unknown[] } | null {
  const wantsSurvival = u() < 0.15;
  const wantsRotation = u() < 0.12;
  const wantsFrequency = u() < 0.08;
  const wantsPlans = u() < 0.15;
  const draws = Array.from({ length: 12 }, () => u()); // fixed use of the stream, whatever is taken
  if (!wantsSurvival && !wantsRotation && !wantsFrequency && !wantsPlans) return null;
  let k = 0;
  const v = () => draws[k++ % draws.length]!;
  let model;
  let scenario;
  try {
    scenario = loadScenario(stringify(doc), 'generated.yaml');
    model = buildColumnModel(scenario);
  } catch {
    return null;
  }
  const x = model.mean;
  const evidence: unknown[] = [];
  const capacity = model.modelFactor(x) * model.capacity(x);
  if (wantsSurvival && capacity > 0 && Number.isFinite(capacity)) {
    const fraction = 0.2 + 0.6 * v();
    evidence.push(v() < 0.7
      ? { type: 'survived_load', load: `${num((fraction * capacity) / 1e3)} kN`, notes: 'invented' }
      : { type: 'survived_load', load: { dist: 'normal', mean: `${num((fraction * capacity) / 1e3)} kN`, cov: 0.1 } });
  }
  const dependsOn = (m: Measurement): boolean => {
    const base = predictedReading(model, m, x);
    return model.dists.some((d, i) => {
      const moved = Float64Array.from(x);
      moved[i] = d.quantile(0.9);
      return Math.abs(predictedReading(model, m, moved) - base) > 1e-9 * Math.abs(base);
    });
  };
  if (wantsRotation) {
    const end = v() < 0.5 ? 'bottom' : 'top';
    const written = ((doc['column'] as Record<string, unknown>)['ends'] as Record<string, unknown>)[end];
    const moment = 1e3 * pick(v, [1, 10, 50]);
    const cov = pick(v, [0.05, 0.1, 0.3]);
    const m: Measurement = { type: 'rotation_test', index: 0, end, moment, rotation: 1, measurementCov: cov } as unknown as Measurement;
    const theta = predictedReading(model, m, x);
    if (typeof written === 'object' && theta > 1e-9 && theta < 1 && dependsOn(m)) {
      evidence.push({ type: 'rotation_test', end, moment: `${num(moment / 1e3)} kN m`, rotation: `${num(nearReading(v, theta, cov) * 1e3)} mrad`, measurement_cov: cov, source: 'invented' });
    }
  }
  if (wantsFrequency) {
    const s = model.state(x);
    const mass = s.A > 0 ? s.A * 7850 * pick(v, [1, 2, 10]) : 50;
    const axial = model.demand(x) * pick(v, [0, 0.1, 0.3]);
    const cov = pick(v, [0.02, 0.05, 0.1]);
    const m = { type: 'frequency', index: 0, value: 1, axialLoad: axial, massPerLength: mass, measurementCov: cov } as unknown as Measurement;
    const f = predictedReading(model, m, x);
    if (f > 1e-3 && Number.isFinite(f) && dependsOn(m)) {
      evidence.push({ type: 'frequency', value: `${num(nearReading(v, f, cov))} Hz`, axial_load: `${num(Math.max(0, axial) / 1e3)} kN`, mass_per_length: `${num(mass)} kg/m`, measurement_cov: cov });
    }
  }
  const plans: unknown[] = [];
  if (wantsPlans) {
    // tests of this item on column variables that are normal or lognormal (docs/evidence.md §6)
    const testable = randomVariables(scenario).filter((r) => r.path.startsWith('column.') && (r.spec.dist === 'normal' || r.spec.dist === 'lognormal'));
    for (let j = 0; j < Math.min(2, testable.length); j++) {
      const r = testable[Math.floor(v() * testable.length)]!;
      plans.push({ variable: r.path, tests: pick(v, [1, 3, 5]), tested: 'this_one', measurement_cov: pick(v, [0.03, 0.1]), ...(j === 0 ? { label: `plan ${j + 1}` } : {}) });
    }
  }
  return { evidence, plans };
}

/** One generated scenario file (YAML), from uniforms `u`. */
export function generateScenarioText(u: Draw, index: number): string {
  const doc = generateBaseScenario(u, index);
  const extra = structureEvidence(u, doc);
  if (extra?.evidence.length) doc['evidence'] = extra.evidence;
  if (extra?.plans.length) doc['test_plans'] = extra.plans;
  return stringify(doc);
}

export type Outcome = { kind: 'result' } | { kind: 'input-error'; message: string } | { kind: 'internal-error'; message: string; text: string };

export interface RunSizes {
  mcSamples: number;
  isSamples: number;
  subsetSamples: number;
  sobolSamples: number;
  /** render the report files in memory too (charts as SVG; PNG in the bench only) */
  report: 'none' | 'svg' | 'png';
  /** simulated outcomes per test plan in `plan-tests` */
  planOutcomes: number;
}

export const SMALL_RUN: RunSizes = { mcSamples: 2000, isSamples: 400, subsetSamples: 200, sobolSamples: 64, report: 'svg', planOutcomes: 8 };

const META = { version: 'test', date: '2026-01-01', command: 'assess' };

/** Largest chart side, px, a report may draw (resvg aborts the process on absurd sizes). */
const MAX_CHART_SIDE = 10_000;

/** An SVG with an infinite or absurd width or height is a broken chart, even if it rendered. */
function checkChartSizes(files: Map<string, string | Uint8Array>): void {
  for (const [name, content] of files) {
    if (!name.endsWith('.svg') || typeof content !== 'string') continue;
    const head = /<svg[^>]*>/.exec(content)?.[0] ?? '';
    for (const side of ['width', 'height']) {
      const v = Number(new RegExp(`\\s${side}="([^"]+)"`).exec(head)?.[1]);
      if (!(v > 0 && v <= MAX_CHART_SIDE)) throw new Error(`${name}: ${side} ${v} px`);
    }
  }
}

/** A printed NaN is a number the tool failed to compute: an internal error, whatever else went right. */
function noNaN(command: string, text: string): void {
  const line = text.split('\n').find((l) => /\bNaN\b/.test(l));
  if (line !== undefined) throw new Error(`${command} printed NaN: ${line.trim()}`);
}

/** `check` and `assess` (every method and study, JSON, summary, report text) on one scenario. */
export async function runEverything(text: string, sizes: RunSizes = SMALL_RUN): Promise<Outcome> {
  try {
    const s = loadScenario(text, 'generated.yaml');
    const c = deterministicCheck(buildColumnModel(s));
    JSON.stringify(checkJson(c));
    noNaN('check', formatCheck(s, c, 'si'));
    const withSizes = { ...s, analysis: { ...s.analysis, isSamples: sizes.isSamples, subsetSamples: sizes.subsetSamples } };
    const a = await assessColumn(withSizes, {
      methods: ['form', 'sorm', 'is', 'mc', 'subset'],
      samples: sizes.mcSamples,
      seed: 7,
      sobolSamples: sizes.sobolSamples,
    });
    const json = assessmentJson(a, META);
    JSON.stringify(json);
    noNaN('assess', formatAssessment(a, 'si'));
    const input = assessmentReportInput(a, META);
    if (sizes.report === 'none') renderMarkdown(buildReportDocument(input, 'si', []));
    else checkChartSizes(await renderReportFiles(input, json, { png: sizes.report === 'png', pngScale: 1 }));
    if (s.testPlans !== undefined || s.column.axisZ !== undefined) {
      // as `plan-tests` and `restraint --axis` do: on the scenario after its measurements through the model
      const { scenario: updated, summary } = updateScenarioWithEvidence(s, 7);
      if (s.testPlans !== undefined) {
        const study = planTests(updated, { seed: 7, outcomes: sizes.planOutcomes, updatedByMeasurements: summary?.variables.map((v) => v.path) ?? [] });
        JSON.stringify(planTestsJson(study, { version: 'test' }));
        noNaN('plan-tests', formatPlanTests(s.title, study));
      }
      if (s.column.axisZ !== undefined) {
        // the axis assess does not pick by default is the one asked here half of the time
        const axis = text.length % 2 === 0 ? 'z' : 'y';
        // an axis without a rotational spring needs --end, as the command says when it is missing
        const study = await columnRestraint(updated, { axis, governing: governingAssessor(7) }).catch((e: unknown) => {
          if (e instanceof InputError && e.field === '--end') return columnRestraint(updated, { axis, end: 'both', governing: governingAssessor(7) });
          throw e;
        });
        JSON.stringify(restraintJson(study));
      }
    }
    return { kind: 'result' };
  } catch (e) {
    if (e instanceof InputError) return { kind: 'input-error', message: e.describe() };
    // exit 2 as well (cli/failure.ts): e.g. a correlation the marginals cannot reach, found by Nataf
    if (e instanceof DistributionError) return { kind: 'input-error', message: e.message };
    const message = e instanceof Error ? `${e.name}: ${e.message}\n${e.stack ?? ''}` : String(e);
    return { kind: 'internal-error', message, text };
  }
}

export interface ValidRunSummary {
  generated: number;
  results: number;
  inputErrors: number;
  internalErrors: Array<{ index: number; message: string; text: string }>;
  inputErrorMessages: string[];
}

/** `count` generated scenarios from `seed`, each run through everything. */
export async function runGeneratedScenarios(seed: number, count: number, sizes: RunSizes = SMALL_RUN, first = 0): Promise<ValidRunSummary> {
  const out: ValidRunSummary = { generated: 0, results: 0, inputErrors: 0, internalErrors: [], inputErrorMessages: [] };
  for (let i = first; i < first + count; i++) {
    const text = generateScenarioText(uniformStream(seed, i), i);
    const r = await runEverything(text, sizes);
    out.generated++;
    if (r.kind === 'result') out.results++;
    else if (r.kind === 'input-error') {
      out.inputErrors++;
      out.inputErrorMessages.push(r.message);
    } else out.internalErrors.push({ index: i, message: r.message, text: r.text });
  }
  return out;
}
