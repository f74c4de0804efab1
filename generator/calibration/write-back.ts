/**
 * Putting fitted values back into the entries' YAML, keeping everything else of the file
 * byte for byte: comments, blank lines, key order, quoting, flow or block style.
 *
 * The yaml Document gives each node's range; the new number is spliced into the text there
 * (an existing value is replaced, a new key is added after the map's last pair: inside the
 * braces of a flow map, on a new line of a block map). `String(doc)` after `doc.setIn` would
 * be simpler but re-lays out the file (it moves a comment after `levels:` onto a line of its
 * own, pads `[88, 94]` to `[ 88, 94 ]` and rewrites `0.8e-12` as `8e-13`). The Document API
 * still checks the result: the edited text must parse to exactly the data `doc.setIn` gives.
 *
 * Only fitted parameters are written; a parameter kept at its prior never is.
 */
import { isDeepStrictEqual } from 'node:util';
import { isMap, isScalar, type Node, type Pair } from 'yaml';
import type { StoveEntry } from '../content/types.ts';
import {
  nodeAt,
  parseYamlSource,
  rangeAt,
  type YamlPath,
  type YamlSource,
} from '../content/yaml-source.ts';
import type { FitReport } from './types.ts';

export type EntryKind = 'pot' | 'coffee' | 'stove';

export interface EntryEdit {
  readonly entry: EntryKind;
  /** Key path in the entry file, e.g. ['levels', 1, 'heat_to_pot_w']. */
  readonly path: YamlPath;
  /** In the file's unit (m², W, W/K: the same as SI for these keys), rounded for writing. */
  readonly value: number;
  readonly parameterId: string;
  /** Where the value came from, written as a comment at the end of its line (e.g. "fitted ± 3 % from logs/x.yaml, 2026-12-02"). */
  readonly note?: string;
}

/** The edits a report asks for: one per fitted parameter, in the report's order. */
export function plannedEdits(report: FitReport, stove: StoveEntry): EntryEdit[] {
  return report.estimates.flatMap((estimate): EntryEdit[] => {
    if (estimate.status !== 'fitted') return [];
    const { parameter } = estimate;
    const value = roundedForWriting(estimate.value, estimate.sigma);
    const parameterId = parameter.id;
    switch (parameter.kind) {
      case 'permeability':
        return [{ entry: 'coffee', path: ['permeability_m2'], value, parameterId }];
      case 'heat-loss':
        return [{ entry: 'pot', path: ['base', 'heat_loss_w_per_k'], value, parameterId }];
      case 'tightening':
        return [
          {
            entry: 'coffee',
            path: ['bed', 'tightening', 'final_share'],
            value: Math.min(1, value),
            parameterId,
          },
        ];
      case 'heat': {
        const index = stove.levels.findIndex((level) => level.label === parameter.level);
        return [{ entry: 'stove', path: ['levels', index, 'heat_to_pot_w'], value, parameterId }];
      }
    }
  });
}

/**
 * `value` rounded to two significant digits of its σ (the GUM's habit, JCGM 100:2008 §7.2.6):
 * roundedForWriting(323.2467, 1.4) = 323.2; roundedForWriting(1.0917e-12, 3.7e-14) = 1.092e-12.
 * Never fewer than two significant digits of the value.
 */
export function roundedForWriting(value: number, sigma: number): number {
  const digits =
    sigma > 0 && Number.isFinite(sigma)
      ? Math.floor(Math.log10(Math.abs(value))) - Math.floor(Math.log10(sigma)) + 2
      : 6;
  return Number(value.toPrecision(Math.min(15, Math.max(2, digits))));
}

/** The text with the numbers of `edits` written in (each path must lead to a map in the file). */
export function editedText(
  text: string,
  file: string,
  edits: readonly { path: YamlPath; value: number; note?: string }[],
): string {
  let current = text;
  for (const edit of edits) {
    current = withValue(current, file, edit.path, edit.value);
    if (edit.note) current = withNote(current, file, edit.path, edit.note);
  }
  const expected = parseYamlSource(text, file).source.doc;
  for (const edit of edits) expected.setIn([...edit.path], edit.value);
  const written = parseYamlSource(current, file);
  if (written.issues.length > 0 || !isDeepStrictEqual(written.value, expected.toJS())) {
    throw new Error(
      `editing ${file} would change more than ${edits.map((e) => e.path.join('.')).join(', ')}`,
    );
  }
  return current;
}

/** The value at `path` as the file writes it (`0.8e-12`), or null when the key is not there. */
export function previousValueText(text: string, file: string, path: YamlPath): string | null {
  const range = rangeAt(parseYamlSource(text, file).source, path);
  return range ? text.slice(range[0], range[1]) : null;
}

function withValue(text: string, file: string, path: YamlPath, value: number): string {
  const { source } = parseYamlSource(text, file);
  const written = String(value);
  const existing = nodeAt(source, path);
  if (existing && isScalar(existing) && existing.range) {
    return splice(text, existing.range[0], existing.range[1], written);
  }
  const parent = nodeAt(source, path.slice(0, -1));
  const key = String(path.at(-1));
  if (!isMap(parent) || parent.items.length === 0) {
    throw new Error(`${file}: no mapping at ${path.slice(0, -1).join('.')} to add ${key} to`);
  }
  const last = parent.items.at(-1)!;
  const lastEnd = endOf(last);
  if (parent.flow) return splice(text, lastEnd, lastEnd, `, ${key}: ${written}`);
  // After the last pair's line (and its comment); a nested block may end past its newline.
  let end = lastEnd;
  while (end > 0 && text[end - 1] === '\n') end -= 1;
  const lineEnd = text.indexOf('\n', end);
  const at = lineEnd < 0 ? text.length : lineEnd;
  const indent = ' '.repeat(columnOf(source, (parent.items[0]!.key as Node).range![0]));
  return splice(text, at, at, `\n${indent}${key}: ${written}`);
}

/**
 * The provenance note at the end of the value's line: after the line's own comment (kept,
 * word for word), or as a new comment. A note written by an earlier fit is replaced.
 */
function withNote(text: string, file: string, path: YamlPath, note: string): string {
  const range = rangeAt(parseYamlSource(text, file).source, path);
  if (!range) return text;
  const lineEnd = text.indexOf('\n', range[1]);
  const at = lineEnd < 0 ? text.length : lineEnd;
  let line = text.slice(range[1], at);
  line = line.replace(/ ?[#;] ?fitted ±[^#;]*$/u, '');
  const hasComment = /\s#/.test(line);
  return (
    text.slice(0, range[1]) + line + (hasComment ? `; ${note}` : ` # ${note}`) + text.slice(at)
  );
}

function endOf(pair: Pair): number {
  const value = pair.value as Node | null;
  const key = pair.key as Node;
  return value?.range?.[1] ?? key.range![1];
}

function columnOf(source: YamlSource, offset: number): number {
  return source.lineCounter.linePos(offset).col - 1;
}

function splice(text: string, start: number, end: number, insert: string): string {
  return text.slice(0, start) + insert + text.slice(end);
}
