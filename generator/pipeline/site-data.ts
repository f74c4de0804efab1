/**
 * The render phase: every page's data from the plans. Station card views (the costly part:
 * a vega chart, a cross-section, a QR code) come from the view cache when their key is
 * there, else are rendered, in the worker pool when there is one; insert views are
 * composed here from their rows' plans, also through the cache. Then the set lists, the
 * method page's worked example and the troubleshooting page's moves.
 *
 * Each view is made from exactly what its cache key covers: the card's plan and entries
 * and the site's print settings (`cardCatalogue`), never the rest of the catalogue.
 */
import { createHash } from 'node:crypto';
import type { Catalogue, CardRequest } from '../content/types.ts';
import type { AcceptedPlan } from '../planning/types.ts';
import {
  cautions,
  insertCardView,
  pageSetup,
  stationCardView,
  type CardViewOptions,
  type InsertCardView,
  type StationCardView,
} from '../render/card-view.ts';
import { stationSlug } from '../render/paths.ts';
import { plannerPageView, type PlannerPageView } from '../render/planner-view.ts';
import {
  indexView,
  methodView,
  setViews,
  siteInfo,
  siteNav,
  siteVoice,
  troubleshootingView,
  type SiteData,
} from '../render/site-view.ts';
import { movesView } from '../render/moves.ts';
import { voiceFor } from '../render/voice.ts';
import { sensitivityMoves } from '../planning/sensitivity.ts';
import type { CardJobs, InsertCardJob, StationCardJob } from './cards.ts';
import { renderCodeVersion } from './code-version.ts';
import { IO_LIMIT, mapConcurrent } from './concurrent.ts';
import { planTextOf, type PlannedCard } from './plan-all.ts';
import { stableJson, toTaggedJson } from './plan-cache.ts';
import type { WorkerPool } from './pool.ts';
import type { ProgressListener } from './progress.ts';
import {
  RenderCache,
  sha256,
  stationViewKey,
  viewFromText,
  viewSite,
  type CachedView,
} from './render-cache.ts';
import { emptyStats, type BuildStats } from './stats.ts';

export interface RenderOptions {
  readonly pool?: WorkerPool | null;
  /** Views are taken from and written to it; without, every view is rendered. */
  readonly renderCache?: RenderCache | null;
  readonly stats?: BuildStats;
}

/** The site's data and, by each card's PDF file, its view's cache text and hash. */
export interface RenderedSite {
  readonly data: SiteData;
  readonly viewTexts: ReadonlyMap<string, ViewText>;
}

/** A view's cache text (toTaggedJson) and its sha256 (render-cache.ts). */
export interface ViewText {
  readonly text: string;
  readonly hash: string;
}

/** First 8 hex of a key (or of the hash of several keys, for an insert). */
function fingerprint(keys: readonly string[]): string {
  const key =
    keys.length === 1 ? keys[0]! : createHash('sha256').update(keys.join('\n')).digest('hex');
  return key.slice(0, 8);
}

/**
 * What one card's view may read: the site (without its sets) and the entries of its
 * requests (and of `coffeeIds`, for an insert's own coffee).
 */
export function cardCatalogue(
  catalogue: Catalogue,
  requests: readonly CardRequest[],
  coffeeIds: readonly string[] = [],
): Catalogue {
  const pick = <T>(map: ReadonlyMap<string, T>, ids: readonly string[]) => {
    const picked = new Map<string, T>();
    for (const id of ids) {
      const entry = map.get(id);
      if (entry) picked.set(id, entry);
    }
    return picked;
  };
  return {
    contentDir: catalogue.contentDir,
    site: { ...catalogue.site, sets: [] },
    pots: pick(
      catalogue.pots,
      requests.map((r) => r.potId),
    ),
    coffees: pick(catalogue.coffees, [...requests.map((r) => r.coffeeId), ...coffeeIds]),
    stoves: pick(
      catalogue.stoves,
      requests.map((r) => r.stoveId),
    ),
    logs: new Map(),
  };
}

async function stationView(
  job: StationCardJob,
  planned: PlannedCard,
  catalogue: Catalogue,
  builtOn: string,
  options: RenderOptions,
  renderVersion: string,
): Promise<CachedView<StationCardView>> {
  const stats = options.stats ?? emptyStats();
  const cache = options.renderCache ?? null;
  const key = stationViewKey({
    planKey: planned.key,
    renderVersion,
    builtOn,
    site: viewSite(catalogue.site),
    language: job.language,
  });
  const hit = cache ? await cache.view<StationCardView>(key) : null;
  if (hit) {
    stats.views.reused += 1;
    return hit;
  }
  const viewOptions: CardViewOptions = {
    builtOn,
    fingerprint: fingerprint([planned.key]),
    language: job.language,
  };
  const own = cardCatalogue(catalogue, [job.request]);
  let text: string;
  if (options.pool) {
    const pool = options.pool;
    const { result, ms } = await pool
      .run({
        kind: 'station-view',
        planJson: await planTextOf(planned),
        catalogue: own,
        options: viewOptions,
      })
      .catch((error: unknown) => {
        pool.clearQueue(); // the build fails: render nothing more
        throw error;
      });
    text = result.json;
    stats.views.ms += ms;
  } else {
    const started = performance.now();
    text = toTaggedJson(await stationCardView(planned.plan, own, viewOptions));
    stats.views.ms += performance.now() - started;
  }
  stats.views.made += 1;
  await cache?.views.put(key, text);
  return viewFromText<StationCardView>(text);
}

async function insertView(
  job: InsertCardJob,
  plans: ReadonlyMap<string, PlannedCard>,
  catalogue: Catalogue,
  builtOn: string,
  options: RenderOptions,
  renderVersion: string,
): Promise<CachedView<InsertCardView>> {
  const rows = job.rows.map((request) => ({ request, planned: plans.get(stationSlug(request))! }));
  const coffee = catalogue.coffees.get(job.coffeeId);
  const key = sha256(
    stableJson({
      kind: 'insert-view',
      job: { setId: job.setId, coffeeId: job.coffeeId, slug: job.slug, language: job.language },
      coffee: coffee ? { ...coffee, source: null } : null,
      rows: rows.map((row) => row.planned.key),
      code: renderVersion,
      builtOn,
      site: viewSite(catalogue.site),
    }),
  );
  const cache = options.renderCache ?? null;
  const hit = cache ? await cache.view<InsertCardView>(key) : null;
  if (hit) return hit;
  const view = await insertCardView(
    {
      setId: job.setId,
      coffeeId: job.coffeeId,
      slug: job.slug,
      rows: rows.map(({ request, planned }) => ({
        potId: request.potId,
        stoveId: request.stoveId,
        plan: planned.plan,
      })),
    },
    cardCatalogue(catalogue, job.rows, [job.coffeeId]),
    {
      builtOn,
      fingerprint: fingerprint(rows.map((row) => row.planned.key)),
      language: job.language,
    },
  );
  const text = toTaggedJson(view);
  await cache?.views.put(key, text);
  return viewFromText<InsertCardView>(text);
}

/** Every page's data, and the hash of each card's view. */
export async function renderSite(
  catalogue: Catalogue,
  jobs: CardJobs,
  plans: ReadonlyMap<string, PlannedCard>,
  builtOn: string,
  onProgress: ProgressListener = () => {},
  options: RenderOptions = {},
): Promise<RenderedSite> {
  const renderVersion = await renderCodeVersion();
  const total = jobs.stations.length + jobs.inserts.length;
  let done = 0;
  onProgress({ phase: 'render', done, total });
  const progressed = <T>(value: T): T => {
    onProgress({ phase: 'render', done: ++done, total });
    return value;
  };
  const stationViews = await mapConcurrent(jobs.stations, IO_LIMIT * 8, async (job) =>
    progressed(
      await stationView(job, plans.get(job.slug)!, catalogue, builtOn, options, renderVersion),
    ),
  );
  const insertViews = await mapConcurrent(jobs.inserts, IO_LIMIT, async (job) =>
    progressed(await insertView(job, plans, catalogue, builtOn, options, renderVersion)),
  );

  const viewTexts = new Map<string, ViewText>();
  const stations = new Map<string, StationCardView>();
  jobs.stations.forEach((job, i) => {
    const { view, hash, text } = stationViews[i]!;
    stations.set(job.key, view);
    viewTexts.set(view.paths.pdfFile, { text, hash });
  });
  const inserts = new Map<string, InsertCardView>();
  jobs.inserts.forEach((job, i) => {
    const { view, hash, text } = insertViews[i]!;
    inserts.set(job.slug, view);
    viewTexts.set(view.paths.pdfFile, { text, hash });
  });

  const example = methodExample(catalogue, jobs, plans, stations);
  const moveRows = example ? sensitivityMoves(example.plan, catalogue) : null;
  const languages = [...new Set([catalogue.site.language, ...jobs.sets.map((s) => s.language)])];
  const frontMatter = Object.fromEntries(
    languages.map((language) => {
      const voice = voiceFor(language, catalogue.site.units);
      return [
        language,
        {
          method: methodView(example, catalogue, voice),
          troubleshooting: troubleshootingView(
            example && moveRows
              ? movesView(moveRows, exampleNames(example.plan, catalogue), voice, {
                  potId: example.plan.potId,
                  coffeeId: example.plan.coffeeId,
                  stoveId: example.plan.stoveId,
                })
              : null,
            voice,
          ),
        },
      ];
    }),
  );
  const site = frontMatter[catalogue.site.language]!;
  const data: SiteData = {
    site: siteInfo(catalogue, builtOn),
    nav: siteNav(siteVoice(catalogue)),
    index: indexView(catalogue),
    sets: setViews(
      jobs.sets,
      stations,
      inserts,
      catalogue.site.baseUrl,
      pageSetup(catalogue.site.units, catalogue.site.paper),
      (language) => frontMatter[language]?.troubleshooting.moves ?? null,
    ),
    stationCards: [...stations.values()],
    insertCards: [...inserts.values()],
    method: site.method,
    troubleshooting: site.troubleshooting,
    cautions: cautions('full', siteVoice(catalogue)),
    frontMatter,
    plannerPages: plannerPages(stations, inserts, catalogue, builtOn),
  };
  return { data, viewTexts };
}

/**
 * The customer's page of every coffee a card links (its `planner`), one per page address:
 * the views name the page, so no card links a page that is not built.
 */
function plannerPages(
  stations: ReadonlyMap<string, StationCardView>,
  inserts: ReadonlyMap<string, InsertCardView>,
  catalogue: Catalogue,
  builtOn: string,
): PlannerPageView[] {
  const pages = new Map<string, PlannerPageView>();
  for (const card of [...stations.values(), ...inserts.values()]) {
    const url = card.planner.pageUrl;
    if (pages.has(url)) continue;
    const slug = url.slice('brew/'.length, -1);
    pages.set(url, plannerPageView(card.coffeeId, slug, card.planner.language, catalogue, builtOn));
  }
  return [...pages.values()];
}

/** The names the troubleshooting table of the method page's example card says. */
function exampleNames(plan: AcceptedPlan, catalogue: Catalogue) {
  return {
    pot: catalogue.pots.get(plan.potId)!.name,
    coffee: catalogue.coffees.get(plan.coffeeId)!.name,
    stove: catalogue.stoves.get(plan.stoveId)!.name,
  };
}

/** The data of every page: card views, set lists, method and troubleshooting. */
export async function siteData(
  catalogue: Catalogue,
  jobs: CardJobs,
  plans: ReadonlyMap<string, PlannedCard>,
  builtOn: string,
  onProgress: ProgressListener = () => {},
  options: RenderOptions = {},
): Promise<SiteData> {
  return (await renderSite(catalogue, jobs, plans, builtOn, onProgress, options)).data;
}

/**
 * The first station card (in set order) with a recipe and a cold start that delivered.
 * Its view says whether it has a recipe, so only the chosen card's plan is read.
 */
function methodExample(
  catalogue: Catalogue,
  jobs: CardJobs,
  plans: ReadonlyMap<string, PlannedCard>,
  stations: ReadonlyMap<string, StationCardView>,
) {
  const ordered = [
    ...jobs.sets.filter((s) => s.layout === 'station').flatMap((s) => s.cardSlugs),
    ...jobs.stations.map((s) => s.key),
  ];
  const slugOf = new Map(jobs.stations.map((s) => [s.key, s.slug]));
  for (const key of ordered) {
    if (stations.get(key)?.recipe === null) continue;
    const plan = plans.get(slugOf.get(key) ?? key)?.plan;
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
