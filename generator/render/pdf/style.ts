/**
 * The PDF cards' type and spacing, after the print stylesheet (templates/assets/card.css):
 * the same sizes in pt scaled by the paper's factor k (A5 1, A4 1.3, letter 1.25,
 * half-letter 0.95, A6 0.7), the same margins and colours. A layout that does not fit
 * tries the next font step (every size × `step`), so a card is never clipped.
 */
import type { PaperSize } from '../../content/types.ts';
import { QR_PRINTED_MM } from '../qr-density.ts';

export const INK = '#000000';
export const SOFT = '#555555';
export const VALVE = '#b00000';
export const WARNING_FILL = '#fff3c4';
export const RULE_SOFT = '#bbbbbb';
export const PAPER = '#ffffff';

/** Paper factor and margin, as the stylesheet's --k and --margin. */
export const PAPER_STYLE: Record<PaperSize, { readonly k: number; readonly marginMm: number }> = {
  A4: { k: 1.3, marginMm: 11 },
  letter: { k: 1.25, marginMm: 11 },
  A5: { k: 1, marginMm: 7 },
  'half-letter': { k: 0.95, marginMm: 7 },
  A6: { k: 0.7, marginMm: 4.5 },
  '4x6in': { k: 0.7, marginMm: 4.5 },
};

/** Font steps tried in order: the stylesheet's sizes first, then smaller. */
export const FONT_STEPS: readonly number[] = [
  1, 0.95, 0.9, 0.85, 0.8, 0.75, 0.7, 0.65, 0.6, 0.55, 0.5,
];

/**
 * The readable floor: no text of any PDF is set smaller, pt, the cautions, the footer,
 * table heads, page numbers and the labels of the drawings and the chart included. Font
 * steps shrink every size, but none below this; a card that does not fit at the floor
 * leaves out its optional blocks (card.ts OPTIONAL_ORDER) instead. 7 pt is the smallest
 * size common legibility guidance allows for printed body text read at arm's length
 * (common practice, no source).
 */
export const PDF_TEXT_FLOOR_PT = 7;

/** Smallest label a drawing or the chart may be scaled to, pt: the floor. */
export const MIN_TEXT_PT = PDF_TEXT_FLOOR_PT;

/** Smallest text of the card itself, pt: the floor. */
export const MIN_BODY_PT = PDF_TEXT_FLOOR_PT;

/** How the body is arranged; tried in this order at each font step. */
export interface Arrangement {
  /** The card's body in one column, or flowed into two (breaking between blocks). */
  readonly bodyColumns: 1 | 2;
  /** Cautions and the watch list in two columns where the column is wide enough. */
  readonly listColumns: 1 | 2;
}

export const ARRANGEMENTS: readonly Arrangement[] = [
  { bodyColumns: 1, listColumns: 1 },
  { bodyColumns: 1, listColumns: 2 },
  { bodyColumns: 2, listColumns: 2 },
];

export interface TextFont {
  readonly size: number;
  readonly bold: boolean;
  readonly color: string;
}

/** Sizes of one font step on one paper, pt. */
export interface CardStyle {
  readonly paper: PaperSize;
  readonly step: number;
  readonly bodyColumns: 1 | 2;
  readonly listColumns: 1 | 2;
  readonly compact: boolean;
  readonly marginPt: number;
  /** Vertical gap between blocks, and between the two halves of a pair. */
  readonly gap: number;
  readonly gutter: number;
  readonly h1: TextFont;
  readonly sub: TextFont;
  readonly notes: TextFont;
  readonly h2: TextFont;
  readonly h2Note: TextFont;
  readonly h3: TextFont;
  readonly label: TextFont;
  readonly big: TextFont;
  readonly bigUnit: TextFont;
  readonly bigAside: TextFont;
  readonly time: TextFont;
  readonly note: TextFont;
  readonly noteStrong: TextFont;
  readonly list: TextFont;
  readonly caption: TextFont;
  readonly expect: TextFont;
  readonly expectLabel: TextFont;
  readonly refusalHeading: TextFont;
  readonly reason: TextFont;
  readonly warning: TextFont;
  readonly caution: TextFont;
  readonly cautionHeading: TextFont;
  readonly foot: TextFont;
  readonly table: TextFont;
  readonly tableHead: TextFont;
  readonly tableAside: TextFont;
  readonly tableRefused: TextFont;
  readonly web: TextFont;
  /** Drawing scale, pt per SVG px, before fitting to a column (CSS: 1 px = 0.75 pt). */
  readonly drawingScale: number;
  /** Thick rule under the header, the rules above steps. */
  readonly ruleHeavy: number;
  readonly ruleLight: number;
  readonly qrSize: number;
  readonly padding: number;
  /** The header's rule: the brand's colour (render/brand.ts accent), else the ink. */
  readonly accent?: string;
  /** The step discs' fill: the brand's colour when it reads as text, else the ink. */
  readonly disc?: string;
}

/**
 * A card's style in the roaster's colours: the header's rule in the accent; the title, the
 * step headings and the step discs in the colour when it reads as text on white (WCAG 2.x
 * 4.5:1: then the discs' white figures read too). The cautions keep their red.
 */
export function brandedStyle(
  st: CardStyle,
  brand: { readonly accent: string | null; readonly text: string | null } | null,
): CardStyle {
  if (!brand) return st;
  const text = brand.text;
  return {
    ...st,
    ...(brand.accent ? { accent: brand.accent } : {}),
    ...(text ? { disc: text, h1: { ...st.h1, color: text }, h2: { ...st.h2, color: text } } : {}),
  };
}

/** Tallest a logo may print on paper of factor k, pt: LOGO_MAX_HEIGHT_MM, less on small paper. */
export function logoMaxHeightPt(paper: PaperSize, maxMm: number): number {
  return maxMm * MM * Math.min(1, PAPER_STYLE[paper].k);
}

const MM = 72 / 25.4;

/** A card's margin on its paper, pt (the same at every font step). */
export function cardMarginPt(paper: PaperSize): number {
  return PAPER_STYLE[paper].marginMm * MM;
}

/**
 * The sizes of one font step on `paper`; `marginMm` replaces the paper's margin (a card in
 * a sheet's cell, render/sheet.ts, keeps its text that far inside the cut line).
 */
export function cardStyle(
  paper: PaperSize,
  step: number,
  arrangement: Arrangement = ARRANGEMENTS[0]!,
  marginMm?: number,
): CardStyle {
  const { k } = PAPER_STYLE[paper];
  const s = k * step;
  const f = (size: number, bold = false, color = INK): TextFont => ({
    size: Math.max(MIN_BODY_PT, size * s),
    bold,
    color,
  });
  return {
    paper,
    step,
    bodyColumns: arrangement.bodyColumns,
    listColumns: arrangement.listColumns,
    compact: paper === 'A6' || paper === '4x6in',
    marginPt: marginMm === undefined ? cardMarginPt(paper) : marginMm * MM,
    gap: 1.6 * MM * s,
    gutter: 3 * MM * s,
    h1: f(16, true),
    sub: f(9),
    notes: f(8, false, SOFT),
    h2: f(9.5, true),
    h2Note: f(8),
    h3: f(8.4, true),
    label: f(7.6, true, SOFT),
    big: f(22, true),
    bigUnit: f(13.2, true),
    bigAside: f(8.8),
    time: f(24, true),
    note: f(7.8),
    noteStrong: f(7.8, true),
    list: f(7.8),
    caption: f(6.8, false, SOFT),
    expect: f(7.8),
    expectLabel: f(7.8, true),
    refusalHeading: f(14, true, VALVE),
    reason: f(11),
    warning: f(7.4),
    caution: f(7.2),
    cautionHeading: f(9.5, true, VALVE),
    foot: f(6.8),
    table: f(8),
    tableHead: f(6.8, true),
    tableAside: f(6.4, false, SOFT),
    tableRefused: f(8, false, VALVE),
    web: f(7.4),
    drawingScale: 0.75 * s,
    ruleHeavy: 0.8 * MM * s,
    ruleLight: 0.75,
    // Never smaller than the width the address's density is checked at (qr-density.ts), so
    // a code that passed the check is printed at a size a phone reads.
    qrSize: Math.max(15 * MM * s, QR_PRINTED_MM * MM),
    padding: 1 * MM * s,
  };
}

/** Sizes of the binder's text pages (contents, method, troubleshooting), pt. */
export interface TextPageStyle {
  readonly marginPt: number;
  readonly gap: number;
  readonly gutter: number;
  readonly h1: TextFont;
  readonly h2: TextFont;
  readonly body: TextFont;
  readonly bodyStrong: TextFont;
  readonly lead: TextFont;
  readonly table: TextFont;
  readonly tableHead: TextFont;
  readonly pageNumber: TextFont;
  /** The running cautions at the foot of every text page. */
  readonly caution: TextFont;
  readonly cautionStrong: TextFont;
  readonly cautionHeading: TextFont;
}

/** The print sizes of the site's text pages (card.css: 10.5 pt body) scaled by the paper's k. */
export function textPageStyle(paper: PaperSize): TextPageStyle {
  const { k, marginMm } = PAPER_STYLE[paper];
  const f = (size: number, bold = false, color = INK): TextFont => ({
    size: Math.max(PDF_TEXT_FLOOR_PT, size * k),
    bold,
    color,
  });
  return {
    // Text pages are read in a binder, not at arm's length by the stove: a wider margin.
    marginPt: Math.max(marginMm, 10 * k) * MM,
    gap: 2.2 * MM * k,
    gutter: 3 * MM * k,
    h1: f(17, true),
    h2: f(11.5, true),
    body: f(9),
    bodyStrong: f(9, true),
    lead: f(10),
    table: f(7.8),
    tableHead: f(7, true),
    pageNumber: f(6.5, false, SOFT),
    caution: f(7),
    cautionStrong: f(7, true),
    cautionHeading: f(7.5, true, VALVE),
  };
}
