/**
 * Where the project's files are, whether this code runs as TypeScript (tsx, vitest) from
 * generator/ or compiled to JavaScript in dist/generator/ (bin/stovecard.js): the folder
 * holding package.json, found upwards from this file.
 */
import { existsSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

function findRoot(start: string): string {
  for (let dir = start; ; dir = path.dirname(dir)) {
    if (existsSync(path.join(dir, 'package.json'))) return dir;
    if (path.dirname(dir) === dir) throw new Error(`no package.json above ${start}`);
  }
}

/** The project folder (package.json, templates/, content/, .eleventy.js). */
export const PROJECT_ROOT: string = findRoot(path.dirname(fileURLToPath(import.meta.url)));

/** True when running the compiled JavaScript of dist/ rather than the TypeScript sources. */
export const COMPILED: boolean = import.meta.url.endsWith('.js');
