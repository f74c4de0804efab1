/**
 * The edit loop of `build --serve`: saves made the way editors make them (a temporary file
 * renamed over the old one, which Node's recursive fs.watch loses track of) keep being
 * seen, a failed rebuild shows its error in the page over the last good site, the next
 * good save clears it, and the server listens on 127.0.0.1 only unless told otherwise.
 */
import { readFile, rename, rm, writeFile, mkdtemp } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildSite } from '../../generator/pipeline/build-site.ts';
import { serveSite, type SiteServer } from '../../generator/pipeline/serve.ts';
import { buildWords } from '../../generator/words/card.ts';
import { demoCopy } from '../hostile/site-tree.ts';

let root: string;
let content: string;
let server: SiteServer;
const log: string[] = [];
const COFFEE = 'coffees/house-blend.yaml';
let original: string;

/** An editor's atomic save: write a temporary file beside the target, rename it over. */
async function atomicSave(file: string, text: string): Promise<void> {
  const temp = path.join(path.dirname(file), `.${path.basename(file)}.swp-${Date.now()}`);
  await writeFile(temp, text);
  await rename(temp, file);
}

/** Waits until `count` log lines start with `prefix` (the watcher debounces, then builds). */
async function logged(prefix: string, count: number, timeoutMs = 90_000): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (log.filter((l) => l.startsWith(prefix)).length < count) {
    if (Date.now() > until)
      throw new Error(`no "${prefix}" #${count} in the log:\n${log.join('\n')}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

beforeAll(async () => {
  root = await mkdtemp(path.join(tmpdir(), 'stovecard-serve-watch-'));
  content = await demoCopy(path.join(root, 'content'));
  original = await readFile(path.join(content, COFFEE), 'utf8');
  const options = {
    contentDir: content,
    outDir: path.join(root, 'site'),
    cacheDir: path.join(root, 'cache'),
  };
  await buildSite(options);
  server = await serveSite({ ...options, port: 0, log: (line) => log.push(line) });
}, 180_000);

afterAll(async () => {
  await server?.close();
  if (root) await rm(root, { recursive: true, force: true });
});

describe('build --serve: watcher, overlay, binding', () => {
  it('listens on 127.0.0.1 only', () => {
    // Default host: a loopback address (other machines cannot reach it).
    expect(new URL(server.url).hostname).toMatch(/^(localhost|127\.0\.0\.1)$/);
  });

  it('sees two atomic saves of the same file in a row (rename over the old file)', async () => {
    await atomicSave(path.join(content, COFFEE), `${original}# first save\n`);
    await logged('rebuilt', 1);
    await atomicSave(path.join(content, COFFEE), `${original}# second save\n`);
    await logged('rebuilt', 2);
  }, 200_000);

  it('a failed rebuild shows its error over the last good page; a good save clears it', async () => {
    const before = await (await fetch(server.url)).text();
    const controller = new AbortController();
    const events = await fetch(new URL('/__stovecard/reload', server.url), {
      signal: controller.signal,
    });
    const reader = events.body!.getReader();
    await reader.read(); // ": connected"

    await atomicSave(
      path.join(content, COFFEE),
      original.replace('permeability_m2: 0.8e-12', 'permeability_m2: [oops'),
    );
    await logged('rebuild failed', 1);
    let pushed = '';
    while (!pushed.includes('event: failed'))
      pushed += new TextDecoder().decode((await reader.read()).value);
    expect(pushed).toContain(buildWords.overlayHeading);
    expect(pushed).toContain('house-blend.yaml');

    // A page loaded now: the last good site, with the overlay added on top.
    const during = await (await fetch(server.url)).text();
    expect(during).toContain('__stovecardOverlay("');
    expect(during.replace(/<script>[^]*?<\/script><\/body>/, '</body>')).toBe(
      before.replace(/<script>[^]*?<\/script><\/body>/, '</body>'),
    );

    await atomicSave(path.join(content, COFFEE), original);
    await logged('rebuilt', 3);
    while (!pushed.includes('data: reload'))
      pushed += new TextDecoder().decode((await reader.read()).value);
    controller.abort();
    expect(await (await fetch(server.url)).text()).not.toContain('__stovecardOverlay("');
  }, 200_000);
});
