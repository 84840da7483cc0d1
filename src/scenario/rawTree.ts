/**
 * The scenario as plain data (what YAML or JSON gave) plus the line of every key, so later
 * checks can name the line of the field they reject.
 */
export type RawValue = string | number | boolean | null | RawValue[] | RawMap;
export interface RawMap {
  [key: string]: RawValue;
}

export interface RawTree {
  readonly value: RawValue;
  /** 1-based line of each field path (`column.material.E`, `correlation[0]`), where known. */
  readonly lines: ReadonlyMap<string, number>;
  readonly format: 'yaml' | 'json';
}

export type PathSegment = string | number;

/** `['column', 'ends', 'bottom']` → `column.ends.bottom`; indexes as `correlation[0]`. */
export function formatPath(path: readonly PathSegment[]): string {
  let out = '';
  for (const seg of path) {
    if (typeof seg === 'number') out += `[${seg}]`;
    else out += out === '' ? seg : `.${seg}`;
  }
  return out;
}

/** The line of a path, or of its nearest ancestor that has one. */
export function lineOf(lines: ReadonlyMap<string, number>, path: readonly PathSegment[]): number | undefined {
  for (let n = path.length; n > 0; n--) {
    const line = lines.get(formatPath(path.slice(0, n)));
    if (line !== undefined) return line;
  }
  return undefined;
}

/** Sets an own enumerable property, even for names such as `constructor`. */
export function setOwn(map: RawMap, key: string, value: RawValue): void {
  Object.defineProperty(map, key, { value, enumerable: true, writable: true, configurable: true });
}
