/**
 * The bag insert as PDF blocks, in the order of the HTML insert
 * (templates/_includes/partials/insert-card.njk): header with the coffee's notes; the
 * heading and intro; the numbered steps with their pictograms (two columns where the
 * card is wide enough, 1 … 4 then 5 … 7); the table of pot sizes × kinds of stove with a
 * recipe; the refused ones in plain words under it; the web line; warnings; cautions and
 * footer.
 *
 * The table's columns are sized from the measured text: each gets the width of its
 * longest word (numbers never wrap), the rest of the width goes to the columns whose text
 * would otherwise wrap. A table whose narrowest form is wider than the card does not fit
 * (and the layout tries a smaller font step).
 */
import type { InsertCardView, InsertRow, InsertStep } from '../card-view.ts';
import { voiceFor } from '../voice.ts';

/** Step numbers: the same figures in every catalogue there is. */
const pdfWords = voiceFor().words.pdf;
import {
  cautionsBlock,
  footerBlock,
  headerBlock,
  shownCautions,
  stepHeading,
  warningsBlock,
} from './blocks.ts';
import { columns, stack, type Block, type CardFrame } from './layout.ts';
import type { Pen } from './pen.ts';
import type { InsertOptional } from './card.ts';
import { INK, RULE_SOFT, VALVE, type CardStyle, type TextFont } from './style.ts';

type ColumnKey = keyof InsertCardView['columns'];

const COLUMNS: readonly ColumnKey[] = [
  'pot',
  'heat',
  'fill',
  'dose',
  'start',
  'level',
  'firstCoffee',
  'offHeat',
];
const NUMERIC = new Set<ColumnKey>(['fill', 'dose', 'start', 'firstCoffee', 'offHeat']);

/** The text of a recipe cell, as the HTML prints it. */
function cellText(row: InsertRow, key: ColumnKey): string {
  switch (key) {
    case 'pot':
      return row.cupsLabel;
    case 'heat':
      return row.heatLabel;
    case 'fill':
      return row.fill?.text ?? '';
    case 'dose':
      return row.dose?.text ?? '';
    case 'start':
      return row.start ?? '';
    case 'level':
      return row.setting ?? '';
    case 'firstCoffee':
      return row.firstCoffee?.text ?? '';
    case 'offHeat':
      return row.offHeat?.text ?? '';
  }
}

interface TableFonts {
  readonly head: TextFont;
  readonly cell: TextFont;
  readonly rowHead: TextFont;
  readonly aside: TextFont;
}

/** Column widths for `width`, or null when even the narrowest columns are too wide. */
function columnWidths(
  pen: Pen,
  view: InsertCardView,
  f: TableFonts,
  pad: number,
  width: number,
  showPot: boolean,
): number[] | null {
  const min: number[] = [];
  const pref: number[] = [];
  for (const key of COLUMNS) {
    const head = view.columns[key];
    let lo = pen.minWidth(head, f.head);
    let hi = pen.width(head, f.head);
    for (const row of tableRows(view)) {
      const text = cellText(row, key);
      const font = key === 'pot' ? f.rowHead : f.cell;
      const w = pen.width(text, font);
      lo = Math.max(lo, NUMERIC.has(key) || key === 'pot' ? w : pen.minWidth(text, font));
      hi = Math.max(hi, w);
      if (key === 'pot' && showPot) {
        lo = Math.max(lo, pen.minWidth(row.potName, f.aside));
        hi = Math.max(hi, pen.width(row.potName, f.aside));
      }
    }
    min.push(lo + 2 * pad);
    pref.push(hi + 2 * pad);
  }
  const minTotal = min.reduce((a, b) => a + b, 0);
  if (minTotal > width + 1e-6) return null;
  const want = pref.map((p, i) => p - min[i]!);
  const wantTotal = want.reduce((a, b) => a + b, 0);
  const spare = width - minTotal;
  if (wantTotal >= spare)
    return min.map((m, i) => m + (wantTotal > 0 ? (want[i]! * spare) / wantTotal : 0));
  // Every column gets all it wants; the rest is shared out evenly.
  const extra = (spare - wantTotal) / pref.length;
  return pref.map((p) => p + extra);
}

function tableBlock(view: InsertCardView, st: CardStyle, potNames = true): Block {
  const f: TableFonts = {
    head: st.tableHead,
    cell: st.table,
    rowHead: { ...st.table, bold: true },
    aside: st.tableAside,
  };
  const pad = st.padding;
  const padY = st.padding * 0.7;
  const showPot = !st.compact && potNames;
  return (pen, x, y, w) => {
    const widths = columnWidths(pen, view, f, pad, w, showPot);
    if (!widths) return Number.POSITIVE_INFINITY;
    const lefts = widths.map((_, i) => x + widths.slice(0, i).reduce((a, b) => a + b, 0));
    const cellW = (i: number) => widths[i]! - 2 * pad;
    let h = 0;
    pen.group('Table', () => {
      // Header row, bottom-aligned.
      const headH = Math.max(
        ...COLUMNS.map((key, i) => pen.height(view.columns[key], cellW(i), f.head)),
      );
      pen.group('THead', () =>
        pen.group('TR', () => {
          COLUMNS.forEach((key, i) => {
            const text = view.columns[key];
            const th = pen.height(text, cellW(i), f.head);
            pen.para('TH', text, lefts[i]! + pad, y + padY + headH - th, cellW(i), f.head, {
              align: NUMERIC.has(key) ? 'right' : 'left',
            });
          });
        }),
      );
      h = headH + 2 * padY;
      pen.rule(x, y + h, w, 1.5, INK);
      h += 1.5;
      pen.group('TBody', () => {
        const rows = tableRows(view);
        rows.forEach((row, r) => {
          const potStart = r > 0 && row.potId !== rows[r - 1]!.potId;
          if (potStart) {
            pen.rule(x, y + h, w, 1.1, INK);
            h += 1.1;
          }
          const rowH = rowHeight(pen, row, widths, pad, f, showPot) + 2 * padY;
          const top = y + h + padY;
          pen.group('TR', () => {
            // The pot's size once, on its first row, as the HTML's rowspan header prints it.
            const firstOfPot = r === 0 || potStart;
            pen.leaf(
              'TH',
              () => {
                if (!firstOfPot) return;
                const ch = pen.write(row.cupsLabel, lefts[0]! + pad, top, cellW(0), f.rowHead, {
                  noWrap: true,
                });
                if (showPot) pen.write(row.potName, lefts[0]! + pad, top + ch, cellW(0), f.aside);
              },
              { scope: 'Row' },
            );
            pen.para('TD', row.heatLabel, lefts[1]! + pad, top, cellW(1), f.cell);
            COLUMNS.slice(2).forEach((key, j) => {
              const i = j + 2;
              const numeric = NUMERIC.has(key);
              pen.para('TD', cellText(row, key), lefts[i]! + pad, top, cellW(i), f.cell, {
                align: numeric ? 'right' : 'left',
                noWrap: numeric,
              });
            });
          });
          h += rowH;
          if (r < rows.length - 1 && rows[r + 1]!.potId === row.potId) {
            pen.rule(x, y + h, w, 0.5, RULE_SOFT);
            h += 0.5;
          }
        });
      });
    });
    return h;
  };
}

/** The rows the table prints: those with a recipe (the refused ones are said under it). */
function tableRows(view: InsertCardView): InsertRow[] {
  return view.rows.filter((row) => row.refused === null);
}

function rowHeight(
  pen: Pen,
  row: InsertRow,
  widths: readonly number[],
  pad: number,
  f: TableFonts,
  showPot: boolean,
): number {
  const cw = (i: number) => widths[i]! - 2 * pad;
  const pot = pen.lineHeight(f.rowHead) + (showPot ? pen.height(row.potName, cw(0), f.aside) : 0);
  const heat = pen.height(row.heatLabel, cw(1), f.cell);
  const cells = COLUMNS.slice(2).map((key, j) =>
    NUMERIC.has(key) ? pen.lineHeight(f.cell) : pen.height(cellText(row, key), cw(j + 2), f.cell),
  );
  return Math.max(pot, heat, ...cells);
}

/** One numbered step: its pictogram, the number, the words (a list item). */
function stepBlock(step: InsertStep, st: CardStyle): Block {
  // Without its pictogram (left out to fit: card.ts OPTIONAL_ORDER) the step starts at its number.
  const size = step.pictogramSvg === '' ? 0 : st.h2.size * 2.4;
  const numberFont = { ...st.noteStrong };
  return (pen, x, y, w) => {
    let h = 0;
    pen.group('LI', () => {
      if (size > 0) pen.decoration(step.pictogramSvg, x, y, size);
      const nx = size > 0 ? x + size + st.padding : x;
      const label = pdfWords.stepNumber(step.n);
      const nw = pen.width('00', numberFont);
      pen.para('Lbl', label, nx, y, nw, numberFont, { noWrap: true });
      const tx = nx + nw + st.padding;
      h = Math.max(size, pen.para('LBody', step.text, tx, y, x + w - tx, st.note));
    });
    return h;
  };
}

/** The numbered steps, in two columns (1 … 4, then 5 … 7) where the card is wide enough. */
function stepsBlock(view: InsertCardView, st: CardStyle): Block {
  if (view.steps.length === 0) return () => 0;
  const items = view.steps.map((step) => stepBlock(step, st));
  return (pen, x, y, w) => {
    let h = pen.para('H3', view.stepsHeading, x, y, w, st.h3);
    const list = w >= 260 ? columns(items, st.padding * 1.5, st.gutter) : stack(items, st.padding);
    h += pen.group('L', () => list(pen, x, y + h, w));
    return h;
  };
}

/** The refused rows in plain words, under the table. */
function unsuitableBlock(view: InsertCardView, st: CardStyle): Block {
  const unsuitable = view.unsuitable;
  if (unsuitable === null) return () => 0;
  const font = { ...st.note, color: VALVE };
  return (pen, x, y, w) =>
    pen.group('Div', () => {
      let h = pen.para('H3', unsuitable.heading, x, y, w, { ...st.h3, color: VALVE });
      for (const item of unsuitable.items) h += pen.para('P', item, x, y + h, w, font);
      return h;
    });
}

function bodyBlock(view: InsertCardView, st: CardStyle, potNames = true): Block {
  const table = tableBlock(view, st, potNames);
  const steps = stepsBlock(view, st);
  const unsuitable = unsuitableBlock(view, st);
  return (pen, x, y, w) =>
    pen.group('Sect', () => {
      let h = stepHeading(pen, null, view.heading, null, x, y, w, st);
      h += pen.para('P', view.intro, x, y + h, w, st.note);
      h += st.padding;
      const stepsH = steps(pen, x, y + h, w);
      if (stepsH > 0) h += stepsH + st.gap;
      if (tableRows(view).length > 0) h += table(pen, x, y + h, w);
      const unsuitableH = unsuitable(pen, x, y + h + st.padding, w);
      if (unsuitableH > 0) h += st.padding + unsuitableH;
      if (view.webLine)
        h += st.padding + pen.para('P', view.webLine, x, y + h + st.padding, w, st.web);
      return h;
    });
}

/** The insert card's blocks at one style. */
export function insertFrame(
  view: InsertCardView,
  st: CardStyle,
  dropped: ReadonlySet<InsertOptional | string> = new Set(),
): CardFrame {
  const shown: InsertCardView = {
    ...view,
    steps: dropped.has('pictograms')
      ? view.steps.map((step) => ({ ...step, pictogramSvg: '' }))
      : view.steps,
    webLine: dropped.has('web-line') ? null : view.webLine,
  };
  return {
    header: headerBlock(
      view.title,
      view.subtitle,
      dropped.has('tasting-notes') ? null : view.notes,
      st,
      view.brand?.logo ?? null,
    ),
    body: [bodyBlock(shown, st, !dropped.has('pot-names')), warningsBlock(view.warnings, st)],
    bottom: [cautionsBlock(shownCautions(view, dropped.has('long-cautions')), st)],
    footer: footerBlock(dropped.has('qr-code') ? { ...view.footer, qrSvg: null } : view.footer, st),
  };
}
