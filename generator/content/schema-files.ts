/**
 * The JSON Schemas' text, read from generator/content/schemas/ (also when running compiled
 * from dist/: tsc copies no JSON). The browser bundle replaces this module with
 * schema-files.browser.ts, which carries the same files inlined (generator/browser/bundle.ts).
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { PROJECT_ROOT } from '../project-root.ts';
import type { SchemaName } from './schema-check.ts';

export function readSchema(name: SchemaName): object {
  const file = path.join(PROJECT_ROOT, 'generator', 'content', 'schemas', `${name}.schema.json`);
  return JSON.parse(readFileSync(file, 'utf8')) as object;
}
