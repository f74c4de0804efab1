/**
 * A folder of files named by a key (a hex sha256 of what made them): `<dir>/<key><ext>`,
 * each with its own check file `<dir>/<key><ext>.sha256` ("<sha256 of the bytes> <size>").
 * The plan, view, page and PDF caches are each one of these. Writes go to a temporary
 * name and are renamed, so a crash never leaves half a file; every read checks the bytes
 * against the check file, and a file that fails (cut short or overwritten) is a miss that the build makes again and counts (damagedCounts), so a damaged
 * cache costs a re-render and a line in the build's report, never a wrong site.
 *
 * Eviction (sweepCacheFolders, after each successful build): a file no cache of its folder
 * has read or written in this process since the folder's last sweep, and not written for
 * CACHE_GRACE_DAYS, is deleted. What the site uses stays; what an edit replaced stays a
 * week (an undo rebuilds from the cache), then goes; so the cache holds the site plus a
 * week of edits, not every version ever built.
 */
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import {
  access,
  link,
  mkdir,
  readdir,
  readFile,
  rename,
  rm,
  stat,
  unlink,
  writeFile,
} from 'node:fs/promises';
import path from 'node:path';

let writes = 0;

export const CACHE_GRACE_DAYS = 7;

/** The check file's extension, after the cached file's own. */
export const CHECK_EXT = '.sha256';

/** File names read or written since the last sweep, by folder (shared by its caches). */
const usedNames = new Map<string, Set<string>>();

/**
 * Cached files this process has read and checked, by what identifies their bytes on disk
 * (device, inode, size and modification time, of the file and of its check file): a
 * cache file is only ever replaced by a rename (a new inode), and a write in place (a
 * person's, through a hard link in a site) changes its modification time. The change
 * time is left out: making a hard link changes it.
 */
const checkedOnDisk = new Set<string>();

function diskIdentity(info: import('node:fs').Stats, check: import('node:fs').Stats): string {
  const one = (s: import('node:fs').Stats) => `${s.dev}:${s.ino}:${s.size}:${s.mtimeMs}`;
  return `${one(info)}|${one(check)}`;
}

/** Files that failed their check since the counts were last taken, by folder. */
const damaged = new Map<string, number>();

function usedIn(dir: string): Set<string> {
  let names = usedNames.get(dir);
  if (!names) {
    names = new Set();
    usedNames.set(dir, names);
  }
  return names;
}

/** The check text of `data`: its sha256 and its length in bytes. */
export function checkText(data: Uint8Array): string {
  return `${createHash('sha256').update(data).digest('hex')} ${data.length}\n`;
}

/**
 * Files that failed their check in the folders under `cacheDir` since the last call, by
 * folder name ("plans", "pdfs", …); the counts start again from zero.
 */
export function damagedCounts(cacheDir: string): Record<string, number> {
  const root = path.resolve(cacheDir);
  const out: Record<string, number> = {};
  for (const [dir, count] of damaged) {
    if (path.dirname(dir) !== root || count === 0) continue;
    out[path.basename(dir)] = count;
    damaged.delete(dir);
  }
  return out;
}

export class FileCache {
  readonly dir: string;
  private made: Promise<unknown> | null = null;

  private readonly used: Set<string>;

  constructor(
    dir: string,
    private readonly ext: string,
  ) {
    this.dir = path.resolve(dir);
    this.used = usedIn(this.dir);
  }

  /** The key's file, counted as used with its check file (a sweep keeps them). */
  file(key: string): string {
    const name = `${key}${this.ext}`;
    this.used.add(name);
    this.used.add(`${name}${CHECK_EXT}`);
    return path.join(this.dir, name);
  }

  /** The bytes when they pass their check; null when absent; a failed check counts. */
  private verified(data: Buffer | null, check: string | null): Buffer | null {
    // Either missing: not cached (a file from before checks were kept has none).
    if (data === null || check === null) return null;
    if (checkText(data) === check) return data;
    damaged.set(this.dir, (damaged.get(this.dir) ?? 0) + 1);
    return null;
  }

  /** The key's bytes, checked; null when absent or damaged. */
  async getBytes(key: string): Promise<Buffer | null> {
    const file = this.file(key);
    const [data, check] = await Promise.all([
      readFile(file).catch(() => null),
      readFile(`${file}${CHECK_EXT}`, 'latin1').catch(() => null),
    ]);
    return this.verified(data, check);
  }

  async getText(key: string): Promise<string | null> {
    return (await this.getBytes(key))?.toString('utf8') ?? null;
  }

  /** For callers that read the file later, and only if they need it (reads check it). */
  async has(key: string): Promise<boolean> {
    try {
      const file = this.file(key);
      await Promise.all([access(file), access(`${file}${CHECK_EXT}`)]);
      return true;
    } catch {
      return false;
    }
  }

  getTextSync(key: string): string | null {
    const file = this.file(key);
    const read = <T>(f: () => T): T | null => {
      try {
        return f();
      } catch {
        return null;
      }
    };
    const data = read(() => readFileSync(file));
    const check = read(() => readFileSync(`${file}${CHECK_EXT}`, 'latin1'));
    return this.verified(data, check)?.toString('utf8') ?? null;
  }

  async put(key: string, data: string | Uint8Array): Promise<void> {
    this.made ??= mkdir(this.dir, { recursive: true });
    await this.made;
    const bytes = typeof data === 'string' ? Buffer.from(data, 'utf8') : data;
    const file = this.file(key);
    const tmp = `${file}.tmp-${process.pid}-${writes++}`;
    // The check first: a crash between the two renames leaves a file that fails it.
    await writeFile(tmp, checkText(bytes));
    await rename(tmp, `${file}${CHECK_EXT}`);
    await writeFile(tmp, bytes);
    await rename(tmp, file);
  }

  /**
   * Puts the cached file at `target` when its bytes pass their check; false when the key
   * is not cached or its file is damaged. A hard link where the file system allows (the
   * cache's files are never written in place, only replaced by a rename, so the site's
   * file keeps the bytes that were checked), else a copy of the checked bytes. A file this
   * process already checked and that has not changed on disk since is not read again.
   */
  async copyTo(key: string, target: string): Promise<boolean> {
    const file = this.file(key);
    let identity: string;
    try {
      const [info, check] = await Promise.all([stat(file), stat(`${file}${CHECK_EXT}`)]);
      identity = diskIdentity(info, check);
    } catch {
      return false;
    }
    let bytes: Buffer | null = null;
    if (!checkedOnDisk.has(identity)) {
      bytes = await this.getBytes(key);
      if (bytes === null) return false;
    }
    try {
      await link(file, target);
      const [info, check] = await Promise.all([stat(target), stat(`${file}${CHECK_EXT}`)]);
      // Linked to what was checked (not to a file renamed in since): done.
      if (diskIdentity(info, check) === identity) {
        checkedOnDisk.add(identity);
        return true;
      }
      await rm(target, { force: true });
    } catch {
      // No hard links here (another device, a file system without them): a copy.
      await rm(target, { force: true });
    }
    bytes ??= await this.getBytes(key);
    if (bytes === null) return false;
    await writeFile(target, bytes);
    return true;
  }
}

export interface SweepReport {
  readonly kept: number;
  readonly deleted: number;
}

/**
 * Deletes the files of `dirs` that no FileCache used since the folder's last sweep and
 * that were last written more than `graceDays` ago (leftover temporary files included),
 * then starts the folders' next round of use. A folder that does not exist is empty.
 */
export async function sweepCacheFolders(
  dirs: readonly string[],
  graceDays: number = CACHE_GRACE_DAYS,
  now: number = Date.now(),
): Promise<SweepReport> {
  const oldest = now - graceDays * 24 * 3600 * 1000;
  let kept = 0;
  let deleted = 0;
  for (const dir of dirs.map((d) => path.resolve(d))) {
    const used = usedIn(dir);
    let names: string[];
    try {
      names = await readdir(dir);
    } catch {
      continue;
    }
    const present = new Set(names);
    for (const name of names) {
      // A check file goes with its file (and alone only when its file is gone).
      if (name.endsWith(CHECK_EXT) && present.has(name.slice(0, -CHECK_EXT.length))) continue;
      if (used.has(name)) {
        kept++;
        continue;
      }
      const file = path.join(dir, name);
      try {
        if ((await stat(file)).mtimeMs < oldest) {
          await unlink(file);
          if (present.has(`${name}${CHECK_EXT}`))
            await unlink(`${file}${CHECK_EXT}`).catch(() => {});
          deleted++;
        } else kept++;
      } catch {
        // Gone already (another build's sweep): nothing to do.
      }
    }
    used.clear();
  }
  return { kept, deleted };
}
