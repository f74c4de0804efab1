/**
 * DejaVu Sans in the PDFs: the same TTF files as the pages and the chart measurements
 * (../fonts.ts, ../text-measure.ts), embedded as subsets (PDF/A wants every font embedded;
 * WOFF2 would crash fontkit's subsetter, so only the TTFs are used). The fonts are parsed
 * once per process and shared by every document, so a card PDF does not re-read 700 kB.
 */
import PDFDocument from 'pdfkit';
import { FONT_FACES, fontPath, type FontFace } from '../fonts.ts';

/** pdfkit names of the registered faces. */
export const PDF_FONT: Record<FontFace, string> = {
  regular: 'DejaVuSans',
  bold: 'DejaVuSans-Bold',
  oblique: 'DejaVuSans-Oblique',
  'bold-oblique': 'DejaVuSans-BoldOblique',
};

let parsed: Map<FontFace, unknown> | null = null;

/**
 * fontkit's parsed font of each face. pdfkit accepts a fontkit font wherever it takes a
 * font file (PDFFontFactory.open: any object with a `layout` method); we obtain them
 * through pdfkit itself (its `_font.font`) rather than importing fontkit, which is only
 * pdfkit's dependency.
 */
function parsedFaces(): Map<FontFace, unknown> {
  if (parsed) return parsed;
  const loader = new PDFDocument({ autoFirstPage: false });
  const faces = new Map<FontFace, unknown>();
  for (const face of FONT_FACES) {
    loader.font(fontPath(face));
    faces.set(face, (loader as unknown as { _font: { font: unknown } })._font.font);
  }
  parsed = faces;
  return faces;
}

/**
 * pdfkit's per-font cache of shaped words, shared by every document: shaping a word with
 * DejaVu's OpenType tables is most of the cost of setting text, and a run's glyphs and
 * positions are only read afterwards (EmbeddedFont.encode, _fragment copy them), so a
 * word shaped for one card serves the next.
 */
const layoutCaches = new Map<FontFace, Record<string, unknown>>();

/**
 * Registers the four faces on `doc` and selects each once, in a fixed order, so pdfkit
 * numbers them F1…F4 whatever the layout measures first (same input, same bytes). A face
 * is embedded only when text uses it.
 */
export function registerPdfFonts(doc: PDFKit.PDFDocument): void {
  for (const [face, font] of parsedFaces()) {
    doc.registerFont(PDF_FONT[face], font as Buffer);
  }
  for (const face of FONT_FACES) {
    doc.font(PDF_FONT[face]);
    const embedded = (doc as unknown as { _font: { layoutCache?: Record<string, unknown> } })._font;
    let shared = layoutCaches.get(face);
    if (!shared) {
      shared = Object.create(null) as Record<string, unknown>;
      layoutCaches.set(face, shared);
    }
    if (embedded.layoutCache) embedded.layoutCache = shared;
  }
}

export function faceOf(bold: boolean, italic: boolean): FontFace {
  if (bold) return italic ? 'bold-oblique' : 'bold';
  return italic ? 'oblique' : 'regular';
}

/**
 * svg-to-pdfkit's font callback: every SVG font-family maps to DejaVu Sans (the charts
 * and drawings declare it, and were measured with it), by weight and style.
 */
export function svgFontCallback(_family: string, bold: boolean, italic: boolean): string {
  return PDF_FONT[faceOf(bold, italic)];
}
