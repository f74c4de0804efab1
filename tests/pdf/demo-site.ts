/**
 * The demo content planned and turned into views by the site build's own functions
 * (planAll, siteData), for the PDF tests; planned once per test file in beforeAll.
 */
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { planAll, siteData, type PlannedCard } from '../../generator/pipeline/build-site.ts';
import { expandCards, type CardJobs } from '../../generator/pipeline/cards.ts';
import { PlanCache } from '../../generator/pipeline/plan-cache.ts';
import { loadCatalogue } from '../../generator/content/index.ts';
import type { Catalogue } from '../../generator/content/types.ts';
import { setPdf, type SetPdf } from '../../generator/render/pdf/binder.ts';
import { isBinderSet, setCards } from '../../generator/render/pdf/site-pdfs.ts';
import type { SetView, SiteData } from '../../generator/render/site-view.ts';

export const BUILT_ON = '2024-05-01';
/** The PDFs' environment: no SOURCE_DATE_EPOCH, so the dates come from the views. */
export const NO_EPOCH: NodeJS.ProcessEnv = {};

export interface DemoSite {
  readonly catalogue: Catalogue;
  readonly jobs: CardJobs;
  readonly plans: ReadonlyMap<string, PlannedCard>;
  readonly data: SiteData;
  readonly cacheDir: string;
  /** Removes the plan cache when this call made it. */
  dispose(): Promise<void>;
}

/** Plans into a fresh cache folder, or into `cacheDir` (a rebuild, as the site build does). */
export async function demoSite(cacheDir?: string): Promise<DemoSite> {
  const own = cacheDir === undefined;
  const dir = cacheDir ?? (await mkdtemp(path.join(tmpdir(), 'stovecard-pdf-cache-')));
  const catalogue = await loadCatalogue('content');
  const jobs = expandCards(catalogue);
  const plans = await planAll(catalogue, jobs, new PlanCache(dir));
  const data = await siteData(catalogue, jobs, plans, BUILT_ON);
  return {
    catalogue,
    jobs,
    plans,
    data,
    cacheDir: dir,
    dispose: async () => (own ? rm(dir, { recursive: true, force: true }) : undefined),
  };
}

/** A demo set's PDF as the site build makes it, from its cards' own PDF bytes (in order). */
export function demoSetPdf(
  demo: DemoSite,
  set: SetView,
  cardPdfs: readonly Uint8Array[],
  author: string,
): Promise<SetPdf> {
  return setPdf({
    set,
    cards: setCards(set, demo.data),
    cardPdfs,
    frontMatter: isBinderSet(set)
      ? { method: demo.data.method, troubleshooting: demo.data.troubleshooting }
      : null,
    page: demo.data.site.page,
    author,
    builtOn: BUILT_ON,
    env: NO_EPOCH,
    brand: demo.data.site.brand,
  });
}
