/** serveSite: the built site on localhost, with a reload message after each rebuild. */
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildSite } from '../../generator/pipeline/build-site.ts';
import { serveSite, type SiteServer } from '../../generator/pipeline/serve.ts';

let root: string;
let server: SiteServer;
const log: string[] = [];

beforeAll(async () => {
  root = await mkdtemp(path.join(tmpdir(), 'stovecard-serve-'));
  const options = {
    contentDir: 'content',
    outDir: path.join(root, 'site'),
    cacheDir: path.join(root, 'cache'),
  };
  await buildSite(options);
  server = await serveSite({ ...options, port: 0, log: (line) => log.push(line) });
});

afterAll(async () => {
  await server?.close();
  await rm(root, { recursive: true, force: true });
});

describe('serveSite', () => {
  it('serves pages with the reload hook added (the files on disk have none)', async () => {
    const index = await fetch(server.url);
    expect(index.status).toBe(200);
    expect(await index.text()).toContain('EventSource');
    const css = await fetch(new URL('assets/card.css', server.url));
    expect(css.headers.get('content-type')).toContain('text/css');
    const folder = await fetch(new URL('method/', server.url));
    expect(await folder.text()).toContain('<h1>');
  });

  it('refuses paths outside the site', async () => {
    const res = await fetch(new URL('/..%2F..%2Fpackage.json', server.url));
    expect(res.status).toBe(404);
  });

  it('tells open pages to reload after a rebuild', async () => {
    const controller = new AbortController();
    const events = await fetch(new URL('/__stovecard/reload', server.url), {
      signal: controller.signal,
    });
    const reader = events.body!.getReader();
    await reader.read(); // ": connected"
    await server.rebuild();
    const { value } = await reader.read();
    expect(new TextDecoder().decode(value)).toContain('data: reload');
    controller.abort();
    expect(log.some((line) => line.startsWith('rebuilt'))).toBe(true);
  });
});
