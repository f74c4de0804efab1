/** Shared option parsing for the subcommands (node:util parseArgs). */
import { parseArgs, type ParseArgsConfig } from 'node:util';
import { UsageError } from './errors.ts';
import { cliWords } from '../words/cli.ts';
import { nearest } from '../content/nearest.ts';

export type Options = Record<string, string | boolean | undefined>;

export function parseOptions(
  argv: string[],
  options: NonNullable<ParseArgsConfig['options']>,
): { values: Options; help: boolean } {
  try {
    const { values } = parseArgs({
      args: argv,
      options: { ...options, help: { type: 'boolean', short: 'h' } },
      strict: true,
      allowPositionals: false,
    });
    return { values: values as Options, help: values.help === true };
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    if ((error as NodeJS.ErrnoException).code === 'ERR_PARSE_ARGS_UNKNOWN_OPTION') {
      const option = /'(-[^' ]*)/.exec(message)?.[1] ?? '';
      const names = [...Object.keys(options), 'help'];
      throw new UsageError(
        cliWords.unknownOption(
          option,
          names.map((n) => `--${n}`),
          nearestOption(option, names),
        ),
      );
    }
    throw new UsageError(message);
  }
}

/** `--levl` → `--level`: the option nearest to a mistyped one (content/nearest.ts), if close. */
export function nearestOption(typed: string, names: readonly string[]): string | undefined {
  const found = nearest(typed.replace(/^-+/, '').split('=')[0]!, names);
  return found === undefined ? undefined : `--${found}`;
}

export function numberOption(values: Options, name: string): number | undefined {
  const raw = values[name];
  if (raw === undefined || typeof raw === 'boolean') return undefined;
  const value = Number(raw);
  if (!Number.isFinite(value) || raw.trim() === '')
    throw new UsageError(cliWords.badNumber(`--${name}`, raw));
  return value;
}

export function requiredString(values: Options, name: string, help: string): string {
  const raw = values[name];
  if (typeof raw !== 'string' || raw === '')
    throw new UsageError(cliWords.missingOption(`--${name}`, help));
  return raw;
}
