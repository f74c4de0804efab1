/**
 * A PDF read back with pdfjs-dist (legacy build: Node, no canvas): page count, page sizes in
 * millimetres and the text of each page.
 */
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';

export interface PdfPages {
  readonly pages: number;
  /** [width, height] of each page, mm (from the page's view box, in pt). */
  readonly sizesMm: readonly (readonly [number, number])[];
  /** Text of each page, items joined with spaces. */
  readonly text: readonly string[];
}

const MM_PER_PT = 25.4 / 72;

export async function readPdfPages(bytes: Uint8Array, withText = false): Promise<PdfPages> {
  const doc = await getDocument({
    data: new Uint8Array(bytes),
    isEvalSupported: false,
    useSystemFonts: false,
    verbosity: 0,
  }).promise;
  try {
    const sizesMm: [number, number][] = [];
    const text: string[] = [];
    for (let i = 1; i <= doc.numPages; i++) {
      const page = await doc.getPage(i);
      const [x0, y0, x1, y1] = page.view as [number, number, number, number];
      sizesMm.push([(x1 - x0) * MM_PER_PT, (y1 - y0) * MM_PER_PT]);
      if (withText) {
        const content = await page.getTextContent();
        text.push(content.items.map((item) => ('str' in item ? item.str : '')).join(' '));
      }
    }
    return { pages: doc.numPages, sizesMm, text };
  } finally {
    await doc.destroy();
  }
}

/** Text with all white space removed, for finding a phrase a layout may have broken into lines. */
export function squash(text: string): string {
  return text.replace(/[\s\u00a0\u202f\u00ad]+/g, '');
}
