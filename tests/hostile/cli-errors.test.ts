/**
 * `stovecard simulate` and `stovecard plan` given a missing file, a file that is not YAML,
 * a file nested past reading, or a fill above the valve: one line per problem on stderr,
 * naming the file and line, nothing on stdout, exit 2 (README: "Bad input gets one line
 * naming the file, line and field and how to fix it, and exit code 2").
 */
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { cliWords } from '../../generator/words/cli.ts';
import { contentWords } from '../../generator/words/content.ts';
import { DEMO_CONTENT, expectCleanFailure, lines, runMain } from './cli-run.ts';

const POT = path.join(DEMO_CONTENT, 'pots', 'three-cup.yaml');
const COFFEE = path.join(DEMO_CONTENT, 'coffees', 'house-blend.yaml');
const STOVE = path.join(DEMO_CONTENT, 'stoves', 'bar-gas.yaml');
/** More than the three-cup pot's safe fill (about 150 mL). */
const TOO_MUCH_ML = 250;

let root: string;
let missing: string;
let broken: string;
let deep: string;

beforeAll(async () => {
  root = await mkdtemp(path.join(tmpdir(), 'stovecard-cli-errors-'));
  missing = path.join(root, 'no-such-pot.yaml');
  broken = path.join(root, 'broken.yaml');
  await writeFile(broken, 'name: Broken pot\ncups: [3\n'); // one unclosed `[`
  deep = path.join(root, 'deep.yaml');
  await writeFile(deep, `name: Deep\nnotes: ${'['.repeat(10_000)}\n`);
});

afterAll(async () => {
  if (root) await rm(root, { recursive: true, force: true });
});

/** The one line a problem with `file` gets: `stovecard: <file>:<line>:<column> … — <problem>`. */
function expectOneLineAbout(
  run: Awaited<ReturnType<typeof runMain>>,
  file: string,
  problem: string,
  label: string,
): void {
  expectCleanFailure(run, label);
  expect(run.stdout, label).toBe('');
  const shown = lines(run.stderr);
  expect(shown, label).toHaveLength(1);
  expect(shown[0], label).toMatch(new RegExp(`^stovecard: ${escape(file)}:\\d+:\\d+ `));
  expect(shown[0], label).toContain(problem);
}

const escape = (text: string) => text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');

const commands = {
  simulate: (pot: string, coffee: string) => [
    'simulate',
    '--pot',
    pot,
    '--coffee',
    coffee,
    '--stove',
    STOVE,
    '--level',
    'medium',
  ],
  plan: (pot: string, coffee: string) => [
    'plan',
    '--pot',
    pot,
    '--coffee',
    coffee,
    '--stove',
    STOVE,
  ],
} as const;

for (const [name, argv] of Object.entries(commands)) {
  describe(`stovecard ${name} with bad input`, () => {
    it('a missing file: one line naming it, exit 2', async () => {
      const run = await runMain(argv(missing, COFFEE));
      expectOneLineAbout(
        run,
        missing,
        contentWords.unreadable('ENOENT').problem,
        `${name} missing`,
      );
    });

    it('a YAML syntax error: one line with its file and line, exit 2', async () => {
      const run = await runMain(argv(broken, COFFEE));
      expectOneLineAbout(
        run,
        broken,
        contentWords.yamlSyntax('', '').problem.trimEnd(),
        `${name} yaml`,
      );
      expect(run.stderr).toMatch(new RegExp(`${escape(broken)}:3:`));
    });

    it('10,000 levels of `[`: one line, exit 2', async () => {
      const run = await runMain(argv(POT, deep));
      expectOneLineAbout(run, deep, contentWords.nestedTooDeeply().problem, `${name} deep`);
    });

    it('two bad files: both reported in one run, one line each', async () => {
      const run = await runMain(argv(missing, broken));
      expectCleanFailure(run, `${name} two files`);
      const shown = lines(run.stderr);
      expect(shown, run.stderr).toHaveLength(2);
      expect(shown.some((l) => l.startsWith(`stovecard: ${missing}:1:1 `))).toBe(true);
      expect(shown.some((l) => l.startsWith(`stovecard: ${broken}:3:`))).toBe(true);
    });

    it(`--fill-ml ${TOO_MUCH_ML}, above the valve: one line, exit 2`, async () => {
      const run = await runMain([...argv(POT, COFFEE), '--fill-ml', String(TOO_MUCH_ML)]);
      expectCleanFailure(run, `${name} fill`);
      expect(run.stdout).toBe('');
      const pattern = escape(cliWords.fillAboveValve(TOO_MUCH_ML, 999_999)).replace(
        '999999',
        '\\d+',
      );
      expect(lines(run.stderr), run.stderr).toEqual([
        expect.stringMatching(new RegExp(`^stovecard: ${pattern}$`)),
      ]);
    });
  });
}
