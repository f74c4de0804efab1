/**
 * The caches put unchanged files into a site as hard links where the file system allows
 * (FileCache.copyTo), and the pool starts its workers from compiled JavaScript only when
 * that is up to date (pool.ts freshCompiledWorker). Own rules of the pipeline: the site's
 * file always holds the bytes that passed their check, and a stale dist/ is never run.
 */
import { mkdir, mkdtemp, readFile, rm, stat, utimes, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { damagedCounts, FileCache } from '../../generator/pipeline/file-cache.ts';
import { freshCompiledWorker } from '../../generator/pipeline/pool.ts';

const folders: string[] = [];
afterEach(async () => {
  await Promise.all(folders.splice(0).map((dir) => rm(dir, { recursive: true, force: true })));
});

async function folder(): Promise<string> {
  const dir = await mkdtemp(path.join(tmpdir(), 'stovecard-link-'));
  folders.push(dir);
  return dir;
}

describe('FileCache.copyTo', () => {
  it('links the cached file into the site (same bytes, one inode on this file system)', async () => {
    const dir = await folder();
    const cache = new FileCache(path.join(dir, 'cache'), '.pdf');
    await cache.put('k', Buffer.from('%PDF-1.7 card'));
    const target = path.join(dir, 'site.pdf');
    expect(await cache.copyTo('k', target)).toBe(true);
    expect(await readFile(target, 'latin1')).toBe('%PDF-1.7 card');
    const [site, cached] = await Promise.all([stat(target), stat(cache.file('k'))]);
    // The temporary folder is one file system, where Linux has hard links.
    expect(site.ino).toBe(cached.ino);
    // A second site gets its own link; removing one leaves the cache whole.
    const second = path.join(dir, 'second.pdf');
    expect(await cache.copyTo('k', second)).toBe(true);
    await rm(target);
    expect(await cache.getText('k')).toBe('%PDF-1.7 card');
  });

  it('a cached file written in place after it was checked is checked again and refused', async () => {
    const dir = await folder();
    const cacheDir = path.join(dir, 'cache');
    const cache = new FileCache(path.join(cacheDir, 'pdfs'), '.pdf');
    await cache.put('k', Buffer.from('%PDF-1.7 good'));
    expect(await cache.copyTo('k', path.join(dir, 'a.pdf'))).toBe(true);
    damagedCounts(cacheDir);
    // A person edits the linked site file in place: the cache's file changes with it.
    await writeFile(path.join(dir, 'a.pdf'), '%PDF-1.7 evil');
    const later = new Date(Date.now() + 5000);
    await utimes(cache.file('k'), later, later);
    expect(await cache.copyTo('k', path.join(dir, 'b.pdf'))).toBe(false);
    expect(damagedCounts(cacheDir)).toEqual({ pdfs: 1 });
  });

  it('a key that is not cached is not put in the site', async () => {
    const dir = await folder();
    const cache = new FileCache(path.join(dir, 'cache'), '.pdf');
    expect(await cache.copyTo('absent', path.join(dir, 'x.pdf'))).toBe(false);
    await expect(stat(path.join(dir, 'x.pdf'))).rejects.toThrow();
  });
});

describe('freshCompiledWorker', () => {
  it('is the compiled worker when no source is newer, and null once one is', async () => {
    const root = await folder();
    const source = path.join(root, 'generator', 'pipeline', 'pool.ts');
    const compiled = path.join(root, 'dist', 'generator', 'pipeline', 'build-worker.js');
    await mkdir(path.dirname(source), { recursive: true });
    await mkdir(path.dirname(compiled), { recursive: true });
    await writeFile(source, '// source');
    await writeFile(compiled, '// compiled');
    const past = new Date(Date.now() - 60_000);
    await utimes(source, past, past);
    expect(freshCompiledWorker(root)?.pathname).toBe(compiled);
    const future = new Date(Date.now() + 60_000);
    await utimes(source, future, future);
    expect(freshCompiledWorker(root)).toBeNull();
    await rm(compiled);
    expect(freshCompiledWorker(root)).toBeNull();
  });
});
