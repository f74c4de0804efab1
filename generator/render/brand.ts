/**
 * The roaster's brand as the cards, inserts, binder cover and site pages show it: the logo
 * (SVG text or PNG bytes, with its aspect) and the colour, split into what it may colour.
 * The same view feeds the HTML (an <img> and CSS custom properties) and the PDF (pdfkit),
 * so both show one logo at one size rule and one colour rule.
 */
import type { SiteEntry } from '../content/types.ts';
import { TEXT_CONTRAST_MIN } from '../content/colour.ts';

/** Where the build copies the logo in the site, without its extension (site-relative). */
export const LOGO_FILE_STEM = 'assets/brand/logo';

/** The tallest a logo is printed on a card, mm (the header's height at A5); smaller paper scales it by its k. */
export const LOGO_MAX_HEIGHT_MM = 12;

/** The widest a logo is printed beside a card's title, as a share of the card's text width. */
export const LOGO_MAX_WIDTH_SHARE = 0.3;

export interface LogoView {
  readonly format: 'svg' | 'png';
  /** The SVG's text, or the PNG's bytes in base64. */
  readonly data: string;
  readonly width: number;
  readonly height: number;
  /** The copy in the site, site-relative (assets/brand/logo.svg). */
  readonly file: string;
  /** Text alternative: the business's name (words: card.footer.logoAlt). */
  readonly alt: string;
}

export interface BrandView {
  readonly logo: LogoView | null;
  /** Rules and accents (the header's rule, the step discs' ring); null: the ink. */
  readonly accent: string | null;
  /** Headings and the step discs' fill: the colour when it reads as text on white, else null (the ink). */
  readonly text: string | null;
  /** The colour's WCAG 2.x contrast on white, for the build log. */
  readonly contrastOnWhite: number | null;
}

/** The file name the build gives the logo's copy (site-relative). */
export function logoFile(format: 'svg' | 'png'): string {
  return `${LOGO_FILE_STEM}.${format}`;
}

/** The site's brand as views show it, or null without one; `alt` words the logo's text alternative. */
export function brandView(
  site: Pick<SiteEntry, 'brand' | 'business'>,
  alt: (business: string) => string,
): BrandView | null {
  const brand = site.brand;
  if (!brand) return null;
  const logo = brand.logo;
  const readable = brand.contrastOnWhite !== null && brand.contrastOnWhite >= TEXT_CONTRAST_MIN;
  return {
    logo: logo
      ? {
          format: logo.format,
          data: logo.data,
          width: logo.width,
          height: logo.height,
          file: logoFile(logo.format),
          alt: alt(site.business.name),
        }
      : null,
    accent: brand.colour,
    text: readable ? brand.colour : null,
    contrastOnWhite: brand.contrastOnWhite,
  };
}

/** The logo as a data: address (the card's own <img>, so a card page, the planner and a saved page need no file). */
export function logoDataUri(logo: LogoView): string {
  return logo.format === 'png'
    ? `data:image/png;base64,${logo.data}`
    : `data:image/svg+xml;charset=utf-8,${encodeURIComponent(logo.data)}`;
}

/**
 * The logo's printed box, pt: at most `maxHeight` high and `maxWidth` wide, its aspect kept.
 */
export function logoBox(
  logo: Pick<LogoView, 'width' | 'height'>,
  maxWidth: number,
  maxHeight: number,
): { readonly width: number; readonly height: number } {
  const scale = Math.min(maxWidth / logo.width, maxHeight / logo.height);
  return { width: logo.width * scale, height: logo.height * scale };
}
