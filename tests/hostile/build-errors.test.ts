/**
 * `stovecard build` on broken content, through the real command (main([...]) in-process,
 * and once as a child process): each copy of the demo content is broken one way, and the
 * build must exit 2 with errors naming file, line and field, print no stack trace, and
 * leave the previous good site in --out byte-identical, with no half-written folder beside
 * it. Loader-level checks of the same problems live in tests/content/; these check what a
 * person running the command sees.
 */
import {
  cp,
  mkdir,
  mkdtemp,
  readFile,
  rename,
  rm,
  stat,
  symlink,
  writeFile,
} from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MAX_CONTENT_FILE_BYTES } from '../../generator/content/file-bytes.ts';
import { MAX_ALIAS_COUNT } from '../../generator/content/yaml-source.ts';
import { buildWords } from '../../generator/words/card.ts';
import { contentWords } from '../../generator/words/content.ts';
import { faultWords } from '../../generator/words/build-faults.ts';
import {
  DEMO_CONTENT,
  expectCleanFailure,
  lines,
  runChild,
  runMain,
  runMainIn,
  type CliRun,
} from './cli-run.ts';
import { demoCopy, leftovers, treeHash } from './site-tree.ts';

let root: string;
/** A site the command built from the demo content: every case starts from a copy of it. */
let goodSite: string;

beforeAll(async () => {
  root = await mkdtemp(path.join(tmpdir(), 'stovecard-hostile-build-'));
  goodSite = path.join(root, 'good-site');
  const built = await runMainIn(root, ['build', '--content', DEMO_CONTENT, '--out', goodSite]);
  expect(built.code, built.stderr).toBe(0);
}, 120_000);

afterAll(async () => {
  if (root) await rm(root, { recursive: true, force: true });
});

type Mutation = (dir: string) => Promise<void>;

async function edit(dir: string, file: string, change: (text: string) => string): Promise<void> {
  const full = path.join(dir, file);
  const before = await readFile(full, 'utf8');
  const after = change(before);
  if (after === before) throw new Error(`the mutation did not change ${file}`);
  await writeFile(full, after);
}

/** A file's text with one line replaced; the line must be there. */
function replaceLine(pattern: RegExp, replacement: string): (text: string) => string {
  return (text) => {
    if (!pattern.test(text)) throw new Error(`no line matches ${pattern}`);
    return text.replace(pattern, replacement);
  };
}

/** The billion-laughs shape: nine levels of nine aliases each (9⁹ strings if expanded). */
function yamlBomb(): string {
  const names = 'abcdefghi';
  const rows = [`${names[0]}: &${names[0]} [lol, lol, lol, lol, lol, lol, lol, lol, lol]`];
  for (let i = 1; i < names.length; i++) {
    const refs = Array.from({ length: 9 }, () => `*${names[i - 1]}`).join(', ');
    rows.push(`${names[i]}: &${names[i]} [${refs}]`);
  }
  return `${rows.join('\n')}\n`;
}

interface Expected {
  /** `file:line` or `file:line:column field`, as the issue line starts. */
  readonly at: string;
  /** The problem, from the same words module the loader uses (omitted where the yaml package words it). */
  readonly problem?: string;
}

interface Case {
  readonly name: string;
  readonly mutate: Mutation;
  readonly expected: readonly Expected[];
}

const ONE_MB_NAME = 'x'.repeat(1_000_000);

const cases: Case[] = [
  {
    name: 'a truncated file (cut inside a flow mapping)',
    mutate: (dir) =>
      edit(dir, 'stoves/bar-gas.yaml', (text) => text.slice(0, text.indexOf('power_w: 600') + 10)),
    expected: [{ at: 'stoves/bar-gas.yaml:7:' }],
  },
  {
    name: 'wrong types (a word for a number, a unit in a number)',
    mutate: (dir) =>
      edit(dir, 'pots/three-cup.yaml', (text) =>
        replaceLine(
          /^cups: 3$/m,
          'cups: three',
        )(replaceLine(/^ {2}valve_height_mm: 32/m, '  valve_height_mm: "32mm"')(text)),
      ),
    expected: [
      { at: 'pots/three-cup.yaml:4:7 cups' },
      { at: 'pots/three-cup.yaml:8:20 base.valve_height_mm' },
    ],
  },
  {
    name: 'huge numbers (1e308, and 1e309 which is Infinity)',
    mutate: (dir) =>
      edit(dir, 'pots/three-cup.yaml', (text) =>
        replaceLine(
          /^ {2}sealed_volume_ml: 260/m,
          '  sealed_volume_ml: 1e308',
        )(replaceLine(/^ {2}mass_g: 180$/m, '  mass_g: 1e309')(text)),
      ),
    expected: [
      { at: 'pots/three-cup.yaml:6:21 base.sealed_volume_ml' },
      { at: 'pots/three-cup.yaml:10:11 base.mass_g', problem: '1e309 is too large to be a number' },
    ],
  },
  {
    name: 'a negative size',
    mutate: (dir) =>
      edit(
        dir,
        'pots/three-cup.yaml',
        replaceLine(/^ {2}inner_diameter_mm: 84$/m, '  inner_diameter_mm: -84'),
      ),
    expected: [
      { at: 'pots/three-cup.yaml:7:22 base.inner_diameter_mm', problem: 'cannot be negative' },
    ],
  },
  {
    name: 'a duplicate key',
    mutate: (dir) => edit(dir, 'coffees/house-blend.yaml', (text) => `${text}roast: dark\n`),
    expected: [
      {
        at: 'coffees/house-blend.yaml:9:1 roast',
        problem: contentWords.duplicateKey('roast').problem,
      },
    ],
  },
  {
    name: 'an unknown key',
    mutate: (dir) => edit(dir, 'coffees/house-blend.yaml', (text) => `${text}colour: brown\n`),
    expected: [
      {
        at: 'coffees/house-blend.yaml:9:1 colour',
        problem: contentWords.unknownKey('colour', '', undefined, []).problem,
      },
    ],
  },
  {
    name: 'deeply nested YAML (10,000 levels of `[`)',
    mutate: (dir) =>
      edit(
        dir,
        'coffees/house-blend.yaml',
        replaceLine(/^notes: .*$/m, `notes: ${'['.repeat(10_000)}`),
      ),
    expected: [
      { at: 'coffees/house-blend.yaml:8:', problem: contentWords.nestedTooDeeply().problem },
    ],
  },
  {
    name: 'a very long string (a 1,000,000-character name)',
    mutate: (dir) =>
      edit(dir, 'coffees/house-blend.yaml', replaceLine(/^name: .*$/m, `name: ${ONE_MB_NAME}`)),
    expected: [
      {
        at: 'coffees/house-blend.yaml:2:7 name',
        problem: contentWords.textLength(80, ONE_MB_NAME.length).problem,
      },
    ],
  },
  {
    name: 'a file over the size limit (a 1 MiB name)',
    mutate: (dir) =>
      edit(
        dir,
        'pots/one-cup.yaml',
        replaceLine(/^name: .*$/m, `name: ${'y'.repeat(1024 * 1024)}`),
      ),
    expected: [
      { at: 'pots/one-cup.yaml:1:1', problem: 'more than the 1.0 MiB a content file may be' },
    ],
  },
  {
    name: 'bytes that are not UTF-8',
    mutate: async (dir) => {
      const file = path.join(dir, 'coffees', 'house-blend.yaml');
      const bytes = await readFile(file);
      const at = bytes.indexOf('Cocoa');
      const bad = Buffer.from([0xff, 0xfe, 0xc3]);
      await writeFile(file, Buffer.concat([bytes.subarray(0, at), bad, bytes.subarray(at)]));
    },
    expected: [{ at: 'coffees/house-blend.yaml:8:8', problem: contentWords.notUtf8().problem }],
  },
  {
    name: 'an empty file',
    mutate: (dir) => writeFile(path.join(dir, 'stoves', 'bar-gas.yaml'), ''),
    expected: [{ at: 'stoves/bar-gas.yaml:1:1', problem: contentWords.emptyFile('stove').problem }],
  },
  {
    name: 'a YAML bomb (nine levels of nine aliases)',
    mutate: (dir) => edit(dir, 'coffees/house-blend.yaml', (text) => text + yamlBomb()),
    expected: [
      {
        at: 'coffees/house-blend.yaml:2:1',
        problem: contentWords.tooManyAliases(MAX_ALIAS_COUNT).problem,
      },
    ],
  },
];

/** The report starts with the build's own line, then the heading, then one line per issue. */
function expectReport(run: CliRun, outDir: string, expected: readonly Expected[], label: string) {
  expectCleanFailure(run, label);
  const shown = lines(run.stderr);
  expect(shown[0], label).toBe(`stovecard: ${buildWords.failed(outDir)}`);
  const files = new Set(expected.map((e) => e.at.split(':')[0]));
  expect(shown[1], label).toBe(contentWords.errorsHeading(shown.length - 2, files.size));
  for (const { at, problem } of expected) {
    const line = shown.find((l) => l.startsWith(at));
    expect(line, `${label}: no line starting ${at} in\n${run.stderr}`).toBeDefined();
    if (problem !== undefined) expect(line, label).toContain(problem);
  }
  // Every issue line names a content file and a position.
  for (const issue of shown.slice(2))
    expect(issue, label).toMatch(
      /^(?:site\.yaml|(?:pots|coffees|stoves|logs)\/[^:]+\.ya?ml):\d+:\d+ /,
    );
}

async function prepare(name: string, mutate: Mutation): Promise<{ content: string; out: string }> {
  const slug = name.replace(/[^a-z0-9]+/gi, '-').toLowerCase();
  const content = await demoCopy(path.join(root, `content-${slug}`));
  await mutate(content);
  const out = path.join(root, `out-${slug}`);
  await cp(goodSite, out, { recursive: true, dereference: true });
  return { content, out };
}

describe('stovecard build on broken content keeps the last good site', () => {
  for (const c of cases) {
    it(`${c.name}: exit 2, file:line, no stack trace, --out unchanged`, async () => {
      const { content, out } = await prepare(c.name, c.mutate);
      const before = await treeHash(out);
      const run = await runMain(['build', '--content', content, '--out', out]);
      expectReport(run, out, c.expected, c.name);
      expect(await treeHash(out), `${c.name}: --out changed`).toBe(before);
      expect(await leftovers(out)).toEqual([]);
    });
  }

  it('several broken files are all reported at once', async () => {
    const { content, out } = await prepare('several', async (dir) => {
      await cases[1]!.mutate(dir); // pots/three-cup.yaml: two wrong types
      await cases[4]!.mutate(dir); // coffees/house-blend.yaml: a duplicate key
      await cases[10]!.mutate(dir); // stoves/bar-gas.yaml: empty
      await edit(dir, 'site.yaml', replaceLine(/^units: metric$/m, 'units: metric\ncolour: red'));
    });
    const before = await treeHash(out);
    const run = await runMain(['build', '--content', content, '--out', out]);
    const expected = [
      ...cases[1]!.expected,
      ...cases[4]!.expected,
      ...cases[10]!.expected,
      { at: 'site.yaml:8:1 colour' },
    ];
    expectReport(run, out, expected, 'several');
    expect(lines(run.stderr)[1]).toBe(contentWords.errorsHeading(5, 4));
    expect(await treeHash(out)).toBe(before);
  });

  it('as a child process (npx tsx generator/cli/main.ts build): the same report, exit 2', async () => {
    const { content, out } = await prepare('child', cases[9]!.mutate);
    const before = await treeHash(out);
    const run = await runChild(['build', '--content', content, '--out', out]);
    expectReport(run, out, cases[9]!.expected, 'child process');
    expect(run.stderr).not.toMatch(/ExperimentalWarning|DeprecationWarning/);
    expect(await treeHash(out)).toBe(before);
    expect(await leftovers(out)).toEqual([]);
  });

  it('an insert set too long for A6 at the 7 pt floor: the card and the fix named, exit 2', async () => {
    const { content, out } = await prepare('a6-insert', async (dir) => {
      const text = await readFile(path.join(dir, 'site.yaml'), 'utf8');
      await writeFile(
        path.join(dir, 'site.yaml'),
        `${text.slice(0, text.indexOf('sets:'))}sets:\n  - id: bags\n    title: Bags\n    layout: insert\n    paper: A6\n    coffees: [house-blend]\n`,
      );
    });
    const before = await treeHash(out);
    const run = await runMain(['build', '--content', content, '--out', out]);
    expectCleanFailure(run, 'A6 insert');
    expect(run.stderr).toContain('"house-blend" does not fit on one A6 page');
    expect(run.stderr).toContain('fewer pots or stoves');
    expect(await treeHash(out)).toBe(before);
    expect(await leftovers(out)).toEqual([]);
  });

  it('a station card too big for an 8-up A4 sheet’s cell: site.yaml:line, the sheet field, the cell in mm and the fix, exit 2', async () => {
    const { content, out } = await prepare('sheet-8-up', async (dir) => {
      const text = await readFile(path.join(dir, 'site.yaml'), 'utf8');
      await writeFile(
        path.join(dir, 'site.yaml'),
        `${text.slice(0, text.indexOf('sets:'))}sets:\n  - id: bar\n    title: Bar\n    layout: station\n    cards:\n      - { pot: three-cup, coffee: house-blend, stove: bar-gas }\n    sheet: { paper: A4, up: 8 }\n`,
      );
    });
    const before = await treeHash(out);
    const run = await runMain(['build', '--content', content, '--out', out]);
    expectCleanFailure(run, 'sheet 8 up');
    const lineOf = (await readFile(path.join(content, 'site.yaml'), 'utf8'))
      .split('\n')
      .findIndex((line) => line.includes('sheet:'));
    // own rule: the cell of 8 up on A4 is (297 − 12) / 4 − 8 = 63.25 mm × (210 − 12) / 2 − 8 = 91 mm
    expect(run.stderr).toContain(`site.yaml:${lineOf + 1}:12 sets[0].sheet — `);
    expect(run.stderr).toContain('"three-cup--house-blend--bar-gas" does not fit its cell');
    expect(run.stderr).toContain('A4 sheet at 8 up (63.3 × 91 mm)');
    expect(run.stderr).toContain('Write `up: 4` or `up: 2`, or a larger `paper:` for the sheet.');
    expect(await treeHash(out)).toBe(before);
    expect(await leftovers(out)).toEqual([]);
  });

  it('into a new --out folder: nothing is created', async () => {
    const { content } = await prepare('fresh', cases[0]!.mutate);
    const out = path.join(root, 'never-built');
    const run = await runMain(['build', '--content', content, '--out', out]);
    expectCleanFailure(run, 'fresh out');
    expect(await treeHash(out)).toBeNull();
    expect(await leftovers(out)).toEqual([]);
  });
});

describe('stovecard build with linked entry files', () => {
  it('a link to nowhere and a link to itself: each named, exit 2, --out unchanged', async () => {
    const { content, out } = await prepare('links', async (dir) => {
      await symlink(path.join(root, 'no-such-file.yaml'), path.join(dir, 'pots', 'gone.yaml'));
      await symlink(path.join(dir, 'pots', 'loop.yaml'), path.join(dir, 'pots', 'loop.yaml'));
    });
    const before = await treeHash(out);
    const run = await runMain(['build', '--content', content, '--out', out]);
    expectReport(
      run,
      out,
      [
        { at: 'pots/gone.yaml:1:1', problem: contentWords.unreadable('ENOENT').problem },
        { at: 'pots/loop.yaml:1:1', problem: contentWords.unreadable('ELOOP').problem },
      ],
      'links',
    );
    expect(await treeHash(out)).toBe(before);
  });

  it('a link to a shared pot file is that pot: its card is built', async () => {
    const content = await demoCopy(path.join(root, 'content-linked'));
    // Inside the content folder (a link that leaves it is refused: odd-files.test.ts).
    await mkdir(path.join(content, 'shared'), { recursive: true });
    const shared = path.join(content, 'shared', 'three-cup.yaml');
    await rename(path.join(content, 'pots', 'three-cup.yaml'), shared);
    await symlink(shared, path.join(content, 'pots', 'three-cup.yaml'));
    await edit(content, 'site.yaml', (text) =>
      text.replace(
        /^sets:[\s\S]*$/m,
        'sets:\n  - id: bar\n    title: Bar\n    layout: station\n    cards:\n      - { pot: three-cup, coffee: house-blend, stove: bar-gas }\n',
      ),
    );
    const out = path.join(root, 'out-linked');
    const run = await runMainIn(root, ['build', '--content', content, '--out', out]);
    expect(run.code, run.stderr).toBe(0);
    expect(
      await treeHash(path.join(out, 'cards', 'three-cup--house-blend--bar-gas')),
    ).not.toBeNull();
  });
});

describe('stovecard build --out that must not be replaced', () => {
  /** One line, exit 2, and the folder or file untouched. */
  async function refused(out: string, content: string, expectedLine: string): Promise<void> {
    const before = await treeHash(out);
    const beforeContent = await treeHash(content);
    const run = await runMain(['build', '--content', content, '--out', out]);
    expectCleanFailure(run, out);
    expect(lines(run.stderr)).toEqual([`stovecard: ${expectedLine}`]);
    expect(await treeHash(out)).toBe(before);
    expect(await treeHash(content)).toBe(beforeContent);
  }

  it('--out the content folder itself', async () => {
    const content = await demoCopy(path.join(root, 'content-as-out'));
    await refused(content, content, buildWords.outHoldsContent(content));
  });

  it('--out a parent of the content folder', async () => {
    const parent = path.join(root, 'parent-of-content');
    const content = await demoCopy(path.join(parent, 'content'));
    await refused(parent, content, buildWords.outHoldsContent(parent));
  });

  it('--out the folder the command runs in', async () => {
    const workdir = path.join(root, 'workdir');
    await mkdir(workdir);
    await writeFile(path.join(workdir, 'notes.txt'), 'keep me');
    const before = await treeHash(workdir);
    const run = await runMainIn(workdir, ['build', '--content', DEMO_CONTENT, '--out', '.']);
    expectCleanFailure(run, '--out .');
    expect(lines(run.stderr)).toEqual([`stovecard: ${buildWords.outHoldsWorkingFolder('.')}`]);
    expect(await treeHash(workdir)).toBe(before);
  });

  it('--out a file', async () => {
    const file = path.join(root, 'notes.txt');
    await writeFile(file, 'not a site');
    await refused(file, DEMO_CONTENT, buildWords.outNotAFolder(file));
    expect((await stat(file)).isFile()).toBe(true);
  });

  it('--out a folder of other files', async () => {
    const folder = path.join(root, 'photos');
    await mkdir(folder);
    await writeFile(path.join(folder, 'cat.jpg'), 'meow');
    await refused(folder, DEMO_CONTENT, faultWords.outNotASite(folder));
  });
});
