/**
 * References between files: ids a site or a log names must be files that exist, and a
 * log's levels must be levels of its stove. A mistyped id gets the nearest existing one.
 */
import { message } from './messages.ts';
import type { ContentIssue } from './issues.ts';
import { nearest } from './nearest.ts';
import type { StoveEntry } from './types.ts';
import { issueAt, type YamlPath, type YamlSource } from './yaml-source.ts';

export type ReferencedKind = 'pot' | 'coffee' | 'stove';

/** Ids of the files present in each folder, sorted (whether or not each file is valid). */
export type KnownIds = Readonly<Record<ReferencedKind, readonly string[]>>;

/** An issue at `path` when `id` names no file of `kind`. */
export function unknownIdIssues(
  source: YamlSource,
  path: YamlPath,
  kind: ReferencedKind,
  id: string,
  known: KnownIds,
): ContentIssue[] {
  const ids = known[kind];
  if (ids.includes(id)) return [];
  return [
    issueAt(source, path, 'unknown-id', message('unknownId', kind, id, nearest(id, ids), ids)),
  ];
}

/** An issue at `path` when `stove` has no level labelled `level`. */
export function unknownLevelIssues(
  source: YamlSource,
  path: YamlPath,
  stove: StoveEntry,
  level: string,
): ContentIssue[] {
  const labels = stove.levels.map((each) => each.label);
  if (labels.includes(level)) return [];
  const wording = message('unknownLevel', level, stove.id, nearest(level, labels), labels);
  return [issueAt(source, path, 'unknown-level', wording)];
}
