/**
 * One card on one page: the pure core the PDF files are made of.
 *
 *   card view ─ fitCard (measure at font steps) ─▶ CardFit ─ drawCard (same blocks, drawing
 *   pen) ─▶ a page of the card's paper size in an open document
 *
 * `cardPdf` makes the one-page PDF twin of a card; sets and binders copy those pages
 * (binder.ts, merge.ts) instead of drawing them again.
 */
import type { InsertCardView, StationCardView } from '../card-view.ts';
import { voiceFor } from '../voice.ts';
import { openPdf, pageSizePt, pdfDate, type OpenPdf } from './document.ts';
import { insertFrame } from './insert-card.ts';
import { fitCard, placeCard, type CardFit, type CardFrame, type PageBox } from './layout.ts';
import { Pen } from './pen.ts';
import { stationFrame } from './station-card.ts';
import { brandedStyle, type CardStyle } from './style.ts';

export type CardView = StationCardView | InsertCardView;

/** A card whose text does not fit one page even at the smallest font step. */
export class PdfLayoutError extends Error {
  constructor(
    readonly cardId: string,
    readonly fit: CardFit,
  ) {
    // For the operator (the build log): English, as every build message.
    super(
      voiceFor().words.pdf.doesNotFit(
        cardId,
        fit.style.paper,
        fit.usedHeightPt,
        fit.availableHeightPt,
      ),
    );
    this.name = 'PdfLayoutError';
  }
}

export function pageBox(view: Pick<CardView, 'page'>): PageBox {
  const [widthPt, heightPt] = pageSizePt(view.page.widthMm, view.page.heightMm);
  return { widthPt, heightPt };
}

/**
 * What a card may leave out, in the order it does, when it does not fit one page with
 * every text at the floor (style.ts PDF_TEXT_FLOOR_PT) at any font step: first the
 * chart, then the long cautions, the drawings and the extras. `long-cautions` sets the cautions in their
 * short form (the same ten cautions in fewer words, as on A6), never fewer of them.
 * Never the recipe, the refusal, the steps, the warnings or the cautions themselves.
 * DEVELOPERS.md and content/README.md list the same order.
 */
export const OPTIONAL_ORDER = {
  station: ['chart', 'long-cautions', 'cross-section', 'expect', 'qr-code'],
  insert: ['pictograms', 'web-line', 'pot-names', 'long-cautions', 'tasting-notes', 'qr-code'],
} as const;

export type StationOptional = (typeof OPTIONAL_ORDER.station)[number];
export type InsertOptional = (typeof OPTIONAL_ORDER.insert)[number];
export type OptionalBlock = StationOptional | InsertOptional;

export function cardFrame(
  view: CardView,
  style: CardStyle,
  dropped: readonly OptionalBlock[] = [],
): CardFrame {
  const left = new Set<OptionalBlock>(dropped);
  const st = brandedStyle(style, view.brand ?? null);
  return view.kind === 'station' ? stationFrame(view, st, left) : insertFrame(view, st, left);
}

/** A card's document title, in its own language (English for a view without one). */
export function cardTitle(
  view: Pick<CardView, 'kind' | 'title' | 'subtitle'> & { readonly language?: string },
): string {
  const pdfWords = voiceFor(view.language).words.pdf;
  return view.kind === 'station'
    ? pdfWords.stationTitle(view.title, view.subtitle)
    : pdfWords.insertTitle(view.title);
}

/**
 * Measures the card at its paper's font steps; when no step fits, leaves out the optional
 * blocks one by one in OPTIONAL_ORDER until one does (`dropped` says which). Needs only a
 * document for the fonts.
 */
export function layoutCard(doc: PDFKit.PDFDocument, view: CardView): CardFit {
  const order: readonly OptionalBlock[] = OPTIONAL_ORDER[view.kind];
  let fit: CardFit | null = null;
  for (let n = 0; n <= order.length; n++) {
    const dropped = order.slice(0, n);
    fit = fitCard(
      new Pen(doc, false),
      pageBox(view),
      view.page.paper,
      (style) => cardFrame(view, style, dropped),
      view.page.marginMm,
    );
    if (fit.fits) return n === 0 ? fit : { ...fit, dropped };
  }
  return { ...fit!, dropped: order };
}

export interface CardPage {
  readonly fit: CardFit;
  /** svg-to-pdfkit's complaints about the drawings (none expected). */
  readonly warnings: readonly string[];
}

/**
 * Adds a page of the card's size to `open` and draws the card on it, tagged as an article
 * (the bench also draws a whole set this way, to compare a set's size with: bench/floors.ts).
 */
export function addCardPage(open: OpenPdf, view: CardView): CardPage {
  const page = pageBox(view);
  open.doc.addPage({ size: [page.widthPt, page.heightPt], margin: 0 });
  const fit = layoutCard(open.doc, view);
  if (!fit.fits) throw new PdfLayoutError(view.id, fit);
  const pen = new Pen(open.doc, true, open.root);
  const dropped = (fit.dropped ?? []) as readonly OptionalBlock[];
  pen.group('Art', () => placeCard(pen, page, fit.style, cardFrame(view, fit.style, dropped)), {
    title: view.title,
  });
  return { fit, warnings: pen.warnings };
}

export interface CardPdf extends CardPage {
  readonly bytes: Buffer;
}

export interface PdfContext {
  /** Who prints the cards (Info Author, dc:creator). */
  readonly author: string;
  /** For SOURCE_DATE_EPOCH; default process.env. */
  readonly env?: NodeJS.ProcessEnv;
}

/** The one-page PDF twin of a card. */
export async function cardPdf(view: CardView, context: PdfContext): Promise<CardPdf> {
  const open = openPdf({
    title: cardTitle(view),
    author: context.author,
    lang: view.lang,
    date: pdfDate(view.footer.builtOn, context.env),
    idSeed: JSON.stringify(view),
  });
  const page = addCardPage(open, view);
  return { ...page, bytes: await open.finish() };
}
