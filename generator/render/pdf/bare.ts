/**
 * The benchmark's stricter floor (bench/run.ts): a bare one-page PDF of a card, the same
 * kind of document as every card's (document.ts openPdf: PDF/A-2b, tagged, the DejaVu
 * faces registered) and of the card's paper size, holding only the card's title and
 * subtitle as two paragraphs in the regular and bold faces. What a card's PDF costs
 * before any of its own layout, words, chart or drawing.
 */
import { pageSizePt, openPdf, pdfDate } from './document.ts';
import { PDF_FONT } from './fonts.ts';

export interface BarePdfInput {
  readonly title: string;
  readonly subtitle: string;
  readonly lang: string;
  readonly widthMm: number;
  readonly heightMm: number;
  readonly builtOn: string;
  readonly author: string;
  readonly env?: NodeJS.ProcessEnv;
}

export async function barePdf(input: BarePdfInput): Promise<Uint8Array> {
  const open = openPdf({
    title: input.title,
    author: input.author,
    lang: input.lang,
    date: pdfDate(input.builtOn, input.env),
    idSeed: JSON.stringify(input),
  });
  const { doc, root } = open;
  const [widthPt, heightPt] = pageSizePt(input.widthMm, input.heightMm);
  doc.addPage({ size: [widthPt, heightPt], margin: 0 });
  const margin = 24;
  const paragraph = (font: string, size: number, text: string) => {
    root.add(
      doc.struct('P', {}, () => {
        doc
          .font(font)
          .fontSize(size)
          .text(text, margin, doc.y, { width: widthPt - 2 * margin });
      }),
    );
  };
  doc.y = margin;
  paragraph(PDF_FONT.bold, 14, input.title);
  paragraph(PDF_FONT.regular, 10, input.subtitle);
  return open.finish();
}
