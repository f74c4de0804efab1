/**
 * `build --serve` and file-system failures through the real entry points: the server
 * survives malformed URLs and requests that land during a swap; a port in use is found
 * before the build; file-system errors come out as what to change, not "internal error".
 */
import http from 'node:http';
import { mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { reportError } from '../../generator/cli/errors.ts';
import { buildSite } from '../../generator/pipeline/build-site.ts';
import { serveSite, type SiteServer } from '../../generator/pipeline/serve.ts';
import { faultWords } from '../../generator/words/build-faults.ts';
import { expectCleanFailure, lines, runMainIn } from './cli-run.ts';
import { demoCopy } from './site-tree.ts';

let root: string;
let content: string;

beforeAll(async () => {
  root = await mkdtemp(path.join(tmpdir(), 'stovecard-serve-faults-'));
  content = await demoCopy(path.join(root, 'content'));
  const site = path.join(content, 'site.yaml');
  const text = await readFile(site, 'utf8');
  await writeFile(
    site,
    `${text.slice(0, text.indexOf('sets:'))}sets:\n  - id: bar\n    title: Bar\n    layout: station\n    cards:\n      - { pot: three-cup, coffee: house-blend, stove: bar-gas }\n`,
  );
});

afterAll(async () => {
  if (root) await rm(root, { recursive: true, force: true });
});

describe('the server', () => {
  let server: SiteServer;
  beforeAll(async () => {
    const options = {
      contentDir: content,
      outDir: path.join(root, 'site'),
      cacheDir: path.join(root, 'cache'),
    };
    await buildSite({ ...options, workers: 0 });
    server = await serveSite({ ...options, port: 0, log: () => {} });
  }, 120_000);
  afterAll(async () => server?.close());

  it('answers a malformed URL (/%zz, /%00) with 400 and goes on serving', async () => {
    for (const bad of ['/%zz', '/cards/%E0%A4%A', '/%00']) {
      const res = await fetch(new URL(bad, server.url));
      expect(res.status, bad).toBe(400);
    }
    expect((await fetch(server.url)).status).toBe(200);
  });

  it('serves every request whole while the site is swapped under it (three rebuilds)', async () => {
    const index = await (await fetch(server.url)).text();
    let stop = false;
    const statuses: number[] = [];
    const bodies: string[] = [];
    const hammer = async () => {
      while (!stop) {
        const res = await fetch(server.url);
        statuses.push(res.status);
        bodies.push(await res.text());
      }
    };
    const clients = Array.from({ length: 4 }, hammer);
    for (let i = 0; i < 3; i++) await server.rebuild();
    stop = true;
    await Promise.all(clients);
    expect(statuses.length).toBeGreaterThan(10);
    expect(new Set(statuses)).toEqual(new Set([200]));
    expect(new Set(bodies)).toEqual(new Set([index]));
  }, 120_000);
});

describe('build --serve on a port in use', () => {
  it('is refused before the build, naming the port and --port', async () => {
    const busy = http.createServer();
    await new Promise<void>((resolve) => busy.listen(0, '127.0.0.1', () => resolve()));
    const port = (busy.address() as { port: number }).port;
    try {
      const out = path.join(root, 'never-built');
      const started = performance.now();
      const run = await runMainIn(root, [
        'build',
        '--content',
        content,
        '--out',
        out,
        '--serve',
        '--port',
        String(port),
      ]);
      expectCleanFailure(run, 'port in use');
      expect(lines(run.stderr)).toEqual([`stovecard: ${faultWords.portInUse(port)}`]);
      expect(performance.now() - started).toBeLessThan(5_000); // no build ran (that is seconds)
      await expect(readFile(path.join(out, 'index.html'))).rejects.toThrow();
    } finally {
      await new Promise((resolve) => busy.close(resolve));
    }
  });
});

describe('file-system failures name what to change', () => {
  it('ENOTDIR: --out inside a file', async () => {
    const file = path.join(root, 'a-file');
    await writeFile(file, 'x');
    const run = await runMainIn(root, [
      'build',
      '--content',
      content,
      '--out',
      path.join(file, 'site'),
    ]);
    expectCleanFailure(run, 'ENOTDIR');
    expect(run.stderr).toContain('(ENOTDIR)');
    expect(run.stderr).toContain('is a file, not a folder');
  });

  it('ENAMETOOLONG: an --out name longer than the file system allows', async () => {
    const out = path.join(root, 'x'.repeat(300));
    const run = await runMainIn(root, ['build', '--content', content, '--out', out]);
    expectCleanFailure(run, 'ENAMETOOLONG');
    expect(run.stderr).toContain('(ENAMETOOLONG)');
    expect(run.stderr).toContain('use a shorter --out');
    expect(run.stderr.length).toBeLessThan(400); // the path is shown cut to 80 characters
  });

  // EACCES, ENOSPC and EBUSY cannot be caused here (the tests run as root, on a roomy
  // disk): the errors Node gives for them go through the command's own error edge.
  for (const [code, words] of [
    ['EACCES', 'permission denied'],
    ['ENOSPC', 'the disk is full'],
    ['EBUSY', 'in use by another program'],
  ] as const) {
    it(`${code}: one line with the path and what to do, exit 2`, () => {
      const error = Object.assign(new Error(`${code}: failed, open '/srv/site.tmp-1/x.pdf'`), {
        code,
        syscall: 'open',
        path: '/srv/site.tmp-1/x.pdf',
      });
      let stderr = '';
      const spy = vi
        .spyOn(process.stderr, 'write')
        .mockImplementation((chunk) => ((stderr += String(chunk)), true));
      let exit: number;
      try {
        exit = reportError(error);
      } finally {
        spy.mockRestore();
      }
      expect(exit).toBe(2);
      expect(stderr).toBe(`stovecard: ${faultWords.fileSystem(code, '/srv/site.tmp-1/x.pdf')}\n`);
      expect(stderr).toContain(words);
      expect(stderr).not.toContain('internal error');
    });
  }
});
