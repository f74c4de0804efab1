/**
 * Building beside the output and swapping it in: the site folder is either the last good
 * build or the new one, never half of each.
 *
 *   <out>.tmp-<pid>   written by the build and its extra steps
 *   <out>             renamed to <out>.old-<pid>, the new folder renamed in, the old removed
 */
import { mkdir, rename, rm, stat } from 'node:fs/promises';
import path from 'node:path';

export function tempDirFor(outDir: string, pid = process.pid): string {
  const abs = path.resolve(outDir);
  return path.join(path.dirname(abs), `${path.basename(abs)}.tmp-${pid}`);
}

/** A fresh, empty temporary folder beside `outDir`. */
export async function freshTempDir(outDir: string): Promise<string> {
  const tmp = tempDirFor(outDir);
  await rm(tmp, { recursive: true, force: true });
  await mkdir(tmp, { recursive: true });
  return tmp;
}

async function exists(p: string): Promise<boolean> {
  try {
    await stat(p);
    return true;
  } catch {
    return false;
  }
}

/** Puts `tmpDir` in place of `outDir` (two renames), then removes the old site. */
export async function swapIn(tmpDir: string, outDir: string): Promise<void> {
  const abs = path.resolve(outDir);
  const old = path.join(path.dirname(abs), `${path.basename(abs)}.old-${process.pid}`);
  const hadOld = await exists(abs);
  if (hadOld) {
    await rm(old, { recursive: true, force: true });
    await rename(abs, old);
  }
  try {
    await rename(tmpDir, abs);
  } catch (error) {
    if (hadOld) await rename(old, abs);
    throw error;
  }
  if (hadOld) await rm(old, { recursive: true, force: true });
}

export async function discard(tmpDir: string): Promise<void> {
  await rm(tmpDir, { recursive: true, force: true });
}
