/**
 * Test fixtures for the content layer: a copy of the demo content in a temp folder, and
 * entry texts owned by the tests, so line numbers asserted below never move when the demo
 * files change. The line numbers are written beside each line.
 */
import { wording } from '../../generator/words/content.ts';
import { cp, mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, expect } from 'vitest';
import { ContentErrors, loadCatalogue, type ContentIssue } from '../../generator/content/index.ts';
import type { ContentIssueCode } from '../../generator/content/issues.ts';
import type { Wording } from '../../generator/words/content.ts';

export const DEMO_CONTENT = fileURLToPath(new URL('../../content/', import.meta.url));

/** pots/three-cup.yaml as the tests write it. */
export const POT = [
  'name: Three-cup aluminium pot', //  1
  'cups: 3', //                        2
  'base:', //                          3
  '  sealed_volume_ml: 260', //        4
  '  inner_diameter_mm: 84', //        5
  '  valve_height_mm: 32', //          6
  '  material: aluminium', //          7
  '  mass_g: 180', //                  8
  'funnel:', //                        9
  '  basket_diameter_mm: 56', //      10
  '  basket_depth_mm: 15', //         11
  '  tube_inner_diameter_mm: 7', //   12
  '  tube_gap_mm: 4', //              13
  'upper:', //                        14
  '  spout_height_mm: 115', //        15
  '  capacity_ml: 200', //            16
].join('\n');

/** coffees/house-blend.yaml as the tests write it. */
export const COFFEE = [
  'name: House blend', //              1
  'roast: medium', //                  2
  'grind: medium-fine', //             3
  'bulk_density_g_ml: 0.38', //        4
  'retention_g_per_g: 1.2', //         5
].join('\n');

/** stoves/bar-gas.yaml as the tests write it. */
export const STOVE = [
  'name: Bar gas', //                            1
  'kind: gas', //                                2
  'levels:', //                                  3
  '  - { label: low, power_w: 600 }', //         4
  '  - { label: medium, power_w: 1000 }', //     5
  '  - { label: high, power_w: 1500 }', //       6
].join('\n');

/** logs/first-morning.yaml as the tests write it. */
export const LOG = [
  'pot: three-cup', //                           1
  'coffee: house-blend', //                      2
  'stove: bar-gas', //                           3
  'brews:', //                                   4
  '  - level: medium', //                        5
  '    fill_ml: 150', //                         6
  '    start_c: 20', //                          7
  '    room_c: 21', //                           8
  '    first_coffee_s: 96', //                   9
  '    cup_g: [[110, 18], [130, 52]]', //       10
].join('\n');

/** site.yaml as the tests write it. */
export const SITE = [
  'business: { name: Test Roasters, contact: t@test.example }', //    1
  'units: metric', //                                                 2
  'paper: A5', //                                                     3
  'room: { ambient_c: 20 }', //                                       4
  'sets:', //                                                         5
  '  - id: bar', //                                                   6
  '    title: Bar', //                                                7
  '    layout: station', //                                           8
  '    cards:', //                                                    9
  '      - { pot: three-cup, coffee: house-blend, stove: bar-gas }', // 10
  '      - { stove: bar-induction, every_coffee_with_every_pot: true }', // 11
  '  - id: inserts', //                                              12
  '    title: Inserts', //                                           13
  '    layout: insert', //                                           14
  '    coffees: [house-blend]', //                                   15
].join('\n');

/** Replace the one line of `text` that starts (after its indent) with `start`. */
export function withLine(text: string, start: string, replacement: string): string {
  const lines = text.split('\n');
  const index = lines.findIndex((line) => line.trimStart().startsWith(start));
  if (index < 0) throw new Error(`no line starting with ${start}`);
  lines[index] = replacement;
  return lines.join('\n');
}

export function withoutLine(text: string, start: string): string {
  return text
    .split('\n')
    .filter((line) => !line.trimStart().startsWith(start))
    .join('\n');
}

/** A copy of the demo content folder with the tests' own three-cup, house-blend, bar-gas, first-morning and site files. */
export async function contentCopy(): Promise<string> {
  const dir = await mkdtemp(join(tmpdir(), 'stovecard-content-'));
  await cp(DEMO_CONTENT, dir, { recursive: true });
  await put(dir, 'pots/three-cup.yaml', POT);
  await put(dir, 'coffees/house-blend.yaml', COFFEE);
  await put(dir, 'stoves/bar-gas.yaml', STOVE);
  await put(dir, 'logs/first-morning.yaml', LOG);
  await put(dir, 'site.yaml', SITE);
  return dir;
}

export async function removeCopy(dir: string): Promise<void> {
  await rm(dir, { recursive: true, force: true });
}

export async function put(dir: string, file: string, contents: string | Uint8Array): Promise<void> {
  await writeFile(join(dir, file), contents);
}

/** The issues loadCatalogue reports for `dir` (it must fail with ContentErrors). */
export async function catalogueIssues(dir: string): Promise<readonly ContentIssue[]> {
  return (await rejection(loadCatalogue(dir))).issues;
}

export interface ExpectedIssue {
  readonly file: string;
  readonly line: number;
  readonly column?: number;
  readonly field: string;
  readonly code?: ContentIssueCode;
  readonly wording?: Wording;
}

/** The one issue of `issues` in `file` at `line` and `field`, checked against what is expected. */
export function expectIssue(
  issues: readonly ContentIssue[],
  expected: ExpectedIssue,
): ContentIssue {
  const found = issues.filter(
    (issue) =>
      issue.file === expected.file &&
      issue.line === expected.line &&
      issue.field === expected.field,
  );
  expect(
    found,
    `one issue at ${expected.file}:${expected.line} ${expected.field} in:\n${issues.join('\n')}`,
  ).toHaveLength(1);
  const issue = found[0]!;
  if (expected.column !== undefined) expect(issue.column, String(issue)).toBe(expected.column);
  if (expected.code !== undefined) expect(issue.code, String(issue)).toBe(expected.code);
  if (expected.wording !== undefined) {
    expect({ problem: wording(issue.message).problem, fix: wording(issue.message).fix }).toEqual(
      expected.wording,
    );
  }
  expect(wording(issue.message).fix.length, 'every issue says how to fix it').toBeGreaterThan(0);
  return issue;
}

const tempFolders: string[] = [];
afterAll(async () => {
  await Promise.all(tempFolders.splice(0).map(removeCopy));
});

/** Write `text` to a fresh temp folder (removed after the test file) as `name`; returns its path. */
export async function tempFile(name: string, contents: string | Uint8Array): Promise<string> {
  const dir = await mkdtemp(join(tmpdir(), 'stovecard-file-'));
  tempFolders.push(dir);
  const path = join(dir, name);
  await writeFile(path, contents);
  return path;
}

/** The ContentErrors a promise rejects with (it must reject with one). */
export async function rejection(promise: Promise<unknown>): Promise<ContentErrors> {
  const error = await promise.then(
    () => undefined,
    (thrown: unknown) => thrown,
  );
  expect(error, 'should throw ContentErrors').toBeInstanceOf(ContentErrors);
  return error as ContentErrors;
}
