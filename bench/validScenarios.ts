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

/** One generated scenario file (YAML), from uniforms `u`. */
export function generateScenarioText(u: Draw, index: number): string {
  const frame = pick(u, ['braced', 'sway'] as const);
  const L = Number(logUniform(u, -0.3, 1.3).toPrecision(3)); // 0.5 m to 20 m
  const steel = u() < 0.7;
  const E = steel ? 200e9 : Number(logUniform(u, 9.5, 10.2).toPrecision(3));
  const fy = steel ? pick(u, [235e6, 275e6, 355e6, 460e6]) : Number(logUniform(u, 7, 7.6).toPrecision(3));
  const A = logUniform(u, -3.5, -1.5);
  const radius = logUniform(u, -2.2, -0.8);
  const I = A * radius * radius;
  const S = I / (radius * pick(u, [1.2, 1.6, 2.2]));
  const EI = E * I;
  const strength = pick(u, STRENGTHS);
  const correlate = u() < 0.3;
  const squash = A * fy;
  // demand from 1e−4 to 3 times the squash load: impossible failure up to certain failure
  const load = squash * logUniform(u, -4, 0.5);
  const nLoads = 1 + Math.floor(u() * 3);
  const loads: Record<string, unknown> = {};
  for (let k = 0; k < nLoads; k++) loads[`load_${k}`] = loadValue(u, load / nLoads / 1e3);

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

  const doc: Record<string, unknown> = {
    stanchion: 1,
    title: `generated scenario ${index} (invented)`,
    column: {
      length: `${L} m`,
      frame,
      section: {
        area: positiveValue(u, A * 1e6, 'mm^2', 0.7),
        inertia: positiveValue(u, I * 1e12, 'mm^4', 0.7),
        section_modulus: positiveValue(u, S * 1e9, 'mm^3', 0.8),
      },
      material: { E: positiveValue(u, E / 1e6, 'MPa', correlate ? 0 : 0.4), fy: positiveValue(u, fy / 1e6, 'MPa', correlate ? 0 : 0.4) },
      ends,
      ...(bow !== undefined || strength === 'first-yield' ? { imperfection: { bow: bow ?? bowMean } } : {}),
    },
    loads,
    strength,
  };
  const theta = u();
  if (theta < 0.4) doc['model_factor'] = { dist: 'lognormal', mean: 1, cov: pick(u, [0.05, 0.2]) };
  else if (theta < 0.5) doc['model_factor'] = pick(u, [0.8, 1.1]);
  if (correlate) doc['correlation'] = [['column.material.E', 'column.material.fy', Number((u() * 1.2 - 0.4).toFixed(2))]];
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
}

export const SMALL_RUN: RunSizes = { mcSamples: 2000, isSamples: 400, subsetSamples: 200, sobolSamples: 64, report: 'svg' };

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

/** `check` and `assess` (every method and study, JSON, summary, report text) on one scenario. */
export async function runEverything(text: string, sizes: RunSizes = SMALL_RUN): Promise<Outcome> {
  try {
    const s = loadScenario(text, 'generated.yaml');
    const c = deterministicCheck(buildColumnModel(s));
    JSON.stringify(checkJson(c));
    formatCheck(s, c, 'si');
    const withSizes = { ...s, analysis: { ...s.analysis, isSamples: sizes.isSamples, subsetSamples: sizes.subsetSamples } };
    const a = await assessColumn(withSizes, {
      methods: ['form', 'sorm', 'is', 'mc', 'subset'],
      samples: sizes.mcSamples,
      seed: 7,
      sobolSamples: sizes.sobolSamples,
    });
    const json = assessmentJson(a, META);
    JSON.stringify(json);
    formatAssessment(a, 'si');
    const input = assessmentReportInput(a, META);
    if (sizes.report === 'none') renderMarkdown(buildReportDocument(input, 'si', []));
    else checkChartSizes(await renderReportFiles(input, json, { png: sizes.report === 'png', pngScale: 1 }));
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
