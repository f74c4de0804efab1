/**
 * Where each page and PDF lives in the site, relative to the site's root. One place, so
 * the HTML build, the PDF step and the QR codes agree:
 *
 *   index.html                                  every card, by set
 *   sets/<set>/index.html                       one set
 *   cards/<pot>--<coffee>--<stove>/index.html   a station card   (+ cards/<…>.pdf)
 *   cards/<lang>/<pot>--<coffee>--<stove>/…      the same card in a set of another language than
 *                                               the site's (a slug always holds `--`, a
 *                                               language code never: no collision)
 *     (ids holding `--` are escaped so no two cards share a name: pagePart)
 *   inserts/<coffee>/index.html                 an insert card   (+ inserts/<coffee>.pdf)
 *   brew/<coffee>/index.html                    the customer's page of a coffee (planner)
 *     (brew/<coffee>--<language>/ for a language other than the site's)
 *   method/index.html, troubleshooting/index.html
 */
import type { CardRequest } from '../content/types.ts';

export interface CardPaths {
  /** Site-relative HTML file, e.g. "cards/three-cup--house--bar-gas/index.html". */
  readonly pageFile: string;
  /** Site-relative page address (folder form), e.g. "cards/three-cup--house--bar-gas/". */
  readonly pageUrl: string;
  /** Site-relative PDF file, the page's folder path + ".pdf": "cards/three-cup--house--bar-gas.pdf". */
  readonly pdfFile: string;
  /** Absolute web address of the page when the site has a base_url, else null. */
  readonly webUrl: string | null;
}

/**
 * An id as a part of a page name that joins ids with `--`. Ids match
 * `^[a-z0-9][a-z0-9-]*$`, so they may hold `--` themselves (pot `p--x` × coffee `c` and
 * pot `p` × coffee `x--c` would both be `p--x--c`). A run of k ≥ 2 dashes is written as
 * `-` followed by k − 1 times `_-` (`_` is never in an id), so a part never holds `--`
 * and ends in at most one `-`, and a joined name splits back one way only: at each run
 * of two dashes, or of three after a part ending in `-`. Ids without `--` (all the
 * usual ones) are their own part, so their addresses do not change.
 */
export function pagePart(id: string): string {
  return id.replace(/-{2,}/g, (run) => `-${'_-'.repeat(run.length - 1)}`);
}

/** The ids joined into one page name, collision-free (pagePart). The one naming function. */
export function pageName(...ids: readonly string[]): string {
  return ids.map(pagePart).join('--');
}

export function stationSlug(request: CardRequest): string {
  return pageName(request.potId, request.coffeeId, request.stoveId);
}

/** An insert's page name: the coffee's, or coffee and set when an earlier set took it. */
export function insertSlug(coffeeId: string, setId: string | null): string {
  return setId === null ? pageName(coffeeId) : pageName(coffeeId, setId);
}

function paths(folder: string, baseUrl: string | undefined): CardPaths {
  return {
    pageFile: `${folder}/index.html`,
    pageUrl: `${folder}/`,
    pdfFile: `${folder}.pdf`,
    webUrl: baseUrl ? webUrl(baseUrl, `${folder}/`) : null,
  };
}

/**
 * A station card's page and PDF. `language` is the card's language when it is not the
 * site's (pathLanguage); the site's own language keeps the plain address.
 */
export function stationPaths(
  request: CardRequest,
  baseUrl?: string,
  language?: string | null,
): CardPaths {
  return paths(`cards/${language ? `${language}/` : ''}${stationSlug(request)}`, baseUrl);
}

/** The language part of a card's address: none for the site's language, else the code. */
export function pathLanguage(language: string, siteLanguage: string): string | null {
  return language === siteLanguage ? null : language;
}

/** A station card's key among the build's cards: its slug, after its language part if any. */
export function stationKey(request: CardRequest, language?: string | null): string {
  return language ? `${language}/${stationSlug(request)}` : stationSlug(request);
}

/** `slug` is the coffee id, or `<coffee>--<set>` when a coffee is in more than one insert set. */
export function insertPaths(slug: string, baseUrl?: string): CardPaths {
  return paths(`inserts/${slug}`, baseUrl);
}

/** The customer's page of a coffee: in the site's language, or a set's other language. */
export function plannerSlug(coffeeId: string, language: string, siteLanguage: string): string {
  return language === siteLanguage ? pageName(coffeeId) : pageName(coffeeId, language);
}

/** The customer's page (no PDF of its own: `pdfFile` is unused). */
export function plannerPaths(slug: string, baseUrl?: string): CardPaths {
  return paths(`brew/${slug}`, baseUrl);
}

export function setPaths(setId: string, baseUrl?: string): CardPaths {
  return paths(`sets/${pageName(setId)}`, baseUrl);
}

/** A set's sheet PDF (several cards to a sheet, `sheet:`), beside the set's own PDF. */
export function sheetPdfFile(setId: string): string {
  return `sets/${pageName(setId)}-sheet.pdf`;
}

/** Joins the site's base address and a site-relative path with exactly one slash. */
export function webUrl(baseUrl: string, sitePath: string): string {
  return `${baseUrl.replace(/\/+$/, '')}/${sitePath.replace(/^\/+/, '')}`;
}

/**
 * A link from the page at `fromUrl` (site-relative, folder form, '' for the root) to the
 * site-relative `target`, relative so the site also works opened from disk (file://).
 * Folder targets get an explicit index.html for the same reason.
 */
export function relativeHref(fromUrl: string, target: string): string {
  const depth = fromUrl.split('/').filter((part) => part !== '').length;
  const file = target === '' || target.endsWith('/') ? `${target}index.html` : target;
  return `${'../'.repeat(depth)}${file.replace(/^\/+/, '')}`;
}
