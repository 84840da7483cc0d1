import { describe, expect, it } from 'vitest';
import { defaultStudies, skippedStudiesLine } from '../../src/studies/defaultStudies.js';
import { STUDY_NAMES } from '../../src/studies/studyNames.js';
import { parseStudies } from '../../src/cli/optionParsers.js';

describe('the default studies follow the methods chosen', () => {
  it('no --methods, or form/sorm among them: every study', () => {
    for (const m of [undefined, ['form'] as const, ['sorm', 'mc'] as const, ['form', 'is'] as const]) {
      expect(defaultStudies(m)).toEqual({ studies: [...STUDY_NAMES], skipped: [] });
    }
  });

  it('sampling methods only: the tornado alone; the rest named as skipped', () => {
    for (const m of [['mc'] as const, ['is', 'subset'] as const]) {
      const d = defaultStudies(m);
      expect(d.studies).toEqual(['tornado']);
      expect(d.skipped).toEqual(['conditional-beta', 'elasticities', 'sobol', 'restraint', 'strength-models', 'form-check']);
    }
    const line = skippedStudiesLine(defaultStudies(['mc']).skipped);
    expect(line.split('\n')).toHaveLength(1);
    expect(line).toContain('sobol');
    expect(line).toContain('--studies all');
  });

  it('--studies all names every study', () => {
    expect(parseStudies('all')).toEqual([...STUDY_NAMES]);
    expect(() => parseStudies('all,magic')).toThrow(/unknown study 'all'|unknown study 'magic'/);
  });
});
