/**
 * Where each page and PDF lives in the site, relative to the site's root. One place, so
 * the HTML build, the PDF step and the QR codes agree:
 *
 *   index.html                                  every card, by set
 *   sets/<set>/index.html                       one set
 *   cards/<pot>--<coffee>--<stove>/index.html   a station card   (+ cards/<…>.pdf)
 *   inserts/<coffee>/index.html                 an insert card   (+ inserts/<coffee>.pdf)
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

export function stationSlug(request: CardRequest): string {
  return `${request.potId}--${request.coffeeId}--${request.stoveId}`;
}

function paths(folder: string, baseUrl: string | undefined): CardPaths {
  return {
    pageFile: `${folder}/index.html`,
    pageUrl: `${folder}/`,
    pdfFile: `${folder}.pdf`,
    webUrl: baseUrl ? webUrl(baseUrl, `${folder}/`) : null,
  };
}

export function stationPaths(request: CardRequest, baseUrl?: string): CardPaths {
  return paths(`cards/${stationSlug(request)}`, baseUrl);
}

/** `slug` is the coffee id, or `<coffee>--<set>` when a coffee is in more than one insert set. */
export function insertPaths(slug: string, baseUrl?: string): CardPaths {
  return paths(`inserts/${slug}`, baseUrl);
}

export function setPaths(setId: string, baseUrl?: string): CardPaths {
  return paths(`sets/${setId}`, baseUrl);
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
