/**
 * The code version of a plan: sha256 over the source of everything that decides what a
 * plan contains (the simulation, physics, numerics, the planner, and the planner's words,
 * which are copied into refusals and warnings). Any edit there invalidates every cached
 * plan; edits to the loader, the renderers or the templates do not.
 */
import { createHash } from 'node:crypto';
import { readdir, readFile } from 'node:fs/promises';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const generatorDir = path.dirname(path.dirname(fileURLToPath(import.meta.url)));

/** Folders and files under generator/ whose source makes up the plan's code version. */
export const PLAN_SOURCES: readonly string[] = [
  'brew',
  'physics',
  'numerics',
  'planning',
  'words/plan.ts',
];

async function sourceFiles(relative: string): Promise<string[]> {
  const full = path.join(generatorDir, relative);
  if (relative.endsWith('.ts')) return [relative];
  let entries;
  try {
    entries = await readdir(full, { withFileTypes: true });
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return [];
    throw error;
  }
  const files: string[] = [];
  for (const entry of entries) {
    const child = `${relative}/${entry.name}`;
    if (entry.isDirectory()) files.push(...(await sourceFiles(child)));
    else if (entry.isFile() && /\.(ts|json)$/.test(entry.name)) files.push(child);
  }
  return files;
}

let memo: Promise<string> | null = null;

/** Hex sha256 of the plan sources (names and bytes, sorted by name); computed once per process. */
export function planCodeVersion(): Promise<string> {
  memo ??= (async () => {
    const files = (await Promise.all(PLAN_SOURCES.map(sourceFiles))).flat().sort();
    const hash = createHash('sha256');
    for (const file of files) {
      hash.update(`${file}\0`);
      hash.update(await readFile(path.join(generatorDir, file)));
      hash.update('\0');
    }
    return hash.digest('hex');
  })();
  return memo;
}

/** For tests and long-running servers that edit the sources: forget the memoised version. */
export function forgetPlanCodeVersion(): void {
  memo = null;
}
