/**
 * A sweep case's values set in the base scenario (parsed and shape-checked once per runner): each
 * value is checked against its own field's rule, then the case is read by the same meaning stage
 * as loadScenario, so units, expressions (`L/1500` follows a varied length) and every validation
 * rule stay in one place, and the base file's lines still point at the user's file. A value its
 * field refuses goes through the whole shape check, which words the message. `applySweepValues` writes the same edit as text (YAML
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
import { buildScenario } from '../scenario/buildScenario.js';
import { scenarioShape, type ScenarioShape } from '../scenario/scenarioShape.js';
import { fieldRuleAt, type FieldRule } from '../scenario/shapeAtPath.js';
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
  /** The shape-checked base (frozen: cases share what they do not edit). */
  shaped: ScenarioShape;
  /** Each set of varied paths' edits, with the rule of every varied field (filled as cases come). */
  plans: Map<string, PlannedEdit[]>;
}

/** One varied path: where it lands, what it drops, and its field's rule (null: check the whole scenario). */
interface PlannedEdit extends Edit {
  path: string;
  rule: FieldRule | null;
}

function deepFreeze<T>(x: T): T {
  if (typeof x === 'object' && x !== null && !Object.isFrozen(x)) {
    Object.freeze(x);
    for (const v of Object.values(x)) deepFreeze(v);
  }
  return x;
}

/** Validates the base scenario (loadScenario's errors) and keeps it ready for edits. */
export function parseSweepBase(text: string, fileName: string): SweepBase {
  const scenario = loadScenario(text, fileName);
  const tree = parseText(text, fileName);
  const sha256 = scenario.sha256;
  const format = detectFormat(text, fileName);
  // loadScenario has shape-checked this very tree, so this parse succeeds
  const shaped = deepFreeze(scenarioShape.parse(tree.value));
  const plans = new Map<string, PlannedEdit[]>();
  if (format === 'json') return { fileName, scenario, format, plain: JSON.parse(text) as unknown, yaml: null, tree, sha256, shaped, plans };
  const yaml = parseDocument(text, { uniqueKeys: true });
  return { fileName, scenario, format, plain: yaml.toJS() as unknown, yaml, tree, sha256, shaped, plans };
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

/** A copy of a map with the same own keys in the same order. */
function shallowCopy(v: RawMap): RawMap {
  const out: RawMap = {};
  for (const k of Object.keys(v)) setOwn(out, k, v[k]);
  return out;
}

/** The edits of a set of varied paths (planEdit's errors, in the order of the values). */
function plannedEdits(base: SweepBase, paths: string[], fieldOf: (path: string) => string): PlannedEdit[] {
  const key = paths.join('\n');
  const known = base.plans.get(key);
  if (known !== undefined) return known;
  const varied = new Set(paths);
  const plans = paths.map((p) => {
    const e = planEdit(base.plain, p, fieldOf(p), varied);
    return { path: p, ...e, rule: fieldRuleAt(base.shaped, e.segments) };
  });
  base.plans.set(key, plans);
  return plans;
}

/**
 * The case's values set in a copy of the shape-checked base (only the objects on the edited paths
 * are copied), or null when some value does not pass its field's own rule (shapeAtPath.ts).
 */
function shapedWithValues(base: SweepBase, plans: readonly PlannedEdit[], values: Readonly<Record<string, SweepValue>>): ScenarioShape | null {
  for (const e of plans) {
    if (e.rule === null || !e.rule.accepts(values[e.path])) return null;
    if (e.drop !== null && !e.rule.optional(e.drop[e.drop.length - 1])) return null;
  }
  const root = shallowCopy(base.shaped as unknown as RawMap);
  const copies = new Set<RawMap>([root]);
  for (const e of plans) {
    const leaf = e.segments[e.segments.length - 1];
    let grand: RawMap | null = null;
    let node = root;
    for (let k = 0; k < e.segments.length - 1; k++) {
      const seg = e.segments[k];
      let child = node[seg] as RawMap;
      if (!copies.has(child)) {
        child = shallowCopy(child);
        copies.add(child);
        setOwn(node, seg, child);
      }
      grand = node;
      node = child;
    }
    if (e.drop !== null) delete node[e.drop[e.drop.length - 1]];
    if (Object.hasOwn(node, leaf)) {
      setOwn(node, leaf, values[e.path]);
      continue;
    }
    // a new key (sd in place of cov): the parent rebuilt in the shape's key order, as the shape check gives it
    if (!e.rule!.parentKeys.includes(leaf) || grand === null) return null;
    const rebuilt: RawMap = {};
    for (const k of e.rule!.parentKeys) {
      if (k === leaf) setOwn(rebuilt, k, values[e.path]);
      else if (Object.hasOwn(node, k)) setOwn(rebuilt, k, node[k]);
    }
    copies.add(rebuilt);
    setOwn(grand, e.segments[e.segments.length - 2], rebuilt);
  }
  return root as unknown as ScenarioShape;
}

/**
 * The case's shape-checked data (what the shape check of treeWithValues gives), or null when a
 * value does not pass its field's own rule; planEdit's InputErrors for a path not in the scenario.
 */
export function shapedCase(
  base: SweepBase,
  values: Readonly<Record<string, SweepValue>>,
  fieldOf: (path: string) => string = (p) => p,
): ScenarioShape | null {
  return shapedWithValues(base, plannedEdits(base, Object.keys(values), fieldOf), values);
}

/** The name of a case's scenario: the base text's sha256 and the case's values. */
function caseSha256(base: SweepBase, values: Readonly<Record<string, SweepValue>>): string {
  return createHash('sha256').update(base.sha256).update(JSON.stringify(values)).digest('hex');
}

/**
 * The scenario of one case. Each varied value is checked against its own field's rule and set in
 * the already shape-checked base, then read by the meaning stage (units, expressions such as
 * `L/1500` that follow a varied length, cross-field rules) as loadScenario reads it. A value its
 * field refuses takes scenarioWithValuesChecked instead, so every message stays the whole check's.
 */
export function scenarioWithValues(
  base: SweepBase,
  values: Readonly<Record<string, SweepValue>>,
  fieldOf: (path: string) => string = (p) => p,
): Scenario {
  const shaped = shapedCase(base, values, fieldOf);
  if (shaped === null) return scenarioWithValuesChecked(base, values, fieldOf);
  return buildScenario(shaped, base.tree.lines, { fileName: base.fileName, format: base.tree.format, sha256: caseSha256(base, values) });
}

/**
 * The scenario of one case: the base tree with the values set, through the shape and meaning
 * stages of loadScenario (the whole scenario shape-checked again; no text written or parsed).
 */
export function scenarioWithValuesChecked(
  base: SweepBase,
  values: Readonly<Record<string, SweepValue>>,
  fieldOf: (path: string) => string = (p) => p,
): Scenario {
  return scenarioFromTree(treeWithValues(base, values, fieldOf), base.fileName, caseSha256(base, values));
}

/** The base's parsed tree with the case's values set (a copy; the base's lines). */
export function treeWithValues(
  base: SweepBase,
  values: Readonly<Record<string, SweepValue>>,
  fieldOf: (path: string) => string = (p) => p,
): RawTree {
  const varied = new Set(Object.keys(values));
  const value = cloneRaw(base.tree.value);
  for (const p of Object.keys(values)) {
    const e = planEdit(base.plain, p, fieldOf(p), varied);
    if (e.drop) deletePlain(value, e.drop);
    setPlain(value, e.segments, values[p]);
  }
  return { value, lines: base.tree.lines, format: base.tree.format };
}
