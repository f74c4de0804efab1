/**
 * `stovecard` command line: one subcommand per job. Each subcommand module exports
 * `run(argv): Promise<number>` (the exit code). Bad input is a one-line error and exit 2,
 * never a stack trace.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { cliWords } from '../words/cli.ts';
import { UsageError, reportError } from './errors.ts';
import { nearest } from '../content/nearest.ts';
import { PROJECT_ROOT } from '../project-root.ts';

function packageVersion(): string {
  const text = readFileSync(path.join(PROJECT_ROOT, 'package.json'), 'utf8');
  return (JSON.parse(text) as { version: string }).version;
}

const commands: Record<string, () => Promise<{ run: (argv: string[]) => Promise<number> }>> = {
  simulate: () => import('./simulate.ts'),
  plan: () => import('./plan.ts'),
  fit: () => import('./fit.ts'),
  build: () => import('./build.ts'),
  init: () => import('./init.ts'),
};

export async function main(argv: string[]): Promise<number> {
  let [name, ...rest] = argv;
  if (name === '--version' || name === '-V' || name === 'version') {
    process.stdout.write(cliWords.version(packageVersion()));
    return 0;
  }
  // `stovecard help build` is `stovecard build --help`.
  if (name === 'help' && rest[0] !== undefined) [name, rest] = [rest[0], ['--help']];
  if (name === undefined || name === '--help' || name === '-h' || name === 'help') {
    process.stdout.write(cliWords.mainHelp(Object.keys(commands)));
    return name === undefined ? 2 : 0;
  }
  const load = commands[name];
  if (!load) {
    const names = Object.keys(commands);
    process.stderr.write(cliWords.unknownCommand(name, names, nearest(name, names)) + '\n');
    return 2;
  }
  try {
    return await (await load()).run(rest);
  } catch (error) {
    return reportError(error);
  }
}

// Run when executed directly (tsx generator/cli/main.ts or bin/stovecard.js).
const invokedDirectly =
  process.argv[1] !== undefined &&
  (import.meta.url.endsWith(process.argv[1]) ||
    process.argv[1].endsWith('stovecard.js') ||
    process.argv[1].endsWith('stovecard'));
if (invokedDirectly) {
  main(process.argv.slice(2)).then(
    (code) => {
      process.exitCode = code;
    },
    (error: unknown) => {
      process.exitCode = reportError(error);
    },
  );
}

export { UsageError };
