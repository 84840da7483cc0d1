import { readFileSync } from 'node:fs';
import { describe, expect, test } from 'vitest';
import { loadCombinations } from '../../src/loads/loadCombinations.js';
import { loadTimeNotes } from '../../src/loads/loadTimeNotes.js';
import { loadScenario } from '../../src/scenario/loadScenario.js';
import { InputError } from '../../src/scenario/inputError.js';

const BASE = readFileSync(new URL('../reference/turkstra-column.yaml', import.meta.url), 'utf8');
const withLoads = (loads: string, extra = '') =>
  loadScenario(BASE.replace(/loads:\n(?: {2}.*\n)+/, `loads:\n${loads}`) + extra, 't.yaml');
const exponents = (s: ReturnType<typeof loadScenario>) => loadCombinations(s).map((c) => ({ leading: c.leading, n: Object.fromEntries(c.exponents) }));

// source: Turkstra (1970); JCSS Probabilistic Model Code Part 1 (2001): each time-varying load leads
// once at its reference-period maximum, the others at companion (annual or point-in-time) values.
describe('Turkstra load combinations', () => {
  test('two annual-maximum loads over 50 years: each leads once at 50×, the other at its annual maximum', () => {
    expect(exponents(loadScenario(BASE, 't.yaml'))).toEqual([
      { leading: 'imposed', n: { 'loads.dead': 1, 'loads.imposed': 50, 'loads.snow': 1 } },
      { leading: 'snow', n: { 'loads.dead': 1, 'loads.imposed': 1, 'loads.snow': 50 } },
    ]);
  });

  test('one time-varying load: a single combination, converted to the reference period', () => {
    const s = withLoads('  dead: {dist: normal, mean: 380 kN, cov: 0.1, kind: permanent}\n  imposed: {dist: gumbel, mean: 150 kN, cov: 0.35, kind: imposed, maximum_over: 1 year}\n');
    expect(exponents(s)).toEqual([{ leading: null, n: { 'loads.dead': 1, 'loads.imposed': 50 } }]);
  });

  test('a stated 50-year maximum with a 50-year reference period is used as stated', () => {
    // common practice: a conversion by a factor of one changes nothing
    const s = withLoads('  dead: {dist: normal, mean: 380 kN, cov: 0.1}\n  imposed: {dist: gumbel, mean: 150 kN, cov: 0.35, kind: imposed, maximum_over: 50 years}\n');
    expect(exponents(s)).toEqual([{ leading: null, n: { 'loads.dead': 1, 'loads.imposed': 1 } }]);
  });

  test('a point-in-time load renews every τ: leading T/τ, companion as given', () => {
    const s = withLoads(
      '  sustained: {dist: lognormal, mean: 60 kN, cov: 0.5, kind: imposed, point_in_time: true, renewal_period: 10 years}\n' +
        '  snow: {dist: gumbel, mean: 110 kN, cov: 0.4, kind: snow, maximum_over: 1 year}\n',
    );
    expect(exponents(s)).toEqual([
      { leading: 'sustained', n: { 'loads.sustained': 5, 'loads.snow': 1 } },
      { leading: 'snow', n: { 'loads.sustained': 1, 'loads.snow': 50 } },
    ]);
  });

  test('reference period other than 50 years; loads without a basis are never converted', () => {
    const s = withLoads(
      '  dead: {dist: normal, mean: 380 kN, cov: 0.1}\n  wind: {dist: gumbel, mean: 50 kN, cov: 0.3, kind: wind, maximum_over: 1 year}\n  snow: {dist: gumbel, mean: 80 kN, cov: 0.3, kind: snow, maximum_over: 1 year}\n',
    );
    const t = loadScenario(BASE.replace('reference_period: 50 years', 'reference_period: 15 years'), 't.yaml');
    expect(loadCombinations(t).map((c) => c.exponents.get('loads.imposed'))).toEqual([15, 1]);
    expect(exponents(s)[0]!.n['loads.dead']).toBe(1);
  });
});

describe('notes and refusals', () => {
  test('a time-varying kind without a basis, and loads summed as if their maxima coincided, are pointed out', () => {
    const s = withLoads('  dead: {dist: normal, mean: 380 kN, cov: 0.1}\n  imposed: {dist: gumbel, mean: 150 kN, cov: 0.35, kind: imposed}\n  snow: {dist: gumbel, mean: 80 kN, cov: 0.3}\n');
    const notes = loadTimeNotes(s).join('\n');
    expect(notes).toMatch(/loads\.imposed \(imposed\) states no maximum_over/);
    expect(notes).toMatch(/loads\.dead, loads\.snow: no kind or time basis/);
  });

  const errorOf = (text: string) => {
    try {
      loadScenario(text, 't.yaml');
    } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      return e as InputError;
    }
    throw new Error('expected an InputError');
  };
  test.each([
    ['maximum_over: 1 year}', 'maximum_over: 1 kN}', 'loads.imposed.maximum_over', /period such as 50 years/],
    ['maximum_over: 1 year}', 'maximum_over: 1 year, point_in_time: true}', 'loads.imposed.point_in_time', /either maximum_over or point_in_time/],
    ['maximum_over: 1 year}', 'point_in_time: true}', 'loads.imposed.renewal_period', /is missing/],
    ['kind: permanent}', 'kind: permanent, maximum_over: 1 year}', 'loads.dead.maximum_over', /permanent load has no maximum/],
    ['reference_period: 50 years', 'reference_period: 0 years', 'reference_period', /greater than zero/],
    ['beta: 3.8,', 'beta: 8.5,', 'target.beta', /between 0.5 and 8/],
    ['beta: 3.8,', 'beta: 0.2,', 'target.beta', /between 0.5 and 8/],
    ['period: 50 years,', 'period: 50,', 'target.period', /give a unit|period such as/],
  ])('%s → %s is refused at %s', (from, to, field, message) => {
    expect(BASE).toContain(from);
    const e = errorOf(BASE.replace(from, to));
    expect(e.field).toBe(field);
    expect(e.message).toMatch(message);
  });

  test('the target: stated period, reference period, annual value, verbatim source', () => {
    // source: EN 1990:2002 Table B2, RC2: 4.7 for 1 year ~ 3.8 for 50 years (Annex C eq. C.3)
    const s = loadScenario(BASE.replace('beta: 3.8, period: 50 years', 'beta: 4.7, period: 1 year'), 't.yaml');
    expect(s.target.betaReferencePeriod).toBeCloseTo(3.8, 1);
    expect(s.targetBeta).toBe(s.target.betaReferencePeriod);
    expect(s.target.betaAnnual).toBe(4.7);
    expect(s.targetSource).toBe('EN 1990 Annex C, RC2, 50 years');
    expect(s.target.consequenceClass).toBe('CC2');
    expect(() => loadScenario(BASE.replace('analysis:', 'target_beta: 3.8\nanalysis:'), 't.yaml')).toThrow(/either target/);
  });
});
