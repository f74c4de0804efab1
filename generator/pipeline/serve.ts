/**
 * `stovecard build --serve` (npm start): serves the built site on localhost, watches the
 * content folder and the templates, rebuilds through the same buildSite (so the plan cache
 * makes a one-coffee edit quick) and tells open pages to reload. The reload hook is a
 * one-line EventSource script added to HTML responses as they are served; the files in
 * the site folder never contain it. When a rebuild fails, the pages show an overlay with
 * the error over the last good site (sent to open pages, and added to pages loaded while the
 * error stands) until a rebuild succeeds.
 *
 * The watcher is chokidar 4's, as Eleventy's own (@11ty/chokidar-with-glob-support; Node's recursive fs.watch loses a file an editor saves by
 * writing a temporary file and renaming it over the old one); the server binds 127.0.0.1
 * unless a host is given.
 */
import { watch, type FSWatcher } from '@11ty/chokidar-with-glob-support';
import { readFile, stat } from 'node:fs/promises';
import http from 'node:http';
import path from 'node:path';
import { ContentErrors } from '../content/index.ts';
import { formatContentErrors } from '../words/content.ts';
import { buildWords } from '../words/card.ts';
import { buildSite, defaultCacheDir, type BuildResult, type BuildStep } from './build-site.ts';
import {
  forgetCodeVersions,
  pageCodeVersion,
  planCodeVersion,
  renderCodeVersion,
} from './code-version.ts';
import { WorkerPool } from './pool.ts';
import { TEMPLATES_DIR } from './eleventy.ts';

export interface ServeOptions {
  readonly contentDir: string;
  readonly outDir: string;
  readonly port: number;
  /** Address to bind, default 127.0.0.1 (this machine only). */
  readonly host?: string;
  readonly cacheDir?: string;
  /** Each rebuild's extra steps, as the first build had them (e.g. the PDFs). */
  readonly extraSteps?: readonly BuildStep[];
  readonly log: (line: string) => void;
  /** One line describing a finished build. */
  readonly describe?: (result: BuildResult) => string;
}

export interface SiteServer {
  readonly url: string;
  /** Rebuild now (as a file change would) and notify the pages. */
  rebuild(): Promise<void>;
  close(): Promise<void>;
}

const RELOAD_PATH = '/__stovecard/reload';
const OVERLAY_ID = '__stovecard-overlay';
/** The page's side: reload on `data: reload`; show the overlay on an `event: failed` (data: JSON text). */
const CLIENT_SCRIPT = `(function(){var es=new EventSource(${JSON.stringify(RELOAD_PATH)});es.onmessage=function(){location.reload()};es.addEventListener('failed',function(e){show(JSON.parse(e.data))});function show(text){var d=document.getElementById('${OVERLAY_ID}');if(!d){d=document.createElement('pre');d.id='${OVERLAY_ID}';d.setAttribute('role','alert');d.style.cssText='position:fixed;left:0;right:0;bottom:0;max-height:60vh;overflow:auto;margin:0;padding:1em 1.5em;background:#fff4f2;color:#5a0a00;border-top:4px solid #b3261e;font:14px/1.45 monospace;white-space:pre-wrap;z-index:2147483647;box-shadow:0 -4px 16px rgba(0,0,0,.25)';document.body.appendChild(d)}d.textContent=text}window.__stovecardOverlay=show;})()`;

/** What is added before </body>: the live-reload hook and, while a rebuild has failed, its overlay. */
function injected(failure: string | null): string {
  const show = failure === null ? '' : `__stovecardOverlay(${scriptJson(failure)});`;
  return `<script>${CLIENT_SCRIPT};${show}</script>`;
}

/** JSON safe inside a <script> element (no `</script>` or `<!--` can close it). */
function scriptJson(value: unknown): string {
  return JSON.stringify(value)
    .replace(/</g, '\\u003c')
    .replace(/\u2028/g, '\\u2028')
    .replace(/\u2029/g, '\\u2029');
}
const DEBOUNCE_MS = 200;

const TYPES: Record<string, string> = {
  '.html': 'text/html; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.ttf': 'font/ttf',
  '.pdf': 'application/pdf',
  '.png': 'image/png',
  '.json': 'application/json',
};

/** The URL path decoded, or null when it is not valid percent-encoding (`/%zz`). */
function decodedPath(urlPath: string): string | null {
  try {
    const clean = decodeURIComponent(urlPath.split(/[?#]/)[0] ?? '/');
    return clean.includes('\0') ? null : clean;
  } catch {
    return null;
  }
}

/**
 * The bytes of the site's file for `url`, or null. A request that lands during a swap
 * may find the file's version removed between the lookup and the read: it is looked up
 * again through `<out>`, which by then names the new version.
 */
async function siteFile(root: string, url: string): Promise<{ file: string; body: Buffer } | null> {
  const clean = decodedPath(url);
  if (clean === null) return null;
  for (let attempt = 0; attempt < 3; attempt++) {
    const file = await fileFor(root, clean);
    if (!file) return null;
    try {
      return { file, body: await readFile(file) };
    } catch {
      // Removed under us (a swap): try again.
    }
  }
  return null;
}

async function fileFor(root: string, clean: string): Promise<string | null> {
  const target = path.resolve(root, `.${clean}`);
  if (target !== root && !target.startsWith(root + path.sep)) return null;
  try {
    const info = await stat(target);
    if (info.isDirectory()) return fileFor(root, `${clean.replace(/\/?$/, '/')}index.html`);
    return target;
  } catch {
    return null;
  }
}

export async function serveSite(options: ServeOptions): Promise<SiteServer> {
  const root = path.resolve(options.outDir);
  const clients = new Set<http.ServerResponse>();
  /** The overlay's text while the last rebuild failed, else null. */
  let failure: string | null = null;
  const server = http.createServer(async (req, res) => {
    if (req.url === RELOAD_PATH) {
      res.writeHead(200, { 'content-type': 'text/event-stream', 'cache-control': 'no-cache' });
      res.write(': connected\n\n');
      clients.add(res);
      if (failure !== null) res.write(`event: failed\ndata: ${JSON.stringify(failure)}\n\n`);
      req.on('close', () => clients.delete(res));
      return;
    }
    try {
      if (decodedPath(req.url ?? '/') === null) {
        res.writeHead(400, { 'content-type': 'text/plain' }).end('bad request');
        return;
      }
      const found = await siteFile(root, req.url ?? '/');
      if (!found) {
        res.writeHead(404, { 'content-type': 'text/plain' }).end('not found');
        return;
      }
      const type = TYPES[path.extname(found.file)] ?? 'application/octet-stream';
      let body: Buffer | string = found.body;
      if (type.startsWith('text/html'))
        body = body.toString('utf8').replace('</body>', `${injected(failure)}</body>`);
      res.writeHead(200, { 'content-type': type, 'cache-control': 'no-store' }).end(body);
    } catch {
      // Whatever one request meets, the server goes on serving the others.
      if (!res.headersSent) res.writeHead(500, { 'content-type': 'text/plain' });
      res.end('server error');
    }
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port, options.host ?? '127.0.0.1', () => resolve());
  });
  const address = server.address();
  const url = `http://localhost:${typeof address === 'object' && address ? address.port : options.port}/`;
  options.log(buildWords.serving(url, options.contentDir));

  let timer: NodeJS.Timeout | null = null;
  let running: Promise<void> | null = null;
  let again = false;
  // One pool for the session, so a rebuild's few cards go to started, warm workers. The
  // workers run the code they loaded: when the sources change, a new pool is started.
  let pool: { readonly workers: WorkerPool; readonly code: string } | null = null;
  const sessionPool = async (): Promise<WorkerPool> => {
    const code = (
      await Promise.all([planCodeVersion(), renderCodeVersion(), pageCodeVersion()])
    ).join();
    if (pool?.code !== code) {
      await pool?.workers.close();
      pool = { workers: new WorkerPool(), code };
    }
    return pool.workers;
  };
  const rebuild = async (): Promise<void> => {
    if (running) {
      again = true;
      return running;
    }
    running = (async () => {
      do {
        again = false;
        forgetCodeVersions();
        try {
          const result = await buildSite({
            contentDir: options.contentDir,
            outDir: options.outDir,
            pool: await sessionPool(),
            ...(options.cacheDir ? { cacheDir: options.cacheDir } : {}),
            ...(options.extraSteps ? { extraSteps: options.extraSteps } : {}),
          });
          options.log(
            buildWords.rebuilt(
              options.describe ? options.describe(result) : `${result.pages} pages`,
            ),
          );
          failure = null;
          for (const client of clients) client.write('data: reload\n\n');
        } catch (error) {
          const message =
            error instanceof ContentErrors
              ? formatContentErrors(error)
              : error instanceof Error
                ? error.message
                : String(error);
          options.log(buildWords.rebuildFailed(message));
          failure = `${buildWords.overlayHeading}\n\n${message}`;
          const event = `event: failed\ndata: ${JSON.stringify(failure)}\n\n`;
          for (const client of clients) client.write(event);
        }
      } while (again);
    })();
    try {
      await running;
    } finally {
      running = null;
    }
  };
  const schedule = () => {
    if (timer) clearTimeout(timer);
    timer = setTimeout(() => void rebuild(), DEBOUNCE_MS);
  };
  // Every add, change, unlink (an atomic save is an unlink and an add of the same path, or a
  // rename over it; chokidar reports the path either way). The site and cache folders are
  // not under the watched ones unless a user put them there: ignore them then.
  const ignoredRoots = [
    root,
    path.resolve(options.cacheDir ?? defaultCacheDir(options.contentDir)),
  ];
  const watcher: FSWatcher = watch([options.contentDir, TEMPLATES_DIR], {
    ignoreInitial: true,
    ignored: (file: string) =>
      ignoredRoots.some((r) => file === r || file.startsWith(r + path.sep)),
  });
  watcher.on('all', schedule);
  await new Promise<void>((resolve) => watcher.once('ready', () => resolve()));

  return {
    url,
    rebuild,
    async close() {
      if (timer) clearTimeout(timer);
      await watcher.close();
      for (const client of clients) client.end();
      await running?.catch(() => {});
      await pool?.workers.close();
      await new Promise<void>((resolve) => server.close(() => resolve()));
    },
  };
}

/**
 * Throws an error with code EADDRINUSE (or EACCES) when `port` cannot be listened on at
 * 127.0.0.1, so `build --serve` can say so before the build rather than after it.
 */
export async function checkPort(port: number): Promise<void> {
  const probe = http.createServer();
  await new Promise<void>((resolve, reject) => {
    probe.once('error', reject);
    probe.listen(port, '127.0.0.1', () => resolve());
  });
  await new Promise<void>((resolve) => probe.close(() => resolve()));
}
