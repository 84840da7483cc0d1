/**
 * The rule of one field of an already shape-checked scenario: walk the shape (scenarioShape.ts)
 * along a path, taking at every union the branch the scenario's own value there satisfies. A
 * sweep uses it to check a varied value against its field alone instead of shape-checking the
 * whole scenario per case.
 *
 * Why that is the same check: the shape has no transforms or defaults (its output is its input
 * with object keys in the shape's order), and every union below the root is chosen by keys or by
 * `dist`, never by a sibling's value. So, with everything else unchanged, the edited scenario
 * passes the whole shape exactly when the new value passes the field's rule and any key dropped
 * beside it is optional there. Changing `dist` itself would change the branch: that field's rule
 * is the branch's literal, so any other distribution fails here and takes the whole check.
 */
import type * as z from 'zod';
import { scenarioShape } from './scenarioShape.js';

type Schema = z.core.$ZodType;

export interface FieldRule {
  /** Does `value` pass the field's own rule? */
  accepts(value: unknown): boolean;
  /** The keys of the field's parent object in the shape's order (the order the shape check gives them). */
  parentKeys: readonly string[];
  /** Is `key` an optional key of the parent object? */
  optional(key: string): boolean;
}

function def(s: Schema): z.core.$ZodTypeDef & Record<string, unknown> {
  return s._zod.def as z.core.$ZodTypeDef & Record<string, unknown>;
}

function unwrapOptional(s: Schema): Schema {
  let out = s;
  while (def(out).type === 'optional') out = def(out).innerType as Schema;
  return out;
}

function passes(s: Schema, value: unknown): boolean {
  return (s as z.ZodType).safeParse(value).success;
}

/** The branch of a union that `value` satisfies (the first, as the shape check takes), or null. */
function branchOf(s: Schema, value: unknown): Schema | null {
  let out = unwrapOptional(s);
  while (def(out).type === 'union') {
    const options = def(out).options as Schema[];
    const chosen = options.find((o) => passes(o, value));
    if (chosen === undefined) return null;
    out = unwrapOptional(chosen);
  }
  return out;
}

/**
 * The rule of the field at `segments` in the shape-checked scenario `shaped`, or null when the
 * path does not lead through objects and records of the shape (the caller then checks the
 * whole scenario, which also names what is wrong).
 */
export function fieldRuleAt(shaped: unknown, segments: readonly string[]): FieldRule | null {
  if (segments.length === 0) return null;
  let schema: Schema = scenarioShape;
  let node: unknown = shaped;
  let parent: Schema | null = null;
  for (let k = 0; k < segments.length; k++) {
    const here = branchOf(schema, node);
    if (here === null || typeof node !== 'object' || node === null || Array.isArray(node)) return null;
    const key = segments[k];
    const d = def(here);
    let next: Schema | undefined;
    if (d.type === 'object') next = (d.shape as Record<string, Schema>)[key];
    else if (d.type === 'record') next = d.valueType as Schema;
    if (next === undefined || (k < segments.length - 1 && !Object.hasOwn(node, key))) return null;
    parent = here;
    schema = next;
    node = (node as Record<string, unknown>)[key];
  }
  const leaf = schema;
  const parentDef = def(parent!);
  const shape = parentDef.type === 'object' ? (parentDef.shape as Record<string, Schema>) : null;
  return {
    accepts: (value) => value !== undefined && passes(leaf, value),
    parentKeys: shape ? Object.keys(shape) : [],
    optional: (key) => shape !== null && shape[key] !== undefined && def(shape[key]).type === 'optional',
  };
}
