/**
 * The site's sets expanded into the cards to print:
 *   - station sets: one card per CardRequest, in the order the set lists them;
 *   - insert sets: one card per coffee, with a row per pot × kind of stove (gas, electric,
 *     induction) among the set's requests for that coffee; when a set offers two stoves
 *     of one kind for a pot, the first listed gives the row.
 * Every request that appears anywhere (station card or insert row) also gets a station
 * page, so an insert's rows can point to their full cards. Each distinct request is
 * planned once.
 */
import type { CardRequest, Catalogue, PaperSize, SheetSpec } from '../content/types.ts';
import { heatKindOf, type HeatKind } from '../content/heat-kind.ts';
import type { RefusalCode } from '../planning/types.ts';
import {
  insertPaths,
  insertSlug,
  pathLanguage,
  setPaths,
  sheetPdfFile,
  stationKey,
  stationPaths,
  stationSlug,
} from '../render/paths.ts';

export interface StationCardJob {
  /** The plan's slug (stationSlug): one plan per pot × coffee × stove, whatever the language. */
  readonly slug: string;
  /**
   * The card's key (stationKey): the slug, after the language part when the card speaks
   * another language than the site's. Sets list their cards by it.
   */
  readonly key: string;
  /** Language code of the card (its sets'). */
  readonly language: string;
  readonly request: CardRequest;
  /** Sets listing this card as a station card, in site order. */
  readonly setIds: readonly string[];
}

export interface InsertCardJob {
  readonly setId: string;
  /** Language code of the insert (its set's). */
  readonly language: string;
  readonly coffeeId: string;
  /** Page slug: the coffee id, or "<coffee>--<set>" when an earlier insert set took it. */
  readonly slug: string;
  readonly rows: readonly CardRequest[];
}

export interface SetJob {
  readonly id: string;
  readonly title: string;
  readonly layout: 'station' | 'insert';
  /** `layout: binder` (CardSet.binder): the PDF opens with the training front matter. */
  readonly binder?: boolean;
  /** Paper of the set's PDF (CardSet.paper); default the site's. */
  readonly paper?: PaperSize;
  /** The set's cards several to a sheet (CardSet.sheet); absent or null without. */
  readonly sheet?: SheetSpec | null;
  /** Language code of the set's page and PDF (CardSet.language). */
  readonly language: string;
  /** Station sets: keys of their station cards (StationCardJob.key); insert sets: slugs of their inserts. */
  readonly cardSlugs: readonly string[];
  /** Station sets: keys of the cards left out when their plan is refused (CardSet.leaveOutIfRefused). */
  readonly optionalSlugs?: readonly string[];
  /** Why each card left out was refused, one code per card (leave-out.ts; empty before). */
  readonly leftOut?: readonly RefusalCode[];
}

export interface CardJobs {
  readonly sets: readonly SetJob[];
  /** One per distinct request and language, in first-appearance order. */
  readonly stations: readonly StationCardJob[];
  readonly inserts: readonly InsertCardJob[];
}

const HEAT_ORDER: readonly HeatKind[] = ['gas', 'electric', 'induction'];

export function expandCards(catalogue: Catalogue): CardJobs {
  const stations = new Map<
    string,
    { slug: string; language: string; request: CardRequest; setIds: string[] }
  >();
  const siteLanguage = catalogue.site.language;
  const addStation = (request: CardRequest, setId: string | null, language: string): string => {
    const key = stationKey(request, pathLanguage(language, siteLanguage));
    let job = stations.get(key);
    if (!job) {
      job = {
        slug: stationSlug(request),
        language,
        request: { potId: request.potId, coffeeId: request.coffeeId, stoveId: request.stoveId },
        setIds: [],
      };
      stations.set(key, job);
    }
    if (setId !== null && !job.setIds.includes(setId)) job.setIds.push(setId);
    return key;
  };

  const sets: SetJob[] = [];
  const inserts: InsertCardJob[] = [];
  const insertSlugs = new Set<string>();
  for (const set of catalogue.site.sets) {
    if (set.layout === 'station') {
      const slugs = set.cards.map((request) => addStation(request, set.id, set.language));
      sets.push({
        id: set.id,
        title: set.title,
        layout: 'station',
        binder: set.binder,
        paper: set.paper,
        sheet: set.sheet,
        language: set.language,
        cardSlugs: [...new Set(slugs)],
        optionalSlugs: set.leaveOutIfRefused.map((request) =>
          stationKey(request, pathLanguage(set.language, siteLanguage)),
        ),
      });
      continue;
    }
    const slugs: string[] = [];
    for (const coffeeId of set.coffeeIds) {
      const rows = insertRows(catalogue, set.cards, coffeeId);
      for (const row of rows) addStation(row, null, set.language);
      const slug = insertSlug(
        coffeeId,
        insertSlugs.has(insertSlug(coffeeId, null)) ? set.id : null,
      );
      insertSlugs.add(slug);
      inserts.push({ setId: set.id, language: set.language, coffeeId, slug, rows });
      slugs.push(slug);
    }
    sets.push({
      id: set.id,
      title: set.title,
      layout: 'insert',
      paper: set.paper,
      sheet: set.sheet,
      language: set.language,
      cardSlugs: slugs,
    });
  }
  const jobs = {
    sets,
    stations: [...stations.entries()].map(([key, job]) => ({ key, ...job })),
    inserts,
  };
  checkPageNames(jobs);
  return jobs;
}

/** Two cards or sets that would be written to one page (pagePart makes it impossible). */
export class PageCollisionError extends Error {
  override readonly name = 'PageCollisionError';
  constructor(
    readonly page: string,
    readonly first: string,
    readonly second: string,
  ) {
    super(`page collision: ${page}`);
  }
}

/** Throws PageCollisionError naming both entries when two jobs share a page file. */
export function checkPageNames(jobs: CardJobs): void {
  const owners = new Map<string, string>();
  const claim = (page: string, owner: string) => {
    const key = page.toLowerCase(); // one file on a case-insensitive disk, too
    const first = owners.get(key);
    if (first !== undefined && first !== owner) throw new PageCollisionError(page, first, owner);
    owners.set(key, owner);
  };
  for (const { request, key } of jobs.stations) {
    const owner = `pot ${request.potId} × coffee ${request.coffeeId} × stove ${request.stoveId}`;
    const paths = stationPaths(request, undefined, key.includes('/') ? key.split('/')[0] : null);
    claim(paths.pageFile, owner);
    claim(paths.pdfFile, owner);
  }
  for (const job of jobs.inserts) {
    const owner = `insert of coffee ${job.coffeeId} in set ${job.setId}`;
    const paths = insertPaths(job.slug);
    claim(paths.pageFile, owner);
    claim(paths.pdfFile, owner);
  }
  for (const set of jobs.sets) {
    const paths = setPaths(set.id);
    claim(paths.pageFile, `set ${set.id}`);
    claim(paths.pdfFile, `set ${set.id}`);
    if (set.sheet) claim(sheetPdfFile(set.id), `the sheets of set ${set.id}`);
  }
}

/** Rows of one coffee's insert: a pot × heat kind each, pots by size, then gas, electric, induction. */
function insertRows(
  catalogue: Catalogue,
  requests: readonly CardRequest[],
  coffeeId: string,
): CardRequest[] {
  const mine = requests.filter((r) => r.coffeeId === coffeeId);
  const byRow = new Map<string, CardRequest>();
  for (const request of mine) {
    const stove = catalogue.stoves.get(request.stoveId);
    if (!stove) continue;
    const key = `${request.potId}|${heatKindOf[stove.stoveKind]}`;
    if (!byRow.has(key)) byRow.set(key, request);
  }
  const cups = (potId: string) => catalogue.pots.get(potId)?.cups ?? 0;
  const kind = (stoveId: string) =>
    HEAT_ORDER.indexOf(heatKindOf[catalogue.stoves.get(stoveId)!.stoveKind]);
  return [...byRow.values()].sort(
    (a, b) =>
      cups(a.potId) - cups(b.potId) ||
      (a.potId < b.potId ? -1 : a.potId > b.potId ? 1 : 0) ||
      kind(a.stoveId) - kind(b.stoveId),
  );
}
