/**
 * The HTML pages, incrementally: Eleventy renders the pages whose inputs changed, and the
 * card pages it rendered before are copied from the page cache.
 *
 *   card page key = sha256(the card view's hash, the site data a card page reads, the
 *                   page code version: templates, .eleventy.js, packages)
 *
 *   SiteData ─ split ─▶ cached card pages ─ copy ─────────────────────────▶ <site>/cards/…
 *                    └▶ the other cards + index, sets, method, troubleshooting ─ Eleventy ─┘
 *
 * A card page (templates/card.njk, insert.njk and their partials and layout) reads its
 * card and, of the global data, only `site`, `nav` and `index` (CARD_PAGE_GLOBALS);
 * Eleventy paginates the card lists one card per page, so a page rendered in a run with
 * fewer cards has the same bytes. tests/pipeline/incremental.test.ts holds both to it: a
 * template that starts reading another global must add it here.
 */
import { mkdir, readFile } from 'node:fs/promises';
import path from 'node:path';
import type { InsertCardView, StationCardView } from '../render/card-view.ts';
import type { SiteData } from '../render/site-view.ts';
import { pageCodeVersion } from './code-version.ts';
import { IO_LIMIT, mapConcurrent } from './concurrent.ts';
import { writeSite } from './eleventy.ts';
import { stableJson } from './plan-cache.ts';
import { sha256, type RenderCache } from './render-cache.ts';
import type { ViewText } from './site-data.ts';
import type { BuildStats } from './stats.ts';

export interface PageRun {
  readonly siteDir: string;
  readonly data: SiteData;
  /** By card PDF file (the views' `paths.pdfFile`), the view's hash. */
  readonly viewTexts: ReadonlyMap<string, ViewText>;
  readonly cache: RenderCache;
  readonly stats: BuildStats;
}

type CardView = StationCardView | InsertCardView;

/** The parts of SiteData a card's page reads besides its card. */
export const CARD_PAGE_GLOBALS = [
  'site',
  'nav',
  'index',
] as const satisfies readonly (keyof SiteData)[];

/** Writes every page into run.siteDir; returns the number of pages. */
export async function writePages(run: PageRun): Promise<number> {
  const { data, siteDir, cache, stats } = run;
  const { stationCards, insertCards } = data;
  const read = Object.fromEntries(CARD_PAGE_GLOBALS.map((name) => [name, data[name]]));
  const common = sha256(stableJson(read), await pageCodeVersion());
  const keyOf = (card: CardView) => {
    const view = run.viewTexts.get(card.paths.pdfFile);
    return view ? sha256('page', view.hash, common) : null;
  };
  const cards = [...stationCards, ...insertCards];
  const keys = cards.map(keyOf);
  const folders = new Set(
    cards.map((card) => path.dirname(path.join(siteDir, card.paths.pageFile))),
  );
  await Promise.all([...folders].map((folder) => mkdir(folder, { recursive: true })));
  const copied = await mapConcurrent(cards, IO_LIMIT, async (card, i) => {
    const key = keys[i] ?? null;
    return key !== null && (await cache.pages.copyTo(key, path.join(siteDir, card.paths.pageFile)));
  });
  const toRender = new Set(cards.filter((_, i) => !copied[i]));
  const written = await writeSite({
    outDir: siteDir,
    data: {
      ...data,
      stationCards: stationCards.filter((card) => toRender.has(card)),
      insertCards: insertCards.filter((card) => toRender.has(card)),
    },
  });
  await mapConcurrent(cards, IO_LIMIT, async (card, i) => {
    const key = keys[i] ?? null;
    if (key === null || !toRender.has(card)) return;
    await cache.pages.put(key, await readFile(path.join(siteDir, card.paths.pageFile)));
  });
  const reused = cards.length - toRender.size;
  stats.pages.made += written;
  stats.pages.reused += reused;
  return written + reused;
}
