/**
 * A sweep case's values set in the base scenario's parsed tree (parsed once per runner), then
 * read by the same shape and meaning stages as loadScenario: units, expressions (`L/1500`
 * follows a varied length) and every validation rule stay in one place, and the base file's
 * lines still point at the user's file. `applySweepValues` writes the same edit as text (YAML
 * edited as a document, comments kept; JSON as a plain object) for people to read.
 *
 * A path is a contract path (`column.length`, `loads.dead`, `column.ends.bottom.rotation`)
 * or, for a random variable, one of its parameters (`column.ends.bottom.rotation.mean`).
 * Setting `sd` drops a `cov` given in the file, and the other way round (unless both are
 * varied), so a spread can be swept whichever way the file wrote it.
 */
import { parseDocument, type Document } from 'yaml';
import { createHash } from 'node:crypto';
import { detectFormat, parseText } from '../scenario/parseText.js';
import { InputError } from '../scenario/inputError.js';
import { loadScenario, scenarioFromTree } from '../scenario/loadScenario.js';
import { setOwn, type RawMap, type RawValue, type RawTree } from '../scenario/rawTree.js';
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
  /** The parsed tree and line of every key; each case edits a copy. */
  tree: RawTree;
  /** sha256 of the base text; a case's scenario is named by it and the case's values. */
  sha256: string;
}

/** Validates the base scenario (loadScenario's errors) and keeps it ready for edits. */
export function parseSweepBase(text: string, fileName: string): SweepBase {
  const scenario = loadScenario(text, fileName);
  const tree = parseText(text, fileName);
  const sha256 = scenario.sha256;
  const format = detectFormat(text, fileName);
  if (format === 'json') return { fileName, scenario, format, plain: JSON.parse(text) as unknown, yaml: null, tree, sha256 };
  const yaml = parseDocument(text, { uniqueKeys: true });
  return { fileName, scenario, format, plain: yaml.toJS() as unknown, yaml, tree, sha256 };
}

/** A deep copy of a raw tree value (own keys kept as own keys, whatever their names). */
function cloneRaw(v: RawValue): RawValue {
  if (Array.isArray(v)) return v.map(cloneRaw);
  if (typeof v !== 'object' || v === null) return v;
  const out: RawMap = {};
  for (const k of Object.keys(v)) setOwn(out, k, cloneRaw(v[k]));
  return out;
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
  setOwn(node as RawMap, segments[segments.length - 1], value);
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

/**
 * The scenario of one case: the base tree with the values set, through the shape and meaning
 * stages of loadScenario (no text written or parsed per case).
 */
export function scenarioWithValues(
  base: SweepBase,
  values: Readonly<Record<string, SweepValue>>,
  fieldOf: (path: string) => string = (p) => p,
): Scenario {
  const varied = new Set(Object.keys(values));
  const value = cloneRaw(base.tree.value);
  for (const p of Object.keys(values)) {
    const e = planEdit(base.plain, p, fieldOf(p), varied);
    if (e.drop) deletePlain(value, e.drop);
    setPlain(value, e.segments, values[p]);
  }
  const sha256 = createHash('sha256').update(base.sha256).update(JSON.stringify(values)).digest('hex');
  return scenarioFromTree({ value, lines: base.tree.lines, format: base.tree.format }, base.fileName, sha256);
}
