/**
 * The pieces every PDF card shares, as Blocks (layout.ts): the header, numbered step
 * headings, lists, the warnings box, the cautions and the footer. They place the views'
 * strings as they are; nothing is reworded or recomputed here.
 */
import { cautions, type Cautions, type Footer, type Warnings } from '../card-view.ts';
import type { UnitSystem } from '../../content/types.ts';
import { LOGO_MAX_HEIGHT_MM, LOGO_MAX_WIDTH_SHARE, logoBox, type LogoView } from '../brand.ts';
import { voiceFor } from '../voice.ts';

/** Step numbers, list markers and bullets: the same figures in every catalogue there is. */
const pdfWords = voiceFor().words.pdf;
import { balancedSplit, type Block } from './layout.ts';
import type { Pen } from './pen.ts';
import {
  INK,
  logoMaxHeightPt,
  PAPER,
  PDF_TEXT_FLOOR_PT,
  WARNING_FILL,
  type CardStyle,
  type TextFont,
} from './style.ts';

/**
 * Title (H1), subtitle and notes, over a heavy rule; the roaster's logo at the right, at most
 * LOGO_MAX_HEIGHT_MM high (less on small paper), no taller than the title and subtitle, and
 * at most LOGO_MAX_WIDTH_SHARE of the width.
 */
export function headerBlock(
  title: string,
  subtitle: string,
  notes: string | null,
  st: CardStyle,
  logo: LogoView | null = null,
): Block {
  const textHeight = (pen: Pen, w: number) =>
    pen.height(title, w, st.h1) +
    pen.height(subtitle, w, st.sub) +
    (notes ? pen.height(notes, w, st.notes) : 0);
  return (pen, x, y, w) => {
    // Never taller than the title and subtitle beside it: the logo costs the card no height.
    const maxHeight = Math.min(logoMaxHeightPt(st.paper, LOGO_MAX_HEIGHT_MM), textHeight(pen, w));
    const box = logo ? logoBox(logo, w * LOGO_MAX_WIDTH_SHARE, maxHeight) : null;
    const tw = box ? w - box.width - st.gutter : w;
    let h = pen.para('H1', title, x, y, tw, st.h1);
    h += pen.para('P', subtitle, x, y + h, tw, st.sub);
    if (notes) h += pen.para('P', notes, x, y + h, tw, st.notes);
    if (box && logo) {
      pen.logo(logo, x + w - box.width, y, box.width, box.height);
      h = Math.max(h, box.height);
    }
    h += st.padding;
    pen.rule(x, y + h, w, st.ruleHeavy, st.accent ?? INK);
    return h + st.ruleHeavy;
  };
}

/**
 * A step heading: a black disc with the step number, the heading (H2, number included, as
 * the page reads "1 Water"), and the note after it on the same line when it fits.
 * Returns the height.
 */
export function stepHeading(
  pen: Pen,
  n: number | null,
  text: string,
  note: string | null,
  x: number,
  y: number,
  w: number,
  st: CardStyle,
  font: TextFont = st.h2,
): number {
  const numberFont: TextFont = {
    size: Math.max(PDF_TEXT_FLOOR_PT, font.size * 0.95),
    bold: true,
    color: PAPER,
  };
  const d = n === null ? 0 : font.size * 0.95 * 1.45;
  const space = n === null ? 0 : font.size * 0.4;
  const tx = x + d + space;
  const tw = w - d - space;
  const capCentre = y + pen.ascent(font) - font.size * 0.365;
  if (n !== null) {
    pen.artifact(() => {
      pen.doc.circle(x + d / 2, capCentre, d / 2).fill(st.disc ?? INK);
    });
  }
  let headingH = 0;
  pen.leaf('H2', () => {
    if (n !== null) {
      const label = pdfWords.stepNumber(n);
      const top = capCentre + numberFont.size * 0.365 - pen.ascent(numberFont);
      pen.write(label, x, top, d, numberFont, { noWrap: true, align: 'center' });
    }
    headingH = pen.write(text, tx, y, tw, font);
  });
  let h = Math.max(headingH, d);
  if (note) {
    const headingW = pen.width(text, font);
    const gap = font.size * 0.4;
    if (
      headingH <= pen.lineHeight(font) + 1e-6 &&
      headingW + gap + pen.width(note, st.h2Note) <= tw
    ) {
      const top = y + pen.ascent(font) - pen.ascent(st.h2Note);
      pen.para('P', note, tx + headingW + gap, top, tw - headingW - gap, st.h2Note, {
        noWrap: true,
      });
    } else {
      h += pen.para('P', note, tx, y + h, tw, st.h2Note);
    }
  }
  return h + font.size * 0.25;
}

export interface ListOptions {
  readonly numbered?: boolean;
  readonly columns?: 1 | 2;
  /** The last item in bold (the watch list's "take it off the heat"). */
  readonly strongLast?: boolean;
}

/** A list (L › LI › Lbl + LBody), in one or two columns balanced by height. */
export function listBlock(
  items: readonly string[],
  font: TextFont,
  st: CardStyle,
  options: ListOptions = {},
): Block {
  const labels = items.map((_, i) =>
    options.numbered ? pdfWords.listNumber(i + 1) : pdfWords.bullet,
  );
  const fonts = items.map((_, i) =>
    options.strongLast && i === items.length - 1 ? { ...font, bold: true } : font,
  );
  const itemGap = font.size * 0.2;
  return (pen, x, y, w) => {
    if (items.length === 0) return 0;
    const indent = Math.max(...labels.map((label) => pen.width(label, font))) + font.size * 0.5;
    // Two columns only where each still holds a line of some 16 em.
    const columns = options.columns === 2 && (w - st.gutter) / 2 >= font.size * 16 ? 2 : 1;
    const colW = columns === 2 ? (w - st.gutter) / 2 : w;
    const heights = items.map((item, i) => pen.height(item, colW - indent, fonts[i]!));
    const split = columns === 2 ? balancedSplit(heights, itemGap) : items.length;
    let tallest = 0;
    pen.group('L', () => {
      let cy = y;
      let cx = x;
      items.forEach((item, i) => {
        if (i === split) {
          tallest = Math.max(tallest, cy - y - itemGap);
          cy = y;
          cx = x + colW + st.gutter;
        }
        pen.group('LI', () => {
          pen.para('Lbl', labels[i]!, cx, cy, indent, fonts[i]!, { noWrap: true });
          pen.para('LBody', item, cx + indent, cy, colW - indent, fonts[i]!);
        });
        cy += heights[i]! + itemGap;
      });
      tallest = Math.max(tallest, cy - y - itemGap);
    });
    return tallest;
  };
}

/** Measures `block` first, so a drawing pen can paint the box under it. */
function boxed(
  block: Block,
  padX: number,
  padY: number,
  paint: (pen: Pen, x: number, y: number, w: number, h: number) => void,
): Block {
  return (pen, x, y, w) => {
    const inner = block(pen.measuring(), x + padX, y + padY, w - 2 * padX);
    const h = inner + 2 * padY;
    if (pen.drawing && Number.isFinite(h)) {
      paint(pen, x, y, w, h);
      block(pen, x + padX, y + padY, w - 2 * padX);
    }
    return h;
  };
}

/** The yellow "Check these" box of model-range warnings. */
export function warningsBlock(warnings: Warnings | null, st: CardStyle): Block {
  if (!warnings) return () => 0;
  const mm = st.padding;
  const list = listBlock(warnings.items, st.warning, st);
  const inner: Block = (pen, x, y, w) =>
    pen.group('Sect', () => {
      const h = stepHeading(pen, null, warnings.heading, null, x, y, w, st);
      return h + list(pen, x, y + h, w);
    });
  return boxed(inner, 2 * mm, 1.2 * mm, (pen, x, y, w, h) =>
    pen.artifact(() => {
      pen.doc
        .lineWidth(1.5)
        .rect(x + 0.75, y + 0.75, w - 1.5, h - 1.5)
        .fillAndStroke(WARNING_FILL, INK);
    }),
  );
}

/** The safety cautions: a rule, the heading in the valve's red, the list, the deferral to the maker. */
/**
 * The cautions a PDF card prints: the view's own, or their short form in the card's
 * language and units when the 7 pt floor dropped the long form (card.ts, the drop order).
 */
export function shownCautions(
  view: {
    readonly cautions: Cautions;
    readonly language: string;
    readonly page: { readonly units: UnitSystem };
  },
  short: boolean,
): Cautions {
  return short ? cautions('compact', voiceFor(view.language, view.page.units)) : view.cautions;
}

export function cautionsBlock(cautions: Cautions, st: CardStyle): Block {
  const columns = st.compact ? 1 : st.listColumns;
  // The compact form (small paper) runs on as one paragraph: a list's line per item is the room it lacks.
  const list: Block =
    cautions.form === 'compact'
      ? (pen, x, y, w) => pen.para('P', cautions.items.join(' · '), x, y, w, st.caution)
      : listBlock(cautions.items, st.caution, st, { columns });
  return (pen, x, y, w) =>
    pen.group('Sect', () => {
      const rule = st.ruleHeavy * 0.75;
      pen.rule(x, y, w, rule, INK);
      let h = rule + st.padding;
      h += stepHeading(pen, null, cautions.heading, null, x, y + h, w, st, st.cautionHeading);
      h += list(pen, x, y + h, w);
      h += st.caution.size * 0.3;
      return h + pen.para('P', cautions.deferral, x, y + h, w, { ...st.caution, bold: true });
    });
}

/** Who printed the card, when it was computed, its address and QR code. */
export function footerBlock(footer: Footer, st: CardStyle): Block {
  return (pen, x, y, w) =>
    pen.group('Sect', () => {
      pen.rule(x, y, w, st.ruleLight, INK);
      const top = y + st.ruleLight + st.padding;
      const font = st.foot;
      const qr = footer.qrSvg !== null;
      const captionW = qr
        ? Math.min(font.size * 8, pen.width(footer.qrCaption ?? '', font) + 1)
        : 0;
      const qrW = qr ? st.qrSize + st.padding * 1.5 + captionW : 0;
      const textW = qr ? w - qrW - st.gutter : w;
      const lines = [footer.printedBy, footer.built, ...(footer.webUrl ? [footer.webUrl] : [])];
      const textH = lines.reduce((sum, line) => sum + pen.height(line, textW, font), 0);
      const boxH = Math.max(textH, qr ? st.qrSize : 0);
      // Bottom-aligned, as the stylesheet's align-items: flex-end.
      let ty = top + boxH - textH;
      for (const line of lines) ty += pen.para('P', line, x, ty, textW, font);
      if (qr) {
        const qx = x + w - st.qrSize;
        const captionH = pen.height(footer.qrCaption ?? '', captionW, font);
        pen.para(
          'Caption',
          footer.qrCaption ?? '',
          qx - st.padding * 1.5 - captionW,
          top + boxH - st.qrSize / 2 - captionH / 2,
          captionW,
          font,
          {
            align: 'right',
          },
        );
        pen.figure(
          footer.qrSvg!,
          qx,
          top + boxH - st.qrSize,
          st.qrSize,
          footer.qrAlt ?? pdfWords.qrAlt(footer.webUrl ?? ''),
        );
      }
      return st.ruleLight + st.padding + boxH;
    });
}

/** A small label over a value ("Fill the base with"). */
export function labelLine(
  pen: Pen,
  text: string,
  x: number,
  y: number,
  w: number,
  st: CardStyle,
): number {
  return pen.para('P', text, x, y, w, st.label);
}
