/** The public face of reliability/: methods, their options and results. */
export type {
  LimitState, ReliabilityProblem, ProblemRecipe, FormResult, FormStep, DesignPointCandidate, SormResult, SormFormula,
  McResult, McTracePoint, IsResult, SubsetResult, SubsetLevel, SimulationProgress,
} from './types.js';
export { LimitStateError } from './limitStateError.js';
export { form, type FormOptions } from './form.js';
export { sorm, type SormOptions } from './sorm.js';
export { breitung, hohenbichlerRackwitz, tvedt } from './sormFormulas.js';
export { monteCarlo, betaFromPf, crudeCov, MC_CHUNK_SIZE, type MonteCarloOptions } from './monteCarlo.js';
export { importanceSampling, importanceSamplingAtDesignPoint, IS_CHUNK_SIZE, type ImportanceSamplingOptions } from './importanceSampling.js';
export { subsetSimulation, type SubsetOptions } from './subsetSimulation.js';
export { verdict, type Verdict, type VerdictInput, type VerdictOptions, type MethodComparison, type MethodName } from './verdict.js';
export { seriesSystemFailure, type SeriesSystemResult } from './seriesSystem.js';
export { wilsonInterval } from './wilson.js';
export { loadRecipe } from './loadRecipe.js';
export { compiledTwin } from '../runtime/compiledTwin.js';
