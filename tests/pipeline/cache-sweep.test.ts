import { mkdtemp, readdir, readFile, rm, utimes, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import {
  CACHE_GRACE_DAYS,
  CHECK_EXT,
  damagedCounts,
  FileCache,
  sweepCacheFolders,
} from '../../generator/pipeline/file-cache.ts';

const DAY_MS = 24 * 3600 * 1000;
const folders: string[] = [];
afterEach(async () => {
  await Promise.all(folders.splice(0).map((dir) => rm(dir, { recursive: true, force: true })));
});

async function folder(): Promise<string> {
  const dir = await mkdtemp(path.join(tmpdir(), 'stovecard-sweep-'));
  folders.push(dir);
  return dir;
}

async function age(file: string, days: number): Promise<void> {
  const when = new Date(Date.now() - days * DAY_MS);
  await utimes(file, when, when);
}

describe('sweepCacheFolders', () => {
  it('deletes what no cache used since the last sweep and is older than the grace', async () => {
    const dir = await folder();
    const cache = new FileCache(dir, '.json');
    await cache.put('used-old', '{}');
    await cache.put('unused-old', '{}');
    await cache.put('unused-new', '{}');
    await writeFile(path.join(dir, 'stray.json.tmp-1-1'), 'half');
    for (const key of ['used-old', 'unused-old']) await age(cache.file(key), CACHE_GRACE_DAYS + 3);
    await age(path.join(dir, 'stray.json.tmp-1-1'), CACHE_GRACE_DAYS + 3);
    // Everything was used by this "build" but the stray temporary file.
    expect(await sweepCacheFolders([dir])).toEqual({ kept: 3, deleted: 1 });
    // A new build's caches: only what it reads or writes counts as used.
    const next = new FileCache(dir, '.json');
    expect(await next.getText('used-old')).toBe('{}');

    expect(await sweepCacheFolders([dir])).toEqual({ kept: 2, deleted: 1 });
    expect((await readdir(dir)).sort()).toEqual([
      'unused-new.json',
      'unused-new.json.sha256',
      'used-old.json',
      'used-old.json.sha256',
    ]);
  });

  it('counts a copy out of the cache as a use, and a missing folder as empty', async () => {
    const dir = await folder();
    const cache = new FileCache(dir, '.pdf');
    await cache.put('card', 'pdf');
    await age(cache.file('card'), 30);
    await sweepCacheFolders([dir]);
    expect(await new FileCache(dir, '.pdf').copyTo('card', path.join(dir, '..', 'out.pdf'))).toBe(
      true,
    );
    folders.push(path.join(dir, '..', 'out.pdf'));
    expect(await sweepCacheFolders([dir, path.join(dir, 'missing')])).toEqual({
      kept: 1,
      deleted: 0,
    });
  });
});

describe('FileCache checks every file against the sha256 stored beside it', () => {
  // The check: FIPS 180-4 SHA-256 through node:crypto; sha256("abc") is the standard's
  // example B.1 (ba7816bf…), so the stored check is the standard digest of the bytes.
  it('stores the standard digest and size of the bytes', async () => {
    const dir = await folder();
    const cache = new FileCache(dir, '.json');
    await cache.put('abc', 'abc');
    expect(await readFile(`${cache.file('abc')}${CHECK_EXT}`, 'latin1')).toBe(
      'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad 3\n',
    );
  });

  it('treats a file cut short, replaced by a valid-looking tail, or unchecked as a miss, and counts the damaged', async () => {
    const dir = await folder();
    const cacheDir = path.dirname(dir);
    const cache = new FileCache(dir, '.pdf');
    damagedCounts(cacheDir);
    await cache.put('whole', '%PDF-1.7\n…\n%%EOF\n');
    await cache.put('eof-only', '%PDF-1.7\n…\n%%EOF\n');
    await cache.put('cut', '%PDF-1.7\n… 12 0 obj <<');
    await writeFile(cache.file('eof-only'), '%%EOF\n'); // what issue 16 found shipping
    await writeFile(cache.file('cut'), '%PDF-1.7\n');
    await writeFile(path.join(dir, 'unchecked.pdf'), '%PDF-1.7\n…\n%%EOF\n');
    expect(await cache.copyTo('whole', path.join(dir, 'out-whole.pdf'))).toBe(true);
    expect(await readFile(path.join(dir, 'out-whole.pdf'), 'utf8')).toBe('%PDF-1.7\n…\n%%EOF\n');
    expect(await cache.copyTo('eof-only', path.join(dir, 'out-eof.pdf'))).toBe(false);
    expect(await cache.copyTo('cut', path.join(dir, 'out-cut.pdf'))).toBe(false);
    expect(await cache.copyTo('unchecked', path.join(dir, 'out-unchecked.pdf'))).toBe(false);
    expect(await cache.copyTo('absent', path.join(dir, 'out-absent.pdf'))).toBe(false);
    expect(cache.getTextSync('eof-only')).toBeNull();
    expect(damagedCounts(cacheDir)).toEqual({ [path.basename(dir)]: 3 });
    expect(damagedCounts(cacheDir)).toEqual({});
  });
});
