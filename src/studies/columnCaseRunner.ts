/**
 * The sweep's case runner for a column scenario: the base scenario with the case's values
 * set (applySweepValues), the deterministic check at the means, then each requested
 * reliability method. Every sampling method draws from the case's own seed, in this thread,
 * so a case gives the same numbers whichever worker or shard runs it.
 */
import { fileURLToPath } from 'node:url';
import { buildColumnModel, type ColumnModel } from '../limitState/columnModel.js';
import { problemFromModel } from '../limitState/columnRecipe.js';
import { checkCore } from '../limitState/deterministicCheck.js';
import { form } from '../reliability/form.js';
import { checkEstimate, checkForm } from '../reliability/formCheck.js';
import { importanceSamplingAtDesignPoint } from '../reliability/importanceSampling.js';
import { monteCarlo } from '../reliability/monteCarlo.js';
import { sorm } from '../reliability/sorm.js';
import { subsetSimulation } from '../reliability/subsetSimulation.js';
import type { FormResult, ReliabilityProblem } from '../reliability/types.js';
import { InputError } from '../scenario/inputError.js';
import type { Method } from '../scenario/types.js';
import { parseSweepBase, scenarioWithValues } from './applySweepValues.js';
import type { CaseRunner, CaseRunnerRecipe } from './caseRunner.js';
import type { CaseResult, SweepCase } from './sweepTypes.js';

export interface ColumnCaseArgs {
  scenarioText: string;
  fileName: string;
  /** Default ['form']. */
  methods?: readonly Method[];
  /** Monte Carlo samples per case (default: the scenario's mc_samples, else 100 000). */
  samples?: number;
}

export const SWEEP_DEFAULT_METHODS: readonly Method[] = ['form'];
export const SWEEP_DEFAULT_MC_SAMPLES = 100_000;
const DEFAULT_IS_SAMPLES = 50_000;
const IS_TARGET_COV = 0.02;
const DEFAULT_SUBSET_SAMPLES = 1000;

/** FORM, or its certain outcome when nothing is random or the mean column is a mechanism. */
function formOrCertain(model: ColumnModel, problem: ReliabilityProblem | null): FormResult | { beta: number; pf: number; converged: true } {
  if (problem === null) {
    return model.g(model.mean) > 0 ? { beta: Infinity, pf: 0, converged: true } : { beta: -Infinity, pf: 1, converged: true };
  }
  // restarts: 0 — no blind restarts; doubtful directions are still searched (form.ts)
  return form(problem, { restarts: 0 });
}

async function runCase(args: ColumnCaseArgs, base: ReturnType<typeof parseSweepBase>, c: SweepCase): Promise<CaseResult> {
  const methods = args.methods ?? SWEEP_DEFAULT_METHODS;
  const s = scenarioWithValues(base, c.values);
  const model = buildColumnModel(s);
  // the check's numbers at the means that a row keeps (not its mode shapes or connection moments)
  const check = checkCore(model);
  const out: CaseResult = {
    utilization: check.utilization,
    capacity: check.capacity,
    demand: check.demand,
    critical_load: check.critical_load,
    effective_length_factor: check.effective_length_factor,
  };
  const needsForm = methods.some((m) => m === 'form' || m === 'sorm' || m === 'is');
  const certain = model.names.length === 0 || !(model.capacity(model.mean) > 0);
  const problem = certain ? null : problemFromModel(model);
  const f = needsForm ? formOrCertain(model, problem) : null;
  if (f && methods.includes('form')) {
    if (problem && 'designPointU' in f) {
      // FORM's series system, checked by sampling; a row where they disagree carries the check's value.
      const check = checkForm(problem, f, { seed: c.seed });
      const e = checkEstimate(check);
      out.beta_form = check.agrees ? f.system.beta : e.beta;
      out.pf_form = check.agrees ? f.system.pf : e.pf;
      out.converged_form = f.converged;
      out.form_check = check.agrees ? 'agrees' : 'disagrees: beta_form is the sampling check';
      out.beta_form_unchecked = f.system.beta;
      out.beta_form_check = check.beta;
      out.design_points_form = f.system.designPoints.length;
    } else {
      out.beta_form = f.beta;
      out.pf_form = f.pf;
      out.converged_form = f.converged;
      out.form_check = 'certain';
    }
  }
  if (methods.includes('sorm') && f) {
    if (problem && 'designPointU' in f) {
      const r = sorm(problem, f);
      out.beta_sorm = r.beta;
      out.pf_sorm = r.pf;
    } else {
      out.beta_sorm = f.beta;
      out.pf_sorm = f.pf;
    }
  }
  if (methods.includes('is') && f) {
    if (problem && 'designPointU' in f) {
      const r = await importanceSamplingAtDesignPoint(problem, f, {
        samples: s.analysis.isSamples ?? DEFAULT_IS_SAMPLES,
        seed: c.seed,
        targetCov: IS_TARGET_COV,
      });
      Object.assign(out, { beta_is: r.beta, pf_is: r.pf, cov_is: r.cov, calls_is: r.calls });
    } else {
      Object.assign(out, { beta_is: f.beta, pf_is: f.pf, cov_is: 0, calls_is: 0 });
    }
  }
  if (methods.includes('mc')) {
    if (problem) {
      const r = await monteCarlo(problem, { samples: args.samples ?? s.analysis.mcSamples ?? SWEEP_DEFAULT_MC_SAMPLES, seed: c.seed });
      Object.assign(out, { beta_mc: r.beta, pf_mc: r.pf, cov_mc: r.cov, samples_mc: r.samples, failures_mc: r.failures });
    } else {
      const pf = model.g(model.mean) > 0 ? 0 : 1;
      Object.assign(out, { beta_mc: pf === 0 ? Infinity : -Infinity, pf_mc: pf, cov_mc: 0, samples_mc: 0, failures_mc: 0 });
    }
  }
  if (methods.includes('subset')) {
    if (problem) {
      const r = subsetSimulation(problem, { seed: c.seed, samplesPerLevel: s.analysis.subsetSamples ?? DEFAULT_SUBSET_SAMPLES });
      Object.assign(out, { beta_subset: r.beta, pf_subset: r.pf, cov_subset: r.cov, calls_subset: r.calls });
    } else {
      const pf = model.g(model.mean) > 0 ? 0 : 1;
      Object.assign(out, { beta_subset: pf === 0 ? Infinity : -Infinity, pf_subset: pf, cov_subset: 0, calls_subset: 0 });
    }
  }
  return out;
}

/** The runner factory named in the worker recipe: (args) => CaseRunner. */
export function columnCaseRunner(args: ColumnCaseArgs): CaseRunner {
  const base = parseSweepBase(args.scenarioText, args.fileName);
  return async (c: SweepCase) => {
    try {
      return await runCase(args, base, c);
    } catch (err) {
      // the journal keeps only the message: put the field in it
      if (err instanceof InputError) throw new InputError(err.field, err.describe(), err.line);
      throw err;
    }
  };
}

/** How worker threads rebuild this runner (the .ts source maps to its dist twin). */
export function columnCaseRecipe(args: ColumnCaseArgs): CaseRunnerRecipe {
  return { module: fileURLToPath(import.meta.url), exportName: 'columnCaseRunner', args };
}
