/**
 * The bag insert as PDF blocks, in the order of the HTML insert
 * (templates/_includes/partials/insert-card.njk): header with the coffee's notes; the
 * heading and intro; the table of pot sizes × kinds of stove (a refused row says why,
 * across the recipe columns); the web line; warnings; cautions and footer.
 *
 * The table's columns are sized from the measured text: each gets the width of its
 * longest word (numbers never wrap), the rest of the width goes to the columns whose text
 * would otherwise wrap. A table whose narrowest form is wider than the card does not fit
 * (and the layout tries a smaller font step).
 */
import type { InsertCardView, InsertRow } from '../card-view.ts';
import { cautionsBlock, footerBlock, headerBlock, stepHeading, warningsBlock } from './blocks.ts';
import type { Block, CardFrame } from './layout.ts';
import type { Pen } from './pen.ts';
import { INK, RULE_SOFT, type CardStyle, type TextFont } from './style.ts';

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
      return row.level ?? '';
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
  readonly refused: TextFont;
  readonly refusedLabel: TextFont;
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
    for (const row of view.rows) {
      if (row.refused && key !== 'pot' && key !== 'heat') continue;
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

function tableBlock(view: InsertCardView, st: CardStyle): Block {
  const f: TableFonts = {
    head: st.tableHead,
    cell: st.table,
    rowHead: { ...st.table, bold: true },
    aside: st.tableAside,
    refused: st.tableRefused,
    refusedLabel: { ...st.tableRefused, bold: true },
  };
  const pad = st.padding;
  const padY = st.padding * 0.7;
  const showPot = !st.compact;
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
        view.rows.forEach((row, r) => {
          const potStart = r > 0 && row.potId !== view.rows[r - 1]!.potId;
          if (potStart) {
            pen.rule(x, y + h, w, 1.1, INK);
            h += 1.1;
          }
          const rowH = rowHeight(pen, row, widths, pad, f, showPot) + 2 * padY;
          const top = y + h + padY;
          pen.group('TR', () => {
            pen.leaf(
              'TH',
              () => {
                const ch = pen.write(row.cupsLabel, lefts[0]! + pad, top, cellW(0), f.rowHead, {
                  noWrap: true,
                });
                if (showPot) pen.write(row.potName, lefts[0]! + pad, top + ch, cellW(0), f.aside);
              },
              { scope: 'Row' },
            );
            pen.para('TD', row.heatLabel, lefts[1]! + pad, top, cellW(1), f.cell);
            if (row.refused) {
              const spanW = widths.slice(2).reduce((a, b) => a + b, 0) - 2 * pad;
              pen.leaf(
                'TD',
                () => {
                  pen.write(refusedText(row), lefts[2]! + pad, top, spanW, f.refused);
                },
                { colSpan: COLUMNS.length - 2 },
              );
            } else {
              COLUMNS.slice(2).forEach((key, j) => {
                const i = j + 2;
                const numeric = NUMERIC.has(key);
                pen.para('TD', cellText(row, key), lefts[i]! + pad, top, cellW(i), f.cell, {
                  align: numeric ? 'right' : 'left',
                  noWrap: numeric,
                });
              });
            }
          });
          h += rowH;
          if (r < view.rows.length - 1 && view.rows[r + 1]!.potId === row.potId) {
            pen.rule(x, y + h, w, 0.5, RULE_SOFT);
            h += 0.5;
          }
        });
      });
    });
    return h;
  };
}

/** "Not suitable: brew time out of range", as the HTML's bold label and reason. */
function refusedText(row: InsertRow): string {
  return `${row.refused!.label}: ${row.refused!.reason}`;
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
  if (row.refused) {
    const spanW = widths.slice(2).reduce((a, b) => a + b, 0) - 2 * pad;
    return Math.max(pot, heat, pen.height(refusedText(row), spanW, f.refused));
  }
  const cells = COLUMNS.slice(2).map((key, j) =>
    NUMERIC.has(key) ? pen.lineHeight(f.cell) : pen.height(cellText(row, key), cw(j + 2), f.cell),
  );
  return Math.max(pot, heat, ...cells);
}

function bodyBlock(view: InsertCardView, st: CardStyle): Block {
  const table = tableBlock(view, st);
  return (pen, x, y, w) =>
    pen.group('Sect', () => {
      let h = stepHeading(pen, null, view.heading, null, x, y, w, st);
      h += pen.para('P', view.intro, x, y + h, w, st.note);
      h += st.padding;
      h += table(pen, x, y + h, w);
      if (view.webLine)
        h += st.padding + pen.para('P', view.webLine, x, y + h + st.padding, w, st.web);
      return h;
    });
}

/** The insert card's blocks at one style. */
export function insertFrame(view: InsertCardView, st: CardStyle): CardFrame {
  return {
    header: headerBlock(view.title, view.subtitle, view.notes, st),
    body: [bodyBlock(view, st), warningsBlock(view.warnings, st)],
    bottom: [cautionsBlock(view.cautions, st)],
    footer: footerBlock(view.footer, st),
  };
}
