/**
 * One content file from bytes to schema-valid data: read (size cap, strict UTF-8, sha256),
 * parse with positions, check against the kind's JSON Schema. What each kind then checks
 * and converts lives in pot.ts, coffee.ts, stove.ts, log.ts and site.ts.
 */
import { basename, extname } from 'node:path';
import { readContentText } from './file-bytes.ts';
import type { SchemaName } from './schema-check.ts';
import { validText, type Checked, type ValidFile } from './entry-text.ts';

export { validText, type Checked, type ValidFile } from './entry-text.ts';

/** The id a file gives its entry: its name without .yaml or .yml. */
export function idOfFile(path: string): string {
  return basename(path, extname(path));
}

/** Read `path` (named `file` in messages) and check it against the `schema` schema. */
async function readValidFile<T>(
  schema: SchemaName,
  path: string,
  file: string,
): Promise<Checked<ValidFile<T>>> {
  const read = await readContentText(path, file);
  if (!read.ok) return { issues: [read.issue] };
  return validText<T>(schema, read.text, read.hash, idOfFile(path), file);
}

/** Read, check and build one entry: `build` makes the kind's own checks and the SI entry. */
export async function loadEntry<T, E>(
  schema: SchemaName,
  path: string,
  file: string,
  build: (valid: ValidFile<T>) => Checked<E>,
): Promise<Checked<E>> {
  const read = await readValidFile<T>(schema, path, file);
  return read.value === undefined ? { issues: read.issues } : build(read.value);
}
