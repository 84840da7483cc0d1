/**
 * `test_plans:` — candidate tests for plan-tests and the report. Checked against the built
 * scenario: the variable must be random and updatable the way the plan says (docs/evidence.md §6).
 */
import { InputError } from './inputError.js';
import { formatPath, lineOf, type PathSegment } from './rawTree.js';
import type { ScenarioShape } from './scenarioShape.js';
import type { Scenario, TestPlan } from './types.js';
import { randomVariables, scalarAt } from './variables.js';
import { didYouMean } from './nearestName.js';

type RawPlan = NonNullable<ScenarioShape['test_plans']>[number];

/** Why `path` cannot take a plan of this kind (null: it can). */
export function planRefusal(s: Omit<Scenario, 'correlation'>, path: string, tested: 'similar' | 'this_one'): string | null {
  const scalar = scalarAt(s, path);
  if (scalar === undefined) {
    const names = randomVariables(s).map((v) => v.path);
    return `'${path}' is not a variable of this scenario${didYouMean(path, names)}`;
  }
  if (scalar.kind !== 'random') return `'${path}' is fixed in this scenario: a test can only update a random variable`;
  if (!path.startsWith('column.')) return 'tests update the column’s own values (material, section, ends, bow), not loads or the model factor';
  const record = s.evidence?.[path];
  if (tested === 'similar') {
    if (!record || record.tested !== 'similar') return 'more tests of similar items need the tests already entered under this variable (evidence: {tests: [...]}); plan tests of this item instead (tested: this_one)';
    return null;
  }
  if (record && record.tested === 'similar') return 'this variable is already updated by tests of similar items: plan more of them (tested: similar)';
  if (scalar.spec.dist !== 'normal' && scalar.spec.dist !== 'lognormal') return `a test of this item updates a normal or lognormal variable, not a ${scalar.spec.dist} one`;
  return null;
}

export function readTestPlans(raw: readonly RawPlan[] | undefined, s: Omit<Scenario, 'correlation'>, lines: ReadonlyMap<string, number>): TestPlan[] | undefined {
  if (raw === undefined) return undefined;
  const fail = (p: readonly PathSegment[], message: string): never => {
    throw new InputError(formatPath(p), message, lineOf(lines, p));
  };
  return raw.map((p, i) => {
    const at: PathSegment[] = ['test_plans', i];
    const record = s.evidence?.[p.variable];
    const tested = p.tested ?? (record?.tested === 'similar' ? 'similar' : 'this_one');
    const why = planRefusal(s, p.variable, tested);
    if (why) fail([...at, p.tested !== undefined && scalarAt(s, p.variable)?.kind === 'random' ? 'tested' : 'variable'], why);
    if (p.tests > 50) fail([...at, 'tests'], `at most 50 tests per plan, got ${p.tests}`);
    if (tested === 'similar' && p.measurement_cov !== undefined) {
      fail([...at, 'measurement_cov'], 'more tests of similar items are read like the ones already entered (their measurement error); leave measurement_cov out');
    }
    if (tested === 'this_one') {
      if (p.measurement_cov === undefined) fail([...at, 'measurement_cov'], 'is missing: a test of this item needs the CoV of its measurement error, e.g. 0.1');
      if (!(p.measurement_cov! > 0 && p.measurement_cov! < 1)) fail([...at, 'measurement_cov'], `must be a CoV greater than 0 and below 1, got ${p.measurement_cov}`);
    }
    const label = p.label?.trim();
    return {
      variable: p.variable,
      tests: p.tests,
      tested,
      ...(tested === 'this_one' ? { measurementCov: p.measurement_cov } : {}),
      ...(label ? { label } : {}),
    };
  });
}
