/**
 * `stovecard build`: the whole site from the content folder.
 *
 *   content/*.yaml ─ loadCatalogue ─▶ Catalogue ─ expandCards ─▶ station + insert jobs
 *     ─ planCard once per distinct pot × coffee × stove (disk cache) ─▶ CardPlan[]
 *     ─ card views (formatted, with charts and drawings) ─▶ SiteData
 *     ─ Eleventy (templates/) ─▶ <out>.tmp-<pid>/ ─ extra steps (e.g. PDFs) ─▶ swap into <out>/
 *
 * A failure anywhere leaves <out> as it was and removes the temporary folder.
 */
import { createHash } from 'node:crypto';
import path from 'node:path';
import { loadCatalogue } from '../content/index.ts';
import type { Catalogue, CardRequest } from '../content/types.ts';
import { planCard } from '../planning/plan.ts';
import type { AcceptedPlan, CardPlan } from '../planning/types.ts';
import {
  insertCardView,
  stationCardView,
  type InsertCardView,
  type StationCardView,
} from '../render/card-view.ts';
import {
  indexView,
  methodView,
  setViews,
  siteInfo,
  troubleshootingView,
  type SiteData,
} from '../render/site-view.ts';
import { stationSlug } from '../render/paths.ts';
import { cardWords } from '../words/card.ts';
import { buildDate } from './build-date.ts';
import { expandCards, type CardJobs } from './cards.ts';
import { planCodeVersion } from './code-version.ts';
import { writeSite } from './eleventy.ts';
import { PlanCache, planKey } from './plan-cache.ts';
import type { ProgressListener } from './progress.ts';
import { sensitivityMoves } from './sensitivity.ts';
import { discard, freshTempDir, swapIn } from './swap.ts';

/** One planned card: its request, the cache key and the plan. */
export interface PlannedCard {
  readonly slug: string;
  readonly request: CardRequest;
  readonly key: string;
  readonly plan: CardPlan;
  readonly fromCache: boolean;
}

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
}

export type BuildStep = (context: BuildContext) => Promise<void>;

export interface BuildOptions {
  readonly contentDir: string;
  readonly outDir: string;
  /** Default `.stovecard-cache` in the working folder. */
  readonly cacheDir?: string;
  /** Run in order on the temporary folder after the HTML is written, before the swap. */
  readonly extraSteps?: readonly BuildStep[];
  readonly onProgress?: ProgressListener;
  /** Default process.env (SOURCE_DATE_EPOCH). */
  readonly env?: NodeJS.ProcessEnv;
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
}

const noProgress: ProgressListener = () => {};

/** Plans every distinct request once, from the cache when its key is there. */
export async function planAll(
  catalogue: Catalogue,
  jobs: CardJobs,
  cache: PlanCache,
  onProgress: ProgressListener = noProgress,
): Promise<Map<string, PlannedCard>> {
  const codeVersion = await planCodeVersion();
  const site = catalogue.site;
  const planned = new Map<string, PlannedCard>();
  const total = jobs.stations.length;
  onProgress({ phase: 'plan', done: 0, total });
  for (const job of jobs.stations) {
    const pot = catalogue.pots.get(job.request.potId)!;
    const coffee = catalogue.coffees.get(job.request.coffeeId)!;
    const stove = catalogue.stoves.get(job.request.stoveId)!;
    const key = planKey({ pot, coffee, stove, site, codeVersion });
    let plan = await cache.get(key);
    const fromCache = plan !== null;
    if (plan === null) {
      plan = planCard({ pot, coffee, stove, room: site.room, kettlePresetsK: site.kettlePresetsK });
      await cache.put(key, plan);
    }
    planned.set(job.slug, { slug: job.slug, request: job.request, key, plan, fromCache });
    onProgress({ phase: 'plan', done: planned.size, total });
  }
  return planned;
}

/** First 8 hex of a key (or of the hash of several keys, for an insert). */
function fingerprint(keys: readonly string[]): string {
  const key =
    keys.length === 1 ? keys[0]! : createHash('sha256').update(keys.join('\n')).digest('hex');
  return key.slice(0, 8);
}

/** The data of every page: card views, set lists, method and troubleshooting. */
export async function siteData(
  catalogue: Catalogue,
  jobs: CardJobs,
  plans: ReadonlyMap<string, PlannedCard>,
  builtOn: string,
  onProgress: ProgressListener = noProgress,
): Promise<SiteData> {
  const total = jobs.stations.length + jobs.inserts.length;
  let done = 0;
  onProgress({ phase: 'render', done, total });
  const stations = new Map<string, StationCardView>();
  for (const job of jobs.stations) {
    const planned = plans.get(job.slug)!;
    stations.set(
      job.slug,
      await stationCardView(planned.plan, catalogue, {
        builtOn,
        fingerprint: fingerprint([planned.key]),
      }),
    );
    onProgress({ phase: 'render', done: ++done, total });
  }
  const inserts = new Map<string, InsertCardView>();
  for (const job of jobs.inserts) {
    const rows = job.rows.map((request) => {
      const planned = plans.get(stationSlug(request))!;
      return {
        potId: request.potId,
        stoveId: request.stoveId,
        plan: planned.plan,
        key: planned.key,
      };
    });
    inserts.set(
      job.slug,
      await insertCardView(
        { setId: job.setId, coffeeId: job.coffeeId, slug: job.slug, rows },
        catalogue,
        {
          builtOn,
          fingerprint: fingerprint(rows.map((row) => row.key)),
        },
      ),
    );
    onProgress({ phase: 'render', done: ++done, total });
  }

  const example = methodExample(catalogue, jobs, plans);
  return {
    site: siteInfo(catalogue, builtOn),
    nav: cardWords.nav,
    index: indexView(catalogue),
    sets: setViews(jobs.sets, stations, inserts, catalogue.site.baseUrl),
    stationCards: [...stations.values()],
    insertCards: [...inserts.values()],
    method: methodView(example, catalogue),
    troubleshooting: troubleshootingView(
      example ? sensitivityMoves(example.plan, catalogue) : null,
    ),
  };
}

/** The first station card (in set order) with a recipe and a cold start that delivered. */
function methodExample(
  catalogue: Catalogue,
  jobs: CardJobs,
  plans: ReadonlyMap<string, PlannedCard>,
) {
  const ordered = [
    ...jobs.sets.filter((s) => s.layout === 'station').flatMap((s) => s.cardSlugs),
    ...jobs.stations.map((s) => s.slug),
  ];
  for (const slug of ordered) {
    const plan = plans.get(slug)?.plan;
    if (plan && plan.refused === null && plan.coldStart.firstCoffeeS !== null) {
      return {
        plan: plan as AcceptedPlan,
        potName: catalogue.pots.get(plan.potId)!.name,
        coffeeName: catalogue.coffees.get(plan.coffeeId)!.name,
        stoveName: catalogue.stoves.get(plan.stoveId)!.name,
      };
    }
  }
  return null;
}

/** Loads, plans, renders and writes the site; <out> changes only when all of it succeeded. */
export async function buildSite(options: BuildOptions): Promise<BuildResult> {
  const started = performance.now();
  const onProgress = options.onProgress ?? noProgress;
  const outDir = path.resolve(options.outDir);
  onProgress({ phase: 'load', done: 0, total: 0 });
  const catalogue = await loadCatalogue(options.contentDir);
  const jobs = expandCards(catalogue);
  const cache = new PlanCache(path.resolve(options.cacheDir ?? '.stovecard-cache'));
  const plans = await planAll(catalogue, jobs, cache, onProgress);
  const builtOn = buildDate(options.env ?? process.env);
  const data = await siteData(catalogue, jobs, plans, builtOn, onProgress);

  const siteDir = await freshTempDir(outDir);
  try {
    onProgress({ phase: 'write', done: 0, total: 0 });
    const pages = await writeSite({ outDir: siteDir, data });
    const context: BuildContext = { siteDir, outDir, catalogue, jobs, plans, data, onProgress };
    for (const step of options.extraSteps ?? []) {
      onProgress({ phase: 'steps', done: 0, total: 0 });
      await step(context);
    }
    onProgress({ phase: 'swap', done: 0, total: 0 });
    await swapIn(siteDir, outDir);
    const all = [...plans.values()];
    return {
      outDir,
      pages,
      stationCards: data.stationCards.length,
      insertCards: data.insertCards.length,
      planned: all.filter((p) => !p.fromCache).length,
      cached: all.filter((p) => p.fromCache).length,
      refused: all.filter((p) => p.plan.refused !== null).length,
      durationMs: performance.now() - started,
      data,
    };
  } catch (error) {
    await discard(siteDir);
    throw error;
  }
}
