/**
 * The command line's own help: --version, `help <command>`, and the nearest command or
 * option offered for a mistyped one (a slip of one edit in four letters or so, the usual
 * behaviour of command-line tools: common practice, no source).
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { PROJECT_ROOT, runMain } from './cli-run.ts';

const VERSION = (
  JSON.parse(readFileSync(path.join(PROJECT_ROOT, 'package.json'), 'utf8')) as { version: string }
).version;

describe('stovecard --version and help <command>', () => {
  it('--version prints the version of package.json, exit 0', async () => {
    const run = await runMain(['--version']);
    expect(run.code).toBe(0);
    expect(run.stdout).toBe(`stovecard ${VERSION}\n`);
  });

  it('help build prints the build command’s help, not the main help', async () => {
    const viaHelp = await runMain(['help', 'build']);
    const viaFlag = await runMain(['build', '--help']);
    expect(viaHelp.code).toBe(0);
    expect(viaHelp.stdout).toContain('Usage: stovecard build');
    expect(viaHelp.stdout).toBe(viaFlag.stdout);
  });
});

describe('nearest-match suggestions', () => {
  it('a mistyped command is answered with the nearest one (buidl → build), exit 2', async () => {
    const run = await runMain(['buidl']);
    expect(run.code).toBe(2);
    expect(run.stderr).toContain('did you mean "build"?');
  });

  it('a command nothing is near gets no suggestion, only the list', async () => {
    const run = await runMain(['zzzzzz']);
    expect(run.code).toBe(2);
    expect(run.stderr).not.toContain('did you mean');
    expect(run.stderr).toContain('simulate, plan, fit, build');
  });

  it.each([
    [['plan', '--pott', 'x'], '--pot'],
    [['simulate', '--levle', 'x'], '--level'],
    [['build', '--serv'], '--serve'],
    [['fit', '--contnt', 'x'], '--content'],
  ])('%j suggests %s, exit 2, no stack trace', async (argv, suggestion) => {
    const run = await runMain(argv);
    expect(run.code).toBe(2);
    expect(run.stderr).toContain(`did you mean ${suggestion}?`);
    expect(run.stderr).not.toMatch(/\n\s+at /);
  });
});
