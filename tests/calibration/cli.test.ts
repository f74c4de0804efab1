/**
 * `stovecard fit` in-process through main([...]), stdout and stderr captured. The demo log is
 * read from content/ and never written; --write runs on temp copies.
 */
import { cp, mkdtemp, readdir, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { main } from '../../generator/cli/main.ts';
import { loadFitInput } from '../../generator/cli/fit.ts';
import {
  ContentErrors,
  loadCoffeeFile,
  loadPotFile,
  loadStoveFile,
} from '../../generator/content/index.ts';
import { contentWords, wording } from '../../generator/words/content.ts';
import { expectRelative } from '../helpers/close.ts';
import { DEMO_TRUTH } from './demo-log.ts';
import { FIRST_COFFEE_ONLY, IDS, syntheticInput, testContent } from './fixtures.ts';

const DEMO_CONTENT = fileURLToPath(new URL('../../content/', import.meta.url));
const DEMO_LOG = join(DEMO_CONTENT, 'logs', 'first-morning.yaml');

async function fit(...args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  let stdout = '';
  let stderr = '';
  const out = vi
    .spyOn(process.stdout, 'write')
    .mockImplementation((chunk) => ((stdout += String(chunk)), true));
  const err = vi
    .spyOn(process.stderr, 'write')
    .mockImplementation((chunk) => ((stderr += String(chunk)), true));
  try {
    const code = await main(['fit', ...args]);
    return { code, stdout, stderr };
  } finally {
    out.mockRestore();
    err.mockRestore();
  }
}

interface JsonParameter {
  id: string;
  value: number;
  identifiable: boolean;
  sigma?: number;
}

describe('stovecard fit content/logs/first-morning.yaml', () => {
  it('exits 0 and prints the fitted values', async () => {
    const { code, stdout, stderr } = await fit(DEMO_LOG);
    expect(stderr).toBe('');
    expect(code).toBe(0);
    for (const text of [
      'permeability_m2',
      'house-blend',
      'heat_to_pot_w',
      'bar-gas medium',
      'bar-gas high',
      'Residuals',
    ]) {
      expect(stdout).toContain(text);
    }
  });

  // own rule: the fit recovers the synthetic truth it was given, not an outside value
  it('recovers the true values the demo log was made from (permeability 10 %, heat 5 %)', async () => {
    const { code, stdout } = await fit(DEMO_LOG, '--json');
    expect(code).toBe(0);
    const report = JSON.parse(stdout) as { parameters: JsonParameter[]; residuals: unknown[] };
    const value = (id: string): JsonParameter => report.parameters.find((p) => p.id === id)!;
    expect(value('permeability').identifiable).toBe(true);
    expectRelative(
      value('permeability').value,
      DEMO_TRUTH.permeabilityM2,
      0.1,
      'demo permeability',
    );
    for (const level of ['medium', 'high']) {
      expect(value(`heat:${level}`).identifiable).toBe(true);
      expectRelative(
        value(`heat:${level}`).value,
        DEMO_TRUTH.heatW[level]!,
        0.05,
        `demo heat ${level}`,
      );
    }
    expect(report.residuals.length).toBeGreaterThan(10);
  });
});

describe('stovecard fit with bad arguments', () => {
  const cases: [string, string[]][] = [
    ['no log', []],
    ['an unknown option', [DEMO_LOG, '--bogus']],
    ['two logs', [DEMO_LOG, DEMO_LOG]],
    ['--content without a folder', [DEMO_LOG, '--content']],
    ['--write with a value', [DEMO_LOG, '--write=yes']],
    ['a content folder without entries', [DEMO_LOG, '--content', tmpdir()]],
  ];
  for (const [name, args] of cases) {
    it(`${name}: exit 2 and one line on stderr`, async () => {
      const { code, stdout, stderr } = await fit(...args);
      expect(code).toBe(2);
      expect(stdout).toBe('');
      expect(stderr.trimEnd().split('\n'), stderr).toHaveLength(1);
      expect(stderr).toMatch(/^stovecard: /);
    });
  }
});

describe('stovecard fit with a malformed log', () => {
  let dir: string;
  beforeAll(async () => {
    dir = await testContent();
  });
  afterAll(async () => {
    await rm(dir, { recursive: true, force: true });
  });

  const LOG = [
    `pot: ${IDS.pot}`, //            1
    `coffee: ${IDS.coffee}`, //      2
    `stove: ${IDS.stove}`, //        3
    'brews:', //                     4
    '  - level: medium', //          5
    '    fill_ml: 150', //           6
    '    start_c: 20', //            7
    '    room_c: 21', //             8
    '    first_coffee_s: 66', //     9
  ];
  const cases: {
    name: string;
    lines: string[];
    line: number;
    column: number;
    field: string;
    code: string;
  }[] = [
    {
      name: 'a wrong type',
      lines: LOG.map((l) => (l.includes('fill_ml') ? '    fill_ml: lots' : l)),
      line: 6,
      column: 14,
      field: 'brews[0].fill_ml',
      code: 'wrong-type',
    },
    {
      name: 'an unknown key',
      lines: [...LOG, '    sputter: 90'],
      line: 10,
      column: 5,
      field: 'brews[0].sputter',
      code: 'unknown-key',
    },
    {
      name: 'a missing field',
      lines: LOG.filter((l) => !l.includes('room_c')),
      line: 5,
      column: 5,
      field: 'brews[0].room_c',
      code: 'missing-key',
    },
    {
      name: 'an unknown pot id',
      lines: LOG.map((l) => (l.startsWith('pot:') ? 'pot: test-pott' : l)),
      line: 1,
      column: 6,
      field: 'pot',
      code: 'unknown-id',
    },
    {
      name: 'an unknown level',
      lines: LOG.map((l) => (l.includes('level:') ? '  - level: medum' : l)),
      line: 5,
      column: 12,
      field: 'brews[0].level',
      code: 'unknown-level',
    },
  ];
  for (const c of cases) {
    it(`${c.name}: ContentErrors at ${c.field}, line ${c.line}, and exit 2`, async () => {
      const path = join(dir, 'logs', `${c.code}.yaml`);
      await writeFile(path, `${c.lines.join('\n')}\n`);
      const error = await loadFitInput(path, dir).then(
        () => undefined,
        (thrown: unknown) => thrown,
      );
      expect(error).toBeInstanceOf(ContentErrors);
      const issues = (error as ContentErrors).issues;
      expect(issues.map((i) => [i.file, i.line, i.column, i.field, i.code])).toEqual([
        [path, c.line, c.column, c.field, c.code],
      ]);
      const { code, stderr } = await fit(path);
      expect(code).toBe(2);
      expect(stderr).toContain(`${path}:${c.line}:${c.column} ${c.field} — `);
    });
  }

  it('a brew the simulation cannot run (filled below the funnel tube): one line at the brew, exit 2', async () => {
    const path = join(dir, 'logs', 'too-little.yaml');
    await writeFile(
      path,
      `${LOG.map((l) => (l.includes('fill_ml') ? '    fill_ml: 20' : l)).join('\n')}\n`,
    );
    const { code, stdout, stderr } = await fit(path);
    expect(code).toBe(2);
    expect(stdout).toBe('');
    expect(stderr.trimEnd().split('\n')).toHaveLength(1);
    expect(stderr).toContain(`${path}:5:5 brews[0] — this brew cannot be simulated as logged`);
  });

  it('an unknown pot id names the nearest one', async () => {
    const path = join(dir, 'logs', 'near.yaml');
    await writeFile(
      path,
      `${LOG.map((l) => (l.startsWith('pot:') ? 'pot: test-pott' : l)).join('\n')}\n`,
    );
    const error = (await loadFitInput(path, dir).catch((e: unknown) => e)) as ContentErrors;
    expect(wording(error.issues[0]!.message).fix).toBe(
      contentWords.unknownId('pot', 'test-pott', 'test-pot', [IDS.pot]).fix,
    );
  });
});

/** Lines removed from `before` and added in `after` (whole-line comparison). */
function changedLines(
  before: string,
  after: string,
): { removed: string[]; added: string[]; kept: [string[], string[]] } {
  const a = before.split('\n');
  const b = after.split('\n');
  const removed = a.filter((line) => !b.includes(line));
  const added = b.filter((line) => !a.includes(line));
  return {
    removed,
    added,
    kept: [a.filter((l) => !removed.includes(l)), b.filter((l) => !added.includes(l))],
  };
}

describe('stovecard fit --write', () => {
  // own rule: the note's σ is the fit's own, written as a percent of the value.
  it('on a copy of the demo content changes only the fitted values and keeps every comment and blank line', async () => {
    const dir = await mkdtemp(join(tmpdir(), 'stovecard-fit-write-'));
    try {
      await cp(DEMO_CONTENT, dir, { recursive: true });
      const files = {
        coffee: 'coffees/house-blend.yaml',
        stove: 'stoves/bar-gas.yaml',
        pot: 'pots/three-cup.yaml',
      };
      const before = Object.fromEntries(
        await Promise.all(
          Object.entries(files).map(
            async ([k, f]) => [k, await readFile(join(dir, f), 'utf8')] as const,
          ),
        ),
      );
      const { code, stdout } = await fit(
        join(dir, 'logs', 'first-morning.yaml'),
        '--write',
        '--json',
      );
      expect(code).toBe(0);
      const report = JSON.parse(stdout) as {
        parameters: JsonParameter[];
        written: { file: string; field: string; value: string; was: string | null }[];
      };
      const fitted = report.parameters.filter((p) => p.identifiable);
      expect(report.written).toHaveLength(fitted.length);

      for (const [kind, file] of Object.entries(files)) {
        const after = await readFile(join(dir, file), 'utf8');
        const own = report.written.filter((w) => w.file === file);
        const { removed, added, kept } = changedLines(before[kind]!, after);
        expect(kept[1], `${file}: every other line, comment and blank line as it was`).toEqual(
          kept[0],
        );
        expect(added, `${file}: one changed line per written value`).toHaveLength(own.length);
        for (const w of own) {
          const key = w.field.split('.').at(-1)!;
          expect(
            added.some((line) => line.includes(`${key}: ${w.value}`)),
            `${file}: ${w.field} ${w.value}`,
          ).toBe(true);
        }
        expect(removed.length).toBeLessThanOrEqual(own.length);
      }

      const [coffee, stove, pot] = await Promise.all([
        loadCoffeeFile(join(dir, files.coffee)),
        loadStoveFile(join(dir, files.stove)),
        loadPotFile(join(dir, files.pot)),
      ]);
      const written = (field: string): number =>
        Number(report.written.find((w) => w.field === field)!.value);
      expect(coffee.bed.permeabilityM2).toBe(written('permeability_m2'));
      expect(coffee.permeabilityAssumed).toBe(false);
      // The note beside each written value is read back: its log, the day and the fit's σ.
      const today = new Date().toISOString().slice(0, 10);
      const sigmaOf = (id: string) => {
        const p = report.parameters.find((x) => x.id === id)!;
        return Number(((p.sigma! / p.value) * 100).toPrecision(2)) / 100;
      };
      expect(coffee.permeabilityProvenance).toEqual({
        sigmaRel: sigmaOf('permeability'),
        log: 'logs/first-morning.yaml',
        date: today,
      });
      for (const level of stove.levels.filter((l) => l.label === 'medium' || l.label === 'high')) {
        const index = stove.levels.indexOf(level);
        expect(level).toMatchObject({
          fitted: true,
          heatToPotW: written(`levels[${index}].heat_to_pot_w`),
          provenance: { log: 'logs/first-morning.yaml', date: today },
        });
        expect(level.provenance!.sigmaRel).toBeGreaterThan(0);
      }
      const ua = report.parameters.find((p) => p.id === 'heat-loss')!;
      if (ua.identifiable) expect(pot.model.heatLossWPerK).toBe(written('base.heat_loss_w_per_k'));
      else expect(await readFile(join(dir, files.pot), 'utf8')).toBe(before.pot);

      for (const folder of ['coffees', 'stoves', 'pots']) {
        expect(
          (await readdir(join(dir, folder))).filter((n) => n.endsWith('.fit-tmp')),
          'no temp file left',
        ).toEqual([]);
      }
    } finally {
      await rm(dir, { recursive: true, force: true });
    }
  });

  it('never writes a value the log cannot pin down', async () => {
    const dir = await testContent();
    try {
      const input = await syntheticInput(dir, 'first-coffee', FIRST_COFFEE_ONLY);
      const coffeeBefore = await readFile(join(dir, 'coffees', `${IDS.coffee}.yaml`), 'utf8');
      const potBefore = await readFile(join(dir, 'pots', `${IDS.pot}.yaml`), 'utf8');
      const { code, stdout } = await fit(input.path, '--write');
      expect(code).toBe(0);
      expect(stdout).toMatch(/Wrote stoves\/test-ring\.yaml: levels\[1\]\.heat_to_pot_w \d/);
      expect(stdout).toContain(
        'Not written (not identifiable): permeability_m2 (test-blend), heat_loss_w_per_k (test-pot)',
      );
      expect(await readFile(join(dir, 'coffees', `${IDS.coffee}.yaml`), 'utf8')).toBe(coffeeBefore);
      expect(await readFile(join(dir, 'pots', `${IDS.pot}.yaml`), 'utf8')).toBe(potBefore);
    } finally {
      await rm(dir, { recursive: true, force: true });
    }
  });
});
