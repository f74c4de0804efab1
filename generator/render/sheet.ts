/**
 * Several cards to a sheet for a desktop printer (a set's `sheet: { paper, up }`): where
 * the cells sit on the sheet and what a card laid out for a cell looks like. The PDF code
 * (pdf/sheet.ts) only places what this computes.
 *
 *   sheet paper, turned so the cells stand upright ─ less the printer's margin ─ divided
 *   into the grid (2 up: 2 × 1, 4 up: 2 × 2, 8 up: 4 × 2, columns × rows) ─ each slot less
 *   the room for the crop marks ─▶ the cell: the card's own page, cut out along the marks
 *
 * Cards are never scaled: each is laid out again at its cell's size (onCell), so every
 * text keeps the 7 pt floor (pdf/style.ts PDF_TEXT_FLOOR_PT); a card that does not fit
 * its cell leaves out optional blocks as on any paper, and one that does not fit even so
 * stops the build (pdf/sheet.ts SheetLayoutError).
 *
 * The cells stand upright like every card (portrait): a 2-up or 8-up sheet is turned
 * landscape instead of turning the cards, so a sheet's text runs the way a card's does
 * (and is extracted in reading order). A printer prints a landscape page on its paper as
 * it is (common practice, no source).
 */
import type { PaperSize, SheetUp } from '../content/types.ts';
import { cautions, COMPACT_PAPERS, paperMm, type Cautions, type PageSetup } from './card-view.ts';
import { voiceFor } from './voice.ts';

/**
 * Margin the sheet keeps clear on every side, mm: most desktop inkjet and laser printers
 * cannot print within about 3–5 mm of the paper's edge (common practice, no source); 6 mm
 * clears them with room to spare (own rule).
 */
export const PRINTER_MARGIN_MM = 6;

/**
 * Between a cell's cut line and the edge of its share of the sheet, mm: the crop marks sit
 * in it, so two neighbouring cells are 2 × 4 mm apart (own rule).
 */
export const CELL_INSET_MM = 4;

/**
 * A crop mark: a hairline continuing each cut line past a cell's corner, starting this far
 * from the corner (so it never touches the card) and this long, mm (own rule; two
 * neighbours' marks in the 8 mm between them stay 1 mm apart).
 */
export const CROP_MARK_OFFSET_MM = 1;
export const CROP_MARK_LENGTH_MM = 2.5;

/**
 * A card's margin inside its cell, mm: the text keeps this far from the cut line, so a cut
 * a little off the mark never touches it (own rule, after the 3 mm safe zone common for
 * trimmed print, no source).
 */
export const CELL_MARGIN_MM = 2.5;

/** How each `up` divides the sheet, and whether the sheet is turned landscape. */
export const SHEET_GRID: Record<
  SheetUp,
  { readonly columns: number; readonly rows: number; readonly landscape: boolean }
> = {
  2: { columns: 2, rows: 1, landscape: true },
  4: { columns: 2, rows: 2, landscape: false },
  8: { columns: 4, rows: 2, landscape: true },
};

export interface SheetGeometry {
  readonly paper: PaperSize;
  readonly up: SheetUp;
  /** The sheet's page as printed (landscape for 2 and 8 up), mm. */
  readonly widthMm: number;
  readonly heightMm: number;
  readonly columns: number;
  readonly rows: number;
  /** Every cell's size, mm: the cut-out card's page. */
  readonly cellWidthMm: number;
  readonly cellHeightMm: number;
  /** Top-left corner of each cell from the sheet's top-left, mm, row by row. */
  readonly cells: readonly { readonly xMm: number; readonly yMm: number }[];
  /**
   * The paper whose type sizes a cell's card starts from (style.ts PAPER_STYLE): the one
   * nearest the cell in area. The layout steps down from there as on any paper.
   */
  readonly typeOf: PaperSize;
}

const PAPERS: readonly PaperSize[] = ['A4', 'letter', 'A5', 'half-letter', 'A6', '4x6in'];

/** The paper nearest a page in area (by ratio), for its type sizes. */
export function nearestPaper(widthMm: number, heightMm: number): PaperSize {
  const area = widthMm * heightMm;
  let best: PaperSize = PAPERS[0]!;
  let bestRatio = Number.POSITIVE_INFINITY;
  for (const paper of PAPERS) {
    const p = paperMm(paper);
    const ratio = Math.abs(Math.log((p.widthMm * p.heightMm) / area));
    if (ratio < bestRatio - 1e-9) {
      best = paper;
      bestRatio = ratio;
    }
  }
  return best;
}

const round = (mm: number): number => Math.round(mm * 100) / 100;

export function sheetGeometry(paper: PaperSize, up: SheetUp): SheetGeometry {
  const grid = SHEET_GRID[up];
  const portrait = paperMm(paper);
  const widthMm = grid.landscape ? portrait.heightMm : portrait.widthMm;
  const heightMm = grid.landscape ? portrait.widthMm : portrait.heightMm;
  const slotW = (widthMm - 2 * PRINTER_MARGIN_MM) / grid.columns;
  const slotH = (heightMm - 2 * PRINTER_MARGIN_MM) / grid.rows;
  const cellWidthMm = round(slotW - 2 * CELL_INSET_MM);
  const cellHeightMm = round(slotH - 2 * CELL_INSET_MM);
  const cells: { xMm: number; yMm: number }[] = [];
  for (let row = 0; row < grid.rows; row++)
    for (let column = 0; column < grid.columns; column++)
      cells.push({
        xMm: round(PRINTER_MARGIN_MM + column * slotW + CELL_INSET_MM),
        yMm: round(PRINTER_MARGIN_MM + row * slotH + CELL_INSET_MM),
      });
  return {
    paper,
    up,
    widthMm,
    heightMm,
    columns: grid.columns,
    rows: grid.rows,
    cellWidthMm,
    cellHeightMm,
    cells,
    typeOf: nearestPaper(cellWidthMm, cellHeightMm),
  };
}

/** The page of a card in a cell: the cell's size, its type class, the cell's margin. */
export function cellPage(page: PageSetup, sheet: SheetGeometry): PageSetup {
  return {
    units: page.units,
    paper: sheet.typeOf,
    cssSize: `${sheet.cellWidthMm}mm ${sheet.cellHeightMm}mm`,
    widthMm: sheet.cellWidthMm,
    heightMm: sheet.cellHeightMm,
    compact: COMPACT_PAPERS.has(sheet.typeOf),
    marginMm: CELL_MARGIN_MM,
  };
}

/** A card's view laid out for a sheet's cell: its page and its cautions' form. */
export function onCell<
  V extends { readonly page: PageSetup; readonly cautions: Cautions; readonly language: string },
>(view: V, sheet: SheetGeometry): V {
  const page = cellPage(view.page, sheet);
  const voice = voiceFor(view.language, view.page.units);
  return { ...view, page, cautions: cautions(page.compact ? 'compact' : 'full', voice) };
}

/** Sheets a set of `cards` cards needs. */
export function sheetCount(cards: number, up: SheetUp): number {
  return Math.ceil(cards / up);
}
