/**
 * The studies `assess` runs beside the reliability methods; each can be switched off
 * (`--studies LIST`, `--no-studies`). FORM runs whenever one of them needs it, and the output
 * says so when FORM was not among the methods asked for.
 */
export const STUDY_NAMES = ['tornado', 'conditional-beta', 'elasticities', 'sobol', 'restraint', 'strength-models', 'form-check'] as const;
export type StudyName = (typeof STUDY_NAMES)[number];
