/**
 * A sweep case's values written into the scenario FILE, then read by loadScenario: parsing,
 * units, expressions (`L/1500` follows a varied length) and every validation rule stay in
 * one place. YAML is edited as a document (comments and lines kept, so loadScenario's line
 * numbers still point at the user's file); JSON as a plain object.
 *
 * A path is a contract path (`column.length`, `loads.dead`, `column.ends.bottom.rotation`)
 * or, for a random variable, one of its parameters (`column.ends.bottom.rotation.mean`).
 * Setting `sd` drops a `cov` given in the file, and the other way round (unless both are
 * varied), so a spread can be swept whichever way the file wrote it.
 */
import { parseDocument, type Document } from 'yaml';
import { detectFormat } from '../scenario/parseText.js';
import { InputError } from '../scenario/inputError.js';
import { loadScenario } from '../scenario/loadScenario.js';
import { didYouMean } from '../scenario/nearestName.js';
import type { Scenario } from '../scenario/types.js';
import type { SweepValue } from './sweepTypes.js';

const DIST_PARAMETERS = ['mean', 'sd', 'cov', 'min', 'max'];
const SPREAD_PAIR: Record<string, string> = { sd: 'cov', cov: 'sd' };

type Plain = Record<string, unknown>;

function isPlain(x: unknown): x is Plain {
  return typeof x === 'object' && x !== null && !Array.isArray(x);
}

/** The base scenario, parsed once per runner and copied per case. */
export interface SweepBase {
  fileName: string;
  /** The base scenario as read. */
  scenario: Scenario;
  format: 'yaml' | 'json';
  /** A plain-object view, for checking paths. */
  plain: unknown;
  yaml: Document | null;
}

/** Validates the base scenario (loadScenario's errors) and keeps it ready for edits. */
export function parseSweepBase(text: string, fileName: string): SweepBase {
  const scenario = loadScenario(text, fileName);
  const format = detectFormat(text, fileName);
  if (format === 'json') return { fileName, scenario, format, plain: JSON.parse(text) as unknown, yaml: null };
  const yaml = parseDocument(text, { uniqueKeys: true });
  return { fileName, scenario, format, plain: yaml.toJS() as unknown, yaml };
}

/** What an edit does besides setting the path: a spread parameter it replaces. */
interface Edit {
  segments: string[];
  drop: string[] | null;
}

/** Where `path` lands in the scenario, or an InputError naming `field`. */
function planEdit(plain: unknown, path: string, field: string, varied: ReadonlySet<string>): Edit {
  const segments = path.split('.');
  if (segments.some((s) => s.trim() === '')) throw new InputError(field, `'${path}' is not a scenario path`);
  let node: unknown = plain;
  for (let k = 0; k < segments.length - 1; k++) {
    const here = segments.slice(0, k + 1).join('.');
    const key = segments[k];
    if (!isPlain(node) || !Object.hasOwn(node, key)) {
      const keys = isPlain(node) ? Object.keys(node) : [];
      throw new InputError(field, `'${path}' is not in the scenario: it has no '${here}'${didYouMean(key, keys)}`);
    }
    node = node[key];
    if (!isPlain(node)) {
      throw new InputError(field, `'${path}' is not in the scenario: '${here}' is a plain value (${JSON.stringify(node)}); vary '${here}' itself`);
    }
  }
  const leaf = segments[segments.length - 1];
  const parent = node as Plain;
  if (Object.hasOwn(parent, leaf)) {
    if (Array.isArray(parent[leaf])) throw new InputError(field, `'${path}' is a list; a sweep sets single values`);
  } else if (!('dist' in parent && DIST_PARAMETERS.includes(leaf))) {
    const candidates = 'dist' in parent ? [...Object.keys(parent), ...DIST_PARAMETERS] : Object.keys(parent);
    throw new InputError(field, `'${path}' is not in the scenario${didYouMean(leaf, candidates)}`);
  }
  const other = SPREAD_PAIR[leaf];
  const parentPath = segments.slice(0, -1).join('.');
  const drop =
    'dist' in parent && other !== undefined && Object.hasOwn(parent, other) && !varied.has(`${parentPath}.${other}`)
      ? [...segments.slice(0, -1), other]
      : null;
  return { segments, drop };
}

function setPlain(root: unknown, segments: string[], value: SweepValue): void {
  let node = root as Plain;
  for (const key of segments.slice(0, -1)) node = node[key] as Plain;
  node[segments[segments.length - 1]] = value;
}

function deletePlain(root: unknown, segments: string[]): void {
  let node = root as Plain;
  for (const key of segments.slice(0, -1)) node = node[key] as Plain;
  delete node[segments[segments.length - 1]];
}

/** Checks every path against the base scenario without applying anything. */
export function checkSweepPaths(base: SweepBase, paths: readonly string[], fieldOf: (path: string) => string = (p) => p): void {
  const varied = new Set(paths);
  for (const p of paths) planEdit(base.plain, p, fieldOf(p), varied);
}

/** The scenario text with the case's values set. */
export function applySweepValues(
  base: SweepBase,
  values: Readonly<Record<string, SweepValue>>,
  fieldOf: (path: string) => string = (p) => p,
): string {
  const varied = new Set(Object.keys(values));
  const edits = Object.keys(values).map((p) => ({ path: p, ...planEdit(base.plain, p, fieldOf(p), varied) }));
  if (base.yaml) {
    const doc = base.yaml.clone();
    for (const e of edits) {
      if (e.drop) doc.deleteIn(e.drop);
      doc.setIn(e.segments, values[e.path]);
    }
    return doc.toString({ lineWidth: 0 });
  }
  const copy = structuredClone(base.plain);
  for (const e of edits) {
    if (e.drop) deletePlain(copy, e.drop);
    setPlain(copy, e.segments, values[e.path]);
  }
  return `${JSON.stringify(copy, null, 2)}\n`;
}

/** The scenario of one case: the base with the values set, read by loadScenario. */
export function scenarioWithValues(
  base: SweepBase,
  values: Readonly<Record<string, SweepValue>>,
  fieldOf?: (path: string) => string,
): Scenario {
  return loadScenario(applySweepValues(base, values, fieldOf), base.fileName);
}
