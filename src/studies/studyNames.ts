/**
 * The studies `assess` runs beside the reliability methods; each can be switched off
 * (`--studies LIST`, `--no-studies`). FORM runs whenever one of them needs it, and the output
 * says so when FORM was not among the methods asked for.
 */
export const STUDY_NAMES = ['tornado', 'conditional-beta', 'elasticities', 'sobol', 'restraint', 'strength-models', 'form-check'] as const;
export type StudyName = (typeof STUDY_NAMES)[number];

/** What each study is, for the list in the output. */
export const STUDY_TEXT: Record<StudyName, string> = {
  tornado: 'tornado of utilization and capacity (5 %/95 % of one variable)',
  'conditional-beta': 'conditional β (FORM with one variable fixed at a time)',
  elasticities: 'elasticities of β to each mean and standard deviation (FORM)',
  sobol: 'Sobol indices of capacity and g',
  restraint: 'restraint needed for the target β (FORM against connection stiffness)',
  'strength-models': 'β by strength model (FORM)',
  'form-check': 'FORM\'s self-check by sampling when FORM or SORM decides alone',
};

/** Studies that need a FORM design point of the scenario itself. */
export const STUDIES_NEEDING_FORM: readonly StudyName[] = ['strength-models', 'form-check'];
