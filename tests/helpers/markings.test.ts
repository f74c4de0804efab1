/**
 * Every outside check of the model's tests carries a marking (DEVELOPERS.md, "Adding a
 * check"): the published source it rests on, "closed form", "common practice, no source",
 * "from memory", or "regression snapshot". The scanner is tests/helpers/markings.ts; the
 * list of every check and its marking is printed with STOVECARD_LIST_MARKINGS=1.
 */
import { readdir, readFile } from 'node:fs/promises';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { assertsANumber, outsideChecks, type OutsideCheck } from './markings.ts';

const TESTS = fileURLToPath(new URL('../', import.meta.url));
/** The folders whose tests hold the model against outside values. */
export const CHECKED_FOLDERS = [
  'physics',
  'brew',
  'planning',
  'calibration',
  'content',
  'numerics',
];

async function checksOf(folder: string): Promise<OutsideCheck[]> {
  const dir = path.join(TESTS, folder);
  const files = (await readdir(dir)).filter((f) => f.endsWith('.test.ts')).sort();
  const out: OutsideCheck[] = [];
  for (const file of files) {
    const src = await readFile(path.join(dir, file), 'utf8');
    out.push(...outsideChecks(`tests/${folder}/${file}`, src));
  }
  return out;
}

describe('the marking scanner (tests/helpers/markings.ts)', () => {
  it('counts a test asserting a written number, and not one asserting 0, 1 or a length', () => {
    expect(assertsANumber('expect(x).toBeCloseTo(958.34, 2);')).toBe(true);
    expect(assertsANumber('expectRelative(v, 0.394913866e2, 1e-8, label);')).toBe(true);
    expect(assertsANumber('expect(list).toHaveLength(2);\nexpect(n).toBe(0);')).toBe(false);
    expect(assertsANumber('const k = 958; // not an assertion')).toBe(false);
  });

  it('finds a marking in the name, a comment, a label or the enclosing describe, and flags none', () => {
    const src = [
      "describe('table 5 (IAPWS R7-97)', () => {",
      "  it('a', () => { expect(f()).toBe(3.5); });",
      '});',
      "describe('plain', () => {",
      '  // from memory: a plausible range',
      "  it('b', () => { expect(g()).toBeLessThan(80); });",
      "  it('c', () => { expect(h(), 'h, common practice, no source').toBe(7); });",
      "  it('d', () => { expect(h()).toBe(7); });",
      "  it.each([[1, 2]])('e %d', (a) => { expect(a).toBe(9); });",
      '});',
    ].join('\n');
    const checks = outsideChecks('x.test.ts', src);
    expect(checks.map((c) => [c.name, c.marking])).toEqual([
      ['a', 'source'],
      ['b', 'from memory'],
      ['c', 'common practice'],
      ['d', null],
      ['e %d', null],
    ]);
  });
});

describe(`outside checks in tests/{${CHECKED_FOLDERS.join(',')}}`, () => {
  it('each carries a marking (a source, closed form, common practice, from memory, snapshot)', async () => {
    const checks = (await Promise.all(CHECKED_FOLDERS.map(checksOf))).flat();
    if (process.env.STOVECARD_LIST_MARKINGS) {
      for (const c of checks)
        process.stdout.write(
          `${c.file}:${c.line}  ${c.marking ?? 'UNMARKED'}  ${c.name}  [${(c.markedBy ?? '').slice(0, 80)}]\n`,
        );
    }
    const counts = new Map<string, number>();
    for (const c of checks)
      counts.set(c.marking ?? 'unmarked', (counts.get(c.marking ?? 'unmarked') ?? 0) + 1);
    process.stdout.write(
      `outside checks: ${checks.length} (${[...counts].map(([k, n]) => `${k} ${n}`).join(', ')})\n`,
    );
    expect(checks.length).toBeGreaterThan(50);
    const unmarked = checks
      .filter((c) => c.marking === null)
      .map((c) => `${c.file}:${c.line} ${c.name}`);
    expect(unmarked, 'outside checks with no marking (DEVELOPERS.md, "Adding a check")').toEqual(
      [],
    );
  });
});
