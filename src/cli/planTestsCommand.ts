/**
 * `stanchion plan-tests FILE`: rank candidate tests by what they would do to β
 * (studies/testPlanning.ts). Plans from the scenario's `test_plans:`, or by default 1, 3 and 5
 * tests on each of the three most important testable variables.
 */
import { loadScenario } from '../scenario/loadScenario.js';
import { planTests, DEFAULT_MEASUREMENT_COV, type TestPlanStudy } from '../studies/testPlanning.js';
import { formatBeta, formatNumber, type UnitSystem } from '../report/displayUnits.js';
import { readScenarioText } from './readScenarioText.js';
import { CAUTION, textTable } from './textTable.js';
import { toolVersion } from './version.js';
import { InputError } from '../scenario/inputError.js';
import { planTestsJson } from '../studies/testPlanJson.js';
import { updateScenarioWithEvidence } from '../studies/measurementUpdate.js';
import { DEFAULT_SEED } from '../studies/columnAssessment.js';

export interface PlanTestsOptions {
  json?: boolean;
  seed?: number;
  outcomes?: number;
  units?: UnitSystem;
}

export const DEFAULT_PLAN_SEED = 20261201;

export function formatPlanTests(title: string, p: TestPlanStudy): string {
  const lines: string[] = [];
  lines.push(`stanchion plan-tests: ${title}`);
  lines.push(`  β now ${formatBeta(p.betaNow)} against the target ${formatNumber(p.target, 3)}${p.survivalIncluded ? ' (given the survived loads)' : ''}; ${p.outcomes} simulated outcomes per plan, seed ${p.seed}`);
  if (p.defaults) lines.push(`  no test_plans in the scenario: 1, 3 and 5 tests on each of the most important testable variables (tests of this item with a measurement CoV of ${DEFAULT_MEASUREMENT_COV})`);
  lines.push('');
  const rows = [['rank', 'plan', 'meas. CoV', 'β after: 5 %', 'median', '95 %', 'P(meets target)', 'expected gain']];
  p.plans.forEach((r, i) =>
    rows.push([
      String(i + 1), r.label, r.measurementCov === undefined ? 'as entered' : formatNumber(r.measurementCov, 2),
      formatBeta(r.beta05), formatBeta(r.beta50), formatBeta(r.beta95), formatNumber(r.pMeet, 2),
      Number.isFinite(r.expectedGain) ? (r.expectedGain >= 0 ? '+' : '') + r.expectedGain.toFixed(2) : '—',
    ]),
  );
  lines.push(textTable(rows));
  lines.push('');
  lines.push('  β after: the FORM β the assessment would have once the tests are done, over outcomes drawn from today\'s distributions');
  lines.push('  (pre-posterior analysis); ranked by the probability of then meeting the target, then by the expected gain E[β after] − β now.');
  if (p.unconverged > 0) lines.push(`  ${p.unconverged} of the outcome FORM analyses did not converge; their β is used as found.`);
  lines.push('');
  lines.push(CAUTION);
  return lines.join('\n') + '\n';
}

export async function runPlanTests(file: string, opts: PlanTestsOptions): Promise<void> {
  const { text, fileName } = readScenarioText(file);
  const scenario = loadScenario(text, fileName);
  const seed = opts.seed ?? scenario.analysis.seed ?? DEFAULT_PLAN_SEED;
  // the plans start from what the assessment would use: the scenario after its measurements through the model (same seed as assess)
  const { scenario: updated, summary } = updateScenarioWithEvidence(scenario, opts.seed ?? scenario.analysis.seed ?? DEFAULT_SEED);
  const study = planTests(updated, {
    seed,
    ...(opts.outcomes !== undefined ? { outcomes: opts.outcomes } : {}),
    updatedByMeasurements: summary?.variables.map((v) => v.path) ?? [],
  });
  if (study.plans.length === 0) throw new InputError('test_plans', 'nothing to plan: no random variable of the column can be tested; list plans under test_plans');
  if (opts.json) process.stdout.write(JSON.stringify(planTestsJson(study, { version: toolVersion(), scenario_sha256: scenario.sha256 }), null, 2) + '\n');
  else process.stdout.write(formatPlanTests(scenario.title, study));
}
