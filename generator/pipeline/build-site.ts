/**
 * `stovecard build`: the whole site from the content folder.
 *
 *   content/*.yaml ─ loadCatalogue ─▶ Catalogue ─ expandCards ─▶ station + insert jobs
 *     ─ planCard once per distinct pot × coffee × stove  (plan-all.ts; <cache>/plans)
 *     ─ card views: words, charts, drawings, QR codes    (site-data.ts; <cache>/views) ─▶ SiteData
 *     ─ Eleventy (templates/), unchanged card pages copied (pages.ts; <cache>/pages)
 *         ─▶ <out>.tmp-<pid>/ ─ extra steps (the PDFs: pdf-step.ts; <cache>/pdfs) ─▶ swap into <out>/
 *
 * Every cache is keyed by a hash of what made its items and of the code that makes them
 * (plan-cache.ts, render-cache.ts, code-version.ts), so a rebuild after one edit plans and
 * renders only the cards the edit reaches. Plans, views and PDFs that must be made are
 * made on a pool of worker threads (pool.ts), with the same results as in one thread.
 *
 * A failure anywhere leaves <out> as it was and removes the temporary folder.
 */
import { mkdir, writeFile } from 'node:fs/promises';
import { availableParallelism } from 'node:os';
import path from 'node:path';
import { loadCatalogue } from '../content/index.ts';
import type { Catalogue } from '../content/types.ts';
import type { SiteData } from '../render/site-view.ts';
import {
  insertPaths,
  pathLanguage,
  plannerPaths,
  plannerSlug,
  stationPaths,
} from '../render/paths.ts';
import { PLANNER_SCRIPT, plannerScript } from './browser-bundle.ts';
import { checkQrDensity } from '../render/qr-density.ts';
import { buildDate } from './build-date.ts';
import { expandCards, type CardJobs } from './cards.ts';
import { leaveOutRefused } from './leave-out.ts';
import { writePages } from './pages.ts';
import { planAll, type PlannedCard } from './plan-all.ts';
import { damagedCounts, sweepCacheFolders } from './file-cache.ts';
import { PlanCache } from './plan-cache.ts';
import { WorkerPool } from './pool.ts';
import type { ProgressListener } from './progress.ts';
import { RenderCache } from './render-cache.ts';
import { renderSite, type ViewText } from './site-data.ts';
import { emptyStats, timedPhase, type BuildStats } from './stats.ts';
import {
  checkReplaceable,
  discard,
  freshTempDir,
  recoverLeftovers,
  resolveOut,
  swapIn,
  type SwapReport,
} from './swap.ts';

export { planAll, type PlannedCard, type PlanOptions } from './plan-all.ts';
export { siteData, renderSite, type RenderOptions, type ViewText } from './site-data.ts';

/** What an extra step sees: the temporary site folder before the swap, and all the data. */
export interface BuildContext {
  /** The temporary folder that becomes <out> after the steps; write into it. */
  readonly siteDir: string;
  readonly outDir: string;
  readonly catalogue: Catalogue;
  readonly jobs: CardJobs;
  /** By station slug. */
  readonly plans: ReadonlyMap<string, PlannedCard>;
  readonly data: SiteData;
  readonly onProgress: ProgressListener;
  /** The build's cache folder (plans, views, pages, PDFs: render-cache.ts). */
  readonly cacheDir: string;
  /** The build's workers, or null when the build runs in one thread. */
  readonly pool: WorkerPool | null;
  /** By each card's PDF file, its view's cache text and hash (a key for what is drawn from it). */
  readonly viewTexts: ReadonlyMap<string, ViewText>;
  /** The build's environment (SOURCE_DATE_EPOCH). */
  readonly env: NodeJS.ProcessEnv;
  readonly stats: BuildStats;
}

export type BuildStep = (context: BuildContext) => Promise<void>;

export interface BuildOptions {
  readonly contentDir: string;
  readonly outDir: string;
  /** Default `.stovecard-cache` beside the content folder (defaultCacheDir). */
  readonly cacheDir?: string;
  /** Run in order on the temporary folder after the HTML is written, before the swap. */
  readonly extraSteps?: readonly BuildStep[];
  readonly onProgress?: ProgressListener;
  /** Default process.env (SOURCE_DATE_EPOCH). */
  readonly env?: NodeJS.ProcessEnv;
  /**
   * Worker threads for plans, views and PDFs, started when there is work for them;
   * default os.availableParallelism(); 0 runs everything in this thread.
   */
  readonly workers?: number;
  /**
   * Workers the caller keeps between builds (the `--serve` loop: a rebuild then finds them
   * started and warm); used instead of `workers`, and neither started nor closed here.
   */
  readonly pool?: WorkerPool;
}

export interface BuildResult {
  readonly outDir: string;
  /** HTML pages written. */
  readonly pages: number;
  readonly stationCards: number;
  readonly insertCards: number;
  /** Plans computed in this build (cache misses) and taken from the cache. */
  readonly planned: number;
  readonly cached: number;
  readonly refused: number;
  readonly durationMs: number;
  readonly data: SiteData;
  readonly stats: BuildStats;
  /** What the swap did (the folder now in place, the previous one if it could not go). */
  readonly swap: SwapReport;
  /** Names of what killed builds had left beside <out>, removed by this one. */
  readonly sweptLeftovers: readonly string[];
  /** Content files passed over (editor lock and backup files, dotfiles). */
  readonly skippedFiles: readonly string[];
  /** Cached files that failed their hash check and were made again, by cache folder. */
  readonly damagedCache: Readonly<Record<string, number>>;
}

const noProgress: ProgressListener = () => {};

/**
 * `.stovecard-cache` beside the content folder (content/ → ./.stovecard-cache), so a build
 * started from any working folder finds the same cache, and none is left where it ran.
 */
export function defaultCacheDir(contentDir: string): string {
  return path.join(path.dirname(path.resolve(contentDir)), '.stovecard-cache');
}

/** Loads, plans, renders and writes the site; <out> changes only when all of it succeeded. */
export async function buildSite(options: BuildOptions): Promise<BuildResult> {
  const started = performance.now();
  const onProgress = options.onProgress ?? noProgress;
  const outDir = path.resolve(options.outDir);
  const cacheDir = path.resolve(options.cacheDir ?? defaultCacheDir(options.contentDir));
  const env = options.env ?? process.env;
  const stats = emptyStats();
  const workers = options.workers ?? availableParallelism();
  const ownPool = options.pool === undefined && workers > 0;
  const pool = options.pool ?? (ownPool ? new WorkerPool({ size: workers }) : null);
  try {
    // Before any work: a folder that is not ours is refused now, not after the build.
    const out = await resolveOut(outDir);
    const sweptLeftovers = await recoverLeftovers(out);
    await checkReplaceable(out);
    damagedCounts(cacheDir); // counted from here: this build's damaged files
    onProgress({ phase: 'load', done: 0, total: 0 });
    const { catalogue, jobs: allJobs } = await timedPhase(stats, 'load', async () => {
      const catalogue = await loadCatalogue(options.contentDir);
      const jobs = expandCards(catalogue);
      const baseUrl = catalogue.site.baseUrl;
      if (baseUrl)
        checkQrDensity([
          ...jobs.stations.map(
            (job) =>
              stationPaths(
                job.request,
                baseUrl,
                pathLanguage(job.language, catalogue.site.language),
              ).webUrl!,
          ),
          ...jobs.inserts.map((job) => insertPaths(job.slug, baseUrl).webUrl!),
          // An insert's code opens its coffee's page for customers (the longest, other languages).
          ...jobs.inserts.map(
            (job) =>
              plannerPaths(
                plannerSlug(job.coffeeId, job.language, catalogue.site.language),
                baseUrl,
              ).webUrl!,
          ),
        ]);
      return { catalogue, jobs };
    });
    const plans = await timedPhase(stats, 'plan', () =>
      planAll(catalogue, allJobs, new PlanCache(cacheDir), onProgress, { pool, stats }),
    );
    const jobs = leaveOutRefused(allJobs, plans);
    const builtOn = buildDate(env);
    const renderCache = new RenderCache(cacheDir);
    const { data, viewTexts } = await timedPhase(stats, 'render', () =>
      renderSite(catalogue, jobs, plans, builtOn, onProgress, { pool, renderCache, stats }),
    );

    const siteDir = await freshTempDir(out);
    let swap: SwapReport;
    try {
      onProgress({ phase: 'write', done: 0, total: 0 });
      await timedPhase(stats, 'write', () =>
        writePages({ siteDir, data, viewTexts, cache: renderCache, stats }),
      );
      stats.pages.ms += stats.wallMs.write ?? 0;
      const context: BuildContext = {
        siteDir,
        outDir,
        catalogue,
        jobs,
        plans,
        data,
        onProgress,
        cacheDir,
        pool,
        viewTexts,
        env,
        stats,
      };
      if (data.plannerPages.length > 0) {
        // The customer's pages' script (generator/browser/), bundled once per process.
        const script = path.join(siteDir, PLANNER_SCRIPT);
        await mkdir(path.dirname(script), { recursive: true });
        await writeFile(script, await plannerScript(cacheDir));
      }
      const logo = data.site.brand?.logo;
      if (logo) {
        // The roaster's logo, for the site's pages (the cards carry their own copy inline).
        const file = path.join(siteDir, logo.file);
        await mkdir(path.dirname(file), { recursive: true });
        await writeFile(file, Buffer.from(logo.data, logo.format === 'png' ? 'base64' : 'utf8'));
      }
      for (const step of options.extraSteps ?? []) {
        onProgress({ phase: 'steps', done: 0, total: 0 });
        await timedPhase(stats, 'steps', () => step(context));
      }
      onProgress({ phase: 'swap', done: 0, total: 0 });
      swap = await timedPhase(stats, 'swap', () => swapIn(siteDir, out));
    } catch (error) {
      await discard(siteDir);
      throw error;
    }
    // The site is in place: what this build did not use and is old leaves the cache. A
    // sweep that fails costs only disk space, never the build.
    const swept = await sweepCacheFolders(
      ['plans', 'views', 'pages', 'pdfs'].map((folder) => path.join(cacheDir, folder)),
    ).catch(() => ({ deleted: 0 }));
    stats.cacheFilesDeleted = swept.deleted;
    const all = [...plans.values()];
    stats.workers = pool?.spawned ?? 0;
    return {
      outDir,
      pages: stats.pages.made + stats.pages.reused,
      stationCards: data.stationCards.length,
      insertCards: data.insertCards.length,
      planned: all.filter((p) => !p.fromCache).length,
      cached: all.filter((p) => p.fromCache).length,
      // From the views, so a rebuild need not read the plans it did not draw.
      refused: data.stationCards.filter((card) => card.refusal !== null).length,
      durationMs: performance.now() - started,
      data,
      stats,
      swap,
      sweptLeftovers,
      skippedFiles: catalogue.skipped ?? [],
      damagedCache: damagedCounts(cacheDir),
    };
  } finally {
    if (ownPool) await pool?.close();
  }
}
