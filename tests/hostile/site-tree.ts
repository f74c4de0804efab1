/**
 * Folders as evidence: a hash of a whole tree (names and bytes), whether a build left its
 * temporary or old folders beside the output, and copies of the demo content to break.
 */
import { createHash } from 'node:crypto';
import { cp, readdir, readFile, readlink, stat } from 'node:fs/promises';
import path from 'node:path';
import { DEMO_CONTENT } from './cli-run.ts';

async function files(dir: string): Promise<string[]> {
  const out: string[] = [];
  for (const entry of await readdir(dir, { withFileTypes: true })) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) out.push(...(await files(full)));
    else out.push(full);
  }
  return out.sort();
}

/** sha256 over every file's relative path and bytes (a file's own bytes); null when absent. */
export async function treeHash(dir: string): Promise<string | null> {
  let all: string[];
  try {
    all = (await stat(dir)).isDirectory() ? await files(dir) : [dir];
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code === 'ENOENT') return null;
    throw error;
  }
  const hash = createHash('sha256');
  for (const file of all) {
    hash.update(`${path.relative(dir, file)}\0`);
    hash.update(await readFile(file));
    hash.update('\0');
  }
  return hash.digest('hex');
}

/**
 * What a build left beside `outDir` besides the site: its temporary, old and link names,
 * and version folders (`<out>.v-…`) that `outDir` does not link to.
 */
export async function leftovers(outDir: string): Promise<string[]> {
  const base = path.basename(outDir);
  let current: string | null = null;
  try {
    current = await readlink(outDir);
  } catch {
    current = null;
  }
  const names = await readdir(path.dirname(outDir));
  return names.filter(
    (name) =>
      name !== current &&
      ['tmp', 'old', 'link', 'v'].some((kind) => name.startsWith(`${base}.${kind}-`)),
  );
}

/** A fresh copy of the demo content at `dir`. */
export async function demoCopy(dir: string, from = DEMO_CONTENT): Promise<string> {
  await cp(from, dir, { recursive: true });
  return dir;
}
