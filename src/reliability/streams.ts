/**
 * Stream indices of the seeded generators, one range per method so that MC, IS and subset
 * simulation run with the same seed never share random numbers. Chunk i of a method always
 * uses stream base + i, whatever the number of workers.
 */
export const MC_STREAM_BASE = 0;
export const IS_STREAM_BASE = 2 ** 32;
export const SUBSET_STREAM_BASE = 2 ** 33;
/** Random shifts of the lattice rules in seriesSystem.ts (stream base + term index). */
export const SERIES_STREAM_BASE = 3 * 2 ** 32;
/** FORM's self-check (formCheck.ts). */
export const FORM_CHECK_STREAM_BASE = 4 * 2 ** 32;
/** Monte Carlo of a failure given a survived proof load (conditionalFailure.ts). */
export const CONDITIONAL_STREAM_BASE = 5 * 2 ** 32;
/** Simulated outcomes of planned tests (studies/testPlanning.ts): stream base + plan index. */
export const TEST_PLAN_STREAM_BASE = 6 * 2 ** 32;
/*
 * 7·2³² is the posterior sampler's (evidence/adaptiveMetropolis.ts POSTERIOR_STREAM_BASE: + chain index).
 */
/**
 * Importance sampling of a failure given a survived proof load (conditionalImportance.ts):
 * stream base for the joint event, base + 1 for the probability of the survival.
 */
export const CONDITIONAL_IS_STREAM_BASE = 8 * 2 ** 32;
