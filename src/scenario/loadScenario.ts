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
import type { RawTree } from './rawTree.js';

export function loadScenario(text: string, fileName: string): Scenario {
  const tree = parseText(text, fileName);
  return scenarioFromTree(tree, fileName, createHash('sha256').update(text, 'utf8').digest('hex'));
}

/**
 * The shape and meaning stages on an already parsed tree (a sweep edits the base scenario's
 * tree per case instead of writing and re-reading its text). `sha256` names the input.
 */
export function scenarioFromTree(tree: RawTree, fileName: string, sha256: string): Scenario {
  const rootName = fileName === '-' ? 'stdin' : fileName;
  const checked = scenarioShape.safeParse(tree.value, { reportInput: true });
  if (!checked.success) throw shapeError(checked.error.issues, tree.lines, rootName);
  return buildScenario(checked.data, tree.lines, { fileName, format: tree.format, sha256 });
}
