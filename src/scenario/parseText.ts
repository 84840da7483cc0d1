/**
 * Scenario text → RawTree. YAML through the `yaml` package (keeping node ranges for line
 * numbers); JSON strictly through JSON.parse, then through `yaml` again only to learn lines
 * and to catch duplicate keys, which JSON.parse would silently merge.
 */
import { LineCounter, isAlias, isMap, isScalar, isSeq, parseDocument, type Node, type YAMLError } from 'yaml';
import { InputError } from './inputError.js';
import { setOwn, formatPath, type PathSegment, type RawMap, type RawTree, type RawValue } from './rawTree.js';

const MAX_DEPTH = 32;
/** The largest scenario read: in bytes by the CLI's reader, in characters here (never more than bytes). */
export const MAX_TEXT_LENGTH = 4_000_000;

/** A UTF-8 byte order mark some editors put first: not part of the text. */
export function stripByteOrderMark(text: string): string {
  return text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
}

/** Decides JSON or YAML: by extension, or for stdin (`-`) by a leading `{`. */
export function detectFormat(text: string, fileName: string): 'yaml' | 'json' {
  if (/\.json$/i.test(fileName)) return 'json';
  if (fileName === '-' || fileName === '') return text.trimStart().startsWith('{') ? 'json' : 'yaml';
  return 'yaml';
}

export function parseText(withMark: string, fileName: string): RawTree {
  const text = stripByteOrderMark(withMark);
  const where = fileName === '-' ? 'stdin' : fileName;
  if (text.length > MAX_TEXT_LENGTH) throw new InputError(where, `is too large (${text.length} characters; the limit is ${MAX_TEXT_LENGTH})`);
  if (text.trim() === '') throw new InputError(where, 'is empty: a scenario needs at least `stanchion: 1`, `column`, `loads` and `strength`');
  const format = detectFormat(text, fileName);
  if (format === 'json') checkJsonSyntax(text, where);
  return fromYamlParser(text, where, format);
}

function checkJsonSyntax(text: string, where: string): void {
  try {
    JSON.parse(text);
  } catch (e) {
    const message = e instanceof Error ? e.message : String(e);
    const position = /position (\d+)/.exec(message);
    const lineMatch = /line (\d+)/.exec(message);
    const line = lineMatch ? Number(lineMatch[1]) : position ? lineAt(text, Number(position[1])) : undefined;
    throw new InputError(where, `is not valid JSON: ${message.replace(/\s*\(line \d+ column \d+\)/, '')}`, line);
  }
}

function lineAt(text: string, offset: number): number {
  let line = 1;
  for (let i = 0; i < offset && i < text.length; i++) if (text.charCodeAt(i) === 10) line++;
  return line;
}

function fromYamlParser(text: string, where: string, format: 'yaml' | 'json'): RawTree {
  const lineCounter = new LineCounter();
  let doc;
  try {
    doc = parseDocument(text, { lineCounter, prettyErrors: true, uniqueKeys: true });
  } catch (e) {
    if (e instanceof RangeError) throw new InputError(where, 'is nested too deeply');
    throw e;
  }
  const problem: YAMLError | undefined = doc.errors[0] ?? doc.warnings[0];
  if (problem !== undefined && format === 'json' && problem.code !== 'DUPLICATE_KEY') {
    // Valid JSON the YAML reader dislikes: use JSON.parse's value, without line numbers.
    return { value: fromJsonValue(JSON.parse(text) as unknown, [], where), lines: new Map(), format };
  }
  if (problem !== undefined) {
    const line = problem.linePos?.[0]?.line;
    const firstLine = problem.message.split('\n')[0]!.replace(/ at line \d+, column \d+:?$/, '');
    throw new InputError(where, `is not valid ${format === 'json' ? 'JSON' : 'YAML'}: ${firstLine}`, line);
  }
  const lines = new Map<string, number>();
  const lineOfNode = (node: Node | null | undefined): number | undefined => {
    const offset = node?.range?.[0];
    return offset === undefined ? undefined : lineCounter.linePos(offset).line;
  };

  const walk = (node: unknown, path: PathSegment[]): RawValue => {
    const field = path.length === 0 ? where : formatPath(path);
    if (path.length > MAX_DEPTH) throw new InputError(field, 'is nested too deeply', lineOfNode(node as Node));
    if (isAlias(node)) {
      throw new InputError(field, `uses the alias *${node.source}: anchors and aliases are not supported, write the value out`, lineOfNode(node));
    }
    if (isScalar(node)) {
      const v = node.value;
      if (v === null || typeof v === 'string' || typeof v === 'boolean') return v;
      if (typeof v === 'number') return v; // NaN and Infinity (.nan, .inf) are rejected by the shape check
      throw new InputError(field, `holds a value of an unsupported type (${node.tag ?? typeof v})`, lineOfNode(node));
    }
    if (isSeq(node)) {
      return node.items.map((item, i) => walk(item, [...path, i]));
    }
    if (isMap(node)) {
      const map: RawMap = {};
      for (const pair of node.items) {
        const keyNode = pair.key;
        if (!isScalar(keyNode) || !(typeof keyNode.value === 'string' || typeof keyNode.value === 'number')) {
          throw new InputError(field, 'has a key that is not a plain name', lineOfNode(keyNode as Node) ?? lineOfNode(node));
        }
        const key = String(keyNode.value);
        const childPath = [...path, key];
        if (key === '__proto__') throw new InputError(formatPath(childPath), 'is not an allowed key', lineOfNode(keyNode));
        const line = lineOfNode(keyNode);
        if (line !== undefined) lines.set(formatPath(childPath), line);
        setOwn(map, key, walk(pair.value, childPath));
      }
      return map;
    }
    if (node === null || node === undefined) return null;
    throw new InputError(field, 'holds something that is not a value', lineOfNode(node as Node));
  };

  // Sequence items get their own line too (correlation[0]).
  const recordItemLines = (node: unknown, path: PathSegment[]): void => {
    if (path.length > MAX_DEPTH) return;
    if (isSeq(node)) {
      node.items.forEach((item, i) => {
        const line = lineOfNode(item as Node);
        if (line !== undefined) lines.set(formatPath([...path, i]), line);
        recordItemLines(item, [...path, i]);
      });
    } else if (isMap(node)) {
      for (const pair of node.items) if (isScalar(pair.key)) recordItemLines(pair.value, [...path, String(pair.key.value)]);
    }
  };

  const value = walk(doc.contents, []);
  recordItemLines(doc.contents, []);
  return { value, lines, format };
}

function fromJsonValue(v: unknown, path: PathSegment[], where: string): RawValue {
  const field = path.length === 0 ? where : formatPath(path);
  if (path.length > MAX_DEPTH) throw new InputError(field, 'is nested too deeply');
  if (v === null || typeof v === 'string' || typeof v === 'number' || typeof v === 'boolean') return v;
  if (Array.isArray(v)) return v.map((item, i) => fromJsonValue(item, [...path, i], where));
  const map: RawMap = {};
  for (const [key, item] of Object.entries(v as Record<string, unknown>)) {
    if (key === '__proto__') throw new InputError(formatPath([...path, key]), 'is not an allowed key');
    setOwn(map, key, fromJsonValue(item, [...path, key], where));
  }
  return map;
}
