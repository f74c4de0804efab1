/**
 * YAML text with positions: parse one file into a yaml Document that keeps every node's
 * range, and find the node, line and column of any value by its path. Errors point at
 * these positions; the calibration step rewrites values through the same Document (its
 * `setIn` and `toString` keep comments and layout).
 */
import {
  isAlias,
  isMap,
  isPair,
  isScalar,
  isSeq,
  LineCounter,
  parseDocument,
  type Document,
  type Node,
  type Pair,
  type YAMLError,
  visit,
  YAMLParseError,
} from 'yaml';
import { message, type ContentMessage } from './messages.ts';
import { ContentIssue, type ContentIssueCode, type IssueLocation } from './issues.ts';
import type { SourceRef } from './types.ts';

/** Keys and list indices from the document root, e.g. ['levels', 2, 'power_w']. */
export type YamlPath = readonly (string | number)[];

export interface YamlSource {
  /** As shown in messages: relative to the content folder, or the path as given. */
  readonly file: string;
  readonly text: string;
  readonly doc: Document.Parsed;
  readonly lineCounter: LineCounter;
}

/** Aliases (*name) a file may expand; more is refused as a resource-exhaustion attempt. */
export const MAX_ALIAS_COUNT = 100;

export interface ParsedYaml {
  readonly source: YamlSource;
  /** The plain data (undefined when the YAML could not be read; it may come with issues). */
  readonly value: unknown;
  readonly issues: readonly ContentIssue[];
}

function yamlIssue(source: YamlSource, error: YAMLError): ContentIssue {
  const offset = error.pos[0];
  if (error.code === 'DUPLICATE_KEY') {
    const path = pathAtOffset(source, offset);
    const at = { ...positionOfOffset(source, offset), file: source.file, field: fieldName(path) };
    return new ContentIssue('duplicate-key', at, message('duplicateKey', String(path.at(-1))));
  }
  const detail = error.message.split('\n')[0]!.replace(/ at line \d+, column \d+:?$/, '');
  const at = { ...positionOfOffset(source, offset), file: source.file, field: '' };
  return new ContentIssue('yaml-syntax', at, message('yamlSyntax', detail, error.code));
}

function tooDeepAt(source: YamlSource, offset: number): ContentIssue {
  const at = { ...positionOfOffset(source, offset), file: source.file, field: '' };
  return new ContentIssue('too-deep', at, message('nestedTooDeeply'));
}

/** A repeated key in any mapping of the document, as the yaml package's own error for it. */
function duplicateKeyErrors(doc: Document.Parsed): YAMLError[] {
  const errors: YAMLError[] = [];
  visit(doc, {
    Map(_key, map) {
      const seen = new Set<unknown>();
      for (const pair of map.items) {
        const key = isScalar(pair.key) ? pair.key.value : pair.key;
        if (seen.has(key)) {
          const range = (pair.key as Node | null)?.range ?? [0, 0, 0];
          errors.push(
            new YAMLParseError([range[0], range[1]], 'DUPLICATE_KEY', 'Map keys must be unique'),
          );
        } else seen.add(key);
      }
    },
  });
  return errors;
}

/** The same problem at the same place once (the yaml package can repeat an error per level). */
function uniqueIssues(issues: readonly ContentIssue[]): ContentIssue[] {
  const seen = new Set<string>();
  return issues.filter((issue) => {
    const key = `${issue.line}:${issue.column}:${issue.code}:${JSON.stringify(issue.message)}`;
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}

/**
 * Parse one file's text. Syntax errors come back as issues with positions and no value; a
 * duplicate key is an issue too, but the rest of the file is still read (the later value wins).
 */
export function parseYamlSource(text: string, file: string): ParsedYaml {
  const lineCounter = new LineCounter();
  // CR-only line ends (old Mac editors) as the line feeds YAML 1.2 reads (§5.4); the
  // offsets do not move, so lines and columns stay the file's.
  const yamlText = text.includes('\r') && !text.includes('\n') ? text.replaceAll('\r', '\n') : text;
  // uniqueKeys compares every key with every earlier one (quadratic: a 1 MiB file of
  // 76,000 keys took minutes); duplicateKeyErrors finds the same keys with a Set.
  const doc = parseDocument(yamlText, { lineCounter, prettyErrors: true, uniqueKeys: false });
  const source: YamlSource = { file, text: yamlText, doc, lineCounter };
  const problems = [...doc.errors, ...doc.warnings, ...duplicateKeyErrors(doc)];
  // Nesting deep enough to overflow the parser's stack (10,000 `[`) makes the yaml package
  // report the overflow, and often hundreds of follow-on errors at the same place: one
  // issue says it instead.
  const exhausted = problems.find((error) => error.code === 'RESOURCE_EXHAUSTION');
  if (exhausted) return { source, value: undefined, issues: [tooDeepAt(source, exhausted.pos[0])] };
  const issues = uniqueIssues(problems.map((error) => yamlIssue(source, error)));
  if (problems.some((error) => error.code !== 'DUPLICATE_KEY'))
    return { source, value: undefined, issues };
  try {
    return { source, value: doc.toJS({ maxAliasCount: MAX_ALIAS_COUNT }), issues };
  } catch (error) {
    // Turning a nesting the parser survived into plain data can still overflow the stack.
    if (error instanceof RangeError)
      return { source, value: undefined, issues: [tooDeepAt(source, 0)] };
    if (!(error instanceof ReferenceError)) throw error;
    const tooMany = issueAt(
      source,
      [],
      'too-many-aliases',
      message('tooManyAliases', MAX_ALIAS_COUNT),
    );
    return { source, value: undefined, issues: [...issues, tooMany] };
  }
}

function resolved(source: YamlSource, node: unknown): unknown {
  return isAlias(node) ? node.resolve(source.doc) : node;
}

function pairFor(map: unknown, key: string): Pair | undefined {
  if (!isMap(map)) return undefined;
  return map.items.find((pair) => String(isScalar(pair.key) ? pair.key.value : pair.key) === key);
}

interface Step {
  readonly node: Node | undefined;
  /** The key node of the last step, when it was a mapping key. */
  readonly key: Node | undefined;
  /** How many segments of the path exist in the document. */
  readonly depth: number;
}

function walk(source: YamlSource, path: YamlPath): Step {
  let node: unknown = resolved(source, source.doc.contents);
  let key: Node | undefined;
  let depth = 0;
  for (const segment of path) {
    let next: unknown;
    if (typeof segment === 'number' && isSeq(node)) {
      next = node.items[segment];
      key = undefined;
    } else {
      const pair = pairFor(node, String(segment));
      next = pair?.value;
      key = pair?.key as Node | undefined;
    }
    if (next === undefined || next === null) break;
    node = resolved(source, next);
    depth += 1;
  }
  return { node: (node ?? undefined) as Node | undefined, key, depth };
}

/** The node at `path` (aliases resolved), or undefined when the path is not in the file. */
export function nodeAt(source: YamlSource, path: YamlPath): Node | undefined {
  const step = walk(source, path);
  return step.depth === path.length ? step.node : undefined;
}

/** Offsets [start, end) of the value at `path` in the text, for rewriting it in place. */
export function rangeAt(source: YamlSource, path: YamlPath): readonly [number, number] | undefined {
  const range = nodeAt(source, path)?.range;
  return range ? [range[0], range[1]] : undefined;
}

function positionOfOffset(source: YamlSource, offset: number): { line: number; column: number } {
  const { line, col } = source.lineCounter.linePos(offset);
  return { line, column: col };
}

/**
 * Line and column (1-based) of the value at `path`, or of its key with on = 'key'. A path
 * that is not in the file gives the position of the deepest part of it that is.
 */
export function positionAt(
  source: YamlSource,
  path: YamlPath,
  on: 'value' | 'key' = 'value',
): { line: number; column: number } {
  const step = walk(source, path);
  const atEnd = step.depth === path.length && step.depth > 0;
  // A key written with no value (`mass_g:`) holds an empty scalar: point at the key then too.
  const empty = isScalar(step.node) && step.node.value === null && !step.node.source;
  const node = atEnd && step.key && (on === 'key' || empty) ? step.key : step.node;
  return positionOfOffset(source, node?.range?.[0] ?? 0);
}

/** `base.valve_height_mm`, `levels[2].power_w`, `cup_g[0][1]`; '' for the root. */
export function fieldName(path: YamlPath): string {
  return path
    .map((segment, index) =>
      typeof segment === 'number' ? `[${segment}]` : index === 0 ? segment : `.${segment}`,
    )
    .join('');
}

/** Where the value at `path` is, for an entry's `source` (path [] = the document root). */
export function refAt(source: YamlSource, path: YamlPath): SourceRef {
  return { file: source.file, ...positionAt(source, path) };
}

export function locate(
  source: YamlSource,
  path: YamlPath,
  on: 'value' | 'key' = 'value',
): IssueLocation {
  return { file: source.file, ...positionAt(source, path, on), field: fieldName(path) };
}

export function issueAt(
  source: YamlSource,
  path: YamlPath,
  code: ContentIssueCode,
  wording: ContentMessage,
  on: 'value' | 'key' = 'value',
): ContentIssue {
  return new ContentIssue(code, locate(source, path, on), wording);
}

/** The path of the innermost key or item whose text covers `offset`. */
export function pathAtOffset(source: YamlSource, offset: number): YamlPath {
  const path: (string | number)[] = [];
  const covers = (node: unknown): boolean => {
    const range = (node as Node | null)?.range;
    return !!range && range[0] <= offset && offset < Math.max(range[2], range[0] + 1);
  };
  let node: unknown = source.doc.contents;
  for (;;) {
    if (isMap(node)) {
      const pair = node.items.find(
        (item) => isPair(item) && (covers(item.key) || covers(item.value)),
      );
      if (!pair) break;
      path.push(String(isScalar(pair.key) ? pair.key.value : pair.key));
      if (covers(pair.key)) break;
      node = pair.value;
    } else if (isSeq(node)) {
      const index = node.items.findIndex(covers);
      if (index < 0) break;
      path.push(index);
      node = node.items[index];
    } else {
      break;
    }
  }
  return path;
}
