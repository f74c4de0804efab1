/**
 * A damaged cache never ships, through the real build: cached PDFs replaced by `%%EOF`
 * (what issue 16 saw go into the site with exit 0), views and plans replaced by valid but
 * wrong JSON. Each fails its stored sha256, is made again, and the build says so.
 */
import { mkdtemp, readdir, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { faultWords } from '../../generator/words/build-faults.ts';
import { lines, runMainIn } from './cli-run.ts';
import { demoCopy, treeHash } from './site-tree.ts';

let root: string;
let content: string;

beforeAll(async () => {
  root = await mkdtemp(path.join(tmpdir(), 'stovecard-cache-damage-'));
  content = await demoCopy(path.join(root, 'content'));
  const site = path.join(content, 'site.yaml');
  const { readFile } = await import('node:fs/promises');
  const text = await readFile(site, 'utf8');
  await writeFile(
    site,
    `${text.slice(0, text.indexOf('sets:'))}sets:\n  - id: bar\n    title: Bar\n    layout: station\n    cards:\n      - { pot: three-cup, coffee: house-blend, stove: bar-gas }\n      - { pot: six-cup, coffee: ember-blend, stove: bar-gas }\n`,
  );
  process.env.SOURCE_DATE_EPOCH = '1767225600';
});

afterAll(async () => {
  delete process.env.SOURCE_DATE_EPOCH;
  if (root) await rm(root, { recursive: true, force: true });
});

async function overwriteAll(folder: string, ext: string, text: string): Promise<number> {
  const dir = path.join(root, '.stovecard-cache', folder);
  const names = (await readdir(dir)).filter((name) => name.endsWith(ext));
  for (const name of names) await writeFile(path.join(dir, name), text);
  return names.length;
}

describe('damaged cache files', () => {
  it('PDFs cut to %%EOF, views and plans replaced by {}: made again, the same site, and a note', async () => {
    const out = path.join(root, 'site');
    const first = await runMainIn(root, ['build', '--content', content, '--out', out]);
    expect(first.code, first.stderr).toBe(0);
    const good = await treeHash(out);
    const pdfs = await overwriteAll('pdfs', '.pdf', '%%EOF\n');
    const views = await overwriteAll('views', '.json', '{}');
    const plans = await overwriteAll('plans', '.json', '{}');
    const pages = await overwriteAll('pages', '.html', '</html>\n');
    expect(pdfs).toBe(3); // two cards and the set
    const second = await runMainIn(root, ['build', '--content', content, '--out', out]);
    expect(second.code, second.stderr).toBe(0);
    expect(second.stderr).not.toContain('internal error');
    expect(await treeHash(out)).toBe(good);
    const note = lines(second.stderr).find((line) => line.startsWith('note: made again'));
    expect(note, second.stderr).toBe(faultWords.damagedCache({ plans, views, pages, pdfs }));
    // The files made again are whole: a third build takes everything from the cache quietly.
    const third = await runMainIn(root, ['build', '--content', content, '--out', out]);
    expect(third.code, third.stderr).toBe(0);
    expect(third.stderr).not.toContain('note:');
    expect(third.stderr).toContain('planned 0, from cache 2');
  }, 120_000);
});
