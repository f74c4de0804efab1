/**
 * One content file from bytes to schema-valid data: read (size cap, strict UTF-8, sha256),
 * parse with positions, check against the kind's JSON Schema. What each kind then checks
 * and converts lives in pot.ts, coffee.ts, stove.ts, log.ts and site.ts.
 */
import { basename, extname } from 'node:path';
import { message } from './messages.ts';
import { readContentText } from './file-bytes.ts';
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

/** The id a file gives its entry: its name without .yaml or .yml. */
export function idOfFile(path: string): string {
  return basename(path, extname(path));
}

/** Read `path` (named `file` in messages) and check it against the `schema` schema. */
async function readValidFile<T>(
  schema: SchemaName,
  path: string,
  file: string,
): Promise<Checked<ValidFile<T>>> {
  const read = await readContentText(path, file);
  if (!read.ok) return { issues: [read.issue] };
  const parsed = parseYamlSource(read.text, file);
  if (parsed.value === undefined && parsed.issues.length > 0) return { issues: parsed.issues };
  if (parsed.value === null || parsed.value === undefined) {
    return { issues: [issueAt(parsed.source, [], 'empty-file', message('emptyFile', schema))] };
  }
  const issues = [...parsed.issues, ...schemaIssues(schema, parsed.value, parsed.source)];
  if (issues.length > 0) return { issues };
  const data = parsed.value as T;
  return {
    value: { id: idOfFile(path), hash: read.hash, source: parsed.source, data },
    issues: [],
  };
}

/** Read, check and build one entry: `build` makes the kind's own checks and the SI entry. */
export async function loadEntry<T, E>(
  schema: SchemaName,
  path: string,
  file: string,
  build: (valid: ValidFile<T>) => Checked<E>,
): Promise<Checked<E>> {
  const read = await readValidFile<T>(schema, path, file);
  return read.value === undefined ? { issues: read.issues } : build(read.value);
}
