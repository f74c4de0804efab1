/**
 * The render caches beside the plan cache, so a rebuild re-renders only what changed:
 *
 *   <cacheDir>/views/<key>.json   a station card's view (chart, cross-section, QR code and
 *                                 words), keyed by its plan's key, the render code version,
 *                                 the build date and the site's print settings
 *   <cacheDir>/pages/<key>.html   a card's HTML page, keyed by its view's hash, the page
 *                                 code version and the site data every page shows
 *   <cacheDir>/pdfs/<key>.pdf     a card's or a set's PDF, keyed by the hashes of the
 *                                 views it is drawn from and the render code version
 *   <cacheDir>/pdfs/<key>.page.json  a card page in a set's object form, under its card
 *                                 PDF's key (set-assembly.ts, render/pdf/merge.ts)
 *   <cacheDir>/pdfs/<key>.shell  a set's own pages and placeholders (setShellKey)
 *
 * A view's hash is sha256 over its cache text, so equal views give equal page and PDF
 * keys whatever made them. What a build did not use is swept after a week (file-cache.ts);
 * deleting the folder is always safe.
 */
import { createHash } from 'node:crypto';
import path from 'node:path';
import type { SiteEntry } from '../content/types.ts';
import { FileCache } from './file-cache.ts';
import { fromTaggedJson, stableJson } from './plan-cache.ts';

/** Bumped when a key's layout or a cached file's format changes. */
const RENDER_CACHE_FORMAT = 1;

export function sha256(...parts: readonly string[]): string {
  const hash = createHash('sha256');
  for (const part of parts) hash.update(part).update('\0');
  return hash.digest('hex');
}

/** What of the site a station card's view prints (its entries are in the plan's key). */
export type ViewSite = Pick<
  SiteEntry,
  'units' | 'paper' | 'baseUrl' | 'business' | 'kettlePresetsK'
> & {
  /** The brand by its logo's sha256 and its colour: a new logo or colour draws every card again. */
  readonly brand: { readonly logo: string | null; readonly colour: string | null } | null;
};

export function viewSite(site: SiteEntry): ViewSite {
  const { units, paper, baseUrl, business, kettlePresetsK } = site;
  const brand = site.brand
    ? { logo: site.brand.logo?.sha256 ?? null, colour: site.brand.colour }
    : null;
  return { units, paper, baseUrl, business, kettlePresetsK, brand };
}

export interface StationViewKeyInput {
  readonly planKey: string;
  readonly renderVersion: string;
  readonly builtOn: string;
  readonly site: ViewSite;
  /** Language code of the card (its set's): the same plan makes one view per language. */
  readonly language: string;
}

export function stationViewKey(input: StationViewKeyInput): string {
  return sha256(
    stableJson({
      format: RENDER_CACHE_FORMAT,
      kind: 'station-view',
      plan: input.planKey,
      code: input.renderVersion,
      builtOn: input.builtOn,
      site: input.site,
      language: input.language,
    }),
  );
}

/** A view as the cache holds it: the parsed view, its text's hash, and the text. */
export interface CachedView<V> {
  readonly view: V;
  readonly hash: string;
  readonly text: string;
}

export function viewFromText<V>(text: string): CachedView<V> {
  return { view: fromTaggedJson<V>(text), hash: sha256(text), text };
}

export class RenderCache {
  readonly views: FileCache;
  readonly pages: FileCache;
  readonly pdfs: FileCache;
  /** Beside each card PDF: the optional blocks it left out (JSON array), for the build log. */
  readonly pdfNotes: FileCache;

  constructor(cacheDir: string) {
    this.views = new FileCache(path.join(cacheDir, 'views'), '.json');
    this.pages = new FileCache(path.join(cacheDir, 'pages'), '.html');
    this.pdfs = new FileCache(path.join(cacheDir, 'pdfs'), '.pdf');
    this.pdfNotes = new FileCache(path.join(cacheDir, 'pdfs'), '.dropped.json');
  }

  /** The cached view, or null when absent or unreadable. */
  async view<V>(key: string): Promise<CachedView<V> | null> {
    const text = await this.views.getText(key);
    if (text === null) return null;
    try {
      return viewFromText<V>(text);
    } catch {
      return null;
    }
  }
}

/**
 * Key of a set's sheet PDF (render/pdf/sheet.ts): the sheet (paper, up, its cells, title,
 * where `sheet:` is written), the views of its cards (each laid out again for the cell from
 * its view), who prints them, the date and the code.
 */
export function sheetPdfKey(input: {
  readonly set: unknown;
  readonly sheet: unknown;
  readonly cardHashes: readonly string[];
  readonly author: string;
  readonly builtOn: string;
  readonly sourceDateEpoch: string | undefined;
  readonly renderVersion: string;
}): string {
  return sha256(
    stableJson({
      format: RENDER_CACHE_FORMAT,
      kind: 'sheet-pdf',
      set: input.set,
      sheet: input.sheet,
      cards: input.cardHashes,
      author: input.author,
      builtOn: input.builtOn,
      epoch: input.sourceDateEpoch ?? null,
      code: input.renderVersion,
    }),
  );
}

/** Key of a card's PDF: the view's hash, who prints it, the PDF date setting, the code. */
export function cardPdfKey(input: {
  readonly viewHash: string;
  readonly author: string;
  readonly sourceDateEpoch: string | undefined;
  readonly renderVersion: string;
}): string {
  return sha256(
    stableJson({
      format: RENDER_CACHE_FORMAT,
      kind: 'card-pdf',
      view: input.viewHash,
      author: input.author,
      epoch: input.sourceDateEpoch ?? null,
      code: input.renderVersion,
    }),
  );
}

/** What a set's PDF and its shell are both keyed by: all the set reads but its cards. */
export interface SetKeyed {
  readonly set: unknown;
  readonly frontMatter: unknown;
  readonly page: unknown;
  readonly author: string;
  readonly builtOn: string;
  readonly sourceDateEpoch: string | undefined;
  readonly renderVersion: string;
  /** The brand the binder's cover shows. */
  readonly brand?: unknown;
}

function setKey(kind: 'set-pdf' | 'set-shell', input: SetKeyed, cards: unknown): string {
  return sha256(
    stableJson({
      format: RENDER_CACHE_FORMAT,
      kind,
      brand: input.brand ?? null,
      set: input.set,
      cards,
      front: input.frontMatter,
      page: input.page,
      author: input.author,
      builtOn: input.builtOn,
      epoch: input.sourceDateEpoch ?? null,
      code: input.renderVersion,
    }),
  );
}

/**
 * Key of a set's PDF: everything setPdf reads, its cards by their views' hashes (which,
 * with the author, the date setting and the code, are the keys of the card PDFs it is
 * assembled from).
 */
export function setPdfKey(input: SetKeyed & { readonly cardHashes: readonly string[] }): string {
  return setKey('set-pdf', input, input.cardHashes);
}

/**
 * Key of a set's shell (binder.ts setShell: its own pages and a placeholder per card):
 * everything setPdf reads but the card PDFs, so an edit that leaves the cards' titles,
 * refusals and paper as they were keeps the shell.
 */
export function setShellKey(input: SetKeyed & { readonly cards: unknown }): string {
  return setKey('set-shell', input, input.cards);
}
