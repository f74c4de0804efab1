/**
 * Where `stovecard build` may write. The build swaps a whole new folder in place of --out
 * (generator/pipeline/swap.ts) and removes what was there, so --out must be a site an earlier
 * build made, an empty folder, or a new one: never the content folder, the working folder
 * or one of their parents, never a file, never a folder of other things.
 */
import { readdir, realpath, stat } from 'node:fs/promises';
import path from 'node:path';
import { buildWords } from '../words/card.ts';
import { UsageError } from './errors.ts';

/** The page every build writes at the top of the site: its presence marks an earlier build. */
const SITE_MARK = 'index.html';

async function real(p: string): Promise<string> {
  try {
    return await realpath(p);
  } catch {
    return path.resolve(p);
  }
}

/** `inner` is `outer` or inside it. */
function within(inner: string, outer: string): boolean {
  const relative = path.relative(outer, inner);
  return relative === '' || (!relative.startsWith('..') && !path.isAbsolute(relative));
}

/** Throws a UsageError saying why `outDir` may not be replaced by a build. */
export async function checkOutFolder(contentDir: string, outDir: string): Promise<void> {
  const out = await real(outDir);
  if (within(await real(contentDir), out)) throw new UsageError(buildWords.outHoldsContent(outDir));
  if (within(await real(process.cwd()), out))
    throw new UsageError(buildWords.outHoldsWorkingFolder(outDir));
  let isFolder: boolean;
  try {
    isFolder = (await stat(out)).isDirectory();
  } catch {
    return; // not there yet: the build creates it
  }
  if (!isFolder) throw new UsageError(buildWords.outNotAFolder(outDir));
  const names = await readdir(out);
  if (names.length > 0 && !names.includes(SITE_MARK))
    throw new UsageError(buildWords.outNotASite(outDir));
}
