/**
 * Code versions the caches are keyed by: sha256 over the source files whose code decides
 * what a cached item contains, so any edit there invalidates exactly those items.
 *
 *   plan     the simulation, physics, numerics and the planner; a plan holds codes and SI
 *            facts, no words, so wording, loader, renderer or template edits keep every
 *            plan (tests/pipeline/code-version.test.ts holds generator/words out of it)
 *   render   the renderers (views, charts, drawings, PDFs), every word they print, the
 *            build code that hands them their input, and the installed packages
 *            (package-lock.json: vega, qrcode, pdfkit, the fonts)
 *   page     the templates and the Eleventy wiring, and the installed packages
 *
 * A view or PDF is keyed by its plan's key as well, so it also follows the plan code.
 */
import { createHash } from 'node:crypto';
import { readdir, readFile } from 'node:fs/promises';
import path from 'node:path';
import { PROJECT_ROOT } from '../project-root.ts';

const projectDir = PROJECT_ROOT;

/** Folders and files under generator/ whose source makes up the plan's code version. */
export const PLAN_SOURCES: readonly string[] = [
  'generator/brew',
  'generator/physics',
  'generator/numerics',
  'generator/planning',
  'generator/pipeline/plan-all.ts', // what of the catalogue a plan request carries
];

/** … of the render code version (views, charts, drawings, PDFs). */
export const RENDER_SOURCES: readonly string[] = [
  'generator/render',
  'generator/words',
  'generator/units.ts', // the conversions the views print through
  'generator/content/colour.ts', // the brand colour's contrast rule (render/brand.ts)
  'generator/content/heat-kind.ts', // how an insert groups its stoves
  'generator/content/schemas/log.schema.json', // the binder's brew-log sheet columns
  'generator/content/own-entries.ts', // the customer's page's form fields
  'generator/pipeline/site-data.ts', // what a view is given (its catalogue, its fingerprint)
  'generator/pipeline/render-cache.ts',
  'generator/pipeline/pdf-step.ts', // what a set's PDF is given
  'package-lock.json',
];

/** … of the page code version (what Eleventy makes of a view). */
export const PAGE_SOURCES: readonly string[] = [
  'templates',
  '.eleventy.js',
  'generator/render/eleventy-setup.ts',
  'generator/render/card-html.ts', // the card markup the templates call as filters
  'generator/pipeline/eleventy.ts',
  'generator/pipeline/pages.ts',
  'package-lock.json',
];

const SOURCE_FILE = /\.(ts|mjs|js|json|njk|css)$/;

async function sourceFiles(relative: string): Promise<string[]> {
  const full = path.join(projectDir, relative);
  let entries;
  try {
    entries = await readdir(full, { withFileTypes: true });
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    if (code === 'ENOTDIR') return [relative];
    if (code === 'ENOENT') return [];
    throw error;
  }
  const files: string[] = [];
  for (const entry of entries) {
    const child = `${relative}/${entry.name}`;
    if (entry.isDirectory()) files.push(...(await sourceFiles(child)));
    else if (entry.isFile() && SOURCE_FILE.test(entry.name)) files.push(child);
  }
  return files;
}

async function versionOf(sources: readonly string[]): Promise<string> {
  const files = (await Promise.all(sources.map(sourceFiles))).flat().sort();
  const hash = createHash('sha256');
  for (const file of files) {
    hash.update(`${file}\0`);
    hash.update(await readFile(path.join(projectDir, file)));
    hash.update('\0');
  }
  return hash.digest('hex');
}

const memo = new Map<readonly string[], Promise<string>>();

function memoised(sources: readonly string[]): Promise<string> {
  let version = memo.get(sources);
  if (!version) {
    version = versionOf(sources);
    memo.set(sources, version);
  }
  return version;
}

/** Hex sha256 of the plan sources (names and bytes, sorted by name); computed once per process. */
export function planCodeVersion(): Promise<string> {
  return memoised(PLAN_SOURCES);
}

export function renderCodeVersion(): Promise<string> {
  return memoised(RENDER_SOURCES);
}

export function pageCodeVersion(): Promise<string> {
  return memoised(PAGE_SOURCES);
}

/** For tests and long-running servers that edit the sources: forget the memoised versions. */
export function forgetCodeVersions(): void {
  memo.clear();
}
