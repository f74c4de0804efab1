/**
 * The PDF fonts' shared word-shape cache (generator/render/pdf/fonts.ts): bounded, and a
 * memo only: a card's PDF has the same bytes whatever the cache held when it was drawn.
 * (Here rather than in tests/pdf/ so the PDF suite's files stay with the set-PDF work.)
 */
import { beforeAll, describe, expect, it } from 'vitest';
import type { Catalogue } from '../../generator/content/types.ts';
import { stationCardView, type StationCardView } from '../../generator/render/card-view.ts';
import { cardPdf } from '../../generator/render/pdf/card.ts';
import { openPdf } from '../../generator/render/pdf/document.ts';
import { PDF_FONT, WORD_SHAPES_PER_FACE, pdfWordShapes } from '../../generator/render/pdf/fonts.ts';
import { OPTIONS, demoCatalogue, firstAcceptedPlan, refusedPlan } from './demo.ts';

const CONTEXT = { author: 'Brindlemoss Roastery', env: { SOURCE_DATE_EPOCH: '1714521600' } };
const FACES = ['regular', 'bold', 'oblique', 'bold-oblique'] as const;

let catalogue: Catalogue;
let accepted: StationCardView;
let refused: StationCardView;

const open = () =>
  openPdf({
    title: 't',
    author: 'a',
    lang: 'en-GB',
    date: new Date(Date.UTC(2024, 4, 1)),
    idSeed: 's',
  });

/** Sets `count` distinct words in every face of a fresh document. */
function setDistinctWords(count: number, prefix: string): void {
  const { doc } = open();
  for (const face of FACES) {
    doc.font(PDF_FONT[face]).fontSize(10);
    for (let i = 0; i < count; i++) doc.widthOfString(`${prefix}${i.toString(36)}`);
  }
}

beforeAll(async () => {
  catalogue = await demoCatalogue();
  accepted = await stationCardView(firstAcceptedPlan(catalogue), catalogue, OPTIONS);
  refused = await stationCardView(refusedPlan(catalogue), catalogue, OPTIONS);
});

describe('the shared word-shape cache', () => {
  it(`never holds more than WORD_SHAPES_PER_FACE (${WORD_SHAPES_PER_FACE}) words of a face`, () => {
    pdfWordShapes.clear();
    for (let round = 0; round < 3; round++) {
      setDistinctWords(WORD_SHAPES_PER_FACE, `w${round}-`);
      for (const face of FACES) {
        expect(pdfWordShapes.size(face), `${face} after round ${round}`).toBeLessThanOrEqual(
          WORD_SHAPES_PER_FACE,
        );
      }
    }
    expect(pdfWordShapes.size('regular')).toBeGreaterThan(WORD_SHAPES_PER_FACE / 2);
  });

  it('a card PDF drawn with a cold cache has the same bytes as one drawn with a warm cache', async () => {
    for (const view of [accepted, refused]) {
      pdfWordShapes.clear();
      const cold = (await cardPdf(view, CONTEXT)).bytes;
      expect(pdfWordShapes.size('regular'), 'the cold draw filled the cache').toBeGreaterThan(0);
      const warm = (await cardPdf(view, CONTEXT)).bytes;
      // After the cache has rolled over with other words.
      setDistinctWords(WORD_SHAPES_PER_FACE, `${view.id}-`);
      const rolled = (await cardPdf(view, CONTEXT)).bytes;
      expect(Buffer.compare(warm, cold), `${view.id}: warm vs cold`).toBe(0);
      expect(Buffer.compare(rolled, cold), `${view.id}: after roll-over vs cold`).toBe(0);
    }
  });

  it('every document sets its regular text in the one shared parse of the font', () => {
    // A cached shape points at its font's glyphs: a document's own copy would stay alive.
    const fontOf = (doc: PDFKit.PDFDocument) =>
      (doc.font(PDF_FONT.regular) as unknown as { _font: { font: unknown } })._font.font;
    const a = open().doc;
    const b = open().doc;
    expect(fontOf(a)).toBe(fontOf(b));
    expect((a.font(PDF_FONT.bold) as unknown as { _font: { font: unknown } })._font.font).toBe(
      (b.font(PDF_FONT.bold) as unknown as { _font: { font: unknown } })._font.font,
    );
  });
});
