/**
 * `stovecard` command line: one subcommand per job. Each subcommand module exports
 * `run(argv): Promise<number>` (the exit code). Bad input is a one-line error and exit 2,
 * never a stack trace.
 */
import { cliWords } from '../words/cli.ts';
import { UsageError, reportError } from './errors.ts';

const commands: Record<string, () => Promise<{ run: (argv: string[]) => Promise<number> }>> = {
  simulate: () => import('./simulate.ts'),
  plan: () => import('./plan.ts'),
  fit: () => import('./fit.ts'),
  build: () => import('./build.ts'),
};

export async function main(argv: string[]): Promise<number> {
  const [name, ...rest] = argv;
  if (name === undefined || name === '--help' || name === '-h' || name === 'help') {
    process.stdout.write(cliWords.mainHelp(Object.keys(commands)));
    return name === undefined ? 2 : 0;
  }
  const load = commands[name];
  if (!load) {
    process.stderr.write(cliWords.unknownCommand(name, Object.keys(commands)) + '\n');
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
  (import.meta.url.endsWith(process.argv[1]) || process.argv[1].endsWith('stovecard.js') || process.argv[1].endsWith('stovecard'));
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
