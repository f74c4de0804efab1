/**
 * A set's sheets (`sheet: { paper, up }`): its cards several to a page for a desktop
 * printer, each laid out at its cell's own size (../sheet.ts onCell), so no text goes
 * under the 7 pt floor, with crop marks at every cell's corners.
 *
 *   cell views ─ layoutCard each (font steps, then optional blocks) ─ all fit? ── no ─▶
 *     SheetLayoutError (site.yaml:line, the `sheet` field, the cell in mm, the fix)
 *   └─ yes ─▶ per sheet: crop marks (artifacts), each card drawn into its cell ─▶ PDF
 *
 * The cards are drawn into the sheet's own document (pdfkit, under a translation to the
 * cell), not copied from their PDFs: the card PDFs are of the card's paper, and a card
 * laid out for a cell is another layout. Drawing keeps the sheets tagged like every PDF
 * (each card an `Art` under the sheet's Document, in reading order) and their text
 * extractable, and the fonts are embedded once for the whole file.
 */
import { printWords } from '../../words/print.ts';
import { CROP_MARK_LENGTH_MM, CROP_MARK_OFFSET_MM, sheetCount } from '../sheet.ts';
import type { SetView, SheetView } from '../site-view.ts';
import { cardFrame, layoutCard, pageBox, type CardView, type OptionalBlock } from './card.ts';
import { openPdf, pageSizePt, pdfDate } from './document.ts';
import { placeCard, type CardFit } from './layout.ts';
import { Pen } from './pen.ts';
import { INK, PDF_TEXT_FLOOR_PT } from './style.ts';

export interface SheetPdfInput {
  readonly set: Pick<SetView, 'id' | 'lang'>;
  readonly sheet: SheetView;
  /** The set's cards laid out for the sheet's cell (../sheet.ts onCell), in the set's order. */
  readonly cards: readonly CardView[];
  readonly author: string;
  readonly builtOn: string;
  readonly env?: NodeJS.ProcessEnv;
}

export interface SheetPdf {
  readonly bytes: Buffer;
  readonly pages: number;
  /** The cards that left out optional blocks to fit their cell (the build log says so). */
  readonly dropped: readonly { readonly card: string; readonly blocks: readonly string[] }[];
}

/** A card that does not fit its cell at the floor even without its optional blocks. */
export class SheetLayoutError extends Error {
  override readonly name = 'SheetLayoutError';

  constructor(
    readonly cardId: string,
    readonly sheet: SheetView,
    readonly fit: CardFit,
  ) {
    // For the operator (the build log): English, as every build message.
    const g = sheet.geometry;
    super(
      printWords.sheetDoesNotFit({
        at: `${sheet.source.file}:${sheet.source.line}:${sheet.source.column}`,
        field: sheet.field,
        card: cardId,
        up: g.up,
        paper: g.paper,
        cellWidthMm: g.cellWidthMm,
        cellHeightMm: g.cellHeightMm,
        floorPt: PDF_TEXT_FLOOR_PT,
      }),
    );
  }
}

const MM = 72 / 25.4;

/** Hairline of the crop marks, pt (common practice for trim marks, no source). */
const MARK_WIDTH_PT = 0.25;

/** The crop marks of one cell: each cut line continued past each corner, outside the cell. */
function cropMarks(pen: Pen, x: number, y: number, w: number, h: number): void {
  const off = CROP_MARK_OFFSET_MM * MM;
  const len = CROP_MARK_LENGTH_MM * MM;
  pen.artifact(() => {
    const doc = pen.doc;
    doc.lineWidth(MARK_WIDTH_PT).strokeColor(INK);
    for (const cy of [y, y + h]) {
      doc.moveTo(x - off - len, cy).lineTo(x - off, cy);
      doc.moveTo(x + w + off, cy).lineTo(x + w + off + len, cy);
    }
    for (const cx of [x, x + w]) {
      doc.moveTo(cx, y - off - len).lineTo(cx, y - off);
      doc.moveTo(cx, y + h + off).lineTo(cx, y + h + off + len);
    }
    doc.stroke();
  });
}

/** The set's cards, `up` to a sheet, in order; the last sheet may have empty cells. */
export async function sheetPdf(input: SheetPdfInput): Promise<SheetPdf> {
  const { sheet, cards } = input;
  const g = sheet.geometry;
  const open = openPdf({
    title: sheet.title,
    author: input.author,
    lang: input.set.lang,
    date: pdfDate(input.builtOn, input.env),
    idSeed: JSON.stringify({ sheet: input.set.id, up: g.up, paper: g.paper }),
  });
  const { doc } = open;
  // Every card is measured before anything is drawn: one that does not fit stops the sheet.
  const fits = cards.map((view) => {
    if (view.page.widthMm !== g.cellWidthMm || view.page.heightMm !== g.cellHeightMm)
      throw new Error(`PDF: card ${view.id} is not laid out for the sheet's cell (onCell)`);
    const fit = layoutCard(doc, view);
    if (!fit.fits) throw new SheetLayoutError(view.id, sheet, fit);
    return fit;
  });
  const [widthPt, heightPt] = pageSizePt(g.widthMm, g.heightMm);
  const pen = new Pen(doc, true, open.root);
  const pages = sheetCount(cards.length, g.up);
  for (let p = 0; p < pages; p++) {
    doc.addPage({ size: [widthPt, heightPt], margin: 0 });
    for (let c = 0; c < g.up; c++) {
      const i = p * g.up + c;
      const view = cards[i];
      if (!view) break;
      const fit = fits[i]!;
      const cell = pageBox(view);
      const at = g.cells[c]!;
      const x = at.xMm * MM;
      const y = at.yMm * MM;
      cropMarks(pen, x, y, cell.widthPt, cell.heightPt);
      const dropped = (fit.dropped ?? []) as readonly OptionalBlock[];
      doc.save();
      doc.translate(x, y);
      pen.group('Art', () => placeCard(pen, cell, fit.style, cardFrame(view, fit.style, dropped)), {
        title: view.title,
      });
      doc.restore();
    }
  }
  const dropped = cards.flatMap((view, i) => {
    const blocks = fits[i]!.dropped ?? [];
    return blocks.length > 0 ? [{ card: view.paths.pdfFile, blocks }] : [];
  });
  return { bytes: await open.finish(), pages, dropped };
}
