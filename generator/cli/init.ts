/**
 * `stovecard init [DIR]`: a new content folder (default `content`) with one entry of each
 * kind, each linked to its JSON Schema by a `# yaml-language-server: $schema=…` line that
 * points at this stovecard's schemas, relative to the file. DIR must be new or empty, and
 * every file is created exclusively (`wx`), so nothing the user wrote is ever replaced.
 */
import { mkdir, readdir, stat, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { parseArgs } from 'node:util';
import { PROJECT_ROOT } from '../project-root.ts';
import { INIT_FILES, initWords, type InitSchema } from '../words/init.ts';
import { shown } from '../words/shown.ts';
import { UsageError } from './errors.ts';
import { nearestOption } from './options.ts';
import { cliWords } from '../words/cli.ts';

const SCHEMAS = path.join(PROJECT_ROOT, 'generator', 'content', 'schemas');

/**
 * The modeline's schema path for a file at `file`: relative (with `/`) when the folder is
 * inside this stovecard's project (as `content/` is), else a file:// URL, which stays
 * right when the folder is moved.
 */
export function schemaPathFor(file: string, schema: InitSchema): string {
  const target = path.join(SCHEMAS, `${schema}.schema.json`);
  const inside = path.relative(PROJECT_ROOT, path.resolve(file));
  if (inside.startsWith('..') || path.isAbsolute(inside)) return pathToFileURL(target).href;
  return path
    .relative(path.dirname(path.resolve(file)), target)
    .split(path.sep)
    .join('/');
}

/** Entries in `dir`, or null when it does not exist; a UsageError when it is a file. */
async function entriesOf(dir: string): Promise<number | null> {
  let info;
  try {
    info = await stat(dir);
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return null;
    throw error;
  }
  if (!info.isDirectory()) throw new UsageError(initWords.notAFolder(shown(dir)));
  return (await readdir(dir)).length;
}

/** Writes the new content folder; returns the files written, relative to `dir`. */
export async function initContent(dir: string): Promise<string[]> {
  const entries = await entriesOf(dir);
  if (entries !== null && entries > 0)
    throw new UsageError(initWords.notEmpty(shown(dir), entries));
  const written: string[] = [];
  for (const { file, schema } of INIT_FILES) {
    const full = path.join(dir, file);
    await mkdir(path.dirname(full), { recursive: true });
    // `wx`: fails rather than replace a file that appeared meanwhile.
    await writeFile(full, initWords.fileText(schema, schemaPathFor(full, schema)), {
      flag: 'wx',
    });
    written.push(file);
  }
  return written;
}

export async function run(argv: string[]): Promise<number> {
  let parsed;
  try {
    parsed = parseArgs({
      args: argv,
      options: { help: { type: 'boolean', short: 'h' } },
      strict: true,
      allowPositionals: true,
    });
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ERR_PARSE_ARGS_UNKNOWN_OPTION') {
      const option = /'(-[^' ]*)/.exec((error as Error).message)?.[1] ?? '';
      throw new UsageError(
        cliWords.unknownOption(option, ['--help'], nearestOption(option, ['help'])),
      );
    }
    throw new UsageError((error as Error).message);
  }
  if (parsed.values.help === true) {
    process.stdout.write(initWords.help);
    return 0;
  }
  const [dir = 'content', extra] = parsed.positionals;
  if (extra !== undefined) throw new UsageError(initWords.tooMany(shown(extra)));
  const files = await initContent(dir);
  process.stdout.write(initWords.written(shown(dir), files));
  return 0;
}
