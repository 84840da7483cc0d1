/**
 * Which studies `assess` runs when `--studies` is not given. Most of them explain a FORM/SORM
 * result or cost many extra limit-state calls; when the methods were chosen explicitly and
 * contain neither FORM nor SORM, only the cheap tornado stays on by default, so that a
 * sampling-only run costs what was asked for. The scenario's own `analysis.methods` keeps
 * every study.
 */
import type { Method } from '../scenario/types.js';
import { STUDY_NAMES, type StudyName } from './studyNames.js';

/** Studies that only explain FORM/SORM or need many extra evaluations. */
export const FORM_OR_COSTLY_STUDIES: readonly StudyName[] = ['conditional-beta', 'elasticities', 'sobol', 'restraint', 'strength-models', 'form-check'];

export interface DefaultStudies {
  studies: StudyName[];
  /** switched off by default (empty when every study runs) */
  skipped: StudyName[];
}

/** `methodsGiven`: the methods chosen on the command line, undefined when not given. */
export function defaultStudies(methodsGiven: readonly Method[] | undefined): DefaultStudies {
  const explains = methodsGiven === undefined || methodsGiven.includes('form') || methodsGiven.includes('sorm');
  if (explains) return { studies: [...STUDY_NAMES], skipped: [] };
  return {
    studies: STUDY_NAMES.filter((n) => !FORM_OR_COSTLY_STUDIES.includes(n)),
    skipped: STUDY_NAMES.filter((n) => FORM_OR_COSTLY_STUDIES.includes(n)),
  };
}

/** The one line that says what was skipped and how to run it. */
export function skippedStudiesLine(skipped: readonly StudyName[]): string {
  return `stanchion: without form or sorm among --methods, the studies ${skipped.join(', ')} were skipped (they explain FORM or cost many extra calls); --studies all runs every study, --studies ${skipped[0]},… only those named`;
}
