/**
 * A folder of files named by a key (a hex sha256 of what made them): `<dir>/<key><ext>`.
 * The plan, view, page and PDF caches are each one of these. Writes go to a temporary
 * name and are renamed, so a crash never leaves half a file; a file that cannot be read
 * is a miss (and so is a copy of one that does not end as its kind must), so a damaged
 * cache only costs a re-render.
 *
 * Eviction (sweepCacheFolders, after each successful build): a file no cache of its folder
 * has read or written in this process since the folder's last sweep, and not written for
 * CACHE_GRACE_DAYS, is deleted. What the site uses stays; what an edit replaced stays a
 * week (an undo rebuilds from the cache), then goes; so the cache holds the site plus a
 * week of edits, not every version ever built.
 */
import { constants, readFileSync } from 'node:fs';
import {
  access,
  copyFile,
  mkdir,
  open,
  readdir,
  readFile,
  rename,
  stat,
  unlink,
  writeFile,
} from 'node:fs/promises';
import path from 'node:path';

let writes = 0;

export const CACHE_GRACE_DAYS = 7;

/** File names read or written since the last sweep, by folder (shared by its caches). */
const usedNames = new Map<string, Set<string>>();

function usedIn(dir: string): Set<string> {
  let names = usedNames.get(dir);
  if (!names) {
    names = new Set();
    usedNames.set(dir, names);
  }
  return names;
}

export class FileCache {
  readonly dir: string;
  private made: Promise<unknown> | null = null;

  private readonly used: Set<string>;

  /**
   * `ending`: how every whole file of this cache ends (a PDF's `%%EOF`, a page's `</html>`);
   * a file that does not is damaged, and copyTo treats it as a miss.
   */
  constructor(
    dir: string,
    private readonly ext: string,
    private readonly ending?: string,
  ) {
    this.dir = path.resolve(dir);
    this.used = usedIn(this.dir);
  }

  /** The key's file, counted as used (a sweep keeps it). */
  file(key: string): string {
    const name = `${key}${this.ext}`;
    this.used.add(name);
    return path.join(this.dir, name);
  }

  async getText(key: string): Promise<string | null> {
    try {
      return await readFile(this.file(key), 'utf8');
    } catch {
      return null;
    }
  }

  /** For callers that read the file later, and only if they need it. */
  async has(key: string): Promise<boolean> {
    try {
      await access(this.file(key));
      return true;
    } catch {
      return false;
    }
  }

  getTextSync(key: string): string | null {
    try {
      return readFileSync(this.file(key), 'utf8');
    } catch {
      return null;
    }
  }

  async put(key: string, data: string | Uint8Array): Promise<void> {
    this.made ??= mkdir(this.dir, { recursive: true });
    await this.made;
    const tmp = `${this.file(key)}.tmp-${process.pid}-${writes++}`;
    await writeFile(tmp, data);
    await rename(tmp, this.file(key));
  }

  /**
   * Copies the cached file to `target` (a copy-on-write clone where the file system has
   * them); false when the key is not cached. A copy, not a hard link: a site file edited
   * in place must not change the cache.
   */
  async copyTo(key: string, target: string): Promise<boolean> {
    try {
      const file = this.file(key);
      if (this.ending !== undefined && !(await endsWith(file, this.ending))) return false;
      await copyFile(file, target, constants.COPYFILE_FICLONE);
      return true;
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code === 'ENOENT') return false;
      throw error;
    }
  }
}

/** True when the file's last bytes, trailing white space aside, are `ending`. */
async function endsWith(file: string, ending: string): Promise<boolean> {
  const handle = await open(file, 'r');
  try {
    const { size } = await handle.stat();
    const tail = Buffer.alloc(Math.min(size, ending.length + 16));
    await handle.read(tail, 0, tail.length, size - tail.length);
    return tail.toString('latin1').trimEnd().endsWith(ending);
  } finally {
    await handle.close();
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
    for (const name of names) {
      if (used.has(name)) {
        kept++;
        continue;
      }
      const file = path.join(dir, name);
      try {
        if ((await stat(file)).mtimeMs < oldest) {
          await unlink(file);
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
