/**
 * The layout combinators on blocks of known size (closed form: heights add, gaps count
 * once between neighbours, a pair is as tall as its taller half), and fitCard's search.
 */
import PDFDocument from 'pdfkit';
import { describe, expect, it } from 'vitest';
import { registerPdfFonts } from '../../generator/render/pdf/fonts.ts';
import {
  balancedSplit,
  beside,
  columns,
  fitCard,
  placeCard,
  stack,
  type Block,
  type CardFrame,
} from '../../generator/render/pdf/layout.ts';
import { Pen } from '../../generator/render/pdf/pen.ts';
import { cardStyle, FONT_STEPS } from '../../generator/render/pdf/style.ts';

function measuringPen(): Pen {
  const doc = new PDFDocument({ autoFirstPage: false });
  registerPdfFonts(doc);
  return new Pen(doc, false);
}

/** A block `h` tall at any width of at least `minW` (else it cannot be laid out). */
const box =
  (h: number, minW = 0): Block =>
  (_pen, _x, _y, w) =>
    w >= minW ? h : Number.POSITIVE_INFINITY;

/** Records where it was placed. */
function spy(h: number, at: { x: number; y: number; w: number }[]): Block {
  return (_pen, x, y, w) => {
    at.push({ x, y, w });
    return h;
  };
}

const pen = measuringPen();

describe('stack(blocks, gap)', () => {
  it('stack([10, 20, 30], 5) is 10 + 20 + 30 + 2 × 5 = 70', () => {
    expect(stack([box(10), box(20), box(30)], 5)(pen, 0, 0, 100)).toBe(70);
  });
  it('an empty block takes no gap: stack([10, 0, 30], 5) is 45', () => {
    expect(stack([box(10), box(0), box(30)], 5)(pen, 0, 0, 100)).toBe(45);
  });
});

describe('balancedSplit(heights, gap)', () => {
  it('balancedSplit([1, 1, 1, 1], 0) splits in the middle', () => {
    expect(balancedSplit([1, 1, 1, 1], 0)).toBe(2);
  });
  it('balancedSplit([3, 1, 1, 1], 0) puts the tall item alone', () => {
    expect(balancedSplit([3, 1, 1, 1], 0)).toBe(1);
  });
  it('balancedSplit([5], 0) keeps one item in one column', () => {
    expect(balancedSplit([5], 0)).toBe(1);
  });
});

describe('beside(left, right, gutter, gap)', () => {
  it('side by side it is as tall as the taller half, each half placed in its own column', () => {
    const at: { x: number; y: number; w: number }[] = [];
    const pair = beside(
      { block: spy(40, at), share: 1, minWidth: () => 10 },
      { block: spy(25, at), share: 1, minWidth: () => 10 },
      10,
      5,
    );
    const drawing = new Pen(pen.doc, true, pen.doc.struct('Document'));
    expect(pair(drawing, 0, 0, 110)).toBe(40);
    expect(at.at(-2)).toEqual({ x: 0, y: 0, w: 50 });
    expect(at.at(-1)).toEqual({ x: 60, y: 0, w: 50 });
  });
  it('when a half cannot have its minimum width, one under the other: 40 + 5 + 25', () => {
    const pair = beside(
      { block: box(40), share: 1, minWidth: () => 80 },
      { block: box(25), share: 1, minWidth: () => 80 },
      10,
      5,
    );
    expect(pair(pen, 0, 0, 110)).toBe(70);
  });
});

describe('columns(blocks, gap, gutter)', () => {
  it('columns([30, 30, 30, 30], 5, 10) is two columns of 30 + 5 + 30', () => {
    expect(columns([box(30), box(30), box(30), box(30)], 5, 10)(pen, 0, 0, 210)).toBe(65);
  });
});

describe('placeCard(frame)', () => {
  const style = cardStyle('A5', 1);
  const page = { widthPt: 400, heightPt: 600 };
  const available = 600 - 2 * style.marginPt;
  const frame = (body: number): CardFrame => ({
    header: box(40),
    body: [box(body)],
    bottom: [box(60)],
    footer: box(30),
  });

  it('uses header + body + bottom + footer + 3 gaps', () => {
    const fit = placeCard(pen, page, style, frame(100));
    expect(fit.usedHeightPt).toBeCloseTo(40 + 100 + 60 + 30 + 3 * style.gap, 9);
    expect(fit.availableHeightPt).toBeCloseTo(available, 9);
    expect(fit.fits).toBe(true);
  });

  it('does not fit when the body is one point too tall', () => {
    const body = available - (40 + 60 + 30 + 3 * style.gap) + 1;
    expect(placeCard(pen, page, style, frame(body)).fits).toBe(false);
    expect(placeCard(pen, page, style, frame(body - 1)).fits).toBe(true);
  });
});

describe('fitCard(page, paper, frameFor)', () => {
  const page = { widthPt: 400, heightPt: 600 };
  it('takes the stylesheet’s sizes (step 1, lists in one column) when they fit', () => {
    const fit = fitCard(pen, page, 'A5', () => ({
      header: box(10),
      body: [],
      bottom: [],
      footer: box(10),
    }));
    expect(fit.style.step).toBe(1);
    expect(fit.style.listColumns).toBe(1);
    expect(fit.style.bodyColumns).toBe(1);
  });
  it('steps the font down until the body fits (a body that shrinks with the step)', () => {
    const fit = fitCard(pen, page, 'A5', (st) => ({
      header: box(0),
      body: [box(700 * st.step)],
      bottom: [],
      footer: box(0),
    }));
    // Header and footer of no height: the body and the two gaps around it.
    const available = 600 - 2 * cardStyle('A5', 1).marginPt;
    const expected = FONT_STEPS.find((s) => 700 * s + 2 * cardStyle('A5', s).gap <= available);
    expect(expected).toBeDefined();
    expect(fit.fits).toBe(true);
    expect(fit.style.step).toBe(expected);
  });
  it('reports fits false, never a clipped page, when nothing fits', () => {
    const fit = fitCard(pen, page, 'A5', () => ({
      header: box(0),
      body: [box(10_000)],
      bottom: [],
      footer: box(0),
    }));
    expect(fit.fits).toBe(false);
    expect(fit.usedHeightPt).toBeGreaterThan(fit.availableHeightPt);
  });
});
