/**
 * Content text to schema-valid data: parse with positions, check against the kind's JSON
 * Schema. No file system here, so the customer's page in the browser checks what a
 * customer types with the same rules and messages as the build (entry-file.ts reads files).
 */
import { message } from './messages.ts';
import type { ContentIssue } from './issues.ts';
import { schemaIssues, type SchemaName } from './schema-check.ts';
import { issueAt, parseYamlSource, type YamlSource } from './yaml-source.ts';

/** A value, or the issues that stopped it (never both empty). */
export interface Checked<T> {
  readonly value?: T;
  readonly issues: readonly ContentIssue[];
}

/** A file whose data matched its schema, so `data` has the shape its kind's type declares. */
export interface ValidFile<T> {
  /** File stem: "three-cup" for pots/three-cup.yaml. */
  readonly id: string;
  readonly hash: string;
  readonly source: YamlSource;
  readonly data: T;
}

/**
 * Control characters (but tab and line ends) and the bidirectional overrides, embeddings
 * and isolates (U+202A–U+202E, U+2066–U+2069; UAX #9) in keys or text: they would print
 * raw on a terminal or reorder a card's text (a right-to-left override turns a footer
 * around), so each is an issue at its place. At most MAX_UNSAFE per file.
 */
const UNSAFE_TEXT =
  /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f-\u009f\u202a-\u202e\u2066-\u2069]/;
const MAX_UNSAFE = 20;

function unsafeTextIssues(value: unknown, source: YamlSource): ContentIssue[] {
  const issues: ContentIssue[] = [];
  const visit = (node: unknown, path: (string | number)[]): void => {
    if (issues.length >= MAX_UNSAFE) return;
    if (typeof node === 'string') {
      const found = UNSAFE_TEXT.exec(node);
      if (found)
        issues.push(
          issueAt(source, path, 'bad-value', message('unsafeCharacter', found[0].codePointAt(0)!)),
        );
    } else if (Array.isArray(node)) node.forEach((item, i) => visit(item, [...path, i]));
    else if (node && typeof node === 'object')
      for (const [key, item] of Object.entries(node)) {
        const found = UNSAFE_TEXT.exec(key);
        if (found)
          issues.push(
            issueAt(
              source,
              [...path, key],
              'bad-value',
              message('unsafeCharacter', found[0].codePointAt(0)!),
              'key',
            ),
          );
        else visit(item, [...path, key]);
      }
  };
  visit(value, []);
  return issues;
}

/** Text already read (named `file`, its entry `id`) checked against the `schema` schema. */
export function validText<T>(
  schema: SchemaName,
  text: string,
  hash: string,
  id: string,
  file: string,
): Checked<ValidFile<T>> {
  const read = { text, hash };
  const parsed = parseYamlSource(read.text, file);
  if (parsed.value === undefined && parsed.issues.length > 0) return { issues: parsed.issues };
  if (parsed.value === null || parsed.value === undefined) {
    return { issues: [issueAt(parsed.source, [], 'empty-file', message('emptyFile', schema))] };
  }
  const issues = [
    ...parsed.issues,
    ...unsafeTextIssues(parsed.value, parsed.source),
    ...schemaIssues(schema, parsed.value, parsed.source),
  ];
  if (issues.length > 0) return { issues };
  const data = parsed.value as T;
  return {
    value: { id, hash: read.hash, source: parsed.source, data },
    issues: [],
  };
}
