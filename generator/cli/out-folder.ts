/**
 * Where `stovecard build` may write. The build swaps a whole new site in place of --out
 * (generator/pipeline/swap.ts) and removes what was there, so --out must be a site an
 * earlier build made (it holds the marker file swap.ts writes into every site), an empty
 * folder, or a new one: never the content folder, the working folder or one of their
 * parents, never a file, never a folder of other things. A link someone made at --out is
 * kept, and what it points to is checked instead.
 */
import { realpath } from 'node:fs/promises';
import path from 'node:path';
import { checkReplaceable, OutFolderError, resolveOut } from '../pipeline/swap.ts';
import { buildWords } from '../words/card.ts';
import { faultWords } from '../words/build-faults.ts';
import { UsageError } from './errors.ts';

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

/** The words for a refused --out folder. */
export function outFolderMessage(outDir: string, error: OutFolderError): string {
  switch (error.code) {
    case 'not-a-folder':
      return buildWords.outNotAFolder(outDir);
    case 'not-a-site':
      return faultWords.outNotASite(outDir);
    case 'link-loop':
      return faultWords.outLinkLoop(outDir);
  }
}

/** Throws a UsageError saying why `outDir` may not be replaced by a build. */
export async function checkOutFolder(contentDir: string, outDir: string): Promise<void> {
  try {
    const managed = await resolveOut(outDir);
    const out = await real(managed);
    if (within(await real(contentDir), out))
      throw new UsageError(buildWords.outHoldsContent(outDir));
    if (within(await real(process.cwd()), out))
      throw new UsageError(buildWords.outHoldsWorkingFolder(outDir));
    await checkReplaceable(managed);
  } catch (error) {
    if (error instanceof OutFolderError) throw new UsageError(outFolderMessage(outDir, error));
    throw error;
  }
}
