/**
 * What .eleventy.js registers: the template filters and the files copied into the site
 * as they are (stylesheet, fonts and their licence). Kept here so .eleventy.js stays wiring.
 */
import path from 'node:path';
import { PROJECT_ROOT as projectRoot } from '../project-root.ts';
import { FONT_FACES, FONT_LICENSE_PATH, fontFileName, fontPath } from './fonts.ts';
import {
  brandLogoHtml,
  cardHeadAttrs,
  cautionsHtml,
  footerHtml,
  stationCardHtml,
  warningsHtml,
} from './card-html.ts';
import { relativeHref } from './paths.ts';
import { FONTS_DIR } from './site-view.ts';

/** Template filters, by name. */
export const filters = {
  /** `{{ 'assets/card.css' | rel(page.url) }}`: a link relative to the current page. */
  rel: (target: string, fromUrl: string): string => relativeHref(fromUrl ?? '', target ?? ''),
  // The card's markup, one source for the pages and the customer's page (card-html.ts).
  stationCardHtml,
  warningsHtml,
  cautionsHtml,
  footerHtml,
  brandLogoHtml,
  cardHeadAttrs,
};

/** Passthrough copies: absolute source → site-relative destination. */
export function passthroughCopies(): Record<string, string> {
  const copies: Record<string, string> = {
    [path.join(projectRoot, 'templates', 'assets', 'card.css')]: 'assets/card.css',
    [FONT_LICENSE_PATH]: `${FONTS_DIR}/LICENSE`,
  };
  for (const face of FONT_FACES) copies[fontPath(face)] = `${FONTS_DIR}/${fontFileName(face)}`;
  return copies;
}
