/**
 * Scenario text → Scenario (docs/scenario-format.md), or an InputError naming the field and line.
 * Three stages: parse (YAML/JSON with lines) → shape (zod) → meaning (units, rules).
 */
import { createHash } from 'node:crypto';
import { buildScenario } from './buildScenario.js';
import { parseText } from './parseText.js';
import { scenarioShape } from './scenarioShape.js';
import { shapeError } from './shapeErrors.js';
import type { Scenario } from './types.js';

export function loadScenario(text: string, fileName: string): Scenario {
  const tree = parseText(text, fileName);
  const rootName = fileName === '-' ? 'stdin' : fileName;
  const checked = scenarioShape.safeParse(tree.value, { reportInput: true });
  if (!checked.success) throw shapeError(checked.error.issues, tree.lines, rootName);
  const sha256 = createHash('sha256').update(text, 'utf8').digest('hex');
  return buildScenario(checked.data, tree.lines, { fileName, format: tree.format, sha256 });
}
