/**
 * The customer's page script: generator/browser/planner.ts and what it imports (the
 * engine, the content checks, the card code) bundled by esbuild into one minified file,
 * assets/planner.js. A few modules have a browser twin, swapped in here; the rest is the
 * build's own code:
 *
 *   render/fonts.ts          → browser/fonts.browser.ts          (no file paths)
 *   render/text-measure.ts   → browser/text-measure.browser.ts   (canvas, not pdfkit)
 *   render/chart.ts          → browser/chart.browser.ts          (same spec, drawn without vega)
 *   content/schema-files.ts  → content/schema-files.browser.ts   (schemas inlined)
 *   vega, render/chart-runtime.ts → nothing (only chart.ts's vega drawing used them)
 *
 * Made once per process (the sources do not change under a running build) and cached on
 * disk by the hash of its sources, so a rebuild costs a file copy.
 */
import { createHash } from 'node:crypto';
import { mkdir, readdir, readFile, rename, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { PROJECT_ROOT } from '../project-root.ts';
import { renderCodeVersion } from './code-version.ts';

/** Site-relative file of the bundle. */
export const PLANNER_SCRIPT = 'assets/planner.js';

const generator = path.join(PROJECT_ROOT, 'generator');
const ENTRY = path.join(generator, 'browser', 'planner.ts');

/** Absolute module file → its browser twin (null: an empty module). */
const TWINS = new Map<string, string | null>([
  [path.join(generator, 'render', 'fonts.ts'), path.join(generator, 'browser', 'fonts.browser.ts')],
  [
    path.join(generator, 'render', 'text-measure.ts'),
    path.join(generator, 'browser', 'text-measure.browser.ts'),
  ],
  [path.join(generator, 'render', 'chart.ts'), path.join(generator, 'browser', 'chart.browser.ts')],
  [
    path.join(generator, 'content', 'schema-files.ts'),
    path.join(generator, 'content', 'schema-files.browser.ts'),
  ],
  [path.join(generator, 'render', 'chart-runtime.ts'), null],
]);
const EMPTY_PACKAGES = new Set(['vega', 'vega-lite', 'pdfkit']);

let made: Promise<Uint8Array> | null = null;

/** The bundle's bytes (made or read from the cache once per process). */
export function plannerScript(cacheDir: string): Promise<Uint8Array> {
  made ??= cachedBundle(cacheDir).catch((error: unknown) => {
    made = null;
    throw error;
  });
  return made;
}

async function cachedBundle(cacheDir: string): Promise<Uint8Array> {
  // The render code version covers render/, words/, units.ts and the package lock; the
  // engine, content and browser folders are added here.
  const key = createHash('sha256')
    .update(await renderCodeVersion())
    .update(await folderHash(['browser', 'content', 'planning', 'brew', 'physics', 'numerics']))
    .digest('hex')
    .slice(0, 32);
  const file = path.join(cacheDir, 'bundles', `planner-${key}.js`);
  try {
    return await readFile(file);
  } catch {
    const bytes = await bundle();
    await mkdir(path.dirname(file), { recursive: true });
    const temp = `${file}.${process.pid}.tmp`;
    await writeFile(temp, bytes);
    await rename(temp, file);
    return bytes;
  }
}

async function folderHash(folders: readonly string[]): Promise<string> {
  const hash = createHash('sha256');
  const visit = async (dir: string): Promise<void> => {
    const entries = (await readdir(dir, { withFileTypes: true })).sort((a, b) =>
      a.name < b.name ? -1 : 1,
    );
    for (const entry of entries) {
      const full = path.join(dir, entry.name);
      if (entry.isDirectory()) await visit(full);
      else if (/\.(ts|json)$/.test(entry.name)) {
        hash
          .update(path.relative(generator, full))
          .update('\0')
          .update(await readFile(full));
      }
    }
  };
  for (const folder of folders) await visit(path.join(generator, folder));
  return hash.digest('hex');
}

/** Runs esbuild (loaded only here: a build without the page never pays for it). */
export async function bundle(options: { minify?: boolean } = {}): Promise<Uint8Array> {
  const esbuild = await import('esbuild');
  const result = await esbuild.build({
    entryPoints: [ENTRY],
    bundle: true,
    write: false,
    // A classic script, not a module: Chromium refuses module scripts on pages opened from disk.
    format: 'iife',
    platform: 'browser',
    target: ['es2020'],
    minify: options.minify ?? true,
    legalComments: 'eof',
    logLevel: 'silent',
    plugins: [
      {
        name: 'stovecard-browser-twins',
        setup(build) {
          build.onResolve({ filter: /.*/ }, (args) => {
            if (EMPTY_PACKAGES.has(args.path)) return { path: args.path, namespace: 'empty' };
            if (!args.path.startsWith('.')) return undefined;
            const target = path.resolve(args.resolveDir, args.path);
            if (!TWINS.has(target)) return undefined;
            const twin = TWINS.get(target)!;
            // A twin importing its original (chart.browser.ts re-exports the spec) gets it.
            if (twin !== null && args.importer === twin) return undefined;
            return twin === null ? { path: target, namespace: 'empty' } : { path: twin };
          });
          build.onLoad({ filter: /.*/, namespace: 'empty' }, () => ({
            // CommonJS, so the originals' named imports bind (to undefined; never called).
            contents: 'module.exports = {};',
            loader: 'js',
          }));
        },
      },
    ],
  });
  return result.outputFiles[0]!.contents;
}
