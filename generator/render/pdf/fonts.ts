/**
 * DejaVu Sans in the PDFs: the same TTF files as the pages and the chart measurements
 * (../fonts.ts, ../text-measure.ts), embedded as subsets (PDF/A wants every font embedded;
 * WOFF2 would crash fontkit's subsetter, so only the TTFs are used). The fonts are parsed
 * once per process and every document sets its text in those parses (registerPdfFonts).
 */
import PDFDocument from 'pdfkit';
import { BoundedCache } from '../bounded-cache.ts';
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
 * word shaped for one card serves the next. Bounded (BoundedCache: the words every card
 * uses stay, a card's own address and fingerprint age out), so memory stays flat over a
 * site of thousands of cards; a word shaped again gives the same run, so the bytes of a
 * PDF do not depend on what the cache held.
 */
export const WORD_SHAPES_PER_FACE = 4096;

interface WordShapes {
  readonly runs: BoundedCache<string, unknown>;
  /** The same, as pdfkit reads it (EmbeddedFont.layoutCached: `cache[text]`, `cache[text] = run`). */
  readonly layoutCache: Record<string, unknown>;
}

const wordShapes = new Map<FontFace, WordShapes>();

function wordShapesOf(face: FontFace): WordShapes {
  let shapes = wordShapes.get(face);
  if (!shapes) {
    const runs = new BoundedCache<string, unknown>(WORD_SHAPES_PER_FACE);
    const layoutCache = new Proxy(Object.create(null) as Record<string, unknown>, {
      get: (_target, text) => (typeof text === 'string' ? runs.get(text) : undefined),
      set: (_target, text, run: unknown) => {
        if (typeof text === 'string') runs.set(text, run);
        return true;
      },
    });
    shapes = { runs, layoutCache };
    wordShapes.set(face, shapes);
  }
  return shapes;
}

/** Words held in the shared cache of each face, and a way to empty them (for tests). */
export const pdfWordShapes = {
  size(face: FontFace): number {
    return wordShapes.get(face)?.runs.size ?? 0;
  },
  clear(): void {
    for (const shapes of wordShapes.values()) shapes.runs.clear();
  },
};

/** The parts of pdfkit's EmbeddedFont this module reads and sets. */
interface EmbeddedFont {
  font: { createSubset(): unknown };
  subset: { glyphs: readonly number[] };
  layoutCache?: Record<string, unknown>;
  encode(text: string): unknown;
}

/**
 * The characters every embedded subset starts with, in this order: printable ASCII,
 * Latin-1, the punctuation and signs the words print (dashes, quotes, arrows, ≤ ≥ ± ×
 * σ χ), and DejaVu's f-ligatures (fontkit sets "fi" as one glyph). So two cards whose text
 * stays within it embed byte-identical subsets of each face, and a set assembled from
 * their PDFs (merge.ts, which stores identical objects once) holds each face once, as a
 * set drawn in one document would; a card with a character outside it still gets that
 * glyph (appended after these), only its subset is its own. A fixed list, never the
 * site's text: a card's PDF stays a function of its own view.
 */
export const SUBSET_BASE: readonly string[] = [
  ...Array.from({ length: 0x7f - 0x20 }, (_, i) => String.fromCharCode(0x20 + i)),
  ...Array.from({ length: 0x100 - 0xa0 }, (_, i) => String.fromCharCode(0xa0 + i)),
  ...'–—‘’‚“”„•…‹›→←−≤≥≈≠±×÷·σχµ‰€™',
  'fi',
  'fl',
  'ff',
  'ffi',
  'ffl',
];

/** Puts SUBSET_BASE's glyphs first in a face's still empty subset (same order each time). */
function startSubset(embedded: EmbeddedFont): void {
  if (embedded.subset.glyphs.length > 1) return;
  for (const text of SUBSET_BASE) embedded.encode(text);
}

/**
 * Registers the four faces on `doc` and selects each once, in a fixed order, so pdfkit
 * numbers them F1…F4 whatever the layout measures first (same input, same bytes). A face
 * is embedded only when text uses it.
 *
 * A document opened with DejaVu Sans by path as its starting font (document.ts, so pdfkit
 * does not load Helvetica) parses its own copy of the regular face, which then answers to
 * "DejaVuSans" (its PostScript name) instead of the registered one. Before any text is set
 * it is switched to the shared parse of the same file: the numbers pdfkit read from it
 * (name, scale, metrics, glyph 0's width) are the same, and a shared word shape never
 * holds on to one document's copy of the font (about 1 MB for every card drawn).
 */
export function registerPdfFonts(doc: PDFKit.PDFDocument): void {
  const faces = parsedFaces();
  for (const [face, font] of faces) {
    doc.registerFont(PDF_FONT[face], font as Buffer);
  }
  for (const face of FONT_FACES) {
    doc.font(PDF_FONT[face]);
    const embedded = (doc as unknown as { _font: EmbeddedFont })._font;
    const shared = faces.get(face) as EmbeddedFont['font'];
    if (embedded.font !== shared) {
      // Only glyph 0 in the subset: nothing set in this font yet.
      if (embedded.subset.glyphs.length > 1) continue;
      embedded.font = shared;
      embedded.subset = shared.createSubset() as EmbeddedFont['subset'];
    }
    if (embedded.layoutCache) embedded.layoutCache = wordShapesOf(face).layoutCache;
    startSubset(embedded);
  }
}

/**
 * The font a document starts with (document.ts): the shared parse of the regular face, so
 * opening a document does not read and parse the 700 kB TTF again (pdfkit takes a fontkit
 * font wherever it takes a file).
 */
export function startingFont(): string {
  return parsedFaces().get('regular') as string;
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
