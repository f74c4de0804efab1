/**
 * Card layout from measured blocks. A Block lays itself out at a width and returns its
 * height (Infinity when it cannot be laid out that narrow); the same call draws when the
 * pen draws. A card is a header at the top, blocks below it, blocks pinned above the
 * footer (the cautions, as the stylesheet's `margin-top: auto`) and the footer at the
 * bottom margin. fitCard tries font steps (and, at each step, a few arrangements: lists in
 * one or two columns, the body in one or two) until the card fits its page, and reports
 * what it used.
 */
import type { PaperSize } from '../../content/types.ts';
import type { Pen } from './pen.ts';
import { ARRANGEMENTS, cardStyle, FONT_STEPS, type CardStyle } from './style.ts';

export type Block = (pen: Pen, x: number, y: number, width: number) => number;

export interface CardFrame {
  readonly header: Block;
  /** From the top, under the header. */
  readonly body: readonly Block[];
  /** Pinned above the footer. */
  readonly bottom: readonly Block[];
  readonly footer: Block;
}

export interface PageBox {
  readonly widthPt: number;
  readonly heightPt: number;
}

/** What a card's layout used: the measure the tests and the build assert on. */
export interface CardFit {
  readonly fits: boolean;
  /** Height of everything placed, gaps included, pt. */
  readonly usedHeightPt: number;
  /** Page height inside the margins, pt. */
  readonly availableHeightPt: number;
  readonly style: CardStyle;
  /** Optional blocks left out so the card fits at the floor (card.ts OPTIONAL_ORDER). */
  readonly dropped?: readonly string[];
}

/** Blocks one under another, `gap` apart (empty blocks take no gap). */
export function stack(blocks: readonly Block[], gap: number): Block {
  return (pen, x, y, width) => {
    let h = 0;
    for (const block of blocks) {
      const dy = h === 0 ? 0 : gap;
      const bh = block(pen, x, y + h + dy, width);
      if (bh > 0) h += dy + bh;
    }
    return h;
  };
}

/** Index of the first item of the second column, so the taller column is as short as it can be. */
export function balancedSplit(heights: readonly number[], gap: number): number {
  const total = (from: number, to: number) => {
    const part = heights.slice(from, to).filter((h) => h > 0);
    return part.reduce((sum, h) => sum + h, 0) + Math.max(0, part.length - 1) * gap;
  };
  let best = heights.length;
  let bestH = total(0, heights.length);
  for (let k = 1; k < heights.length; k++) {
    const h = Math.max(total(0, k), total(k, heights.length));
    if (h < bestH - 1e-9) {
      bestH = h;
      best = k;
    }
  }
  return best;
}

/** Blocks flowed into two columns, breaking between blocks where the columns come out most even. */
export function columns(blocks: readonly Block[], gap: number, gutter: number): Block {
  return (pen, x, y, width) => {
    const w = (width - gutter) / 2;
    const measure = pen.measuring();
    const heights = blocks.map((block) => block(measure, x, y, w));
    const split = balancedSplit(heights, gap);
    if (!pen.drawing) {
      const sum = (part: readonly number[]) => {
        const placed = part.filter((h) => h > 0);
        return placed.reduce((a, b) => a + b, 0) + Math.max(0, placed.length - 1) * gap;
      };
      return Math.max(sum(heights.slice(0, split)), sum(heights.slice(split)));
    }
    const left = stack(blocks.slice(0, split), gap)(pen, x, y, w);
    const right = stack(blocks.slice(split), gap)(pen, x + w + gutter, y, w);
    return Math.max(left, right);
  };
}

export interface Side {
  readonly block: Block;
  /** Share of the width (the two shares are normalised). */
  readonly share: number;
  /** Narrowest width the block may be given beside the other, pt. */
  readonly minWidth: (pen: Pen) => number;
}

/** Shares of the width tried around a pair's preferred split (as fractions of the width). */
const SPLIT_TRIES: readonly number[] = [0, -0.08, 0.08, -0.16, 0.16];

/**
 * Two blocks side by side when each gets its minimum width, else one under the other.
 * Side by side, the split of the width is the preferred one, moved by up to 16 % when
 * that makes the pair shorter (text that wraps less beside a smaller drawing).
 */
export function beside(left: Side, right: Side, gutter: number, gap: number): Block {
  return (pen, x, y, width) => {
    const inner = width - gutter;
    const preferred = left.share / (left.share + right.share);
    const lo = left.minWidth(pen);
    const hi = inner - right.minWidth(pen);
    if (lo > hi) return stack([left.block, right.block], gap)(pen, x, y, width);
    const measure = pen.measuring();
    let best = { lw: 0, h: Number.POSITIVE_INFINITY };
    for (const delta of SPLIT_TRIES) {
      const lw = Math.min(hi, Math.max(lo, inner * (preferred + delta)));
      const h = Math.max(
        left.block(measure, x, y, lw),
        right.block(measure, x + lw + gutter, y, inner - lw),
      );
      if (h < best.h - 0.5) best = { lw, h };
    }
    if (!Number.isFinite(best.h)) return stack([left.block, right.block], gap)(pen, x, y, width);
    if (pen.drawing) {
      left.block(pen, x, y, best.lw);
      right.block(pen, x + best.lw + gutter, y, inner - best.lw);
    }
    return best.h;
  };
}

/** Places the frame on the page; measures with a measuring pen, draws with a drawing one. */
export function placeCard(pen: Pen, page: PageBox, style: CardStyle, frame: CardFrame): CardFit {
  const m = style.marginPt;
  const x = m;
  const width = page.widthPt - 2 * m;
  const top = m;
  const bottomEdge = page.heightPt - m;
  const available = bottomEdge - top;
  const measure = pen.measuring();

  const footerH = frame.footer(measure, x, 0, width);
  const bottomH = stack(frame.bottom, style.gap)(measure, x, 0, width);
  const footerY = bottomEdge - footerH;
  const bottomY = footerY - (bottomH > 0 ? style.gap + bottomH : 0);

  const headerH = frame.header(pen, x, top, width);
  const bodyY = top + headerH + style.gap;
  const body =
    style.bodyColumns === 2
      ? columns(frame.body, style.gap, style.gutter)
      : stack(frame.body, style.gap);
  const bodyH = body(pen, x, bodyY, width);
  if (pen.drawing) {
    stack(frame.bottom, style.gap)(pen, x, bottomY, width);
    frame.footer(pen, x, footerY, width);
  }
  const used =
    headerH + style.gap + bodyH + (bottomH > 0 ? style.gap + bottomH : 0) + style.gap + footerH;
  return {
    fits: Number.isFinite(used) && used <= available + 1e-6,
    usedHeightPt: used,
    availableHeightPt: available,
    style,
  };
}

/**
 * The first style that fits: font steps from the stylesheet's sizes down, at each step
 * the arrangements in order (lists in one column, lists in two, the body in two
 * columns). When none fits, the smallest try, with fits false.
 */
export function fitCard(
  pen: Pen,
  page: PageBox,
  paper: PaperSize,
  frameFor: (style: CardStyle) => CardFrame,
  /** The card's margin when not its paper's (a sheet's cell), mm. */
  marginMm?: number,
): CardFit {
  const measure = pen.measuring();
  let last: CardFit | null = null;
  for (const step of FONT_STEPS) {
    for (const arrangement of ARRANGEMENTS) {
      const style = cardStyle(paper, step, arrangement, marginMm);
      last = placeCard(measure, page, style, frameFor(style));
      if (last.fits) return last;
    }
  }
  return last!;
}
