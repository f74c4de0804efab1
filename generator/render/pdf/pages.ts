/**
 * Text that runs over several pages (the binder's contents, method and troubleshooting):
 * blocks placed top to bottom, a new page when the next block does not fit, a heading
 * kept with what follows it. Page breaks fall between blocks only; a block taller than a
 * page is an error, never clipped.
 */
import type { Block, PageBox } from './layout.ts';
import type { Pen } from './pen.ts';
import type { TextFont } from './style.ts';

export interface FlowItem {
  readonly block: Block;
  /** Keep on the same page as the next item (headings). */
  readonly keepWithNext?: boolean;
}

export interface FlowFrame {
  readonly page: PageBox;
  readonly marginPt: number;
  readonly gap: number;
  /** Room kept free above the bottom margin of every page (a running foot), pt. */
  readonly footPt?: number;
}

/**
 * Places `items`; returns the number of pages used. When the pen draws, `newPage(n)` is
 * called before page n (1-based) is written, and must add it.
 */
export function flowPages(
  pen: Pen,
  frame: FlowFrame,
  items: readonly FlowItem[],
  newPage: (n: number) => void,
): number {
  const x = frame.marginPt;
  const width = frame.page.widthPt - 2 * frame.marginPt;
  const top = frame.marginPt;
  const bottom = frame.page.heightPt - frame.marginPt - (frame.footPt ?? 0);
  const available = bottom - top;
  const measure = pen.measuring();
  const heights = items.map((item) => item.block(measure, x, top, width));
  heights.forEach((h, i) => {
    if (h > available + 1e-6)
      throw new Error(
        `PDF: a text block (item ${i + 1}) is taller than a page (${Math.ceil(h)} pt for ${Math.floor(available)} pt)`,
      );
  });
  let pages = 1;
  if (pen.drawing) newPage(1);
  let y = top;
  items.forEach((item, i) => {
    const h = heights[i]!;
    if (h <= 0) {
      // Zero-height items (opening and closing a structure element) take no room.
      item.block(pen, x, y, width);
      return;
    }
    let need = h;
    for (let j = i; items[j]?.keepWithNext && j + 1 < items.length; j++)
      need += frame.gap + heights[j + 1]!;
    need = Math.min(need, available);
    if (y > top && y + need > bottom + 1e-6) {
      pages += 1;
      if (pen.drawing) newPage(pages);
      y = top;
    }
    item.block(pen, x, y, width);
    y += h + frame.gap;
  });
  return pages;
}

/** "3 / 28" centred in the bottom margin, as a pagination artifact. */
export function drawPageNumber(
  pen: Pen,
  page: PageBox,
  marginPt: number,
  text: string,
  font: TextFont,
): void {
  const y = page.heightPt - marginPt / 2 - pen.lineHeight(font) / 2;
  pen.artifact(() => {
    pen.write(text, 0, y, page.widthPt, font, { noWrap: true, align: 'center' });
  }, 'Pagination');
}
