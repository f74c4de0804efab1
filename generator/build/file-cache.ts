/**
 * A folder of files named by a key (a hex sha256 of what made them): `<dir>/<key><ext>`.
 * The plan, view, page and PDF caches are each one of these. Writes go to a temporary
 * name and are renamed, so a crash never leaves half a file; a file that cannot be read
 * is a miss, so a damaged cache only costs a re-render.
 */
import { constants, readFileSync } from 'node:fs';
import { access, copyFile, mkdir, readFile, rename, writeFile } from 'node:fs/promises';
import path from 'node:path';

let writes = 0;

export class FileCache {
  readonly dir: string;
  private made: Promise<unknown> | null = null;

  constructor(
    dir: string,
    private readonly ext: string,
  ) {
    this.dir = dir;
  }

  file(key: string): string {
    return path.join(this.dir, `${key}${this.ext}`);
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
      await copyFile(this.file(key), target, constants.COPYFILE_FICLONE);
      return true;
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code === 'ENOENT') return false;
      throw error;
    }
  }
}
